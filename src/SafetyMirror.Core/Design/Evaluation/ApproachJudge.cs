using SafetyMirror.Core.Optics;
using SafetyMirror.Core.Site;

namespace SafetyMirror.Core.Design.Evaluation;

/// <summary>Judges one approach: what the eye sees directly, and how a mirror at a given position (if any) covers each road user.</summary>
/// <remarks>
/// What does not depend on the aim (the required distance, the direct view, the stations to sample) is found once, so
/// the same judge serves the aim as set and the aims off by the tolerance.
/// </remarks>
internal sealed class ApproachJudge
{
    private readonly SitePlan plan;
    private readonly Vec3 eye;
    private readonly EvaluationOptions options;
    private readonly List<double> mirrorSamples;
    private readonly List<double> sizeSamples;
    private readonly List<double> directSamples;
    private readonly Dictionary<double, List<(double FromM, double ToM)>> directByHeight = [];
    private readonly Dictionary<double, StationPoint> points = [];

    /// <summary>Prepares the judge of one approach.</summary>
    /// <param name="plan">The plan.</param>
    /// <param name="eye">The waiting driver's eye.</param>
    /// <param name="mirrorFace">Points spread over the mirror's face (its vertex and rim), where the light paths leave it; null
    /// to judge the direct view only.</param>
    /// <param name="approach">The approach.</param>
    /// <param name="options">How it is judged.</param>
    public ApproachJudge(SitePlan plan, Vec3 eye, IReadOnlyList<Vec3>? mirrorFace, Approach approach, EvaluationOptions options)
    {
        this.plan = plan;
        this.eye = eye;
        this.options = options;
        Approach = approach;
        Required = options.SightDistance.Required(approach);
        Regular = RegularStations(approach, options.StationSpacingM);

        // The verdict is judged on its own stations, never on the spacing a caller asked to see reported.
        var judging = JudgingStations(approach, Required.DesignM);
        sizeSamples = judging;
        mirrorSamples = mirrorFace is { } face ? StationIntervals.Samples(plan, approach, judging, [.. face]) : judging;
        directSamples = StationIntervals.Samples(plan, approach, judging, eye);
        var direct = DirectlySeen(Required.ObjectHeightM);
        DirectSightDistanceM = direct is [var first, ..] && first.FromM <= 0 ? first.ToM : 0;
        DirectBlockedBy = DirectSightDistanceM < approach.LengthM
            ? Blocker(Math.Min(approach.LengthM, DirectSightDistanceM + Tolerance), Required.ObjectHeightM)?.Feature
            : null;
    }

    /// <summary>Spacing of the stations the verdict is judged on, out to past the required distance, in metres.</summary>
    public const double JudgingSpacingM = 1;

    /// <summary>Spacing of the judging stations beyond that, where only how far the mirror reaches is measured, in metres.</summary>
    public const double FarJudgingSpacingM = 5;

    private static double Tolerance => MirrorEvaluator.BoundaryToleranceM;

    public Approach Approach { get; }

    public RequiredSightDistance Required { get; }

    /// <summary>The regular stations from the conflict point to the approach's end.</summary>
    public List<double> Regular { get; }

    /// <summary>The continuous stretch from the conflict point the eye sees directly (object height per the method).</summary>
    public double DirectSightDistanceM { get; }

    /// <summary>The obstacle that ends the direct view, if one does.</summary>
    public FeatureReference? DirectBlockedBy { get; }

    public bool DirectMeets => DirectSightDistanceM >= Required.DesignM;

    /// <summary>The point at a station and the direction of travel there, found once per station: it does not depend on the mirror.</summary>
    public StationPoint PointAt(double stationM)
    {
        if (!points.TryGetValue(stationM, out var point))
        {
            point = Approach.PointAtStation(stationM);
            points[stationM] = point;
        }

        return point;
    }

    /// <summary>The road user along this approach in the viewer's mirror, each station worked out once.</summary>
    public StationLooks Looks(MirrorViewer viewer, RoadUser user) => new(viewer, this, user);

    /// <summary>The stretches on which the mirror shows the road user.</summary>
    public List<(double FromM, double ToM)> Shown(StationLooks looks) => StationIntervals.Where(mirrorSamples, looks.Shows, Tolerance);

    /// <summary>The farthest station where the road user is shown and at least the given angle tall and wide; null if nowhere.</summary>
    public double? FarthestWhereSeenAtLeast(StationLooks looks, List<(double FromM, double ToM)> shown, double angleRad) =>
        SeenAtLeast(looks, shown, angleRad) is [.., var last] ? last.ToM : null;

    /// <summary>How the road user is covered by the direct view and this mirror together.</summary>
    public UserCoverage Cover(MirrorViewer viewer, RoadUser user)
    {
        var looks = Looks(viewer, user);
        return Cover(looks, Shown(looks));
    }

    /// <summary>How the road user, shown on the given stretches, is covered by the direct view and this mirror together.</summary>
    public UserCoverage Cover(StationLooks looks, List<(double FromM, double ToM)> shown)
    {
        var user = looks.User;
        double? shownFrom = shown is [var first, ..] ? first.FromM : null;
        double? shownTo = shown is [var stretch, ..] ? stretch.ToM : null;
        var recognisable = SeenAtLeast(looks, shown, looks.Viewer.Vision.Recognition.AngleRad);
        double? recognisableTo = recognisable is [.., var last] ? last.ToM : null;
        var requiredM = Required.DesignM;

        // Seen directly where the road user's top, or the method's object point if lower, shows over the obstacles.
        List<(double FromM, double ToM)> covering = [.. DirectlySeen(Math.Min(Required.ObjectHeightM, user.HeightM)), .. recognisable];
        var unseen = Unseen(covering, requiredM);
        var provided = recognisable.Count == 0 ? 0 : Reach(recognisable, options.MaxUnseenStretchM + MirrorEvaluator.NegligibleGapM);
        var margin = DirectMeets ? double.PositiveInfinity : provided / requiredM;
        var meets = DirectMeets || (
            (unseen.MaxBy(u => u.LengthM)?.LengthM ?? 0) <= options.MaxUnseenStretchM
            && margin >= Math.Max(1, options.MinMargin) - 1e-9);
        return new UserCoverage(user, shownFrom, shownTo, recognisableTo, provided, provided >= Approach.LengthM - Tolerance, unseen, margin, meets);
    }

    /// <summary>The stretches where the road user is shown and at least the given angle tall and wide.</summary>
    /// <remarks>Apparent size is only looked at from the last sample at or before the first shown stretch to the first at or
    /// after the last: whatever it does outside that span cannot meet a shown stretch, so the intersection is the same.</remarks>
    private List<(double FromM, double ToM)> SeenAtLeast(StationLooks looks, List<(double FromM, double ToM)> shown, double angleRad)
    {
        if (shown.Count == 0)
        {
            return [];
        }

        var from = sizeSamples.BinarySearch(shown[0].FromM);
        from = from >= 0 ? from : ~from - 1;
        var to = sizeSamples.BinarySearch(from, sizeSamples.Count - from, shown[^1].ToM, null);
        to = to >= 0 ? to : ~to;
        var large = StationIntervals.Where(sizeSamples.GetRange(from, to - from + 1), s => looks.LargeEnough(s, angleRad), Tolerance);
        return Intersect(shown, large);
    }

    /// <summary>How far out the stretches reach from the start of the first, without a gap longer than allowed.</summary>
    /// <remarks>For the stretches where the mirror shows the road user recognisably, without gaps, this is the lesser of how far
    /// the mirror shows it and how far it stays recognisable.</remarks>
    private static double Reach(List<(double FromM, double ToM)> covering, double allowedGapM)
    {
        var reached = covering.Min(c => c.FromM);
        foreach (var (from, to) in covering.OrderBy(c => c.FromM))
        {
            if (from - reached > allowedGapM)
            {
                break;
            }

            reached = Math.Max(reached, to);
        }

        return reached;
    }

    /// <summary>The stretches out to the required distance that none of the covering stretches covers, tolerance-short gaps dropped.</summary>
    private List<UnseenStretch> Unseen(List<(double FromM, double ToM)> covering, double requiredM)
    {
        var speedMps = Approach.SpeedKmh / 3.6;
        var gaps = new List<UnseenStretch>();
        var reached = 0.0;
        foreach (var (from, to) in covering.OrderBy(c => c.FromM))
        {
            if (from > reached)
            {
                Add(reached, Math.Min(from, requiredM));
            }

            reached = Math.Max(reached, to);
            if (reached >= requiredM)
            {
                break;
            }
        }

        Add(reached, requiredM);
        return gaps;

        void Add(double fromM, double toM)
        {
            if (toM - fromM > MirrorEvaluator.NegligibleGapM)
            {
                gaps.Add(new UnseenStretch(fromM, toM, (toM - fromM) / speedMps));
            }
        }
    }

    private static List<(double FromM, double ToM)> Intersect(List<(double FromM, double ToM)> a, List<(double FromM, double ToM)> b)
    {
        var result = new List<(double, double)>();
        int i = 0, j = 0;
        while (i < a.Count && j < b.Count)
        {
            var from = Math.Max(a[i].FromM, b[j].FromM);
            var to = Math.Min(a[i].ToM, b[j].ToM);
            if (to >= from)
            {
                result.Add((from, to));
            }

            if (a[i].ToM < b[j].ToM)
            {
                i++;
            }
            else
            {
                j++;
            }
        }

        return result;
    }

    /// <summary>The stretches the eye sees directly at an object height, located once per height, as far as any answer uses them.</summary>
    /// <remarks>
    /// The unseen stretches are judged out to the required distance, so only the stretches that begin before it count, and of
    /// those only whether they reach it; the direct sight distance is the whole first stretch. So the samples are looked at out
    /// to the first at or past the required distance, and beyond it only while the first stretch, from the conflict point,
    /// goes on: every stretch that counts is located between the same two samples, by the same bisection, as over all of them.
    /// </remarks>
    private List<(double FromM, double ToM)> DirectlySeen(double objectHeightM)
    {
        if (directByHeight.TryGetValue(objectHeightM, out var seen))
        {
            return seen;
        }

        bool Clear(double stationM) => Blocker(stationM, objectHeightM) is null;
        var last = directSamples.FindIndex(s => s >= Required.DesignM) is var i and >= 0 ? i : directSamples.Count - 1;
        seen = StationIntervals.Where(directSamples.GetRange(0, last + 1), Clear, Tolerance);
        if (seen is [var first, ..] && first.FromM <= 0 && first.ToM == directSamples[last] && last < directSamples.Count - 1)
        {
            // The first stretch is still open: follow it to where it ends, as the whole run would.
            var end = directSamples.FindIndex(last + 1, s => !Clear(s));
            seen[0] = (first.FromM, end < 0 ? directSamples[^1] : StationIntervals.Boundary(directSamples[end - 1], directSamples[end], Clear, Tolerance));
        }

        directByHeight[objectHeightM] = seen;
        return seen;
    }

    private Obstacle? Blocker(double stationM, double objectHeightM) =>
        plan.FirstObstacleBlocking(eye, PointAt(stationM).Position with { Z = objectHeightM });

    /// <summary>Every metre out to well past the required distance, every 5 m beyond, and both sides of every bend of the lane,
    /// where a road user turns and its apparent width jumps.</summary>
    private static List<double> JudgingStations(Approach approach, double requiredM)
    {
        var length = approach.LengthM;
        var near = Math.Min(length, Math.Max(1.5 * requiredM, requiredM + 20));
        var stations = new SortedSet<double>();
        for (var s = 0.0; s < near; s += JudgingSpacingM)
        {
            stations.Add(s);
        }

        for (var s = near; s < length; s += FarJudgingSpacingM)
        {
            stations.Add(s);
        }

        stations.Add(length);
        var along = 0.0;
        for (var i = approach.Line.NumPoints - 1; i > 0; i--)
        {
            along += approach.Line.GetCoordinateN(i).Distance(approach.Line.GetCoordinateN(i - 1));
            if (along < length)
            {
                stations.UnionWith([Math.Max(0, along - 0.01), along, Math.Min(length, along + 0.01)]);
            }
        }

        return [.. stations];
    }

    /// <summary>Regular stations from 0 to the approach's end, at most <see cref="MirrorEvaluator.MaxStationsPerApproach"/>.</summary>
    public static List<double> RegularStations(Approach approach, double spacingM)
    {
        var spacing = Math.Max(spacingM, approach.LengthM / MirrorEvaluator.MaxStationsPerApproach);
        var count = (int)Math.Floor(approach.LengthM / spacing);
        var stations = Enumerable.Range(0, count + 1).Select(i => i * spacing).ToList();
        if (approach.LengthM - stations[^1] > Tolerance)
        {
            stations.Add(approach.LengthM);
        }

        return stations;
    }
}
