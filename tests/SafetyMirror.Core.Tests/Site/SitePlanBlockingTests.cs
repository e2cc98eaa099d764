using CsCheck;
using NetTopologySuite.Geometries;
using SafetyMirror.Core.Optics;
using SafetyMirror.Core.Site;

namespace SafetyMirror.Core.Tests.Site;

public class SitePlanBlockingTests
{
    private static readonly GeometryFactory Factory = new();

    // A 2 m wall across x = 10 to 12 (y -5 to 5), a 6 m building farther on at x = 30 to 40, and a hedge of two
    // clumps (y 20 to 22 and 24 to 26) with a gap between them. Heights on the line are worked by hand.
    private static readonly SitePlan Plan = new(
        PlanFrame.LocalMetres,
        eyes: [new Eye(new Vec3(0, 0, 1.08), new FeatureReference(0))],
        approaches: [new Approach(Factory.CreateLineString([new(-20, 60), new(60, 60)]), 50, 0, new FeatureReference(1))],
        obstacles:
        [
            new Obstacle(Box(10, -5, 12, 5), 2, new FeatureReference(2, Name: "Garden wall")),
            new Obstacle(Box(30, -5, 40, 5), 6, new FeatureReference(3, Name: "Corner shop")),
            new Obstacle(Factory.CreateMultiPolygon([Box(50, 20, 52, 22), Box(50, 24, 52, 26)]), 1.5, new FeatureReference(4, Name: "Hedge")),
        ]);

    [Fact]
    public void FirstObstacleBlocking_LineThroughTheWallBelowItsTop_IsTheWall()
    {
        Assert.Equal("Garden wall", Plan.FirstObstacleBlocking(new Vec3(0, 0, 1.08), new Vec3(20, 0, 1.2))?.Feature.Name);
    }

    [Fact]
    public void FirstObstacleBlocking_LineAboveTheWall_IsNone()
    {
        Assert.Null(Plan.FirstObstacleBlocking(new Vec3(0, 0, 2.5), new Vec3(20, 0, 3)));
    }

    [Fact]
    public void FirstObstacleBlocking_LineBesideTheWall_IsNone()
    {
        Assert.Null(Plan.FirstObstacleBlocking(new Vec3(0, 6, 1), new Vec3(20, 6, 1)));
    }

    [Fact]
    public void FirstObstacleBlocking_LineClimbingOverTheWall_IsNone()
    {
        // Height 1.5 + 0.06·x: 2.1 m where it enters the wall at x = 10.
        Assert.Null(Plan.FirstObstacleBlocking(new Vec3(0, 0, 1.5), new Vec3(20, 0, 2.7)));
    }

    [Fact]
    public void FirstObstacleBlocking_LineDroppingBelowTheTopInsideTheWall_IsTheWall()
    {
        // Height 4.4 - x·2.8/12: 2.07 m where it enters at x = 10, 1.6 m where it leaves at x = 12.
        Assert.Equal("Garden wall", Plan.FirstObstacleBlocking(new Vec3(0, 0, 4.4), new Vec3(12, 0, 1.6))?.Feature.Name);
    }

    [Fact]
    public void FirstObstacleBlocking_LineAtExactlyTheTop_IsNone()
    {
        Assert.Null(Plan.FirstObstacleBlocking(new Vec3(0, 0, 2), new Vec3(20, 0, 2)));
    }

    [Fact]
    public void FirstObstacleBlocking_LineThroughTwoObstacles_IsTheOneNearestItsStart()
    {
        Assert.Equal("Garden wall", Plan.FirstObstacleBlocking(new Vec3(0, 0, 1), new Vec3(45, 0, 1))?.Feature.Name);
    }

    [Fact]
    public void FirstObstacleBlocking_SameLineTheOtherWay_IsTheOtherObstacle()
    {
        Assert.Equal("Corner shop", Plan.FirstObstacleBlocking(new Vec3(45, 0, 1), new Vec3(0, 0, 1))?.Feature.Name);
    }

    [Fact]
    public void FirstObstacleBlocking_LineAboveTheWallButIntoTheShop_IsTheShop()
    {
        Assert.Equal("Corner shop", Plan.FirstObstacleBlocking(new Vec3(0, 0, 3), new Vec3(45, 0, 3))?.Feature.Name);
    }

    [Fact]
    public void FirstObstacleBlocking_LineTouchingOnlyACorner_IsNone()
    {
        // y = 5 - x touches the wall only at its corner (10, -5).
        Assert.Null(Plan.FirstObstacleBlocking(new Vec3(0, 5, 1), new Vec3(20, -15, 1)));
    }

    [Fact]
    public void FirstObstacleBlocking_LineThroughTheGapOfAMultiPolygon_IsNone()
    {
        Assert.Null(Plan.FirstObstacleBlocking(new Vec3(45, 23, 1), new Vec3(60, 23, 1)));
    }

    [Fact]
    public void FirstObstacleBlocking_LineThroughOnePartOfAMultiPolygon_IsIt()
    {
        Assert.Equal("Hedge", Plan.FirstObstacleBlocking(new Vec3(45, 25, 1), new Vec3(60, 25, 1))?.Feature.Name);
    }

    [Fact]
    public void FirstObstacleBlocking_VerticalLineInsideTheWall_IsTheWall()
    {
        Assert.Equal("Garden wall", Plan.FirstObstacleBlocking(new Vec3(11, 0, 0.5), new Vec3(11, 0, 3))?.Feature.Name);
    }

    [Fact]
    public void IsBlocked_LineBesideEveryObstacle_IsFalse()
    {
        Assert.False(Plan.IsBlocked(new Vec3(0, 0, 1.08), new Vec3(0, 60, 1.08)));
    }

    [Theory]
    [InlineData(11, 0, "Garden wall")]
    [InlineData(35, 4, "Corner shop")]
    [InlineData(51, 25, "Hedge")]
    [InlineData(20, 0, null)]
    [InlineData(10, 0, null)]
    public void ObstacleContaining_PointInAFootprint_IsThatObstacle(double x, double y, string? name)
    {
        Assert.Equal(name, Plan.ObstacleContaining(x, y)?.Feature.Name);
    }

    [Fact]
    public void IsInsideAnyObstacle_PointBetweenObstacles_IsFalse()
    {
        Assert.False(Plan.IsInsideAnyObstacle(20, 0));
    }

    [Fact]
    public void FirstObstacleBlocking_RandomStarShapedObstacle_AgreesWithTheOverlayOfNetTopologySuite()
    {
        // Reference: NTS's own overlay clips the plan line to the footprint; each piece is checked at both ends.
        var star = Gen.Double[2, 10].Array[5, 12];
        var point = Gen.Select(Gen.Double[-15, 15], Gen.Double[-15, 15], Gen.Double[0, 4]);
        Gen.Select(star, point, point).Sample((radii, a, b) =>
        {
            var footprint = StarPolygon(radii);
            var plan = new SitePlan(PlanFrame.LocalMetres, [], [], [new Obstacle(footprint, 2, new FeatureReference(0))]);
            var from = new Vec3(a.Item1, a.Item2, a.Item3);
            var to = new Vec3(b.Item1, b.Item2, b.Item3);

            // A sightline that grazes the top, or starts or ends on the outline (within a nanometre), may go either way: both answers are right.
            // (The overlay itself may fail to node a line lying on the outline, so that case is settled first.)
            if (new[] { from, to }.Any(end => footprint.Boundary.Distance(Factory.CreatePoint(new Coordinate(end.X, end.Y))) < 1e-9))
            {
                return true;
            }

            var lowest = LowestOverFootprint(footprint, from, to);
            return Math.Abs(lowest - 2) < 1e-9 || plan.IsBlocked(from, to) == lowest < 2;
        });
    }

    /// <summary>The sightline's lowest height over the footprint (infinity where it does not cross it); linear in between, so at a piece's end.</summary>
    private static double LowestOverFootprint(Geometry footprint, Vec3 from, Vec3 to)
    {
        var segment = new LineSegment(from.X, from.Y, to.X, to.Y);
        var inside = footprint.Intersection(segment.ToGeometry(Factory));
        return Enumerable.Range(0, inside.NumGeometries)
            .Select(inside.GetGeometryN)
            .OfType<LineString>()
            .Where(piece => piece.Length > 0)
            .SelectMany(piece => new[] { piece.StartPoint.Coordinate, piece.EndPoint.Coordinate })
            .Select(end => from.Z + (segment.ProjectionFactor(end) * (to.Z - from.Z)))
            // A sightline too short for the overlay to return a piece (its ends a few femtometres apart) still starts or ends inside.
            .Concat(new[] { from, to }.Where(end => footprint.Covers(Factory.CreatePoint(new Coordinate(end.X, end.Y)))).Select(end => end.Z))
            .DefaultIfEmpty(double.PositiveInfinity)
            .Min();
    }

    /// <summary>A simple polygon: points at equal angles round the origin, at the given distances.</summary>
    private static Polygon StarPolygon(double[] radii)
    {
        var ring = radii.Select((r, i) => new Coordinate(r * Math.Cos(2 * Math.PI * i / radii.Length), r * Math.Sin(2 * Math.PI * i / radii.Length))).ToList();
        ring.Add(ring[0]);
        return Factory.CreatePolygon([.. ring]);
    }

    private static Polygon Box(double west, double south, double east, double north) =>
        Factory.CreatePolygon([new(west, south), new(east, south), new(east, north), new(west, north), new(west, south)]);
}
