using System.ComponentModel;
using System.Security.Claims;
using Microsoft.AspNetCore.Http.HttpResults;

namespace SafetyMirror.Api.Access;

/// <summary>Who the service takes the caller to be.</summary>
/// <param name="Owner">The key's owner, recorded on what the caller creates; "local" for a local caller without a key.</param>
/// <param name="KeyId">The public id of the key presented; absent without a key.</param>
public sealed record CallerResponse(
    [property: Description("The key's owner, recorded on what the caller creates; \"local\" for a caller on the service's own machine without a key (Development only).")] string Owner,
    [property: Description("The public id of the key presented (its first part); absent without a key.")] string? KeyId);

/// <summary>The route that tells a caller which owner its key acts for.</summary>
public static class CallerEndpoints
{
    /// <summary>Maps <c>GET /caller</c> on the given route builder.</summary>
    public static RouteHandlerBuilder MapCaller(this IEndpointRouteBuilder routes) =>
        routes.MapGet("/caller", Caller)
            .WithName("GetCaller")
            .WithTags("Access")
            .WithSummary("Say which owner the API key acts for")
            .WithDescription("Checks an API key without costing anything: answers the key's owner and id, or 401 for a missing or wrong key.")
            .RequireApiKey();

    private static Ok<CallerResponse> Caller(ClaimsPrincipal user) =>
        TypedResults.Ok(new CallerResponse(AccessClaims.OwnerOf(user) ?? string.Empty, AccessClaims.KeyIdOf(user)));
}
