using System.Collections.Immutable;
using SafetyMirror.Core.Optics;
using SafetyMirror.Core.Site;
using SafetyMirror.Core.Sun;

namespace SafetyMirror.Core.Design.Glare;

/// <summary>Scans a year for the times the low sun dazzles the waiting driver by way of a mirror, or from behind it.</summary>
/// <remarks>
/// Every <see cref="GlareScanOptions.DayStride"/>-th day from 1 January, from local midnight to the next, every
/// <see cref="GlareScanOptions.StepMinutes"/> minutes: the sun's position (NOAA's equations, at the site centre), then for
/// each eye the quick test against the face's reflected directions and, for candidates only, the exact reflection and the
/// obstacle checks (<see cref="SunGlare"/>). Samples the sun cannot reach a glaring direction by (below the horizon or far
/// from both cones, at its greatest speed across the sky) are stepped over: they could not glare, so the answer is the
/// same as sampling them. A sample that glares stands for one step. A month's hours are its sampled hours
/// times its days over its sampled days; the year's are the months' sum. The plan's local metres have their y axis on true
/// north at the site, so the sun's direction enters them unrotated.
/// </remarks>
public static class GlareScanner
{
    /// <summary>The most the sun's apparent direction moves in a minute, in degrees: 15.04°/h of hour angle times cos δ
    /// (at most 0.251°/min), with a fifth more for the refraction's change near the horizon (NOAA's polynomial changes by
    /// at most 0.15° per degree of elevation).</summary>
    private const double MaxSunMotionDegPerMinute = 0.3;

    private const int MinutesPerDay = 1440;

    /// <summary>The sentence given when the plan is drawn in local metres.</summary>
    public const string LocalPlanReason =
        "The plan is drawn in local metres, with no place on the earth and no true north, so the sun cannot be set on it: " +
        "give the plan in WGS84 longitude/latitude or a UTM zone for the glare hours.";

    /// <summary>The year's glare for each eye of the plan at the given mirror (in the plan's local metres).</summary>
    /// <param name="plan">The corner; georeferenced for a scan (a plan in local metres gets the reason why not).</param>
    /// <param name="mirror">The mirror in the plan's local metres.</param>
    /// <param name="options">The sampling.</param>
    /// <param name="cancellationToken">Stops the work between sampled days.</param>
    /// <exception cref="ArgumentOutOfRangeException">An option out of its range.</exception>
    public static GlareScan Scan(SitePlan plan, ConvexMirror mirror, GlareScanOptions options, CancellationToken cancellationToken = default)
    {
        ArgumentNullException.ThrowIfNull(plan);
        ArgumentNullException.ThrowIfNull(mirror);
        ArgumentNullException.ThrowIfNull(options);
        options.Validate();
        var zone = plan.TimeZone ?? TimeZoneInfo.Utc;
        if (plan.Frame.OriginLonLat is not { } site)
        {
            return new GlareScan(LocalPlanReason, [], options, double.NaN, double.NaN, zone.Id, null, 0);
        }

        var days = SampledDays(options);
        var step = TimeSpan.FromMinutes(options.StepMinutes);
        var eyes = plan.Eyes.Select(eye => new Tally(eye, new SunGlare(plan, mirror, eye.Position, options.BehindMirrorAngleDeg), step)).ToList();
        foreach (var day in days)
        {
            cancellationToken.ThrowIfCancellationRequested();
            var (start, end) = (MidnightUtc(day, zone), MidnightUtc(day.AddDays(1), zone));
            for (var instant = start; instant < end;)
            {
                var sun = SolarCalculator.At(instant, site.Y, site.X);
                var direction = sun.Direction;
                var clearanceDeg = Angles.ToDeg(eyes.Select(tally => tally.Glare.ClearanceRad(direction)).DefaultIfEmpty(Math.PI).Min());
                var stepsClear = (int)Math.Min(MinutesPerDay, Math.Floor(clearanceDeg / (MaxSunMotionDegPerMinute * options.StepMinutes)));
                if (stepsClear > 0 || !sun.IsAboveHorizon)
                {
                    // No glare now, nor at any sample the sun cannot reach a glaring direction by.
                    eyes.ForEach(tally => tally.Quiet());
                    instant += Math.Max(1, stepsClear) * step;
                    continue;
                }

                foreach (var tally in eyes)
                {
                    tally.Sample(day, TimeZoneInfo.ConvertTime(instant, zone), sun, direction);
                }

                instant += step;
            }

            eyes.ForEach(tally => tally.Quiet());
        }

        return new GlareScan(
            null,
            [.. eyes.Select(tally => new EyeGlare(tally.Eye, tally.InMirror.Summarise(days), tally.BehindMirror.Summarise(days)))],
            options,
            site.Y,
            site.X,
            zone.Id,
            plan.Frame.GridConvergenceDeg,
            days.Count);
    }

    private static List<DateOnly> SampledDays(GlareScanOptions options)
    {
        var days = new List<DateOnly>();
        for (var day = new DateOnly(options.Year, 1, 1); day.Year == options.Year; day = day.AddDays(options.DayStride))
        {
            days.Add(day);
        }

        return days;
    }

    // Local midnight as a UTC instant; where a clock change skips midnight, the zone's offset just before it is used.
    private static DateTimeOffset MidnightUtc(DateOnly day, TimeZoneInfo zone)
    {
        var local = day.ToDateTime(TimeOnly.MinValue, DateTimeKind.Unspecified);
        return new DateTimeOffset(local, zone.GetUtcOffset(local)).ToUniversalTime();
    }

    /// <summary>The samples of one eye as they come, merged into windows.</summary>
    private sealed class Tally(Eye eye, SunGlare glare, TimeSpan step)
    {
        public Eye Eye => eye;

        public SunGlare Glare => glare;

        public Runs InMirror { get; } = new(step);

        public Runs BehindMirror { get; } = new(step);

        public void Sample(DateOnly day, DateTimeOffset local, SunPosition sun, Vec3 direction)
        {
            InMirror.Add(day, local, sun, glare.GlintPoint(direction) is not null);
            BehindMirror.Add(day, local, sun, glare.IsBehindMirror(direction));
        }

        public void Quiet()
        {
            InMirror.Close();
            BehindMirror.Close();
        }
    }

    /// <summary>Runs of consecutive glaring samples, each closed into a window when a sample does not glare.</summary>
    private sealed class Runs(TimeSpan step)
    {
        private readonly List<(DateOnly Day, GlareWindow Window, int Samples)> windows = [];
        private readonly List<(DateTimeOffset Local, SunPosition Sun)> open = [];
        private DateOnly openDay;

        public void Add(DateOnly day, DateTimeOffset local, SunPosition sun, bool glares)
        {
            if (!glares)
            {
                Close();
                return;
            }

            openDay = day;
            open.Add((local, sun));
        }

        public void Close()
        {
            if (open.Count == 0)
            {
                return;
            }

            var middle = open[open.Count / 2].Sun;
            windows.Add((openDay, new GlareWindow(open[0].Local, open[^1].Local + step, middle.AzimuthDeg, middle.ElevationDeg), open.Count));
            open.Clear();
        }

        public GlareTimes Summarise(List<DateOnly> days)
        {
            Close();
            var months = new double[12];
            foreach (var month in Enumerable.Range(1, 12))
            {
                var sampled = days.Count(d => d.Month == month);
                var hours = windows.Where(w => w.Day.Month == month).Sum(w => w.Samples) * step.TotalHours;
                months[month - 1] = sampled == 0 ? 0 : hours * DateTime.DaysInMonth(days[0].Year, month) / sampled;
            }

            var worst = months.Max() > 0 ? Array.IndexOf(months, months.Max()) + 1 : (int?)null;
            return new GlareTimes([.. windows.Select(w => w.Window)], months.Sum(), [.. months], worst);
        }
    }
}
