using System.Collections.Immutable;
using SafetyMirror.Core.Site;

namespace SafetyMirror.Core.Design.Glare;

/// <summary>One stretch of a sampled day in which the sun dazzles, in the site's local time.</summary>
/// <param name="Start">First sampled instant of the stretch.</param>
/// <param name="End">The instant after its last sample (last sample plus one step).</param>
/// <param name="SunAzimuthDeg">The sun's azimuth from true north at the middle sample, in degrees.</param>
/// <param name="SunElevationDeg">The sun's apparent elevation at the middle sample, in degrees.</param>
public sealed record GlareWindow(DateTimeOffset Start, DateTimeOffset End, double SunAzimuthDeg, double SunElevationDeg)
{
    /// <summary>How long the stretch lasts, in minutes.</summary>
    public double Minutes => (End - Start).TotalMinutes;
}

/// <summary>When one kind of glare happens over the scanned year.</summary>
/// <param name="Windows">Every stretch found on the sampled days, in time order.</param>
/// <param name="HoursPerYear">Estimated hours in the year: each month's sampled hours scaled by its days over its sampled days, summed.</param>
/// <param name="HoursByMonth">The estimate per month, January first (12 values).</param>
/// <param name="WorstMonth">The month (1 to 12) with the most hours; null when there are none.</param>
public sealed record GlareTimes(ImmutableArray<GlareWindow> Windows, double HoursPerYear, ImmutableArray<double> HoursByMonth, int? WorstMonth);

/// <summary>The year's glare for one waiting driver's eye.</summary>
/// <param name="Eye">The eye point.</param>
/// <param name="InMirror">When the sun reflects from the face into the eye.</param>
/// <param name="BehindMirror">When the sun stands close behind the mirror as the driver looks at it.</param>
public sealed record EyeGlare(Eye Eye, GlareTimes InMirror, GlareTimes BehindMirror)
{
    /// <summary>Estimated hours a year of both kinds, summed (a sample of both kinds counts twice).</summary>
    public double HoursPerYear => InMirror.HoursPerYear + BehindMirror.HoursPerYear;

    /// <summary>Hours of either kind per month, January first (12 values).</summary>
    public ImmutableArray<double> HoursByMonth => [.. InMirror.HoursByMonth.Zip(BehindMirror.HoursByMonth, (a, b) => a + b)];

    /// <summary>The month (1 to 12) with the most hours of either kind; null when there are none.</summary>
    public int? WorstMonth => HoursByMonth.Max() > 0 ? HoursByMonth.IndexOf(HoursByMonth.Max()) + 1 : null;
}

/// <summary>A year's scan of sun glare at a mirror, or why it could not be made.</summary>
/// <param name="NotComputedReason">A sentence saying why there is no scan; null when there is one.</param>
/// <param name="Eyes">The glare per eye point of the plan (empty without a scan).</param>
/// <param name="Options">The sampling used.</param>
/// <param name="LatitudeDeg">Latitude of the site, degrees WGS84 (NaN without a scan).</param>
/// <param name="LongitudeDeg">Longitude of the site, degrees WGS84 (NaN without a scan).</param>
/// <param name="TimeZoneId">The clock the times are stated in: the plan's time zone, or "UTC" when it names none.</param>
/// <param name="GridConvergenceDeg">Angle from true north to the plan's grid north at the site (UTM), 0 for WGS84.</param>
/// <param name="SampledDays">How many days of the year were sampled.</param>
public sealed record GlareScan(
    string? NotComputedReason,
    ImmutableArray<EyeGlare> Eyes,
    GlareScanOptions Options,
    double LatitudeDeg,
    double LongitudeDeg,
    string TimeZoneId,
    double? GridConvergenceDeg,
    int SampledDays)
{
    /// <summary>True when the scan was made.</summary>
    public bool IsComputed => NotComputedReason is null;
}
