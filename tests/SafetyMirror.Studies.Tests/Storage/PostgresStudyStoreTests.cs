using System.Data.Common;
using Npgsql;
using SafetyMirror.Studies.Storage;

namespace SafetyMirror.Studies.Tests.Storage;

/// <summary>The store contract on a real PostgreSQL with PostGIS (SAFETYMIRROR_TEST_POSTGRES), one schema per test.</summary>
public sealed class PostgresStudyStoreTests : StudyStoreContract
{
    protected override string BackendName => "postgres";

    protected override Task<string> CreateLocationAsync() => TestPostgres.CreateSchemaAsync();

    protected override Task DeleteLocationAsync(string location) => TestPostgres.DropSchemaAsync(location);

    protected override SqlStudyStore OpenStore(string location, TimeProvider time) => new PostgresStudyStore(location, time);

    protected override async Task<DbConnection> OpenRawAsync(string location)
    {
        var connection = new NpgsqlConnection(location);
        await connection.OpenAsync();
        return connection;
    }

    protected override string SeedVersionOneSql => """
        INSERT INTO studies (id, title, site_text, site, extent, owner, archived, created_at, latest_revision)
        VALUES (@id, 'Old corner', 'Quarry Lane', ST_SetSRID(ST_MakePoint(4.3505, 50.8503), 4326),
                ST_MakeEnvelope(4.3500, 50.8500, 4.3510, 50.8506, 4326), 'eastwick-roads', false, '2025-05-30 10:00:00+00', 1);
        INSERT INTO revisions (study_id, number, plan_json, options_json, mirror_json, service_version, rule_set_json,
                               evaluation_json, recommendation_json, author, note, created_at, content_hash)
        VALUES (@id, 1, '{"type":"FeatureCollection","features":[]}', '{}', NULL, '0.9.0', '{}', NULL, NULL,
                'A. Planner', 'before the upgrade', '2025-06-01 08:00:00+00',
                '6e9a08e8367c34b085f3bcddf8cf331510999a61dbac1edd95d28546059a6ee1');
        """;
}
