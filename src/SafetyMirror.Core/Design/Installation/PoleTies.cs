using NetTopologySuite.Geometries;
using NetTopologySuite.Operation.Distance;
using SafetyMirror.Core.Site;

namespace SafetyMirror.Core.Design.Installation;

/// <summary>The pole tied to the nearest carriageway edge, square to it.</summary>
/// <param name="Carriageway">The carriageway whose edge is nearest.</param>
/// <param name="OffsetM">Horizontal distance from the edge to the pole, measured square to the edge, in metres.</param>
/// <param name="BearingDeg">Direction from the foot of that square line on the edge to the pole, clockwise from north, in degrees.</param>
/// <param name="OnCarriageway">Whether the pole stands on the carriageway itself (then the offset is measured in from its edge).</param>
/// <param name="EdgeXM">Local x of the foot of the square line on the edge.</param>
/// <param name="EdgeYM">Local y of the foot of the square line on the edge.</param>
public sealed record KerbTie(FeatureReference Carriageway, double OffsetM, double BearingDeg, bool OnCarriageway, double EdgeXM, double EdgeYM);

/// <summary>The pole tied to the nearest corner of an obstacle's footprint (a building, wall or hedge corner).</summary>
/// <param name="Obstacle">The obstacle the corner belongs to.</param>
/// <param name="CornerXM">Local x of the corner.</param>
/// <param name="CornerYM">Local y of the corner.</param>
/// <param name="DistanceM">Horizontal distance from the corner to the pole, in metres.</param>
/// <param name="BearingDeg">Direction from the corner to the pole, clockwise from north, in degrees.</param>
public sealed record CornerTie(FeatureReference Obstacle, double CornerXM, double CornerYM, double DistanceM, double BearingDeg);

/// <summary>Where a pole stands, tied to what a crew finds on site: the nearest carriageway edge and the nearest obstacle corner.</summary>
/// <param name="Kerb">The tie to the nearest carriageway edge, or null when the plan draws no carriageway.</param>
/// <param name="Corner">The tie to the nearest obstacle corner, or null when the plan has no obstacle.</param>
public sealed record PoleTies(KerbTie? Kerb, CornerTie? Corner)
{
    private static readonly GeometryFactory Factory = new();

    /// <summary>The ties of a pole at a local point of the plan.</summary>
    /// <remarks>Corners are the vertices of the footprints' outlines (holes included); bearings are in the plan's local frame,
    /// whose north is the y axis.</remarks>
    public static PoleTies Of(SitePlan plan, double xM, double yM)
    {
        ArgumentNullException.ThrowIfNull(plan);
        var pole = new Coordinate(xM, yM);
        var kerb = plan.Carriageways
            .Select(c => (Carriageway: c, Foot: DistanceOp.NearestPoints(c.Area.Boundary, Factory.CreatePoint(pole))[0]))
            .Select(c => new KerbTie(c.Carriageway.Feature, c.Foot.Distance(pole), BearingDeg(c.Foot, pole),
                c.Carriageway.Area.Contains(Factory.CreatePoint(pole)), c.Foot.X, c.Foot.Y))
            .MinBy(k => k.OffsetM);
        var corner = plan.Obstacles
            .SelectMany(o => o.Footprint.Coordinates.Select(c => new CornerTie(o.Feature, c.X, c.Y, c.Distance(pole), BearingDeg(c, pole))))
            .MinBy(c => c.DistanceM);
        return new PoleTies(kerb, corner);
    }

    /// <summary>Direction from one local point to another, clockwise from north (the y axis), 0 to 360 degrees.</summary>
    /// <remarks>Rounded to 1e-9° so that due north is 0, not a hair under 360.</remarks>
    public static double BearingDeg(Coordinate from, Coordinate to) =>
        Math.Round((Math.Atan2(to.X - from.X, to.Y - from.Y) * 180 / Math.PI) + 360, 9) % 360;

    /// <summary>The compass point of a bearing among eight: "north", "north-east", … .</summary>
    public static string CompassPoint(double bearingDeg) =>
        CompassPoints[(int)Math.Round(((bearingDeg % 360) + 360) % 360 / 45) % 8];

    private static readonly string[] CompassPoints = ["north", "north-east", "east", "south-east", "south", "south-west", "west", "north-west"];
}
