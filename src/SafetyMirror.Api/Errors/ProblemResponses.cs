namespace SafetyMirror.Api.Errors;

/// <summary>Uniform RFC 9457 problem details for every error the service answers.</summary>
public static class ProblemResponses
{
    /// <summary>Adds problem details, the bad-request exception handler and makes the framework throw on unreadable requests.</summary>
    public static IServiceCollection AddProblemResponses(this IServiceCollection services)
    {
        services.AddProblemDetails();
        services.AddExceptionHandler<BadRequestExceptionHandler>();

        // Thrown in every environment, so the handler can name the position of bad JSON.
        services.Configure<RouteHandlerOptions>(options => options.ThrowOnBadRequest = true);
        return services;
    }
}
