using System.Data;
using System.Data.Common;

namespace SafetyMirror.Studies.Storage;

/// <summary>
/// The study store written once in SQL that SQLite and PostgreSQL both speak; each back-end supplies its schema,
/// its connections and the few expressions where the two differ (geometry, text search).
/// </summary>
/// <remarks>
/// Revision numbers come from the study row: <c>UPDATE studies SET latest_revision = latest_revision + 1 … RETURNING</c>
/// locks that row until the transaction ends (SQLite takes the database write lock), so concurrent adds are numbered
/// one after the other and none is lost.
/// </remarks>
public abstract partial class SqlStudyStore : IStudyStore, IAsyncDisposable
{
    readonly TimeProvider time;

    /// <summary>Makes a store that stamps studies and revisions with the given clock.</summary>
    protected SqlStudyStore(TimeProvider time) => this.time = time;

    /// <summary>The schema, step by step.</summary>
    protected abstract IReadOnlyList<Migration> Migrations { get; }

    /// <summary>The study columns in the order <see cref="ReadStudy"/> reads them.</summary>
    protected abstract string StudyColumns { get; }

    /// <summary>The INSERT of a study row from @id, @title, @site_text, @site_lon, @site_lat, @west, @south, @east, @north,
    /// @owner, @archived, @created_at, @latest_revision, @updated_at.</summary>
    protected abstract string InsertStudy { get; }

    /// <summary>A predicate on the study row: its extent meets the box @west, @south, @east, @north.</summary>
    protected abstract string ExtentIntersects { get; }

    /// <summary>A predicate: the text of <paramref name="column"/>, lower-cased, contains @text.</summary>
    protected abstract string Contains(string column);

    /// <summary>Statements run inside each migration transaction before the version is read, to keep migrators apart.</summary>
    protected virtual string? MigrationLock => null;

    /// <summary>A read-only transaction that sees one committed state and does not hold writers back.</summary>
    protected virtual async Task<DbTransaction> BeginSnapshotAsync(DbConnection connection, CancellationToken cancellationToken) =>
        await connection.BeginTransactionAsync(IsolationLevel.RepeatableRead, cancellationToken);

    /// <summary>An open connection, ready for work.</summary>
    protected abstract Task<DbConnection> OpenAsync(CancellationToken cancellationToken);

    /// <summary>Lets go of the back-end's pooled connections.</summary>
    public abstract ValueTask DisposeAsync();

    /// <summary>The newest schema version this store knows.</summary>
    public int LatestSchemaVersion => Migrations[^1].Version;

    /// <summary>Brings the schema up to <paramref name="toVersion"/> (the newest when null); safe to run from several processes at once.</summary>
    /// <returns>The schema version afterwards.</returns>
    public async Task<int> MigrateAsync(int? toVersion = null, CancellationToken cancellationToken = default)
    {
        await using var connection = await OpenAsync(cancellationToken);
        await using (var transaction = await connection.BeginTransactionAsync(cancellationToken))
        {
            if (MigrationLock is { } lockSql) await Execute(connection, transaction, lockSql, cancellationToken);
            await Execute(connection, transaction, """
                CREATE TABLE IF NOT EXISTS schema_migrations (
                    version integer PRIMARY KEY,
                    name text NOT NULL,
                    applied_at text NOT NULL)
                """, cancellationToken);
            await transaction.CommitAsync(cancellationToken);
        }
        foreach (var migration in Migrations.Where(m => m.Version <= (toVersion ?? LatestSchemaVersion)))
        {
            await using var transaction = await connection.BeginTransactionAsync(cancellationToken);
            if (MigrationLock is { } lockSql) await Execute(connection, transaction, lockSql, cancellationToken);
            // Another process may have migrated since this loop began.
            if (migration.Version <= await CurrentSchemaVersionAsync(connection, transaction, cancellationToken)) continue;
            await Execute(connection, transaction, migration.Sql, cancellationToken);
            await using var record = Command(connection, transaction,
                "INSERT INTO schema_migrations (version, name, applied_at) VALUES (@version, @name, @applied_at)");
            Parameter(record, "version", migration.Version);
            Parameter(record, "name", migration.Name);
            Parameter(record, "applied_at", time.GetUtcNow().ToString("O", System.Globalization.CultureInfo.InvariantCulture));
            await record.ExecuteNonQueryAsync(cancellationToken);
            await transaction.CommitAsync(cancellationToken);
        }
        return await CurrentSchemaVersionAsync(connection, null, cancellationToken);
    }

    /// <inheritdoc/>
    public async Task<StudyRecord> CreateAsync(NewStudy study, RevisionContent firstRevision, CancellationToken cancellationToken = default)
    {
        var hash = firstRevision.RequestHashHex();
        var now = Now();
        var stored = new Study(Guid.CreateVersion7(now), study.Title, study.SiteText, study.SitePoint, study.Extent, study.Owner,
            IsArchived: false, now, LatestRevision: 1, UpdatedAt: now);

        await using var connection = await OpenAsync(cancellationToken);
        await using var transaction = await connection.BeginTransactionAsync(cancellationToken);
        var revision = await InsertStudyAsync(connection, transaction, stored, firstRevision, hash, cancellationToken);
        await transaction.CommitAsync(cancellationToken);
        return new StudyRecord(stored, [Summary(revision)]);
    }

    /// <summary>Inserts a new study row and its first revision inside the caller's transaction.</summary>
    async Task<Revision> InsertStudyAsync(DbConnection connection, DbTransaction transaction, Study stored, RevisionContent firstRevision, string hash, CancellationToken cancellationToken)
    {
        await using (var insert = Command(connection, transaction, InsertStudy))
        {
            Parameter(insert, "id", stored.Id);
            Parameter(insert, "title", stored.Title);
            Parameter(insert, "site_text", stored.SiteText);
            Parameter(insert, "site_lon", stored.SitePoint?.LongitudeDeg);
            Parameter(insert, "site_lat", stored.SitePoint?.LatitudeDeg);
            AddBox(insert, stored.Extent);
            Parameter(insert, "owner", stored.Owner);
            Parameter(insert, "archived", false);
            Parameter(insert, "created_at", stored.CreatedAt);
            Parameter(insert, "latest_revision", 1);
            Parameter(insert, "updated_at", stored.CreatedAt);
            await insert.ExecuteNonQueryAsync(cancellationToken);
        }
        var revision = new Revision(stored.Id, 1, firstRevision, stored.CreatedAt, hash);
        await InsertRevision(connection, transaction, revision, cancellationToken);
        return revision;
    }

    /// <inheritdoc/>
    public async Task<RevisionWrite> AddRevisionAsync(Guid studyId, RevisionContent content, int? expectedLatest = null, CancellationToken cancellationToken = default)
    {
        var hash = content.RequestHashHex();
        var now = Now();

        await using var connection = await OpenAsync(cancellationToken);
        await using var transaction = await connection.BeginTransactionAsync(cancellationToken);
        await using var take = Command(connection, transaction, """
            UPDATE studies SET latest_revision = latest_revision + 1, updated_at = @updated_at
            WHERE id = @id AND NOT archived AND (@expected IS NULL OR latest_revision = @expected)
            RETURNING latest_revision
            """);
        Parameter(take, "id", studyId);
        Parameter(take, "updated_at", now);
        Parameter(take, "expected", expectedLatest);
        if (await take.ExecuteScalarAsync(cancellationToken) is not { } taken)
            return await RefusalAsync(connection, transaction, studyId, cancellationToken);

        var revision = new Revision(studyId, Convert.ToInt32(taken, System.Globalization.CultureInfo.InvariantCulture), content, now, hash);
        await InsertRevision(connection, transaction, revision, cancellationToken);
        await transaction.CommitAsync(cancellationToken);
        return new RevisionWrite(RevisionWriteOutcome.Added, revision, revision.Number);
    }

    /// <inheritdoc/>
    public async Task<StudyRecord?> GetStudyAsync(Guid studyId, CancellationToken cancellationToken = default)
    {
        await using var connection = await OpenAsync(cancellationToken);
        await using var transaction = await BeginSnapshotAsync(connection, cancellationToken);
        await using var select = Command(connection, transaction, $"SELECT {StudyColumns} FROM studies WHERE id = @id");
        Parameter(select, "id", studyId);
        Study study;
        await using (var reader = await select.ExecuteReaderAsync(cancellationToken))
        {
            if (!await reader.ReadAsync(cancellationToken)) return null;
            study = ReadStudy(reader);
        }

        await using var list = Command(connection, transaction, """
            SELECT number, author, created_at, note, content_hash FROM revisions WHERE study_id = @id ORDER BY number
            """);
        Parameter(list, "id", studyId);
        var revisions = new List<RevisionSummary>();
        await using (var reader = await list.ExecuteReaderAsync(cancellationToken))
            while (await reader.ReadAsync(cancellationToken))
                revisions.Add(new RevisionSummary(reader.GetInt32(0), reader.GetString(1),
                    reader.GetFieldValue<DateTimeOffset>(2), reader.GetString(3), reader.GetString(4)));
        await transaction.CommitAsync(cancellationToken);
        return new StudyRecord(study, revisions);
    }

    /// <inheritdoc/>
    public async Task<Revision?> GetRevisionAsync(Guid studyId, int number, CancellationToken cancellationToken = default)
    {
        await using var connection = await OpenAsync(cancellationToken);
        await using var select = Command(connection, null, """
            SELECT plan_json, options_json, mirror_json, service_version, rule_set_json, evaluation_json,
                   recommendation_json, author, note, created_at, content_hash
            FROM revisions WHERE study_id = @id AND number = @number
            """);
        Parameter(select, "id", studyId);
        Parameter(select, "number", number);
        await using var reader = await select.ExecuteReaderAsync(cancellationToken);
        if (!await reader.ReadAsync(cancellationToken)) return null;
        var content = new RevisionContent(reader.GetString(0), reader.GetString(1), NullableString(reader, 2),
            reader.GetString(3), reader.GetString(4), NullableString(reader, 5), NullableString(reader, 6),
            reader.GetString(7), reader.GetString(8));
        return new Revision(studyId, number, content, reader.GetFieldValue<DateTimeOffset>(9), reader.GetString(10));
    }

    /// <inheritdoc/>
    public async Task<StudyPage> ListAsync(StudyQuery query, CancellationToken cancellationToken = default)
    {
        ArgumentOutOfRangeException.ThrowIfLessThan(query.Limit, 1, nameof(query.Limit));
        ArgumentOutOfRangeException.ThrowIfGreaterThan(query.Limit, StudyQuery.MaxLimit, nameof(query.Limit));
        ArgumentOutOfRangeException.ThrowIfNegative(query.Offset, nameof(query.Offset));

        var conditions = new List<string> { "(@include_archived OR NOT archived)" };
        var text = string.IsNullOrWhiteSpace(query.Text) ? null : query.Text.Trim().ToLowerInvariant();
        if (text is not null) conditions.Add($"({Contains("title")} OR {Contains("site_text")})");
        if (query.Intersecting is not null) conditions.Add(ExtentIntersects);
        if (query.Owner is not null) conditions.Add("owner = @owner");
        var where = string.Join(" AND ", conditions);

        void Bind(DbCommand command)
        {
            Parameter(command, "include_archived", query.IncludeArchived);
            if (text is not null) Parameter(command, "text", text);
            if (query.Owner is not null) Parameter(command, "owner", query.Owner);
            AddBox(command, query.Intersecting);
        }

        await using var connection = await OpenAsync(cancellationToken);
        await using var transaction = await BeginSnapshotAsync(connection, cancellationToken);
        await using var count = Command(connection, transaction, $"SELECT count(*) FROM studies WHERE {where}");
        Bind(count);
        var total = Convert.ToInt32(await count.ExecuteScalarAsync(cancellationToken), System.Globalization.CultureInfo.InvariantCulture);

        await using var select = Command(connection, transaction, $"""
            SELECT {StudyColumns} FROM studies WHERE {where}
            ORDER BY updated_at DESC, id DESC LIMIT @limit OFFSET @offset
            """);
        Bind(select);
        Parameter(select, "limit", query.Limit);
        Parameter(select, "offset", query.Offset);
        var items = new List<Study>();
        await using (var reader = await select.ExecuteReaderAsync(cancellationToken))
            while (await reader.ReadAsync(cancellationToken))
                items.Add(ReadStudy(reader));
        await transaction.CommitAsync(cancellationToken);
        return new StudyPage(items, total);
    }

    /// <inheritdoc/>
    public async Task<bool> ArchiveAsync(Guid studyId, CancellationToken cancellationToken = default)
    {
        await using var connection = await OpenAsync(cancellationToken);
        await using var archive = Command(connection, null, "UPDATE studies SET archived = @archived WHERE id = @id");
        Parameter(archive, "archived", true);
        Parameter(archive, "id", studyId);
        return await archive.ExecuteNonQueryAsync(cancellationToken) > 0;
    }

    /// <summary>Why a revision was not taken; rolls the transaction back.</summary>
    async Task<RevisionWrite> RefusalAsync(DbConnection connection, DbTransaction transaction, Guid studyId, CancellationToken cancellationToken)
    {
        await using var state = Command(connection, transaction, "SELECT archived, latest_revision FROM studies WHERE id = @id");
        Parameter(state, "id", studyId);
        RevisionWrite answer;
        await using (var reader = await state.ExecuteReaderAsync(cancellationToken))
            answer = !await reader.ReadAsync(cancellationToken)
                ? new RevisionWrite(RevisionWriteOutcome.StudyNotFound, null, 0)
                : new RevisionWrite(reader.GetBoolean(0) ? RevisionWriteOutcome.Archived : RevisionWriteOutcome.Conflict, null, reader.GetInt32(1));
        await transaction.RollbackAsync(cancellationToken);
        return answer;
    }

    static async Task InsertRevision(DbConnection connection, DbTransaction transaction, Revision revision, CancellationToken cancellationToken)
    {
        await using var insert = Command(connection, transaction, """
            INSERT INTO revisions (study_id, number, plan_json, options_json, mirror_json, service_version, rule_set_json,
                                   evaluation_json, recommendation_json, author, note, created_at, content_hash)
            VALUES (@study_id, @number, @plan_json, @options_json, @mirror_json, @service_version, @rule_set_json,
                    @evaluation_json, @recommendation_json, @author, @note, @created_at, @content_hash)
            """);
        var content = revision.Content;
        Parameter(insert, "study_id", revision.StudyId);
        Parameter(insert, "number", revision.Number);
        Parameter(insert, "plan_json", content.PlanJson);
        Parameter(insert, "options_json", content.OptionsJson);
        Parameter(insert, "mirror_json", content.MirrorJson);
        Parameter(insert, "service_version", content.ServiceVersion);
        Parameter(insert, "rule_set_json", content.RuleSetJson);
        Parameter(insert, "evaluation_json", content.EvaluationJson);
        Parameter(insert, "recommendation_json", content.RecommendationJson);
        Parameter(insert, "author", content.Author);
        Parameter(insert, "note", content.Note);
        Parameter(insert, "created_at", revision.CreatedAt);
        Parameter(insert, "content_hash", revision.ContentHash);
        await insert.ExecuteNonQueryAsync(cancellationToken);
    }

    static async Task<int> CurrentSchemaVersionAsync(DbConnection connection, DbTransaction? transaction, CancellationToken cancellationToken)
    {
        await using var select = Command(connection, transaction, "SELECT coalesce(max(version), 0) FROM schema_migrations");
        return Convert.ToInt32(await select.ExecuteScalarAsync(cancellationToken), System.Globalization.CultureInfo.InvariantCulture);
    }

    static Study ReadStudy(DbDataReader reader) => new(
        reader.GetGuid(0),
        reader.GetString(1),
        reader.GetString(2),
        reader.IsDBNull(3) ? null : new GeoPoint(reader.GetDouble(3), reader.GetDouble(4)),
        reader.IsDBNull(5) ? null : new GeoBox(reader.GetDouble(5), reader.GetDouble(6), reader.GetDouble(7), reader.GetDouble(8)),
        reader.GetString(9),
        reader.GetBoolean(10),
        reader.GetFieldValue<DateTimeOffset>(11),
        reader.GetInt32(12),
        reader.GetFieldValue<DateTimeOffset>(13));

    static RevisionSummary Summary(Revision revision) =>
        new(revision.Number, revision.Content.Author, revision.CreatedAt, revision.Content.Note, revision.ContentHash);

    static string? NullableString(DbDataReader reader, int ordinal) => reader.IsDBNull(ordinal) ? null : reader.GetString(ordinal);

    /// <summary>The clock's time to the microsecond, the finest PostgreSQL keeps, so a written time reads back equal.</summary>
    DateTimeOffset Now()
    {
        var now = time.GetUtcNow();
        return now.AddTicks(-(now.Ticks % 10));
    }

    static void AddBox(DbCommand command, GeoBox? box)
    {
        Parameter(command, "west", box?.WestDeg);
        Parameter(command, "south", box?.SouthDeg);
        Parameter(command, "east", box?.EastDeg);
        Parameter(command, "north", box?.NorthDeg);
    }

    /// <summary>A command on the connection, inside the transaction when one is given.</summary>
    protected static DbCommand Command(DbConnection connection, DbTransaction? transaction, string sql)
    {
        var command = connection.CreateCommand();
        command.CommandText = sql;
        command.Transaction = transaction;
        return command;
    }

    static async Task Execute(DbConnection connection, DbTransaction? transaction, string sql, CancellationToken cancellationToken)
    {
        await using var command = Command(connection, transaction, sql);
        await command.ExecuteNonQueryAsync(cancellationToken);
    }

    // Typed even when null, so PostgreSQL can tell the type of "@expected IS NULL".
    static void Parameter(DbCommand command, string name, int? value) => Parameter(command, name, value, DbType.Int32);
    static void Parameter(DbCommand command, string name, double? value) => Parameter(command, name, value, DbType.Double);
    static void Parameter(DbCommand command, string name, string? value) => Parameter(command, name, value, DbType.String);
    static void Parameter(DbCommand command, string name, bool value) => Parameter(command, name, value, DbType.Boolean);
    static void Parameter(DbCommand command, string name, Guid value) => Parameter(command, name, value, DbType.Guid);
    static void Parameter(DbCommand command, string name, DateTimeOffset value) => Parameter(command, name, value, DbType.DateTimeOffset);

    static void Parameter(DbCommand command, string name, object? value, DbType type)
    {
        var parameter = command.CreateParameter();
        parameter.ParameterName = name;
        parameter.DbType = type;
        parameter.Value = value ?? DBNull.Value;
        command.Parameters.Add(parameter);
    }
}
