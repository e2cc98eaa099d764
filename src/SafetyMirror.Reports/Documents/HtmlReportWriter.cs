using System.Text;
using SafetyMirror.Reports.Graphics;

namespace SafetyMirror.Reports.Documents;

/// <summary>Writes a report as one self-contained HTML page: inline CSS with print rules, inline SVG figures, nothing fetched.</summary>
/// <remarks>
/// The page sets its paper size with <c>@page</c>, writes the footer (title, reference, stamp, date, "Page n of N") into
/// the bottom margin boxes of every printed page (CSS Paged Media margin boxes, which Chromium prints), shows the same
/// footer once at the end on screen, starts each section
/// (level-1 heading) on a new printed page and forbids every external load through its Content-Security-Policy.
/// Not thread-safe: one writer per report.
/// </remarks>
public sealed class HtmlReportWriter : IReportWriter
{
    private readonly PageFooter footer;
    private readonly PaperSize paper;
    private readonly StringBuilder body = new();
    private bool inSection;

    /// <summary>Starts a page with the given document title (shown in the browser tab and the page metadata).</summary>
    public HtmlReportWriter(string title, PaperSize paper)
        : this(new PageFooter(title), paper)
    {
    }

    /// <summary>Starts a page titled with the footer's title, the whole footer on every printed page.</summary>
    public HtmlReportWriter(PageFooter footer, PaperSize paper)
    {
        this.footer = footer ?? throw new ArgumentNullException(nameof(footer));
        this.paper = paper;
    }

    /// <inheritdoc />
    public void Heading(string text, int level)
    {
        ArgumentOutOfRangeException.ThrowIfLessThan(level, 1);
        ArgumentOutOfRangeException.ThrowIfGreaterThan(level, 3);
        if (level == 1)
        {
            Section(text, PageOrientation.Portrait);
            return;
        }

        body.Append($"<h{level}>{HtmlText.Escape(text)}</h{level}>\n");
    }

    /// <inheritdoc />
    /// <remarks>A landscape section is printed on the named page <c>landscape</c>, which turns the sheet (CSS Paged Media named pages).</remarks>
    public void Section(string heading, PageOrientation orientation)
    {
        if (inSection)
        {
            body.Append("</section>\n");
        }

        body.Append(orientation == PageOrientation.Landscape ? "<section class=\"landscape\">\n" : "<section>\n");
        inSection = true;
        body.Append($"<h1>{HtmlText.Escape(heading)}</h1>\n");
    }

    /// <inheritdoc />
    public void Paragraph(string text) =>
        body.Append("<p>").Append(HtmlText.Escape(text).ReplaceLineEndings("<br />")).Append("</p>\n");

    /// <inheritdoc />
    public void BulletList(IReadOnlyList<string> items)
    {
        ArgumentNullException.ThrowIfNull(items);
        body.Append("<ul>\n");
        foreach (var item in items)
        {
            body.Append("<li>").Append(HtmlText.Escape(item)).Append("</li>\n");
        }

        body.Append("</ul>\n");
    }

    /// <inheritdoc />
    public void Table(ReportTable table)
    {
        ArgumentNullException.ThrowIfNull(table);
        body.Append("<table>\n<colgroup>");
        foreach (var fraction in table.ColumnFractions)
        {
            body.Append($"<col style=\"width: {Invariant.Number(fraction * 100)}%\" />");
        }

        body.Append("</colgroup>\n<thead><tr>");
        foreach (var header in table.Headers)
        {
            body.Append("<th>").Append(HtmlText.Escape(header)).Append("</th>");
        }

        body.Append("</tr></thead>\n<tbody>\n");
        foreach (var row in table.Rows)
        {
            body.Append("<tr>");
            foreach (var cell in row)
            {
                body.Append("<td>").Append(HtmlText.Escape(cell).ReplaceLineEndings("<br />")).Append("</td>");
            }

            body.Append("</tr>\n");
        }

        body.Append("</tbody>\n</table>\n");
    }

    /// <inheritdoc />
    public void Figure(Drawing drawing, string caption)
    {
        body.Append("<figure>\n").Append(SvgWriter.ToSvg(drawing)).Append('\n');
        body.Append("<figcaption>").Append(HtmlText.Escape(caption)).Append("</figcaption>\n</figure>\n");
    }

    /// <inheritdoc />
    /// <remarks>The picture is inline as a data: URI, its size set in millimetres so it prints at the size given.</remarks>
    public void Picture(byte[] png, double widthMm, double heightMm, string altText, string caption)
    {
        ArgumentNullException.ThrowIfNull(png);
        PictureRow([(png, altText)], widthMm, heightMm, caption);
    }

    /// <inheritdoc />
    public void PictureRow(IReadOnlyList<(byte[] Png, string AltText)> pictures, double widthMm, double heightMm, string caption)
    {
        ArgumentNullException.ThrowIfNull(pictures);
        body.Append("<figure>\n");
        foreach (var (png, altText) in pictures)
        {
            body.Append("<img src=\"data:image/png;base64,").Append(Convert.ToBase64String(png)).Append("\" alt=\"").Append(HtmlText.Escape(altText))
                .Append($"\" style=\"width: {Invariant.Number(widthMm)}mm; height: {Invariant.Number(heightMm)}mm\" />\n");
        }

        body.Append("<figcaption>").Append(HtmlText.Escape(caption)).Append("</figcaption>\n</figure>\n");
    }

    /// <summary>The whole page as written so far, from the doctype to the closing html tag.</summary>
    public string ToHtml()
    {
        var page = new StringBuilder();
        page.Append("<!DOCTYPE html>\n<html lang=\"en\">\n<head>\n<meta charset=\"utf-8\" />\n");
        // Nothing may be fetched: the report must print the same on a machine with no network.
        page.Append("<meta http-equiv=\"Content-Security-Policy\" content=\"default-src 'none'; style-src 'unsafe-inline'; img-src data:\" />\n");
        page.Append("<meta name=\"viewport\" content=\"width=device-width, initial-scale=1\" />\n");
        page.Append("<title>").Append(HtmlText.Escape(footer.Title)).Append("</title>\n");
        var footerText = footer.Details.Length > 0 ? $"{footer.Title}\n{footer.Details}" : footer.Title;
        page.Append("<style>\n").Append(Css(paper, CssString(footerText))).Append("</style>\n</head>\n<body>\n");
        page.Append(body);
        if (inSection)
        {
            page.Append("</section>\n");
        }

        page.Append("<footer class=\"report-footer\"><p>").Append(HtmlText.Escape(footer.Title)).Append("</p>");
        if (footer.Details.Length > 0)
        {
            page.Append("<p>").Append(HtmlText.Escape(footer.Details)).Append("</p>");
        }

        page.Append("</footer>\n");

        page.Append("</body>\n</html>\n");
        return page.ToString();
    }

    /// <summary>A CSS string literal holding plain text: quotes and backslashes escaped, line breaks as \A, and angle brackets escaped so that no text can close the style element.</summary>
    private static string CssString(string text)
    {
        var css = new StringBuilder("\"");
        foreach (var c in text)
        {
            css.Append(c switch
            {
                '"' or '\\' => $"\\{c}",
                '<' or '>' or '&' or < ' ' or '\u007f' => $"\\{(int)c:X} ",
                _ => c.ToString(),
            });
        }

        return css.Append('"').ToString();
    }

    private static string Css(PaperSize paper, string footerText) => $$"""
        @page {
          size: {{Sheets.Css(paper, PageOrientation.Portrait)}};
          margin: 20mm 20mm 22mm;
          @bottom-left { content: {{footerText}}; white-space: pre-wrap; font-size: 8pt; color: #555; vertical-align: top; width: 70%; }
          @bottom-right { content: "Page " counter(page) " of " counter(pages); font-size: 8pt; color: #555; vertical-align: top; }
        }
        @page landscape { size: {{Sheets.Css(paper, PageOrientation.Landscape)}}; }
        section.landscape { page: landscape; }
        :root { font-family: "DejaVu Sans", Verdana, sans-serif; font-size: 10pt; line-height: 1.35; color: #000; background: #fff; }
        body { max-width: 176mm; margin: 0 auto; padding: 10mm; }
        h1 { font-size: 16pt; margin: 0 0 4mm; }
        h2 { font-size: 13pt; margin: 6mm 0 2mm; }
        h3 { font-size: 11pt; margin: 5mm 0 2mm; }
        h1, h2, h3 { break-after: avoid; page-break-after: avoid; }
        section + section { break-before: page; page-break-before: always; }
        p, ul { margin: 0 0 3mm; }
        table { border-collapse: collapse; width: 100%; margin: 0 0 4mm; font-size: 9pt; }
        thead { display: table-header-group; }
        th { background: #eee; text-align: left; }
        th, td { border-bottom: 0.2mm solid #999; padding: 1mm 1.5mm; vertical-align: top; overflow-wrap: anywhere; }
        tr, li, figure { break-inside: avoid; page-break-inside: avoid; }
        figure { margin: 0 0 5mm; }
        /* A figure keeps its size in millimetres, never scaled, so a plan prints at its stated scale; a narrow screen scrolls it. */
        figure svg { display: block; }
        figure img { display: inline-block; vertical-align: top; margin: 0 1mm 1mm 0; }
        @media screen { figure { overflow-x: auto; } }
        figcaption { font-size: 9pt; margin-top: 1.5mm; }
        .report-footer { margin-top: 8mm; border-top: 0.2mm solid #999; font-size: 8pt; color: #555; }
        .report-footer p { margin: 1mm 0 0; }
        @media print { body { max-width: none; margin: 0; padding: 0; } .report-footer { display: none; } }

        """;
}
