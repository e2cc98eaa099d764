using SafetyMirror.Core.Optics;
using SafetyMirror.Core.Site;

namespace SafetyMirror.Core.Design.Evaluation;

/// <summary>The waiting driver looking into the mirror: sees one road user at one station.</summary>
internal sealed record MirrorViewer(SitePlan Plan, ConvexMirror Mirror, Vec3 Eye, VisionCriteria Vision)
{
    /// <summary>How the road user at the station looks in the mirror, or why it is not shown.</summary>
    public StationView See(Approach approach, double stationM, RoadUser user)
    {
        var station = approach.PointAtStation(stationM);
        var path = PathOf(station, user);
        return See(station, user, path, path.Shown ? SizesOf(station, user) : default);
    }

    /// <summary>How the road user at the station looks, from its centre's light path and, when shown, its apparent sizes.</summary>
    public StationView See(StationPoint station, RoadUser user, CentrePath path, ApparentSizes sizes)
    {
        var stationM = station.StationM;
        var reflection = path.Reflection;
        if (!reflection.IsFound)
        {
            return NotShown(stationM, user, NotShownReason.NoReflection, BlockedLeg.None, null, null);
        }

        if (!reflection.InsideAperture)
        {
            return NotShown(stationM, user, NotShownReason.OutsideFace, BlockedLeg.None, null, reflection);
        }

        if (path.EyeSide is { } eyeSide)
        {
            return NotShown(stationM, user, NotShownReason.Blocked, BlockedLeg.EyeToMirror, eyeSide.Feature, reflection);
        }

        if (path.RoadSide is { } roadSide)
        {
            return NotShown(stationM, user, NotShownReason.Blocked, BlockedLeg.MirrorToRoadUser, roadSide.Feature, reflection);
        }

        var (height, width) = sizes;
        if (!sizes.AllReflect)
        {
            return NotShown(stationM, user, NotShownReason.NoReflection, BlockedLeg.None, null, reflection);
        }

        var smallest = Math.Min(height.Angle, width.Angle);
        return new StationView(
            stationM,
            user,
            Shown: true,
            NotShownReason.None,
            BlockedLeg.None,
            null,
            reflection.Point,
            reflection.IncidenceDeg,
            Angles.ToArcmin(height.Angle),
            Angles.ToArcmin(width.Angle),
            ApparentSize.EquivalentDirectDistanceM(user.HeightM, height.Angle),
            reflection.PathLengthM,
            smallest >= Vision.Recognition.AngleRad,
            smallest >= Vision.Detection.AngleRad);
    }

    /// <summary>Where the road user's centre at half height reflects and what cuts either leg: whether it is shown.</summary>
    /// <remarks>The cheap part of <see cref="See(Approach, double, RoadUser)"/>, for locating where the shown stretch begins and
    /// ends. A leg is only tested once the reflection lies on the face, and the far leg only when the near one is clear.</remarks>
    public CentrePath PathOf(StationPoint station, RoadUser user)
    {
        var centre = station.Position with { Z = user.HeightM / 2 };
        var reflection = Mirror.Reflect(Eye, centre);
        if (!reflection.IsFound || !reflection.InsideAperture)
        {
            return new CentrePath(reflection, null, null);
        }

        var eyeSide = Plan.FirstObstacleBlocking(Eye, reflection.Point);
        return new CentrePath(reflection, eyeSide, eyeSide is null ? Plan.FirstObstacleBlocking(reflection.Point, centre) : null);
    }

    /// <summary>Whether the road user at the station is shown and at least the recognition angle tall and wide: what
    /// <see cref="See(Approach, double, RoadUser)"/> says of it, found with no more work than that takes.</summary>
    /// <remarks>A station the face surely cannot show costs no solve; of the two angles, the one across the road user's
    /// smaller side is looked at first and the other only when that one reaches the threshold.</remarks>
    public bool Recognisable(StationPoint station, RoadUser user)
    {
        if (SurelyNotShown(station, user) || !PathOf(station, user).Shown)
        {
            return false;
        }

        var angleRad = Vision.Recognition.AngleRad;
        return user.WidthM < user.HeightM
            ? WidthOf(station, user).Reaches(angleRad) && HeightOf(station, user).Reaches(angleRad)
            : HeightOf(station, user).Reaches(angleRad) && WidthOf(station, user).Reaches(angleRad);
    }

    /// <summary>Whether the road user's centre surely does not reflect on the face, found without solving for the reflection.</summary>
    public bool SurelyNotShown(StationPoint station, RoadUser user) =>
        ReflectionSolver.SurelyNotOnFace(Mirror, Eye, station.Position with { Z = user.HeightM / 2 });

    /// <summary>How tall and how wide the road user at the station looks in the mirror's sphere, shown or not.</summary>
    /// <remarks>Apparent size changes smoothly along the lane, unlike what the face's rim and obstacles cut off, so it can be
    /// sampled sparsely; where the road user is recognisable is where it is shown and large enough.</remarks>
    public ApparentSizes SizesOf(StationPoint station, RoadUser user) => new(HeightOf(station, user), WidthOf(station, user));

    /// <summary>The angle between the images of the road user's front from bottom to top at its centre line.</summary>
    public ApparentAngle HeightOf(StationPoint station, RoadUser user) =>
        new(ApparentSize.InMirror(Mirror, Eye, station.Position, station.Position with { Z = user.HeightM }));

    /// <summary>The angle between the images of the road user's front from edge to edge at half height, across the direction
    /// of travel.</summary>
    public ApparentAngle WidthOf(StationPoint station, RoadUser user)
    {
        var centre = station.Position with { Z = user.HeightM / 2 };
        var across = new Vec3(-station.Direction.Y, station.Direction.X, 0) * (user.WidthM / 2);
        return new(ApparentSize.InMirror(Mirror, Eye, centre + across, centre - across));
    }

    private static StationView NotShown(double stationM, RoadUser user, NotShownReason reason, BlockedLeg leg, FeatureReference? by, Reflection? reflection) =>
        new(stationM, user, false, reason, leg, by,
            reflection?.Point, reflection?.IncidenceDeg, null, null, null, reflection?.PathLengthM, false, false);
}

/// <summary>The light path of a road user's centre: its reflection, and the obstacle that cuts the leg to the eye or, that one
/// clear, the leg to the road user (each null when clear or not tested).</summary>
internal readonly record struct CentrePath(Reflection Reflection, Obstacle? EyeSide, Obstacle? RoadSide)
{
    /// <summary>The centre reflects on the face and neither leg is blocked.</summary>
    public bool Shown => Reflection.IsFound && Reflection.InsideAperture && EyeSide is null && RoadSide is null;
}

/// <summary>The images of a road user's front: bottom to top at its centre line, and edge to edge at half height.</summary>
internal readonly record struct ApparentSizes(ApparentAngle Height, ApparentAngle Width)
{
    /// <summary>All four points reflect on the sphere.</summary>
    public bool AllReflect => Height.Reflects && Width.Reflects;
}

/// <summary>Of the images of two points of a road user: whether both points reflect on the sphere, and the angle between them.</summary>
/// <remarks>Only what the judgement reads, kept small: thousands are held per evaluation.</remarks>
internal readonly record struct ApparentAngle(bool Reflects, double Angle)
{
    /// <summary>Keeps what is read of a view.</summary>
    public ApparentAngle(MirrorView view)
        : this(view.First.IsFound && view.Second.IsFound, view.Angle)
    {
    }

    /// <summary>Both points reflect and the angle between their images is at least the given one.</summary>
    public bool Reaches(double angleRad) => Reflects && Angle >= angleRad;
}
