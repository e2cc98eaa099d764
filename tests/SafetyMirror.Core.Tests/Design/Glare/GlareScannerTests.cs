using SafetyMirror.Core.Design.Glare;
using SafetyMirror.Core.Site;
using SafetyMirror.Core.Tests.Design.Evaluation;
using static SafetyMirror.Core.Tests.Design.Glare.GlareCorner;

namespace SafetyMirror.Core.Tests.Design.Glare;

public class GlareScannerTests
{
    private static readonly TimeZoneInfo Berlin = TimeZoneInfo.FindSystemTimeZoneById("Europe/Berlin");

    // One scan shared by the tests that read it: a year of 5-minute samples on every 7th day.
    private static readonly Lazy<GlareScan> AimedScan = new(() =>
        GlareScanner.Scan(Plan(Berlin), AimedAt(SunAt(Afternoon)), new GlareScanOptions(2026)));

    [Fact]
    public void Scan_MirrorAimedAtTheSunOnASampledDay_HasAWindowHoldingThatInstant()
    {
        var windows = AimedScan.Value.Eyes.Single().InMirror.Windows;

        Assert.Contains(windows, w => w.Start <= Afternoon && Afternoon < w.End);
    }

    [Fact]
    public void Scan_PlanInBerlinTime_StatesWindowsInCentralEuropeanTime()
    {
        var window = AimedScan.Value.Eyes.Single().InMirror.Windows.Single(w => w.Start <= Afternoon && Afternoon < w.End);

        // 19 March is before the change to summer time (last Sunday of March, EU Directive 2000/84/EC): UTC+1.
        Assert.Equal(TimeSpan.FromHours(1), window.Start.Offset);
        Assert.Equal("Europe/Berlin", AimedScan.Value.TimeZoneId);
    }

    [Fact]
    public void Scan_AnyMonth_ScalesItsSampledHoursByItsDaysOverItsSampledDays()
    {
        var times = AimedScan.Value.Eyes.Single().InMirror;
        var marchMinutes = times.Windows.Where(w => w.Start.Month == 3).Sum(w => w.Minutes);

        // 2026 from 1 January every 7th day: 5, 12, 19 and 26 March sampled; March has 31 days.
        Assert.Equal(marchMinutes / 60 * 31 / 4, times.HoursByMonth[2], 1e-9);
        Assert.Equal(times.HoursByMonth.Sum(), times.HoursPerYear, 1e-9);
    }

    [Fact]
    public void Scan_MirrorAimedAtTheSunInMarch_HasItsWorstMonthWhereTheSunPassesThatPlace()
    {
        var worst = AimedScan.Value.Eyes.Single().InMirror.WorstMonth;

        // The sun stands at the same azimuth and elevation again when its declination repeats: near the equinoxes, so in
        // March/April or September/October (the sun's declination is symmetric about the solstices, any almanac).
        Assert.Contains(worst!.Value, new[] { 2, 3, 4, 9, 10 });
    }

    [Fact]
    public void Scan_PlanWithoutTimeZone_StatesTimesInUtc()
    {
        var scan = GlareScanner.Scan(Plan(), AimedAt(SunAt(Afternoon)), new GlareScanOptions(2026) { DayStride = 28 });

        Assert.Equal("UTC", scan.TimeZoneId);
        Assert.All(scan.Eyes.Single().InMirror.Windows, w => Assert.Equal(TimeSpan.Zero, w.Start.Offset));
    }

    [Fact]
    public void Scan_PlanInLocalMetres_SaysWhyThereIsNoScan()
    {
        var plan = Corners.Plan(Corners.FromWest());

        var scan = GlareScanner.Scan(plan, AimedAt(SunAt(Afternoon)), new GlareScanOptions(2026));

        Assert.False(scan.IsComputed);
        Assert.Equal(GlareScanner.LocalPlanReason, scan.NotComputedReason);
        Assert.Empty(scan.Eyes);
    }

    [Fact]
    public void Scan_FaceSendingTheEyesRaysToTheGround_HasNoGlareInTheMirror()
    {
        // A face looking back at the eye (azimuth 200°) tilted down 30° reflects the eye's rising rays some 45° below the
        // horizon (law of reflection, by hand: r = d − 2(d·n)n): no sun can stand there.
        var mirror = SafetyMirror.Core.Optics.ConvexMirror.Aimed(Vertex, 200, 30, 3, new SafetyMirror.Core.Optics.RoundAperture(0.6));

        var scan = GlareScanner.Scan(Plan(Berlin), mirror, new GlareScanOptions(2026) { DayStride = 28 });

        Assert.Empty(scan.Eyes.Single().InMirror.Windows);
        Assert.Null(scan.Eyes.Single().InMirror.WorstMonth);
    }

    [Fact]
    public void Scan_OptionOutOfRange_Throws()
    {
        Assert.Throws<ArgumentOutOfRangeException>(() =>
            GlareScanner.Scan(Plan(), AimedAt(SunAt(Afternoon)), new GlareScanOptions(2026) { DayStride = 29 }));
    }
}

public class GlareScannerSkippingTests
{
    [Fact]
    public void Scan_SteppingOverClearSamples_FindsEverySampleThatGlaresWhenEachIsTested()
    {
        // A wide face (R 2.2 m, 600 mm) looking back at the driver and up 2°, which catches the afternoon sun for weeks.
        var mirror = SafetyMirror.Core.Optics.ConvexMirror.Aimed(GlareCorner.Vertex, 215, -2, 2.2, new SafetyMirror.Core.Optics.RoundAperture(0.6));
        var plan = GlareCorner.Plan();
        var options = new GlareScanOptions(2026) { DayStride = 14, StepMinutes = 10 };
        var glare = new SunGlare(plan, mirror, GlareCorner.Eye, options.BehindMirrorAngleDeg);

        var scan = GlareScanner.Scan(plan, mirror, options).Eyes.Single();

        // Every sample of every sampled day, each tested: the same instants must glare.
        var days = Enumerable.Range(0, 27).Select(k => new DateTimeOffset(2026, 1, 1, 0, 0, 0, TimeSpan.Zero).AddDays(14 * k)).Where(d => d.Year == 2026);
        var samples = days.SelectMany(d => Enumerable.Range(0, 144).Select(i => d.AddMinutes(10 * i))).ToList();
        var sun = samples.ToDictionary(s => s, s => SafetyMirror.Core.Sun.SolarCalculator.At(s, GlareCorner.LatitudeDeg, GlareCorner.LongitudeDeg));
        var inMirror = samples.Where(s => sun[s].IsAboveHorizon && glare.GlintPoint(sun[s].Direction) is not null).ToList();
        var behind = samples.Where(s => sun[s].IsAboveHorizon && glare.IsBehindMirror(sun[s].Direction)).ToList();

        Assert.NotEmpty(inMirror);
        Assert.Equal(inMirror, samples.Where(s => scan.InMirror.Windows.Any(w => w.Start <= s && s < w.End)));
        Assert.Equal(behind, samples.Where(s => scan.BehindMirror.Windows.Any(w => w.Start <= s && s < w.End)));
    }
}

public class GlareScannerFramesTests
{
    [Fact]
    public void Scan_SameCornerInUtm_GivesTheSameWindowsAsInWgs84()
    {
        // A UTM plan goes through longitude/latitude to the same local frame, whose y axis is true north at the site: the grid
        // convergence (here about 0.7°, zone 32's central meridian 9° E) must not turn the sun.
        var (x, y) = SafetyMirror.Core.Tests.Site.ReferenceUtm.FromWgs84(32, north: true).Transform(GlareCorner.LongitudeDeg, GlareCorner.LatitudeDeg);
        var utm = PlanFrame.CentredOn(PlanCoordinateSystem.Utm(32, north: true), new NetTopologySuite.Geometries.Coordinate(x, y));
        var wgs84 = GlareCorner.Plan();
        var mirror = GlareCorner.AimedAt(GlareCorner.SunAt(GlareCorner.Afternoon));
        var options = new GlareScanOptions(2026) { DayStride = 14 };

        var fromUtm = GlareScanner.Scan(new SitePlan(utm, wgs84.Eyes, wgs84.Approaches), mirror, options);
        var fromWgs84 = GlareScanner.Scan(wgs84, mirror, options);

        // The site's longitude/latitude comes back from UTM to about 1e-12°: the same windows, the sun's angles to 1e-9°.
        Assert.Equal(
            fromWgs84.Eyes.Single().InMirror.Windows.Select(w => (w.Start, w.End, Math.Round(w.SunAzimuthDeg, 9), Math.Round(w.SunElevationDeg, 9))),
            fromUtm.Eyes.Single().InMirror.Windows.Select(w => (w.Start, w.End, Math.Round(w.SunAzimuthDeg, 9), Math.Round(w.SunElevationDeg, 9))));
        Assert.True(fromUtm.GridConvergenceDeg > 0.5, $"convergence {fromUtm.GridConvergenceDeg}°");
    }

    [Fact]
    public void Scan_WindowInSummer_IsStatedInSummerTime()
    {
        // The same sun direction returns near the September equinox, after the change to summer time (EU Directive
        // 2000/84/EC: last Sunday of March to last Sunday of October, UTC+2 in Central Europe).
        var plan = GlareCorner.Plan(TimeZoneInfo.FindSystemTimeZoneById("Europe/Berlin"));
        var scan = GlareScanner.Scan(plan, GlareCorner.AimedAt(GlareCorner.SunAt(GlareCorner.Afternoon)), new GlareScanOptions(2026));

        var summer = scan.Eyes.Single().InMirror.Windows.Where(w => w.Start.Month is >= 4 and <= 10).ToList();

        Assert.NotEmpty(summer);
        Assert.All(summer, w => Assert.Equal(TimeSpan.FromHours(2), w.Start.Offset));
    }
}
