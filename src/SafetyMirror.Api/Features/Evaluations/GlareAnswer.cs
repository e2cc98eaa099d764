using System.Globalization;
using SafetyMirror.Api.Requests;
using SafetyMirror.Core.Design.Evaluation;
using SafetyMirror.Core.Design.Glare;
using SafetyMirror.Core.Design.Recommendation;
using SafetyMirror.Core.Site;

namespace SafetyMirror.Api.Features.Evaluations;

/// <summary>What a request asks of the glare scan: the year, and the hours a year allowed (null: report only).</summary>
public sealed record GlareRequest(int Year, double? HoursPerYearAllowed);

/// <summary>The year's sun glare at an evaluated mirror: read from the options, scanned once, checked and put in the answer.</summary>
public static class GlareAnswer
{
    /// <summary>Reads <c>options.glareYear</c> and <c>options.glareHoursPerYearAllowed</c>; the year defaults to <paramref name="defaultYear"/>.</summary>
    public static GlareRequest Read(CornerOptionsRequest? request, int defaultYear, RequestErrors errors)
    {
        ArgumentNullException.ThrowIfNull(errors);
        var year = (int)errors.Within(request?.GlareYear, Ranges.MinGlareYear, Ranges.MaxGlareYear, "", "options.glareYear", defaultYear);
        double? allowed = request?.GlareHoursPerYearAllowed is null ? null
            : errors.Within(request.GlareHoursPerYearAllowed, 0, Ranges.MaxGlareHoursPerYear, "h", "options.glareHoursPerYearAllowed", 0);
        return new GlareRequest(year, allowed);
    }

    /// <summary>The recommendation options with ties between designs broken by the same year's glare the answer states.</summary>
    public static RecommendationOptions WithGlareTieBreak(this RecommendationOptions options, GlareRequest glare) =>
        (options ?? throw new ArgumentNullException(nameof(options))) with { GlareTieBreak = new GlareScanOptions((glare ?? throw new ArgumentNullException(nameof(glare))).Year) };

    /// <summary>The year by the clock, the default glare year.</summary>
    public static int CurrentYear(TimeProvider clock) => (clock ?? throw new ArgumentNullException(nameof(clock))).GetUtcNow().Year;

    /// <summary>Scans the evaluated mirror's year and, with a limit, adds its check to the evaluation.</summary>
    public static (MirrorEvaluation Evaluation, GlareScan Scan) Apply(
        SitePlan plan, MirrorEvaluation evaluation, GlareRequest glare, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(evaluation);
        ArgumentNullException.ThrowIfNull(glare);
        var scan = GlareScanner.Scan(plan, evaluation.Placement.ToMirror(), new GlareScanOptions(glare.Year), cancellationToken);
        return (glare.HoursPerYearAllowed is { } allowed ? evaluation.WithGlareLimit(scan, allowed) : evaluation, scan);
    }

    /// <summary>The answer's glare section.</summary>
    public static GlareResponse ToResponse(GlareScan scan, GlareRequest glare)
    {
        ArgumentNullException.ThrowIfNull(scan);
        ArgumentNullException.ThrowIfNull(glare);
        return new GlareResponse(
            scan.IsComputed,
            scan.NotComputedReason,
            glare.Year,
            scan.TimeZoneId,
            glare.HoursPerYearAllowed,
            [.. GlareWording.Sentences(scan)],
            [.. scan.Eyes.Select(Eye)]);
    }

    private static EyeGlareResponse Eye(EyeGlare eye)
    {
        var windows = eye.InMirror.Windows.Select(w => Window(w, ReflectedSun))
            .Concat(eye.BehindMirror.Windows.Select(w => Window(w, SunBehindMirror)))
            .OrderBy(w => w.Date, StringComparer.Ordinal).ThenBy(w => w.Start, StringComparer.Ordinal).ThenBy(w => w.Kind, StringComparer.Ordinal);
        return new EyeGlareResponse(
            EvaluationMapping.Ref(eye.Eye.Feature),
            Hours(eye.HoursPerYear),
            Hours(eye.InMirror.HoursPerYear),
            Hours(eye.BehindMirror.HoursPerYear),
            [.. eye.HoursByMonth.Select(Hours)],
            eye.WorstMonth,
            [.. windows]);
    }

    /// <summary>The kind of a window where the sun is reflected from the face into the eye.</summary>
    public const string ReflectedSun = "reflected-sun";

    /// <summary>The kind of a window where the sun stands close behind the mirror on the driver's line of sight.</summary>
    public const string SunBehindMirror = "sun-behind-mirror";

    private static GlareWindowResponse Window(GlareWindow w, string kind) => new(
        kind,
        w.Start.ToString("yyyy-MM-dd", CultureInfo.InvariantCulture),
        w.Start.ToString("HH:mm", CultureInfo.InvariantCulture),
        w.End.ToString(w.End.Date > w.Start.Date ? "24:00" : "HH:mm", CultureInfo.InvariantCulture),
        Math.Round(w.SunAzimuthDeg, 1),
        Math.Round(w.SunElevationDeg, 1));

    private static double Hours(double hours) => Math.Round(hours, 1);
}

/// <summary>The year's sun glare at the mirror, or why it is absent.</summary>
/// <param name="Computed">Whether the scan was made (only on a plan in WGS84 or UTM).</param>
/// <param name="NotComputedReason">Why there is no scan; null when there is one.</param>
/// <param name="Year">The calendar year scanned (the request's glareYear, else the year by the service's clock when answered).</param>
/// <param name="TimeZone">The clock the dates and times are stated in: the plan's timeZone, or UTC.</param>
/// <param name="HoursPerYearAllowed">The limit checked, if the request set one.</param>
/// <param name="Sentences">The scan in plain sentences (the report states the same).</param>
/// <param name="Eyes">The glare at each eye point of the plan.</param>
public sealed record GlareResponse(
    bool Computed, string? NotComputedReason, int Year, string TimeZone, double? HoursPerYearAllowed, IReadOnlyList<string> Sentences, IReadOnlyList<EyeGlareResponse> Eyes);

/// <summary>The year's glare at one eye point.</summary>
/// <param name="Eye">The eye feature.</param>
/// <param name="HoursPerYear">Estimated hours a year of either kind.</param>
/// <param name="ReflectedSunHoursPerYear">Of which the sun reflected from the face into the eye.</param>
/// <param name="SunBehindMirrorHoursPerYear">Of which the sun close behind the mirror on the line of sight to it.</param>
/// <param name="HoursByMonth">Hours of either kind per month, January first (12 values).</param>
/// <param name="WorstMonth">The month (1 to 12) with the most hours; null when there are none.</param>
/// <param name="Windows">Every stretch of glare on the sampled days, in date and time order.</param>
public sealed record EyeGlareResponse(
    FeatureRefResponse Eye, double HoursPerYear, double ReflectedSunHoursPerYear, double SunBehindMirrorHoursPerYear,
    IReadOnlyList<double> HoursByMonth, int? WorstMonth, IReadOnlyList<GlareWindowResponse> Windows);

/// <summary>One stretch of a sampled day in which the sun dazzles, in local clock time.</summary>
/// <param name="Kind">"reflected-sun" or "sun-behind-mirror".</param>
/// <param name="Date">The local date, yyyy-MM-dd.</param>
/// <param name="Start">First sampled time, HH:mm local.</param>
/// <param name="End">The time after the last sample, HH:mm local (24:00 at midnight).</param>
/// <param name="SunAzimuthDeg">The sun's azimuth from true north in the middle of the stretch.</param>
/// <param name="SunElevationDeg">The sun's apparent elevation in the middle of the stretch.</param>
public sealed record GlareWindowResponse(string Kind, string Date, string Start, string End, double SunAzimuthDeg, double SunElevationDeg);
