using System.Globalization;
using System.Text.Json;
using Microsoft.AspNetCore.Http.HttpResults;
using Microsoft.Extensions.Options;
using SafetyMirror.Api.Access;
using SafetyMirror.Api.Features.Studies;
using SafetyMirror.Api.OpenApi;
using SafetyMirror.Api.Requests;
using SafetyMirror.Api.Service;
using SafetyMirror.Core.Site;
using SafetyMirror.Core.View;
using SafetyMirror.Reports.Views;
using SafetyMirror.Studies;

namespace SafetyMirror.Api.Features.Views;

/// <summary>Routes that render what the waiting driver sees in the mirror, as a PNG picture.</summary>
public static class ViewEndpoints
{
    /// <summary>The media type of the picture.</summary>
    public const string Png = "image/png";

    /// <summary>Response header: the angle across the picture's width, in degrees.</summary>
    public const string FieldOfViewHeader = "View-Field-Of-View-Deg";

    /// <summary>Response header: the angle one pixel spans at the picture's centre, in arc minutes.</summary>
    public const string ScaleHeader = "View-Arcmin-Per-Pixel";

    private const string Description =
        "Every pixel is an eye ray from the driver's eye: where it meets the mirror's face it is reflected exactly on the spherical cap "
        + "and continues into the corner built in 3-D from the plan (carriageway, footway and other ground shaded apart, the approach lines, "
        + "obstacles raised to their heights, sky), where it meets the backing board (or the pole) it is dark, and elsewhere it goes on directly, so the "
        + "mirror sits in its surroundings. The design road user stands as a box of its design dimensions at the required sight distance on "
        + "every approach (red), with any road users view.roadUsers adds (blue). The headers View-Field-Of-View-Deg and View-Arcmin-Per-Pixel "
        + "state the picture's scale; a caption band across its top states it too, with the cautions: vehicles in a convex mirror look smaller, "
        + "farther away and slower, left and right are reversed, and the picture is decision support, not approval.";

    /// <summary>Maps <c>POST /views</c> on the given route builder.</summary>
    public static RouteGroupBuilder MapViews(this IEndpointRouteBuilder routes)
    {
        var group = routes.MapGroup("/views").WithTags("Views");
        group.MapPost("/", Render)
            .WithName("RenderDriverView")
            .WithRequestChecks()
            .WithSummary("Render what the waiting driver sees in the mirror")
            .WithDescription("Takes the evaluation request (plan, mirror, options) and a 'view' member (size, field of view, extra road users) and answers a PNG. " + Description)
            .Produces<string>(StatusCodes.Status200OK, Png)
            .WithMetadata(new RequestExamples("demo-corner-local.json", "demo-corner-wgs84.json"));
        return group;
    }

    /// <summary>Maps <c>GET /studies/{id}/revisions/{number}/view</c>: the picture of a stored revision's mirror, for its owner.</summary>
    public static RouteHandlerBuilder MapRevisionView(this IEndpointRouteBuilder routes) =>
        routes.MapGet("/studies/{id:guid}/revisions/{number:int}/view", RenderRevision)
            .WithTags("Views")
            .RequireApiKey()
            .WithName("RenderRevisionDriverView")
            .WithSummary("Render what the waiting driver sees in a stored revision's mirror")
            .WithDescription("The picture of POST /v1/views for the revision's stored request, at the default size and framing; a revision "
                + "without a mirror (a recommendation) answers 409. " + Description)
            .Produces<string>(StatusCodes.Status200OK, Png)
            .ProducesProblem(StatusCodes.Status404NotFound)
            .ProducesProblem(StatusCodes.Status409Conflict)
            .ProducesProblem(StatusCodes.Status422UnprocessableEntity);

    private static Results<FileContentHttpResult, ValidationProblem> Render(ViewRequest request, HttpContext http)
    {
        var errors = new RequestErrors();
        return Picture(request.Plan, request.Mirror, request.Options, request.View, errors, http.RequestAborted) is { } picture
            ? Answer(picture, http)
            : errors.ToValidationProblem("The driver's view cannot be rendered as sent.");
    }

    private static async Task<Results<FileContentHttpResult, ProblemHttpResult>> RenderRevision(Guid id, int number, HttpContext http, IStudyStore store, IOptions<Microsoft.AspNetCore.Http.Json.JsonOptions> json)
    {
        if (await StudyEndpoints.FindRevisionAsync(id, number, http, store) is not (_, { } revision))
        {
            return StudyEndpoints.NotFound(id, number);
        }

        var input = StudyInput.From(revision.Content, json.Value.SerializerOptions);
        if (input.Mirror is null)
        {
            return TypedResults.Problem(
                statusCode: StatusCodes.Status409Conflict,
                title: "The revision has no mirror to show.",
                detail: "It asked for a recommendation; post the recommended mirror to POST /v1/views, or add a revision with that mirror.");
        }

        var errors = new RequestErrors();
        return Picture(input.Plan, input.Mirror, input.Options, null, errors, http.RequestAborted) is { } picture
            ? Answer(picture, http)
            : StudyEndpoints.Refused(errors);
    }

    /// <summary>Reads the request's parts and renders the picture; null with every problem recorded under its path.</summary>
    private static ViewPicture? Picture(
        JsonElement planJson, MirrorRequest? mirror, CornerOptionsRequest? optionsRequest, ViewOptionsRequest? viewRequest, RequestErrors errors, CancellationToken cancellationToken)
    {
        var plan = CornerRequestReader.ReadPlan(planJson, SitePlanLimits.Default, errors);
        var options = CornerRequestReader.ReadOptions(optionsRequest, errors);
        var placement = CornerRequestReader.ReadMirror(mirror, plan?.Frame, errors);
        var view = ViewRequestReader.Read(viewRequest, plan, options, errors);
        if (plan is null || placement is null || !errors.IsEmpty)
        {
            return null;
        }

        var result = ServiceTelemetry.Measure(ComputeKind.View, () => DriverView.Render(plan, placement, options, view, cancellationToken));
        CornerRequestReader.AddProblems(result.Problems, errors);
        return errors.IsEmpty ? result.Picture : null;
    }

    private static FileContentHttpResult Answer(ViewPicture picture, HttpContext http)
    {
        http.Response.Headers[FieldOfViewHeader] = picture.FieldOfViewDeg.ToString("0.####", CultureInfo.InvariantCulture);
        http.Response.Headers[ScaleHeader] = picture.ArcminPerPixel.ToString("0.#####", CultureInfo.InvariantCulture);
        return TypedResults.File(ViewPng.Encode(picture), Png);
    }
}
