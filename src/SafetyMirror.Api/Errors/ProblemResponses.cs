using Microsoft.AspNetCore.Mvc;
using Microsoft.AspNetCore.WebUtilities;
using Microsoft.Extensions.DependencyInjection.Extensions;
using SafetyMirror.Api.Limits;

namespace SafetyMirror.Api.Errors;

/// <summary>Uniform RFC 9457 problem details for every error the service answers.</summary>
public static class ProblemResponses
{
    /// <summary>Adds problem details, the bad-request exception handler and makes the framework throw on unreadable requests.</summary>
    public static IServiceCollection AddProblemResponses(this IServiceCollection services)
    {
        services.AddProblemDetails();
        // After the default writer, which declines clients that do not accept JSON (a report asked for as a PDF, say).
        services.TryAddEnumerable(ServiceDescriptor.Singleton<IProblemDetailsWriter, AnyClientProblemWriter>());
        services.AddExceptionHandler<BadRequestExceptionHandler>();

        // Thrown in every environment, so the handler can name the position of bad JSON.
        services.Configure<RouteHandlerOptions>(options => options.ThrowOnBadRequest = true);
        return services;
    }

    /// <summary>Answers exceptions and bare status codes as problem details, and keeps JSON bodies so bad JSON can be located.</summary>
    /// <remarks>
    /// The body is kept in memory up to the body-size limit: when the JSON is malformed inside a member read raw (the
    /// plan), the serializer only names the member; reading the kept body again names the exact place.
    /// </remarks>
    public static IApplicationBuilder UseProblemResponses(this IApplicationBuilder app)
    {
        var limits = app.ApplicationServices.GetRequiredService<RequestLimits>();
        app.UseExceptionHandler();
        app.UseStatusCodePages();
        return app.Use((context, next) =>
        {
            if (context.Request.HasJsonContentType())
            {
                context.Request.EnableBuffering(bufferThreshold: (int)Math.Min(limits.MaxRequestBodyBytes, int.MaxValue));
            }

            return next(context);
        });
    }

    /// <summary>Writes problem details as JSON for any client, with the status code's reason as title when none is set.</summary>
    private sealed class AnyClientProblemWriter : IProblemDetailsWriter
    {
        public bool CanWrite(ProblemDetailsContext context) => true;

        public ValueTask WriteAsync(ProblemDetailsContext context)
        {
            var problem = context.ProblemDetails;
            problem.Status ??= context.HttpContext.Response.StatusCode;
            problem.Title ??= ReasonPhrases.GetReasonPhrase(problem.Status.Value);
            return new ValueTask(context.HttpContext.Response.WriteAsJsonAsync(problem, problem.GetType(), (System.Text.Json.JsonSerializerOptions?)null, "application/problem+json"));
        }
    }
}
