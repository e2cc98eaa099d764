using System.Globalization;
using SafetyMirror.Api.Requests;
using SafetyMirror.Reports.Documents;
using SafetyMirror.Reports.Justification;

namespace SafetyMirror.Api.Features.Reports;

/// <summary>Reads the report member of a request into the report's header, units and layout, recording every problem under its path.</summary>
public static class ReportRequestReader
{
    /// <summary>The title when none is given.</summary>
    public const string DefaultTitle = "Sight distance justification for a convex traffic mirror";

    private static readonly Dictionary<string, UnitSystem> UnitNames = new() { ["metric"] = UnitSystem.Metric, ["imperial"] = UnitSystem.Imperial };
    private static readonly Dictionary<string, PaperSize> PaperNames = new()
    {
        ["A4"] = PaperSize.A4, ["Letter"] = PaperSize.Letter, ["A3"] = PaperSize.A3, ["Tabloid"] = PaperSize.Tabloid,
    };

    /// <summary>The header, units and layout (paper, plan pages' orientation); the date defaults to today on <paramref name="clock"/> in the service's time zone.</summary>
    public static (ReportHeader Header, UnitSystem Units, ReportLayout Layout) Read(ReportDetailsRequest? request, TimeProvider clock, RequestErrors errors)
    {
        ArgumentNullException.ThrowIfNull(clock);
        ArgumentNullException.ThrowIfNull(errors);
        var today = DateOnly.FromDateTime(clock.GetLocalNow().DateTime);
        var title = Text(request?.Title, "report.title", errors);
        if (request?.Title is { } given && string.IsNullOrWhiteSpace(given))
        {
            errors.Add("report.title", "Must not be blank; leave it out for the default title.");
        }

        var header = new ReportHeader(
            string.IsNullOrWhiteSpace(title) ? DefaultTitle : title,
            Text(request?.Site, "report.site", errors),
            Text(request?.Reference, "report.reference", errors),
            Text(request?.RequestedBy, "report.requestedBy", errors),
            Text(request?.PreparedBy, "report.preparedBy", errors),
            Date(request?.Date, today, errors));
        var paper = CornerRequestReader.Lookup(PaperNames, request?.Paper, PaperSize.A4, "report.paper", errors);
        return (header, CornerRequestReader.Lookup(UnitNames, request?.Units, UnitSystem.Metric, "report.units", errors), new ReportLayout(paper, request?.PlanPagesLandscape ?? false));
    }

    private static string? Text(string? value, string path, RequestErrors errors)
    {
        if (value is { Length: > Ranges.MaxReportTextLength })
        {
            errors.Add(path, $"At most {Ranges.MaxReportTextLength} characters; it had {value.Length}.");
            return value[..Ranges.MaxReportTextLength];
        }

        return value;
    }

    private static DateOnly Date(string? value, DateOnly today, RequestErrors errors)
    {
        if (value is null)
        {
            return today;
        }

        if (DateOnly.TryParseExact(value, "yyyy-MM-dd", CultureInfo.InvariantCulture, DateTimeStyles.None, out var date))
        {
            return date;
        }

        errors.Add("report.date", $"Must be an ISO 8601 calendar date, yyyy-MM-dd (for example 2025-03-14); it was \"{value}\".");
        return today;
    }
}
