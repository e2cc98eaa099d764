using SafetyMirror.Core.Optics;
using SafetyMirror.Core.Site;

namespace SafetyMirror.Core.Design.Evaluation;

/// <summary>Judges one mirror on one corner: what it shows of each approach, how large, and whether that is enough.</summary>
/// <remarks>
/// A road user is shown at a station when the exact reflection of its centre at half height lies on the face
/// and no obstacle cuts either leg of the light path. Boundaries between reported stations (where the shown
/// stretch or the recognisable reach ends) are refined by bisection to <see cref="BoundaryToleranceM"/>.
/// </remarks>
public static class MirrorEvaluator
{
    /// <summary>How finely the ends of stretches are located, in metres.</summary>
    public const double BoundaryToleranceM = 0.05;

    /// <summary>Most stations reported per approach.</summary>
    public const int MaxStationsPerApproach = 400;

    /// <summary>The reasons the mirror cannot be evaluated on this plan with these options; empty when it can.</summary>
    /// <remarks>Paths name the offending part: <c>mirror.location</c>, <c>options.eyeIndex</c>, <c>features[i].geometry</c>.</remarks>
    public static IReadOnlyList<SitePlanProblem> Problems(SitePlan plan, MirrorPlacement placement, EvaluationOptions options)
    {
        ArgumentNullException.ThrowIfNull(plan);
        ArgumentNullException.ThrowIfNull(placement);
        ArgumentNullException.ThrowIfNull(options);
        var problems = new List<SitePlanProblem>();
        if (options.EyeIndex < 0 || options.EyeIndex >= plan.Eyes.Length)
        {
            problems.Add(new("options.eyeIndex", $"The plan has {plan.Eyes.Length} eye point(s); eyeIndex must be from 0 to {plan.Eyes.Length - 1}."));
            return problems;
        }

        // A pole may stand in a low hedge or on a wall; it may not stand where the obstacle would reach the face.
        if (plan.ObstacleContaining(placement.XM, placement.YM) is { } obstacle
            && obstacle.HeightM >= placement.CentreHeightM - placement.Aperture.CircumradiusM)
        {
            problems.Add(new("mirror.location", $"The mirror stands inside obstacle {obstacle.Feature}, which is {obstacle.HeightM} m high and would reach the face."));
        }

        var mirror = placement.ToMirror();
        if (mirror.IsInsideSphere(plan.Eyes[options.EyeIndex].Position))
        {
            problems.Add(new("mirror.location", $"The eye is within the mirror's radius of curvature ({placement.RadiusM} m) of its centre of curvature: move the mirror farther from the eye."));
        }

        foreach (var approach in plan.Approaches)
        {
            var required = options.SightDistance.Required(approach.SpeedKmh, approach.GradePercent);
            if (approach.LengthM < required.DesignM)
            {
                problems.Add(new($"{approach.Feature.Path}.geometry",
                    $"The approach is {approach.LengthM:F1} m long; draw it at least as far as the required sight distance of {required.DesignM} m ({required.Formula}) so the mirror's reach can be judged."));
            }
        }

        return problems;
    }

    /// <summary>What the waiting driver sees of each approach without a mirror, against what it needs.</summary>
    /// <remarks>The plan must have the options' eye; approaches shorter than their requirement report their length.</remarks>
    public static IReadOnlyList<DirectView> DirectViews(SitePlan plan, EvaluationOptions options)
    {
        ArgumentNullException.ThrowIfNull(plan);
        ArgumentNullException.ThrowIfNull(options);
        var eye = plan.Eyes[options.EyeIndex].Position;
        return
        [
            .. plan.Approaches.Select(approach =>
            {
                var required = options.SightDistance.Required(approach.SpeedKmh, approach.GradePercent);
                var (distance, blocker) = DirectSightDistance(plan, eye, approach, StationsFor(approach, options), required.ObjectHeightM);
                return new DirectView(approach, required, distance, blocker);
            }),
        ];
    }

    /// <summary>Evaluates the mirror on the plan; call <see cref="Problems"/> first: this throws on what it reports.</summary>
    public static MirrorEvaluation Evaluate(SitePlan plan, MirrorPlacement placement, EvaluationOptions options)
    {
        if (Problems(plan, placement, options) is [var first, ..])
        {
            throw new ArgumentException($"{first.Path}: {first.Message}", nameof(plan));
        }

        var eye = plan.Eyes[options.EyeIndex];
        var mirror = placement.ToMirror();
        var facts = MirrorFactsOf(plan, mirror, eye.Position, options);
        var approaches = plan.Approaches.Select(a => EvaluateApproach(new MirrorViewer(plan, mirror, eye.Position, options.Vision), a, options)).ToList();
        var checks = RuleChecks(plan, facts, options.Rules);
        var cautions = Cautions.For(plan.Approaches.Max(a => a.SpeedKmh), options.Rules, options.RoadUsers);
        return new MirrorEvaluation(eye, placement, facts, approaches, checks, cautions, options);
    }

    private static MirrorFacts MirrorFactsOf(SitePlan plan, ConvexMirror mirror, Vec3 eye, EvaluationOptions options)
    {
        var lowerEdge = Enumerable.Range(0, 720)
            .Select(i => mirror.Aperture.Rim(i / 720.0))
            .Min(rim => mirror.PointOnFace(rim.UM, rim.VM).Z);
        var inFront = Vec3.Dot(eye - mirror.Vertex, mirror.Normal) > 0;
        var blocker = plan.FirstObstacleBlocking(eye, mirror.Vertex);
        var reach = plan.Approaches.Max(a => a.LengthM + Distance2D(a.ConflictPoint, mirror.Vertex));
        var field = FieldOfViewTracer.Trace(mirror, eye, 0, reach, options.FieldOfViewRays);
        return new MirrorFacts(mirror, lowerEdge, Vec3.Distance(eye, mirror.Vertex), inFront && blocker is null, blocker?.Feature, field);
    }

    private static List<RuleCheck> RuleChecks(SitePlan plan, MirrorFacts facts, SitingRules rules)
    {
        var fastest = plan.Approaches.Max(a => a.SpeedKmh);
        return
        [
            new("lower-edge-clearance", "Height of the mirror's lower edge above the footway or carriageway below it.",
                facts.LowerEdgeHeightM, rules.MinimumLowerEdgeClearanceM, "m", "at-least",
                facts.LowerEdgeHeightM >= rules.MinimumLowerEdgeClearanceM, rules.Source),
            new("eye-to-mirror-distance", "Distance from the waiting driver's eye to the mirror.",
                facts.DistanceFromEyeM, rules.MaximumEyeToMirrorDistanceM, "m", "at-most",
                facts.DistanceFromEyeM <= rules.MaximumEyeToMirrorDistanceM, rules.Source),
            new("approach-speed", "Highest approach speed at the corner.",
                fastest, rules.CautionAboveSpeedKmh, "km/h", "at-most", fastest <= rules.CautionAboveSpeedKmh, rules.Source),
            new("eye-sees-mirror", "The waiting driver's eye is in front of the face and sees its centre unobstructed (1 = yes).",
                facts.EyeSeesMirror ? 1 : 0, 1, "", "at-least", facts.EyeSeesMirror, "common practice"),
        ];
    }

    private static ApproachEvaluation EvaluateApproach(MirrorViewer viewer, Approach approach, EvaluationOptions options)
    {
        var required = options.SightDistance.Required(approach.SpeedKmh, approach.GradePercent);

        // The figures that decide always come from the regular grid; a caller's list of stations only chooses what is reported.
        var stations = StationsFor(approach, options with { StationsM = null });
        var (direct, directBlocker) = DirectSightDistance(viewer.Plan, viewer.Eye, approach, stations, required.ObjectHeightM);
        var views = ViewsAt(viewer, approach, stations, options);
        var reported = options.StationsM is null ? views : ViewsAt(viewer, approach, StationsFor(approach, options), options);

        var design = options.DesignRoadUser;
        var (shownFrom, shownTo) = ShownStretch(viewer, approach, stations, views, design);
        var reach = options.RoadUsers
            .Select(user => new RoadUserReach(
                user,
                FarthestWhere(viewer, approach, stations, views, user, shownFrom, v => v.Recognisable),
                FarthestWhere(viewer, approach, stations, views, user, shownFrom, v => v.Detectable)))
            .ToList();
        var designReach = reach[0].RecognisableToM ?? 0;
        var provided = shownTo ?? 0;
        var summary = new ApproachSummary(
            shownFrom,
            shownTo,
            provided,
            shownFrom ?? approach.LengthM,
            reach,
            provided >= required.DesignM && designReach >= required.DesignM,
            direct >= required.DesignM);
        return new ApproachEvaluation(approach, required, direct, directBlocker, reported, summary);
    }

    private static List<StationView> ViewsAt(MirrorViewer viewer, Approach approach, List<double> stations, EvaluationOptions options) =>
        [.. stations.SelectMany(station => options.RoadUsers.Select(user => viewer.See(approach, station, user)))];

    /// <summary>The reported stations: the caller's list within the approach, or a regular spacing from 0 to the approach's end.</summary>
    private static List<double> StationsFor(Approach approach, EvaluationOptions options)
    {
        var listed = options.StationsM?.Where(s => s >= 0 && s <= approach.LengthM).Distinct().Order().ToList();
        if (listed is not null)
        {
            return listed;
        }

        var spacing = Math.Max(options.StationSpacingM, approach.LengthM / MaxStationsPerApproach);
        var count = (int)Math.Floor(approach.LengthM / spacing);
        var stations = Enumerable.Range(0, count + 1).Select(i => i * spacing).ToList();
        if (approach.LengthM - stations[^1] > BoundaryToleranceM)
        {
            stations.Add(approach.LengthM);
        }

        return stations;
    }

    /// <summary>How far the driver sees along the approach directly: the continuous clear stretch from the conflict point.</summary>
    private static (double DistanceM, FeatureReference? BlockedBy) DirectSightDistance(SitePlan plan, Vec3 eye, Approach approach, List<double> stations, double objectHeightM)
    {
        Obstacle? Blocker(double s) =>
            plan.FirstObstacleBlocking(eye, approach.PointAtStation(s).Position with { Z = objectHeightM });

        var samples = stations.Count > 1 ? stations : [0, approach.LengthM];
        var clear = 0.0;
        foreach (var s in samples)
        {
            if (Blocker(s) is { } obstacle)
            {
                return (s == 0 ? 0 : Boundary(clear, s, x => Blocker(x) is null), obstacle.Feature);
            }

            clear = s;
        }

        return (approach.LengthM, null);
    }

    /// <summary>The first continuous stretch on which the design road user is shown, refined at both ends.</summary>
    private static (double? From, double? To) ShownStretch(MirrorViewer viewer, Approach approach, List<double> stations, List<StationView> views, RoadUser user)
    {
        var shown = views.Where(v => v.RoadUser == user).Select(v => v.Shown).ToList();
        var first = shown.IndexOf(true);
        if (first < 0)
        {
            return (null, null);
        }

        bool IsShown(double s) => viewer.See(approach, s, user).Shown;
        var from = first == 0 ? stations[0] : Boundary(stations[first], stations[first - 1], IsShown);
        var last = first;
        while (last + 1 < shown.Count && shown[last + 1])
        {
            last++;
        }

        var to = last + 1 < stations.Count ? Boundary(stations[last], stations[last + 1], IsShown) : stations[last];
        return (from, to);
    }

    /// <summary>The farthest station, beyond the start of the shown stretch, where the condition holds, refined outward.</summary>
    private static double? FarthestWhere(
        MirrorViewer viewer, Approach approach, List<double> stations, List<StationView> views, RoadUser user, double? shownFrom, Func<StationView, bool> condition)
    {
        var own = views.Where(v => v.RoadUser == user).ToList();
        var last = own.FindLastIndex(v => condition(v) && v.StationM >= (shownFrom ?? 0) - BoundaryToleranceM);
        if (last < 0)
        {
            return null;
        }

        return last + 1 < stations.Count
            ? Boundary(stations[last], stations[last + 1], s => condition(viewer.See(approach, s, user)))
            : stations[last];
    }

    /// <summary>Bisection between a station where a condition holds and one where it does not; returns the last where it holds.</summary>
    internal static double Boundary(double holds, double fails, Func<double, bool> condition, double toleranceM = BoundaryToleranceM)
    {
        while (Math.Abs(fails - holds) > toleranceM)
        {
            var middle = (holds + fails) / 2;
            if (condition(middle))
            {
                holds = middle;
            }
            else
            {
                fails = middle;
            }
        }

        return holds;
    }

    private static double Distance2D(Vec3 a, Vec3 b) => Math.Sqrt(((a.X - b.X) * (a.X - b.X)) + ((a.Y - b.Y) * (a.Y - b.Y)));
}
