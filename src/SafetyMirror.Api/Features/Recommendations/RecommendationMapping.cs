using NetTopologySuite.Geometries;
using SafetyMirror.Api.Features.Evaluations;
using SafetyMirror.Core.Design;
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
        _ => "no-mirror-serves",
    };

    /// <summary>The response for a recommendation on a plan with the options it was made with.</summary>
    public static RecommendationResponse ToResponse(this Recommendation recommendation, SitePlan plan, RecommendationOptions options)
    {
        var alternatives = recommendation.Alternatives.Select((a, i) => Alternative(a, i + 1, plan)).ToList();
        var first = recommendation.Alternatives.FirstOrDefault();
        return new RecommendationResponse(
            OutcomeCode(recommendation.Outcome),
            Summary(recommendation, plan),
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
        ?? Cautions.For(plan.Approaches.Max(a => a.SpeedKmh), options.Evaluation.Rules, options.Evaluation.RoadUsers);

    private static AlternativeResponse Alternative(Alternative alternative, int rank, SitePlan plan)
    {
        var s = alternative.Score;
        var r = alternative.Robustness;
        return new AlternativeResponse(
            rank,
            s.MeetsRequirement,
            [.. alternative.Mirrors.Select(m => new DesignMirrorResponse(m.Type.Id, Approaches(plan, m.ServedApproaches), m.Evaluation.ToResponse(plan)))],
            new ScoreResponse(Round(s.Coverage), Round(s.FaceAreaM2), Round(s.Margin), Round(s.NearBlindZoneM), Round(s.Robustness)),
            new RobustnessResponse(r.ToleranceDeg, Round(r.WorstCoverage),
                r.WorstApparentHeightArcmin is { } h && double.IsFinite(h) ? Round(h) : null),
            alternative.Rationale);
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

    private static string Summary(Recommendation recommendation, SitePlan plan)
    {
        var served = Names(plan, recommendation.ServedApproaches);
        switch (recommendation.Outcome)
        {
            case RecommendationOutcome.NoMirrorNeeded:
                return $"No mirror is needed: the direct view already gives the required sight distance on {(recommendation.ServedApproaches.Count == 0 ? "every approach" : served)}.";
            case RecommendationOutcome.OneMirror:
                var mirror = recommendation.Alternatives[0].Mirrors[0];
                var p = mirror.Placement;
                return Invariant(
                    $"One {mirror.Type.Description} serves {served}: centre {p.CentreHeightM:0.00} m up, aimed {Math.Round(p.AzimuthDeg, 1) % 360:0.0}° from north and tilted {p.TiltDownDeg:0.0}° down. See the installation sheet, the measures to consider first and the cautions.");
            case RecommendationOutcome.TwoMirrors:
                var mirrors = recommendation.Alternatives[0].Mirrors;
                var onePole = mirrors.Select(m => (m.Placement.XM, m.Placement.YM)).Distinct().Count() == 1;
                var parts = mirrors.Select(m => $"a {m.Type.Description} for {Names(plan, m.ServedApproaches)}");
                return $"No single mirror serves {served}; two do, one per approach{(onePole ? ", on one pole" : string.Empty)}: {string.Join("; ", parts)}. See the installation sheet, the measures to consider first and the cautions.";
            default:
                var best = recommendation.Alternatives[0];
                var faces = string.Join(" and ", best.Mirrors.Select(m => m.Type.Description));
                return Invariant(
                    $"No mirror in the catalogue meets the requirement on {served}: the best design found, {faces}, covers {Math.Floor(best.Score.Coverage * 100):0}% of the required sight distance. Consider the measures listed instead.");
        }
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

    private static string Names(SitePlan plan, IEnumerable<int> indices) =>
        string.Join(" and ", indices.Select(i => plan.Approaches[i].Feature).Select(f => f.Name ?? f.Id ?? f.Path));

    // Fractions and metres to four decimals: enough to tell 0.9999 from 1, not so many as to suggest false precision.
    private static double Round(double value) => Math.Round(value, 4);
}
