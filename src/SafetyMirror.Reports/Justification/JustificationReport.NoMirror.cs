using SafetyMirror.Core.Design.Alternatives;
using SafetyMirror.Core.Design.Installation;
using SafetyMirror.Reports.Documents;
using static System.FormattableString;

namespace SafetyMirror.Reports.Justification;

/// <summary>The measures without a mirror the report weighs first, each with the figures that rule it in or out.</summary>
public sealed partial class JustificationReport
{
    /// <summary>How far back from the carriageway edge UK practice takes the waiting driver's eye (Manual for Streets, x-distance; secondary source, domain brief §3).</summary>
    private const double UkXDistanceM = 2.4;

    /// <summary>How far back from the edge of the travelled way AASHTO puts the decision point on the minor road (domain brief §3).</summary>
    private const double AashtoDecisionPointM = 4.4;

    private void WriteNoMirrorOptions(IReportWriter writer)
    {
        writer.Heading("Without a mirror", 2);
        var needing = NoMirrorOptions.For(report.Plan, report.Options);
        if (needing.Count == 0)
        {
            writer.Paragraph("Every approach is seen directly to its required sight distance: no measure, and no mirror, is needed.");
            return;
        }

        writer.Paragraph("A mirror is a last resort. Each measure below is judged with the same sightlines as the direct view (driver's eye to the "
            + "object height of the method, over every obstacle at its height), with only that one thing changed.");
        foreach (var options in needing)
        {
            var approach = report.Approaches.First(a => a.Approach.Feature == options.Approach.Feature);
            writer.Heading($"{approach.Title}: direct view {units.Distance(options.DirectM)} of {units.Distance(options.RequiredM)} required"
                + (options.BlockedBy is { } blocker ? $", ended by {Wording.FeatureName(blocker, "obstacle")}" : ""), 3);
            writer.Table(new ReportTable(
                ["Measure", "What it takes", "Direct view then", "Required then", "Result"],
                [ClearingRow(options), ForwardRow(options), LowerSpeedRow(options)],
                [2, 4.4, 1.3, 1.3, 1.2]));
        }

        writer.Paragraph("A measure marked \"Meets\" restores the direct view on its own; whether the obstacle may be removed or lowered, the stop line moved "
            + "(a vehicle waiting farther forward may stand in the path of passing traffic) or a lower speed enforced is for the road authority. Where one of them "
            + "can be done, it comes before a mirror.");
    }

    private IReadOnlyList<string> ClearingRow(ApproachOptions options)
    {
        var clearing = options.Clearing;
        var required = units.Distance(options.RequiredM);
        if (clearing.Cleared.Count == 0)
        {
            return ["Clear the obstruction", "No obstacle ends the direct view: the drawn lane ends first", units.Distance(clearing.DirectM), required, "Ruled out"];
        }

        var names = string.Join(", then ", clearing.Cleared.Select(f => Wording.FeatureName(f, "obstacle")));
        var what = clearing.LowerToM is { } lowerTo
            ? $"Remove {names}, or lower it to {units.Height(lowerTo)} or less"
            : clearing.Meets
                ? $"Remove {names}"
                : $"Remove {names}: the view is still short with {(clearing.Cleared.Count == 1 ? "it" : "them")} gone";
        return ["Clear the obstruction", what, units.Distance(clearing.DirectM), required, clearing.Meets ? "Meets" : "Ruled out"];
    }

    private IReadOnlyList<string> ForwardRow(ApproachOptions options)
    {
        var forward = options.Forward;
        var required = units.Distance(options.RequiredM);
        const string measure = "Move the stop line or waiting position forward";
        if (forward.Reason is { } reason)
        {
            return [measure, $"Not assessed: {reason}", "—", required, "Ruled out"];
        }

        var direction = Invariant($"toward the carriageway ({PoleTies.CompassPoint(forward.BearingDeg)})");
        if (forward.ForwardM is { } forwardM)
        {
            var fromEdge = forward.LimitM - forwardM;
            // Domain brief §3: the waiting driver's eye is taken 2.4 m back from the edge in UK practice, 4.4 m by AASHTO.
            var close = fromEdge < UkXDistanceM
                ? $", nearer the edge than the {units.Height(UkXDistanceM)} x-distance of UK practice (Manual for Streets) or the {units.Height(AashtoDecisionPointM)} "
                    + "decision point of AASHTO take for a waiting driver's eye"
                : "";
            return [measure, $"The driver's eye {units.Height(forwardM)} forward {direction}, {units.Height(fromEdge)} short of the carriageway edge{close}",
                units.Distance(forward.DirectAtForwardM), required, close.Length > 0 ? "Meets, eye near the edge" : "Meets"];
        }

        return
            [measure, $"No position up to the carriageway edge ({units.Height(forward.LimitM)} forward {direction}) gives the view",
                $"{units.Distance(forward.DirectAtForwardM)} at the edge", required, "Ruled out"];
    }

    private IReadOnlyList<string> LowerSpeedRow(ApproachOptions options)
    {
        var lower = options.LowerSpeed;
        const string measure = "Lower the approach speed";
        var from = units.Speed(options.Approach.SpeedKmh);
        return lower.SpeedKmh is { } speed
            ? [measure, $"From {from} to {units.Speed(speed)} or less (the highest whole km/h at which the present view suffices)", units.Distance(options.DirectM), units.Distance(lower.RequiredM), "Meets"]
            : [measure, $"No speed down to {units.Speed(lower.LowestTriedKmh)}, the lowest the method takes, makes the present view enough", units.Distance(options.DirectM),
                $"{units.Distance(lower.RequiredM)} at {units.Speed(lower.LowestTriedKmh)}", "Ruled out"];
    }
}
