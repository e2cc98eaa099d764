using NetTopologySuite.Geometries;
using SafetyMirror.Core.Design.Evaluation;
using SafetyMirror.Core.Optics;
using SafetyMirror.Core.Site;

namespace SafetyMirror.Core.Tests.Design.Evaluation;

/// <summary>
/// Invented test corners in local metres (x east, y north): a driveway meets a 6 m street from the south; the
/// street's eastbound lane runs along y = 1.5, its westbound lane along y = 4.5; a pole on the far footway.
/// </summary>
public static class Corners
{
    private static readonly GeometryFactory Factory = new();

    public static readonly Vec3 Eye = new(0, -3, 1.08); // AASHTO passenger-car eye height (domain brief §3)

    /// <summary>Eastbound traffic from the west, 120 m drawn, ending at the driveway's centre line.</summary>
    public static Approach FromWest(double speedKmh = 30) =>
        new(Line((-120, 1.5), (0, 1.5)), speedKmh, 0, new FeatureReference(1, "from-west", "Eastbound lane"));

    /// <summary>Westbound traffic from the east.</summary>
    public static Approach FromEast(double speedKmh = 30) =>
        new(Line((120, 4.5), (0, 4.5)), speedKmh, 0, new FeatureReference(2, "from-east", "Westbound lane"));

    /// <summary>A 6 m high building on the driveway's west side, its corner at (−2, −1).</summary>
    public static Obstacle WestBuilding() =>
        new(Box(-30, -20, -2, -1), 6, new FeatureReference(3, "west-building", "Corner house"));

    /// <summary>A 600 mm mirror (R 2.2 m) on the north footway, aimed down the street to the west.</summary>
    public static MirrorPlacement WestMirror(double radiusM = 2.2, double diameterM = 0.6) =>
        new(0, 7.5, 2.9, 226, 5, radiusM, new RoundAperture(diameterM));

    public static SitePlan Plan(params SiteFeature[] features) =>
        new(PlanFrame.LocalMetres,
            [new Eye(Eye, new FeatureReference(0, "driver"))],
            features.OfType<Approach>(),
            features.OfType<Obstacle>());

    public static LineString Line(params (double X, double Y)[] points) =>
        Factory.CreateLineString(points.Select(p => new Coordinate(p.X, p.Y)).ToArray());

    public static Polygon Box(double minX, double minY, double maxX, double maxY) =>
        (Polygon)Factory.ToGeometry(new Envelope(minX, maxX, minY, maxY));
}
