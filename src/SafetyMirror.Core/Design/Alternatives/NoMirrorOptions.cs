using NetTopologySuite.Geometries;
using NetTopologySuite.Operation.Distance;
using SafetyMirror.Core.Design.Evaluation;
using SafetyMirror.Core.Design.Installation;
using SafetyMirror.Core.Optics;
using SafetyMirror.Core.Site;

namespace SafetyMirror.Core.Design.Alternatives;

/// <summary>The direct view with the obstacles that block it cleared away, one after another until the view is enough, nothing blocks it
/// or <see cref="NoMirrorOptions.MaxCleared"/> are gone.</summary>
/// <param name="Cleared">The obstacles removed, in the order they were found to end the direct view.</param>
/// <param name="DirectM">How far the direct view reaches with them removed, in metres.</param>
/// <param name="Meets">Whether that reaches the required distance.</param>
/// <param name="LowerToM">When removing the first blocker alone is enough: the greatest height it may keep instead, in metres (rounded
/// down to the centimetre); null otherwise.</param>
public sealed record ClearingOption(IReadOnlyList<FeatureReference> Cleared, double DirectM, bool Meets, double? LowerToM);

/// <summary>The waiting position moved forward, toward the carriageway, until the direct view is enough.</summary>
/// <param name="ForwardM">How far the eye must move forward, in metres (to the centimetre); null when no position up to the limit does it.</param>
/// <param name="LimitM">How far forward the eye can go within the plan: to the nearest carriageway edge, in metres.</param>
/// <param name="BearingDeg">The direction forward, clockwise from north.</param>
/// <param name="DirectAtForwardM">How far the direct view reaches with the eye moved <paramref name="ForwardM"/> forward, or to the
/// limit when no position meets, in metres.</param>
/// <param name="Reason">Why the option does not apply at all, or null.</param>
public sealed record ForwardOption(double? ForwardM, double LimitM, double BearingDeg, double DirectAtForwardM, string? Reason)
{
    /// <summary>Whether moving the waiting position forward gives the required view.</summary>
    public bool Meets => ForwardM is not null;
}

/// <summary>The highest approach speed at which the present direct view meets the requirement.</summary>
/// <param name="SpeedKmh">That speed, a whole km/h below the approach speed; null when none down to the method's lowest does.</param>
/// <param name="RequiredM">The sight distance required at that speed (or at the lowest speed tried), in metres.</param>
/// <param name="LowestTriedKmh">The lowest speed tried: the method's lowest.</param>
public sealed record LowerSpeedOption(double? SpeedKmh, double RequiredM, double LowestTriedKmh)
{
    /// <summary>Whether some lower speed makes the present direct view enough.</summary>
    public bool Meets => SpeedKmh is not null;
}

/// <summary>The measures without a mirror for one approach whose direct view falls short.</summary>
/// <param name="Approach">The approach.</param>
/// <param name="RequiredM">The sight distance it needs, in metres.</param>
/// <param name="DirectM">How far the direct view reaches now, in metres.</param>
/// <param name="BlockedBy">What ends the direct view now, if anything.</param>
/// <param name="Clearing">Clearing the obstruction.</param>
/// <param name="Forward">Moving the waiting position forward.</param>
/// <param name="LowerSpeed">Lowering the approach speed.</param>
public sealed record ApproachOptions(
    Approach Approach, double RequiredM, double DirectM, FeatureReference? BlockedBy, ClearingOption Clearing, ForwardOption Forward, LowerSpeedOption LowerSpeed);

/// <summary>What could restore the direct view without a mirror: clearing the obstruction, moving the waiting position forward,
/// lowering the speed; each judged by the same direct-view computation as the evaluation.</summary>
/// <remarks>Every figure comes from the evaluation's own direct view (its sightlines, object height and bisection), with the one thing
/// changed, so an option that "meets" here would be found met directly by an evaluation of the changed corner.</remarks>
public static class NoMirrorOptions
{
    /// <summary>Step of the scan along the forward direction, in metres; the meeting point is then found by bisection.</summary>
    public const double ForwardScanM = 0.25;

    /// <summary>Most steps of that scan: an eye far from the carriageway is scanned in longer steps.</summary>
    public const int MaxForwardSteps = 40;

    /// <summary>Most obstacles cleared one after another before the clearing option gives up.</summary>
    public const int MaxCleared = 10;

    /// <summary>How finely the forward distance and the height to lower to are stated, in metres (found a hundred times finer,
    /// then rounded to the safe side).</summary>
    public const double ResolutionM = 0.01;

    private static readonly GeometryFactory Factory = new();

    /// <summary>The measures for every approach of the plan whose direct view falls short of its requirement.</summary>
    /// <remarks>The plan must have the options' eye.</remarks>
    public static IReadOnlyList<ApproachOptions> For(SitePlan plan, EvaluationOptions options)
    {
        ArgumentNullException.ThrowIfNull(plan);
        ArgumentNullException.ThrowIfNull(options);
        var eye = plan.Eyes[options.EyeIndex].Position;
        return
        [
            .. plan.Approaches
                .Select(a => new ApproachJudge(plan, eye, null, a, options))
                .Where(j => !j.DirectMeets)
                .Select(j => new ApproachOptions(j.Approach, j.Required.DesignM, j.DirectSightDistanceM, j.DirectBlockedBy,
                    Clearing(plan, eye, j, options), Forward(plan, eye, j.Approach, options), LowerSpeed(plan, eye, j.Approach, options))),
        ];
    }

    /// <summary>Removes the obstacle that ends the direct view, then the next, until the view is enough or nothing blocks it.</summary>
    public static ClearingOption Clearing(SitePlan plan, Vec3 eye, Approach approach, EvaluationOptions options)
    {
        ArgumentNullException.ThrowIfNull(plan);
        ArgumentNullException.ThrowIfNull(options);
        return Clearing(plan, eye, new ApproachJudge(plan, eye, null, approach, options), options);
    }

    private static ClearingOption Clearing(SitePlan plan, Vec3 eye, ApproachJudge judge, EvaluationOptions options)
    {
        var cleared = new List<Obstacle>();
        var now = judge;
        while (!now.DirectMeets && cleared.Count < MaxCleared && now.DirectBlockedBy is { } blocker && plan.Obstacles.FirstOrDefault(o => o.Feature == blocker) is { } obstacle)
        {
            cleared.Add(obstacle);
            now = new ApproachJudge(Without(plan, cleared, null), eye, null, judge.Approach, options);
        }

        double? lowerTo = null;
        if (now.DirectMeets && cleared.Count == 1)
        {
            var first = cleared[0];
            bool Meets(double heightM) => new ApproachJudge(Without(plan, [first], new Obstacle(first.Footprint, heightM, first.Feature)), eye, null, judge.Approach, options).DirectMeets;
            var lowest = SiteRanges.MinObstacleHeightM;
            if (Meets(lowest))
            {
                lowerTo = Math.Floor(StationIntervals.Boundary(lowest, first.HeightM, Meets, ResolutionM / 100) / ResolutionM) * ResolutionM;
            }
        }

        return new ClearingOption([.. cleared.Select(o => o.Feature)], now.DirectSightDistanceM, now.DirectMeets, lowerTo);
    }

    /// <summary>Moves the eye forward toward the nearest carriageway edge, no farther than that edge, until the direct view is enough.</summary>
    public static ForwardOption Forward(SitePlan plan, Vec3 eye, Approach approach, EvaluationOptions options)
    {
        ArgumentNullException.ThrowIfNull(plan);
        ArgumentNullException.ThrowIfNull(options);
        var at = Factory.CreatePoint(new Coordinate(eye.X, eye.Y));
        var nearest = plan.Carriageways.MinBy(c => c.Area.Distance(at));
        if (nearest is null)
        {
            return new ForwardOption(null, 0, 0, 0, "the plan draws no carriageway edge to move toward");
        }

        if (nearest.Area.Distance(at) == 0)
        {
            return new ForwardOption(null, 0, 0, 0, "the waiting driver's eye already stands on the carriageway");
        }

        var edge = DistanceOp.NearestPoints(nearest.Area, at)[0];
        var limit = edge.Distance(at.Coordinate);
        var direction = new Vec3(edge.X - eye.X, edge.Y - eye.Y, 0) / limit;
        var bearing = PoleTies.BearingDeg(new Coordinate(eye.X, eye.Y), edge);
        ApproachJudge Judge(double forwardM)
        {
            var moved = eye + (direction * forwardM);
            return new ApproachJudge(plan, moved, null, approach, options);
        }

        bool Meets(double forwardM) => !plan.IsInsideAnyObstacle(eye.X + (direction.X * forwardM), eye.Y + (direction.Y * forwardM)) && Judge(forwardM).DirectMeets;
        var step = Math.Max(ForwardScanM, limit / MaxForwardSteps);
        var steps = Enumerable.Range(0, (int)Math.Ceiling(limit / step) + 1).Select(i => Math.Min(limit, i * step)).Distinct().ToList();
        var first = steps.FindIndex(Meets);
        if (first < 0)
        {
            return new ForwardOption(null, limit, bearing, Judge(limit).DirectSightDistanceM, null);
        }

        var found = first == 0 ? 0 : StationIntervals.Boundary(steps[first], steps[first - 1], Meets, ResolutionM / 100);
        var forward = Math.Min(limit, Math.Ceiling(found / ResolutionM) * ResolutionM);
        return new ForwardOption(forward, limit, bearing, Judge(forward).DirectSightDistanceM, null);
    }

    /// <summary>The highest whole km/h below the approach speed at which the present direct view meets the requirement.</summary>
    /// <remarks>Searched speed by speed with the evaluation's own requirement and direct view, not by inverting a formula: the
    /// design distance rounds up to the next 5 m, so the formula alone would not give the speed at which the rounded value fits.</remarks>
    public static LowerSpeedOption LowerSpeed(SitePlan plan, Vec3 eye, Approach approach, EvaluationOptions options)
    {
        ArgumentNullException.ThrowIfNull(plan);
        ArgumentNullException.ThrowIfNull(approach);
        ArgumentNullException.ThrowIfNull(options);
        var lowest = Math.Max(SightDistanceMethod.MinimumSpeedKmh, SiteRanges.MinSpeedKmh);
        var directM = new ApproachJudge(plan, eye, null, approach, options).DirectSightDistanceM;
        for (var speed = Math.Ceiling(approach.SpeedKmh) - 1; speed >= lowest; speed--)
        {
            // The requirement alone rules most speeds out; a speed it leaves in is confirmed by the evaluation's own judgement,
            // whose direct view is located to the boundary tolerance.
            if (options.SightDistance.Required(speed, approach.GradePercent).DesignM > directM + (2 * MirrorEvaluator.BoundaryToleranceM))
            {
                continue;
            }

            var judge = new ApproachJudge(plan, eye, null, new Approach(approach.Line, speed, approach.GradePercent, approach.Feature), options);
            if (judge.DirectMeets)
            {
                return new LowerSpeedOption(speed, judge.Required.DesignM, lowest);
            }
        }

        return new LowerSpeedOption(null, options.SightDistance.Required(lowest, approach.GradePercent).DesignM, lowest);
    }

    private static SitePlan Without(SitePlan plan, IReadOnlyList<Obstacle> removed, Obstacle? instead) =>
        new(plan.Frame, plan.Eyes, plan.Approaches, [.. plan.Obstacles.Where(o => !removed.Any(r => ReferenceEquals(r, o))), .. instead is null ? [] : new[] { instead }],
            plan.MountingZones, plan.Carriageways, plan.Footways, plan.StopLines);
}
