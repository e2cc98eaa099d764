namespace SafetyMirror.Api.Features.Evaluations;

/// <summary>Routes that evaluate a convex mirror on a blind corner.</summary>
public static class EvaluationEndpoints
{
    /// <summary>Maps the evaluation group under <c>/evaluations</c> of the given route builder.</summary>
    public static RouteGroupBuilder MapEvaluations(this IEndpointRouteBuilder routes) =>
        routes.MapGroup("/evaluations").WithTags("Evaluations");
}
