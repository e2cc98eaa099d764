namespace SafetyMirror.Reports.Justification;

/// <summary>Who a justification report is for and by whom, as its header block shows it.</summary>
/// <param name="Title">The report's title, also the document title and the page footer.</param>
/// <param name="Site">The site described in words (street, corner), or null.</param>
/// <param name="Reference">The file or work-order reference, or null.</param>
/// <param name="RequestedBy">Who asked for the study, or null.</param>
/// <param name="PreparedBy">Who prepared the report, or null; it also fills the sign-off block.</param>
/// <param name="Date">The report's date.</param>
/// <param name="Stamp">The stored study revision the report was rendered from, or null for a report on a request.</param>
/// <remarks>Every text is plain: the writers escape it.</remarks>
public sealed record ReportHeader(string Title, string? Site, string? Reference, string? RequestedBy, string? PreparedBy, DateOnly Date, StudyStamp? Stamp = null)
{
    /// <summary>The report's title, never blank.</summary>
    public string Title { get; } = string.IsNullOrWhiteSpace(Title) ? throw new ArgumentException("A report needs a title.", nameof(Title)) : Title;
}

/// <summary>Names the stored study revision a report was rendered from, so a reader can fetch and re-run exactly that.</summary>
/// <param name="StudyId">The study's id.</param>
/// <param name="Revision">The revision's number, from 1.</param>
/// <param name="Hash">The revision's content hash (SHA-256 of its canonical request, hex).</param>
public sealed record StudyStamp(Guid StudyId, int Revision, string Hash)
{
    /// <summary>How many hex digits of the hash the report shows: 64 bits, plenty to tell revisions apart.</summary>
    public const int ShownHashLength = 16;

    /// <summary>The revision's content hash, never blank.</summary>
    public string Hash { get; } = string.IsNullOrWhiteSpace(Hash) ? throw new ArgumentException("A study stamp needs the revision's hash.", nameof(Hash)) : Hash;

    /// <summary>"Study &lt;id&gt; rev &lt;n&gt; hash &lt;first 16 hex digits&gt;", as the header and every page footer show it.</summary>
    public override string ToString() => $"Study {StudyId} rev {Revision} hash {Hash[..Math.Min(ShownHashLength, Hash.Length)]}";
}
