using NetTopologySuite.Geometries;
using SafetyMirror.Core.Design.Evaluation;
using SafetyMirror.Core.Design.Glare;
using SafetyMirror.Core.Optics;
using SafetyMirror.Core.Site;

namespace SafetyMirror.Core.Design.Recommendation;

/// <summary>Finds the mirror to install on a corner: where, which, how high and aimed where, ranked with the reasons.</summary>
/// <remarks>
/// The outline: check the plan once; if the direct view already suffices, say so; else search positions and mirrors
/// (<see cref="PositionSearch"/>) for one mirror serving every approach, and where none does, a mirror per approach. Designs
/// rank by <see cref="DesignScore"/>: those meeting the verdict first (the requirement at every aim within the tolerance and
/// every siting check), then the smaller face, then the worst-case margin. No clock, no randomness: the same input gives the
/// same answer.
/// </remarks>
public static class MirrorRecommender
{
    /// <summary>How far above the clearance a face's lowest point is hung, in metres: room for the sag of a tilted face.</summary>
    public const double SagAllowanceM = 0.02;

    /// <summary>Recommends a design, or says why it cannot.</summary>
    public static RecommendationResult Recommend(SitePlan plan, RecommendationOptions options, CancellationToken cancellationToken = default)
    {
        ArgumentNullException.ThrowIfNull(plan);
        ArgumentNullException.ThrowIfNull(options);
        var problems = Problems(plan, options);
        return problems.Count > 0 ? new RecommendationResult(null, problems) : new RecommendationResult(RecommendChecked(plan, options, cancellationToken), []);
    }

    /// <summary>The lowest centre height at which a mirror's lower edge keeps the clearance above the surface, whatever the pole allows.</summary>
    public static double LowestCentreHeightM(MirrorType type, double clearanceM, double surfaceHeightM = 0)
    {
        ArgumentNullException.ThrowIfNull(type);
        var halfHeight = type.Aperture switch
        {
            RectangularAperture r => r.HeightM / 2,
            _ => type.Aperture.CircumradiusM,
        };
        return surfaceHeightM + clearanceM + halfHeight + SagAllowanceM;
    }

    /// <summary>The centre height the search hangs a mirror at over a surface: the lowest that keeps the clearance, within the pole's range; null if none.</summary>
    public static double? HeightFor(MirrorType type, RecommendationOptions options, double surfaceHeightM = 0)
    {
        ArgumentNullException.ThrowIfNull(options);
        var height = Math.Max(options.MinCentreHeightM, LowestCentreHeightM(type, options.Evaluation.Rules.MinimumLowerEdgeClearanceM, surfaceHeightM));
        return height <= options.MaxCentreHeightM ? Math.Round(height, 2) : null;
    }

    /// <summary>The aim a face takes to show the required-distance points to the eye: its axis bisects the two directions.</summary>
    public static (double AzimuthDeg, double TiltDownDeg) BisectorAim(Vec3 vertex, Vec3 eye, IEnumerable<Vec3> targets) =>
        AimTuning.Bisector(vertex, eye, targets);

    private static List<SitePlanProblem> Problems(SitePlan plan, RecommendationOptions options)
    {
        var evaluation = options.Evaluation;
        var problems = CornerProblems.Of(plan, evaluation);
        if (problems.Any(p => p.Path == "options.eyeIndex"))
        {
            return problems;
        }

        foreach (var (index, i) in (options.ServedApproaches ?? []).Select((index, i) => (index, i)))
        {
            if (index < 0 || index >= plan.Approaches.Length)
            {
                problems.Add(new($"options.servedApproaches[{i}]", $"The plan has {plan.Approaches.Length} approach(es); use indices 0 to {plan.Approaches.Length - 1}."));
            }
        }

        if (options.Catalogue.Count == 0)
        {
            problems.Add(new("options.catalogue", "The catalogue is empty: list at least one mirror."));
        }

        if (options.MinCentreHeightM > options.MaxCentreHeightM)
        {
            problems.Add(new("options.minCentreHeightM", $"The pole's lowest centre height ({options.MinCentreHeightM} m) is above its highest ({options.MaxCentreHeightM} m)."));
        }

        if (options.Catalogue.Count > 0 && options.Catalogue.All(t => HeightFor(t, options) is null))
        {
            problems.Add(new("options.maxCentreHeightM",
                $"No catalogue mirror can hang with its lower edge {evaluation.Rules.MinimumLowerEdgeClearanceM} m up and its centre at most {options.MaxCentreHeightM} m up: raise the pole's highest centre height."));
        }

        if (plan.MountingZones.Length == 0 && plan.Carriageways.Length == 0)
        {
            problems.Add(new("features",
                "Add a feature with role \"mounting-zone\" (Point, LineString or Polygon where a pole may stand) or a \"carriageway\" polygon, so pole positions can be proposed along its far edge."));
        }
        else if (problems.Count == 0 && CandidatePositions.Spread(plan, plan.Eyes[evaluation.EyeIndex].Position, options).Count == 0)
        {
            problems.Add(new("features",
                $"No pole position is possible: every point of the mounting zones (or of the far kerb) is more than {evaluation.Rules.MaximumEyeToMirrorDistanceM} m from the eye or inside an obstacle."));
        }

        return problems;
    }

    private static Recommendation RecommendChecked(SitePlan plan, RecommendationOptions options, CancellationToken cancellationToken)
    {
        var direct = MirrorEvaluator.DirectViews(plan, options.Evaluation);
        var served = options.ServedApproaches?.Distinct().Order().ToList()
            ?? [.. direct.Select((view, i) => (view, i)).Where(x => !x.view.MeetsRequirement).Select(x => x.i)];
        if (served.All(i => direct[i].MeetsRequirement))
        {
            var judged = served.Count > 0 ? [.. served.Select(i => direct[i])] : direct;
            return RecommendationWording.NoMirrorNeeded(judged, served);
        }

        var single = new PositionSearch(plan, options, served, cancellationToken);
        var alternatives = single.Run().Select(d => Alternative([d], [served])).ToList();
        var evaluations = single.Evaluations;
        var candidates = single.Candidates;
        var outcome = RecommendationOutcome.OneMirror;
        if (!(alternatives.FirstOrDefault()?.Score.MeetsRequirement ?? false) && served.Count > 1)
        {
            var pairs = Pairs(plan, options, served, ref evaluations, candidates, cancellationToken);
            if (pairs.Count > 0 && pairs[0].Score.MeetsRequirement)
            {
                alternatives = pairs;
                outcome = RecommendationOutcome.TwoMirrors;
            }
        }

        if (alternatives.Count == 0 || !alternatives[0].Score.MeetsRequirement)
        {
            outcome = alternatives.Count > 0 && alternatives[0].Mirrors.Any(m => m.Evaluation.Verdict.FailedChecks.Count > 0)
                ? RecommendationOutcome.OutsideSitingRules
                : RecommendationOutcome.NoMirrorServes;
        }

        alternatives = BreakTiesByGlare(plan, options, alternatives, cancellationToken);
        return RecommendationWording.Recommendation(plan, options, outcome, alternatives, candidates, direct, served, evaluations);
    }

    /// <summary>Designs that rank equal on every term, ordered by their hours of sun glare a year at the eye, fewer first.</summary>
    /// <remarks>Only designs tied with another are scanned: a year's scan costs as much as judging thousands of candidates.
    /// The order of untied designs, and of ties without a scan (a local plan, no <see cref="RecommendationOptions.GlareTieBreak"/>), is kept.</remarks>
    public static List<Alternative> BreakTiesByGlare(SitePlan plan, RecommendationOptions options, List<Alternative> alternatives, CancellationToken cancellationToken)
    {
        if (options.GlareTieBreak is not { } scan || plan.Frame.OriginLonLat is null || alternatives.Count < 2)
        {
            return alternatives;
        }

        double Hours(Alternative alternative) => alternative.Mirrors.Sum(m =>
            GlareScanner.Scan(plan, m.Placement.ToMirror(), scan, cancellationToken).Eyes[options.Evaluation.EyeIndex].HoursPerYear);
        // GroupBy keeps the groups in their first order and OrderBy is stable, so only ties move.
        return [.. alternatives.GroupBy(a => a.Score.Key).SelectMany(tied => tied.Count() == 1 ? tied : (IEnumerable<Alternative>)tied.OrderBy(Hours))];
    }

    private static Alternative Alternative(IReadOnlyList<Designed> parts, IReadOnlyList<IReadOnlyList<int>> servedBy)
    {
        var mirrors = parts.Select((d, i) => new MirrorDesign(d.Trial.Type, d.Trial.Placement, servedBy[i], d.Evaluation)).ToList();
        var score = parts.Count == 1 ? parts[0].Score : new DesignScore(
            parts.Max(p => p.Score.Standing),
            parts.Min(p => p.Score.Coverage),
            parts.Sum(p => p.Score.FaceAreaM2),
            parts.Min(p => p.Score.Margin),
            parts.Max(p => p.Score.UnseenM),
            parts.Max(p => p.Score.NearBlindZoneM),
            parts.Min(p => p.Score.Robustness));
        var each = parts.Select(p => Scoring.RobustnessOf(p.Evaluation)).ToList();
        var robustness = new Robustness(each[0].ToleranceDeg, each.All(r => r.Holds), each.Min(r => r.WorstMargin), each.Min(r => r.WorstCoverage), each.Max(r => r.LongestUnseenM));
        return new Alternative(mirrors, score, robustness, string.Empty);
    }

    private static List<Alternative> Pairs(
        SitePlan plan, RecommendationOptions options, List<int> served, ref int evaluations, List<CandidateTried> candidates, CancellationToken cancellationToken)
    {
        // One mirror per approach: the best for each on its own, and the same on one pole where the first's pole serves the second.
        var perApproach = new List<Designed>();
        foreach (var index in served)
        {
            var search = new PositionSearch(plan, options, [index], cancellationToken);
            var best = search.Run();
            evaluations += search.Evaluations;
            candidates.AddRange(search.Candidates);
            if (best.Count == 0)
            {
                return [];
            }

            perApproach.Add(best[0]);
        }

        var pairs = new List<Alternative> { Alternative(perApproach, [.. served.Select(i => (IReadOnlyList<int>)[i])]) };
        if (served.Count == 2)
        {
            var pole = perApproach[0].Trial.Placement;
            var second = new PositionSearch(plan, options, [served[1]], cancellationToken, onlyAt: new Coordinate(pole.XM, pole.YM));
            var samePole = second.Run();
            evaluations += second.Evaluations;
            if (samePole.Count > 0)
            {
                pairs.Add(Alternative([perApproach[0], samePole[0]], [[served[0]], [served[1]]]));
            }
        }

        return [.. pairs.OrderByDescending(p => p.Score).ThenBy(p => p.Mirrors.Select(m => (m.Placement.XM, m.Placement.YM)).Distinct().Count())];
    }
}
