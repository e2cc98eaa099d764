using Microsoft.Data.Sqlite;

namespace SafetyMirror.Api.Access;

/// <summary>Keeps API keys in one SQLite file: id, owner, SHA-256 of the key and when it was issued.</summary>
public sealed class SqliteApiKeyStore : IApiKeyStore
{
    private const string Schema = """
        CREATE TABLE IF NOT EXISTS api_keys (
            id TEXT PRIMARY KEY,
            owner TEXT NOT NULL,
            sha256 BLOB NOT NULL,
            created_at TEXT NOT NULL
        );
        """;

    private readonly string connectionString;
    private readonly Lazy<Task> created;

    /// <summary>A store in the file at <paramref name="path"/>, created with its folder on first use.</summary>
    public SqliteApiKeyStore(string path)
    {
        connectionString = new SqliteConnectionStringBuilder { DataSource = path, Mode = SqliteOpenMode.ReadWriteCreate }.ToString();
        created = new Lazy<Task>(() => CreateAsync(path));
    }

    /// <inheritdoc />
    public async Task AddAsync(StoredApiKey key, CancellationToken cancellationToken)
    {
        await using var connection = await OpenAsync(cancellationToken);
        await using var command = connection.CreateCommand();
        command.CommandText = "INSERT INTO api_keys (id, owner, sha256, created_at) VALUES ($id, $owner, $sha256, $createdAt)";
        command.Parameters.AddWithValue("$id", key.Id);
        command.Parameters.AddWithValue("$owner", key.Owner);
        command.Parameters.AddWithValue("$sha256", key.Sha256);
        command.Parameters.AddWithValue("$createdAt", key.CreatedAt.ToString("O"));
        await command.ExecuteNonQueryAsync(cancellationToken);
    }

    /// <inheritdoc />
    public async Task<StoredApiKey?> FindAsync(string id, CancellationToken cancellationToken)
    {
        await using var connection = await OpenAsync(cancellationToken);
        await using var command = connection.CreateCommand();
        command.CommandText = "SELECT owner, sha256, created_at FROM api_keys WHERE id = $id";
        command.Parameters.AddWithValue("$id", id);
        await using var reader = await command.ExecuteReaderAsync(cancellationToken);
        if (!await reader.ReadAsync(cancellationToken))
        {
            return null;
        }

        return new StoredApiKey(id, reader.GetString(0), (byte[])reader[1], DateTimeOffset.Parse(reader.GetString(2), System.Globalization.CultureInfo.InvariantCulture));
    }

    private async Task<SqliteConnection> OpenAsync(CancellationToken cancellationToken)
    {
        await created.Value;
        var connection = new SqliteConnection(connectionString);
        await connection.OpenAsync(cancellationToken);
        return connection;
    }

    private async Task CreateAsync(string path)
    {
        if (Path.GetDirectoryName(Path.GetFullPath(path)) is { } folder)
        {
            Directory.CreateDirectory(folder);
        }

        await using var connection = new SqliteConnection(connectionString);
        await connection.OpenAsync();
        await using var command = connection.CreateCommand();
        command.CommandText = Schema;
        await command.ExecuteNonQueryAsync();
    }
}
