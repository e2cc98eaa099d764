using SafetyMirror.Core.Site;
using static System.FormattableString;

namespace SafetyMirror.Core.Design.Evaluation;

/// <summary>How the sentences write distances, heights and speeds: metric by default, or a report's own units.</summary>
/// <param name="Distance">A distance along the road or the face's setting, with its unit: "35 m".</param>
/// <param name="Speed">A speed with its unit: "30 km/h".</param>
/// <param name="Height">A height or small length on the mirror's setting, with its unit: "2.95 m".</param>
public sealed record WordingUnits(Func<double, string> Distance, Func<double, string> Speed, Func<double, string> Height)
{
    /// <summary>Metres to the decimetre (heights to the centimetre) and km/h.</summary>
    public static WordingUnits Metric { get; } = new(m => Invariant($"{m:0.#} m"), v => Invariant($"{v:0.#} km/h"), m => Invariant($"{m:0.00} m"));

    /// <summary>A check's value or limit in its unit: distances and speeds in these units, anything else as it is.</summary>
    public string Quantity(double value, string unit) => unit switch
    {
        "m" => Height(value),
        "km/h" => Speed(value),
        _ => Invariant($"{value:0.##} {unit}").TrimEnd(),
    };
}

/// <summary>The verdict on a mirror and the sentences that state it: written once, for the API and the report alike.</summary>
public static class EvaluationWording
{
    /// <summary>The verdict: the direct view suffices, or a siting check fails, or the requirement is not met at some aim, or it is met.</summary>
    internal static Verdict Verdict(
        MirrorPlacement placement, IReadOnlyList<ApproachEvaluation> approaches, IReadOnlyList<RuleCheck> checks, AimRobustness robustness, EvaluationOptions options)
    {
        var failed = checks.Where(c => !c.Passes).ToList();
        var notCovered = options.RoadUsers.Except(options.Decisive)
            .Where(user => approaches.Any(a => !a.Summary.DirectMeetsRequirement
                && (a.Summary.Reach.First(r => r.RoadUser == user).RecognisableToM ?? 0) < a.Required.DesignM))
            .ToList();
        var decision = approaches.All(a => a.Summary.DirectMeetsRequirement) ? Decision.DirectViewSuffices
            : failed.Count > 0 ? Decision.OutsideSitingRules
            : robustness.Holds ? Decision.MeetsRequirement
            : Decision.DoesNotMeet;
        var covered = decision == Decision.MeetsRequirement ? options.Decisive : [];
        var verdict = new Verdict(decision, covered, notCovered, failed, string.Empty);
        return verdict with { Sentence = Sentence(verdict, placement, approaches, robustness, options, WordingUnits.Metric) };
    }

    /// <summary>What would bring a design inside a failed siting check, in a few words.</summary>
    public static string Remedy(RuleCheck check, WordingUnits? units = null)
    {
        ArgumentNullException.ThrowIfNull(check);
        var u = units ?? WordingUnits.Metric;
        var short_ = u.Height(Math.Ceiling(Math.Abs(check.Limit - check.Value) * 100) / 100);
        return check.Code switch
        {
            "lower-edge-clearance" => $"hang the face {short_} higher",
            "carriageway-clearance" => $"hang the face {short_} higher or set the pole back so the face no longer overhangs the carriageway",
            "kerb-offset" => $"set the pole {short_} farther back from the kerb",
            "stop-line-to-mirror-distance" or "eye-to-mirror-distance" => $"stand the mirror {short_} nearer the stop line",
            "approach-speed" => $"lower the approach speed to {u.Speed(check.Limit)} or less",
            "eye-sees-mirror" => "turn the face towards the waiting driver and clear the line between them",
            GlareLimit.Code => "turn or move the mirror so the low sun is not reflected into the waiting driver's eyes",
            _ => "bring the design within the limit",
        };
    }

    /// <summary>A siting check that failed, with its figures and remedy: "approach-speed 55 km/h against at most 50 km/h (lower …)".</summary>
    public static string FailedCheck(RuleCheck check, WordingUnits? units = null)
    {
        ArgumentNullException.ThrowIfNull(check);
        var u = units ?? WordingUnits.Metric;
        var comparison = check.Comparison == "at-least" ? "at least" : "at most";
        return $"{check.Code} {u.Quantity(check.Value, check.Unit)} against {comparison} {u.Quantity(check.Limit, check.Unit)} ({Remedy(check, u)})";
    }

    /// <summary>The name an approach goes by in a sentence: its name, else its id, else its path.</summary>
    public static string NameOf(FeatureReference feature)
    {
        ArgumentNullException.ThrowIfNull(feature);
        return feature.Name ?? feature.Id ?? feature.Path;
    }

    /// <summary>Whom a verdict speaks of: "a passenger car", "a passenger car and a bicycle with rider".</summary>
    public static string Whom(IEnumerable<RoadUser> users) =>
        Join(users.Select(u => $"a {u.Name.ToLowerInvariant()}").ToList());

    /// <summary>One approach in one sentence (or two): what is seen directly and in the mirror, what is left unseen, against the requirement.</summary>
    public static string ApproachSentence(ApproachEvaluation approach, WordingUnits? units = null)
    {
        ArgumentNullException.ThrowIfNull(approach);
        var u = units ?? WordingUnits.Metric;
        var name = NameOf(approach.Approach.Feature);
        var s = approach.Summary;
        var required = approach.Required.DesignM;
        if (s.DirectMeetsRequirement)
        {
            return $"{name}: the direct view already gives {u.Distance(approach.DirectSightDistanceM)} against {u.Distance(required)} required.";
        }

        var parts = new List<string>();
        foreach (var c in s.Coverage)
        {
            var who = c.RoadUser.Name.ToLowerInvariant();
            var seen = c.ShownFromM is null
                ? $"the mirror never shows a {who}"
                : c.RecognisableToM is { } to
                    ? $"the mirror shows a {who} from {u.Distance(c.ShownFromM.Value)} to {u.Distance(c.ShownToM!.Value)} and it stays recognisable to {u.Distance(to)}"
                    : $"the mirror shows a {who} from {u.Distance(c.ShownFromM.Value)} to {u.Distance(c.ShownToM!.Value)} but it is recognisable nowhere in it";
            var sentence = $"{seen}; the mirror provides {u.Distance(c.ProvidedSightDistanceM)} against {u.Distance(required)} required ({(c.Meets ? "met" : "not met")})";
            if (c.CutByApproachEnd)
            {
                sentence += " — the drawn lane ends there, so the mirror may show farther";
            }

            foreach (var gap in c.Unseen)
            {
                sentence += $"; between {u.Distance(gap.FromM)} and {u.Distance(gap.ToM)} ({Invariant($"{gap.Seconds:0.0}")} s at {u.Speed(approach.Approach.SpeedKmh)}) neither the direct view nor the mirror shows a {who} recognisably";
            }

            parts.Add(sentence);
        }

        return $"{name} (direct view {u.Distance(approach.DirectSightDistanceM)}): " + string.Join("; ", parts) + ".";
    }

    /// <summary>How the design holds with the aim off by the tolerance, in one sentence.</summary>
    public static string RobustnessSentence(AimRobustness robustness, WordingUnits? units = null)
    {
        ArgumentNullException.ThrowIfNull(robustness);
        var u = units ?? WordingUnits.Metric;
        var worst = robustness.Worst;
        var where = worst.AzimuthOffsetDeg != 0 ? Invariant($"azimuth {worst.AzimuthOffsetDeg:+0.#;-0.#}°")
            : worst.TiltOffsetDeg != 0 ? Invariant($"tilt {worst.TiltOffsetDeg:+0.#;-0.#}°") : "the aim as set";
        var margin = double.IsPositiveInfinity(worst.Margin) ? "no mirror needed" : Invariant($"{worst.Margin:0.00} × the required distance recognisable");
        var gap = worst.LongestUnseen is { } g ? $", {u.Distance(g.LengthM)} left unseen" : string.Empty;
        return robustness.Holds
            ? Invariant($"With the aim off by {robustness.ToleranceDeg:0.#}° either way in azimuth or tilt it still meets the requirement (worst case {where}: {margin}{gap}).")
            : Invariant($"With the aim off by {robustness.ToleranceDeg:0.#}° it no longer meets the requirement (worst case {where}: {margin}{gap}).");
    }

    /// <summary>The verdict's sentences in the given units (the verdict carries them in metric).</summary>
    public static string Sentence(MirrorEvaluation evaluation, WordingUnits units)
    {
        ArgumentNullException.ThrowIfNull(evaluation);
        return Sentence(evaluation.Verdict, evaluation.Placement, evaluation.Approaches, evaluation.Robustness, evaluation.Options, units);
    }

    private static string Sentence(
        Verdict verdict, MirrorPlacement placement, IReadOnlyList<ApproachEvaluation> approaches, AimRobustness robustness, EvaluationOptions options, WordingUnits u)
    {
        if (verdict.Decision == Decision.DirectViewSuffices)
        {
            return "No mirror is needed: the direct view already gives the required sight distance on every approach ("
                + string.Join("; ", approaches.Select(a => $"{NameOf(a.Approach.Feature)} {u.Distance(a.DirectSightDistanceM)} against {u.Distance(a.Required.DesignM)}")) + ").";
        }

        var face = MirrorType.Describe(placement.Aperture, placement.RadiusM);
        var whom = Whom(options.Decisive);
        var opticsHold = robustness.Holds;
        var opening = verdict.Decision switch
        {
            Decision.MeetsRequirement => $"The {face} meets the requirement on every approach for {whom}, {UnseenPhrase(options, u)}, and holds with its aim off by {Invariant($"{robustness.ToleranceDeg:0.#}")}°.",
            Decision.OutsideSitingRules => $"The {face} is outside the siting rules: {string.Join("; ", verdict.FailedChecks.Select(c => FailedCheck(c, u)))}. "
                + (opticsHold ? $"What it shows would meet the requirement for {whom}, but a design outside the rules is not met." : $"It does not meet the requirement for {whom} either."),
            _ => $"The {face} does not meet the requirement for {whom}.",
        };
        var sentences = new List<string> { opening };
        sentences.AddRange(approaches.Select(a => ApproachSentence(a, u)));
        sentences.Add(RobustnessSentence(robustness, u));
        foreach (var user in verdict.NotCovered)
        {
            var reach = approaches.Where(a => !a.Summary.DirectMeetsRequirement).Select(a => a.Summary.Reach.First(r => r.RoadUser == user).RecognisableToM ?? 0).Min();
            sentences.Add(reach > 0
                ? $"A {user.Name.ToLowerInvariant()} stays recognisable only to {u.Distance(reach)} on some approach and is not covered."
                : $"A {user.Name.ToLowerInvariant()} is recognisable nowhere in the mirror on some approach and is not covered.");
        }

        return string.Join(" ", sentences);
    }

    /// <summary>What the verdict allowed to stay unseen: "with nothing left unseen", or the allowance when one was given.</summary>
    public static string UnseenPhrase(EvaluationOptions options, WordingUnits? units = null)
    {
        ArgumentNullException.ThrowIfNull(options);
        return options.MaxUnseenStretchM > 0
            ? $"with no unseen stretch longer than {(units ?? WordingUnits.Metric).Distance(options.MaxUnseenStretchM)}"
            : "with nothing left unseen";
    }

    private static string Join(IReadOnlyList<string> items) => items.Count switch
    {
        0 => string.Empty,
        1 => items[0],
        _ => $"{string.Join(", ", items.Take(items.Count - 1))} and {items[^1]}",
    };
}
