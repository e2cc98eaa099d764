using NetTopologySuite.Geometries;
using SafetyMirror.Core.Optics;
using SafetyMirror.Core.Site;

namespace SafetyMirror.Core.Tests.Site;

/// <summary>A viewpoint 3 m up at the origin looking over a 100 m square of ground at a target 0.75 m up, past one wall
/// across x = 5 to 6, y −2 to 2, of the height each case gives. Every check value is worked by hand (similar triangles).</summary>
public class SightShadowsTests
{
    private const double ViewpointHeightM = 3;
    private const double TargetHeightM = 0.75;

    private static readonly GeometryFactory Factory = new();
    private static readonly Vec3 Viewpoint = new(0, 0, ViewpointHeightM);
    private static readonly Polygon Ground = Box(-50, -50, 50, 50);

    [Fact]
    public void SeenPart_WallTallerThanTheViewpoint_HidesTheWholeWedgeBehindItToTheAreasEdge()
    {
        // Hand computation: the wedge |y| ≤ 0.4·x between the rays past the near corners (5, ±2), from x = 5 to the area's
        // edge at x = 50, is a trapezoid of parallel sides 4 m and 40 m, 45 m apart: 990 m² hidden of 10,000 m².
        var seen = SeenPast(heightM: 4);

        Assert.Equal(10_000 - 990, seen.Area, 1e-6);
    }

    [Fact]
    public void SeenPart_WallLowerThanTheTarget_HidesOnlyItsFootprint()
    {
        // Geometric construction: the sightline never comes down to the target height before the target, so a 0.5 m wall
        // below a 0.75 m target hides nothing but the 1 m × 4 m it stands on.
        var seen = SeenPast(heightM: 0.5);

        Assert.Equal(10_000 - 4, seen.Area, 1e-6);
    }

    [Fact]
    public void SeenPart_MidHeightWall_ShadowEndsWhereTheSightlineGrazesItsBackTop()
    {
        // Hand computation: the sightline to a target D metres out along y = 0 is at 3 − 2.25·6/D over the wall's back
        // edge (x = 6); it clears the 2 m top from D = 6·(3 − 0.75)/(3 − 2) = 13.5 m on.
        var seen = SeenPast(heightM: 2);

        Assert.False(seen.Contains(Factory.CreatePoint(new Coordinate(13.45, 0))));
        Assert.True(seen.Contains(Factory.CreatePoint(new Coordinate(13.55, 0))));
    }

    [Fact]
    public void SeenPart_MidHeightWall_HidesTheWallScaledFromOneToTheGrazingRatio()
    {
        // Hand computation: the footprint scaled by 1 to 2.25 about the viewpoint sweeps the trapezoid |y| ≤ 0.4·x from
        // x = 5 to 11.25 (sides 4 m and 9 m: 40.625 m²) and the far copy, x 11.25 to 13.5 by y ±4.5 (20.25 m²).
        var seen = SeenPast(heightM: 2);

        Assert.Equal(10_000 - 40.625 - 20.25, seen.Area, 1e-6);
    }

    [Fact]
    public void SeenPart_MidHeightWall_AgreesWithTheSightlineTestAtEveryGroundPoint()
    {
        // The area construction against the plan's own 2.5-D sightline test, on a 0.5 m grid (points nearer than 5 cm to
        // the shadow's outline left out).
        var wall = Wall(2);
        var plan = new SitePlan(PlanFrame.LocalMetres, [], [], [wall]);
        var seen = SightShadows.SeenPart(Ground, [wall], Viewpoint, TargetHeightM)!;

        var disagreeing = Grid(-20, 20, 0.5)
            .Where(p => seen.Boundary.Distance(Factory.CreatePoint(p)) > 0.05)
            .Where(p => seen.Contains(Factory.CreatePoint(p)) == plan.IsBlocked(Viewpoint, new Vec3(p.X, p.Y, TargetHeightM)))
            .ToList();

        Assert.Empty(disagreeing);
    }

    [Fact]
    public void SeenPart_WallOverTheWholeArea_IsNull()
    {
        Assert.Null(SightShadows.SeenPart(Box(10, 10, 20, 20), [new Obstacle(Box(0, 0, 30, 30), 4, new FeatureReference(0))], Viewpoint, TargetHeightM));
    }

    private static Geometry SeenPast(double heightM) => SightShadows.SeenPart(Ground, [Wall(heightM)], Viewpoint, TargetHeightM)!;

    private static Obstacle Wall(double heightM) => new(Box(5, -2, 6, 2), heightM, new FeatureReference(1, Name: "Wall"));

    private static IEnumerable<Coordinate> Grid(double min, double max, double step) =>
        from i in Enumerable.Range(0, (int)((max - min) / step) + 1)
        from j in Enumerable.Range(0, (int)((max - min) / step) + 1)
        select new Coordinate(min + (i * step), min + (j * step));

    private static Polygon Box(double minX, double minY, double maxX, double maxY) =>
        (Polygon)Factory.ToGeometry(new Envelope(minX, maxX, minY, maxY));
}
