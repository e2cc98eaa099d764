namespace SafetyMirror.Core.Sun;

/// <summary>The sun's position by the NOAA Solar Calculator's equations (after Meeus, <i>Astronomical Algorithms</i>).</summary>
/// <remarks>
/// The column formulas of NOAA's solar calculation spreadsheets: the sun's geometric mean longitude and anomaly, the
/// equation of the centre, the apparent longitude with the nutation and aberration term, the corrected obliquity, the
/// declination and the equation of time, then the hour angle from true solar time. NOAA states about 0.01° for dates within
/// a few centuries of 2000. Time is UTC and stands in for terrestrial time (their difference, about a minute, moves the sun
/// by less than 0.001°). The refraction is NOAA's: Bennett-like series above 5°, a polynomial from 5° to −0.575°, and a
/// small term below; it assumes standard pressure and temperature. The azimuth is the spreadsheet's angle written with
/// atan2, which agrees with its acos form and stays defined with the sun at the zenith or the place at a pole.
/// </remarks>
public static class SolarCalculator
{
    private const double JulianDayOfUnixEpoch = 2_440_587.5;
    private const double JulianDayOfJ2000 = 2_451_545;

    /// <summary>The sun's position seen from a latitude and longitude (degrees, WGS84, east and north positive) at an instant.</summary>
    /// <exception cref="ArgumentOutOfRangeException">A latitude outside −90 to 90 or a longitude outside −180 to 180.</exception>
    public static SunPosition At(DateTimeOffset instant, double latitudeDeg, double longitudeDeg)
    {
        Preconditions.InRange(latitudeDeg, -90, 90, "degrees");
        Preconditions.InRange(longitudeDeg, -180, 180, "degrees");
        var utc = instant.UtcDateTime;
        var julianDay = ((utc - DateTime.UnixEpoch).Ticks / (double)TimeSpan.TicksPerDay) + JulianDayOfUnixEpoch;
        var t = (julianDay - JulianDayOfJ2000) / 36525; // Julian centuries since J2000.0

        var meanLongitude = Modulo(280.46646 + (t * (36000.76983 + (t * 0.0003032))), 360);
        var meanAnomaly = 357.52911 + (t * (35999.05029 - (0.0001537 * t)));
        var eccentricity = 0.016708634 - (t * (0.000042037 + (0.0000001267 * t)));
        var centre = (Sin(meanAnomaly) * (1.914602 - (t * (0.004817 + (0.000014 * t)))))
            + (Sin(2 * meanAnomaly) * (0.019993 - (0.000101 * t)))
            + (Sin(3 * meanAnomaly) * 0.000289);
        var trueLongitude = meanLongitude + centre;
        var node = 125.04 - (1934.136 * t);
        var apparentLongitude = trueLongitude - 0.00569 - (0.00478 * Sin(node));
        var meanObliquity = 23 + ((26 + ((21.448 - (t * (46.815 + (t * (0.00059 - (t * 0.001813)))))) / 60)) / 60);
        var obliquity = meanObliquity + (0.00256 * Cos(node));
        var rightAscension = Modulo(Degrees(Math.Atan2(Cos(obliquity) * Sin(apparentLongitude), Cos(apparentLongitude))), 360);
        var declination = Degrees(Math.Asin(Sin(obliquity) * Sin(apparentLongitude)));

        var y = Math.Pow(Math.Tan(Radians(obliquity / 2)), 2);
        var equationOfTime = 4 * Degrees(
            (y * Sin(2 * meanLongitude))
            - (2 * eccentricity * Sin(meanAnomaly))
            + (4 * eccentricity * y * Sin(meanAnomaly) * Cos(2 * meanLongitude))
            - (0.5 * y * y * Sin(4 * meanLongitude))
            - (1.25 * eccentricity * eccentricity * Sin(2 * meanAnomaly)));

        var minutesOfDay = utc.TimeOfDay.Ticks / (double)TimeSpan.TicksPerMinute;
        var trueSolarTime = Modulo(minutesOfDay + equationOfTime + (4 * longitudeDeg), 1440);
        var hourAngle = (trueSolarTime / 4) - 180;

        var cosZenith = (Sin(latitudeDeg) * Sin(declination)) + (Cos(latitudeDeg) * Cos(declination) * Cos(hourAngle));
        var geometricElevation = 90 - Degrees(Math.Acos(Math.Clamp(cosZenith, -1, 1)));
        var azimuth = Modulo(180 + Degrees(Math.Atan2(
            Sin(hourAngle),
            (Cos(hourAngle) * Sin(latitudeDeg)) - (Math.Tan(Radians(declination)) * Cos(latitudeDeg)))), 360);
        var refraction = Refraction(geometricElevation);
        return new SunPosition(azimuth, geometricElevation + refraction, geometricElevation, refraction, declination, rightAscension, equationOfTime, hourAngle);
    }

    /// <summary>NOAA's approximate atmospheric refraction, in degrees, for a geometric elevation in degrees.</summary>
    public static double Refraction(double geometricElevationDeg)
    {
        var e = geometricElevationDeg;
        if (e > 85)
        {
            return 0;
        }

        var tan = Math.Tan(Radians(e));
        var arcseconds = e switch
        {
            > 5 => (58.1 / tan) - (0.07 / Math.Pow(tan, 3)) + (0.000086 / Math.Pow(tan, 5)),
            > -0.575 => 1735 + (e * (-518.2 + (e * (103.4 + (e * (-12.79 + (e * 0.711))))))),
            _ => -20.772 / tan,
        };
        return arcseconds / 3600;
    }

    private static double Radians(double degrees) => degrees * Math.PI / 180;

    private static double Degrees(double radians) => radians * 180 / Math.PI;

    private static double Sin(double degrees) => Math.Sin(Radians(degrees));

    private static double Cos(double degrees) => Math.Cos(Radians(degrees));

    private static double Modulo(double value, double period) => ((value % period) + period) % period;
}
