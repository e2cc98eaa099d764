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

    private static StationView NotShown(double stationM, RoadUser user, NotShownReason reason, BlockedLeg leg, FeatureReference? by, Reflection? reflection) =>
        new(stationM, user, false, reason, leg, by,
            reflection?.Point, reflection?.IncidenceDeg, null, null, null, reflection?.PathLengthM, false, false);
}
