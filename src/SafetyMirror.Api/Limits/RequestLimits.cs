using System.Globalization;
using System.Threading.RateLimiting;
using Microsoft.AspNetCore.Http.Features;
using Microsoft.AspNetCore.Http.HttpResults;
using Microsoft.AspNetCore.Http.Metadata;
using Microsoft.AspNetCore.Mvc;
using Microsoft.AspNetCore.RateLimiting;
using SafetyMirror.Api.Access;
using SafetyMirror.Api.Service;

namespace SafetyMirror.Api.Limits;

/// <summary>The service's request limits, bound from the "Limits" configuration section.</summary>
public sealed class RequestLimits
{
    /// <summary>The configuration section these limits are read from.</summary>
    public const string Section = "Limits";

    /// <summary>Largest request body accepted, in bytes; larger bodies get 413.</summary>
    public long MaxRequestBodyBytes { get; init; } = 2 * 1024 * 1024;

    /// <summary>Requests one client address may make per window on /v1; more get 429.</summary>
    public int PermitLimit { get; init; } = 600;

    /// <summary>Requests one API key may make per window on /v1, from any address; more get 429.</summary>
    public int KeyPermitLimit { get; init; } = 600;

    /// <summary>Costly requests (recommendations, reports) one caller (its key, else its address) may make per window; more get
    /// 429, so that a burst from one client is turned away at once instead of overrunning the work queue and its deadline.</summary>
    public int CostlyPermitLimit { get; init; } = 30;

    /// <summary>Length of the fixed rate-limit window, in seconds.</summary>
    public int WindowSeconds { get; init; } = 60;

    /// <summary>The work budget of costly requests.</summary>
    public WorkLimits Work { get; init; } = new();
}

/// <summary>Registers and applies the body-size limit and the rate limits.</summary>
public static class RequestLimitsExtensions
{
    /// <summary>Binds <see cref="RequestLimits"/>, caps Kestrel's request body and adds the per-address and per-key fixed-window limiters.</summary>
    public static WebApplicationBuilder AddRequestLimits(this WebApplicationBuilder builder)
    {
        var limits = builder.Configuration.GetSection(RequestLimits.Section).Get<RequestLimits>() ?? new RequestLimits();
        builder.Services.AddSingleton(limits);
        builder.Services.AddSingleton<WorkBudget>();

        // Kestrel enforces the cap while a body without Content-Length is read.
        builder.WebHost.ConfigureKestrel(kestrel => kestrel.Limits.MaxRequestBodySize = limits.MaxRequestBodyBytes);

        builder.Services.AddRateLimiter(options =>
        {
            // Both limits apply: a key does not escape its address's limit, nor a key spread over addresses its own.
            options.GlobalLimiter = PartitionedRateLimiter.CreateChained(
                PartitionedRateLimiter.Create<HttpContext, string>(context => Window(context, AddressOf(context), limits.PermitLimit, limits)),
                PartitionedRateLimiter.Create<HttpContext, string>(context => Window(context, KeyOf(context), limits.KeyPermitLimit, limits)),
                PartitionedRateLimiter.Create<HttpContext, string>(context => Window(
                    context, WorkBudgetExtensions.IsBudgeted(context) ? "costly:" + (KeyOf(context) ?? AddressOf(context)) : null, limits.CostlyPermitLimit, limits)));
            options.OnRejected = (rejected, _) => TooManyAsync(rejected, limits);
        });

        return builder;
    }

    /// <summary>
    /// Answers 413 problem details before any endpoint runs when the declared body is over the cap: the service's, or the
    /// larger one a route states with <see cref="IRequestSizeLimitMetadata"/> (a district batch), which Kestrel then enforces.
    /// </summary>
    public static IApplicationBuilder UseRequestBodyLimit(this IApplicationBuilder app)
    {
        var limits = app.ApplicationServices.GetRequiredService<RequestLimits>();
        return app.Use(async (context, next) =>
        {
            var cap = context.GetEndpoint()?.Metadata.GetMetadata<IRequestSizeLimitMetadata>()?.MaxRequestBodySize ?? limits.MaxRequestBodyBytes;
            if (context.Request.ContentLength > cap)
            {
                await TooLarge(context, cap).ExecuteAsync(context);
                return;
            }

            if (cap != limits.MaxRequestBodyBytes && context.Features.Get<IHttpMaxRequestBodySizeFeature>() is { IsReadOnly: false } body)
            {
                body.MaxRequestBodySize = cap;
            }

            await next(context);
        });
    }

    /// <summary>Puts the rate limits on a route group and documents its 413 and 429 answers.</summary>
    public static TBuilder WithRequestLimits<TBuilder>(this TBuilder builder)
        where TBuilder : IEndpointConventionBuilder =>
        builder.WithMetadata(RateLimited.Instance)
            .ProducesProblem(StatusCodes.Status413PayloadTooLarge)
            .ProducesProblem(StatusCodes.Status429TooManyRequests);

    // Behind a configured proxy the forwarded-headers middleware has already put the client's address here.
    // Requests without a remote address (in-process hosts, Unix sockets) share one partition.
    private static string AddressOf(HttpContext context) => "address:" + context.Connection.RemoteIpAddress;

    private static string? KeyOf(HttpContext context) => AccessClaims.KeyIdOf(context.User) is { } id ? "key:" + id : null;

    private static RateLimitPartition<string> Window(HttpContext context, string? partition, int permits, RequestLimits limits) =>
        partition is null || context.GetEndpoint()?.Metadata.GetMetadata<RateLimited>() is null
            ? RateLimitPartition.GetNoLimiter(string.Empty)
            : RateLimitPartition.GetFixedWindowLimiter(partition, _ => new FixedWindowRateLimiterOptions
            {
                PermitLimit = permits,
                Window = TimeSpan.FromSeconds(limits.WindowSeconds),
                QueueLimit = 0,
            });

    private static async ValueTask TooManyAsync(OnRejectedContext rejected, RequestLimits limits)
    {
        var wait = rejected.Lease.TryGetMetadata(MetadataName.RetryAfter, out var retryAfter) ? retryAfter : TimeSpan.FromSeconds(limits.WindowSeconds);
        var seconds = Math.Max(1, (int)Math.Ceiling(wait.TotalSeconds));
        rejected.HttpContext.Response.Headers.RetryAfter = seconds.ToString(CultureInfo.InvariantCulture);
        await ProblemWriter.WriteAsync(rejected.HttpContext, new ProblemDetails
        {
            Status = StatusCodes.Status429TooManyRequests,
            Title = "Too many requests.",
            Detail = $"Each client address may make {limits.PermitLimit} requests and each API key {limits.KeyPermitLimit} requests "
                + $"per {limits.WindowSeconds} s on /v1, of which {limits.CostlyPermitLimit} recommendations or reports. Try again in {seconds} s (Retry-After).",
        });
    }

    private static ProblemHttpResult TooLarge(HttpContext context, long? cap) => TypedResults.Problem(
        statusCode: StatusCodes.Status413PayloadTooLarge,
        detail: $"The request body is {context.Request.ContentLength} bytes; this service accepts at most {cap} bytes.");

    /// <summary>Marks the routes the rate limits count.</summary>
    private sealed class RateLimited
    {
        public static readonly RateLimited Instance = new();
    }
}
