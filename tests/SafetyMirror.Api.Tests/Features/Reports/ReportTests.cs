using System.Net;
using System.Text;
using System.Text.RegularExpressions;
using System.Text.Json.Nodes;
using Microsoft.AspNetCore.Mvc.Testing;
using Microsoft.Extensions.DependencyInjection;
using SafetyMirror.Reports.Tests;

namespace SafetyMirror.Api.Tests.Features.Reports;

// POST /v1/reports on the invented demo corner, read back as a PDF by poppler (pdftotext, pdfinfo, pdffonts) and as HTML.
[Collection(ApiCollection.Name)]
public sealed class ReportTests(ApiFactory api) : IDisposable
{
    private readonly Poppler poppler = new();

    public void Dispose() => poppler.Dispose();

    private async Task<string> PdfAsync(JsonNode body) => poppler.Write(await api.ReportAsync(body, Reports.Pdf));

    private async Task<string> HtmlAsync(JsonNode body) => Encoding.UTF8.GetString(await api.ReportAsync(body, Reports.Html));

    [Fact]
    public async Task Post_AcceptPdf_GivesTheDecisionAndTheKeyFigures()
    {
        var text = Poppler.Flow(await PdfAsync(DemoCorners.Report()));

        Assert.Contains("Decision: the mirror meets the requirement.", text, StringComparison.Ordinal);
        // AASHTO Green Book 2011, Table 3-1: 30 km/h needs 35 m of stopping sight distance.
        Assert.Contains("Required sight distance 35 m", text, StringComparison.Ordinal);
        Assert.Contains("231.0° clockwise from plan north", text, StringComparison.Ordinal);
        Assert.Contains("WRF-TM-2025-014", text, StringComparison.Ordinal);
        Assert.Contains("Sign-off", text, StringComparison.Ordinal);
    }

    [Fact]
    public async Task Post_At55Kmh_StatesTheSameVerdictAsTheEvaluation()
    {
        // France IISR Art. 14: priority road at 50 km/h or less, so the report, like the evaluation, is outside the siting rules.
        var body = DemoCorners.Report();
        foreach (var feature in body["plan"]!["features"]!.AsArray().Where(f => (string?)f!["properties"]!["role"] == "approach"))
        {
            feature!["properties"]!["speedKmh"] = 55;
        }

        var text = Poppler.Flow(await PdfAsync(body));

        Assert.Contains("Decision: the mirror is outside the siting rules.", text, StringComparison.Ordinal);
        Assert.Contains("approach-speed 55 km/h against at most 50 km/h", text, StringComparison.Ordinal);
    }

    [Fact]
    public async Task Post_AcceptPdf_EmbedsEveryFont()
    {
        var fonts = Poppler.Fonts(await PdfAsync(DemoCorners.Report()));

        // pdffonts lists one font per line after two header lines; column "emb" says whether it is embedded.
        var rows = fonts.Split('\n', StringSplitOptions.RemoveEmptyEntries).Skip(2).ToList();
        Assert.NotEmpty(rows);
        Assert.All(rows, row => Assert.Contains(" yes ", row, StringComparison.Ordinal));
    }

    [Theory]
    // A4 is 210 x 297 mm (ISO 216), 595 x 842 pt; Letter is 8.5 x 11 in (ANSI/ASME Y14.1), 612 x 792 pt.
    [InlineData("A4", "595 x 842 pts (A4)")]
    [InlineData("Letter", "612 x 792 pts (letter)")]
    // A3 is 297 x 420 mm (ISO 216), 842 x 1191 pt; Tabloid is 11 x 17 in (ANSI/ASME Y14.1 size B), 792 x 1224 pt.
    [InlineData("A3", "842 x 1191 pts (A3)")]
    [InlineData("Tabloid", "792 x 1224 pts")]
    public async Task Post_Paper_GivesThatPageSize(string paper, string expected)
    {
        var body = DemoCorners.Report();
        body["report"]!["paper"] = paper;

        Assert.Contains($"Page size:       {expected}", Poppler.Info(await PdfAsync(body)), StringComparison.Ordinal);
    }

    [Fact]
    public async Task Post_NoPaper_IsA4()
    {
        var body = DemoCorners.Report();
        body["report"]!.AsObject().Remove("paper");

        Assert.Contains("Page size:       595 x 842 pts (A4)", Poppler.Info(await PdfAsync(body)), StringComparison.Ordinal);
    }

    [Fact]
    public async Task Post_WithoutMirror_ReportsTheRecommendation()
    {
        var body = DemoCorners.Report();
        body.Remove("mirror");

        var text = Poppler.Flow(await PdfAsync(body));

        Assert.Contains("Decision: a mirror is recommended.", text, StringComparison.Ordinal);
        Assert.Contains("Alternatives considered", text, StringComparison.Ordinal);
    }

    [Fact]
    public async Task Post_Imperial_ShowsFeetAndMph()
    {
        var body = DemoCorners.Report();
        body["report"]!["units"] = "imperial";

        var text = Poppler.Flow(await PdfAsync(body));

        // 30 km/h / 1.609344 km/h per mph = 18.6 mph (exact definition); at 18.64 mph the US customary formula of AASHTO
        // Green Book 2011, Eq. 3-2 [memory], gives 1.47·18.64·2.5 + 1.075·18.64²/11.2 = 101.9 ft, designed for 105 ft.
        Assert.Contains("Required sight distance 105 ft", text, StringComparison.Ordinal);
        Assert.Contains("18.6 mph", text, StringComparison.Ordinal);
    }

    [Fact]
    public async Task Post_ImperialAt35Mph_PrintsTheUsCustomaryTableValue()
    {
        var body = DemoCorners.Report().WithSpeedMph(35);
        body["report"]!["units"] = "imperial";

        var text = Poppler.Flow(await PdfAsync(body));

        // AASHTO Green Book 2011, Table 3-1, US customary: 35 mph needs 250 ft [memory] (1.47·35·2.5 + 1.075·35²/11.2 = 246.2 ft).
        Assert.Contains("Required sight distance 250 ft (AASHTO 2011, US customary, Table 3-1", text, StringComparison.Ordinal);
    }

    [Fact]
    public async Task Post_ImperialWithMetricUnitsAsked_KeepsTheMetricRequirement()
    {
        var body = DemoCorners.Report();
        body["report"]!["units"] = "imperial";
        body["options"]!["sightDistance"]!["units"] = "metric";

        var text = Poppler.Flow(await PdfAsync(body));

        // AASHTO Green Book 2011, Table 3-1 (metric): 30 km/h needs 35 m [memory]; 35 m / 0.3048 m per ft = 114.8 ft.
        Assert.Contains("Required sight distance 115 ft (35 m, metric design value", text, StringComparison.Ordinal);
    }

    [Fact]
    public async Task Post_AcceptHtml_EscapesAScriptInTheTitle()
    {
        var body = DemoCorners.Report();
        body["report"]!["title"] = "<script>alert('x')</script> Mews";
        body["report"]!["site"] = "<img src=x onerror=alert(1)>";

        var html = await HtmlAsync(body);

        Assert.DoesNotContain("<script", html, StringComparison.OrdinalIgnoreCase);
        // The only images are the report's own pictures of the driver's view, inline PNGs.
        Assert.All(Regex.Matches(html, "<img[^>]*>", RegexOptions.IgnoreCase),
            image => Assert.StartsWith("<img src=\"data:image/png;base64,", image.Value, StringComparison.Ordinal));
        Assert.Contains("<title>&lt;script&gt;alert(&#39;x&#39;)&lt;/script&gt; Mews</title>", html, StringComparison.Ordinal);
    }

    [Fact]
    public async Task Post_NoDate_TakesTodayFromTheServiceClock()
    {
        var body = DemoCorners.Report();
        body["report"]!.AsObject().Remove("date");
        using var clocked = api.WithWebHostBuilder(b => b.ConfigureServices(s => s.AddSingleton<TimeProvider>(new FixedClock(new DateTimeOffset(2031, 7, 9, 10, 0, 0, TimeSpan.Zero)))));

        var html = Encoding.UTF8.GetString(await clocked.ReportAsync(body, Reports.Html));

        Assert.Contains("<td>2031-07-09</td>", html, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("application/json")]
    [InlineData("*/*")]
    [InlineData(null)]
    public async Task Post_NeitherHtmlNorPdfAccepted_Is406Problem(string? accept)
    {
        using var response = await api.PostReportAsync(DemoCorners.Report(), accept);

        var problem = await response.AssertProblemAsync(HttpStatusCode.NotAcceptable);
        Assert.Contains("application/pdf", problem.GetProperty("detail").GetString(), StringComparison.Ordinal);
    }

    [Fact]
    public async Task Post_HtmlPreferredOverPdf_GivesTheHtmlPage()
    {
        using var response = await api.PostReportAsync(DemoCorners.Report(), "application/pdf;q=0.5, text/html");

        Assert.Equal(HttpStatusCode.OK, response.StatusCode);
        Assert.Equal(Reports.Html, response.Content.Headers.ContentType?.MediaType);
    }

    [Theory]
    [InlineData("paper", "A5", "report.paper", "A4, Letter, A3, Tabloid")]
    // Ledger is the Tabloid sheet turned; the request names sheets in portrait and turns only the plan pages.
    [InlineData("paper", "Ledger", "report.paper", "Tabloid")]
    [InlineData("units", "furlongs", "report.units", "metric, imperial")]
    [InlineData("date", "14/03/2025", "report.date", "yyyy-MM-dd")]
    [InlineData("date", "2025-02-30", "report.date", "yyyy-MM-dd")]
    [InlineData("title", "   ", "report.title", "blank")]
    public async Task Post_BadReportMember_Is400NamingTheField(string member, string value, string path, string hint)
    {
        var body = DemoCorners.Report();
        body["report"]![member] = value;

        await AssertRejectedAsync(body, path, hint);
    }

    [Fact]
    public async Task Post_TitleOverTheLimit_Is400NamingTheTitle()
    {
        var body = DemoCorners.Report();
        body["report"]!["title"] = new string('T', 301);

        await AssertRejectedAsync(body, "report.title", "300");
    }

    [Fact]
    public async Task Post_BadMirror_Is400NamingTheMirrorField()
    {
        var body = DemoCorners.Report();
        body["mirror"]!["radiusM"] = 0;

        await AssertRejectedAsync(body, "mirror.radiusM", "0.3");
    }

    [Fact]
    public async Task Post_WithoutMirrorOnAShortApproach_Is400NamingItsGeometry()
    {
        // 30 km/h needs 35 m (AASHTO Green Book 2011, Table 3-1); the eastbound lane is drawn 20 m long.
        var body = DemoCorners.Report();
        body.Remove("mirror");
        body.Feature(1)["geometry"]!["coordinates"] = new JsonArray(new JsonArray(-20, 1.5), new JsonArray(0, 1.5));

        await AssertRejectedAsync(body, "plan.features[1].geometry", "35 m");
    }

    [Fact]
    public async Task Post_SearchOptionWithAMirror_Is400SayingItWouldDoNothing()
    {
        var body = DemoCorners.Report();
        body["options"]!["alternatives"] = 2;

        await AssertRejectedAsync(body, "options.alternatives", "no mirror is given");
    }

    [Fact]
    public async Task Post_WithoutMirror_HonoursTheRecommendationCatalogue()
    {
        var body = DemoCorners.Report();
        body.Remove("mirror");
        body["options"]!["catalogue"] = new JsonArray(new JsonObject { ["id"] = "round-800" });

        var text = Poppler.Flow(await PdfAsync(body));

        Assert.Contains("800 mm round mirror", text, StringComparison.Ordinal);
        Assert.DoesNotContain("600 × 450 mm mirror", text, StringComparison.Ordinal);
    }

    [Fact]
    public async Task Post_UnknownReportMember_Is400ProblemEvenToAPdfOnlyClient()
    {
        var body = DemoCorners.Report();
        body["report"]!["colour"] = "blue";

        using var response = await api.PostReportAsync(body, Reports.Pdf);

        var problem = await response.AssertProblemAsync(HttpStatusCode.BadRequest);
        Assert.True(problem.GetProperty("errors").TryGetProperty("report.colour", out _), problem.ToString());
    }

    private async Task AssertRejectedAsync(JsonNode body, string path, string hint)
    {
        using var response = await api.PostReportAsync(body, Reports.Pdf);

        var problem = await response.AssertProblemAsync(HttpStatusCode.BadRequest);
        var messages = problem.GetProperty("errors").GetProperty(path).EnumerateArray().Select(m => m.GetString()!).ToList();
        Assert.Contains(messages, m => m.Contains(hint, StringComparison.Ordinal));
    }

    /// <summary>A clock stopped at one instant.</summary>
    private sealed class FixedClock(DateTimeOffset now) : TimeProvider
    {
        public override DateTimeOffset GetUtcNow() => now;

        public override TimeZoneInfo LocalTimeZone => TimeZoneInfo.Utc;
    }
}
