using CsCheck;
using NetTopologySuite.Geometries;
using SafetyMirror.Core.Site;

namespace SafetyMirror.Core.Tests.Site;

public class PlanFrameTests
{
    private static readonly GeometryFactory Factory = new();

    [Fact]
    public void ToLocal_PointsAThousandthOfADegreeOfLatitudeApart_AreThePublishedMeridianArcApart()
    {
        var (south, north) = LocalPair(new(12, 45), new(12, 45.001));

        // Length of a degree of latitude at 45°, WGS84: 111.132 km (published table of degree lengths [memory]).
        Assert.Equal(111.132, south.Distance(north), 0.001);
    }

    [Fact]
    public void ToLocal_PointsAThousandthOfADegreeOfLatitudeApart_AreTheComputedMeridianArcApart()
    {
        var (south, north) = LocalPair(new(9.87, 50.31), new(9.87, 50.311));

        // Meridian arc from WGS84's defining constants: M at the mid latitude times the angle (third-order terms < 1e-12 m).
        var expected = Wgs84Ellipsoid.MeridianRadiusM(50.3105) * 0.001 * Math.PI / 180;
        Assert.Equal(expected, south.Distance(north), 1e-6);
    }

    [Fact]
    public void ToLocal_PointsAThousandthOfADegreeOfLongitudeApart_AreTheParallelArcApart()
    {
        var (west, east) = LocalPair(new(12, 45), new(12.001, 45));

        // Length of a degree of longitude at 45°, WGS84: 78.847 km (published table of degree lengths [memory]).
        Assert.Equal(78.847, west.Distance(east), 0.001);
        Assert.Equal(Wgs84Ellipsoid.ParallelRadiusM(45) * 0.001 * Math.PI / 180, west.Distance(east), 1e-6);
    }

    [Fact]
    public void ToLocal_PointDueNorthOfTheCentre_LiesOnTheLocalYAxis()
    {
        var frame = PlanFrame.CentredOn(PlanCoordinateSystem.Wgs84, new Coordinate(-71.06, 42.36));

        var north = frame.ToLocal(new Coordinate(-71.06, 42.364));

        Assert.Equal(0, north.X, 1e-9);
        Assert.True(north.Y > 400);
    }

    [Fact]
    public void ToLocal_SiteCentre_IsTheOrigin()
    {
        var frame = PlanFrame.CentredOn(PlanCoordinateSystem.Wgs84, new Coordinate(174.77, -41.29));

        var centre = frame.ToLocal(new Coordinate(174.77, -41.29));

        Assert.Equal((0, 0), (Math.Round(centre.X, 9), Math.Round(centre.Y, 9)));
    }

    [Fact]
    public void ToPlan_OfToLocal_ReturnsTheWgs84PointToANanodegree()
    {
        Gen.Select(Gen.Double[-179, 179], Gen.Double[-80, 80], Gen.Double[-0.005, 0.005], Gen.Double[-0.005, 0.005])
            .Sample((lon, lat, dLon, dLat) =>
            {
                var frame = PlanFrame.CentredOn(PlanCoordinateSystem.Wgs84, new Coordinate(lon, lat));
                var point = new Coordinate(lon + dLon, lat + dLat);

                var back = frame.ToPlan(frame.ToLocal(point));

                return Math.Abs(back.X - point.X) < 1e-9 && Math.Abs(back.Y - point.Y) < 1e-9;
            });
    }

    [Fact]
    public void ToPlan_OfToLocal_ReturnsTheWgs84GeometryToANanodegree()
    {
        var frame = PlanFrame.CentredOn(PlanCoordinateSystem.Wgs84, new Coordinate(-3.19, 55.95));
        var polygon = Factory.CreatePolygon([new(-3.19, 55.95), new(-3.188, 55.95), new(-3.188, 55.951), new(-3.19, 55.95)]);

        var back = frame.ToPlan(frame.ToLocal(polygon));

        Assert.True(back.EqualsExact(polygon, 1e-9), back.ToString());
    }

    [Theory]
    [InlineData(33, true, 16.37, 48.21)]
    [InlineData(56, false, 151.21, -33.87)]
    [InlineData(32, true, 9.87, 50.31)]
    public void ToLocal_UtmPlan_GivesTheSameLocalPointsAsTheSamePlanInWgs84(int zone, bool north, double lon, double lat)
    {
        // The site's points in UTM, from ProjNET's own built-in UTM definition (a general-purpose reference library).
        var toUtm = ReferenceUtm.FromWgs84(zone, north);
        Coordinate[] lonLat = [new(lon, lat), new(lon + 0.004, lat + 0.001), new(lon - 0.003, lat - 0.002), new(lon + 0.001, lat - 0.004)];
        var utm = lonLat.Select(p => toUtm.Transform(p.X, p.Y)).Select(p => new Coordinate(p.x, p.y)).ToArray();
        var wgs84Frame = PlanFrame.CentredOn(PlanCoordinateSystem.Wgs84, Mean(lonLat));
        var utmFrame = PlanFrame.CentredOn(PlanCoordinateSystem.Utm(zone, north), Mean(utm));

        var fromWgs84 = lonLat.Select(wgs84Frame.ToLocal).ToArray();
        var fromUtm = utm.Select(utmFrame.ToLocal).ToArray();

        Assert.All(fromWgs84.Zip(fromUtm), pair => Assert.True(pair.First.Distance(pair.Second) < 0.01, $"{pair.First} against {pair.Second}"));
    }

    [Fact]
    public void ToPlan_OfToLocal_ReturnsTheUtmPointToAMicrometre()
    {
        var frame = PlanFrame.CentredOn(PlanCoordinateSystem.Utm(33, north: true), new Coordinate(601_234.5, 5_340_678.9));
        var point = new Coordinate(601_300.25, 5_340_512.75);

        var back = frame.ToPlan(frame.ToLocal(point));

        Assert.True(back.Distance(point) < 1e-6, back.ToString());
    }

    [Fact]
    public void ToLocal_UtmPlan_IsInTrueNorthNotGridNorth()
    {
        // Easting 601 km at 48.2°N is Δλ ≈ 101 km / (0.9996 · 74.34 km per degree) ≈ 1.359° east of zone 33's central
        // meridian, where grid north lies east of true north by the convergence γ ≈ Δλ·sin φ ≈ 1.013° (first term of
        // the transverse Mercator convergence series, Snyder 1987, USGS PP 1395, §8 [memory]).
        var frame = PlanFrame.CentredOn(PlanCoordinateSystem.Utm(33, north: true), new Coordinate(601_000, 5_340_000));

        var south = frame.ToLocal(new Coordinate(601_000, 5_340_000));
        var gridNorth = frame.ToLocal(new Coordinate(601_000, 5_340_500));

        var turnDeg = Math.Atan2(gridNorth.X - south.X, gridNorth.Y - south.Y) * 180 / Math.PI;
        Assert.Equal(1.013, turnDeg, 0.002);
    }

    [Fact]
    public void LocalMetres_UsesCoordinatesAsTheyAre()
    {
        var frame = PlanFrame.CentredOn(PlanCoordinateSystem.LocalMetres, new Coordinate(500, 500));

        Assert.Equal((new Coordinate(12.5, -3.25), new Coordinate(7, 8)), (frame.ToLocal(new Coordinate(12.5, -3.25)), frame.ToPlan(new Coordinate(7, 8))));
    }

    private static (Coordinate A, Coordinate B) LocalPair(Coordinate a, Coordinate b)
    {
        var frame = PlanFrame.CentredOn(PlanCoordinateSystem.Wgs84, Mean([a, b]));
        return (frame.ToLocal(a), frame.ToLocal(b));
    }

    private static Coordinate Mean(Coordinate[] points) => new(points.Average(p => p.X), points.Average(p => p.Y));
}
