using SafetyMirror.Core.Design.Evaluation;
using SafetyMirror.Core.Optics;
using SafetyMirror.Core.Site;

namespace SafetyMirror.Core.Design.Recommendation;

/// <summary>The search's objective: a quick, deterministic judgement of one placement on the served approaches.</summary>
/// <remarks>Public so that a brute-force scan (benchmarks, tests) can judge by exactly the same measure.</remarks>
public sealed class PlacementJudge
{
    private const double SearchToleranceM = 0.1;

    // Below one step of the blind-zone term (the bisection tolerance over the required distance), so it only breaks ties.
    private const double CentringWeight = 5e-3;
    private static readonly double[] Quarters = [0, 0.25, 0.5, 0.75, 1];
    private readonly RecommendationOptions options;
    private readonly EvaluationOptions checks;

    /// <summary>Prepares the judge for a plan, the options and the indices of the approaches to serve.</summary>
    public PlacementJudge(SitePlan plan, RecommendationOptions options, IReadOnlyList<int> served)
    {
        ArgumentNullException.ThrowIfNull(plan);
        ArgumentNullException.ThrowIfNull(options);
        ArgumentNullException.ThrowIfNull(served);
        this.options = options;
        Eye = plan.Eyes[options.Evaluation.EyeIndex].Position;
        ServedPlan = new SitePlan(plan.Frame, plan.Eyes, served.Select(i => plan.Approaches[i]), plan.Obstacles, plan.MountingZones, plan.Carriageways, plan.Footways);
        var design = options.Evaluation.DesignRoadUser;
        Required = [.. ServedPlan.Approaches.Select(a => (a, options.Evaluation.SightDistance.Required(a.SpeedKmh, a.GradePercent).DesignM))];
        Targets = [.. Required.Select(r => r.Approach.PointAtStation(Math.Min(r.RequiredM, r.Approach.LengthM)).Position with { Z = design.HeightM / 2 })];
        checks = options.Evaluation with { RoadUsers = [design], FieldOfViewRays = 9 };
    }

    /// <summary>The plan with only the served approaches.</summary>
    public SitePlan ServedPlan { get; }

    /// <summary>The waiting driver's eye.</summary>
    public Vec3 Eye { get; }

    /// <summary>Each served approach with its required distance, in metres.</summary>
    public IReadOnlyList<(Approach Approach, double RequiredM)> Required { get; }

    /// <summary>The design road user's centre at each served approach's required distance.</summary>
    public IReadOnlyList<Vec3> Targets { get; }

    /// <summary>How many placements this judge has judged.</summary>
    public int Evaluations { get; private set; }

/// <summary>A quick judgement of one placement for the search: coverage and near blind zone of the design road user.</summary>
    /// <remarks>
    /// Samples each served approach at quarters of its required distance, then locates the start of the shown
    /// stretch and the end of the stretch on which the design road user is shown and recognisable by bisection.
    /// The full evaluation, with every station and road user, is made only for the designs that are returned.
    /// </remarks>
    public (DesignScore Score, double Value) Judge(MirrorPlacement placement)
    {
        Evaluations++;
        var area = placement.Aperture.AreaM2;
        if (MirrorEvaluator.Problems(ServedPlan, placement, checks).Count > 0)
        {
            return Infeasible(area); // e.g. an aim that turns the face so the eye falls inside its sphere
        }

        var mirror = placement.ToMirror();
        if (Vec3.Dot(Eye - mirror.Vertex, mirror.Normal) <= 0 || ServedPlan.IsBlocked(Eye, mirror.Vertex))
        {
            return Infeasible(area);
        }

        var viewer = new MirrorViewer(ServedPlan, mirror, Eye, options.Evaluation.Vision);
        var design = options.Evaluation.DesignRoadUser;
        double minCoverage = 1, sumCoverage = 0, sumBlind = 0;
        foreach (var (approach, requiredM) in Required)
        {
            bool Shown(double s) => viewer.See(approach, s, design).Shown;
            bool Recognised(double s) => viewer.See(approach, s, design).Recognisable;
            var samples = Quarters.Select(k => Math.Min(k * requiredM, approach.LengthM)).ToList();
            var first = samples.FindIndex(Shown);
            double coverage = 0, blind = requiredM;
            if (first >= 0)
            {
                blind = first == 0 ? 0 : MirrorEvaluator.Boundary(samples[first], samples[first - 1], Shown, SearchToleranceM);
                var last = first - 1;
                while (last + 1 < samples.Count && Recognised(samples[last + 1]))
                {
                    last++;
                }

                coverage = last < first ? 0
                    : last == samples.Count - 1 ? 1
                    : MirrorEvaluator.Boundary(samples[last], samples[last + 1], Recognised, SearchToleranceM) / requiredM;
            }

            minCoverage = Math.Min(minCoverage, coverage);
            sumCoverage += coverage;
            sumBlind += blind / requiredM;
        }

        var n = Required.Count;
        var score = new DesignScore(minCoverage, area, double.NaN, sumBlind / n, double.NaN);
        return (score, (1000 * minCoverage) + (100 * sumCoverage / n) - (sumBlind / n) - (CentringWeight * OffCentre(mirror)));
    }

    /// <summary>How far from the face's centre the required-distance points reflect: 0 at the centre, 1 at the rim.</summary>
    /// <remarks>A point reflected near the centre stays on the face when the aim drifts: the search's stand-in for
    /// robustness, weighted to decide only between aims the other terms cannot tell apart.</remarks>
    private double OffCentre(ConvexMirror mirror)
    {
        var sum = 0.0;
        foreach (var target in Targets)
        {
            var reflection = mirror.Reflect(Eye, target);
            if (!reflection.IsFound)
            {
                sum += 2;
                continue;
            }

            var radial = reflection.Point - mirror.Centre;
            double u = Vec3.Dot(radial, mirror.HorizontalAxis), v = Vec3.Dot(radial, mirror.VerticalAxis);
            sum += Math.Min(2, Math.Sqrt((u * u) + (v * v)) / mirror.Aperture.CircumradiusM);
        }

        return sum / Targets.Count;
    }

    /// <summary>The judgement of a placement that cannot work: no coverage, never chosen.</summary>
    public static (DesignScore Score, double Value) Infeasible(double faceAreaM2) =>
        (new DesignScore(0, faceAreaM2, 0, double.PositiveInfinity, double.NaN), double.NegativeInfinity);
}
