using NetTopologySuite.Geometries;
using NetTopologySuite.Geometries.Utilities;
using NetTopologySuite.LinearReferencing;
using SafetyMirror.Reports.Plans;
using static System.FormattableString;

namespace SafetyMirror.Reports.Justification;

/// <summary>The site plans of a report: the corner at true scale with the mirror's reach drawn on it, whole and in detail.</summary>
/// <remarks>
/// The plan is turned so the main road runs across the page (see <see cref="MainRoadRotationDeg"/>), with the north arrow
/// turned with it. The whole plan is cropped to the eye, the mirrors, the conflict points and each approach a little beyond its
/// required distance, so a long approach does not shrink the corner to an illegible scale. The detail shows the eye, the
/// mirrors and the conflict points at a larger scale. Everything is clipped to the plan's window, an upright box on the
/// turned page.
/// </remarks>
internal static class SitePlanFigure
{
    private const double MarginM = 4;
    private const double ReachBeyondM = 4;
    private const double DetailMarginM = 7;
    private const double AimArrowMm = 9;
    private const double TravelArrowMm = 8;
    private const double StepM = 0.25;

    /// <summary>A road within this of running across the page is left unturned, so the plan keeps north up.</summary>
    private const double StraightEnoughDeg = 2;
    private static readonly GeometryFactory Factory = new();

    /// <summary>The corner out to a little beyond each approach's required distance.</summary>
    /// <remarks>Obstacle heights are labelled unless <paramref name="labelHeights"/> is false (when a detail labels them legibly).</remarks>
    public static PlanDrawing Whole(ReportCase report, DisplayUnits units, double widthMm, double heightMm, bool labelHeights = true)
    {
        var rotationDeg = MainRoadRotationDeg(report);
        // The margin goes round the eye and the mirrors; the approaches already reach a little beyond what they need,
        // and every metre more along the road can halve the scale.
        var ends = report.Approaches.SelectMany(a => Part(Outward(a), 0, Reach(a)).Coordinates);
        var box = Turned(Core(report), rotationDeg);
        box.ExpandBy(MarginM);
        box.ExpandToInclude(Turned(ends, rotationDeg));
        var title = $"Plan of the corner, {Orientation(report, rotationDeg)}";
        var plan = Draw(report, units, Unturned(box, rotationDeg), rotationDeg, widthMm, heightMm, title, labelHeights);
        // At the round scale chosen the map may have room to spare along the road: show more of the approaches there
        // instead of white paper. The wider window still fits the same scale, so the plan is drawn once more at it.
        var spareM = (plan.ContentBox!.Right - plan.ContentBox.Left) * plan.ScaleDenominator / 1000.0 - box.Width;
        if (spareM < 1)
        {
            return plan;
        }

        box.ExpandBy(spareM / 2 - 0.05, 0);
        return Draw(report, units, Unturned(box, rotationDeg), rotationDeg, widthMm, heightMm, title, labelHeights);
    }

    /// <summary>The eye, the mirrors and the conflict points at a larger scale; null when the whole plan is already as large.</summary>
    public static PlanDrawing? Detail(ReportCase report, DisplayUnits units, PlanDrawing whole, double widthMm, double heightMm)
    {
        var points = Core(report).Concat(report.Approaches.Select(a => new Coordinate(a.Approach.ConflictPoint.X, a.Approach.ConflictPoint.Y))).ToList();
        var window = Window(points, whole.RotationDeg, DetailMarginM);
        var detail = Draw(report, units, window, whole.RotationDeg, widthMm, heightMm, $"Detail of the corner, {Orientation(report, whole.RotationDeg)}", labelHeights: true);
        return detail.ScaleDenominator * 2 <= whole.ScaleDenominator ? detail : null;
    }

    /// <summary>The caption under a plan: its scale, which way it is turned and what the letters stand for.</summary>
    public static string Caption(PlanDrawing plan, ReportCase report, string what) =>
        Invariant($"{what} at 1:{plan.ScaleDenominator} (true scale when printed at 100 %), {Orientation(report, plan.RotationDeg)}. ")
        + (HasTrueNorth(report)
            ? plan.RotationDeg == 0
                ? "The plan is drawn on a transverse Mercator projection centred on the site, so up is true north there. "
                : "The plan is drawn on a transverse Mercator projection centred on the site, where its north arrow points to true north. "
            : "The plan is drawn in local metres, whose north is the plan's y axis, not true north: relate it to the site. ")
        + string.Join("; ", report.Approaches.Select(a => $"{a.Letter}: {a.Name}"))
        + ", each travelling towards its conflict point (arrows)."
        + (report.Mirrors.Count > 0 ? " The road seen in the mirror is drawn less what obstacles hide from the mirror." : "");

    /// <summary>How far to turn the plan counter-clockwise so its main road runs across the page, in degrees from -90 to 90.</summary>
    /// <remarks>
    /// The main road is the length-weighted mean direction of the approaches as drawn (out to a little beyond their required
    /// distances). Directions are doubled before averaging, so the two directions of one road (eastbound, westbound) agree
    /// instead of cancelling, and the through road, drawn twice, outweighs a side approach. A road already within
    /// <see cref="StraightEnoughDeg"/> of across is left as it is, so the usual north-up plan stays north up.
    /// </remarks>
    public static double MainRoadRotationDeg(ReportCase report)
    {
        var (c, s) = (0.0, 0.0);
        foreach (var approach in report.Approaches)
        {
            var drawn = Part(Outward(approach), 0, Reach(approach)).Coordinates;
            for (var i = 1; i < drawn.Length; i++)
            {
                var (dx, dy) = (drawn[i].X - drawn[i - 1].X, drawn[i].Y - drawn[i - 1].Y);
                var length = Math.Sqrt(dx * dx + dy * dy);
                var angle = 2 * Math.Atan2(dy, dx);
                (c, s) = (c + length * Math.Cos(angle), s + length * Math.Sin(angle));
            }
        }

        var roadDeg = Math.Atan2(s, c) / 2 * 180 / Math.PI;
        return Math.Abs(roadDeg) < StraightEnoughDeg ? 0 : -roadDeg;
    }

    /// <summary>Whether the plan's coordinates are tied to the earth (WGS84 or UTM), so that its north is true north.</summary>
    private static bool HasTrueNorth(ReportCase report) => !report.Plan.Frame.CoordinateSystem.IsLocalMetres;

    private static string Orientation(ReportCase report, double rotationDeg) => rotationDeg == 0
        ? HasTrueNorth(report) ? "true north up" : "plan north up"
        : $"rotated so the main road runs across the page; the north arrow shows {(HasTrueNorth(report) ? "true north" : "plan north")}";

    /// <summary>How far out along an approach the whole plan reaches: a little beyond the required distance.</summary>
    private static double Reach(ReportedApproach approach) => Math.Min(approach.Approach.LengthM, approach.Required.DesignM + ReachBeyondM);

    /// <summary>The eye and the mirrors.</summary>
    private static IEnumerable<Coordinate> Core(ReportCase report)
    {
        var eye = report.Plan.Eyes[report.Options.EyeIndex].Position;
        return report.Mirrors.Select(m => new Coordinate(m.Placement.XM, m.Placement.YM)).Prepend(new Coordinate(eye.X, eye.Y));
    }

    /// <summary>The box around the points, upright on the page turned by <paramref name="rotationDeg"/>, widened by a margin, in plan coordinates.</summary>
    private static Geometry Window(IEnumerable<Coordinate> points, double rotationDeg, double marginM)
    {
        var box = Turned(points, rotationDeg);
        box.ExpandBy(marginM);
        return Unturned(box, rotationDeg);
    }

    /// <summary>The upright box around the points as they lie on the page turned by <paramref name="rotationDeg"/>.</summary>
    private static Envelope Turned(IEnumerable<Coordinate> points, double rotationDeg)
    {
        var turn = AffineTransformation.RotationInstance(rotationDeg * Math.PI / 180);
        var box = new Envelope();
        foreach (var point in points)
        {
            box.ExpandToInclude(turn.Transform(point, new Coordinate()));
        }

        return box;
    }

    /// <summary>A box upright on the turned page, back in plan coordinates.</summary>
    private static Geometry Unturned(Envelope box, double rotationDeg) =>
        AffineTransformation.RotationInstance(-rotationDeg * Math.PI / 180).Transform(Factory.ToGeometry(box));

    private static PlanDrawing Draw(ReportCase report, DisplayUnits units, Geometry window, double rotationDeg, double widthMm, double heightMm, string title, bool labelHeights)
    {
        var builder = new PlanDrawingBuilder(widthMm, heightMm, title)
        {
            Unit = units.Length,
            NorthLabel = HasTrueNorth(report) ? "N" : "Plan N",
            RotationDeg = rotationDeg,
            FitToContent = true,
        };
        var carriageways = report.Plan.Carriageways.Select(c => (Carriageway: c, Visible: Areas(c.Area.Intersection(window)))).Where(c => !c.Visible.IsEmpty).ToList();
        foreach (var (_, visible) in carriageways)
        {
            builder.Add(visible, PlanLayers.Carriageway);
        }

        foreach (var footway in report.Plan.Footways)
        {
            AddArea(builder, footway.Area, window, PlanLayers.Footway);
        }

        foreach (var stopLine in report.Plan.StopLines)
        {
            AddClipped(builder, stopLine.Line, window, PlanLayers.StopLine);
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

        var eye = report.Plan.Eyes[report.Options.EyeIndex].Position;
        var lanes = report.Approaches.Select(a => (Approach: a, Outward: Outward(a), InsideM: Inside(Outward(a), window))).Where(l => l.InsideM > 0).ToList();
        var ticks = new PlanLayer($"Distance from conflict point ({units.Length.Symbol})", PlanLayers.StationTicks.Style);
        foreach (var (approach, outward, insideM) in lanes)
        {
            AddStretches(builder, approach, outward, insideM);
            var drawn = Part(outward, 0, insideM);
            // Distance labels go on the side away from the driver, where they hide neither the eye nor what blocks its view.
            var eyeSide = IsOnLeft(outward, eye) ? LabelSide.Left : LabelSide.Right;
            var awaySide = eyeSide == LabelSide.Left ? LabelSide.Right : LabelSide.Left;
            builder.Add(drawn, PlanLayers.Approach).AddStationTicks(drawn, units.TickIntervalM, ticks, awaySide);
            if (approach.Required.DesignM <= insideM)
            {
                builder.AddStationMarker(drawn, approach.Required.DesignM, $"Required {units.Distance(approach.Required.DesignM)}", PlanLayers.RequiredDistance, eyeSide);
            }

            builder.AddTravelArrow(drawn, 0.6 * Math.Min(insideM, approach.Required.DesignM), TravelArrowMm, PlanLayers.TravelDirection, eyeSide);
        }

        AddSightlines(builder, report, lanes.Select(l => (l.Approach, l.Outward)), window);
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
            // Halfway between two ticks, so the letter covers none of them: far out first, then nearer the corner.
            var indexed = new LengthIndexedLine(outward);
            var last = Math.Floor(insideM * 0.85 / units.TickIntervalM);
            var stations = Enumerable.Range(0, (int)last + 1).Select(k => (last - k + 0.5) * units.TickIntervalM).Where(m => m <= insideM).DefaultIfEmpty(insideM / 2);
            builder.AddLabel([.. stations.Select(m => indexed.ExtractPoint(m))], approach.Letter);
        }

        if (report.Mirrors.Count > 1)
        {
            foreach (var mirror in report.Mirrors)
            {
                builder.AddLabel(new Coordinate(mirror.Placement.XM, mirror.Placement.YM), mirror.Label);
            }
        }

        AddStreetNames(builder, report, carriageways, lanes.Select(l => (l.Approach, Drawn: Part(l.Outward, 0, l.InsideM))));
        return builder.Build();
    }

    /// <summary>The carriageways' names along them; an approach outside every named carriageway is named along its lane.</summary>
    private static void AddStreetNames(PlanDrawingBuilder builder, ReportCase report, List<(Core.Site.Carriageway Carriageway, Geometry Visible)> carriageways, IEnumerable<(ReportedApproach Approach, LineString Drawn)> lanes)
    {
        var named = carriageways.Where(c => !string.IsNullOrWhiteSpace(c.Carriageway.Feature.Name)).ToList();
        foreach (var (carriageway, visible) in named.DistinctBy(c => c.Carriageway.Feature.Name))
        {
            builder.AddStreetName(visible, carriageway.Feature.Name!);
        }

        foreach (var (approach, drawn) in lanes.Where(l => l.Approach.Approach.Feature.Name is { Length: > 0 } && !named.Any(c => c.Carriageway.Area.Covers(Factory.CreatePoint(l.Approach.Approach.Line.EndPoint.Coordinate)))))
        {
            builder.AddStreetName(drawn, approach.Approach.Feature.Name!);
        }
    }

    /// <summary>Along an approach out to the window: the stretch seen directly, the stretch only the mirror shows, and the rest of the required distance seen neither way.</summary>
    private static void AddStretches(PlanDrawingBuilder builder, ReportedApproach approach, LineString outward, double insideM)
    {
        var requiredM = approach.Required.DesignM;
        var directM = Math.Min(approach.DirectM, requiredM);
        AddStretch(builder, outward, 0, Math.Min(directM, insideM), PlanLayers.SeenDirectly);
        if (approach.DirectMeets)
        {
            return;
        }

        // Where the direct view already shows the lane, the mirror adds nothing to draw.
        var shown = approach.Mirror?.Summary is { ShownFromM: { } from, ShownToM: { } to } && to > directM ? (From: Math.Max(from, directM), To: to) : ((double From, double To)?)null;
        if (shown is { } mirror)
        {
            AddStretch(builder, outward, mirror.From, Math.Min(mirror.To, insideM), PlanLayers.ShownInMirror);
            AddStretch(builder, outward, directM, Math.Min(mirror.From, insideM), PlanLayers.SeenNeitherWay);
            AddStretch(builder, outward, mirror.To, Math.Min(requiredM, insideM), PlanLayers.SeenNeitherWay);
        }
        else
        {
            AddStretch(builder, outward, directM, Math.Min(requiredM, insideM), PlanLayers.SeenNeitherWay);
        }
    }

    private static void AddStretch(PlanDrawingBuilder builder, LineString outward, double fromM, double toM, PlanLayer layer)
    {
        if (toM - fromM > 0.01)
        {
            builder.Add(Part(outward, fromM, toM), layer);
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
