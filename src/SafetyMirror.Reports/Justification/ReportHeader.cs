namespace SafetyMirror.Reports.Justification;

/// <summary>Who a justification report is for and by whom, as its header block shows it.</summary>
/// <param name="Title">The report's title, also the document title and the page footer.</param>
/// <param name="Site">The site described in words (street, corner), or null.</param>
/// <param name="Reference">The file or work-order reference, or null.</param>
/// <param name="RequestedBy">Who asked for the study, or null.</param>
/// <param name="PreparedBy">Who prepared the report, or null; it also fills the sign-off block.</param>
/// <param name="Date">The report's date.</param>
/// <remarks>Every text is plain: the writers escape it.</remarks>
public sealed record ReportHeader(string Title, string? Site, string? Reference, string? RequestedBy, string? PreparedBy, DateOnly Date)
{
    /// <summary>The report's title, never blank.</summary>
    public string Title { get; } = string.IsNullOrWhiteSpace(Title) ? throw new ArgumentException("A report needs a title.", nameof(Title)) : Title;
}
