namespace SafetyMirror.Core.Tests.Sun;

/// <summary>The sun's place by the Astronomical Almanac's low-precision formulae, an independent published algorithm.</summary>
/// <remarks>
/// The Astronomical Almanac, section C, "Low precision formulas for the Sun" (mean longitude and anomaly as linear functions
/// of the day, a two-term equation of the centre, a linear obliquity; 0.01° from 1950 to 2050), with the hour angle from
/// Greenwich mean sidereal time GMST = 18.697374558 h + 24.06570982441908 h·D (US Naval Observatory, "Computing Greenwich
/// Apparent Sidereal Time", its low-precision form). It shares no step with NOAA's series (no equation of time, sidereal time
/// in its place), so agreement to a few hundredths of a degree checks both.
/// </remarks>
internal static class AlmanacSun
{
    /// <summary>Geometric elevation and azimuth (from true north, clockwise), in degrees, without refraction.</summary>
    public static (double ElevationDeg, double AzimuthDeg) At(DateTimeOffset instant, double latitudeDeg, double longitudeDeg)
    {
        var n = ((instant.UtcDateTime - DateTime.UnixEpoch).Ticks / (double)TimeSpan.TicksPerDay) + 2_440_587.5 - 2_451_545;
        var meanLongitude = 280.460 + (0.9856474 * n);
        var anomaly = Rad(357.528 + (0.9856003 * n));
        var longitude = Rad(meanLongitude + (1.915 * Math.Sin(anomaly)) + (0.020 * Math.Sin(2 * anomaly)));
        var obliquity = Rad(23.439 - (0.0000004 * n));
        var rightAscension = Math.Atan2(Math.Cos(obliquity) * Math.Sin(longitude), Math.Cos(longitude));
        var declination = Math.Asin(Math.Sin(obliquity) * Math.Sin(longitude));
        var siderealHours = 18.697374558 + (24.06570982441908 * n);
        var hourAngle = Rad(siderealHours * 15) + Rad(longitudeDeg) - rightAscension;
        var latitude = Rad(latitudeDeg);
        var elevation = Math.Asin((Math.Sin(latitude) * Math.Sin(declination)) + (Math.Cos(latitude) * Math.Cos(declination) * Math.Cos(hourAngle)));
        var azimuth = Math.Atan2(
            -Math.Sin(hourAngle) * Math.Cos(declination),
            (Math.Sin(declination) * Math.Cos(latitude)) - (Math.Cos(declination) * Math.Cos(hourAngle) * Math.Sin(latitude)));
        return (Deg(elevation), ((Deg(azimuth) % 360) + 360) % 360);
    }

    private static double Rad(double degrees) => degrees * Math.PI / 180;

    private static double Deg(double radians) => radians * 180 / Math.PI;
}
