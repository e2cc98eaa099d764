using System.Data.Common;
using Microsoft.AspNetCore.Diagnostics;
using Microsoft.AspNetCore.Mvc;
using Microsoft.Extensions.Diagnostics.HealthChecks;
using SafetyMirror.Api.Service;
using SafetyMirror.Studies;
using SafetyMirror.Studies.Storage;

namespace SafetyMirror.Api.Features.Studies;

/// <summary>Where the service keeps its studies: the "Studies" configuration section.</summary>
public sealed class StudiesOptions
{
    /// <summary>The configuration section.</summary>
    public const string Section = "Studies";

    /// <summary>The SQLite file, relative to the content root; used unless a PostgreSQL connection string is given.</summary>
    public string SqlitePath { get; init; } = "data/studies.db";

    /// <summary>A PostgreSQL (with PostGIS) connection string; when set, studies live there instead.</summary>
    public string? PostgresConnectionString { get; init; }
}

/// <summary>Opens the study store when the service starts (migrating its schema) and shares it as <see cref="IStudyStore"/>.</summary>
public static class StudySetup
{
    /// <summary>The name of the readiness check of the study storage.</summary>
    public const string HealthCheckName = "study-storage";

    /// <summary>Registers the configured store, its readiness check and the 503 answer while it does not answer.</summary>
    /// <remarks>
    /// The store is opened and migrated before the service takes requests. A PostgreSQL server that cannot be reached
    /// yet does not stop the service: it keeps trying in the background and reports not ready until then.
    /// </remarks>
    public static WebApplicationBuilder AddStudies(this WebApplicationBuilder builder)
    {
        var studies = builder.Configuration.GetSection(StudiesOptions.Section).Get<StudiesOptions>() ?? new StudiesOptions();
        var sqlitePath = Path.GetFullPath(studies.SqlitePath, builder.Environment.ContentRootPath);
        builder.Services.AddSingleton(new StudyStorageOptions(sqlitePath, studies.PostgresConnectionString));
        builder.Services.AddSingleton<StudyStoreHost>();
        builder.Services.AddHostedService(services => services.GetRequiredService<StudyStoreHost>());
        builder.Services.AddSingleton<IStudyStore>(services => services.GetRequiredService<StudyStoreHost>().Store);
        builder.Services.AddExceptionHandler<StudyStorageUnavailableHandler>();
        builder.Services.AddHealthChecks().AddCheck<StudyStorageCheck>(HealthCheckName, tags: [Health.ReadyTag], timeout: StudyStorageCheck.Timeout);
        return builder;
    }

    /// <summary>Holds the store from start-up on; the service does not take requests before it is open, or before it has given up for now.</summary>
    private sealed class StudyStoreHost(StudyStorageOptions options, TimeProvider clock, ILogger<StudyStoreHost> logger) : IHostedService, IAsyncDisposable
    {
        private static readonly TimeSpan LongestRetryDelay = TimeSpan.FromSeconds(30);
        private readonly CancellationTokenSource stopping = new();
        private volatile SqlStudyStore? store;
        private Task opening = Task.CompletedTask;

        /// <summary>The open store, or null while the storage has not answered yet.</summary>
        public SqlStudyStore? OpenStore => store;

        public IStudyStore Store => store ?? throw new StudyStorageUnavailableException();

        public async Task StartAsync(CancellationToken cancellationToken)
        {
            if (string.IsNullOrWhiteSpace(options.PostgresConnectionString) && Path.GetDirectoryName(options.SqlitePath) is { Length: > 0 } folder)
            {
                Directory.CreateDirectory(folder);
            }

            try
            {
                store = await StudyStorage.OpenAsync(options, clock, cancellationToken);
            }
            catch (DbException unreachable) when (unreachable.IsTransient)
            {
                // A database that is down or still starting is an outage, not a wrong setting: wait for it, not ready meanwhile.
                logger.LogWarning(unreachable, "The study storage does not answer; the service keeps trying and reports not ready until it does.");
                opening = OpenWhenReachableAsync(stopping.Token);
            }
        }

        private async Task OpenWhenReachableAsync(CancellationToken cancellationToken)
        {
            var delay = TimeSpan.FromSeconds(1);
            while (store is null && !cancellationToken.IsCancellationRequested)
            {
                try
                {
                    await Task.Delay(delay, clock, cancellationToken);
                    store = await StudyStorage.OpenAsync(options, clock, cancellationToken);
                    logger.LogInformation("The study storage answers again.");
                }
                catch (DbException unreachable) when (unreachable.IsTransient)
                {
                    logger.LogWarning("The study storage still does not answer: {Reason}", unreachable.Message);
                    delay = TimeSpan.FromTicks(Math.Min(delay.Ticks * 2, LongestRetryDelay.Ticks));
                }
                catch (OperationCanceledException) when (cancellationToken.IsCancellationRequested)
                {
                    return;
                }
                catch (Exception wrong)
                {
                    // Reached, but refused (a wrong password, no PostGIS): waiting will not mend it.
                    logger.LogCritical(wrong, "The study storage cannot be opened; the service stays not ready.");
                    return;
                }
            }
        }

        // The test host may stop the service after disposing it, so stopping stays safe to repeat (the token source holds no timer to dispose).
        public async Task StopAsync(CancellationToken cancellationToken)
        {
            await stopping.CancelAsync();
            await opening;
        }

        public async ValueTask DisposeAsync()
        {
            await StopAsync(CancellationToken.None);
            if (store is not null)
            {
                await store.DisposeAsync();
            }
        }
    }

    /// <summary>Readiness: the storage answers a real query through the store, the cheapest one it has (a study looked up by key).</summary>
    private sealed class StudyStorageCheck(StudyStoreHost host) : IHealthCheck
    {
        /// <summary>How long the query may take before the storage counts as not answering.</summary>
        public static readonly TimeSpan Timeout = TimeSpan.FromSeconds(3);

        public async Task<HealthCheckResult> CheckHealthAsync(HealthCheckContext context, CancellationToken cancellationToken = default)
        {
            if (host.OpenStore is not { } store)
            {
                return HealthCheckResult.Unhealthy("The study storage has not answered since the service started.");
            }

            try
            {
                await store.GetStudyAsync(Guid.Empty, cancellationToken);
                return HealthCheckResult.Healthy();
            }
            catch (DbException failed)
            {
                return HealthCheckResult.Unhealthy("The study storage does not answer.", failed);
            }
        }
    }
}

/// <summary>Thrown when a request needs the study storage before it has answered for the first time.</summary>
public sealed class StudyStorageUnavailableException() : Exception("The study storage has not answered since the service started.");

/// <summary>Answers a request that needs storage which does not answer (not reached yet, or gone) with 503 and Retry-After, not 500.</summary>
internal sealed class StudyStorageUnavailableHandler(IProblemDetailsService problems) : IExceptionHandler
{
    private const int RetryAfterSeconds = 10;

    public async ValueTask<bool> TryHandleAsync(HttpContext httpContext, Exception exception, CancellationToken cancellationToken)
    {
        if (exception is not (StudyStorageUnavailableException or DbException { IsTransient: true }))
        {
            return false;
        }

        httpContext.Response.StatusCode = StatusCodes.Status503ServiceUnavailable;
        httpContext.Response.Headers.RetryAfter = RetryAfterSeconds.ToString(System.Globalization.CultureInfo.InvariantCulture);
        var problem = new ProblemDetails
        {
            Status = StatusCodes.Status503ServiceUnavailable,
            Title = "The study storage does not answer.",
            Detail = $"The service cannot reach its database just now; try again in {RetryAfterSeconds} s.",
        };
        return await problems.TryWriteAsync(new ProblemDetailsContext { HttpContext = httpContext, ProblemDetails = problem, Exception = exception });
    }
}
