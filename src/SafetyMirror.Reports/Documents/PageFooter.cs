namespace SafetyMirror.Reports.Documents;

/// <summary>What the footer of every printed page says, and the date the document carries.</summary>
/// <param name="Title">The document's title.</param>
/// <param name="Reference">The file or work-order reference, or null.</param>
/// <param name="Stamp">A line that names exactly what the document was made from (a stored study revision), or null.</param>
/// <param name="Date">The document's date, also its creation and modification date in the PDF metadata; null for none.</param>
/// <remarks>Every text is plain: the writers escape it.</remarks>
public sealed record PageFooter(string Title, string? Reference = null, string? Stamp = null, DateOnly? Date = null)
{
    /// <summary>The document's title, never null.</summary>
    public string Title { get; } = Title ?? throw new ArgumentNullException(nameof(Title));

    /// <summary>The footer's second line: reference, stamp and date, those given, separated by " · "; empty when none is.</summary>
    public string Details => string.Join(" · ", new[]
    {
        Reference,
        Stamp,
        Date?.ToString("yyyy-MM-dd", System.Globalization.CultureInfo.InvariantCulture),
    }.Where(part => !string.IsNullOrWhiteSpace(part)));
}
