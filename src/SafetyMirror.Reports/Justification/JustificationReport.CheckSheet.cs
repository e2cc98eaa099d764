using SafetyMirror.Core.Design.Installation;
using SafetyMirror.Core.Optics;
using SafetyMirror.Reports.Documents;
using static System.FormattableString;

namespace SafetyMirror.Reports.Justification;

/// <summary>The crew's part of the installation and check sheet: the pole tied to what stands on site, the aim given as a target
/// to check, and the inspection record.</summary>
public sealed partial class JustificationReport
{
    /// <summary>Empty rows of the inspection record: two years of quarterly visits and two after storms or impacts.</summary>
    private const int InspectionRows = 10;

    /// <summary>The pole tied to the nearest carriageway edge and the nearest obstacle corner, as rows of the mirror's table.</summary>
    private IEnumerable<IReadOnlyList<string>> TieRows(ReportedMirror mirror)
    {
        var p = mirror.Placement;
        var ties = PoleTies.Of(report.Plan, p.XM, p.YM);
        if (ties.Kerb is { } kerb)
        {
            var carriageway = Wording.FeatureName(kerb.Carriageway, "carriageway");
            yield return ["Pole from the carriageway edge", kerb.OnCarriageway
                ? $"{units.Height(kerb.OffsetM)} in from the nearest edge of {carriageway}, on the carriageway, measured square to the edge"
                : $"{units.Height(kerb.OffsetM)} {PoleTies.CompassPoint(kerb.BearingDeg)} of the nearest edge of {carriageway} (the kerb line), measured square to the edge"];
        }

        if (ties.Corner is { } corner)
        {
            yield return ["Pole from the nearest obstacle corner", Invariant($"{units.Height(corner.DistanceM)} on a bearing of {corner.BearingDeg:0.0}° ({PoleTies.CompassPoint(corner.BearingDeg)}) ")
                + $"from the corner of {Wording.FeatureName(corner.Obstacle, "obstacle")} at {Wording.Position(report.Plan.Frame, corner.CornerXM, corner.CornerYM, withSystem: false)}"];
        }

        if (ties.Kerb is null && ties.Corner is null)
        {
            yield return ["Pole tied to site features", "The plan draws no carriageway edge and no obstacle: set the pole out from the plan coordinates"];
        }
    }

    /// <summary>The aim as targets a crew can check from the driver's eye point, one for each approach the mirror serves.</summary>
    private void WriteAimCheck(IReportWriter writer, ReportedMirror mirror)
    {
        writer.Heading($"Aim check, mirror {mirror.Label}", 3);
        var eye = report.Plan.Eyes[report.Options.EyeIndex].Position;
        var tolerance = report.Options.AimToleranceDeg;
        if (mirror.Serves.Count == 0)
        {
            writer.Paragraph("The mirror serves no approach, so there is no aim to check.");
            return;
        }

        var pole = units.Height(CheckTargets.PoleHeightM);
        var tol = Invariant($"{tolerance:0.#}°");
        writer.Table(new ReportTable(
            ["Approach", $"Hold a {pole} pole upright on the lane centre", "From the eye point it appears", $"Aim off {tol} in azimuth: the target lies", $"Aim off {tol} in tilt: the target lies"],
            [.. mirror.Serves.Select(i => AimCheckRow(report.Approaches[i], CheckTargets.For(mirror.Placement, eye, report.Approaches[i].Approach, tolerance)))],
            [1.8, 2.4, 2.6, 1.6, 1.6]));
        writer.Paragraph($"Stand at the driver's eye point, {units.Height(eye.Z)} above the ground, while a helper holds the pole at the distance given, measured "
            + "along the lane from its conflict point. Turn or tilt the face until the pole appears as stated. The targets come from the exact reflection on the "
            + $"curved face, not from a small-angle rule. The verdict was tested with the aim off by {tol} either way in azimuth and in tilt; a target that must "
            + "stand outside the stretches given to appear as stated means the aim is off by more than that: realign it.");
    }

    private IReadOnlyList<string> AimCheckRow(ReportedApproach approach, AimCheck check)
    {
        var target = check.Target;
        if (double.IsInfinity(target.MissM))
        {
            return [approach.Title, "—", "No point of the lane reflects in the face from the eye point: the aim cannot be checked on this lane", "—", "—"];
        }

        var at = $"{units.Distance(target.StationM)} upstream of the conflict point (at {Wording.Position(report.Plan.Frame, target.XM, target.YM, withSystem: false)})";
        var seen = target.AtCentre
            ? $"At the centre of the face: the point {units.Height(target.HeightM)} up the pole"
            : $"Its {(target.HeightM > 0 ? "top" : "foot")} {units.Height(target.MissM)} {(target.AboveCentreM < 0 ? "below" : "above")} the centre of the face "
                + "(no point of the pole reflects exactly at the centre; this is the nearest)";
        var (azFrom, azTo) = check.AzimuthStretchM;
        var (tiltFrom, tiltTo) = check.TiltStretchM;
        return [approach.Title, at, seen, $"{units.Range(azFrom, azTo)} upstream", $"{units.Range(tiltFrom, tiltTo)} upstream"];
    }

    /// <summary>The backing board the rule set asks for this face, or that it asks none; a rule set never gets one it does not state.</summary>
    private string BackingBoard(Aperture aperture) => report.Options.Rules.BackingBoard is not { } board
        ? "As the local rule set requires: the siting values used here set no backing board"
        : aperture is RoundAperture round
            ? Invariant($"Square, {board.SideOverDiameter * round.DiameterM * 1000:0} mm a side ({board.SideOverDiameter:0.##} × the diameter), {board.Pattern} ({Provenance.Plain(board.Source)})")
            : Invariant($"{board.SideOverDiameter:0.##} × the diameter, {board.Pattern} ({Provenance.Plain(board.Source)}); the rule states it for round faces: as the local rule set requires for this one");

    /// <summary>The inspection record for the maintenance file, with empty rows to fill in on site.</summary>
    private static void WriteInspectionRecord(IReportWriter writer)
    {
        writer.Heading("Inspection record", 2);
        writer.Paragraph("For the maintenance file: at every visit, clean the face, check the aim against the target above from the driver's eye point, "
            + "and note damage (cracks, crazing, loose fixings, a bent pole), glare, ice and graffiti.");
        writer.Table(new ReportTable(
            ["Date", "Cleaned", "Aim checked (target at centre)", "Damage or defects", "Initials"],
            [.. Enumerable.Range(0, InspectionRows).Select(_ => (IReadOnlyList<string>)["\n\n", "", "", "", ""])],
            [1.4, 1.1, 2.2, 3.8, 1]));
    }
}
