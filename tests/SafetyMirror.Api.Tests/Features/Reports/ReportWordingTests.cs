using System.Text;
using System.Text.Json.Nodes;
using System.Text.RegularExpressions;
using SafetyMirror.Core.Design;
using SafetyMirror.Reports.Tests;

namespace SafetyMirror.Api.Tests.Features.Reports;

// The permit report is a document for a road authority: no JSON paths, provenance tags or catalogue ids, read back from the
// PDF by poppler's pdftotext and from the HTML with its tags removed.
[Collection(ApiCollection.Name)]
public sealed partial class ReportWordingTests(ApiFactory api) : IDisposable
{
    private readonly Poppler poppler = new();

    public void Dispose() => poppler.Dispose();

    public static TheoryData<string> Bodies => ["demo", "rectangular recommendation"];

    [Theory]
    [MemberData(nameof(Bodies))]
    public async Task Post_Pdf_HasNoJsonPathProvenanceTagOrCatalogueId(string body)
    {
        var text = Poppler.Flow(poppler.Write(await api.ReportAsync(Body(body), Reports.Pdf)));

        AssertPlainWords(text);
    }

    [Theory]
    [MemberData(nameof(Bodies))]
    public async Task Post_Html_HasNoJsonPathProvenanceTagOrCatalogueId(string body)
    {
        var text = HtmlText(Encoding.UTF8.GetString(await api.ReportAsync(Body(body), Reports.Html)));

        AssertPlainWords(text);
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

        // The catalogue's 600 mm wide, 450 mm high face, hung landscape (long side horizontal).
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

    private static void AssertPlainWords(string text)
    {
        Assert.DoesNotContain("features[", text, StringComparison.Ordinal);
        Assert.DoesNotContain("[memory", text, StringComparison.Ordinal);
        Assert.DoesNotContain("common practice", text, StringComparison.OrdinalIgnoreCase);
        Assert.All(MirrorTypes.Defaults, type => Assert.DoesNotContain(type.Id, text, StringComparison.Ordinal));
    }

    private static string HtmlText(string html) => System.Net.WebUtility.HtmlDecode(Tag().Replace(html, " "));

    [GeneratedRegex("<[^>]*>")]
    private static partial Regex Tag();
}
