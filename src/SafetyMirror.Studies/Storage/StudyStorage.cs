namespace SafetyMirror.Studies.Storage;

/// <summary>Where studies are kept: a PostgreSQL connection string when given, else an SQLite file.</summary>
/// <param name="SqlitePath">The SQLite file, created if missing.</param>
/// <param name="PostgresConnectionString">A PostgreSQL (with PostGIS) connection string; when set, it wins.</param>
public sealed record StudyStorageOptions(string SqlitePath = "studies.db", string? PostgresConnectionString = null);

/// <summary>Opens the configured store and brings its schema up to date.</summary>
public static class StudyStorage
{
    /// <summary>The configured store, migrated to the newest schema. Dispose it when done.</summary>
    public static async Task<SqlStudyStore> OpenAsync(StudyStorageOptions options, TimeProvider time, CancellationToken cancellationToken = default)
    {
        SqlStudyStore store = string.IsNullOrWhiteSpace(options.PostgresConnectionString)
            ? new SqliteStudyStore(options.SqlitePath, time)
            : new PostgresStudyStore(options.PostgresConnectionString, time);
        try
        {
            await store.MigrateAsync(cancellationToken: cancellationToken);
            return store;
        }
        catch
        {
            await store.DisposeAsync();
            throw;
        }
    }
}
