using static System.FormattableString;

namespace SafetyMirror.Core.Design;

/// <summary>A warning a result carries: a stable kebab-case code and one sentence for the reader.</summary>
public sealed record Caution(string Code, string Text);

/// <summary>The cautions every result carries, worded for the case.</summary>
public static class Cautions
{
    /// <summary>The cautions for a case, in reading order.</summary>
    /// <remarks>An approach speed above the siting values' limit is a failing siting check, not a caution.</remarks>
    /// <param name="rules">The siting values the case was checked against.</param>
    /// <param name="roadUsers">The road users whose visibility was checked.</param>
    public static IReadOnlyList<Caution> For(SitingRules rules, IEnumerable<RoadUser> roadUsers)
    {
        ArgumentNullException.ThrowIfNull(rules);
        ArgumentNullException.ThrowIfNull(roadUsers);
        var vulnerable = roadUsers.Where(user => user.IsVulnerable).Select(user => user.Name).ToList();

        List<Caution> cautions =
        [
            new("last-resort",
                "A mirror is a last resort, never a substitute for removing the obstruction: cut it back, move the stop line or lower the speed first."),
        ];
        cautions.AddRange(
        [
            new("looks-smaller-farther-slower",
                "Vehicles in a convex mirror look smaller, farther away and slower than they are, so drivers misjudge the gap."),
            new("left-right-reversed",
                "Left and right are reversed in the mirror, so the side a vehicle comes from can be misread."),
            new("blind-zones",
                "The mirror leaves blind zones, near the mirror and beside the obstruction, where nothing is shown."),
            new("pedestrians-and-cyclists", vulnerable.Count == 0
                ? "Pedestrians and cyclists may not be seen at all, above all at night on unlit roads; none was among the road users checked, and they are narrower than any design vehicle."
                : $"Pedestrians and cyclists may not be seen at all, above all at night on unlit roads; the size check (here: {string.Join(", ", vulnerable)}) assumes they are lit and stand out from their background."),
            new("needs-inspection",
                "Glare from low sun and headlights, fog, frost and ice, dirt, vandalism and wind misalignment degrade the mirror, so it needs a regime of inspection, cleaning and realignment."),
            new("drivers-may-over-rely",
                "Drivers may rely on the mirror and stop or look less carefully than without it."),
            new("local-rules-govern", Invariant(
                $"Local road authority rules and permits govern; the siting values used (lower edge at least {rules.MinimumLowerEdgeClearanceM} m above footway or carriageway and {rules.CarriagewayClearanceM} m over a carriageway, face at least {rules.KerbOffsetM} m from the kerb, mirror within {rules.MaximumEyeToMirrorDistanceM} m of the stop line, approach speed at most {rules.CautionAboveSpeedKmh} km/h) come from {rules.Source}; {rules.CarriagewayClearanceSource}; {rules.KerbOffsetSource}; they may differ locally.")),
            new("not-an-approval",
                "This result is decision support, not approval: licensed engineering judgement decides."),
        ]);
        return cautions.AsReadOnly();
    }
}
