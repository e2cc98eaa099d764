using NetTopologySuite.Geometries;
using SafetyMirror.Core.Site;

namespace SafetyMirror.Core.Tests.Site;

public class PlanFrameConvergenceTests
{
    [Fact]
    public void GridConvergenceDeg_UtmSiteEastOfTheCentralMeridian_IsTheTransverseMercatorSeriesValue()
    {
        // A site at 11.5° E, 50.31° N in UTM zone 32 (central meridian 9° E).
        var (x, y) = ReferenceUtm.FromWgs84(32, north: true).Transform(11.5, 50.31);
        var frame = PlanFrame.CentredOn(PlanCoordinateSystem.Utm(32, north: true), new Coordinate(x, y));

        // Convergence on the ellipsoid: γ = Δλ·sin φ·[1 + (Δλ²·cos²φ / 3)(1 + 3η² + 2η⁴)], η² = e′²·cos²φ (Snyder 1987,
        // USGS PP 1395, transverse Mercator, [memory]); e′² = e² / (1 − e²) from WGS84's flattening (NIMA TR8350.2).
        double lat = 50.31 * Math.PI / 180, dLon = 2.5 * Math.PI / 180;
        var e2 = Wgs84Ellipsoid.Flattening * (2 - Wgs84Ellipsoid.Flattening);
        var eta2 = e2 / (1 - e2) * Math.Pow(Math.Cos(lat), 2);
        var gamma = dLon * Math.Sin(lat) * (1 + (dLon * dLon * Math.Pow(Math.Cos(lat), 2) / 3 * (1 + (3 * eta2) + (2 * eta2 * eta2))));
        Assert.Equal(gamma * 180 / Math.PI, frame.GridConvergenceDeg!.Value, 1e-4);
    }

    [Fact]
    public void GridConvergenceDeg_UtmSiteWestOfTheCentralMeridianInTheSouth_IsPositive()
    {
        // West of the central meridian in the southern hemisphere grid north lies east of true north: γ = Δλ·sin φ > 0
        // (both negative), about 2° × sin 34° = 1.12° here (sphere formula, Snyder 1987 [memory]).
        var (x, y) = ReferenceUtm.FromWgs84(56, north: false).Transform(151, -34);
        var frame = PlanFrame.CentredOn(PlanCoordinateSystem.Utm(56, north: false), new Coordinate(x, y));

        Assert.Equal(Math.Atan(Math.Tan(-2 * Math.PI / 180) * Math.Sin(-34 * Math.PI / 180)) * 180 / Math.PI, frame.GridConvergenceDeg!.Value, 1e-3);
    }

    [Fact]
    public void GridConvergenceDeg_Wgs84Plan_IsZero()
    {
        var frame = PlanFrame.CentredOn(PlanCoordinateSystem.Wgs84, new Coordinate(9.87, 50.31));

        Assert.Equal(0, frame.GridConvergenceDeg);
    }

    [Fact]
    public void GridConvergenceDeg_LocalMetresPlan_IsNull()
    {
        Assert.Null(PlanFrame.LocalMetres.GridConvergenceDeg);
    }
}
