using Npgsql;

namespace SafetyMirror.Studies.Tests.Storage;

/// <summary>The real PostgreSQL the tests use, named by SAFETYMIRROR_TEST_POSTGRES; each test gets a schema of its own.</summary>
static class TestPostgres
{
    public const string Variable = "SAFETYMIRROR_TEST_POSTGRES";

    const string HowToStart =
        $"Start PostgreSQL with PostGIS and set {Variable}: eval \"$(deploy/dev-postgres.sh start)\" " +
        "(as root it installs postgresql-15-postgis-3 if missing; stop it with deploy/dev-postgres.sh stop), or run bash .ci/run.";

    /// <summary>A fresh empty schema; its connection string puts it first on the search path, PostGIS after it.</summary>
    public static async Task<string> CreateSchemaAsync()
    {
        var baseConnection = Environment.GetEnvironmentVariable(Variable);
        if (string.IsNullOrWhiteSpace(baseConnection))
            throw new InvalidOperationException($"{Variable} is not set. {HowToStart}");
        var schema = $"test_{Guid.NewGuid():N}";
        try
        {
            await using var connection = new NpgsqlConnection(baseConnection);
            await connection.OpenAsync();
            await using var create = new NpgsqlCommand($"CREATE SCHEMA {schema}", connection);
            await create.ExecuteNonQueryAsync();
        }
        catch (Exception e) when (e is NpgsqlException or InvalidOperationException)
        {
            throw new InvalidOperationException($"PostgreSQL at {Variable} is unreachable ({e.Message}). {HowToStart}", e);
        }
        return new NpgsqlConnectionStringBuilder(baseConnection) { SearchPath = $"{schema},public" }.ToString();
    }

    public static async Task DropSchemaAsync(string connectionString)
    {
        var builder = new NpgsqlConnectionStringBuilder(connectionString);
        var schema = builder.SearchPath!.Split(',')[0];
        builder.SearchPath = null;
        await using var connection = new NpgsqlConnection(builder.ToString());
        await connection.OpenAsync();
        // The service's job engine keeps its tables in a schema beside the studies' one.
        await using var drop = new NpgsqlCommand($"DROP SCHEMA {schema} CASCADE; DROP SCHEMA IF EXISTS {schema}_jobs CASCADE", connection);
        await drop.ExecuteNonQueryAsync();
    }
}
