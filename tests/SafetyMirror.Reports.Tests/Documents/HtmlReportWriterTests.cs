using System.Text.RegularExpressions;
using System.Xml;
using System.Xml.Linq;
using SafetyMirror.Reports.Documents;

namespace SafetyMirror.Reports.Tests.Documents;

public sealed partial class HtmlReportWriterTests
{
    private const string Hostile = "<script>alert(1)</script> & \"Elm\" 'Row'";

    private static string Page(PaperSize paper = PaperSize.A4, string title = "Invented corner report")
    {
        var writer = new HtmlReportWriter(title, paper);
        Report.WriteSample(writer, Hostile);
        return writer.ToHtml();
    }

    /// <summary>The page read back as XML: the writer's markup is well-formed, so System.Xml is an independent reader.</summary>
    private static XDocument Parse(string html)
    {
        using var reader = XmlReader.Create(new StringReader(html), new XmlReaderSettings { DtdProcessing = DtdProcessing.Ignore });
        return XDocument.Load(reader);
    }

    [Fact]
    public void ToHtml_HostileTitleAndText_StayTextAndAddNoScript()
    {
        var html = Page(title: Hostile);

        var page = Parse(html);
        Assert.Equal(Hostile, page.Descendants("title").Single().Value);
        Assert.Equal(Hostile, page.Descendants("h2").First().Value);
        Assert.DoesNotContain(page.Descendants(), e => e.Name.LocalName == "script");
        Assert.DoesNotContain("<script>", html, StringComparison.Ordinal);
    }

    [Theory]
    // CSS Paged Media Level 3, 7.1: the page-size keywords "A4" and "letter".
    [InlineData(PaperSize.A4, "size: A4;")]
    [InlineData(PaperSize.Letter, "size: letter;")]
    public void ToHtml_Paper_SetsThePrintedPageSize(PaperSize paper, string rule)
    {
        Assert.Contains(rule, Page(paper), StringComparison.Ordinal);
    }

    [Fact]
    public void ToHtml_Page_LoadsNothingFromOutside()
    {
        var html = Page();

        Assert.Contains("default-src 'none'", html, StringComparison.Ordinal);
        Assert.DoesNotMatch(ExternalReference(), html);
        // The only absolute URL is the SVG namespace name, which is an identifier and never fetched.
        Assert.All(Url().Matches(html), m => Assert.Equal("http://www.w3.org/2000/svg", m.Value));
    }

    [Fact]
    public void ToHtml_LevelOneHeadings_OpenASectionEachThatStartsANewPrintedPage()
    {
        var html = Page();

        Assert.Equal(2, Parse(html).Descendants("section").Count());
        Assert.Contains("section + section { break-before: page;", html, StringComparison.Ordinal);
    }

    [Fact]
    public void ToHtml_Table_HasAHeaderRowAndColumnWidthsFromTheWeights()
    {
        var page = Parse(Page());

        var table = page.Descendants("table").Single();
        Assert.Equal(["Road user", "Height (m)", "Remarks"], table.Descendants("th").Select(th => th.Value));
        // Weights 2, 1 and 5 are a quarter, an eighth and five eighths of the width.
        Assert.Equal(["width: 25%", "width: 12.5%", "width: 62.5%"], table.Descendants("col").Select(c => c.Attribute("style")!.Value));
        Assert.Equal(2, table.Descendants("tbody").Single().Elements("tr").Count());
    }

    [Fact]
    public void ToHtml_Figure_EmbedsTheDrawingAsInlineSvgWithItsCaption()
    {
        var figure = Parse(Page()).Descendants("figure").Single();

        Assert.Single(figure.Elements(), e => e.Name.LocalName == "svg");
        Assert.StartsWith("Figure 1.", figure.Element("figcaption")!.Value, StringComparison.Ordinal);
    }

    [Fact]
    public void ToHtml_ParagraphLineBreak_BecomesABreakElement()
    {
        var writer = new HtmlReportWriter("t", PaperSize.A4);
        writer.Paragraph("First line\nsecond line");

        Assert.Contains("<p>First line<br />second line</p>", writer.ToHtml(), StringComparison.Ordinal);
    }

    [Fact]
    public void ToHtml_TableCellLineBreak_BecomesABreakElement()
    {
        var writer = new HtmlReportWriter("t", PaperSize.A4);
        writer.Table(new ReportTable(["Signature"], [["\n\n"]]));

        Assert.Contains("<td><br /><br /></td>", writer.ToHtml(), StringComparison.Ordinal);
    }

    [GeneratedRegex(@"\s(src|href)\s*=|@import|url\(\s*['""]?(https?:|//)", RegexOptions.IgnoreCase)]
    private static partial Regex ExternalReference();

    [GeneratedRegex(@"https?://[^\s""')<]+")]
    private static partial Regex Url();
}
