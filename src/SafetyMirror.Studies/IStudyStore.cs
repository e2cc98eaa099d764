namespace SafetyMirror.Studies;

/// <summary>Where studies and their revisions last. Every write is one transaction, acknowledged only once committed.</summary>
/// <remarks>Not-found is an answer (null, false or <see cref="RevisionWriteOutcome.StudyNotFound"/>), never an exception.</remarks>
public interface IStudyStore
{
    /// <summary>Creates a study with its first revision, numbered 1.</summary>
    Task<StudyRecord> CreateAsync(NewStudy study, RevisionContent firstRevision, CancellationToken cancellationToken = default);

    /// <summary>Adds revision n + 1 to a live study.</summary>
    /// <param name="studyId">The study to revise.</param>
    /// <param name="content">The new revision's request, answers, author and note.</param>
    /// <param name="expectedLatest">
    /// The revision the change was based on: when given and no longer the newest, nothing is written and the answer
    /// is <see cref="RevisionWriteOutcome.Conflict"/> with the current number. When null, concurrent adds are
    /// numbered one after the other.
    /// </param>
    /// <param name="cancellationToken">Cancels the call; a write then either committed whole or not at all.</param>
    Task<RevisionWrite> AddRevisionAsync(Guid studyId, RevisionContent content, int? expectedLatest = null, CancellationToken cancellationToken = default);

    /// <summary>A study and the list of its revisions, oldest first; null when there is no such study.</summary>
    Task<StudyRecord?> GetStudyAsync(Guid studyId, CancellationToken cancellationToken = default);

    /// <summary>One revision; null when the study or the revision does not exist.</summary>
    Task<Revision?> GetRevisionAsync(Guid studyId, int number, CancellationToken cancellationToken = default);

    /// <summary>A page of studies, most recently revised first.</summary>
    Task<StudyPage> ListAsync(StudyQuery query, CancellationToken cancellationToken = default);

    /// <summary>Archives a study (it stays readable and takes no more revisions); false when there is no such study.</summary>
    Task<bool> ArchiveAsync(Guid studyId, CancellationToken cancellationToken = default);
}

/// <summary>A study with its revision list, oldest first.</summary>
public sealed record StudyRecord(Study Study, IReadOnlyList<RevisionSummary> Revisions);

/// <summary>What happened to an <see cref="IStudyStore.AddRevisionAsync"/>.</summary>
/// <param name="Outcome">Whether it was added and, if not, why.</param>
/// <param name="Revision">The stored revision when <see cref="Outcome"/> is <see cref="RevisionWriteOutcome.Added"/>.</param>
/// <param name="CurrentNumber">The study's newest revision number after the call (0 when there is no study).</param>
public sealed record RevisionWrite(RevisionWriteOutcome Outcome, Revision? Revision, int CurrentNumber);

/// <summary>The outcome of adding a revision. Every outcome but <see cref="Added"/> wrote nothing.</summary>
public enum RevisionWriteOutcome
{
    /// <summary>The revision was committed.</summary>
    Added,

    /// <summary>There is no study with that id.</summary>
    StudyNotFound,

    /// <summary>The study is archived and takes no more revisions.</summary>
    Archived,

    /// <summary>The expected revision is no longer the newest.</summary>
    Conflict,
}

/// <summary>Which studies to list.</summary>
/// <param name="Text">Part of the title or the site text, case-insensitive (ASCII letters on SQLite); null for all.</param>
/// <param name="Intersecting">Only studies whose plan extent meets this box; studies without an extent are left out.</param>
/// <param name="IncludeArchived">Whether archived studies are listed too.</param>
/// <param name="Offset">How many matching studies to skip.</param>
/// <param name="Limit">At most this many studies (1–<see cref="MaxLimit"/>).</param>
/// <param name="Owner">Only the studies of this owner; null for every owner's.</param>
public sealed record StudyQuery(string? Text = null, GeoBox? Intersecting = null, bool IncludeArchived = false, int Offset = 0, int Limit = 50, string? Owner = null)
{
    /// <summary>The largest page.</summary>
    public const int MaxLimit = 500;
}

/// <summary>A page of studies and how many match in all.</summary>
public sealed record StudyPage(IReadOnlyList<Study> Items, int Total);
