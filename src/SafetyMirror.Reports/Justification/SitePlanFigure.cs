using NetTopologySuite.Geometries;
using NetTopologySuite.LinearReferencing;
using SafetyMirror.Reports.Plans;
using static System.FormattableString;

namespace SafetyMirror.Reports.Justification;

/// <summary>The site plans of a report: the corner at true scale with the mirror's reach drawn on it, whole and in detail.</summary>
/// <remarks>
/// The whole plan is cropped to the eye, the mirrors and each approach a little beyond its required distance, so a long
/// approach does not shrink the corner to an illegible scale. The detail shows the eye, the mirrors and the conflict points
/// at a larger scale. Everything is clipped to the plan's window.
/// </remarks>
internal static class SitePlanFigure
{
    private const double MarginM = 4;
    private const double DetailMarginM = 7;
    private const double AimArrowMm = 9;
    private const double StepM = 0.25;
    private static readonly GeometryFactory Factory = new();

    /// <summary>The corner out to a little beyond each approach's required distance.</summary>
    /// <remarks>Obstacle heights are labelled unless <paramref name="labelHeights"/> is false (when a detail labels them legibly).</remarks>
    public static PlanDrawing Whole(ReportCase report, DisplayUnits units, double widthMm, double heightMm, bool labelHeights = true)
    {
        var extent = Core(report);
        foreach (var approach in report.Approaches)
        {
            var reachM = Math.Min(approach.Approach.LengthM, 1.2 * approach.Required.DesignM + MarginM);
            extent.ExpandToInclude(Part(Outward(approach), 0, reachM).EnvelopeInternal);
        }

        extent.ExpandBy(MarginM);
        return Draw(report, units, extent, widthMm, heightMm, $"Plan of the corner, {NorthUp(report)}", labelHeights);
    }

    /// <summary>The eye, the mirrors and the conflict points at a larger scale; null when the whole plan is already as large.</summary>
    public static PlanDrawing? Detail(ReportCase report, DisplayUnits units, PlanDrawing whole, double widthMm, double heightMm)
    {
        var extent = Core(report);
        foreach (var approach in report.Approaches)
        {
            extent.ExpandToInclude(approach.Approach.ConflictPoint.X, approach.Approach.ConflictPoint.Y);
        }

        extent.ExpandBy(DetailMarginM);
        var detail = Draw(report, units, extent, widthMm, heightMm, $"Detail of the corner, {NorthUp(report)}", labelHeights: true);
        return detail.ScaleDenominator * 2 <= whole.ScaleDenominator ? detail : null;
    }

    /// <summary>The caption under a plan: its scale and what the letters stand for.</summary>
    public static string Caption(PlanDrawing plan, ReportCase report, string what) =>
        Invariant($"{what} at 1:{plan.ScaleDenominator} (true scale when printed at 100 %), {NorthUp(report)}. ")
        + (HasTrueNorth(report)
            ? "The plan is drawn on a transverse Mercator projection centred on the site, so up is true north there. "
            : "The plan is drawn in local metres, whose north is the plan's y axis, not true north: relate it to the site. ")
        + string.Join("; ", report.Approaches.Select(a => $"{a.Letter}: {a.Name}"))
        + ", each travelling towards its conflict point.";

    /// <summary>Whether the plan's coordinates are tied to the earth (WGS84 or UTM), so that its up is true north.</summary>
    private static bool HasTrueNorth(ReportCase report) => !report.Plan.Frame.CoordinateSystem.IsLocalMetres;

    private static string NorthUp(ReportCase report) => HasTrueNorth(report) ? "true north up" : "plan north up";

    private static Envelope Core(ReportCase report)
    {
        var eye = report.Plan.Eyes[report.Options.EyeIndex].Position;
        var extent = new Envelope(eye.X, eye.X, eye.Y, eye.Y);
        foreach (var mirror in report.Mirrors)
        {
            extent.ExpandToInclude(mirror.Placement.XM, mirror.Placement.YM);
        }

        return extent;
    }

    private static PlanDrawing Draw(ReportCase report, DisplayUnits units, Envelope extent, double widthMm, double heightMm, string title, bool labelHeights)
    {
        var window = Factory.ToGeometry(extent);
        var builder = new PlanDrawingBuilder(widthMm, heightMm, title) { Unit = units.Length, NorthLabel = HasTrueNorth(report) ? "N" : "Plan N" };
        foreach (var carriageway in report.Plan.Carriageways)
        {
            AddArea(builder, carriageway.Area, window, PlanLayers.Carriageway);
        }

        foreach (var footway in report.Plan.Footways)
        {
            AddArea(builder, footway.Area, window, PlanLayers.Footway);
        }

        var obstacles = report.Plan.Obstacles.Select(o => (Obstacle: o, Visible: Areas(o.Footprint.Intersection(window)))).Where(o => !o.Visible.IsEmpty).ToList();
        foreach (var (_, visible) in obstacles)
        {
            builder.Add(visible, PlanLayers.Obstacle);
        }

        foreach (var mirror in report.Mirrors)
        {
            if (mirror.Evaluation.Mirror.VisibleFieldOfView.Outline is { } outline)
            {
                AddArea(builder, outline, window, PlanLayers.FieldOfView);
            }
        }

        var lanes = report.Approaches.Select(a => (Approach: a, Outward: Outward(a), InsideM: Inside(Outward(a), window))).Where(l => l.InsideM > 0).ToList();
        var ticks = new PlanLayer($"Distance from conflict point ({units.Length.Symbol})", PlanLayers.StationTicks.Style);
        foreach (var (approach, outward, insideM) in lanes)
        {
            AddReach(builder, approach, outward, insideM);
            var drawn = Part(outward, 0, insideM);
            // Distance labels go on the side away from the driver, where they hide neither the eye nor what blocks its view.
            var eyeOnLeft = IsOnLeft(outward, report.Plan.Eyes[report.Options.EyeIndex].Position);
            builder.Add(drawn, PlanLayers.Approach).AddStationTicks(drawn, units.TickIntervalM, ticks, eyeOnLeft ? LabelSide.Right : LabelSide.Left);
            if (approach.Required.DesignM <= insideM)
            {
                builder.AddStationMarker(drawn, approach.Required.DesignM, $"Required {units.Distance(approach.Required.DesignM)}", PlanLayers.RequiredDistance,
                    eyeOnLeft ? LabelSide.Left : LabelSide.Right);
            }
        }

        AddSightlines(builder, report, lanes.Select(l => (l.Approach, l.Outward)), window);
        var eye = report.Plan.Eyes[report.Options.EyeIndex].Position;
        builder.Add(Factory.CreatePoint(new Coordinate(eye.X, eye.Y)), PlanLayers.EyePoint);
        foreach (var mirror in report.Mirrors)
        {
            var at = new Coordinate(mirror.Placement.XM, mirror.Placement.YM);
            builder.AddArrow(at, mirror.Placement.AzimuthDeg, AimArrowMm, PlanLayers.MirrorAim).Add(Factory.CreatePoint(at), PlanLayers.Mirror);
        }

        foreach (var (obstacle, visible) in labelHeights ? obstacles : [])
        {
            builder.AddLabel(visible.InteriorPoint.Coordinate, $"h {units.Height(obstacle.HeightM)}");
        }

        foreach (var (approach, outward, insideM) in lanes)
        {
            // Halfway between two ticks, so the letter covers none of them.
            var station = (Math.Floor(insideM * 0.85 / units.TickIntervalM) + 0.5) * units.TickIntervalM;
            builder.AddLabel(new LengthIndexedLine(outward).ExtractPoint(Math.Min(station, insideM)), approach.Letter);
        }

        if (report.Mirrors.Count > 1)
        {
            foreach (var mirror in report.Mirrors)
            {
                builder.AddLabel(new Coordinate(mirror.Placement.XM, mirror.Placement.YM + 1.5), mirror.Label);
            }
        }

        return builder.Build();
    }

    /// <summary>The stretch the mirror shows and the near blind zone before it, where a mirror serves the approach.</summary>
    private static void AddReach(PlanDrawingBuilder builder, ReportedApproach approach, LineString outward, double insideM)
    {
        if (approach.DirectMeets || approach.Mirror?.Summary is not { ShownFromM: { } from, ShownToM: { } to } summary)
        {
            return;
        }

        if (from < insideM)
        {
            builder.Add(Part(outward, from, Math.Min(to, insideM)), PlanLayers.ShownStretch);
        }

        if (summary.NearBlindZoneM > 0)
        {
            builder.Add(Part(outward, 0, Math.Min(summary.NearBlindZoneM, insideM)), PlanLayers.NearBlindZone);
        }
    }

    /// <summary>A direct sightline to where the direct view ends, and one by way of the mirror to the required distance.</summary>
    private static void AddSightlines(PlanDrawingBuilder builder, ReportCase report, IEnumerable<(ReportedApproach Approach, LineString Outward)> lanes, Geometry window)
    {
        var eye = report.Plan.Eyes[report.Options.EyeIndex].Position;
        var from = new Coordinate(eye.X, eye.Y);
        foreach (var (approach, outward) in lanes)
        {
            var indexed = new LengthIndexedLine(outward);
            var directEnd = indexed.ExtractPoint(Math.Min(approach.DirectM, approach.Required.DesignM));
            AddClipped(builder, Factory.CreateLineString([from, directEnd]), window, PlanLayers.Sightline);
            var mirror = report.Mirrors.FirstOrDefault(m => m.Label == approach.MirrorLabel);
            if (mirror is not null && !approach.DirectMeets && approach.Mirror?.Summary.ShownToM is { } shownTo)
            {
                var target = indexed.ExtractPoint(Math.Min(shownTo, approach.Required.DesignM));
                AddClipped(builder, Factory.CreateLineString([from, new Coordinate(mirror.Placement.XM, mirror.Placement.YM), target]), window, PlanLayers.MirrorSightline);
            }
        }
    }

    private static void AddClipped(PlanDrawingBuilder builder, LineString line, Geometry window, PlanLayer layer)
    {
        var inside = line.Intersection(window);
        if (!inside.IsEmpty)
        {
            builder.Add(inside, layer);
        }
    }

    private static void AddArea(PlanDrawingBuilder builder, Geometry area, Geometry window, PlanLayer layer)
    {
        var visible = Areas(area.Intersection(window));
        if (!visible.IsEmpty)
        {
            builder.Add(visible, layer);
        }
    }

    /// <summary>The polygons of a clipped geometry, dropping the lines and points a clip can leave on its edge.</summary>
    private static Geometry Areas(Geometry clipped)
    {
        var polygons = Enumerable.Range(0, clipped.NumGeometries).Select(clipped.GetGeometryN).OfType<Polygon>().ToArray();
        return polygons.Length == 1 ? polygons[0] : Factory.CreateMultiPolygon(polygons);
    }

    /// <summary>Whether a point lies to the left of the line's first segment, looking along it.</summary>
    private static bool IsOnLeft(LineString line, Core.Optics.Vec3 point)
    {
        var (a, b) = (line.GetCoordinateN(0), line.GetCoordinateN(1));
        return (b.X - a.X) * (point.Y - a.Y) - (b.Y - a.Y) * (point.X - a.X) > 0;
    }

    /// <summary>How far from its conflict point the approach stays inside the window, to the step.</summary>
    private static double Inside(LineString outward, Geometry window)
    {
        var indexed = new LengthIndexedLine(outward);
        var station = 0.0;
        while (station + StepM <= outward.Length && window.Covers(Factory.CreatePoint(indexed.ExtractPoint(station + StepM))))
        {
            station += StepM;
        }

        return station;
    }

    /// <summary>The approach line drawn from its conflict point outward, so lengths along it are stations.</summary>
    private static LineString Outward(ReportedApproach approach) => (LineString)approach.Approach.Line.Reverse();

    private static LineString Part(LineString outward, double fromM, double toM) =>
        (LineString)new LengthIndexedLine(outward).ExtractLine(Math.Clamp(fromM, 0, outward.Length), Math.Clamp(toM, 0, outward.Length));
}
