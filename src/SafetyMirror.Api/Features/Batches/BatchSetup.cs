using Hangfire;
using Hangfire.PostgreSql;
using Hangfire.PostgreSql.Factories;
using Hangfire.InMemory;
using Microsoft.Extensions.Diagnostics.HealthChecks;
using SafetyMirror.Api.Features.Studies;
using SafetyMirror.Api.Service;
using SafetyMirror.Studies;

namespace SafetyMirror.Api.Features.Batches;

/// <summary>How batches are worked through: the "Batches" configuration section.</summary>
public sealed class BatchOptions
{
    /// <summary>The configuration section.</summary>
    public const string Section = "Batches";

    /// <summary>Consecutive corners one job screens: fewer jobs to queue, but more left to redo when a worker dies.</summary>
    public int CornersPerJob { get; init; } = 20;

    /// <summary>Most corners in one batch.</summary>
    public int MaxCorners { get; init; } = 20_000;

    /// <summary>Largest batch body, bytes: a district of 20,000 corners in GeoJSON.</summary>
    public long MaxBodyBytes { get; init; } = 256L * 1024 * 1024;

    /// <summary>Jobs one instance runs at once; screening is CPU-bound, so one per core.</summary>
    public int Workers { get; init; } = Environment.ProcessorCount;

    /// <summary>Seconds after which a job taken by a worker that has not finished it is handed to another (its process is presumed dead).</summary>
    public double RedeliverAfterSeconds { get; init; } = 300;

    /// <summary>Seconds between a worker's looks at the queue when it is idle.</summary>
    public double PollSeconds { get; init; } = 1;

    /// <summary>
    /// The PostgreSQL schema of the job engine's tables when studies live in PostgreSQL; by default "jobs", or
    /// "&lt;schema&gt;_jobs" when the connection string's search path puts the studies in a schema of their own.
    /// </summary>
    public string? JobSchema { get; init; }

    /// <summary>Seconds between commits of a job's screened corners: each commit is one transaction for many corners.</summary>
    public double RecordEverySeconds { get; init; } = 1;

    /// <summary>Seconds between a job's looks at whether its batch was cancelled.</summary>
    public double CancelCheckEverySeconds { get; init; } = 0.25;

    /// <summary>See <see cref="RecordEverySeconds"/>.</summary>
    public TimeSpan RecordEvery => TimeSpan.FromSeconds(RecordEverySeconds);

    /// <summary>See <see cref="CancelCheckEverySeconds"/>.</summary>
    public TimeSpan CancelCheckEvery => TimeSpan.FromSeconds(CancelCheckEverySeconds);
}

/// <summary>
/// District batches on Hangfire. When studies live in PostgreSQL, so does the job queue (schema "jobs"): every instance
/// on that database shares it, and it outlives any one of them. On the single-machine SQLite default the queue is
/// Hangfire's in-memory one; the batch tables are the durable record, and the queue is refilled from them at start-up.
/// </summary>
public static class BatchSetup
{
    /// <summary>Registers the job engine, the batch store and, when this instance works batches, a Hangfire server.</summary>
    public static WebApplicationBuilder AddBatches(this WebApplicationBuilder builder)
    {
        var options = builder.Configuration.GetSection(BatchOptions.Section).Get<BatchOptions>() ?? new BatchOptions();
        var studies = builder.Configuration.GetSection(StudiesOptions.Section).Get<StudiesOptions>() ?? new StudiesOptions();
        var shared = !string.IsNullOrWhiteSpace(studies.PostgresConnectionString);
        builder.Services.AddSingleton(options);
        builder.Services.AddSingleton<IBatchStore>(services => (IBatchStore)services.GetRequiredService<IStudyStore>());
        builder.Services.AddTransient<BatchJob>();
        builder.Services.AddSingleton<BatchQueue>();

        // The storage is this host's own, not Hangfire's process-wide default, so several hosts in one process stay apart.
        var jobSchema = shared ? options.JobSchema ?? DefaultJobSchema(studies.PostgresConnectionString!) : null;
        builder.Services.AddSingleton(new JobSchema(shared));
        builder.Services.AddSingleton<JobStorage>(_ => shared
            ? PostgresJobs(studies.PostgresConnectionString!, jobSchema!, options)
            : new InMemoryStorage(new InMemoryStorageOptions()));
        builder.Services.AddHangfire((services, configuration) => configuration
            .SetDataCompatibilityLevel(CompatibilityLevel.Version_180)
            .UseLogProvider(new HostLogProvider(services.GetRequiredService<ILoggerFactory>()))
            .UseSimpleAssemblyNameTypeSerializer()
            .UseRecommendedSerializerSettings());
        if (ServiceRoles.Of(builder.Configuration).WorksBatches())
        {
            builder.Services.AddHangfireServer((services, server) =>
            {
                // This host's own services build each job: Hangfire's process-wide activator is whichever host set it last.
                server.Activator = new Hangfire.AspNetCore.AspNetCoreJobActivator(services.GetRequiredService<IServiceScopeFactory>());
                server.WorkerCount = Math.Max(1, options.Workers);
                server.ServerName = BatchJob.Worker;
                server.ShutdownTimeout = TimeSpan.FromSeconds(5);
                server.SchedulePollingInterval = TimeSpan.FromSeconds(options.PollSeconds);
            });
            if (!shared)
            {
                builder.Services.AddHostedService<BatchRefill>();
            }
        }

        if (shared)
        {
            builder.Services.AddHostedService(services => ActivatorUtilities.CreateInstance<JobSchema.Installer>(
                services, studies.PostgresConnectionString!, jobSchema!));
        }

        builder.Services.AddHealthChecks().AddCheck<JobStorageHealthCheck>("job-storage", tags: [Health.ReadyTag], timeout: TimeSpan.FromSeconds(3));
        return builder;
    }

    private static PostgreSqlStorage PostgresJobs(string connectionString, string schema, BatchOptions options)
    {
        var storage = new PostgreSqlStorageOptions
        {
            SchemaName = schema,

            // The schema is installed by JobSchema's installer, which waits for a database that is not up yet.
            PrepareSchemaIfNecessary = false,
            QueuePollInterval = TimeSpan.FromSeconds(options.PollSeconds),
            InvisibilityTimeout = TimeSpan.FromSeconds(options.RedeliverAfterSeconds),

            // A worker killed inside a state change leaves its lock row behind; it must lapse as soon as its job is handed on,
            // not after the default ten minutes. Locks are held only across a state change, far shorter than this.
            DistributedLockTimeout = TimeSpan.FromSeconds(Math.Min(60, options.RedeliverAfterSeconds)),
        };
        return new PostgreSqlStorage(new NpgsqlConnectionFactory(connectionString, storage), storage);
    }

    /// <summary>The job schema that goes with a connection string: beside the studies' own schema, so each database user's studies keep their own queue.</summary>
    public static string DefaultJobSchema(string connectionString) =>
        new Npgsql.NpgsqlConnectionStringBuilder(connectionString).SearchPath?.Split(',')[0].Trim() is { Length: > 0 } schema && schema != "public"
            ? $"{schema}_jobs"
            : "jobs";

    /// <summary>Ready only while the job engine's storage answers (and, on PostgreSQL, once its schema is installed).</summary>
    private sealed class JobStorageHealthCheck(JobStorage storage, JobSchema schema) : IHealthCheck
    {
        public Task<HealthCheckResult> CheckHealthAsync(HealthCheckContext context, CancellationToken cancellationToken = default)
        {
            if (!schema.IsReady)
            {
                return Task.FromResult(HealthCheckResult.Unhealthy("The job engine's tables are not installed yet: the database has not answered."));
            }

            try
            {
                var enqueued = storage.GetMonitoringApi().EnqueuedCount("default");
                return Task.FromResult(HealthCheckResult.Healthy($"{enqueued} batch jobs queued."));
            }
#pragma warning disable CA1031 // Any failure to reach the storage is the answer "unhealthy".
            catch (Exception e)
#pragma warning restore CA1031
            {
                return Task.FromResult(HealthCheckResult.Unhealthy("The job engine's storage does not answer.", e));
            }
        }
    }
}

/// <summary>
/// Hangfire's log lines into the host's logging. Hangfire keeps its log provider process-wide and its classes keep their
/// loggers in static fields, so a logger may outlive the host that made it: its lines are then dropped, not thrown.
/// </summary>
internal sealed class HostLogProvider(ILoggerFactory factory) : Hangfire.Logging.ILogProvider
{
    public Hangfire.Logging.ILog GetLogger(string name) => new HostLog(factory, name);

    private sealed class HostLog(ILoggerFactory factory, string name) : Hangfire.Logging.ILog
    {
        private ILogger? logger;

        public bool Log(Hangfire.Logging.LogLevel logLevel, Func<string>? messageFunc, Exception? exception = null)
        {
            try
            {
                logger ??= factory.CreateLogger(name);
                var level = logLevel switch
                {
                    Hangfire.Logging.LogLevel.Trace => LogLevel.Trace,
                    Hangfire.Logging.LogLevel.Debug => LogLevel.Debug,
                    Hangfire.Logging.LogLevel.Info => LogLevel.Information,
                    Hangfire.Logging.LogLevel.Warn => LogLevel.Warning,
                    Hangfire.Logging.LogLevel.Error => LogLevel.Error,
                    _ => LogLevel.Critical,
                };
                if (messageFunc is null)
                {
                    return logger.IsEnabled(level);
                }

#pragma warning disable CA1848, CA2254 // Hangfire hands over finished messages, not templates.
                logger.Log(level, exception, messageFunc());
#pragma warning restore CA1848, CA2254
                return true;
            }
            catch (ObjectDisposedException)
            {
                return false;
            }
        }
    }
}

/// <summary>The job engine's PostgreSQL schema, installed at start-up by a service that waits for the database as the study store does.</summary>
/// <param name="onPostgres">Whether the job queue lives in PostgreSQL (else it is in memory and always ready).</param>
public sealed class JobSchema(bool onPostgres)
{
    private static readonly TimeSpan LongestRetryDelay = TimeSpan.FromSeconds(30);
    private volatile bool installed;

    /// <summary>Whether the job engine can use its storage: always for the in-memory queue, on PostgreSQL once installed.</summary>
    public bool IsReady => installed || !onPostgres;

    /// <summary>
    /// Installs (or upgrades) the job engine's tables before the service takes work; when the database does not answer
    /// yet, the service starts anyway, not ready, and the installer keeps trying.
    /// </summary>
    internal sealed class Installer(JobSchema schema, string connectionString, string name, ILogger<Installer> log) : IHostedService
    {
        private readonly CancellationTokenSource stopping = new();
        private Task retrying = Task.CompletedTask;

        public async Task StartAsync(CancellationToken cancellationToken)
        {
            if (!await TryInstallAsync(cancellationToken))
            {
                retrying = RetryAsync(stopping.Token);
            }
        }

        public async Task StopAsync(CancellationToken cancellationToken)
        {
            await stopping.CancelAsync();
            await retrying;
        }

        private async Task RetryAsync(CancellationToken cancellationToken)
        {
            var delay = TimeSpan.FromSeconds(1);
            while (!cancellationToken.IsCancellationRequested)
            {
                await Task.Delay(delay, cancellationToken).ContinueWith(_ => { }, TaskScheduler.Default);
                if (!cancellationToken.IsCancellationRequested && await TryInstallAsync(cancellationToken))
                {
                    return;
                }

                delay = TimeSpan.FromTicks(Math.Min(delay.Ticks * 2, LongestRetryDelay.Ticks));
            }
        }

        private async Task<bool> TryInstallAsync(CancellationToken cancellationToken)
        {
            try
            {
                await using var connection = new Npgsql.NpgsqlConnection(connectionString);
                await connection.OpenAsync(cancellationToken);

                // Instances starting together would race to create the schema: one installs at a time, the others find it
                // done. The lock is the session's, and a pooled session outlives this connection object: release it.
                await using (var take = new Npgsql.NpgsqlCommand("SELECT pg_advisory_lock(hashtext(@key))", connection))
                {
                    take.Parameters.AddWithValue("key", "safetymirror.jobs.install:" + name);
                    await take.ExecuteNonQueryAsync(cancellationToken);
                }

                try
                {
                    PostgreSqlObjectsInstaller.Install(connection, name);
                }
                finally
                {
                    await using var release = new Npgsql.NpgsqlCommand("SELECT pg_advisory_unlock(hashtext(@key))", connection);
                    release.Parameters.AddWithValue("key", "safetymirror.jobs.install:" + name);
                    await release.ExecuteNonQueryAsync(CancellationToken.None);
                }

                schema.installed = true;
                return true;
            }
            catch (Npgsql.NpgsqlException unreachable) when (unreachable.IsTransient)
            {
                log.LogWarning("The job engine's database does not answer yet ({Reason}); the service keeps trying.", unreachable.Message);
                return false;
            }
        }
    }
}

/// <summary>Refills the in-memory queue at start-up with every active batch's unrecorded corners, which a stop left behind.</summary>
/// <remarks>Registered after the study store, whose start opens it; the store is taken only then.</remarks>
internal sealed class BatchRefill(IServiceProvider services, BatchQueue queue, ILogger<BatchRefill> log) : IHostedService
{
    public async Task StartAsync(CancellationToken cancellationToken)
    {
        var store = services.GetRequiredService<IBatchStore>();
        foreach (var id in await store.UnfinishedBatchesAsync(cancellationToken))
        {
            if (await store.GetBatchAsync(id, cancellationToken) is { } batch)
            {
                var jobs = queue.Enqueue(batch, await store.UnfinishedPositionsAsync(id, cancellationToken));
                log.LogInformation("Batch {Batch} resumed after a restart: {Jobs} jobs queued", id, jobs);
            }
        }
    }

    public Task StopAsync(CancellationToken cancellationToken) => Task.CompletedTask;
}

/// <summary>Puts a batch's unrecorded corners on the job engine's queue, one job per run of consecutive corners.</summary>
public sealed class BatchQueue
{
    private readonly IBackgroundJobClient jobs;

    /// <summary>A queue on the host's job client; the queue's depth is published as the gauge <c>safetymirror.batch.queue.depth</c>.</summary>
    public BatchQueue(IBackgroundJobClient jobs, JobStorage storage)
    {
        this.jobs = jobs;
        ServiceTelemetry.Meter.CreateObservableGauge(
            "safetymirror.batch.queue.depth", () => storage.GetMonitoringApi().EnqueuedCount("default"), "{job}", "Batch jobs waiting for a worker.");
    }

    /// <summary>Queues a job for every run of <see cref="BatchRecord.CornersPerJob"/> corners that holds an unrecorded one.</summary>
    /// <returns>How many jobs were queued.</returns>
    public int Enqueue(BatchRecord batch, IReadOnlyList<int> unrecorded)
    {
        ArgumentNullException.ThrowIfNull(batch);
        ArgumentNullException.ThrowIfNull(unrecorded);
        var size = batch.CornersPerJob;
        var runs = unrecorded.Select(position => position / size).Distinct().ToList();
        foreach (var run in runs)
        {
            var (first, last) = (run * size, Math.Min(batch.Counts.Total, (run + 1) * size) - 1);
            jobs.Enqueue<BatchJob>(job => job.RunAsync(batch.Id, first, last, CancellationToken.None));
        }

        return runs.Count;
    }
}
