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
        var halfHeight = user.HeightM / 2;
        var centre = station.Position with { Z = halfHeight };
        var reflection = Mirror.Reflect(Eye, centre);
        if (!reflection.IsFound)
        {
            return NotShown(stationM, user, NotShownReason.NoReflection, BlockedLeg.None, null, null);
        }

        if (!reflection.InsideAperture)
        {
            return NotShown(stationM, user, NotShownReason.OutsideFace, BlockedLeg.None, null, reflection);
        }

        if (Plan.FirstObstacleBlocking(Eye, reflection.Point) is { } eyeSide)
        {
            return NotShown(stationM, user, NotShownReason.Blocked, BlockedLeg.EyeToMirror, eyeSide.Feature, reflection);
        }

        if (Plan.FirstObstacleBlocking(reflection.Point, centre) is { } roadSide)
        {
            return NotShown(stationM, user, NotShownReason.Blocked, BlockedLeg.MirrorToRoadUser, roadSide.Feature, reflection);
        }

        // Across the lane: perpendicular to the direction of travel, in the ground plane.
        var across = new Vec3(-station.Direction.Y, station.Direction.X, 0) * (user.WidthM / 2);
        var height = ApparentSize.InMirror(Mirror, Eye, station.Position, station.Position with { Z = user.HeightM });
        var width = ApparentSize.InMirror(Mirror, Eye, centre + across, centre - across);
        if (!height.First.IsFound || !height.Second.IsFound || !width.First.IsFound || !width.Second.IsFound)
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

    /// <summary>Whether the road user at the station is shown: its centre reflects on the face and neither leg is blocked.</summary>
    /// <remarks>The cheap part of <see cref="See"/>, for locating where the shown stretch begins and ends.</remarks>
    public bool Shows(Approach approach, double stationM, RoadUser user)
    {
        var centre = approach.PointAtStation(stationM).Position with { Z = user.HeightM / 2 };
        var reflection = Mirror.Reflect(Eye, centre);
        return reflection.IsFound && reflection.InsideAperture
            && !Plan.IsBlocked(Eye, reflection.Point) && !Plan.IsBlocked(reflection.Point, centre);
    }

    /// <summary>Whether the road user at the station would look at least this large in the mirror's sphere, shown or not.</summary>
    /// <remarks>Apparent size changes smoothly along the lane, unlike what the face's rim and obstacles cut off, so it can be
    /// sampled sparsely; where the road user is recognisable is where it is shown and large enough.</remarks>
    public bool LargeEnough(Approach approach, double stationM, RoadUser user, double angleRad)
    {
        var station = approach.PointAtStation(stationM);
        var centre = station.Position with { Z = user.HeightM / 2 };
        var across = new Vec3(-station.Direction.Y, station.Direction.X, 0) * (user.WidthM / 2);
        var height = ApparentSize.InMirror(Mirror, Eye, station.Position, station.Position with { Z = user.HeightM });
        var width = ApparentSize.InMirror(Mirror, Eye, centre + across, centre - across);
        return height.First.IsFound && height.Second.IsFound && width.First.IsFound && width.Second.IsFound
            && Math.Min(height.Angle, width.Angle) >= angleRad;
    }

    private static StationView NotShown(double stationM, RoadUser user, NotShownReason reason, BlockedLeg leg, FeatureReference? by, Reflection? reflection) =>
        new(stationM, user, false, reason, leg, by,
            reflection?.Point, reflection?.IncidenceDeg, null, null, null, reflection?.PathLengthM, false, false);
}
