namespace SafetyMirror.District;

/// <summary>A corner's own metres (x along the main street, y across it to the far side) turned and placed in WGS84.</summary>
/// <remarks>
/// An equirectangular tangent plane at the corner's origin on the WGS84 ellipsoid (a degree of latitude is the meridian's
/// radius of curvature, a degree of longitude the prime vertical's times the cosine of the latitude): across a corner's
/// 300 m it is within a few millimetres of the transverse Mercator the service centres on the plan, and true north stays
/// north to a thousandth of a degree.
/// </remarks>
internal sealed class CornerFrame(double originLonDeg, double originLatDeg, int quarterTurns)
{
    private const double SemiMajorAxisM = 6_378_137; // WGS84 semi-major axis (NIMA TR8350.2 [memory])
    private const double EccentricitySquared = 0.00669437999014; // WGS84 first eccentricity squared (NIMA TR8350.2 [memory])

    private readonly double metresPerDegreeLat = MetresPerDegreeLat(originLatDeg);
    private readonly double metresPerDegreeLon = MetresPerDegreeLon(originLatDeg);

    /// <summary>Metres in a degree of latitude at a latitude: the meridian's radius of curvature, M = a(1 − e²) / (1 − e² sin² φ)^1.5.</summary>
    public static double MetresPerDegreeLat(double latDeg) =>
        SemiMajorAxisM * (1 - EccentricitySquared) / Math.Pow(1 - (EccentricitySquared * Square(Math.Sin(latDeg * Math.PI / 180))), 1.5) * Math.PI / 180;

    /// <summary>Metres in a degree of longitude at a latitude: the prime vertical's radius of curvature N = a / √(1 − e² sin² φ), times cos φ.</summary>
    public static double MetresPerDegreeLon(double latDeg)
    {
        var latRad = latDeg * Math.PI / 180;
        return SemiMajorAxisM / Math.Sqrt(1 - (EccentricitySquared * Square(Math.Sin(latRad)))) * Math.Cos(latRad) * Math.PI / 180;
    }

    /// <summary>A corner point as [longitude, latitude], rounded to 1e-7° (about a centimetre).</summary>
    public (double Lon, double Lat) ToLonLat(double x, double y)
    {
        var (east, north) = Turn(x, y);
        return (Math.Round(originLonDeg + (east / metresPerDegreeLon), 7), Math.Round(originLatDeg + (north / metresPerDegreeLat), 7));
    }

    /// <summary>The compass bearing (degrees clockwise from true north, 0 to 360) of a direction in corner metres.</summary>
    public double BearingDeg(double dx, double dy)
    {
        var (east, north) = Turn(dx, dy);
        var bearing = Math.Atan2(east, north) * 180 / Math.PI;
        return bearing < 0 ? bearing + 360 : bearing;
    }

    /// <summary>"eastbound", "northbound"…: the way traffic moving along a direction in corner metres heads.</summary>
    public string Bound(double dx, double dy) => Math.Round(BearingDeg(dx, dy) / 90) switch
    {
        1 => "eastbound",
        2 => "southbound",
        3 => "westbound",
        _ => "northbound",
    };

    private (double East, double North) Turn(double x, double y) => (quarterTurns % 4) switch
    {
        1 => (-y, x),
        2 => (-x, -y),
        3 => (y, -x),
        _ => (x, y),
    };

    private static double Square(double value) => value * value;
}
