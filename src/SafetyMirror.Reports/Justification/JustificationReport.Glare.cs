using System.Globalization;
using SafetyMirror.Core.Design.Glare;
using SafetyMirror.Reports.Documents;
using static System.FormattableString;

namespace SafetyMirror.Reports.Justification;

/// <summary>The sun glare section: the scan's sentences, the hours, and a calendar of the windows per eye.</summary>
public sealed partial class JustificationReport
{
    private void WriteGlare(IReportWriter writer)
    {
        var scanned = report.Mirrors.Where(m => m.Glare is not null).ToList();
        if (scanned.Count == 0)
        {
            return;
        }

        writer.Heading("Sun glare", 1);
        foreach (var mirror in scanned)
        {
            if (scanned.Count > 1)
            {
                writer.Heading($"Sun glare, mirror {mirror.Label}", 2);
            }

            var scan = mirror.Glare!;
            foreach (var sentence in GlareWording.Sentences(scan))
            {
                writer.Paragraph(Wording.ForReader(sentence));
            }

            foreach (var eye in scan.Eyes)
            {
                writer.Paragraph(Hours(eye));
                writer.Figure(GlareChart.Of(eye, scan.Options),
                    $"Sun glare through {scan.Options.Year} at the eye {Wording.FeatureName(eye.Eye.Feature, "eye")}: day of the year across, local time of day ({scan.TimeZoneId}) up; each sampled day's glare drawn across the {scan.Options.DayStride} days it stands for.");
            }
        }
    }

    private static string Hours(EyeGlare eye)
    {
        var worst = eye.WorstMonth is { } month
            ? Invariant($"; worst month {CultureInfo.InvariantCulture.DateTimeFormat.GetMonthName(month)} ({eye.HoursByMonth[month - 1]:0.#} h)")
            : string.Empty;
        return Invariant(
            $"{Wording.FeatureName(eye.Eye.Feature, "eye")}: about {eye.HoursPerYear:0.#} hours a year (sun reflected into the eye {eye.InMirror.HoursPerYear:0.#} h, sun behind the mirror {eye.BehindMirror.HoursPerYear:0.#} h){worst}.");
    }
}
