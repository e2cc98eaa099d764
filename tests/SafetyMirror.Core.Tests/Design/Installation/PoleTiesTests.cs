using SafetyMirror.Core.Design.Installation;
using SafetyMirror.Core.Optics;
using SafetyMirror.Core.Site;
using SafetyMirror.Core.Tests.Design.Evaluation;

namespace SafetyMirror.Core.Tests.Design.Installation;

public class PoleTiesTests
{
    // A 6 m street along y = 0 to 6 and a house whose nearest corner is at (−2, −1); invented.
    private static readonly SitePlan Street = new(
        PlanFrame.LocalMetres,
        [new Eye(Corners.Eye, new FeatureReference(0, "driver"))],
        [Corners.FromWest()],
        [new Obstacle(Corners.Box(-30, -20, -2, -1), 6, new FeatureReference(3, "house", "Corner house"))],
        carriageways: [new Carriageway(Corners.Box(-50, 0, 50, 6), new FeatureReference(4, "street", "Street"))]);

    [Fact]
    public void Of_PoleBehindTheNorthKerb_IsSquareToTheKerbOnItsNorthSide()
    {
        var kerb = PoleTies.Of(Street, 6, 7.5).Kerb!;

        // Hand computation: the nearest edge is y = 6, its foot (6, 6); the pole is 1.5 m north of it, off the carriageway.
        Assert.Equal("street", kerb.Carriageway.Id);
        Assert.Equal(1.5, kerb.OffsetM, 9);
        Assert.Equal(0, kerb.BearingDeg, 9);
        Assert.False(kerb.OnCarriageway);
        Assert.Equal(6, kerb.EdgeXM, 9);
        Assert.Equal(6, kerb.EdgeYM, 9);
    }

    [Fact]
    public void Of_PoleOnTheCarriageway_IsMeasuredInFromTheEdge()
    {
        var kerb = PoleTies.Of(Street, 6, 5).Kerb!;

        // Hand computation: 1 m in from the edge y = 6, the pole south of the foot (6, 6).
        Assert.True(kerb.OnCarriageway);
        Assert.Equal(1, kerb.OffsetM, 9);
        Assert.Equal(180, kerb.BearingDeg, 9);
    }

    [Fact]
    public void Of_PoleAcrossTheStreet_IsTiedToTheNearestHouseCorner()
    {
        var corner = PoleTies.Of(Street, 6, 7.5).Corner!;

        // Hand computation: from (−2, −1) to (6, 7.5) is (8, 8.5): √136.25 = 11.6726 m, bearing atan2(8, 8.5) = 43.264°.
        Assert.Equal("house", corner.Obstacle.Id);
        Assert.Equal((-2.0, -1.0), (corner.CornerXM, corner.CornerYM));
        Assert.Equal(11.6726, corner.DistanceM, 4);
        Assert.Equal(43.264, corner.BearingDeg, 3);
    }

    [Fact]
    public void Of_PlanWithoutCarriagewayOrObstacle_HasNoTies()
    {
        var ties = PoleTies.Of(Corners.Plan(Corners.FromWest()), 6, 7.5);

        Assert.Null(ties.Kerb);
        Assert.Null(ties.Corner);
    }

    [Theory]
    [InlineData(0, "north")]
    [InlineData(44, "north-east")]
    [InlineData(181, "south")]
    [InlineData(338, "north")]
    [InlineData(337, "north-west")]
    public void CompassPoint_Bearing_IsTheNearestOfEight(double bearingDeg, string expected)
    {
        // The eight compass points, 45° apart (common practice).
        Assert.Equal(expected, PoleTies.CompassPoint(bearingDeg));
    }
}
