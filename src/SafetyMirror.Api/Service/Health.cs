namespace SafetyMirror.Api.Service;

/// <summary>The liveness probe at <c>/healthz</c>, answered by ASP.NET Core health checks.</summary>
public static class Health
{
    /// <summary>The probe's path.</summary>
    public const string Path = "/healthz";

    /// <summary>Maps the health-check endpoint.</summary>
    public static IEndpointConventionBuilder MapHealth(this IEndpointRouteBuilder routes) =>
        routes.MapHealthChecks(Path);
}
