namespace SafetyMirror.District;

/// <summary>A corner's own metres (x along the main street, y across it to the far side) turned and placed in WGS84.</summary>
/// <remarks>
/// An equirectangular tangent plane at the corner's origin: across a corner's 300 m it is within a few millimetres of
/// the transverse Mercator the service centres on the plan, and true north stays north to a thousandth of a degree.
/// </remarks>
internal sealed class CornerFrame(double originLonDeg, double originLatDeg, int quarterTurns)
{
    /// <summary>Metres per degree of latitude on the sphere of the mean Earth radius (IUGG, 6,371,008.8 m).</summary>
    public const double MetresPerDegree = 6_371_008.8 * Math.PI / 180;

    private readonly double metresPerDegreeLon = MetresPerDegree * Math.Cos(originLatDeg * Math.PI / 180);

    /// <summary>A corner point as [longitude, latitude], rounded to 1e-7° (about a centimetre).</summary>
    public (double Lon, double Lat) ToLonLat(double x, double y)
    {
        var (east, north) = Turn(x, y);
        return (Math.Round(originLonDeg + (east / metresPerDegreeLon), 7), Math.Round(originLatDeg + (north / MetresPerDegree), 7));
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
}
