using NetTopologySuite.Geometries;
using SafetyMirror.Api.Features.Evaluations;
using SafetyMirror.Core.Design;
using SafetyMirror.Core.Design.Evaluation;
using SafetyMirror.Core.Design.Recommendation;
using SafetyMirror.Core.Optics;
using SafetyMirror.Core.Site;
using static System.FormattableString;

namespace SafetyMirror.Api.Features.Recommendations;

/// <summary>Maps a Core recommendation to the response contract, positions back in the plan's coordinates.</summary>
public static class RecommendationMapping
{
    private static readonly GeometryFactory Factory = new();

    /// <summary>The outcome codes of the contract.</summary>
    public static string OutcomeCode(RecommendationOutcome outcome) => outcome switch
    {
        RecommendationOutcome.NoMirrorNeeded => "no-mirror-needed",
        RecommendationOutcome.OneMirror => "one-mirror",
        RecommendationOutcome.TwoMirrors => "two-mirrors",
        RecommendationOutcome.OutsideSitingRules => "outside-siting-rules",
        _ => "no-mirror-serves",
    };

    /// <summary>The response for a recommendation on a plan with the options it was made with; with <paramref name="glare"/> the
    /// recommended design's mirrors carry their year's sun glare (scanned for them only, not for every alternative).</summary>
    public static RecommendationResponse ToResponse(
        this Recommendation recommendation, SitePlan plan, RecommendationOptions options, GlareRequest? glare = null, CancellationToken cancellationToken = default)
    {
        var alternatives = recommendation.Alternatives.Select((a, i) => Alternative(a, i + 1, plan, i == 0 ? glare : null, cancellationToken)).ToList();
        var first = recommendation.Alternatives.FirstOrDefault();
        return new RecommendationResponse(
            OutcomeCode(recommendation.Outcome),
            recommendation.Summary,
            Approaches(plan, recommendation.ServedApproaches),
            alternatives,
            first is not null && first.Score.MeetsRequirement ? new InstallationSheetResponse([.. first.Mirrors.Select(m => Installed(m, plan))]) : null,
            recommendation.MeasuresToConsider,
            [.. CautionsOf(recommendation, plan, options).Select(c => new CautionResponse(c.Code, c.Text))],
            [.. recommendation.Candidates.Select(c => new CandidateResponse(PlanPoint(plan, c.XM, c.YM), Round(c.Score.Coverage), c.Stage))],
            recommendation.Evaluations,
            Options(options, plan));
    }

    /// <summary>The point of the plan at local metres, in the plan's coordinates.</summary>
    public static Point PlanPoint(SitePlan plan, double xM, double yM) => Factory.CreatePoint(plan.Frame.ToPlan(new Coordinate(xM, yM)));

    /// <summary>The cautions of the first alternative's evaluation, or the general ones when there is no alternative.</summary>
    public static IReadOnlyList<Caution> CautionsOf(Recommendation recommendation, SitePlan plan, RecommendationOptions options) =>
        recommendation.Alternatives.FirstOrDefault()?.Mirrors[0].Evaluation.Cautions
        ?? Cautions.For(options.Evaluation.Rules, options.Evaluation.RoadUsers);

    private static AlternativeResponse Alternative(Alternative alternative, int rank, SitePlan plan, GlareRequest? glare, CancellationToken cancellationToken)
    {
        var s = alternative.Score;
        var r = alternative.Robustness;
        return new AlternativeResponse(
            rank,
            s.MeetsRequirement,
            [.. alternative.Mirrors.Select(m => new DesignMirrorResponse(m.Type.Id, Approaches(plan, m.ServedApproaches), Evaluated(m.Evaluation, plan, glare, cancellationToken)))],
            new ScoreResponse(s.Standing, Round(s.Coverage), Round(s.FaceAreaM2), Round(Math.Min(s.Margin, DesignScore.MarginCap)), Round(s.UnseenM), Round(s.NearBlindZoneM), Round(s.Robustness)),
            new DesignRobustnessResponse(r.ToleranceDeg, r.Holds, Round(Math.Min(r.WorstMargin, DesignScore.MarginCap)), Round(r.WorstCoverage), Round(r.LongestUnseenM)),
            alternative.Rationale);
    }

    private static EvaluationResponse Evaluated(MirrorEvaluation evaluation, SitePlan plan, GlareRequest? glare, CancellationToken cancellationToken)
    {
        if (glare is null)
        {
            return evaluation.ToResponse(plan);
        }

        var (_, scan) = GlareAnswer.Apply(plan, evaluation, glare, cancellationToken);
        return evaluation.ToResponse(plan, GlareAnswer.ToResponse(scan, glare));
    }

    private static InstalledMirrorResponse Installed(MirrorDesign mirror, SitePlan plan)
    {
        var placement = mirror.Placement;
        return new InstalledMirrorResponse(
            mirror.Type.Id,
            mirror.Type.Description,
            PlanPoint(plan, placement.XM, placement.YM),
            Round(placement.CentreHeightM),
            Round(mirror.Evaluation.Mirror.LowerEdgeHeightM),
            Math.Round(placement.AzimuthDeg, 1) % 360,
            Math.Round(placement.TiltDownDeg, 1),
            (placement.Aperture as RoundAperture)?.DiameterM,
            (placement.Aperture as RectangularAperture)?.WidthM,
            (placement.Aperture as RectangularAperture)?.HeightM,
            placement.RadiusM,
            Approaches(plan, mirror.ServedApproaches),
            [.. mirror.Evaluation.Cautions.Select(c => new CautionResponse(c.Code, c.Text))]);
    }

    private static RecommendationOptionsResponse Options(RecommendationOptions options, SitePlan plan) => new(
        EvaluationMapping.Options(options.Evaluation),
        options.ServedApproaches is { } served ? Approaches(plan, served) : null,
        [.. options.Catalogue.Select(Entry)],
        options.MinCentreHeightM,
        options.MaxCentreHeightM,
        options.AimToleranceDeg,
        options.Alternatives,
        options.CandidateSpacingM);

    private static CatalogueEntryResponse Entry(MirrorType type) => new(
        type.Id,
        type.Description,
        (type.Aperture as RoundAperture)?.DiameterM,
        (type.Aperture as RectangularAperture)?.WidthM,
        (type.Aperture as RectangularAperture)?.HeightM,
        type.RadiusM,
        Round(type.Aperture.AreaM2),
        type.Source);

    private static List<FeatureRefResponse> Approaches(SitePlan plan, IEnumerable<int> indices) =>
        [.. indices.Select(i => EvaluationMapping.Ref(plan.Approaches[i].Feature))];

    // Fractions and metres to four decimals: enough to tell 0.9999 from 1, not so many as to suggest false precision.
    private static double Round(double value) => Math.Round(value, 4);
}
