using System.Text;
using Microsoft.AspNetCore.Http.HttpResults;
using Microsoft.Net.Http.Headers;
using SafetyMirror.Api.Requests;
using SafetyMirror.Api.Features.Evaluations;
using SafetyMirror.Api.Features.Recommendations;
using SafetyMirror.Api.OpenApi;
using SafetyMirror.Core.Design;
using SafetyMirror.Core.Design.Evaluation;
using SafetyMirror.Core.Design.Glare;
using SafetyMirror.Core.Design.Recommendation;
using SafetyMirror.Core.Site;
using SafetyMirror.Reports.Justification;
using SafetyMirror.Api.Service;

namespace SafetyMirror.Api.Features.Reports;

/// <summary>Routes that write the justification report for a permit file, as an HTML page or a PDF.</summary>
public static class ReportEndpoints
{
    /// <summary>The media type of the page.</summary>
    public const string Html = "text/html";

    /// <summary>The media type of the PDF.</summary>
    public const string Pdf = "application/pdf";

    /// <summary>Maps <c>POST /reports</c> on the given route builder.</summary>
    public static RouteGroupBuilder MapReports(this IEndpointRouteBuilder routes)
    {
        var group = routes.MapGroup("/reports").WithTags("Reports");
        group.MapPost("/", Report)
            .WithName("WriteReport")
            .WithRequestChecks()
            .WithSummary("Write the justification report for a corner")
            .WithDescription(
                "Takes the evaluation request (plan, mirror, options) and a 'report' member with the header (title, site, reference, "
                + "requested by, prepared by, date), the units and the paper. A report in imperial units takes its required sight distance from "
                + "AASHTO's US customary formula and table unless options.sightDistance.units says otherwise. With a mirror it reports on that mirror; without one it runs "
                + "the recommendation and reports on the design it finds (or why none is needed or none can serve). The report holds the "
                + "decision, the site plan at true scale, the figures per approach, charts of apparent size and apparent distance, the "
                + "installation sheet, the siting checks, the method, sources, cautions and a sign-off block. Accept: text/html gives one "
                + "self-contained page; Accept: application/pdf gives the PDF (vector, fonts embedded); any other Accept gives 406.")
            .Produces<string>(StatusCodes.Status200OK, Html, Pdf)
            .ProducesProblem(StatusCodes.Status406NotAcceptable)
            .WithMetadata(new RequestExamples("demo-report-local.json"));
        return group;
    }

    private static Results<FileContentHttpResult, ContentHttpResult, ValidationProblem, ProblemHttpResult> Report(ReportRequest request, HttpRequest http, TimeProvider clock)
    {
        if (Negotiate(http) is not { } format)
        {
            return TypedResults.Problem(
                statusCode: StatusCodes.Status406NotAcceptable,
                title: "The report comes only as an HTML page or a PDF.",
                detail: $"Send Accept: {Html} for the page or Accept: {Pdf} for the PDF.");
        }

        using var measuring = ServiceTelemetry.Measure(ComputeKind.Report);
        var errors = new RequestErrors();
        var plan = CornerRequestReader.ReadPlan(request.Plan, SitePlanLimits.Default, errors);
        var (header, units, paper) = ReportRequestReader.Read(request.Report, clock, errors);
        var report = Write(plan, request.Mirror, request.Options, header, units, header.Date.Year, errors, http.HttpContext.RequestAborted);
        if (report is null)
        {
            return errors.ToValidationProblem("The report cannot be written as sent.");
        }

        return format == Pdf
            ? TypedResults.File(report.ToPdf(paper), Pdf)
            : TypedResults.Content(report.ToHtml(paper), Html, Encoding.UTF8);
    }

    /// <summary>The report on the given mirror, or on the recommended design when there is none; null with the problems recorded.</summary>
    /// <remarks>An imperial report's requirement comes from the US customary formula and table unless the options name other units.
    /// The sun glare is scanned for options.glareYear, else <paramref name="defaultGlareYear"/>.</remarks>
    internal static JustificationReport? Write(
        SitePlan? plan, MirrorRequest? mirror, RecommendationOptionsRequest? options, ReportHeader header, UnitSystem units, int defaultGlareYear, RequestErrors errors, CancellationToken cancellationToken)
    {
        var designUnits = units == UnitSystem.Imperial ? DesignUnits.UsCustomary : DesignUnits.Metric;
        var glare = GlareAnswer.Read(options, defaultGlareYear, errors);
        return mirror is null
            ? Recommended(plan, RecommendationRequestReader.ReadOptions(options, plan, errors, designUnits), header, units, glare, errors, cancellationToken)
            : Evaluated(plan, mirror, ReadEvaluationOptions(options, errors, designUnits), header, units, glare, errors, cancellationToken);
    }

    private static JustificationReport? Evaluated(
        SitePlan? plan, MirrorRequest mirror, EvaluationOptions options, ReportHeader header, UnitSystem units, GlareRequest glare, RequestErrors errors, CancellationToken cancellationToken)
    {
        var placement = CornerRequestReader.ReadMirror(mirror, plan?.Frame, errors);
        if (plan is null || placement is null || !errors.IsEmpty)
        {
            return null;
        }

        var result = ServiceTelemetry.Measure(ComputeKind.Evaluation, () => MirrorEvaluator.Evaluate(plan, placement, options, cancellationToken));
        CornerRequestReader.AddProblems(result.Problems, errors);
        if (result.Evaluation is not { } evaluated || !errors.IsEmpty)
        {
            return null;
        }

        var (evaluation, scan) = GlareAnswer.Apply(plan, evaluated, glare, cancellationToken);
        return JustificationReport.ForEvaluation(plan, evaluation, header, units, scan);
    }

    // With a mirror given there is no search: options that only steer the search would silently do nothing.
    internal static EvaluationOptions ReadEvaluationOptions(RecommendationOptionsRequest? request, RequestErrors errors, DesignUnits designUnits = DesignUnits.Metric)
    {
        var searchOnly = new (string Name, object? Value)[]
        {
            ("servedApproaches", request?.ServedApproaches), ("catalogue", request?.Catalogue), ("minCentreHeightM", request?.MinCentreHeightM),
            ("maxCentreHeightM", request?.MaxCentreHeightM), ("alternatives", request?.Alternatives),
        };
        foreach (var (name, _) in searchOnly.Where(o => o.Value is not null))
        {
            errors.Add($"options.{name}", "Only used when no mirror is given (the report then recommends one); leave it out, or leave out the mirror.");
        }

        return CornerRequestReader.ReadOptions(request, errors, designUnits);
    }

    private static JustificationReport? Recommended(
        SitePlan? plan, RecommendationOptions recommendation, ReportHeader header, UnitSystem units, GlareRequest glare, RequestErrors errors, CancellationToken cancellationToken)
    {
        if (plan is null || !errors.IsEmpty)
        {
            return null;
        }

        var result = ServiceTelemetry.Measure(ComputeKind.Recommendation, () => MirrorRecommender.Recommend(plan, recommendation.WithGlareTieBreak(glare), cancellationToken));
        CornerRequestReader.AddProblems(result.Problems, errors);
        return result.Recommendation is { } recommended && errors.IsEmpty
            ? JustificationReport.ForRecommendation(plan, recommended, recommendation, header, units, new GlareScanOptions(glare.Year), cancellationToken)
            : null;
    }

    /// <summary>The format the client accepts most, of the two the report comes in; null when it accepts neither by name.</summary>
    /// <remarks>Wildcards do not choose: a report is either a page to read or a file to keep, and the client must say which.</remarks>
    internal static string? Negotiate(HttpRequest http)
    {
        var accepted = http.GetTypedHeaders().Accept
            .Where(a => a.Quality is not 0 && (a.MediaType.Equals(Html, StringComparison.OrdinalIgnoreCase) || a.MediaType.Equals(Pdf, StringComparison.OrdinalIgnoreCase)))
            .OrderByDescending(a => a.Quality ?? 1)
            .FirstOrDefault();
        return accepted is null ? null : accepted.MediaType.Equals(Html, StringComparison.OrdinalIgnoreCase) ? Html : Pdf;
    }
}
