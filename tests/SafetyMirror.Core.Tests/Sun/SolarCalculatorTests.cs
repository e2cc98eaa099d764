using SafetyMirror.Core.Sun;

namespace SafetyMirror.Core.Tests.Sun;

public class SolarCalculatorTests
{
    /// <summary>Elevation tolerance away from the horizon, in degrees (NOAA states about 0.01°; the almanac formulae 0.01°).</summary>
    private const double ElevationToleranceDeg = 0.05;

    private static DateTimeOffset Utc(int year, int month, int day, int hour, int minute, int second = 0) =>
        new(year, month, day, hour, minute, second, TimeSpan.Zero);

    [Fact]
    public void At_NoaaSpreadsheetFirstRow_GivesItsDeclinationAndEquationOfTime()
    {
        // NOAA Solar Calculator spreadsheet (NOAA_Solar_Calculations_day), first row: latitude 40° N, longitude 105° W,
        // 2010-06-21 00:06 local at UTC−7 (Julian day 2455368.79583). Its row gives declination 23.4383706°, equation of time
        // −1.7153676 min, right ascension 89.8094801°, as transcribed from the sheet by a public validation script.
        var sun = SolarCalculator.At(Utc(2010, 6, 21, 7, 6), 40, -105);

        Assert.Equal(23.4383706, sun.DeclinationDeg, 1e-6);
        Assert.Equal(-1.7153676, sun.EquationOfTimeMin, 1e-6);
        Assert.Equal(89.8094801, sun.RightAscensionDeg, 1e-6);
    }

    [Fact]
    public void At_NoaaSpreadsheetFirstRow_GivesItsElevationRefractionAndAzimuth()
    {
        // Same row of the NOAA spreadsheet: geometric elevation −26.5537621°, refraction 0.0115457°, apparent elevation
        // −26.5422164°, azimuth 1.0986712° (as transcribed, see above).
        var sun = SolarCalculator.At(Utc(2010, 6, 21, 7, 6), 40, -105);

        Assert.Equal(-26.5537621, sun.GeometricElevationDeg, 1e-6);
        Assert.Equal(0.0115457, sun.RefractionDeg, 1e-6);
        Assert.Equal(-26.5422164, sun.ElevationDeg, 1e-6);
        Assert.Equal(1.0986712, sun.AzimuthDeg, 1e-6);
    }

    [Fact]
    public void At_MeeusExample25a_GivesTheBooksRightAscensionAndDeclination()
    {
        // Meeus, Astronomical Algorithms (2nd ed. 1998), example 25.a: 1992 October 13.0 TD, apparent right ascension
        // 198.38083° (13h13m31.4s) and declination −7.78507° (−7°47′06″) by the same low-accuracy method. UT stands in for TD
        // here (about a minute apart in 1992: under 0.001° of the sun's motion).
        var sun = SolarCalculator.At(Utc(1992, 10, 13, 0, 0), 0, 0);

        Assert.Equal(198.38083, sun.RightAscensionDeg, 0.002);
        Assert.Equal(-7.78507, sun.DeclinationDeg, 0.002);
    }

    [Fact]
    public void At_NrelSpaWorkedExample_GivesItsZenithAndAzimuth()
    {
        // Reda and Andreas, "Solar Position Algorithm for Solar Radiation Applications", NREL/TP-560-34302 (2008), Table A5.1:
        // 2003-10-17 12:30:30 at UTC−7, 39.742476° N, 105.1786° W: topocentric zenith 50.11162° (refraction at 820 mbar,
        // 11 °C), azimuth 194.34024°. NOAA's refraction at standard air differs from the table's by about 0.004° here.
        var sun = SolarCalculator.At(Utc(2003, 10, 17, 19, 30, 30), 39.742476, -105.1786);

        Assert.Equal(50.11162, 90 - sun.ElevationDeg, ElevationToleranceDeg);
        Assert.Equal(194.34024, sun.AzimuthDeg, ElevationToleranceDeg);
    }

    [Theory]
    [InlineData(51.48, 0.0, 2025, 3, 20, 9, 15)]       // mid northern latitude at the equinox, morning
    [InlineData(-33.87, 151.21, 2024, 12, 21, 22, 40)] // southern hemisphere near its summer solstice (local morning)
    [InlineData(64.15, -21.94, 2026, 6, 21, 23, 30)]   // subarctic midsummer night, sun low in the north
    [InlineData(1.29, 103.85, 2023, 9, 1, 5, 0)]       // near the equator, sun high
    [InlineData(-54.8, -68.3, 2027, 7, 15, 16, 10)]    // high southern latitude in winter
    public void At_AnyPlaceAndDate_AgreesWithTheAstronomicalAlmanacLowPrecisionFormulae(
        double latitudeDeg, double longitudeDeg, int year, int month, int day, int hour, int minute)
    {
        var instant = Utc(year, month, day, hour, minute);
        var sun = SolarCalculator.At(instant, latitudeDeg, longitudeDeg);
        var (elevation, azimuth) = AlmanacSun.At(instant, latitudeDeg, longitudeDeg);

        // The Astronomical Almanac, section C, low-precision formulas for the Sun (0.01°): see AlmanacSun.
        Assert.Equal(elevation, sun.GeometricElevationDeg, ElevationToleranceDeg);
        Assert.True(AngleApart(azimuth, sun.AzimuthDeg) * Math.Cos(elevation * Math.PI / 180) < ElevationToleranceDeg,
            $"azimuth {sun.AzimuthDeg}° against the almanac's {azimuth}° at elevation {elevation}°");
    }

    [Fact]
    public void At_SolarNoonAtTheJuneSolstice_StandsAtNinetyMinusLatitudePlusObliquity()
    {
        // At the June solstice the declination equals the obliquity, 23.44° (23°26′, The Astronomical Almanac [memory]);
        // at solar noon the elevation is 90° − φ + δ. 2024-06-20 20:51 UTC was the solstice (USNO Earth's seasons table
        // [memory]); at longitude 0, solar noon that day falls at 12:02 UTC (equation of time −1.7 min, as computed).
        var sun = SolarCalculator.At(Utc(2024, 6, 20, 12, 2), 50, 0);

        Assert.Equal(90 - 50 + 23.44, sun.GeometricElevationDeg, ElevationToleranceDeg);
        Assert.Equal(180, sun.AzimuthDeg, 0.5);
    }

    [Theory]
    [InlineData(90, 0)]       // NOAA: no refraction above 85°
    [InlineData(10, 0.0881)]  // NOAA series: 58.1/tan − 0.07/tan³ + 0.000086/tan⁵ arcsec at 10°: 317.2″ (computed by hand)
    [InlineData(0, 0.4819)]   // NOAA polynomial at 0°: 1735″ = 0.482° (the standard half degree at the horizon, Bennett 1982)
    public void Refraction_AtElevation_IsNoaasValue(double elevationDeg, double expectedDeg)
    {
        Assert.Equal(expectedDeg, SolarCalculator.Refraction(elevationDeg), 0.0005);
    }

    [Fact]
    public void At_LatitudeBeyondTheRange_Throws()
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => SolarCalculator.At(Utc(2025, 1, 1, 0, 0), 91, 0));
    }

    private static double AngleApart(double a, double b) => Math.Abs(((a - b + 540) % 360) - 180);
}
