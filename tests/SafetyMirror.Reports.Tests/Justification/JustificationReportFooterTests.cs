using System.Text.RegularExpressions;
using SafetyMirror.Reports.Documents;
using SafetyMirror.Reports.Justification;

namespace SafetyMirror.Reports.Tests.Justification;

// The footer of every page of a report rendered from a stored study revision, and the same bytes for the same report.
public sealed partial class JustificationReportFooterTests : IDisposable
{
    // SHA-256 of "abc": FIPS 180-2, Appendix B.1; any 64 hex digits would do, this one is a published digest.
    private const string Hash = "ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad";
    private const string Stamp = "Study 0f8fad5b-d9cb-469f-a165-70867728950e rev 3 hash ba7816bf8f01cfea";

    private readonly Poppler poppler = new();

    public void Dispose() => poppler.Dispose();

    private static JustificationReport StampedReport() => JustificationReport.ForEvaluation(
        InventedCorner.Plan(),
        InventedCorner.Evaluation,
        InventedCorner.Header() with { Stamp = new StudyStamp(Guid.Parse("0f8fad5b-d9cb-469f-a165-70867728950e"), 3, Hash) });

    [Fact]
    public void ToPdf_Stamped_EveryPageFooterHasTheStampAndPageNOfN()
    {
        var pdf = poppler.Write(StampedReport().ToPdf(PaperSize.A4));
        var pages = int.Parse(PageCount().Match(Poppler.Info(pdf)).Groups[1].Value, System.Globalization.CultureInfo.InvariantCulture);

        Assert.True(pages > 1, $"{pages} page(s)");
        Assert.All(Enumerable.Range(1, pages), page =>
        {
            var text = Poppler.Text(pdf, page);
            Assert.Contains("Invented Sorrel Mews exit", text, StringComparison.Ordinal);
            Assert.Contains($"INV-2025-007 · {Stamp} · 2025-03-14", text, StringComparison.Ordinal);
            Assert.Contains($"Page {page} of {pages}", text, StringComparison.Ordinal);
        });
    }

    [Fact]
    public void ToPdf_Stamped_HeaderBlockGivesTheFullHash()
    {
        var text = Poppler.Flow(poppler.Write(StampedReport().ToPdf(PaperSize.A4)));

        Assert.Contains($"Rendered from stored study 0f8fad5b-d9cb-469f-a165-70867728950e, revision 3, request hash (SHA-256) {Hash}.", text, StringComparison.Ordinal);
    }

    [Fact]
    public void ToPdf_SameReportTwice_GivesTheSameBytes()
    {
        Assert.Equal(StampedReport().ToPdf(PaperSize.A4), StampedReport().ToPdf(PaperSize.A4));
    }

    [Fact]
    public void ToHtml_Stamped_FooterAndPrintedMarginBoxCarryTheStamp()
    {
        var html = StampedReport().ToHtml(PaperSize.A4);

        Assert.Matches($"<footer class=\"report-footer\">.*{Regex.Escape(Stamp)}.*</footer>", html);
        Assert.Matches($"@bottom-left {{ content: \"[^\"]*{Regex.Escape(Stamp)}", html);
        Assert.Contains("counter(page) \" of \" counter(pages)", html, StringComparison.Ordinal);
    }

    [GeneratedRegex(@"Pages:\s+(\d+)")]
    private static partial Regex PageCount();
}
