using System.Data.Common;
using System.Globalization;

namespace SafetyMirror.Studies.Storage;

/// <summary>The batch half of the store: batches and their corners, in the same database as the studies they create.</summary>
public abstract partial class SqlStudyStore : IBatchStore
{
    const string Unrecorded = "status IN ('pending', 'running')";

    /// <inheritdoc/>
    public async Task<BatchRecord> CreateBatchAsync(NewBatch batch, IReadOnlyList<NewBatchCorner> corners, CancellationToken cancellationToken = default)
    {
        ArgumentNullException.ThrowIfNull(batch);
        ArgumentNullException.ThrowIfNull(corners);
        var now = Now();
        var id = Guid.CreateVersion7(now);
        await using var connection = await OpenAsync(cancellationToken);
        await using var transaction = await connection.BeginTransactionAsync(cancellationToken);
        await using (var insert = Command(connection, transaction, """
            INSERT INTO batches (id, name, owner, state, corners_per_job, created_at)
            VALUES (@id, @name, @owner, 'active', @corners_per_job, @created_at)
            """))
        {
            Parameter(insert, "id", id);
            Parameter(insert, "name", batch.Name);
            Parameter(insert, "owner", batch.Owner);
            Parameter(insert, "corners_per_job", batch.CornersPerJob);
            Parameter(insert, "created_at", now);
            await insert.ExecuteNonQueryAsync(cancellationToken);
        }

        // One prepared statement for every corner: a district is thousands of rows.
        await using var corner = Command(connection, transaction, """
            INSERT INTO batch_corners (batch_id, position, corner, name, plan_json, mirror_json, options_json, paths_json,
                                       status, attempts, problem_json, finished_at)
            VALUES (@batch_id, @position, @corner, @name, @plan_json, @mirror_json, @options_json, @paths_json,
                    @status, 0, @problem_json, @finished_at)
            """);
        Parameter(corner, "batch_id", id);
        Parameter(corner, "position", 0);
        foreach (var name in new[] { "corner", "name", "plan_json", "mirror_json", "options_json", "paths_json", "status", "problem_json" })
            Parameter(corner, name, (string?)null);
        Parameter(corner, "finished_at", (object?)null, System.Data.DbType.DateTimeOffset);
        await corner.PrepareAsync(cancellationToken);
        var counts = new BatchCounts(corners.Count, 0, 0, 0, 0);
        for (var position = 0; position < corners.Count; position++)
        {
            var given = corners[position];
            var failed = given.ProblemJson is not null;
            corner.Parameters["position"].Value = position;
            corner.Parameters["corner"].Value = given.Corner;
            corner.Parameters["name"].Value = given.Name;
            corner.Parameters["plan_json"].Value = given.Input.PlanJson;
            corner.Parameters["mirror_json"].Value = (object?)given.Input.MirrorJson ?? DBNull.Value;
            corner.Parameters["options_json"].Value = given.Input.OptionsJson;
            corner.Parameters["paths_json"].Value = given.Input.PathsJson;
            corner.Parameters["status"].Value = failed ? "failed" : "pending";
            corner.Parameters["problem_json"].Value = (object?)given.ProblemJson ?? DBNull.Value;
            corner.Parameters["finished_at"].Value = failed ? now : DBNull.Value;
            await corner.ExecuteNonQueryAsync(cancellationToken);
            counts = failed ? counts with { Failed = counts.Failed + 1 } : counts with { Pending = counts.Pending + 1 };
        }

        await transaction.CommitAsync(cancellationToken);
        return new BatchRecord(id, batch.Name, batch.Owner, BatchState.Active, batch.CornersPerJob, now, null,
            counts.Failed > 0 ? now : null, counts);
    }

    /// <inheritdoc/>
    public async Task<BatchRecord?> GetBatchAsync(Guid batchId, CancellationToken cancellationToken = default)
    {
        await using var connection = await OpenAsync(cancellationToken);
        await using var transaction = await BeginSnapshotAsync(connection, cancellationToken);
        await using var select = Command(connection, transaction,
            "SELECT name, owner, state, corners_per_job, created_at, started_at FROM batches WHERE id = @id");
        Parameter(select, "id", batchId);
        BatchRecord batch;
        await using (var reader = await select.ExecuteReaderAsync(cancellationToken))
        {
            if (!await reader.ReadAsync(cancellationToken)) return null;
            batch = new BatchRecord(batchId, reader.GetString(0), reader.GetString(1), ParseState(reader.GetString(2)), reader.GetInt32(3),
                reader.GetFieldValue<DateTimeOffset>(4), NullableTime(reader, 5), null, new BatchCounts(0, 0, 0, 0, 0));
        }

        await using var tally = Command(connection, transaction,
            "SELECT status, count(*), max(finished_at) FROM batch_corners WHERE batch_id = @id GROUP BY status");
        Parameter(tally, "id", batchId);
        var (counts, lastFinished) = (batch.Counts, (DateTimeOffset?)null);
        await using (var reader = await tally.ExecuteReaderAsync(cancellationToken))
            while (await reader.ReadAsync(cancellationToken))
            {
                var n = Convert.ToInt32(reader.GetValue(1), CultureInfo.InvariantCulture);
                counts = ParseStatus(reader.GetString(0)) switch
                {
                    CornerStatus.Pending => counts with { Pending = n },
                    CornerStatus.Running => counts with { Running = n },
                    CornerStatus.Done => counts with { Done = n },
                    _ => counts with { Failed = n },
                };
                counts = counts with { Total = counts.Total + n };
                if (NullableTime(reader, 2) is { } finished && (lastFinished is null || finished > lastFinished)) lastFinished = finished;
            }
        await transaction.CommitAsync(cancellationToken);
        return batch with { Counts = counts, LastFinishedAt = lastFinished };
    }

    /// <inheritdoc/>
    public async Task<BatchState?> GetBatchStateAsync(Guid batchId, CancellationToken cancellationToken = default)
    {
        await using var connection = await OpenAsync(cancellationToken);
        await using var select = Command(connection, null, "SELECT state FROM batches WHERE id = @id");
        Parameter(select, "id", batchId);
        return await select.ExecuteScalarAsync(cancellationToken) is string state ? ParseState(state) : null;
    }

    /// <inheritdoc/>
    public async Task<IReadOnlyList<BatchCorner>> ListCornersAsync(Guid batchId, int offset, int limit, CancellationToken cancellationToken = default)
    {
        await using var connection = await OpenAsync(cancellationToken);
        await using var select = Command(connection, null, """
            SELECT position, corner, name, status, attempts, worker, finished_at, outcome_json, problem_json, study_id
            FROM batch_corners WHERE batch_id = @id ORDER BY position LIMIT @limit OFFSET @offset
            """);
        Parameter(select, "id", batchId);
        Parameter(select, "limit", limit);
        Parameter(select, "offset", offset);
        var corners = new List<BatchCorner>();
        await using var reader = await select.ExecuteReaderAsync(cancellationToken);
        while (await reader.ReadAsync(cancellationToken))
            corners.Add(new BatchCorner(reader.GetInt32(0), reader.GetString(1), reader.GetString(2), ParseStatus(reader.GetString(3)),
                reader.GetInt32(4), NullableString(reader, 5), NullableTime(reader, 6), NullableString(reader, 7),
                NullableString(reader, 8), reader.IsDBNull(9) ? null : reader.GetGuid(9)));
        return corners;
    }

    /// <inheritdoc/>
    public async Task<IReadOnlyList<ClaimedCorner>> ClaimCornersAsync(Guid batchId, int first, int last, string worker, CancellationToken cancellationToken = default)
    {
        var now = Now();
        await using var connection = await OpenAsync(cancellationToken);
        await using var transaction = await connection.BeginTransactionAsync(cancellationToken);
        await using (var start = Command(connection, transaction,
            "UPDATE batches SET started_at = coalesce(started_at, @now) WHERE id = @id AND state = 'active'"))
        {
            Parameter(start, "now", now);
            Parameter(start, "id", batchId);
            if (await start.ExecuteNonQueryAsync(cancellationToken) == 0) return [];
        }

        await using var claim = Command(connection, transaction, $"""
            UPDATE batch_corners SET status = 'running', worker = @worker, attempts = attempts + 1
            WHERE batch_id = @id AND position BETWEEN @first AND @last AND {Unrecorded}
            RETURNING position, corner, name, plan_json, mirror_json, options_json, paths_json
            """);
        Parameter(claim, "worker", worker);
        Parameter(claim, "id", batchId);
        Parameter(claim, "first", first);
        Parameter(claim, "last", last);
        var claimed = new List<ClaimedCorner>();
        await using (var reader = await claim.ExecuteReaderAsync(cancellationToken))
            while (await reader.ReadAsync(cancellationToken))
                claimed.Add(new ClaimedCorner(reader.GetInt32(0), reader.GetString(1), reader.GetString(2),
                    new CornerInput(reader.GetString(3), NullableString(reader, 4), reader.GetString(5), reader.GetString(6))));
        await transaction.CommitAsync(cancellationToken);
        return [.. claimed.OrderBy(c => c.Position)];
    }

    /// <inheritdoc/>
    public async Task<int> RecordCornersAsync(Guid batchId, IReadOnlyList<CornerResult> results, CancellationToken cancellationToken = default)
    {
        ArgumentNullException.ThrowIfNull(results);
        if (results.Count == 0) return 0;
        var now = Now();
        await using var connection = await OpenAsync(cancellationToken);
        await using var transaction = await connection.BeginTransactionAsync(cancellationToken);
        var recorded = 0;
        foreach (var result in results)
        {
            var studyId = result.Study is null ? (Guid?)null : Guid.CreateVersion7(now);
            await using (var record = Command(connection, transaction, $"""
                UPDATE batch_corners SET status = @status, worker = @worker, finished_at = @now, outcome_json = @outcome_json,
                                         problem_json = @problem_json, study_id = @study_id
                WHERE batch_id = @id AND position = @position AND {Unrecorded}
                """))
            {
                Parameter(record, "status", result.OutcomeJson is null ? "failed" : "done");
                Parameter(record, "worker", result.Worker);
                Parameter(record, "now", now);
                Parameter(record, "outcome_json", result.OutcomeJson);
                Parameter(record, "problem_json", result.ProblemJson);
                Parameter(record, "study_id", studyId, System.Data.DbType.Guid);
                Parameter(record, "id", batchId);
                Parameter(record, "position", result.Position);
                if (await record.ExecuteNonQueryAsync(cancellationToken) == 0) continue;
            }

            recorded++;
            if (studyId is { } id && result.Study is { } study && result.Revision is { } revision)
            {
                var stored = new Study(id, study.Title, study.SiteText, study.SitePoint, study.Extent, study.Owner,
                    IsArchived: false, now, LatestRevision: 1, UpdatedAt: now);
                await InsertStudyAsync(connection, transaction, stored, revision, revision.RequestHashHex(), cancellationToken);
            }
        }

        await transaction.CommitAsync(cancellationToken);
        return recorded;
    }

    /// <inheritdoc/>
    public async Task ReleaseCornersAsync(Guid batchId, IReadOnlyList<int> positions, CancellationToken cancellationToken = default)
    {
        ArgumentNullException.ThrowIfNull(positions);
        await using var connection = await OpenAsync(cancellationToken);
        await using var transaction = await connection.BeginTransactionAsync(cancellationToken);
        foreach (var position in positions)
        {
            await using var release = Command(connection, transaction,
                "UPDATE batch_corners SET status = 'pending', worker = NULL WHERE batch_id = @id AND position = @position AND status = 'running'");
            Parameter(release, "id", batchId);
            Parameter(release, "position", position);
            await release.ExecuteNonQueryAsync(cancellationToken);
        }

        await transaction.CommitAsync(cancellationToken);
    }

    /// <inheritdoc/>
    public async Task<bool> SetBatchStateAsync(Guid batchId, BatchState state, CancellationToken cancellationToken = default)
    {
        await using var connection = await OpenAsync(cancellationToken);
        await using var update = Command(connection, null, "UPDATE batches SET state = @state WHERE id = @id");
        Parameter(update, "state", state == BatchState.Active ? "active" : "cancelled");
        Parameter(update, "id", batchId);
        return await update.ExecuteNonQueryAsync(cancellationToken) > 0;
    }

    /// <inheritdoc/>
    public async Task<IReadOnlyList<int>> UnfinishedPositionsAsync(Guid batchId, CancellationToken cancellationToken = default)
    {
        await using var connection = await OpenAsync(cancellationToken);
        await using var select = Command(connection, null,
            $"SELECT position FROM batch_corners WHERE batch_id = @id AND {Unrecorded} ORDER BY position");
        Parameter(select, "id", batchId);
        var positions = new List<int>();
        await using var reader = await select.ExecuteReaderAsync(cancellationToken);
        while (await reader.ReadAsync(cancellationToken)) positions.Add(reader.GetInt32(0));
        return positions;
    }

    /// <inheritdoc/>
    public async Task<IReadOnlyList<Guid>> UnfinishedBatchesAsync(CancellationToken cancellationToken = default)
    {
        await using var connection = await OpenAsync(cancellationToken);
        await using var select = Command(connection, null, $"""
            SELECT id FROM batches WHERE state = 'active'
            AND EXISTS (SELECT 1 FROM batch_corners WHERE batch_id = batches.id AND {Unrecorded})
            ORDER BY created_at
            """);
        var batches = new List<Guid>();
        await using var reader = await select.ExecuteReaderAsync(cancellationToken);
        while (await reader.ReadAsync(cancellationToken)) batches.Add(reader.GetGuid(0));
        return batches;
    }

    static BatchState ParseState(string state) => state == "cancelled" ? BatchState.Cancelled : BatchState.Active;

    static CornerStatus ParseStatus(string status) => status switch
    {
        "pending" => CornerStatus.Pending,
        "running" => CornerStatus.Running,
        "done" => CornerStatus.Done,
        _ => CornerStatus.Failed,
    };

    static DateTimeOffset? NullableTime(DbDataReader reader, int ordinal) =>
        reader.IsDBNull(ordinal) ? null : reader.GetFieldValue<DateTimeOffset>(ordinal);
}
