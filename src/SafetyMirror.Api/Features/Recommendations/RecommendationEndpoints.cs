using System.Text.Json.Nodes;
using Microsoft.AspNetCore.Http.HttpResults;
using Microsoft.Extensions.Options;
using SafetyMirror.Api.Requests;
using SafetyMirror.Api.Features.Evaluations;
using SafetyMirror.Api.Json;
using SafetyMirror.Api.OpenApi;
using SafetyMirror.Core.Design.Recommendation;
using SafetyMirror.Core.Site;
using SafetyMirror.Api.Service;

namespace SafetyMirror.Api.Features.Recommendations;

/// <summary>Routes that find the mirror to install on a blind corner.</summary>
public static class RecommendationEndpoints
{
    /// <summary>Maps <c>POST /recommendations</c> on the given route builder.</summary>
    public static RouteGroupBuilder MapRecommendations(this IEndpointRouteBuilder routes)
    {
        var group = routes.MapGroup("/recommendations").WithTags("Recommendations");
        group.MapPost("/", Recommend)
            .WithName("RecommendMirror")
            .WithRequestChecks()
            .WithSummary("Find where to put which mirror on a corner")
            .WithDescription(
                "Takes the corner plan (GeoJSON) with mounting zones or a carriageway, and options, and searches pole positions, "
                + "catalogue mirrors (smallest face first), centre heights and aims for the design that restores the required sight "
                + "distance on the served approaches. The answer gives the outcome (no-mirror-needed, one-mirror, two-mirrors or "
                + "no-mirror-serves) in a sentence, the ranked alternatives with each mirror's full evaluation (as POST /v1/evaluations "
                + "answers it), the objective terms, robustness to aim error and the reasons for the ranking, the installation sheet of "
                + "the first alternative, the measures to consider first or instead, the cautions, and every pole position tried. "
                + "With Accept: application/geo+json the first alternative's layers and the positions tried come back as GIS layers "
                + "(a FeatureCollection whose features carry a 'layer' property).")
            .WithMetadata(new GeoJsonAlternative(), new RequestExamples("demo-recommendation-local.json"));
        return group;
    }

    private static Results<Ok<RecommendationResponse>, JsonHttpResult<JsonObject>, ValidationProblem> Recommend(
        RecommendationRequest request, HttpRequest http, TimeProvider clock, IOptions<Microsoft.AspNetCore.Http.Json.JsonOptions> json)
    {
        var errors = new RequestErrors();
        var plan = CornerRequestReader.ReadPlan(request.Plan, SitePlanLimits.Default, errors);
        var options = RecommendationRequestReader.ReadOptions(request.Options, plan, errors);
        var glare = GlareAnswer.Read(request.Options, GlareAnswer.CurrentYear(clock), errors);
        var result = plan is not null && errors.IsEmpty ? ServiceTelemetry.Measure(ComputeKind.Recommendation, () => MirrorRecommender.Recommend(plan, options.WithGlareTieBreak(glare), http.HttpContext.RequestAborted)) : null;
        if (result is not null)
        {
            CornerRequestReader.AddProblems(result.Problems, errors);
        }

        if (!errors.IsEmpty || plan is null || result?.Recommendation is not { } recommendation)
        {
            return errors.ToValidationProblem("No mirror can be recommended for the corner as sent.");
        }

        if (PlanLayers.AreWanted(http))
        {
            return PlanLayers.Answer(recommendation.ToLayers(plan), plan.Frame, json.Value.SerializerOptions);
        }

        return TypedResults.Ok(recommendation.ToResponse(plan, options, glare, http.HttpContext.RequestAborted));
    }
}
