using System.Text;
using System.Text.Json.Nodes;
using SafetyMirror.Reports.Tests;

namespace SafetyMirror.Api.Tests.Features.Reports;

// The permit report is a document for a road authority: no JSON paths, provenance tags or catalogue ids, read back from the
// PDF by poppler's pdftotext and from the HTML with its tags removed.
[Collection(ApiCollection.Name)]
public sealed class ReportWordingTests(ApiFactory api) : IDisposable
{
    private readonly Poppler poppler = new();

    public void Dispose() => poppler.Dispose();

    public static TheoryData<string> Bodies => ["demo", "rectangular recommendation"];

    [Theory]
    [MemberData(nameof(Bodies))]
    public async Task Post_Pdf_HasNoJsonPathProvenanceTagOrCatalogueId(string body)
    {
        var text = Poppler.Flow(poppler.Write(await api.ReportAsync(Body(body), Reports.Pdf)));

        ReaderWords.AssertPlain(text);
    }

    [Theory]
    [MemberData(nameof(Bodies))]
    public async Task Post_Html_HasNoJsonPathProvenanceTagOrCatalogueId(string body)
    {
        var text = ReaderWords.HtmlText(Encoding.UTF8.GetString(await api.ReportAsync(Body(body), Reports.Html)));

        ReaderWords.AssertPlain(text);
    }

    [Fact]
    public async Task Post_Demo_NamesObstaclesByIdAndName()
    {
        var text = Poppler.Flow(poppler.Write(await api.ReportAsync(DemoCorners.Report(), Reports.Pdf)));

        Assert.Contains("corner-house (No. 2 Colliers Row (corner house))", text, StringComparison.Ordinal);
    }

    [Fact]
    public async Task Post_Demo_WordsTheCatalogueSourceForAReader()
    {
        var text = Poppler.Flow(poppler.Write(await api.ReportAsync(DemoCorners.Report(), Reports.Pdf)));

        Assert.Contains("check size and radius against the supplier's data sheet", text, StringComparison.Ordinal);
    }

    [Fact]
    public async Task Post_RectangularRecommendation_WritesTheFaceWidthByHeight()
    {
        var text = Poppler.Flow(poppler.Write(await api.ReportAsync(Body("rectangular recommendation"), Reports.Pdf)));

        // 600 mm wide, 450 mm high, hung landscape: usual sizes in a Japanese road-mirror industry size table [memory, common practice].
        Assert.Contains("600 × 450 mm", text, StringComparison.Ordinal);
        Assert.DoesNotContain("450 × 600", text, StringComparison.Ordinal);
    }

    private static JsonNode Body(string name)
    {
        var body = DemoCorners.Report();
        if (name == "rectangular recommendation")
        {
            body.Remove("mirror");
            body["options"]!["catalogue"] = new JsonArray(new JsonObject { ["id"] = "rectangular-450x600" });
        }

        return body;
    }
}
