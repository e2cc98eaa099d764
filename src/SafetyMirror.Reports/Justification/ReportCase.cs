using SafetyMirror.Core.Design;
using SafetyMirror.Core.Design.Evaluation;
using SafetyMirror.Core.Design.Glare;
using SafetyMirror.Core.Design.Recommendation;
using SafetyMirror.Core.Site;

namespace SafetyMirror.Reports.Justification;

/// <summary>One mirror the report presents: how it is placed, its evaluation, and the approaches it is for.</summary>
/// <param name="Label">"M1", "M2": how the plan and the tables name it.</param>
/// <param name="Evaluation">Its evaluation on the corner.</param>
/// <param name="Serves">Indices of the plan's approaches it is for.</param>
/// <param name="Type">The catalogue entry, or null for a mirror that matches none.</param>
/// <param name="Glare">Its year's sun glare, or why there is none; null when the report was not asked for glare.</param>
internal sealed record ReportedMirror(string Label, MirrorEvaluation Evaluation, IReadOnlyList<int> Serves, MirrorType? Type, GlareScan? Glare = null)
{
    public MirrorPlacement Placement => Evaluation.Placement;
}

/// <summary>One approach as the report presents it: what it needs, what the driver sees directly, and what its mirror shows.</summary>
/// <param name="Letter">"A", "B": how the plan and the tables name it.</param>
/// <param name="Approach">The approach.</param>
/// <param name="Required">The sight distance it needs.</param>
/// <param name="DirectM">The direct sight distance.</param>
/// <param name="DirectBlockedBy">What ends the direct view, if anything.</param>
/// <param name="Mirror">The evaluation of the mirror that serves it, or null when none does.</param>
/// <param name="MirrorLabel">That mirror's label, or null.</param>
internal sealed record ReportedApproach(
    string Letter,
    Approach Approach,
    RequiredSightDistance Required,
    double DirectM,
    FeatureReference? DirectBlockedBy,
    ApproachEvaluation? Mirror,
    string? MirrorLabel)
{
    public bool DirectMeets => DirectM >= Required.DesignM;

    public string Name => Wording.FeatureName(Approach.Feature, "approach");

    /// <summary>"Colliers Row eastbound (A)".</summary>
    public string Title => $"{Name} ({Letter})";
}

/// <summary>What a report is about, the same shape whether it comes from one evaluated mirror or a recommendation.</summary>
internal sealed record ReportCase(
    SitePlan Plan,
    EvaluationOptions Options,
    IReadOnlyList<ReportedMirror> Mirrors,
    IReadOnlyList<ReportedApproach> Approaches,
    IReadOnlyList<Caution> Cautions,
    Recommendation? Recommendation,
    RecommendationOptions? RecommendationOptions)
{
    public static ReportCase Of(SitePlan plan, MirrorEvaluation evaluation, GlareScan? glare = null)
    {
        var catalogued = MirrorTypes.Defaults.FirstOrDefault(t => t.Aperture == evaluation.Placement.Aperture && t.RadiusM == evaluation.Placement.RadiusM);
        var approaches = evaluation.Approaches.Select((a, i) => new ReportedApproach(Letter(i), a.Approach, a.Required, a.DirectSightDistanceM, a.DirectBlockedBy, a, "M1")).ToList();
        var serves = approaches.Select((a, i) => (a, i)).Where(x => !x.a.DirectMeets).Select(x => x.i).ToList();
        return new ReportCase(plan, evaluation.Options, [new ReportedMirror("M1", evaluation, serves, catalogued, glare)], approaches, evaluation.Cautions, null, null);
    }

    public static ReportCase Of(SitePlan plan, Recommendation recommendation, RecommendationOptions options, GlareScanOptions? glare = null, CancellationToken cancellationToken = default)
    {
        var designs = recommendation.Alternatives.FirstOrDefault()?.Mirrors ?? [];
        var mirrors = designs.Select((d, i) => new ReportedMirror($"M{i + 1}", d.Evaluation, d.ServedApproaches, d.Type,
            glare is null ? null : GlareScanner.Scan(plan, d.Evaluation.Placement.ToMirror(), glare, cancellationToken))).ToList();
        var direct = MirrorEvaluator.DirectViews(plan, options.Evaluation);
        var approaches = direct.Select((view, i) =>
        {
            var mirror = mirrors.FirstOrDefault(m => m.Serves.Contains(i));
            return new ReportedApproach(Letter(i), view.Approach, view.Required, view.DirectSightDistanceM, view.BlockedBy,
                mirror?.Evaluation.Approaches.FirstOrDefault(a => a.Approach.Feature == view.Approach.Feature), mirror?.Label);
        }).ToList();
        var cautions = mirrors.Count > 0
            ? mirrors.SelectMany(m => m.Evaluation.Cautions).DistinctBy(c => c.Code).ToList()
            : Core.Design.Cautions.For(options.Evaluation.Rules, options.Evaluation.RoadUsers);
        return new ReportCase(plan, options.Evaluation, mirrors, approaches, cautions, recommendation, options);
    }

    /// <summary>The approach's letter: A, B, … Z, then A2, B2 ….</summary>
    private static string Letter(int index) => index < 26 ? $"{(char)('A' + index)}" : $"{(char)('A' + index % 26)}{index / 26 + 1}";
}
