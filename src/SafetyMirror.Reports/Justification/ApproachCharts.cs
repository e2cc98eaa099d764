using SafetyMirror.Core.Design.Evaluation;
using SafetyMirror.Reports.Charts;
using SafetyMirror.Reports.Graphics;
using static System.FormattableString;

namespace SafetyMirror.Reports.Justification;

/// <summary>The two charts of an approach: how large each road user looks in the mirror, and how far away it seems.</summary>
/// <remarks>
/// Both are drawn against the distance from the conflict point on one x axis, the same ticks at the same place on paper,
/// so a reader can go from one to the other at a station. The axis reaches a little beyond the farther of the required
/// distance and the shown stretch, but no farther than <see cref="XCapFactor"/> times the required distance; apparent
/// size is capped at <see cref="YCapFactor"/> times the recognition threshold, where the thresholds would otherwise be
/// squeezed to the axis. A caption says where a curve is cut.
/// </remarks>
internal static class ApproachCharts
{
    /// <summary>Most road users one chart shows, one line style each.</summary>
    public const int MaxSeries = 6;

    private const double WidthMm = 170;
    private const double HeightMm = 82;
    private const double PlotLeftMm = 20;
    private const double XCapFactor = 4;
    private const double YCapFactor = 6;

    /// <summary>Apparent size (smaller dimension, arcmin) against distance from the conflict point, per road user; null when nothing is shown.</summary>
    public static (Drawing Chart, string Caption)? ApparentSize(ReportedApproach approach, EvaluationOptions options, DisplayUnits units)
    {
        var stations = approach.Mirror?.Stations ?? [];
        var users = options.RoadUsers.Take(MaxSeries).Where(u => stations.Any(s => s.RoadUser == u && s.Shown)).ToList();
        if (users.Count == 0)
        {
            return null;
        }

        var vision = options.Vision;
        var chart = StationChart(approach, units, "Apparent size, smaller dimension (arcmin)", $"Apparent size in the mirror, {approach.Name}")
            .CapYAxis(YCapFactor * Math.Max(vision.Recognition.AngleArcmin, vision.Detection.AngleArcmin));
        foreach (var user in users)
        {
            chart.AddSeries(user.Name, stations.Where(s => s.RoadUser == user && s.Shown).Select(s => (units.ToLength(s.StationM), s.SmallestApparentArcmin!.Value)));
        }

        chart.AddThreshold(vision.Recognition.AngleArcmin, Invariant($"Recognition {vision.Recognition.AngleArcmin:0.##} arcmin"))
            .AddThreshold(vision.Detection.AngleArcmin, Invariant($"Detection {vision.Detection.AngleArcmin:0.##} arcmin"));
        var drawing = chart.Build();
        var left = options.RoadUsers.Count > MaxSeries ? $" Only the first {MaxSeries} road users are drawn." : "";
        return (drawing,
            $"Apparent size in the mirror of each road user on {approach.Title}, at the stations where the mirror shows it: the smaller of its apparent height and width, "
            + Invariant($"against the recognition ({vision.Recognition.AngleArcmin:0.##} arcmin) and detection ({vision.Detection.AngleArcmin:0.##} arcmin) thresholds.{left}")
            + CutNote(chart, units, approach, nearer: Invariant($"nearer the conflict point the road users look larger than {chart.YCutAt:0.##} arcmin")));
    }

    /// <summary>How far away the design road user looks in the mirror, beside its true distance by way of the mirror; null when it is not shown.</summary>
    public static (Drawing Chart, string Caption)? EquivalentDistance(ReportedApproach approach, EvaluationOptions options, DisplayUnits units)
    {
        var design = options.DesignRoadUser;
        var shown = (approach.Mirror?.Stations ?? []).Where(s => s.RoadUser == design && s.Shown).ToList();
        if (shown.Count == 0)
        {
            return null;
        }

        var chart = StationChart(approach, units, $"Distance ({units.Length.Symbol})", $"How far away it looks, {approach.Name}")
            .AddSeries($"{design.Name}: equivalent direct distance (how far away it looks)", shown.Select(s => (units.ToLength(s.StationM), units.ToLength(s.EquivalentDistanceM!.Value))))
            .AddSeries("True distance, eye to mirror to road user", shown.Select(s => (units.ToLength(s.StationM), units.ToLength(s.PathLengthM!.Value))));
        var drawing = chart.Build();
        var at = shown.Where(s => s.StationM <= approach.Required.DesignM).MaxBy(s => s.StationM) ?? shown.MinBy(s => s.StationM)!;
        var ratio = at.EquivalentDistanceM!.Value / at.PathLengthM!.Value;
        return (drawing,
            $"How far away a {design.Name.ToLowerInvariant()} looks in the mirror on {approach.Title}, against the distance from the conflict point: at {units.Distance(at.StationM)} "
            + $"its light path is {units.Distance(at.PathLengthM!.Value)}, yet it looks as small as it would look seen directly from {units.Distance(at.EquivalentDistanceM!.Value)}, "
            + Invariant($"{ratio:0.0} times as far. Drivers read it as farther away and slower than it is.")
            + CutNote(chart, units, approach, nearer: null));
    }

    /// <summary>A chart against the distance from the conflict point, its x axis the same for both charts of the approach.</summary>
    private static LineChartBuilder StationChart(ReportedApproach approach, DisplayUnits units, string yAxisLabel, string title)
    {
        var requiredM = approach.Required.DesignM;
        var farthestM = (approach.Mirror?.Stations ?? []).Where(s => s.Shown).Select(s => s.StationM).DefaultIfEmpty(0).Max();
        return new LineChartBuilder(WidthMm, HeightMm, $"Distance from the conflict point ({units.Length.Symbol})", yAxisLabel, title) { MinPlotLeftMm = PlotLeftMm }
            .AddMarker(units.ToLength(requiredM), $"Required {units.Distance(requiredM)}")
            .ExtendXAxis(units.ToLength(Math.Min(XCapFactor * requiredM, 1.15 * Math.Max(requiredM, farthestM))))
            .CapXAxis(units.ToLength(XCapFactor * requiredM));
    }

    /// <summary>What the caption says of the curves cut at the end of an axis, or nothing.</summary>
    private static string CutNote(LineChartBuilder chart, DisplayUnits units, ReportedApproach approach, string? nearer)
    {
        var notes = new List<string>();
        if (chart.XCutAt is { } x)
        {
            var farthestM = approach.Mirror!.Stations.Where(s => s.Shown).Max(s => s.StationM);
            notes.Add(Invariant($"the curves are cut at {x:0.##} {units.Length.Symbol}, though the mirror shows the lane out to {units.Distance(farthestM)}"));
        }

        if (chart.YCutAt is not null && nearer is not null)
        {
            notes.Add(Invariant($"the curves are cut at the top of the chart: {nearer}"));
        }

        return notes.Count == 0 ? "" : " Note: " + string.Join("; ", notes) + ".";
    }
}
