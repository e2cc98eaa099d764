namespace SafetyMirror.Core.Tests.Site;

/// <summary>The WGS84 ellipsoid's radii of curvature, computed here independently of any projection library.</summary>
internal static class Wgs84Ellipsoid
{
    /// <summary>Semi-major axis (NIMA TR8350.2, 3rd ed. 2000, Table 3.1).</summary>
    public const double SemiMajorAxisM = 6_378_137;

    /// <summary>Flattening (NIMA TR8350.2, 3rd ed. 2000, Table 3.1: 1/f = 298.257223563).</summary>
    public const double Flattening = 1 / 298.257223563;

    private const double EccentricitySquared = Flattening * (2 - Flattening);

    /// <summary>Radius of curvature of the meridian, M = a(1 - e²) / (1 - e² sin²φ)^(3/2) (Snyder 1987, USGS PP 1395, eq. 4-18 [memory]).</summary>
    public static double MeridianRadiusM(double latitudeDeg) =>
        SemiMajorAxisM * (1 - EccentricitySquared) / Math.Pow(1 - (EccentricitySquared * SinSquared(latitudeDeg)), 1.5);

    /// <summary>Radius of the parallel, N cos φ with N = a / (1 - e² sin²φ)^(1/2) (Snyder 1987, eq. 4-20 [memory]).</summary>
    public static double ParallelRadiusM(double latitudeDeg) =>
        SemiMajorAxisM / Math.Sqrt(1 - (EccentricitySquared * SinSquared(latitudeDeg))) * Math.Cos(latitudeDeg * Math.PI / 180);

    private static double SinSquared(double latitudeDeg) => Math.Pow(Math.Sin(latitudeDeg * Math.PI / 180), 2);
}
