using SafetyMirror.Core.Optics;
using SafetyMirror.Core.Site;

namespace SafetyMirror.Core.Design.Evaluation;

/// <summary>Judges one mirror on one corner: what it shows of each approach, how large, and whether that is enough.</summary>
/// <remarks>
/// A road user is shown at a station when the exact reflection of its centre at half height lies on the face and no
/// obstacle cuts either leg of the light path. The ends of every stretch are located by bisection to
/// <see cref="BoundaryToleranceM"/> between samples that include where sightlines graze obstacle corners, so a thin
/// obstacle between two reported stations is not missed. The verdict follows domain.md §9: no unseen stretch, recognisable
/// at the required distance, robust to the aim tolerance, inside every siting check.
/// </remarks>
public static class MirrorEvaluator
{
    /// <summary>How finely the ends of stretches are located, in metres.</summary>
    public const double BoundaryToleranceM = 0.005;

    /// <summary>An unseen stretch no longer than this counts as none, in metres: it is below what the figures are stated to.</summary>
    public const double NegligibleGapM = 0.05;

    /// <summary>Most stations reported per approach.</summary>
    public const int MaxStationsPerApproach = 400;

    /// <summary>Evaluates the mirror on the plan, or says why it cannot.</summary>
    /// <remarks>Problem paths name the offending part: <c>mirror.location</c>, <c>options.eyeIndex</c>, <c>features[i].geometry</c>.</remarks>
    public static EvaluationResult Evaluate(SitePlan plan, MirrorPlacement placement, EvaluationOptions options, CancellationToken cancellationToken = default)
    {
        ArgumentNullException.ThrowIfNull(plan);
        ArgumentNullException.ThrowIfNull(placement);
        ArgumentNullException.ThrowIfNull(options);
        var problems = CornerProblems.Of(plan, options);
        if (problems.Count == 0)
        {
            problems.AddRange(CornerProblems.OfPlacement(plan, placement, plan.Eyes[options.EyeIndex].Position));
        }

        return problems.Count > 0 ? new EvaluationResult(null, problems) : new EvaluationResult(EvaluateChecked(plan, placement, options, cancellationToken), []);
    }

    /// <summary>What the waiting driver sees of each approach without a mirror, against what it needs.</summary>
    /// <remarks>The plan must have the options' eye.</remarks>
    public static IReadOnlyList<DirectView> DirectViews(SitePlan plan, EvaluationOptions options)
    {
        ArgumentNullException.ThrowIfNull(plan);
        ArgumentNullException.ThrowIfNull(options);
        var eye = plan.Eyes[options.EyeIndex].Position;
        return
        [
            .. plan.Approaches.Select(approach =>
            {
                var judge = new ApproachJudge(plan, eye, null, approach, options);
                return new DirectView(approach, judge.Required, judge.DirectSightDistanceM, judge.DirectBlockedBy);
            }),
        ];
    }

    /// <summary>Evaluates a placement on a plan whose problems were already ruled out.</summary>
    /// <param name="plan">The plan whose approaches are judged.</param>
    /// <param name="placement">The mirror.</param>
    /// <param name="options">How it is judged.</param>
    /// <param name="cancellationToken">Stops the work between approaches and aims.</param>
    /// <param name="corner">The whole corner the siting rules apply to (every approach's speed counts), when the plan holds only
    /// the approaches one mirror serves; null when it is the plan itself.</param>
    internal static MirrorEvaluation EvaluateChecked(
        SitePlan plan, MirrorPlacement placement, EvaluationOptions options, CancellationToken cancellationToken, SitePlan? corner = null)
    {
        var eye = plan.Eyes[options.EyeIndex];
        var mirror = placement.ToMirror();
        var face = FaceSources(mirror);
        var judges = plan.Approaches.Select(a => new ApproachJudge(plan, eye.Position, face, a, options)).ToList();
        var facts = MirrorFactsOf(plan, mirror, eye.Position, options);
        var viewer = new MirrorViewer(plan, mirror, eye.Position, options.Vision);
        var approaches = judges.Select(j =>
        {
            cancellationToken.ThrowIfCancellationRequested();
            return EvaluateApproach(viewer, j, options);
        }).ToList();
        var checks = SitingChecks.For(corner ?? plan, facts, eye.Position, options.Rules);
        var robustness = Robustness(plan, placement, eye.Position, judges, approaches, options, cancellationToken);
        var cautions = Cautions.For(options.Rules, options.RoadUsers);
        var verdict = EvaluationWording.Verdict(placement, approaches, checks, robustness, options);
        return new MirrorEvaluation(eye, placement, facts, approaches, checks, robustness, verdict, cautions, options);
    }

    /// <summary>Where light paths leave the face: its vertex and eight points of its rim, so that the stations where a sightline
    /// grazes an obstacle corner are found from wherever on the face the path reflects.</summary>
    private static List<Vec3> FaceSources(ConvexMirror mirror) =>
        [mirror.Vertex, .. Enumerable.Range(0, 8).Select(k => mirror.Aperture.Rim(k / 8.0)).Select(r => mirror.PointOnFace(r.UM, r.VM))];

    /// <summary>The verdict's figures at the aim as set and off by the tolerance each way in azimuth and tilt.</summary>
    private static AimRobustness Robustness(
        SitePlan plan, MirrorPlacement placement, Vec3 eye, List<ApproachJudge> judges, List<ApproachEvaluation> nominal, EvaluationOptions options, CancellationToken cancellationToken)
    {
        var t = options.AimToleranceDeg;
        var cases = new List<AimCase> { Case(0, 0, [.. nominal.Select(a => a.Summary.Coverage)], judges) };
        foreach (var (da, dt) in new[] { (t, 0.0), (-t, 0.0), (0.0, t), (0.0, -t) })
        {
            cancellationToken.ThrowIfCancellationRequested();
            var off = placement.AimedOffBy(da, dt);
            var viewer = new MirrorViewer(plan, off.ToMirror(), eye, options.Vision);
            var coverage = judges.Select(j => j.DirectMeets ? [] : (IReadOnlyList<UserCoverage>)[.. options.Decisive.Select(u => j.Cover(viewer, u))]).ToList();
            cases.Add(Case(da, dt, coverage, judges));
        }

        return new AimRobustness(t, cases);
    }

    private static AimCase Case(double azimuthOffsetDeg, double tiltOffsetDeg, List<IReadOnlyList<UserCoverage>> coverage, List<ApproachJudge> judges)
    {
        var needing = coverage.Where((_, i) => !judges[i].DirectMeets).SelectMany(c => c).ToList();
        return new AimCase(
            azimuthOffsetDeg,
            tiltOffsetDeg,
            needing.All(c => c.Meets),
            needing.Count == 0 ? double.PositiveInfinity : needing.Min(c => c.Margin),
            needing.Select(c => c.LongestUnseen).OfType<UnseenStretch>().MaxBy(u => u.LengthM),
            needing.Count == 0 ? 0 : needing.Min(c => c.ProvidedSightDistanceM));
    }

    private static MirrorFacts MirrorFactsOf(SitePlan plan, ConvexMirror mirror, Vec3 eye, EvaluationOptions options)
    {
        var lowerEdge = Enumerable.Range(0, 720)
            .Select(i => mirror.Aperture.Rim(i / 720.0))
            .Min(rim => mirror.PointOnFace(rim.UM, rim.VM).Z);
        var inFront = Vec3.Dot(eye - mirror.Vertex, mirror.Normal) > 0;
        var blocker = plan.FirstObstacleBlocking(eye, mirror.Vertex);
        var reach = plan.Approaches.Max(a => a.LengthM + Vec3.HorizontalDistance(a.ConflictPoint, mirror.Vertex));
        var field = FieldOfViewTracer.Trace(mirror, eye, 0, reach, options.FieldOfViewRays);
        var visible = new VisibleFieldOfView(field.Outline, plan.Obstacles, mirror.Vertex, options.DesignRoadUser.HeightM / 2);
        return new MirrorFacts(mirror, lowerEdge, Vec3.Distance(eye, mirror.Vertex), inFront && blocker is null, blocker?.Feature, field, visible);
    }

    private static ApproachEvaluation EvaluateApproach(MirrorViewer viewer, ApproachJudge judge, EvaluationOptions options)
    {
        var approach = judge.Approach;
        var design = options.DesignRoadUser;
        var looks = options.RoadUsers.ToDictionary(u => u, u => judge.Looks(viewer, u));
        var shown = options.RoadUsers.ToDictionary(u => u, u => judge.Shown(looks[u]));
        var coverage = options.Decisive.Select(u => judge.Cover(looks[u], shown[u])).ToList();
        var designCoverage = coverage.FirstOrDefault(c => c.RoadUser == design) ?? judge.Cover(looks[design], shown[design]);
        // A decisive road user's recognisable reach is already located by its coverage; only the others need it found.
        var covered = coverage.ToDictionary(c => c.RoadUser);
        var reach = options.RoadUsers
            .Select(user => new RoadUserReach(
                user,
                covered.TryGetValue(user, out var own) ? own.RecognisableToM : judge.FarthestWhereSeenAtLeast(looks[user], shown[user], options.Vision.Recognition.AngleRad),
                judge.FarthestWhereSeenAtLeast(looks[user], shown[user], options.Vision.Detection.AngleRad)))
            .ToList();

        // The figures that decide come from the located stretches; the reported stations only show them.
        var reported = options.StationsM?.Where(s => s >= 0 && s <= approach.LengthM).Distinct().Order().ToList() ?? judge.Regular;
        var views = reported.SelectMany(s => options.RoadUsers.Select(user => looks[user].See(s))).ToList();
        var summary = new ApproachSummary(
            designCoverage.ShownFromM,
            designCoverage.ShownToM,
            designCoverage.ProvidedSightDistanceM,
            designCoverage.CutByApproachEnd,
            designCoverage.ShownFromM ?? approach.LengthM,
            reach,
            coverage,
            judge.DirectMeets || coverage.All(c => c.Meets),
            judge.DirectMeets);
        return new ApproachEvaluation(approach, judge.Required, judge.DirectSightDistanceM, judge.DirectBlockedBy, views, summary);
    }
}
