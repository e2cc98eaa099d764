using System.Data.Common;
using Microsoft.Data.Sqlite;

namespace SafetyMirror.Studies.Storage;

/// <summary>Studies in one SQLite file: embedded, nothing to install. WAL journal, full sync on every commit.</summary>
/// <remarks>
/// Writers take the database's write lock at BEGIN (IMMEDIATE), so concurrent writers wait their turn (up to the
/// command timeout) instead of failing; readers never wait. Text search lower-cases ASCII letters only.
/// The extent is four plain columns with an R*Tree beside them (filled by a trigger; studies never move); the R*Tree
/// keeps 32-bit floats rounded outwards, so it picks candidates and the exact columns decide.
/// </remarks>
public sealed class SqliteStudyStore : SqlStudyStore
{
    readonly string connectionString;

    /// <summary>A store on the file at <paramref name="path"/> (created if missing, put in WAL mode); call <see cref="SqlStudyStore.MigrateAsync"/> before use.</summary>
    public SqliteStudyStore(string path, TimeProvider time) : base(time)
    {
        connectionString = new SqliteConnectionStringBuilder
        {
            DataSource = path,
            Mode = SqliteOpenMode.ReadWriteCreate,
            ForeignKeys = true,
            Pooling = true,
        }.ToString();
        using var connection = new SqliteConnection(connectionString);
        connection.Open();
        using var wal = connection.CreateCommand();
        wal.CommandText = "PRAGMA journal_mode = WAL";
        wal.ExecuteNonQuery();
    }

    /// <inheritdoc/>
    protected override IReadOnlyList<Migration> Migrations { get; } =
    [
        new(1, "studies and their immutable revisions", """
            CREATE TABLE studies (
                id blob PRIMARY KEY,
                title text NOT NULL,
                site_text text NOT NULL,
                site_lon real,
                site_lat real,
                west real,
                south real,
                east real,
                north real,
                owner text NOT NULL,
                archived integer NOT NULL,
                created_at text NOT NULL,
                latest_revision integer NOT NULL);
            CREATE INDEX studies_extent ON studies (west, east);
            CREATE TABLE revisions (
                study_id blob NOT NULL REFERENCES studies (id),
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
                created_at text NOT NULL,
                content_hash text NOT NULL,
                PRIMARY KEY (study_id, number));
            CREATE TRIGGER revisions_never_change BEFORE UPDATE ON revisions
            BEGIN SELECT raise(ABORT, 'a revision never changes'); END;
            CREATE TRIGGER revisions_never_go BEFORE DELETE ON revisions
            BEGIN SELECT raise(ABORT, 'a revision is never deleted'); END;
            """),
        new(2, "studies remember when they were last revised", """
            ALTER TABLE studies ADD COLUMN updated_at text;
            UPDATE studies SET updated_at = coalesce(
                (SELECT max(created_at) FROM revisions WHERE revisions.study_id = studies.id), created_at);
            CREATE INDEX studies_recent ON studies (updated_at DESC, id DESC);
            """),
        new(3, "an R*Tree over the study extents for bounding-box search", """
            DROP INDEX studies_extent;
            CREATE VIRTUAL TABLE study_extents USING rtree (study_rowid, west, east, south, north);
            INSERT INTO study_extents SELECT rowid, west, east, south, north FROM studies WHERE west IS NOT NULL;
            CREATE TRIGGER study_extents_fill AFTER INSERT ON studies WHEN new.west IS NOT NULL
            BEGIN INSERT INTO study_extents VALUES (new.rowid, new.west, new.east, new.south, new.north); END;
            """),
        new(4, "district batches and their corners", """
            CREATE TABLE batches (
                id blob PRIMARY KEY,
                name text NOT NULL,
                owner text NOT NULL,
                state text NOT NULL,
                corners_per_job integer NOT NULL,
                created_at text NOT NULL,
                started_at text);
            CREATE TABLE batch_corners (
                batch_id blob NOT NULL REFERENCES batches (id),
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
                finished_at text,
                outcome_json text,
                problem_json text,
                study_id blob,
                PRIMARY KEY (batch_id, position));
            CREATE INDEX batch_corners_status ON batch_corners (batch_id, status);
            """),
    ];

    /// <inheritdoc/>
    protected override string StudyColumns =>
        "id, title, site_text, site_lon, site_lat, west, south, east, north, owner, archived, created_at, latest_revision, updated_at";

    /// <inheritdoc/>
    protected override string InsertStudy => """
        INSERT INTO studies (id, title, site_text, site_lon, site_lat, west, south, east, north, owner, archived,
                             created_at, latest_revision, updated_at)
        VALUES (@id, @title, @site_text, @site_lon, @site_lat, @west, @south, @east, @north, @owner, @archived,
                @created_at, @latest_revision, @updated_at)
        """;

    /// <inheritdoc/>
    protected override string ExtentIntersects => """
        rowid IN (SELECT study_rowid FROM study_extents
                  WHERE west <= @east AND east >= @west AND south <= @north AND north >= @south)
        AND west <= @east AND east >= @west AND south <= @north AND north >= @south
        """;

    /// <inheritdoc/>
    protected override string Contains(string column) => $"instr(lower({column}), @text) > 0";

    /// <inheritdoc/>
    protected override Task<DbTransaction> BeginSnapshotAsync(DbConnection connection, CancellationToken cancellationToken) =>
        Task.FromResult<DbTransaction>(((SqliteConnection)connection).BeginTransaction(deferred: true));

    /// <inheritdoc/>
    protected override async Task<DbConnection> OpenAsync(CancellationToken cancellationToken)
    {
        var connection = new SqliteConnection(connectionString);
        await connection.OpenAsync(cancellationToken);
        // Per connection: a commit returns only once the WAL is on disk, so an acknowledged write survives a power cut.
        await using var sync = connection.CreateCommand();
        sync.CommandText = "PRAGMA synchronous = FULL";
        await sync.ExecuteNonQueryAsync(cancellationToken);
        return connection;
    }

    /// <inheritdoc/>
    public override ValueTask DisposeAsync()
    {
        SqliteConnection.ClearAllPools();
        return ValueTask.CompletedTask;
    }
}
