using System.Data.Common;
using Microsoft.Data.Sqlite;
using SafetyMirror.Studies.Storage;

namespace SafetyMirror.Studies.Tests.Storage;

/// <summary>The store contract on a real SQLite file in a temporary folder.</summary>
public sealed class SqliteStudyStoreTests : StudyStoreContract
{
    protected override string BackendName => "sqlite";

    protected override Task<string> CreateLocationAsync()
    {
        var folder = Directory.CreateTempSubdirectory("safetymirror-studies-");
        return Task.FromResult(Path.Combine(folder.FullName, "studies.db"));
    }

    protected override Task DeleteLocationAsync(string location)
    {
        SqliteConnection.ClearAllPools();
        Directory.Delete(Path.GetDirectoryName(location)!, recursive: true);
        return Task.CompletedTask;
    }

    protected override SqlStudyStore OpenStore(string location, TimeProvider time) => new SqliteStudyStore(location, time);

    protected override async Task<DbConnection> OpenRawAsync(string location)
    {
        var connection = new SqliteConnection($"Data Source={location}");
        await connection.OpenAsync();
        return connection;
    }

    protected override string SeedVersionOneSql => """
        INSERT INTO studies (id, title, site_text, site_lon, site_lat, west, south, east, north, owner, archived,
                             created_at, latest_revision)
        VALUES (@id, 'Old corner', 'Quarry Lane', 4.3505, 50.8503, 4.3500, 50.8500, 4.3510, 50.8506, 'eastwick-roads', 0,
                '2025-05-30 10:00:00+00:00', 1);
        INSERT INTO revisions (study_id, number, plan_json, options_json, mirror_json, service_version, rule_set_json,
                               evaluation_json, recommendation_json, author, note, created_at, content_hash)
        VALUES (@id, 1, '{"type":"FeatureCollection","features":[]}', '{}', NULL, '0.9.0', '{}', NULL, NULL,
                'A. Planner', 'before the upgrade', '2025-06-01 08:00:00+00:00',
                '6e9a08e8367c34b085f3bcddf8cf331510999a61dbac1edd95d28546059a6ee1');
        """;
}
