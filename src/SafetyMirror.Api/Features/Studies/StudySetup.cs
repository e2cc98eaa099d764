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
    /// <summary>Registers the configured store; it is opened and migrated before the service takes requests.</summary>
    public static WebApplicationBuilder AddStudies(this WebApplicationBuilder builder)
    {
        var studies = builder.Configuration.GetSection(StudiesOptions.Section).Get<StudiesOptions>() ?? new StudiesOptions();
        var sqlitePath = Path.GetFullPath(studies.SqlitePath, builder.Environment.ContentRootPath);
        builder.Services.AddSingleton(new StudyStorageOptions(sqlitePath, studies.PostgresConnectionString));
        builder.Services.AddSingleton<StudyStoreHost>();
        builder.Services.AddHostedService(services => services.GetRequiredService<StudyStoreHost>());
        builder.Services.AddSingleton<IStudyStore>(services => services.GetRequiredService<StudyStoreHost>().Store);
        return builder;
    }

    /// <summary>Holds the store from start-up on; the service does not take requests before it is open.</summary>
    private sealed class StudyStoreHost(StudyStorageOptions options, TimeProvider clock) : IHostedService, IAsyncDisposable
    {
        private SqlStudyStore? store;

        public IStudyStore Store => store ?? throw new InvalidOperationException("The study store opens when the service starts.");

        public async Task StartAsync(CancellationToken cancellationToken)
        {
            if (string.IsNullOrWhiteSpace(options.PostgresConnectionString) && Path.GetDirectoryName(options.SqlitePath) is { Length: > 0 } folder)
            {
                Directory.CreateDirectory(folder);
            }

            store = await StudyStorage.OpenAsync(options, clock, cancellationToken);
        }

        public Task StopAsync(CancellationToken cancellationToken) => Task.CompletedTask;

        public async ValueTask DisposeAsync()
        {
            if (store is not null)
            {
                await store.DisposeAsync();
            }
        }
    }
}
