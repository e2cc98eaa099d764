using System.Data.Common;
using Npgsql;

namespace SafetyMirror.Studies.Storage;

/// <summary>Studies in PostgreSQL with PostGIS, for a shared server: the plan extent is a geometry with a GiST index.</summary>
/// <remarks>The database needs <c>CREATE EXTENSION postgis</c> (done by an administrator; the store does not need superuser rights).</remarks>
public sealed class PostgresStudyStore : SqlStudyStore
{
    readonly NpgsqlDataSource dataSource;

    /// <summary>A store on the database of <paramref name="connectionString"/>; call <see cref="SqlStudyStore.MigrateAsync"/> before use.</summary>
    public PostgresStudyStore(string connectionString, TimeProvider time) : base(time) =>
        dataSource = NpgsqlDataSource.Create(connectionString);

    /// <inheritdoc/>
    protected override IReadOnlyList<Migration> Migrations { get; } =
    [
        new(1, "studies and their immutable revisions", """
            CREATE TABLE studies (
                id uuid PRIMARY KEY,
                title text NOT NULL,
                site_text text NOT NULL,
                site geometry(Point, 4326),
                extent geometry(Geometry, 4326),
                owner text NOT NULL,
                archived boolean NOT NULL,
                created_at timestamptz NOT NULL,
                latest_revision integer NOT NULL);
            CREATE INDEX studies_extent ON studies USING gist (extent);
            CREATE TABLE revisions (
                study_id uuid NOT NULL REFERENCES studies (id),
                number integer NOT NULL,
                plan_json text NOT NULL,
                options_json text NOT NULL,
                mirror_json text,
                service_version text NOT NULL,
                rule_set_json text NOT NULL,
                evaluation_json text,
                recommendation_json text,
                author text NOT NULL,
                note text NOT NULL,
                created_at timestamptz NOT NULL,
                content_hash text NOT NULL,
                PRIMARY KEY (study_id, number));
            CREATE FUNCTION refuse_revision_change() RETURNS trigger LANGUAGE plpgsql AS
                $$ BEGIN RAISE EXCEPTION 'a revision never changes and is never deleted'; END $$;
            CREATE TRIGGER revisions_never_change BEFORE UPDATE OR DELETE ON revisions
                FOR EACH ROW EXECUTE FUNCTION refuse_revision_change();
            """),
        new(2, "studies remember when they were last revised", """
            ALTER TABLE studies ADD COLUMN updated_at timestamptz;
            UPDATE studies SET updated_at = coalesce(
                (SELECT max(created_at) FROM revisions WHERE revisions.study_id = studies.id), created_at);
            CREATE INDEX studies_recent ON studies (updated_at DESC, id DESC);
            """),
        new(3, "district batches and their corners", """
            CREATE TABLE batches (
                id uuid PRIMARY KEY,
                name text NOT NULL,
                owner text NOT NULL,
                state text NOT NULL,
                corners_per_job integer NOT NULL,
                created_at timestamptz NOT NULL,
                started_at timestamptz);
            CREATE TABLE batch_corners (
                batch_id uuid NOT NULL REFERENCES batches (id),
                position integer NOT NULL,
                corner text NOT NULL,
                name text NOT NULL,
                plan_json text NOT NULL,
                mirror_json text,
                options_json text NOT NULL,
                paths_json text NOT NULL,
                status text NOT NULL,
                attempts integer NOT NULL,
                worker text,
                finished_at timestamptz,
                outcome_json text,
                problem_json text,
                study_id uuid,
                PRIMARY KEY (batch_id, position));
            CREATE INDEX batch_corners_status ON batch_corners (batch_id, status);
            """),
    ];

    /// <inheritdoc/>
    protected override string StudyColumns => """
        id, title, site_text, ST_X(site), ST_Y(site), ST_XMin(extent), ST_YMin(extent), ST_XMax(extent), ST_YMax(extent),
        owner, archived, created_at, latest_revision, updated_at
        """;

    /// <inheritdoc/>
    protected override string InsertStudy => """
        INSERT INTO studies (id, title, site_text, site, extent, owner, archived, created_at, latest_revision, updated_at)
        VALUES (@id, @title, @site_text, ST_SetSRID(ST_MakePoint(@site_lon, @site_lat), 4326),
                ST_MakeEnvelope(@west, @south, @east, @north, 4326), @owner, @archived, @created_at, @latest_revision, @updated_at)
        """;

    /// <inheritdoc/>
    protected override string ExtentIntersects => "extent && ST_MakeEnvelope(@west, @south, @east, @north, 4326)";

    /// <inheritdoc/>
    protected override string Contains(string column) => $"strpos(lower({column}), @text) > 0";

    /// <inheritdoc/>
    protected override string? MigrationLock => "SELECT pg_advisory_xact_lock(hashtext('safetymirror.studies.migrations'))";

    /// <inheritdoc/>
    protected override async Task<DbConnection> OpenAsync(CancellationToken cancellationToken) =>
        await dataSource.OpenConnectionAsync(cancellationToken);

    /// <inheritdoc/>
    public override ValueTask DisposeAsync() => dataSource.DisposeAsync();
}
