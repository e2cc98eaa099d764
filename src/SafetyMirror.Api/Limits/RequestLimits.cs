using System.Threading.RateLimiting;
using Microsoft.AspNetCore.Http.HttpResults;

namespace SafetyMirror.Api.Limits;

/// <summary>The service's request limits, bound from the "Limits" configuration section.</summary>
public sealed class RequestLimits
{
    /// <summary>The configuration section these limits are read from.</summary>
    public const string Section = "Limits";

    /// <summary>The name of the rate-limit policy that the /v1 group carries.</summary>
    public const string RatePolicy = "per-client";

    /// <summary>Largest request body accepted, in bytes; larger bodies get 413.</summary>
    public long MaxRequestBodyBytes { get; init; } = 2 * 1024 * 1024;

    /// <summary>Requests one client may make per window; more get 429.</summary>
    public int PermitLimit { get; init; } = 600;

    /// <summary>Length of the fixed rate-limit window, in seconds.</summary>
    public int WindowSeconds { get; init; } = 60;
}

/// <summary>Registers and applies the body-size limit and the rate limit.</summary>
public static class RequestLimitsExtensions
{
    /// <summary>Binds <see cref="RequestLimits"/>, caps Kestrel's request body and adds the per-client fixed-window limiter.</summary>
    public static WebApplicationBuilder AddRequestLimits(this WebApplicationBuilder builder)
    {
        var limits = builder.Configuration.GetSection(RequestLimits.Section).Get<RequestLimits>() ?? new RequestLimits();
        builder.Services.AddSingleton(limits);

        // Kestrel enforces the cap while a body without Content-Length is read.
        builder.WebHost.ConfigureKestrel(kestrel => kestrel.Limits.MaxRequestBodySize = limits.MaxRequestBodyBytes);

        builder.Services.AddRateLimiter(options =>
        {
            options.RejectionStatusCode = StatusCodes.Status429TooManyRequests;
            // Requests without a remote address (in-process hosts, Unix sockets) share one partition.
            options.AddPolicy(RequestLimits.RatePolicy, context => RateLimitPartition.GetFixedWindowLimiter(
                context.Connection.RemoteIpAddress?.ToString() ?? string.Empty,
                _ => new FixedWindowRateLimiterOptions
                {
                    PermitLimit = limits.PermitLimit,
                    Window = TimeSpan.FromSeconds(limits.WindowSeconds),
                    QueueLimit = 0,
                }));
        });

        return builder;
    }

    /// <summary>Answers 413 problem details before any endpoint runs when the declared body is over the cap.</summary>
    public static IApplicationBuilder UseRequestBodyLimit(this IApplicationBuilder app)
    {
        var limits = app.ApplicationServices.GetRequiredService<RequestLimits>();
        return app.Use(async (context, next) =>
        {
            if (context.Request.ContentLength > limits.MaxRequestBodyBytes)
            {
                await TooLarge(context, limits).ExecuteAsync(context);
                return;
            }

            await next(context);
        });
    }

    /// <summary>Puts the rate-limit policy on a route group and documents its 413 and 429 answers.</summary>
    public static TBuilder WithRequestLimits<TBuilder>(this TBuilder builder)
        where TBuilder : IEndpointConventionBuilder =>
        builder.RequireRateLimiting(RequestLimits.RatePolicy)
            .ProducesProblem(StatusCodes.Status413PayloadTooLarge)
            .ProducesProblem(StatusCodes.Status429TooManyRequests);

    private static ProblemHttpResult TooLarge(HttpContext context, RequestLimits limits) => TypedResults.Problem(
        statusCode: StatusCodes.Status413PayloadTooLarge,
        detail: $"The request body is {context.Request.ContentLength} bytes; this service accepts at most {limits.MaxRequestBodyBytes} bytes.");
}
