using SafetyMirror.Core.Design.Evaluation;
using SafetyMirror.Reports.Charts;
using SafetyMirror.Reports.Graphics;
using static System.FormattableString;

namespace SafetyMirror.Reports.Justification;

/// <summary>The two charts of an approach: how large each road user looks in the mirror, and how far away it seems.</summary>
internal static class ApproachCharts
{
    /// <summary>Most road users one chart shows, one line style each.</summary>
    public const int MaxSeries = 6;

    private const double WidthMm = 170;
    private const double HeightMm = 82;

    /// <summary>Apparent size (smaller dimension, arcmin) against distance from the conflict point, per road user; null when nothing is shown.</summary>
    public static (Drawing Chart, string Caption)? ApparentSize(ReportedApproach approach, EvaluationOptions options, DisplayUnits units)
    {
        var stations = approach.Mirror?.Stations ?? [];
        var users = options.RoadUsers.Take(MaxSeries).Where(u => stations.Any(s => s.RoadUser == u && s.Shown)).ToList();
        if (users.Count == 0)
        {
            return null;
        }

        var chart = new LineChartBuilder(WidthMm, HeightMm, $"Distance from the conflict point ({units.Length.Symbol})", "Apparent size, smaller dimension (arcmin)",
            $"Apparent size in the mirror, {approach.Name}");
        foreach (var user in users)
        {
            chart.AddSeries(user.Name, stations.Where(s => s.RoadUser == user && s.Shown).Select(s => (units.ToLength(s.StationM), s.SmallestApparentArcmin!.Value)));
        }

        var vision = options.Vision;
        chart.AddThreshold(vision.Recognition.AngleArcmin, Invariant($"Recognition {vision.Recognition.AngleArcmin:0.##} arcmin"))
            .AddThreshold(vision.Detection.AngleArcmin, Invariant($"Detection {vision.Detection.AngleArcmin:0.##} arcmin"))
            .AddMarker(units.ToLength(approach.Required.DesignM), $"Required {units.Distance(approach.Required.DesignM)}")
            .ExtendXAxis(units.ToLength(1.15 * approach.Required.DesignM));
        var left = options.RoadUsers.Count > MaxSeries ? $" Only the first {MaxSeries} road users are drawn." : "";
        return (chart.Build(),
            $"Apparent size in the mirror of each road user on {approach.Title}, at the stations where the mirror shows it: the smaller of its apparent height and width, "
            + Invariant($"against the recognition ({vision.Recognition.AngleArcmin:0.##} arcmin) and detection ({vision.Detection.AngleArcmin:0.##} arcmin) thresholds.{left}"));
    }

    /// <summary>Equivalent direct distance against the true light-path length, for the design road user; null when it is not shown.</summary>
    public static (Drawing Chart, string Caption)? EquivalentDistance(ReportedApproach approach, EvaluationOptions options, DisplayUnits units)
    {
        var design = options.DesignRoadUser;
        var shown = (approach.Mirror?.Stations ?? []).Where(s => s.RoadUser == design && s.Shown).ToList();
        if (shown.Count == 0)
        {
            return null;
        }

        var farthestPath = shown.Max(s => s.PathLengthM!.Value);
        var chart = new LineChartBuilder(WidthMm, HeightMm, $"True distance, eye to mirror to road user ({units.Length.Symbol})", $"Equivalent direct distance ({units.Length.Symbol})",
                $"Equivalent direct distance, {approach.Name}")
            .AddSeries($"{design.Name} in the mirror", shown.Select(s => (units.ToLength(s.PathLengthM!.Value), units.ToLength(s.EquivalentDistanceM!.Value))))
            .AddSeries("Seen directly (equal distances)", [(0, 0), (units.ToLength(farthestPath), units.ToLength(farthestPath))])
            .ExtendXAxis(units.ToLength(1.1 * farthestPath));
        var at = shown.Where(s => s.StationM <= approach.Required.DesignM).MaxBy(s => s.StationM) ?? shown.MinBy(s => s.StationM)!;
        chart.AddMarker(units.ToLength(at.PathLengthM!.Value), $"At {units.Distance(at.StationM)} from the conflict point");
        var ratio = at.EquivalentDistanceM!.Value / at.PathLengthM!.Value;
        return (chart.Build(),
            $"How far away a {design.Name.ToLowerInvariant()} looks in the mirror on {approach.Title}: at {units.Distance(at.StationM)} from the conflict point "
            + $"its light path is {units.Distance(at.PathLengthM!.Value)}, yet it looks as small as it would look seen directly from {units.Distance(at.EquivalentDistanceM!.Value)}, "
            + Invariant($"{ratio:0.0} times as far. Drivers read it as farther away and slower than it is."));
    }
}
