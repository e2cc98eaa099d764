using System.Globalization;
using SafetyMirror.Core.Design.Glare;
using SafetyMirror.Reports.Graphics;
using static System.FormattableString;

namespace SafetyMirror.Reports.Justification;

/// <summary>The year's glare at one eye as a calendar: day of the year across, local time of day up, the windows shaded.</summary>
/// <remarks>
/// Each window is drawn as wide as the days its sampled day stands for (the scan's day stride), so the sampled days join
/// into bands. Reflected sun is solid dark grey, sun behind the mirror is hatched: the two read apart in black and white.
/// The time axis spans the hours of glare with an hour to spare each side, in whole ticks and at least <see cref="MinSpanHours"/>
/// (a whole day without glare): glare lasts minutes a day, and a whole day's axis would squeeze the bands to slivers.
/// </remarks>
internal static class GlareChart
{
    private const double WidthMm = 170;
    private const double HeightMm = 84;
    private const double LeftMm = 14;
    private const double RightMm = 3;
    private const double TopMm = 3;
    private const double PlotHeightMm = 62;
    private const double LabelSizeMm = 2.8;
    private const int MinSpanHours = 6;

    private static readonly Style ReflectedSun = Style.Filled(Colour.DarkGrey);
    private static readonly Style SunBehindMirror = new() { Stroke = Colour.Black, StrokeWidthMm = 0.1, Fill = Colour.White, Hatch = new Hatch(HatchKind.Diagonal, Colour.Black, 0.8, 0.15) };
    private static readonly Style Frame = Style.Line(Colour.Black, 0.3);
    private static readonly Style Grid = Style.Line(Colour.LightGrey, 0.15);

    /// <summary>The chart of one eye's year.</summary>
    public static Drawing Of(EyeGlare eye, GlareScanOptions options)
    {
        var days = DateTime.IsLeapYear(options.Year) ? 366 : 365;
        var plotWidth = WidthMm - LeftMm - RightMm;
        double X(double dayOfYear) => LeftMm + plotWidth * dayOfYear / days;
        var (fromHour, toHour, step) = HourSpan([.. eye.InMirror.Windows, .. eye.BehindMirror.Windows]);
        double Y(double hours) => TopMm + PlotHeightMm * (1 - (hours - fromHour) / (toHour - fromHour));
        var bottom = Y(fromHour);
        var shapes = new List<Shape>();
        for (var hour = fromHour; hour <= toHour; hour += step)
        {
            shapes.Add(new Polyline([new(LeftMm, Y(hour)), new(LeftMm + plotWidth, Y(hour))], Grid));
            shapes.Add(new Text(new(LeftMm - 1.5, Y(hour) + LabelSizeMm / 3), Invariant($"{hour:00}:00"), LabelSizeMm) { Anchor = TextAnchor.End });
        }

        foreach (var month in Enumerable.Range(1, 12))
        {
            var start = new DateOnly(options.Year, month, 1).DayOfYear - 1;
            var end = month == 12 ? days : new DateOnly(options.Year, month + 1, 1).DayOfYear - 1;
            shapes.Add(new Polyline([new(X(start), TopMm), new(X(start), bottom + 1.5)], start == 0 ? Frame : Grid));
            shapes.Add(new Text(new((X(start) + X(end)) / 2, bottom + 4.5), CultureInfo.InvariantCulture.DateTimeFormat.GetAbbreviatedMonthName(month), LabelSizeMm) { Anchor = TextAnchor.Middle });
        }

        shapes.AddRange(Bands(eye.InMirror, options, X, Y, ReflectedSun));
        shapes.AddRange(Bands(eye.BehindMirror, options, X, Y, SunBehindMirror));
        shapes.Add(new Polygon([new(LeftMm, TopMm), new(LeftMm + plotWidth, TopMm), new(LeftMm + plotWidth, bottom), new(LeftMm, bottom)], Frame));
        shapes.AddRange(Legend(bottom + 10));
        return new Drawing(WidthMm, HeightMm, shapes);
    }

    /// <summary>The hours the time axis spans and its tick step: the glare's hours with an hour each side, in whole ticks.</summary>
    private static (int From, int To, int Step) HourSpan(IReadOnlyList<GlareWindow> windows)
    {
        if (windows.Count == 0)
        {
            return (0, 24, 3);
        }

        var earliest = windows.Min(w => w.Start.TimeOfDay.TotalHours) - 1;
        var latest = windows.Max(w => EndHour(w)) + 1;
        var step = latest - earliest > 8 ? 3 : 1;
        var from = Math.Max(0, (int)Math.Floor(earliest / step) * step);
        var to = Math.Min(24, (int)Math.Ceiling(latest / step) * step);
        if (to - from < MinSpanHours)
        {
            from = Math.Clamp((from + to - MinSpanHours) / 2, 0, 24 - MinSpanHours);
            to = from + MinSpanHours;
        }

        return (from, to, step);
    }

    private static double EndHour(GlareWindow w) => w.End.Date > w.Start.Date ? 24 : w.End.TimeOfDay.TotalHours;

    private static IEnumerable<Shape> Bands(GlareTimes times, GlareScanOptions options, Func<double, double> x, Func<double, double> y, Style style) =>
        times.Windows.Select(w =>
        {
            var day = w.Start.DayOfYear - 1;
            var (from, to) = (w.Start.TimeOfDay.TotalHours, EndHour(w));
            var (left, right) = (x(day), x(Math.Min(day + options.DayStride, DateTime.IsLeapYear(options.Year) ? 366 : 365)));
            return new Polygon([new(left, y(to)), new(right, y(to)), new(right, y(from)), new(left, y(from))], style);
        });

    private static IEnumerable<Shape> Legend(double topMm)
    {
        var key = new[] { ("Sun reflected into the eye", ReflectedSun), ("Sun behind the mirror", SunBehindMirror) };
        var left = LeftMm;
        foreach (var (label, style) in key)
        {
            yield return new Polygon([new(left, topMm), new(left + 6, topMm), new(left + 6, topMm + 3.5), new(left, topMm + 3.5)], style with { Stroke = Colour.Black, StrokeWidthMm = 0.15 });
            yield return new Text(new(left + 8, topMm + 3), label, LabelSizeMm);
            left += 70;
        }
    }
}
