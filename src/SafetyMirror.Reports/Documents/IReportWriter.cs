using SafetyMirror.Reports.Graphics;

namespace SafetyMirror.Reports.Documents;

/// <summary>The report's content calls, shared by the HTML and PDF writers so that a report is written once for both.</summary>
/// <remarks>Every string is plain text: the writers escape it. A level-1 heading starts a new section on a new page.</remarks>
public interface IReportWriter
{
    /// <summary>Writes a heading of level 1 (section, new portrait page), 2 or 3.</summary>
    void Heading(string text, int level);

    /// <summary>Starts a section under a level-1 heading on a new page turned as given; its pages keep that orientation until the next section.</summary>
    void Section(string heading, PageOrientation orientation);

    /// <summary>Writes a paragraph; line breaks in the text are kept.</summary>
    void Paragraph(string text);

    /// <summary>Writes a bulleted list, one item per string.</summary>
    void BulletList(IReadOnlyList<string> items);

    /// <summary>Writes a table.</summary>
    void Table(ReportTable table);

    /// <summary>Writes a drawing at its natural size (smaller only if it does not fit the page) with a caption below.</summary>
    void Figure(Drawing drawing, string caption);

    /// <summary>Writes a raster picture (PNG bytes) at the given printed size, never scaled to the page, with a caption below.</summary>
    /// <param name="png">The PNG file's bytes.</param>
    /// <param name="widthMm">Printed width, millimetres.</param>
    /// <param name="heightMm">Printed height, millimetres.</param>
    /// <param name="altText">What the picture shows, for a reader who cannot see it.</param>
    /// <param name="caption">The caption printed below it.</param>
    void Picture(byte[] png, double widthMm, double heightMm, string altText, string caption);

    /// <summary>Writes raster pictures side by side, each at the given printed size, with one caption below the row.</summary>
    /// <param name="pictures">Each picture's PNG bytes and what it shows, for a reader who cannot see it.</param>
    /// <param name="widthMm">Printed width of each, millimetres; the row must fit the page's width.</param>
    /// <param name="heightMm">Printed height of each, millimetres.</param>
    /// <param name="caption">The caption printed below the row.</param>
    void PictureRow(IReadOnlyList<(byte[] Png, string AltText)> pictures, double widthMm, double heightMm, string caption);
}
