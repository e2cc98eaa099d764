using NetTopologySuite.Geometries;
using SafetyMirror.Core.Optics;
using SafetyMirror.Core.Site;

namespace SafetyMirror.Core.Tests.Site;

public class ApproachTests
{
    // A bent approach drawn in the direction of travel: 20 m south from (0, 30) to (0, 10), then 15 m along a
    // 3-4-5 direction to the conflict point (12, 19). Expected points are worked by hand.
    private static readonly Approach Bent = new(
        new GeometryFactory().CreateLineString([new(0, 30), new(0, 10), new(12, 19)]),
        speedKmh: 40,
        gradePercent: 0,
        new FeatureReference(1));

    [Fact]
    public void LengthM_IsTheLengthAlongTheBends()
    {
        Assert.Equal(35, Bent.LengthM, 12);
    }

    [Fact]
    public void ConflictPoint_IsTheLastPointOfTheLine()
    {
        Assert.Equal(new Vec3(12, 19, 0), Bent.ConflictPoint);
    }

    [Theory]
    [InlineData(0, 12, 19, 0.8, 0.6)]
    [InlineData(7.5, 6, 14.5, 0.8, 0.6)]
    [InlineData(25, 0, 20, 0, -1)]
    [InlineData(35, 0, 30, 0, -1)]
    public void PointAtStation_GivesThePointUpstreamOfTheConflictPointAndTheWayOfTravel(double stationM, double x, double y, double dx, double dy)
    {
        var point = Bent.PointAtStation(stationM);

        AssertClose(new Vec3(x, y, 0), point.Position);
        AssertClose(new Vec3(dx, dy, 0), point.Direction);
        Assert.Equal(stationM, point.StationM);
    }

    [Fact]
    public void PointAtStation_AtTheBend_FacesAlongTheSegmentLeavingIt()
    {
        var point = Bent.PointAtStation(15);

        AssertClose(new Vec3(0, 10, 0), point.Position);
        AssertClose(new Vec3(0.8, 0.6, 0), point.Direction);
    }

    [Theory]
    [InlineData(-0.01)]
    [InlineData(35.01)]
    [InlineData(double.NaN)]
    public void PointAtStation_OffTheLine_Throws(double stationM)
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => Bent.PointAtStation(stationM));
    }

    [Fact]
    public void Constructor_RepeatedPoint_Throws()
    {
        var line = new GeometryFactory().CreateLineString([new(0, 30), new(0, 10), new(0, 10), new(12, 19)]);

        Assert.Throws<ArgumentException>(() => new Approach(line, 40, 0, new FeatureReference(1)));
    }

    private static void AssertClose(Vec3 expected, Vec3 actual) =>
        Assert.True(Vec3.Distance(expected, actual) < 1e-12, $"expected {expected}, got {actual}");
}
