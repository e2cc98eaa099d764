using System.Globalization;
using System.Text.RegularExpressions;
using SafetyMirror.Reports.Documents;
using SafetyMirror.Reports.Justification;
using SafetyMirror.Reports.Plans;

namespace SafetyMirror.Reports.Tests.Justification;

// The sheets a report is laid out on, and the site plan's pages turned to landscape, read back by poppler's pdfinfo and pdftotext.
public sealed partial class JustificationReportPaperTests : IDisposable
{
    private readonly Poppler poppler = new();

    public void Dispose() => poppler.Dispose();

    private static JustificationReport Report() => JustificationReport.ForEvaluation(InventedCorner.Plan(), InventedCorner.Evaluation, InventedCorner.Header());

    [Theory]
    // ISO 216: A3 is 297 x 420 mm; at 1 pt = 1/72 in that is 841.9 x 1190.6 pt, written as whole points.
    [InlineData(PaperSize.A3, 842, 1191)]
    // ANSI/ASME Y14.1 size B (Tabloid): 11 x 17 in, 792 x 1224 pt.
    [InlineData(PaperSize.Tabloid, 792, 1224)]
    public void ToPdf_BiggerPaper_GivesThatSheetOnEveryPage(PaperSize paper, double widthPt, double heightPt)
    {
        var sizes = Poppler.PageSizes(poppler.Write(Report().ToPdf(paper)));

        Assert.All(sizes, size => Assert.Equal((widthPt, heightPt), size));
    }

    [Theory]
    [InlineData(PaperSize.A4)]
    [InlineData(PaperSize.A3)]
    [InlineData(PaperSize.Tabloid)]
    public void ToPdf_PlanPagesLandscape_TurnsThePlanPagesOnly(PaperSize paper)
    {
        var pdf = poppler.Write(Report().ToPdf(new ReportLayout(paper, PlanPagesLandscape: true)));
        var sizes = Poppler.PageSizes(pdf);
        var planPages = Enumerable.Range(1, sizes.Count).Where(p => Poppler.Text(pdf, p).Contains("true scale when printed", StringComparison.Ordinal)).ToList();

        Assert.NotEmpty(planPages);
        Assert.All(planPages, p => Assert.True(sizes[p - 1].WidthPt > sizes[p - 1].HeightPt, $"plan page {p} is {sizes[p - 1]}"));
        Assert.True(sizes[0].WidthPt < sizes[0].HeightPt, "the summary page stays portrait");
        Assert.True(sizes[^1].WidthPt < sizes[^1].HeightPt, "the sign-off page stays portrait");
    }

    [Theory]
    [InlineData(PaperSize.A3, false)]
    [InlineData(PaperSize.A3, true)]
    [InlineData(PaperSize.Tabloid, true)]
    public void ToPdf_BiggerPaper_DrawsThePlansAtRoundScales(PaperSize paper, bool landscape)
    {
        var text = Poppler.Flow(poppler.Write(Report().ToPdf(new ReportLayout(paper, landscape))));
        var denominators = ScaleRatio().Matches(text).Select(m => int.Parse(m.Groups[1].Value, CultureInfo.InvariantCulture)).ToList();

        Assert.NotEmpty(denominators);
        Assert.All(denominators, d => Assert.Contains(d, PlanScale.Denominators().TakeWhile(n => n <= d)));
    }

    [Fact]
    public void ToPdf_LandscapeA3PlanPages_GiveTheWholePlanALargerScaleThanA4()
    {
        int WholePlanDenominator(ReportLayout layout) =>
            int.Parse(ScaleRatio().Match(Poppler.Flow(poppler.Write(Report().ToPdf(layout), $"{layout.Paper}-{layout.PlanPagesLandscape}.pdf"))).Groups[1].Value, CultureInfo.InvariantCulture);

        Assert.True(WholePlanDenominator(new ReportLayout(PaperSize.A3, true)) < WholePlanDenominator(new ReportLayout(PaperSize.A4)));
    }

    [Fact]
    public void ToPdf_LandscapeA3SameReportTwice_GivesTheSameBytes()
    {
        var layout = new ReportLayout(PaperSize.A3, PlanPagesLandscape: true);

        Assert.Equal(Report().ToPdf(layout), Report().ToPdf(layout));
    }

    [Theory]
    [InlineData(PaperSize.A3, "size: A3;", "size: A3 landscape;")]
    // CSS Paged Media names 11 x 17 in "ledger"; the report gives it as lengths.
    [InlineData(PaperSize.Tabloid, "size: 11in 17in;", "size: 11in 17in landscape;")]
    public void ToHtml_Paper_SetsThePageSizeAndItsLandscapePage(PaperSize paper, string portrait, string landscape)
    {
        var html = Report().ToHtml(new ReportLayout(paper, PlanPagesLandscape: true));

        Assert.Contains(portrait, html, StringComparison.Ordinal);
        Assert.Contains($"@page landscape {{ {landscape} }}", html, StringComparison.Ordinal);
    }

    [Fact]
    public void ToHtml_PlanPagesLandscape_PutsOnlyTheSitePlanOnTheLandscapePage()
    {
        var html = Report().ToHtml(new ReportLayout(PaperSize.A3, PlanPagesLandscape: true));

        Assert.Single(LandscapeSection().Matches(html));
        Assert.Contains("<section class=\"landscape\">\n<h1>Site plan</h1>", html, StringComparison.Ordinal);
    }

    [Fact]
    public void ToHtml_Portrait_HasNoLandscapeSection()
    {
        Assert.Empty(LandscapeSection().Matches(Report().ToHtml(PaperSize.A3)));
    }

    [GeneratedRegex(@"at 1:(\d+) \(true scale when printed at 100 %\)")]
    private static partial Regex ScaleRatio();

    [GeneratedRegex("<section class=\"landscape\">")]
    private static partial Regex LandscapeSection();
}
