using SafetyMirror.Core.Design.Evaluation;
using SafetyMirror.Core.Site;
using static System.FormattableString;

namespace SafetyMirror.Core.Design.Recommendation;

/// <summary>The recommendation in words: the outcome sentence, why each alternative ranks where it does, what to do first.</summary>
/// <remarks>Every figure comes from the alternatives' full evaluations.</remarks>
public static class RecommendationWording
{
    /// <summary>A reserve thinner than this (recognition distance ÷ required, worst case) is flagged.</summary>
    private const double ThinMargin = 1.1;

    private const string NoMirrorNeededSentence = "No mirror is needed: the direct view already gives the required sight distance on every approach to be served.";

    internal static Recommendation NoMirrorNeeded(IReadOnlyList<DirectView> judged, IReadOnlyList<int> served)
    {
        var figures = string.Join(", ", judged.Select(a => Invariant($"{EvaluationWording.NameOf(a.Approach.Feature)} {a.DirectSightDistanceM:0.#} m against {a.Required.DesignM:0.#} m")));
        List<string> measures = [$"{NoMirrorNeededSentence[..^1]} ({figures}).", "Keep the sight triangle clear: cut back vegetation and keep parking out of it."];
        return new Recommendation(RecommendationOutcome.NoMirrorNeeded, [], [], measures, served, 0, NoMirrorNeededSentence);
    }

    /// <summary>The outcome in plain words in the given units (the recommendation carries it in metric).</summary>
    public static string Summary(Recommendation recommendation, RecommendationOptions options, WordingUnits units)
    {
        ArgumentNullException.ThrowIfNull(recommendation);
        ArgumentNullException.ThrowIfNull(options);
        return recommendation.Outcome == RecommendationOutcome.NoMirrorNeeded
            ? NoMirrorNeededSentence
            : Summary(recommendation.Outcome, [.. recommendation.Alternatives], options, units);
    }

    internal static Recommendation Recommendation(
        SitePlan plan,
        RecommendationOptions options,
        RecommendationOutcome outcome,
        List<Alternative> alternatives,
        List<CandidateTried> candidates,
        IReadOnlyList<DirectView> direct,
        List<int> served,
        int evaluations)
    {
        var worded = alternatives.Select((a, rank) => a with { Rationale = Rationale(a, rank, alternatives, options) }).ToList();
        var summary = Summary(outcome, worded, options, WordingUnits.Metric);
        return new Recommendation(outcome, worded, candidates, Measures(plan, direct, worded.FirstOrDefault(), served, options), served, evaluations, summary);
    }

    private static string Summary(RecommendationOutcome outcome, List<Alternative> alternatives, RecommendationOptions options, WordingUnits u)
    {
        string Install(MirrorDesign mirror) => RecommendationWording.Install(mirror, u);
        var whom = EvaluationWording.Whom(options.Evaluation.Decisive);
        var tolerance = Invariant($"{options.AimToleranceDeg:0.#}°");
        var best = alternatives.FirstOrDefault();
        var notCovered = best?.Mirrors.SelectMany(m => m.Evaluation.Verdict.NotCovered).Distinct().ToList() ?? [];
        var coverNote = notCovered.Count == 0 ? string.Empty
            : " " + string.Join(" ", notCovered.Select(u => $"A {u.Name.ToLowerInvariant()} is not recognisable out to the required distance in it and is not covered."));
        return outcome switch
        {
            RecommendationOutcome.OneMirror =>
                $"One mirror serves: the {Install(best!.Mirrors[0])} meets the requirement on every served approach for {whom}, {EvaluationWording.UnseenPhrase(options.Evaluation, u)}, and holds with its aim off by {tolerance}.{coverNote}",
            RecommendationOutcome.TwoMirrors =>
                $"Two mirrors are needed, one per approach: {string.Join("; and ", best!.Mirrors.Select(Install))}. Together they meet the requirement for {whom} and hold with their aim off by {tolerance}.{coverNote}",
            RecommendationOutcome.OutsideSitingRules =>
                $"No mirror can be installed within the siting rules: the best design, the {Install(best!.Mirrors[0])}, breaks {string.Join("; ", best.Mirrors.SelectMany(m => m.Evaluation.Verdict.FailedChecks).Select(c => EvaluationWording.FailedCheck(c, u)).Distinct())}.",
            _ => best is null
                ? "No mirror serves: no pole position and catalogue mirror could be judged."
                : $"No mirror in the catalogue meets the requirement for {whom}: the best, the {Install(best.Mirrors[0])}, {Missing(best, u)}.",
        };
    }

    /// <summary>A mirror and where it goes, in a phrase.</summary>
    private static string Install(MirrorDesign mirror, WordingUnits u)
    {
        var p = mirror.Placement;
        return MirrorType.Describe(p.Aperture, p.RadiusM)
            + Invariant($" on a pole at local ({p.XM:0.0}, {p.YM:0.0}) m, centre ") + u.Height(p.CentreHeightM)
            + Invariant($" up, aimed {p.AzimuthDeg:0.0}° and tilted {p.TiltDownDeg:0.0}° down");
    }

    /// <summary>What keeps a design from meeting the requirement, from its worst aim.</summary>
    private static string Missing(Alternative alternative, WordingUnits u)
    {
        var parts = new List<string>();
        foreach (var mirror in alternative.Mirrors)
        {
            var robustness = mirror.Evaluation.Robustness;
            var worst = robustness.Worst;
            var nominal = robustness.Cases[0];
            if (!nominal.Meets)
            {
                if (nominal.LongestUnseen is { } gap)
                {
                    parts.Add($"leaves the stretch from {u.Distance(gap.FromM)} to {u.Distance(gap.ToM)} unseen");
                }

                parts.Add($"provides {u.Distance(nominal.ProvidedSightDistanceM)} ({Invariant($"{nominal.Margin:0.00}")} × the required distance) at its best aim");
            }
            else if (!worst.Meets)
            {
                parts.Add(Invariant($"meets the requirement at its best aim but not with the aim off by {robustness.ToleranceDeg:0.#}° (") + EvaluationWording.RobustnessSentence(robustness, u).TrimEnd('.') + ")");
            }

            parts.AddRange(mirror.Evaluation.Verdict.FailedChecks.Select(c => "breaks " + EvaluationWording.FailedCheck(c, u)));
        }

        return parts.Count == 0 ? "falls short" : string.Join("; ", parts.Distinct());
    }

    private static string Rationale(Alternative alternative, int rank, List<Alternative> ranked, RecommendationOptions options)
    {
        var arrangement = alternative.Mirrors.Count == 1 ? string.Empty
            : alternative.Mirrors.Select(m => (m.Placement.XM, m.Placement.YM)).Distinct().Count() == 1 ? "Two faces on one pole. " : "Two mirrors on separate poles. ";
        var parts = alternative.Mirrors.Select(m =>
        {
            var face = m.Type.Description;
            var state = alternative.Mirrors.Count == 1
                ? alternative.Score.Standing switch
                {
                    0 => "meets the requirement",
                    1 => "would show enough but is outside the siting rules",
                    _ => "does not meet the requirement",
                }
                : "serves its approach";
            var figures = string.Join("; ", m.Evaluation.Approaches.Where(a => !a.Summary.DirectMeetsRequirement).SelectMany(a => a.Summary.Coverage.Select(c =>
                Invariant($"on {EvaluationWording.NameOf(a.Approach.Feature)} a {c.RoadUser.Name.ToLowerInvariant()} is recognisable to {c.ProvidedSightDistanceM:0.#} m against {a.Required.DesignM:0.#} m required")
                + (c.LongestUnseen is { } gap ? Invariant($", with {gap.FromM:0.#}–{gap.ToM:0.#} m unseen") : string.Empty))));
            return $"The {face} {state}: {figures}. {EvaluationWording.RobustnessSentence(m.Evaluation.Robustness)}";
        });
        var text = arrangement + string.Join(" ", parts);
        if (rank == 0)
        {
            var smaller = ranked.Skip(1).Where(a => a.Score.FaceAreaM2 < alternative.Score.FaceAreaM2).OrderByDescending(a => a.Score).FirstOrDefault();
            if (alternative.Score.MeetsRequirement && smaller is not null)
            {
                text += Invariant($" The smaller {Faces(smaller)} does not meet the verdict ({smaller.Score.Robustness:P0} of the required distance at its worst aim).");
            }
            else if (alternative.Score.MeetsRequirement && options.Catalogue.All(t => t.Aperture.AreaM2 >= alternative.Score.FaceAreaM2 - 1e-9) && alternative.Mirrors.Count == 1)
            {
                text += " It is the smallest mirror in the catalogue.";
            }
        }
        else
        {
            text += $" It ranks below the first on {Difference(alternative.Score, ranked[0].Score)}.";
        }

        if (alternative.Score.MeetsRequirement && alternative.Robustness.WorstMargin < ThinMargin)
        {
            text += Invariant($" Its reserve is thin (recognition distance {alternative.Robustness.WorstMargin:0.00} × the required at its worst aim): a larger mirror, or a careful aim checked on site, gives more.");
        }

        return text;
    }

    private static string Faces(Alternative alternative) => string.Join(" and ", alternative.Mirrors.Select(m => m.Type.Description));

    private static string Difference(DesignScore mine, DesignScore first)
    {
        var (a, b) = (mine.Key, first.Key);
        return a.Standing != b.Standing ? "meeting the verdict"
            : a.Coverage != b.Coverage ? "coverage"
            : a.Face != b.Face ? "face size"
            : a.Margin != b.Margin ? "worst-case margin of recognition distance"
            : a.Unseen != b.Unseen ? "unseen stretch"
            : a.BlindZone != b.BlindZone ? "near blind zone" : "robustness to aim error";
    }

    private static List<string> Measures(SitePlan plan, IReadOnlyList<DirectView> direct, Alternative? best, List<int> served, RecommendationOptions options)
    {
        var measures = new List<string>();
        var blockers = served.Select(i => direct[i].BlockedBy).OfType<FeatureReference>().Distinct().ToList();
        measures.Add(blockers.Count > 0
            ? $"Remove or lower the obstruction first: {string.Join(", ", blockers.Select(b => b.Name ?? b.Id ?? b.Path))} cuts the direct view; a mirror is a last resort."
            : "Remove or lower the obstruction first; a mirror is a last resort.");
        measures.Add("Consider moving the stop line or decision point forward, where the driver sees farther directly.");
        if (best is null || best.Score.MeetsRequirement)
        {
            return measures;
        }

        foreach (var check in best.Mirrors.SelectMany(m => m.Evaluation.Verdict.FailedChecks).DistinctBy(c => c.Code))
        {
            measures.Add($"To bring the best design inside the siting rules: {EvaluationWording.Remedy(check)} ({check.Code}).");
        }

        foreach (var index in served)
        {
            var approach = plan.Approaches[index];
            var evaluated = best.Mirrors.Where(m => m.ServedApproaches.Contains(index))
                .SelectMany(m => m.Evaluation.Approaches).FirstOrDefault(a => a.Approach.Feature == approach.Feature);
            if (evaluated is null || evaluated.Summary.DirectMeetsRequirement)
            {
                continue;
            }

            var achieved = evaluated.Summary.Coverage.Min(c => c.ProvidedSightDistanceM);
            var requiredM = evaluated.Required.DesignM;
            if (achieved >= requiredM)
            {
                continue;
            }

            var speeds = Enumerable.Range(1, (int)(approach.SpeedKmh / 5)).Select(k => approach.SpeedKmh - (5 * k)).Where(v => v >= 5);
            var lower = speeds.FirstOrDefault(v => options.Evaluation.SightDistance.Required(v, approach.GradePercent).DesignM <= achieved);
            var name = EvaluationWording.NameOf(approach.Feature);
            var ceiling = options.Evaluation.Rules.CautionAboveSpeedKmh;
            measures.Add(lower > 0
                ? Invariant($"Lower the speed on {name}: the best design provides {achieved:0.#} m, which meets the requirement at {lower:0} km/h or less")
                    + (lower > ceiling ? Invariant($" (still above the {ceiling:0} km/h the siting values allow for a mirror).") : ".")
                : Invariant($"On {name} the best design provides only {achieved:0.#} m: no speed limit within reach makes a mirror enough."));
        }

        return measures;
    }
}
