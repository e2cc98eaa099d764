using System.Text.Json.Nodes;
using Microsoft.AspNetCore.Http.HttpResults;
using Microsoft.Extensions.Options;
using SafetyMirror.Api.Requests;
using SafetyMirror.Api.Json;
using SafetyMirror.Api.OpenApi;
using SafetyMirror.Core.Design.Evaluation;
using SafetyMirror.Core.Site;
using SafetyMirror.Api.Service;

namespace SafetyMirror.Api.Features.Evaluations;

/// <summary>Routes that evaluate a convex mirror on a blind corner.</summary>
public static class EvaluationEndpoints
{
    /// <summary>Maps <c>POST /evaluations</c> on the given route builder.</summary>
    public static RouteGroupBuilder MapEvaluations(this IEndpointRouteBuilder routes)
    {
        var group = routes.MapGroup("/evaluations").WithTags("Evaluations");
        group.MapPost("/", Evaluate)
            .WithName("EvaluateMirror")
            .WithRequestChecks()
            .WithSummary("Judge one mirror on a corner")
            .WithDescription(
                "Takes the corner plan (GeoJSON), a mirror (location, centre height, aim, radius of curvature, face size) and options, "
                + "and returns for each approach the required, direct and mirror-provided sight distances, the near blind zone, "
                + "per station and road user what the mirror shows and how large and how far away it looks, the siting checks, "
                + "the field of view on the road, the year's sun glare (on a plan in WGS84 or UTM; the year is options.glareYear, "
                + "by default the current year by the service's clock, stated in the answer) and the cautions. With Accept: application/geo+json the same evaluation comes back "
                + "as GIS layers (a FeatureCollection whose features carry a 'layer' property).")
            .WithMetadata(new GeoJsonAlternative(), new RequestExamples("demo-corner-local.json", "demo-corner-wgs84.json"));
        return group;
    }

    private static Results<Ok<EvaluationResponse>, JsonHttpResult<JsonObject>, ValidationProblem> Evaluate(
        EvaluationRequest request, HttpRequest http, TimeProvider clock, IOptions<Microsoft.AspNetCore.Http.Json.JsonOptions> json)
    {
        var errors = new RequestErrors();
        var plan = CornerRequestReader.ReadPlan(request.Plan, SitePlanLimits.Default, errors);
        var options = CornerRequestReader.ReadOptions(request.Options, errors);
        var glare = GlareAnswer.Read(request.Options, GlareAnswer.CurrentYear(clock), errors);
        var placement = CornerRequestReader.ReadMirror(request.Mirror, plan?.Frame, errors);
        var result = plan is not null && placement is not null && errors.IsEmpty ? ServiceTelemetry.Measure(ComputeKind.Evaluation, () => MirrorEvaluator.Evaluate(plan, placement, options, http.HttpContext.RequestAborted)) : null;
        if (result is not null)
        {
            CornerRequestReader.AddProblems(result.Problems, errors);
        }

        if (!errors.IsEmpty || plan is null || result?.Evaluation is not { } evaluated)
        {
            return errors.ToValidationProblem("The corner cannot be evaluated as sent.");
        }

        var (evaluation, scan) = GlareAnswer.Apply(plan, evaluated, glare, http.HttpContext.RequestAborted);

        if (PlanLayers.AreWanted(http))
        {
            return PlanLayers.Answer(evaluation.ToLayers(plan), plan.Frame, json.Value.SerializerOptions);
        }

        return TypedResults.Ok(evaluation.ToResponse(plan, GlareAnswer.ToResponse(scan, glare)));
    }
}
