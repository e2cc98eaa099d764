using SafetyMirror.Reports.Documents;
using SafetyMirror.Reports.Graphics;

namespace SafetyMirror.Reports.Tests.Documents;

public sealed class PdfReportWriterTests : IDisposable
{
    // The writer's margin: 20 mm, in points of 1/72 in (ISO 32000-1:2008, 8.3.2.3).
    private const double MarginPt = 20 * 72 / 25.4;

    private readonly Poppler poppler = new();

    public void Dispose() => poppler.Dispose();

    private string Sample(PaperSize paper = PaperSize.A4)
    {
        using var writer = new PdfReportWriter("Invented corner report", paper);
        Report.WriteSample(writer, "Site & <sight> lines");
        return poppler.Write(writer.ToBytes());
    }

    private static byte[] Stamped()
    {
        using var writer = new PdfReportWriter(new PageFooter("Invented corner report", "File 7", "Invented stamp 42", new DateOnly(2026, 3, 14)), PaperSize.A4);
        Report.WriteSample(writer, "Site & <sight> lines");
        return writer.ToBytes();
    }

    [Theory]
    // A4 is 210 x 297 mm (ISO 216), 595 x 842 pt; Letter is 8.5 x 11 in (ANSI/ASME Y14.1), 612 x 792 pt.
    [InlineData(PaperSize.A4, "595 x 842 pts (A4)")]
    [InlineData(PaperSize.Letter, "612 x 792 pts (letter)")]
    public void ToBytes_Paper_GivesThePageSize(PaperSize paper, string expected)
    {
        Assert.Contains($"Page size:       {expected}", Poppler.Info(Sample(paper)), StringComparison.Ordinal);
    }

    [Fact]
    public void ToBytes_Sample_TextOfEveryKindIsFoundByPdftotext()
    {
        var text = Poppler.Text(Sample());

        Assert.All(
            new[] { "Invented Quince Row driveway", "Site & <sight> lines", "farther away and slower", "glare and ice", "Figure 1. An invented sample drawing.", "Invented Quince Corner", "Passenger car", "1.60" },
            expected => Assert.Contains(expected, text, StringComparison.Ordinal));
    }

    [Fact]
    public void ToBytes_Sample_SetsTheTitleInTheMetadata()
    {
        Assert.Contains("Title:           Invented corner report", Poppler.Info(Sample()), StringComparison.Ordinal);
    }

    [Fact]
    public void ToBytes_LevelOneHeadings_StartPagesNumberedInTheFooter()
    {
        var pdf = Sample();

        Assert.Contains("Pages:           2", Poppler.Info(pdf), StringComparison.Ordinal);
        Assert.Contains("Page 1 of 2", Poppler.Text(pdf, 1), StringComparison.Ordinal);
        Assert.Contains("Road users", Poppler.Text(pdf, 2), StringComparison.Ordinal);
        Assert.Contains("Page 2 of 2", Poppler.Text(pdf, 2), StringComparison.Ordinal);
    }

    [Fact]
    public void ToBytes_FooterWithStamp_PutsTheStampAndPageNOfNOnEveryPage()
    {
        var pdf = poppler.Write(Stamped());

        Assert.All([1, 2], page =>
        {
            var text = Poppler.Text(pdf, page);
            Assert.Contains("Invented corner report", text, StringComparison.Ordinal);
            Assert.Contains("File 7 · Invented stamp 42 · 2026-03-14", text, StringComparison.Ordinal);
            Assert.Contains($"Page {page} of 2", text, StringComparison.Ordinal);
        });
    }

    [Fact]
    public void ToBytes_FooterWithDate_SetsTheMetadataDatesToThatDate()
    {
        var info = Poppler.Info(poppler.Write(Stamped()));

        Assert.Matches(@"CreationDate:\s+Sat Mar 14 \d\d:00:00 2026", info);
        Assert.Matches(@"ModDate:\s+Sat Mar 14 \d\d:00:00 2026", info);
    }

    [Fact]
    public void ToBytes_SameContentAndDateTwice_GivesTheSameBytes()
    {
        var (first, second) = (Stamped(), Stamped());
        Assert.Equal(first, second);
    }

    [Fact]
    public void Paragraph_LongText_WrapsWithinTheMargins()
    {
        using var writer = new PdfReportWriter("Wrap check", PaperSize.A4);
        writer.Paragraph(string.Join(' ', Enumerable.Repeat("Invented words that keep the line going well past the right margin.", 12)));

        var words = Poppler.Words(poppler.Write(writer.ToBytes())).Where(w => w.Text is "Invented" or "margin.").ToList();

        Assert.True(words.Select(w => Math.Round(w.YMin)).Distinct().Count() > 5, "the text runs over several lines");
        Assert.All(words, w => Assert.InRange(w.XMin, MarginPt - 0.5, 595 - MarginPt));
        Assert.All(words, w => Assert.True(w.XMax <= 595 - MarginPt + 0.5, $"'{w.Text}' ends at {w.XMax} pt"));
    }

    [Fact]
    public void Table_LongCell_WrapsWithinItsColumn()
    {
        using var writer = new PdfReportWriter("Table check", PaperSize.A4);
        writer.Table(new ReportTable(["Narrow", "Wide"], [["Elm", string.Join(' ', Enumerable.Repeat("wrapping", 30))]], [1, 3]));

        var words = Poppler.Words(poppler.Write(writer.ToBytes()));

        // The wide column is the right three quarters of the 595 - 2 x margin content width.
        var columnLeft = MarginPt + (595 - 2 * MarginPt) / 4;
        var wrapped = words.Where(w => w.Text == "wrapping").ToList();
        Assert.True(wrapped.Select(w => Math.Round(w.YMin)).Distinct().Count() > 1, "the cell wraps onto several lines");
        Assert.All(wrapped, w => Assert.InRange(w.XMin, columnLeft, 595 - MarginPt));
        Assert.All(wrapped, w => Assert.True(w.XMax <= 595 - MarginPt + 0.5, $"ends at {w.XMax} pt"));
    }

    [Fact]
    public void Table_RunningOntoANewPage_RepeatsTheHeaderRow()
    {
        // Sixty rows of about 18 pt overrun the 723 pt of body height on an A4 page once.
        using var writer = new PdfReportWriter("Long table", PaperSize.A4);
        writer.Table(new ReportTable(["Station (m)", "Apparent size (arcmin)"], Enumerable.Range(0, 60).Select(i => (IReadOnlyList<string>)[$"{i}", "invented"]).ToList()));

        var pdf = poppler.Write(writer.ToBytes());

        Assert.Contains("Pages:           2", Poppler.Info(pdf), StringComparison.Ordinal);
        Assert.Contains("Station (m)", Poppler.Text(pdf, 2), StringComparison.Ordinal);
    }

    [Fact]
    public void Figure_ThatFits_IsDrawnAtNaturalSizeSoAPlanKeepsItsScale()
    {
        var drawing = new Drawing(150, 40, [new Text(new(10, 20), "West", 4), new Text(new(140, 20), "East", 4) { Anchor = TextAnchor.End }]);
        using var writer = new PdfReportWriter("Scale check", PaperSize.A4);
        writer.Figure(drawing, "Invented scale check.");

        var words = Poppler.Words(poppler.Write(writer.ToBytes()));

        // 130 mm between the two anchors is 368.5 pt on paper.
        var span = words.Single(w => w.Text == "East").XMax - words.Single(w => w.Text == "West").XMin;
        Assert.Equal(130 * 72 / 25.4, span, 1.5);
    }

    [Fact]
    public void Figure_WiderThanThePage_IsShrunkToTheContentWidth()
    {
        var drawing = new Drawing(400, 40, [new Text(new(0.5, 20), "West", 4), new Text(new(399.5, 20), "East", 4) { Anchor = TextAnchor.End }]);
        using var writer = new PdfReportWriter("Shrink check", PaperSize.A4);
        writer.Figure(drawing, "Invented wide drawing.");

        var words = Poppler.Words(poppler.Write(writer.ToBytes()));

        Assert.True(words.Single(w => w.Text == "West").XMin >= MarginPt - 0.5);
        Assert.True(words.Single(w => w.Text == "East").XMax <= 595 - MarginPt + 0.5);
    }

    [Fact]
    public void Figure_CaptionTallerThanThePage_FlowsOntoTheNextPages()
    {
        // About 6,000 words of caption: some 60 lines a page at 9 pt, far more than one page holds.
        var caption = string.Join(' ', Enumerable.Repeat("Invented approach name", 2000)) + " tail.";
        using var writer = new PdfReportWriter("Long caption", PaperSize.A4);
        writer.Figure(new Drawing(150, 40, [new Text(new(10, 20), "West", 4)]), caption);

        var pdf = poppler.Write(writer.ToBytes());

        Assert.Contains("West", Poppler.Text(pdf, 1), StringComparison.Ordinal);
        Assert.Contains("tail.", Poppler.Text(pdf), StringComparison.Ordinal);
    }

    [Fact]
    public void Paragraph_OneUnbrokenMillionCharacterWord_IsBrokenWithinTheMargins()
    {
        using var writer = new PdfReportWriter("Long word", PaperSize.A4);
        writer.Paragraph(new string('W', 1_000_000));

        var words = Poppler.Words(poppler.Write(writer.ToBytes()), page: 1);

        Assert.All(words.Where(w => w.Text.StartsWith('W')), w => Assert.True(w.XMax <= 595 - MarginPt + 0.5, $"ends at {w.XMax} pt"));
    }

    [Fact]
    public void Paragraph_AfterSave_IsRefused()
    {
        using var writer = new PdfReportWriter("Saved", PaperSize.A4);
        writer.ToBytes();

        Assert.Throws<InvalidOperationException>(() => writer.Paragraph("Too late."));
    }
}
