using System.ComponentModel;
using System.ComponentModel.DataAnnotations;
using System.Text.Json;
using System.Text.Json.Serialization;
using SafetyMirror.Api.Requests;
using SafetyMirror.Api.Features.Recommendations;

namespace SafetyMirror.Api.Features.Reports;

/// <summary>The header block and layout of a justification report.</summary>
[JsonUnmappedMemberHandling(JsonUnmappedMemberHandling.Disallow)]
public sealed record ReportDetailsRequest
{
    /// <summary>The report's title.</summary>
    [Description("The report's title, at most 300 characters (default: \"Sight distance justification for a convex traffic mirror\").")]
    [MaxLength(Ranges.MaxReportTextLength)]
    public string? Title { get; init; }

    /// <summary>The site in words.</summary>
    [Description("The site in words (street, corner), at most 300 characters.")]
    [MaxLength(Ranges.MaxReportTextLength)]
    public string? Site { get; init; }

    /// <summary>The file or work-order reference.</summary>
    [Description("The file or work-order reference, at most 300 characters.")]
    [MaxLength(Ranges.MaxReportTextLength)]
    public string? Reference { get; init; }

    /// <summary>Who asked for the study.</summary>
    [Description("Who asked for the study, at most 300 characters.")]
    [MaxLength(Ranges.MaxReportTextLength)]
    public string? RequestedBy { get; init; }

    /// <summary>Who prepared the report.</summary>
    [Description("Who prepared the report, at most 300 characters; also written into the sign-off block.")]
    [MaxLength(Ranges.MaxReportTextLength)]
    public string? PreparedBy { get; init; }

    /// <summary>The report's date, yyyy-MM-dd.</summary>
    [Description("The report's date as an ISO 8601 calendar date, yyyy-MM-dd (default: today on the service's clock).")]
    [MaxLength(Ranges.MaxIdLength)]
    public string? Date { get; init; }

    /// <summary>"metric" or "imperial".</summary>
    [Description("\"metric\" (metres, km/h; the default) or \"imperial\" (feet, mph). With \"imperial\" the required sight distance comes from AASHTO's US customary formula and table (for example 250 ft at 35 mph, Table 3-1), not the metric value converted, unless options.sightDistance.units says \"metric\"; the other lengths are computed in metres and shown converted.")]
    [MaxLength(Ranges.MaxIdLength)]
    public string? Units { get; init; }

    /// <summary>"A4", "Letter", "A3" or "Tabloid".</summary>
    [Description("The paper the report is laid out for, named in portrait: \"A4\" (the default; ISO 216, 210 × 297 mm), \"Letter\" (8.5 × 11 in), "
        + "\"A3\" (ISO 216, 297 × 420 mm) or \"Tabloid\" (ANSI B, 11 × 17 in; in landscape the same sheet is called Ledger). "
        + "On a bigger sheet the site plans are drawn larger, each still at a round scale (1:100, 1:200, 1:250, 1:500 …).")]
    [MaxLength(Ranges.MaxIdLength)]
    public string? Paper { get; init; }

    /// <summary>Whether the site plan's pages are landscape.</summary>
    [Description("true to print the site plan's pages in landscape (wider plans at a larger round scale); every other page stays portrait. Default false.")]
    public bool? PlanPagesLandscape { get; init; }
}

/// <summary>A corner, optionally one mirror to judge on it, and the report's header: the justification report for a permit file.</summary>
[JsonUnmappedMemberHandling(JsonUnmappedMemberHandling.Disallow)]
public sealed record ReportRequest
{
    /// <summary>The corner plan: an RFC 7946 FeatureCollection.</summary>
    [Description("The corner plan, as for POST /v1/evaluations: an RFC 7946 GeoJSON FeatureCollection whose features carry properties.role (eye, approach, obstacle, mounting-zone, carriageway, footway).")]
    public JsonElement Plan { get; init; }

    /// <summary>The mirror to judge; absent for a recommendation.</summary>
    [Description("The mirror to judge, as for POST /v1/evaluations. Leave it out to have the service recommend the mirror and report on that.")]
    public MirrorRequest? Mirror { get; init; }

    /// <summary>The options; every one has a default.</summary>
    public RecommendationOptionsRequest? Options { get; init; }

    /// <summary>The report's header and layout.</summary>
    public ReportDetailsRequest? Report { get; init; }
}
