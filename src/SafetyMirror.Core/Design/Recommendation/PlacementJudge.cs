using SafetyMirror.Core.Design.Evaluation;
using SafetyMirror.Core.Optics;
using SafetyMirror.Core.Site;

namespace SafetyMirror.Core.Design.Recommendation;

/// <summary>The search's quick objective: a deterministic judgement of one placement on the served approaches.</summary>
/// <remarks>
/// It only orders candidates: every figure an answer states comes from <see cref="MirrorEvaluator"/>. Public so that a
/// brute-force scan (benchmarks, tests) can order by exactly the same measure. The plan and options were checked once,
/// before the judge was made; per placement only what the placement itself can get wrong is checked.
/// </remarks>
public sealed class PlacementJudge
{
    private const double SearchToleranceM = 0.1;

    // Weights of the objective: coverage decides, then the unseen stretch, then the blind zone; centring only breaks ties.
    private const double CoverageWeight = 1000;
    private const double MeanCoverageWeight = 100;
    private const double UnseenWeight = 50;
    private const double CentringWeight = 5e-3;
    private static readonly double[] Quarters = [0, 0.25, 0.5, 0.75, 1];
    private readonly RecommendationOptions options;
    private readonly double[] directM;
    private readonly double meanRequiredM;

    /// <summary>Prepares the judge for a plan, the options and the indices of the approaches to serve.</summary>
    /// <remarks>The plan must have passed <see cref="MirrorRecommender.Recommend"/>'s checks (eye index, approach lengths).</remarks>
    public PlacementJudge(SitePlan plan, RecommendationOptions options, IReadOnlyList<int> served)
    {
        ArgumentNullException.ThrowIfNull(plan);
        ArgumentNullException.ThrowIfNull(options);
        ArgumentNullException.ThrowIfNull(served);
        this.options = options;
        Eye = plan.Eyes[options.Evaluation.EyeIndex].Position;
        ServedPlan = plan.WithApproaches(served);
        var design = options.Evaluation.DesignRoadUser;
        Required = [.. ServedPlan.Approaches.Select(a => (a, options.Evaluation.SightDistance.Required(a).DesignM))];
        Targets = [.. Required.Select(r => r.Approach.PointAtStation(Math.Min(r.RequiredM, r.Approach.LengthM)).Position with { Z = design.HeightM / 2 })];
        directM = [.. MirrorEvaluator.DirectViews(ServedPlan, options.Evaluation).Select(d => d.DirectSightDistanceM)];
        meanRequiredM = Required.Average(r => r.RequiredM);
    }

    /// <summary>The plan with only the served approaches.</summary>
    public SitePlan ServedPlan { get; }

    /// <summary>The waiting driver's eye.</summary>
    public Vec3 Eye { get; }

    /// <summary>Each served approach with its required distance, in metres.</summary>
    public IReadOnlyList<(Approach Approach, double RequiredM)> Required { get; }

    /// <summary>The design road user's centre at each served approach's required distance.</summary>
    public IReadOnlyList<Vec3> Targets { get; }

    /// <summary>How many placements this judge has judged (each aim counts).</summary>
    public int Evaluations { get; private set; }

    /// <summary>A quick judgement of one placement at its aim: coverage, unseen stretch and near blind zone of the decisive road users.</summary>
    /// <remarks>
    /// Samples each served approach at quarters of its required distance, then locates by bisection where the design road
    /// user starts being recognisable and how far it stays so. The stretch between the end of the direct view and that start
    /// is the quick stand-in for the unseen stretch.
    /// </remarks>
    public (DesignScore Score, double Value) Judge(MirrorPlacement placement)
    {
        ArgumentNullException.ThrowIfNull(placement);
        Evaluations++;
        var area = placement.Aperture.AreaM2;
        var mirror = placement.ToMirror();
        if (mirror.IsInsideSphere(Eye) || Vec3.Dot(Eye - mirror.Vertex, mirror.Normal) <= 0 || ServedPlan.IsBlocked(Eye, mirror.Vertex))
        {
            return Infeasible(area);
        }

        var viewer = new MirrorViewer(ServedPlan, mirror, Eye, options.Evaluation.Vision);
        double minCoverage = 1, sumCoverage = 0, sumBlind = 0, worstUnseen = 0;
        for (var i = 0; i < Required.Count; i++)
        {
            var (approach, requiredM) = Required[i];
            if (directM[i] >= requiredM)
            {
                sumCoverage += 1;
                continue;
            }

            // Every decisive road user, out to the distance the least margin asks for; the worst of them counts.
            var targetM = requiredM * Math.Max(1, options.Evaluation.MinMargin);
            var (coverage, start) = options.Evaluation.Decisive
                .Select(user => Reach(viewer, approach, user, requiredM, targetM))
                .Aggregate((a, b) => (Math.Min(a.Coverage, b.Coverage), Math.Max(a.StartM, b.StartM)));
            var unseen = Math.Max(0, start - directM[i]) / requiredM;
            minCoverage = Math.Min(minCoverage, coverage);
            sumCoverage += coverage;
            sumBlind += start / requiredM;
            worstUnseen = Math.Max(worstUnseen, unseen * requiredM);
        }

        var n = Required.Count;
        var score = new DesignScore(minCoverage >= 1 && worstUnseen <= options.Evaluation.MaxUnseenStretchM + MirrorEvaluator.NegligibleGapM ? 0 : 2,
            minCoverage, area, double.NaN, worstUnseen, sumBlind / n * meanRequiredM, double.NaN);
        var value = (CoverageWeight * minCoverage) + (MeanCoverageWeight * sumCoverage / n) - (UnseenWeight * worstUnseen / meanRequiredM)
            - (sumBlind / n) - (CentringWeight * OffCentre(mirror));
        return (score, value);
    }

    /// <summary>Where one road user starts being recognisable and how far towards the target it stays so, as a fraction of it.</summary>
    private static (double Coverage, double StartM) Reach(MirrorViewer viewer, Approach approach, RoadUser user, double requiredM, double targetM)
    {
        bool Recognised(double s) => viewer.Recognisable(approach.PointAtStation(s), user);
        var samples = Quarters.Select(k => Math.Min(k * targetM, approach.LengthM)).ToList();
        var first = samples.FindIndex(Recognised);
        if (first < 0)
        {
            return (0, requiredM);
        }

        var start = first == 0 ? 0 : StationIntervals.Boundary(samples[first], samples[first - 1], Recognised, SearchToleranceM);
        var last = first;
        while (last + 1 < samples.Count && Recognised(samples[last + 1]))
        {
            last++;
        }

        var coverage = last == samples.Count - 1 && samples[^1] >= targetM ? 1
            : StationIntervals.Boundary(samples[last], samples[Math.Min(last + 1, samples.Count - 1)], Recognised, SearchToleranceM) / targetM;
        return (Math.Min(1, coverage), start);
    }

    /// <summary>The quick judgement at the aim as set and off by the tolerance each way: the worst of the five, so that an aim
    /// that only just works is not preferred to one that keeps working when the pole is knocked.</summary>
    public (DesignScore Score, double Value) JudgeRobust(MirrorPlacement placement)
    {
        ArgumentNullException.ThrowIfNull(placement);
        var nominal = Judge(placement);
        if (double.IsNegativeInfinity(nominal.Value))
        {
            return nominal;
        }

        var t = options.AimToleranceDeg;
        var worst = nominal;
        foreach (var (da, dt) in new[] { (t, 0.0), (-t, 0.0), (0.0, t), (0.0, -t) })
        {
            var off = Judge(placement with { AzimuthDeg = AimTuning.Wrap(placement.AzimuthDeg + da), TiltDownDeg = placement.TiltDownDeg + dt });
            if (off.Value < worst.Value)
            {
                worst = off;
            }
        }

        // The nominal aim's own terms break ties among equally robust aims.
        return (nominal.Score with { Standing = worst.Score.Standing, Robustness = worst.Score.Coverage }, worst.Value + (nominal.Value * 1e-3));
    }

    /// <summary>How far from the face's centre the required-distance points reflect: 0 at the centre, 1 at the rim.</summary>
    /// <remarks>A point reflected near the centre stays on the face when the aim drifts.</remarks>
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
        (new DesignScore(2, 0, faceAreaM2, 0, double.PositiveInfinity, double.PositiveInfinity, double.NaN), double.NegativeInfinity);
}
