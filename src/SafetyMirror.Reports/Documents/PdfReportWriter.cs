using System.Diagnostics.CodeAnalysis;
using System.Security.Cryptography;
using System.Text;
using System.Text.RegularExpressions;
using PdfSharp.Drawing;
using PdfSharp.Pdf;
using SafetyMirror.Reports.Fonts;
using SafetyMirror.Reports.Graphics;

namespace SafetyMirror.Reports.Documents;

/// <summary>Writes a report as a PDF: flowing text with line wrapping, tables, vector figures and numbered pages.</summary>
/// <remarks>
/// Lengths inside are points. Text is DejaVu Sans, embedded as a subset. A level-1 heading starts a new page; a
/// lower heading moves to the next page when too little room is left under it; a table repeats its header row on
/// each page it runs onto. A single table row taller than a page is not split. Not thread-safe: one writer per report.
/// </remarks>
public sealed partial class PdfReportWriter : IReportWriter, IDisposable
{
    private const double MarginPt = Sheets.MarginMm * PdfDrawingRenderer.PointsPerMm;
    private const double BottomMarginPt = Sheets.BottomMarginMm * PdfDrawingRenderer.PointsPerMm;
    private const double BodySizePt = 10;
    private const double TableSizePt = 9;
    private const double CaptionSizePt = 9;
    private const double FooterSizePt = 8;
    private const double Leading = 1.3;
    private const double CellPaddingPt = 3;
    private static readonly XColor Rule = XColor.FromArgb(153, 153, 153);

    private readonly PageFooter footer;
    private readonly PdfDocument document = new();
    private readonly PaperSize paper;
    private PageOrientation orientation = PageOrientation.Portrait;
    private XGraphics graphics;
    private double y;
    private bool saved;

    /// <summary>Starts a document with one empty page; the title goes into the metadata and every page's footer.</summary>
    public PdfReportWriter(string title, PaperSize paper)
        : this(new PageFooter(title), paper)
    {
    }

    /// <summary>Starts a document with one empty page; the footer's title goes into the metadata, the whole footer onto every page.</summary>
    /// <remarks>
    /// With a date, the same content gives the same bytes: the metadata dates are that date at midnight UTC, and the
    /// document id is derived from the content instead of being random.
    /// </remarks>
    public PdfReportWriter(PageFooter footer, PaperSize paper)
    {
        this.footer = footer ?? throw new ArgumentNullException(nameof(footer));
        ReportFonts.Register();
        this.paper = paper;
        document.Info.Title = footer.Title;
        document.Info.Creator = "SafetyMirror";
        if (footer.Date is { } date)
        {
            var midnight = date.ToDateTime(TimeOnly.MinValue, DateTimeKind.Utc);
            document.Info.CreationDate = midnight;
            document.Info.ModificationDate = midnight;
        }

        NewPage();
    }

    private XGraphics Graphics => saved ? throw new InvalidOperationException("The report has been saved; nothing more can be written.") : graphics;

    private double PageWidth => document.Pages[^1].Width.Point;

    private double ContentWidth => PageWidth - 2 * MarginPt;

    private double BodyBottom => document.Pages[^1].Height.Point - BottomMarginPt;

    private bool AtTopOfPage => y <= MarginPt;

    /// <inheritdoc />
    public void Heading(string text, int level)
    {
        ArgumentNullException.ThrowIfNull(text);
        ArgumentOutOfRangeException.ThrowIfLessThan(level, 1);
        ArgumentOutOfRangeException.ThrowIfGreaterThan(level, 3);
        if (level == 1)
        {
            Section(text, PageOrientation.Portrait);
            return;
        }

        var (size, before, after) = level == 2 ? (13.0, 10.0, 5.0) : (11.0, 8.0, 4.0);
        var lines = TextLayout.Wrap(text, size, FontWeight.Bold, ContentWidth);
        if (y + before + lines.Count * size * Leading + 3 * BodySizePt * Leading > BodyBottom)
        {
            NewPage();
        }

        y += AtTopOfPage ? 0 : before;
        DrawLines(lines, size, FontWeight.Bold, MarginPt);
        y += after;
    }

    /// <inheritdoc />
    public void Section(string heading, PageOrientation orientation)
    {
        ArgumentNullException.ThrowIfNull(heading);
        const double size = 16;
        StartSectionPage(orientation);
        DrawLines(TextLayout.Wrap(heading, size, FontWeight.Bold, ContentWidth), size, FontWeight.Bold, MarginPt);
        y += 8;
    }

    /// <inheritdoc />
    public void Paragraph(string text)
    {
        ArgumentNullException.ThrowIfNull(text);
        DrawLines(TextLayout.Wrap(text, BodySizePt, FontWeight.Normal, ContentWidth), BodySizePt, FontWeight.Normal, MarginPt);
        y += BodySizePt * 0.6;
    }

    /// <inheritdoc />
    public void BulletList(IReadOnlyList<string> items)
    {
        ArgumentNullException.ThrowIfNull(items);
        const double indent = 14;
        foreach (var item in items)
        {
            var lines = TextLayout.Wrap(item, BodySizePt, FontWeight.Normal, ContentWidth - indent);
            Reserve(BodySizePt * Leading);
            DrawText("•", BodySizePt, FontWeight.Normal, MarginPt + 4, y + BodySizePt);
            DrawLines(lines, BodySizePt, FontWeight.Normal, MarginPt + indent);
            y += BodySizePt * 0.3;
        }

        y += BodySizePt * 0.3;
    }

    /// <inheritdoc />
    public void Table(ReportTable table)
    {
        ArgumentNullException.ThrowIfNull(table);
        var widths = ColumnWidths(table);
        var header = Cells(table.Headers, widths, FontWeight.Bold);
        var rows = table.Rows.Select(row => Cells(row, widths, FontWeight.Normal)).ToList();
        Reserve(header.Height + (rows.Count > 0 ? rows[0].Height : 0));
        DrawRow(header, widths, FontWeight.Bold);
        foreach (var row in rows)
        {
            if (y + row.Height > BodyBottom && !AtTopOfPage)
            {
                NewPage();
                DrawRow(header, widths, FontWeight.Bold);
            }

            DrawRow(row, widths, FontWeight.Normal);
        }

        y += BodySizePt * 0.8;
    }

    /// <inheritdoc />
    public void Figure(Drawing drawing, string caption)
    {
        ArgumentNullException.ThrowIfNull(drawing);
        ArgumentNullException.ThrowIfNull(caption);
        var captionLines = TextLayout.Wrap(caption, CaptionSizePt, FontWeight.Normal, ContentWidth);
        var captionHeight = captionLines.Count * CaptionSizePt * Leading + 4;
        var natural = PdfDrawingRenderer.NaturalSize(drawing);
        // A caption taller than the page flows on over the next pages; the figure then keeps at least half a page.
        var room = Math.Max(BodyBottom - MarginPt - captionHeight, (BodyBottom - MarginPt) / 2);
        // Shrink only when the figure cannot fit an empty page; at natural size a plan keeps its stated scale.
        var scale = Math.Min(1, Math.Min(ContentWidth / natural.Width, room / natural.Height));
        var (width, height) = (natural.Width * scale, natural.Height * scale);
        Reserve(Math.Min(height + captionHeight, BodyBottom - MarginPt));
        PdfDrawingRenderer.Render(drawing, Graphics, new XRect(MarginPt + (ContentWidth - width) / 2, y, width, height));
        y += height + 4;
        DrawLines(captionLines, CaptionSizePt, FontWeight.Normal, MarginPt);
        y += BodySizePt;
    }

    /// <inheritdoc />
    /// <remarks>The PNG is embedded as an image object (poppler's pdfimages lists it); it is shrunk only when it cannot fit an empty page.</remarks>
    public void Picture(byte[] png, double widthMm, double heightMm, string altText, string caption)
    {
        ArgumentNullException.ThrowIfNull(png);
        PictureRow([(png, altText)], widthMm, heightMm, caption);
    }

    /// <inheritdoc />
    /// <remarks>The row is centred and shrunk only when it cannot fit an empty page; a gap of 2 mm parts the pictures.</remarks>
    public void PictureRow(IReadOnlyList<(byte[] Png, string AltText)> pictures, double widthMm, double heightMm, string caption)
    {
        ArgumentNullException.ThrowIfNull(pictures);
        ArgumentNullException.ThrowIfNull(caption);
        const double GapPt = 2 * PdfDrawingRenderer.PointsPerMm;
        var captionLines = TextLayout.Wrap(caption, CaptionSizePt, FontWeight.Normal, ContentWidth);
        var captionHeight = captionLines.Count * CaptionSizePt * Leading + 4;
        var (naturalWidth, naturalHeight) = (widthMm * PdfDrawingRenderer.PointsPerMm, heightMm * PdfDrawingRenderer.PointsPerMm);
        var rowWidth = pictures.Count * naturalWidth + (pictures.Count - 1) * GapPt;
        var scale = Math.Min(1, Math.Min(ContentWidth / rowWidth, (BodyBottom - MarginPt - captionHeight) / naturalHeight));
        var (width, height) = (naturalWidth * scale, naturalHeight * scale);
        Reserve(Math.Min(height + captionHeight, BodyBottom - MarginPt));
        var x = MarginPt + (ContentWidth - rowWidth * scale) / 2;
        foreach (var (png, _) in pictures)
        {
            using var stream = new MemoryStream(png, writable: false);
            using var image = XImage.FromStream(stream);
            Graphics.DrawImage(image, x, y, width, height);
            x += width + GapPt * scale;
        }

        y += height + 4;
        DrawLines(captionLines, CaptionSizePt, FontWeight.Normal, MarginPt);
        y += BodySizePt;
    }

    /// <summary>Numbers the pages and writes the PDF to <paramref name="output"/>; the writer is finished afterwards.</summary>
    public void Save(Stream output)
    {
        ArgumentNullException.ThrowIfNull(output);
        Graphics.Dispose();
        saved = true;
        var count = document.PageCount;
        for (var i = 0; i < count; i++)
        {
            DrawFooter(document.Pages[i], i + 1, count);
        }

        var seed = ReplaceRandomIdentifiers();
        using var buffer = new MemoryStream();
        document.Save(buffer, closeStream: false);
        var bytes = buffer.GetBuffer().AsSpan(0, (int)buffer.Length);
        ReplaceXmpUuids(bytes, seed);
        output.Write(bytes);
    }

    /// <summary>Numbers the pages and returns the PDF; the writer is finished afterwards.</summary>
    public byte[] ToBytes()
    {
        using var output = new MemoryStream();
        Save(output);
        return output.ToArray();
    }

    /// <inheritdoc />
    public void Dispose()
    {
        graphics.Dispose();
        document.Dispose();
    }

    // Drawn after layout, when the page count is known: title and page number, then reference, stamp and date below.
    private void DrawFooter(PdfPage page, int number, int count)
    {
        using var graphics = XGraphics.FromPdfPage(page, XGraphicsPdfPageOptions.Append);
        var baseline = page.Height.Point - 12 * PdfDrawingRenderer.PointsPerMm;
        var (left, right) = (MarginPt, page.Width.Point - MarginPt);
        graphics.DrawLine(new XPen(Rule, 0.5), left, baseline - 10, right, baseline - 10);
        var grey = new XSolidBrush(XColor.FromArgb(85, 85, 85));
        var font = ReportFonts.Font(FooterSizePt, FontWeight.Normal);
        graphics.DrawString(FirstLine(footer.Title, (right - left) * 0.7), font, grey, left, baseline, XStringFormats.BaseLineLeft);
        graphics.DrawString($"Page {number} of {count}", font, grey, right, baseline, XStringFormats.BaseLineRight);
        if (footer.Details.Length > 0)
        {
            graphics.DrawString(FirstLine(footer.Details, right - left), font, grey, left, baseline + FooterSizePt * Leading, XStringFormats.BaseLineLeft);
        }
    }

    /// <summary>
    /// Replaces the random parts PDFsharp writes (the document id, a fresh GUID, and each embedded font's six-letter
    /// subset tag, drawn from a GUID too) by values derived from the footer, so that the same report gives the same bytes.
    /// </summary>
    private byte[] ReplaceRandomIdentifiers()
    {
        var seed = SHA256.HashData(Encoding.UTF8.GetBytes($"{footer.Title}\n{footer.Details}\n{document.PageCount}"));
        // The id is 16 raw bytes, as PDFsharp itself makes it from a GUID (ISO 32000-1:2008, 14.4).
        var id = Encoding.Latin1.GetString(seed, 0, 16);
        document.Internals.FirstDocumentID = id;
        document.Internals.SecondDocumentID = id;

        var tags = new Dictionary<string, string>(StringComparer.Ordinal);
        foreach (var dictionary in document.Internals.GetAllObjects().OfType<PdfDictionary>())
        {
            foreach (var key in (string[])["/BaseFont", "/FontName"])
            {
                if (dictionary.Elements.GetName(key) is { Length: > 8 } name && SubsetTag().IsMatch(name))
                {
                    var tag = name[1..7];
                    if (!tags.TryGetValue(tag, out var replacement))
                    {
                        replacement = Tag(seed, tags.Count);
                        tags.Add(tag, replacement);
                    }

                    dictionary.Elements.SetName(key, "/" + replacement + name[7..]);
                }
            }
        }

        return seed;
    }

    /// <summary>
    /// PDFsharp writes fresh random UUIDs as the XMP metadata's document and instance ids, with no way to set them; the
    /// metadata stream is stored uncompressed, so each is overwritten in place by one of the same length derived from
    /// the seed, which keeps every byte offset (and so the cross-reference table) valid.
    /// </summary>
    private static void ReplaceXmpUuids(Span<byte> pdf, byte[] seed)
    {
        foreach (var (element, ordinal) in ((string, byte)[])[("<xmpMM:DocumentID>uuid:", 1), ("<xmpMM:InstanceID>uuid:", 2)])
        {
            var start = pdf.IndexOf(Encoding.ASCII.GetBytes(element));
            if (start >= 0)
            {
                var uuid = new Guid(SHA256.HashData([.. seed, ordinal]).AsSpan(0, 16)).ToString("D");
                Encoding.ASCII.GetBytes(uuid).CopyTo(pdf[(start + element.Length)..]);
            }
        }
    }

    // Six uppercase letters from the seed, different for each font of the document (ISO 32000-1:2008, 9.6.4).
    private static string Tag(byte[] seed, int ordinal) =>
        string.Concat(SHA256.HashData([.. seed, (byte)ordinal]).Take(6).Select(b => (char)('A' + b % 26)));

    [GeneratedRegex("^/[A-Z]{6}\\+")]
    private static partial Regex SubsetTag();

    private static string FirstLine(string text, double widthPt)
    {
        var lines = TextLayout.Wrap(text, FooterSizePt, FontWeight.Normal, widthPt);
        return lines.Count > 1 ? lines[0] + " …" : lines[0];
    }

    [MemberNotNull(nameof(graphics))]
    private void NewPage()
    {
        graphics?.Dispose();
        var page = document.AddPage();
        SizePage(page);
        graphics = XGraphics.FromPdfPage(page);
        y = MarginPt;
    }

    /// <summary>Moves to a fresh page turned as given, reusing the current page when nothing is on it yet.</summary>
    private void StartSectionPage(PageOrientation turned)
    {
        if (AtTopOfPage && turned == orientation)
        {
            return;
        }

        orientation = turned;
        if (!AtTopOfPage)
        {
            NewPage();
            return;
        }

        // Nothing drawn yet: turn this page, with new graphics, since they map coordinates with the page's height.
        Graphics.Dispose();
        SizePage(document.Pages[^1]);
        graphics = XGraphics.FromPdfPage(document.Pages[^1]);
    }

    // Width and height set directly rather than through PDFsharp's page sizes and orientation, so the media box is exactly the sheet as turned.
    private void SizePage(PdfPage page)
    {
        var (width, height) = Sheets.Points(paper, orientation);
        page.Width = XUnit.FromPoint(width);
        page.Height = XUnit.FromPoint(height);
    }

    /// <summary>Moves to a new page unless <paramref name="height"/> points fit below the cursor (or the page is empty).</summary>
    private void Reserve(double height)
    {
        if (y + height > BodyBottom && !AtTopOfPage)
        {
            NewPage();
        }
    }

    private void DrawLines(IReadOnlyList<string> lines, double size, FontWeight weight, double x)
    {
        foreach (var line in lines)
        {
            Reserve(size * Leading);
            DrawText(line, size, weight, x, y + size);
            y += size * Leading;
        }
    }

    private void DrawText(string text, double size, FontWeight weight, double x, double baseline) =>
        Graphics.DrawString(text, ReportFonts.Font(size, weight), XBrushes.Black, x, baseline, XStringFormats.BaseLineLeft);

    /// <summary>
    /// The columns' widths from their fractions, widened where a header word would not fit whole (a word broken across
    /// lines, "Coverag / e", reads as a typo), the room taken from the columns that have some to spare.
    /// </summary>
    private List<double> ColumnWidths(ReportTable table)
    {
        var widths = table.ColumnFractions.Select(f => f * ContentWidth).ToList();
        var least = table.Headers
            .Select(header => header.Split(' ', StringSplitOptions.RemoveEmptyEntries).Select(word => TextLayout.Width(word, TableSizePt, FontWeight.Bold)).DefaultIfEmpty(0).Max() + 2 * CellPaddingPt + 0.5)
            .ToList();
        var missing = widths.Select((w, i) => Math.Max(0, least[i] - w)).Sum();
        var spare = widths.Select((w, i) => Math.Max(0, w - least[i])).Sum();
        if (missing <= 0 || spare < missing)
        {
            return widths;
        }

        return [.. widths.Select((w, i) => w < least[i] ? least[i] : w - (w - least[i]) / spare * missing)];
    }

    private static RowLayout Cells(IReadOnlyList<string> cells, List<double> widths, FontWeight weight)
    {
        var lines = cells.Select((cell, i) => TextLayout.Wrap(cell, TableSizePt, weight, widths[i] - 2 * CellPaddingPt)).ToList();
        return new RowLayout(lines, lines.Max(l => l.Count) * TableSizePt * Leading + 2 * CellPaddingPt);
    }

    private void DrawRow(RowLayout row, List<double> widths, FontWeight weight)
    {
        if (weight == FontWeight.Bold)
        {
            Graphics.DrawRectangle(new XSolidBrush(XColor.FromArgb(238, 238, 238)), MarginPt, y, ContentWidth, row.Height);
        }

        var x = MarginPt;
        for (var i = 0; i < widths.Count; i++)
        {
            for (var l = 0; l < row.Lines[i].Count; l++)
            {
                DrawText(row.Lines[i][l], TableSizePt, weight, x + CellPaddingPt, y + CellPaddingPt + TableSizePt + l * TableSizePt * Leading);
            }

            x += widths[i];
        }

        y += row.Height;
        Graphics.DrawLine(new XPen(Rule, weight == FontWeight.Bold ? 0.8 : 0.4), MarginPt, y, MarginPt + ContentWidth, y);
    }

    private sealed record RowLayout(IReadOnlyList<IReadOnlyList<string>> Lines, double Height);
}
