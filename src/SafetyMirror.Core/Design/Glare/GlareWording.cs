using System.Globalization;
using static System.FormattableString;

namespace SafetyMirror.Core.Design.Glare;

/// <summary>The sentences that state a year's glare scan, written once for every reader of it.</summary>
public static class GlareWording
{
    /// <summary>What the scan leaves out, said with every scan.</summary>
    public const string Limits =
        "Glare is estimated for a clear sky over level ground from the plan's obstacles only: trees, hills, signs and " +
        "buildings not drawn may hide the sun, and headlights and wet-road reflections are not included.";

    /// <summary>One sentence per eye (or the reason there is no scan), then <see cref="Limits"/>.</summary>
    public static IReadOnlyList<string> Sentences(GlareScan scan)
    {
        ArgumentNullException.ThrowIfNull(scan);
        if (!scan.IsComputed)
        {
            return [scan.NotComputedReason!];
        }

        var method = Invariant(
            $"Sun positions by NOAA's solar equations every {scan.Options.StepMinutes} minutes on {Days(scan.Options.DayStride)} of {scan.Options.Year}, hours scaled to the whole year, times in {Clock(scan)}.");
        return [.. scan.Eyes.Select(eye => Sentence(eye, scan.Options)), method, Limits];
    }

    private static string Sentence(EyeGlare eye, GlareScanOptions options) => Invariant(
        $"At the eye {eye.Eye.Feature}: the sun shows in the mirror {Times(eye.InMirror)}; it stands within {options.BehindMirrorAngleDeg:0.#}° of the driver's line of sight to the mirror {Times(eye.BehindMirror)}.");

    private static string Times(GlareTimes times)
    {
        if (times.WorstMonth is not { } worst)
        {
            return "at no sampled time";
        }

        var first = times.Windows[0].Start;
        var last = times.Windows[^1].Start;
        var earliest = times.Windows.Min(w => w.Start.TimeOfDay);
        var latest = times.Windows.Max(w => w.End.TimeOfDay == TimeSpan.Zero ? TimeSpan.FromDays(1) : w.End.TimeOfDay);
        return Invariant(
            $"about {times.HoursPerYear:0} hours a year, worst in {CultureInfo.InvariantCulture.DateTimeFormat.GetMonthName(worst)}, on sampled days from {first:d MMMM} to {last:d MMMM} between {earliest:hh\\:mm} and {latest:hh\\:mm}");
    }

    private static string Clock(GlareScan scan) => scan.TimeZoneId == TimeZoneInfo.Utc.Id
        ? "UTC, as the plan names no time zone"
        : $"the plan's local time ({scan.TimeZoneId})";

    private static string Days(int stride) => stride == 1 ? "every day" : Invariant($"every {Ordinal(stride)} day");

    private static string Ordinal(int n) => n switch
    {
        _ when n % 100 is 11 or 12 or 13 => Invariant($"{n}th"),
        _ when n % 10 == 1 => Invariant($"{n}st"),
        _ when n % 10 == 2 => Invariant($"{n}nd"),
        _ when n % 10 == 3 => Invariant($"{n}rd"),
        _ => Invariant($"{n}th"),
    };
}
