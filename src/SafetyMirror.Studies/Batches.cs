namespace SafetyMirror.Studies;

/// <summary>
/// Where district batches last: each batch is a list of corners, each corner screened once and, when it succeeds, kept as
/// a study of its own. Lives beside the studies so that a corner's result and its study are committed together.
/// </summary>
/// <remarks>
/// A corner is claimed before it is screened and recorded only if it is not recorded yet, in the same transaction that
/// creates its study: a corner screened twice (a worker presumed dead that was only slow) is still recorded once.
/// </remarks>
public interface IBatchStore
{
    /// <summary>Stores a batch and all its corners, pending (or failed at once when the split found a problem).</summary>
    Task<BatchRecord> CreateBatchAsync(NewBatch batch, IReadOnlyList<NewBatchCorner> corners, CancellationToken cancellationToken = default);

    /// <summary>A batch with its counts; null when there is none.</summary>
    Task<BatchRecord?> GetBatchAsync(Guid batchId, CancellationToken cancellationToken = default);

    /// <summary>Only the batch's state, cheaply: null when there is no such batch.</summary>
    Task<BatchState?> GetBatchStateAsync(Guid batchId, CancellationToken cancellationToken = default);

    /// <summary>A page of a batch's corners in their order in the batch.</summary>
    Task<IReadOnlyList<BatchCorner>> ListCornersAsync(Guid batchId, int offset, int limit, CancellationToken cancellationToken = default);

    /// <summary>
    /// Claims the corners at positions <paramref name="first"/> to <paramref name="last"/> that are pending or were left
    /// running by a worker that stopped; none when the batch is cancelled.
    /// </summary>
    Task<IReadOnlyList<ClaimedCorner>> ClaimCornersAsync(Guid batchId, int first, int last, string worker, CancellationToken cancellationToken = default);

    /// <summary>Records results in one transaction, each only if its corner is not recorded yet, with its study.</summary>
    /// <returns>How many were recorded (the rest had been recorded before).</returns>
    Task<int> RecordCornersAsync(Guid batchId, IReadOnlyList<CornerResult> results, CancellationToken cancellationToken = default);

    /// <summary>Puts claimed corners that were not screened back to pending (a cancelled batch's, for a later resume).</summary>
    Task ReleaseCornersAsync(Guid batchId, IReadOnlyList<int> positions, CancellationToken cancellationToken = default);

    /// <summary>Cancels or resumes a batch; false when there is none.</summary>
    Task<bool> SetBatchStateAsync(Guid batchId, BatchState state, CancellationToken cancellationToken = default);

    /// <summary>The active batches that still have corners not recorded.</summary>
    Task<IReadOnlyList<Guid>> UnfinishedBatchesAsync(CancellationToken cancellationToken = default);

    /// <summary>The positions of the corners not recorded yet, in order.</summary>
    Task<IReadOnlyList<int>> UnfinishedPositionsAsync(Guid batchId, CancellationToken cancellationToken = default);
}

/// <summary>A batch to store.</summary>
/// <param name="Name">What the engineer called it.</param>
/// <param name="Owner">The key owner who posted it; its corners' studies are this owner's.</param>
/// <param name="CornersPerJob">How many consecutive corners one job screens.</param>
public sealed record NewBatch(string Name, string Owner, int CornersPerJob);

/// <summary>One corner of a new batch.</summary>
/// <param name="Corner">The corner's id in the posted layer.</param>
/// <param name="Name">A readable name, the id when none was given.</param>
/// <param name="Input">The corner's own request.</param>
/// <param name="ProblemJson">Problem details when the corner could not even be split out; it is then failed from the start.</param>
public sealed record NewBatchCorner(string Corner, string Name, CornerInput Input, string? ProblemJson = null);

/// <summary>A corner's request as a single study would take it.</summary>
/// <param name="PlanJson">The plan: a GeoJSON FeatureCollection.</param>
/// <param name="MirrorJson">The mirror to evaluate, or null to recommend one.</param>
/// <param name="OptionsJson">The options, shared and per-corner merged.</param>
/// <param name="PathsJson">Where each part of the request stood in the posted batch, to name offending fields in its terms.</param>
public sealed record CornerInput(string PlanJson, string? MirrorJson, string OptionsJson, string PathsJson);

/// <summary>Whether a batch's corners are still being worked on.</summary>
public enum BatchState
{
    /// <summary>Its jobs screen the corners not recorded yet.</summary>
    Active,

    /// <summary>Its jobs stop; the corners not recorded stay pending until it is resumed.</summary>
    Cancelled,
}

/// <summary>Where a corner stands.</summary>
public enum CornerStatus
{
    /// <summary>Waiting for a job.</summary>
    Pending,

    /// <summary>Claimed by a worker.</summary>
    Running,

    /// <summary>Screened, its study stored.</summary>
    Done,

    /// <summary>Could not be screened; its problem details say why.</summary>
    Failed,
}

/// <summary>A stored batch with its counts.</summary>
/// <param name="Id">The batch's id.</param>
/// <param name="Name">Its name.</param>
/// <param name="Owner">Who posted it.</param>
/// <param name="State">Active or cancelled.</param>
/// <param name="CornersPerJob">Consecutive corners per job.</param>
/// <param name="CreatedAt">When it was posted.</param>
/// <param name="StartedAt">When a worker first claimed a corner, or null.</param>
/// <param name="LastFinishedAt">When the latest corner was recorded, or null.</param>
/// <param name="Counts">How many corners stand where.</param>
public sealed record BatchRecord(
    Guid Id, string Name, string Owner, BatchState State, int CornersPerJob, DateTimeOffset CreatedAt,
    DateTimeOffset? StartedAt, DateTimeOffset? LastFinishedAt, BatchCounts Counts);

/// <summary>How many corners of a batch stand where.</summary>
public sealed record BatchCounts(int Total, int Pending, int Running, int Done, int Failed)
{
    /// <summary>Corners recorded, done or failed.</summary>
    public int Finished => Done + Failed;
}

/// <summary>One corner of a stored batch, as far as it has got.</summary>
/// <param name="Position">Its place in the batch, from 0.</param>
/// <param name="Corner">Its id in the posted layer.</param>
/// <param name="Name">Its name.</param>
/// <param name="Status">Where it stands.</param>
/// <param name="Attempts">How many times a worker claimed it.</param>
/// <param name="Worker">The worker that recorded it, or that holds it.</param>
/// <param name="FinishedAt">When it was recorded.</param>
/// <param name="OutcomeJson">The screening outcome of a done corner.</param>
/// <param name="ProblemJson">The problem details of a failed corner.</param>
/// <param name="StudyId">The study that keeps a done corner.</param>
public sealed record BatchCorner(
    int Position, string Corner, string Name, CornerStatus Status, int Attempts, string? Worker,
    DateTimeOffset? FinishedAt, string? OutcomeJson, string? ProblemJson, Guid? StudyId);

/// <summary>A corner a worker claimed, with its request.</summary>
public sealed record ClaimedCorner(int Position, string Corner, string Name, CornerInput Input);

/// <summary>A screened corner to record: either its outcome and its study, or its problem details.</summary>
/// <param name="Position">The corner's place in the batch.</param>
/// <param name="Worker">The worker that screened it.</param>
/// <param name="OutcomeJson">The outcome of a screened corner; null when it failed.</param>
/// <param name="ProblemJson">The problem details of a failed corner; null when it was screened.</param>
/// <param name="Study">The study to create for a screened corner.</param>
/// <param name="Revision">The study's first revision.</param>
public sealed record CornerResult(int Position, string Worker, string? OutcomeJson, string? ProblemJson, NewStudy? Study, RevisionContent? Revision)
{
    /// <summary>A screened corner with its study.</summary>
    public static CornerResult Screened(int position, string worker, string outcomeJson, NewStudy study, RevisionContent revision) =>
        new(position, worker, outcomeJson, null, study, revision);

    /// <summary>A corner that could not be screened.</summary>
    public static CornerResult Failed(int position, string worker, string problemJson) => new(position, worker, null, problemJson, null, null);
}
