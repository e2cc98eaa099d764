using System.Globalization;
using System.Net;
using System.Text;
using System.Text.Json;
using System.Text.RegularExpressions;
using System.Text.Json.Nodes;
using Microsoft.AspNetCore.Mvc.Testing;
using Microsoft.Extensions.DependencyInjection;
using SafetyMirror.Api.Features.Reports;
using SafetyMirror.Api.Requests;
using SafetyMirror.Api.Tests.Access;
using SafetyMirror.Core.Site;
using SafetyMirror.Reports.Documents;
using SafetyMirror.Reports.Justification;
using SafetyMirror.Reports.Tests;
using SafetyMirror.Studies;

namespace SafetyMirror.Api.Tests.Features.Studies;

// Studies through the real pipeline in Development (loopback callers act as owner "local"), each test on a fresh SQLite file.
public sealed class StudyTests : IDisposable
{
    private readonly ConfiguredApi api = new(ConfiguredApi.Development);
    private readonly Poppler poppler = new();

    public void Dispose()
    {
        api.Dispose();
        poppler.Dispose();
    }

    [Fact]
    public async Task Create_DemoCorner_Answers201WithLocationAndRevisionOne()
    {
        using var response = await api.SendAsync(HttpMethod.Post, Studies.Route, Studies.LocalDemo());

        var study = await Studies.ExpectAsync(response, HttpStatusCode.Created);
        Assert.Equal($"/v1/studies/{study.Id()}", response.Headers.Location?.OriginalString);
        var revision = Assert.Single(study.GetProperty("revisions").EnumerateArray());
        Assert.Equal(1, revision.GetProperty("number").GetInt32());
        Assert.Equal("local", revision.GetProperty("author").GetString());
        Assert.Equal("Drawn from the site sketch", revision.GetProperty("note").GetString());
    }

    [Fact]
    public async Task Get_CreatedStudy_GivesTitleSiteAndDecision()
    {
        var created = await api.CreateAsync(Studies.LocalDemo());

        var study = await api.GetJsonAsync($"{Studies.Route}/{created.Id()}");

        Assert.Equal("Birchwell Lane at Quarry Row", study.GetProperty("title").GetString());
        Assert.Equal("Birchwell Lane / Quarry Row, north-east corner", study.GetProperty("site").GetString());
        Assert.Equal(JsonValueKind.Null, study.GetProperty("extent").ValueKind); // a local-metres plan has no place on the map
        var decision = await api.SendAsync(HttpMethod.Post, "/v1/evaluations", DemoCorners.Local());
        var evaluated = await Studies.ExpectAsync(decision, HttpStatusCode.OK);
        Assert.Equal(evaluated.GetProperty("decision").GetString(), study.GetProperty("revisions")[0].GetProperty("decision").GetString());
    }

    [Fact]
    public async Task Revise_ChangedMirror_AddsRevisionTwo()
    {
        var created = await api.CreateAsync(Studies.LocalDemo());

        using var response = await api.SendAsync(HttpMethod.Post, $"{Studies.Route}/{created.Id()}/revisions", Studies.Revision());

        var added = await Studies.ExpectAsync(response, HttpStatusCode.Created);
        Assert.Equal(2, added.GetProperty("number").GetInt32());
        Assert.Equal($"/v1/studies/{created.Id()}/revisions/2", response.Headers.Location?.OriginalString);
        var study = await api.GetJsonAsync($"{Studies.Route}/{created.Id()}");
        Assert.Equal([1, 2], study.GetProperty("revisions").EnumerateArray().Select(r => r.GetProperty("number").GetInt32()));
        Assert.Equal("Aim corrected after the site visit", study.GetProperty("revisions")[1].GetProperty("note").GetString());
    }

    [Fact]
    public async Task GetRevision_AsJson_GivesTheStoredRequestItsHashAndTheAnswer()
    {
        var created = await api.CreateAsync(Studies.LocalDemo());

        var revision = await api.GetJsonAsync($"{Studies.Route}/{created.Id()}/revisions/1");

        var request = revision.GetProperty("request");
        var expectedHash = RequestHash.Of(request.GetProperty("plan").GetRawText(), request.GetProperty("options").GetRawText(), request.GetProperty("mirror").GetRawText());
        Assert.Equal(expectedHash, revision.GetProperty("hash").GetString());
        Assert.Equal(DemoCorners.Local()["plan"]!.ToJsonString(), request.GetProperty("plan").GetRawText());
        Assert.Equal(231, request.GetProperty("mirror").GetProperty("azimuthDeg").GetDouble());
        Assert.Equal("stopping", revision.GetProperty("ruleSet").GetProperty("sightDistanceMethod").GetString());
        Assert.True(revision.GetProperty("evaluation").TryGetProperty("decision", out _));
        Assert.Equal(JsonValueKind.Null, revision.GetProperty("recommendation").ValueKind);
    }

    [Fact]
    public async Task GetRevision_AsGeoJson_GivesTheLayersOfThePlainEvaluation()
    {
        var created = await api.CreateAsync(Studies.LocalDemo());

        using var stored = await api.SendAsync(HttpMethod.Get, $"{Studies.Route}/{created.Id()}/revisions/1", headers: ("Accept", "application/geo+json"));
        using var direct = await api.SendAsync(HttpMethod.Post, "/v1/evaluations", DemoCorners.Local(), ("Accept", "application/geo+json"));

        Assert.Equal(HttpStatusCode.OK, stored.StatusCode);
        Assert.Equal("application/geo+json", stored.Content.Headers.ContentType?.MediaType);
        Assert.Equal(await direct.Content.ReadAsStringAsync(), await stored.Content.ReadAsStringAsync());
    }

    [Fact]
    public async Task GetRevision_AsPdf_EveryPageFooterNamesTheStudyRevisionAndHash()
    {
        var created = await api.CreateAsync(Studies.LocalDemo());
        var hash = created.GetProperty("revisions")[0].GetProperty("hash").GetString()!;

        using var response = await api.SendAsync(HttpMethod.Get, $"{Studies.Route}/{created.Id()}/revisions/1", headers: ("Accept", "application/pdf"));

        Assert.Equal(HttpStatusCode.OK, response.StatusCode);
        var pdf = poppler.Write(await response.Content.ReadAsByteArrayAsync());
        var pages = Pages(pdf);
        Assert.All(Enumerable.Range(1, pages), page =>
        {
            var text = Poppler.Text(pdf, page);
            Assert.Contains($"Study {created.Id()} rev 1 hash {hash[..16]}", text, StringComparison.Ordinal);
            Assert.Contains($"Page {page} of {pages}", text, StringComparison.Ordinal);
        });
        Assert.Contains($"revision 1, request hash (SHA-256) {hash}.", Poppler.Flow(pdf), StringComparison.Ordinal);
    }

    [Fact]
    public async Task GetRevision_AsHtml_FooterNamesTheStudyRevisionAndHash()
    {
        var created = await api.CreateAsync(Studies.LocalDemo());
        var hash = created.GetProperty("revisions")[0].GetProperty("hash").GetString()!;

        using var response = await api.SendAsync(HttpMethod.Get, $"{Studies.Route}/{created.Id()}/revisions/1", headers: ("Accept", "text/html"));

        Assert.Equal(HttpStatusCode.OK, response.StatusCode);
        Assert.Matches($"<footer class=\"report-footer\">.*Study {created.Id()} rev 1 hash {hash[..16]}.*</footer>", await response.Content.ReadAsStringAsync());
    }

    // The stored report is compared with the report written directly from the request as posted (not as stored), through
    // the same report code as POST /v1/reports and with the same header and stamp: equal bytes show that storing and
    // reloading the request loses nothing the report depends on. POST /v1/reports itself takes no stamp, so its answer
    // is compared in the next test with the stamp's lines taken out.
    [Theory]
    [InlineData("text/html")]
    [InlineData("application/pdf")]
    public async Task GetRevision_AsReport_EqualsByteForByteTheReportWrittenDirectlyFromTheRequestWithTheSameHeaderAndStamp(string accept)
    {
        using var clocked = Clocked();
        using var client = clocked.CreateClient();
        var (id, hash) = await CreateAsync(client);

        using var stored = await client.SendAsync(Get($"{Studies.Route}/{id}/revisions/1", accept));
        var request = JsonSerializer.Deserialize<ReportRequest>(DemoCorners.Local().ToJsonString(), JsonOptions(clocked))!;
        var errors = new RequestErrors();
        var header = new ReportHeader(
            "Birchwell Lane at Quarry Row", "Birchwell Lane / Quarry Row, north-east corner", null, null, null, new DateOnly(2031, 7, 9), new StudyStamp(Guid.Parse(id), 1, hash));
        var direct = ReportEndpoints.Write(CornerRequestReader.ReadPlan(request.Plan, SitePlanLimits.Default, errors), request.Mirror, request.Options, header, UnitSystem.Metric, header.Date.Year, errors, CancellationToken.None)!;

        Assert.Equal(HttpStatusCode.OK, stored.StatusCode);
        Assert.True(errors.IsEmpty);
        var expected = accept == "application/pdf" ? direct.ToPdf(PaperSize.A4) : Encoding.UTF8.GetBytes(direct.ToHtml(PaperSize.A4));
        Assert.Equal(expected, await stored.Content.ReadAsByteArrayAsync());
    }

    [Fact]
    public async Task GetRevision_AsPdf_ReadsAsThePdfPostedToReportsLessTheStampLines()
    {
        using var clocked = Clocked();
        using var client = clocked.CreateClient();
        var (id, hash) = await CreateAsync(client);
        var direct = DemoCorners.Local();
        direct["report"] = new JsonObject { ["title"] = "Birchwell Lane at Quarry Row", ["site"] = "Birchwell Lane / Quarry Row, north-east corner" };

        using var stored = await client.SendAsync(Get($"{Studies.Route}/{id}/revisions/1", "application/pdf"));
        using var posted = await client.SendAsync(Reports.Reports.Request(new Uri("/v1/reports", UriKind.Relative), direct, "application/pdf"));

        var storedPdf = poppler.Write(await stored.Content.ReadAsByteArrayAsync(), "stored.pdf");
        var postedPdf = poppler.Write(await posted.Content.ReadAsByteArrayAsync(), "posted.pdf");
        var storedBody = Body(storedPdf).Replace($"Rendered from stored study {id}, revision 1, request hash (SHA-256) {hash}. ", string.Empty, StringComparison.Ordinal);

        Assert.Equal(Pages(postedPdf), Pages(storedPdf));
        Assert.Equal(Body(postedPdf), storedBody);
    }

    [Fact]
    public async Task List_TextSearch_FindsOnlyTheMatchingTitle()
    {
        await api.CreateAsync(Studies.LocalDemo("Birchwell Lane at Quarry Row"));
        await api.CreateAsync(Studies.LocalDemo("Ostler Gate at Mill Lane"));

        var page = await api.GetJsonAsync($"{Studies.Route}?text=ostler");

        Assert.Equal(1, page.GetProperty("total").GetInt32());
        Assert.Equal("Ostler Gate at Mill Lane", page.GetProperty("items")[0].GetProperty("title").GetString());
    }

    [Fact]
    public async Task List_Bbox_FindsTheWgs84StudyOnlyWhereItsPlanLies()
    {
        await api.CreateAsync(Studies.LocalDemo());
        var placed = await api.CreateAsync(Studies.Wgs84Demo());

        // The demo plan lies near 9.93° E, 49.78° N (openapi/examples/demo-corner-wgs84.json).
        var around = await api.GetJsonAsync($"{Studies.Route}?bbox=9.92,49.77,9.94,49.79");
        var elsewhere = await api.GetJsonAsync($"{Studies.Route}?bbox=10.5,50.5,10.6,50.6");

        Assert.Equal([placed.Id()], around.GetProperty("items").EnumerateArray().Select(s => s.Id()));
        Assert.Equal(0, elsewhere.GetProperty("total").GetInt32());
    }

    [Fact]
    public async Task List_MalformedBbox_Gets400NamingBbox()
    {
        using var response = await api.SendAsync(HttpMethod.Get, $"{Studies.Route}?bbox=9.92,49.77,9.94");

        var problem = await response.AssertProblemAsync(HttpStatusCode.BadRequest);
        Assert.True(problem.GetProperty("errors").TryGetProperty("bbox", out _));
    }

    [Fact]
    public async Task List_Paging_SkipsAndLimits()
    {
        for (var i = 0; i < 3; i++)
        {
            await api.CreateAsync(Studies.LocalDemo($"Corner {i}"));
        }

        var page = await api.GetJsonAsync($"{Studies.Route}?offset=1&limit=1");

        Assert.Equal(3, page.GetProperty("total").GetInt32());
        Assert.Equal("Corner 1", page.GetProperty("items").EnumerateArray().Single().GetProperty("title").GetString());
    }

    [Fact]
    public async Task Revise_TenInParallel_GetDistinctNumbers()
    {
        var created = await api.CreateAsync(Studies.LocalDemo());

        var numbers = await Task.WhenAll(Enumerable.Range(0, 10).Select(async i =>
        {
            using var response = await api.SendAsync(HttpMethod.Post, $"{Studies.Route}/{created.Id()}/revisions", Studies.Revision($"Parallel change {i}"));
            return (await Studies.ExpectAsync(response, HttpStatusCode.Created)).GetProperty("number").GetInt32();
        }));

        Assert.Equal(Enumerable.Range(2, 10), numbers.Order());
    }

    [Fact]
    public async Task Revise_BadPlan_Gets400WithPathAndStoresNothing()
    {
        var created = await api.CreateAsync(Studies.LocalDemo());
        var before = await api.GetJsonAsync($"{Studies.Route}/{created.Id()}");
        var body = Studies.Revision();
        body.Feature(3)["geometry"] = null;

        using var response = await api.SendAsync(HttpMethod.Post, $"{Studies.Route}/{created.Id()}/revisions", body);

        var problem = await response.AssertProblemAsync(HttpStatusCode.BadRequest);
        Assert.Contains(problem.GetProperty("errors").EnumerateObject(), e => e.Name.StartsWith("plan.features[3]", StringComparison.Ordinal));
        var after = await api.GetJsonAsync($"{Studies.Route}/{created.Id()}");
        Assert.Equal(before.GetRawText(), after.GetRawText());
    }

    [Fact]
    public async Task Create_BadMirror_Gets400WithPathAndStoresNothing()
    {
        var body = Studies.LocalDemo();
        body["mirror"]!["radiusM"] = 0.01;

        using var response = await api.SendAsync(HttpMethod.Post, Studies.Route, body);

        var problem = await response.AssertProblemAsync(HttpStatusCode.BadRequest);
        Assert.True(problem.GetProperty("errors").TryGetProperty("mirror.radiusM", out _));
        Assert.Equal(0, (await api.GetJsonAsync(Studies.Route)).GetProperty("total").GetInt32());
    }

    [Fact]
    public async Task Create_BlankTitle_Gets400NamingTitle()
    {
        var body = Studies.LocalDemo(" ");

        using var response = await api.SendAsync(HttpMethod.Post, Studies.Route, body);

        var problem = await response.AssertProblemAsync(HttpStatusCode.BadRequest);
        Assert.True(problem.GetProperty("errors").TryGetProperty("title", out _));
    }

    [Fact]
    public async Task Revise_BasedOnZero_Gets400NamingBasedOn()
    {
        var created = await api.CreateAsync(Studies.LocalDemo());

        using var response = await api.SendAsync(HttpMethod.Post, $"{Studies.Route}/{created.Id()}/revisions", Studies.Revision(basedOn: 0));

        var problem = await response.AssertProblemAsync(HttpStatusCode.BadRequest);
        Assert.True(problem.GetProperty("errors").TryGetProperty("basedOn", out _));
    }

    [Fact]
    public async Task Revise_StaleBasedOn_Gets409WithTheCurrentNumber()
    {
        var created = await api.CreateAsync(Studies.LocalDemo());
        using var first = await api.SendAsync(HttpMethod.Post, $"{Studies.Route}/{created.Id()}/revisions", Studies.Revision(basedOn: 1));
        Assert.Equal(HttpStatusCode.Created, first.StatusCode);

        using var stale = await api.SendAsync(HttpMethod.Post, $"{Studies.Route}/{created.Id()}/revisions", Studies.Revision(basedOn: 1));

        var problem = await stale.AssertProblemAsync(HttpStatusCode.Conflict);
        Assert.Equal(2, problem.GetProperty("currentRevision").GetInt32());
    }

    [Fact]
    public async Task Revise_ArchivedStudy_Gets409()
    {
        var created = await api.CreateAsync(Studies.LocalDemo());
        using var archive = await api.SendAsync(HttpMethod.Post, $"{Studies.Route}/{created.Id()}/archive");
        Assert.True((await Studies.ExpectAsync(archive, HttpStatusCode.OK)).GetProperty("archived").GetBoolean());

        using var response = await api.SendAsync(HttpMethod.Post, $"{Studies.Route}/{created.Id()}/revisions", Studies.Revision());

        await response.AssertProblemAsync(HttpStatusCode.Conflict);
    }

    [Fact]
    public async Task Get_UnknownStudy_Gets404Problem()
    {
        using var response = await api.SendAsync(HttpMethod.Get, $"{Studies.Route}/{Guid.NewGuid()}");

        await response.AssertProblemAsync(HttpStatusCode.NotFound);
    }

    [Fact]
    public async Task GetRevision_UnknownNumber_Gets404Problem()
    {
        var created = await api.CreateAsync(Studies.LocalDemo());

        using var response = await api.SendAsync(HttpMethod.Get, $"{Studies.Route}/{created.Id()}/revisions/2");

        await response.AssertProblemAsync(HttpStatusCode.NotFound);
    }

    [Fact]
    public async Task Rerun_UnchangedRevision_ReportsIdenticalAnswer()
    {
        var created = await api.CreateAsync(Studies.LocalDemo());

        using var response = await api.SendAsync(HttpMethod.Post, $"{Studies.Route}/{created.Id()}/revisions/1/rerun");

        var rerun = await Studies.ExpectAsync(response, HttpStatusCode.OK);
        Assert.True(rerun.GetProperty("identicalAnswer").GetBoolean());
        Assert.True(rerun.GetProperty("sameDecision").GetBoolean());
        Assert.Equal(rerun.GetProperty("stored").GetProperty("approaches").GetRawText(), rerun.GetProperty("current").GetProperty("approaches").GetRawText());
        Assert.NotEmpty(rerun.GetProperty("current").GetProperty("approaches").EnumerateArray());
    }

    [Fact]
    public async Task Rerun_Wgs84RevisionWithoutGlareYear_ReportsIdenticalGlare()
    {
        var created = await api.CreateAsync(Studies.Wgs84Demo());

        using var response = await api.SendAsync(HttpMethod.Post, $"{Studies.Route}/{created.Id()}/revisions/1/rerun");

        var rerun = await Studies.ExpectAsync(response, HttpStatusCode.OK);
        using var stored = await api.SendAsync(HttpMethod.Get, $"{Studies.Route}/{created.Id()}/revisions/1");
        var revision = await Studies.ExpectAsync(stored, HttpStatusCode.OK);
        Assert.True(revision.GetProperty("evaluation").GetProperty("glare").GetProperty("computed").GetBoolean());
        Assert.True(rerun.GetProperty("identicalAnswer").GetBoolean());
    }

    [Fact]
    public async Task Create_NoMirror_StoresARecommendation()
    {
        var body = Studies.LocalDemo();
        body.Remove("mirror");

        var created = await api.CreateAsync(body);

        var revision = await api.GetJsonAsync($"{Studies.Route}/{created.Id()}/revisions/1");
        Assert.True(revision.GetProperty("recommendation").TryGetProperty("outcome", out _));
        Assert.Equal(JsonValueKind.Null, revision.GetProperty("request").GetProperty("mirror").ValueKind);
    }

    /// <summary>
    /// The text of every page without its footer (its last two lines, which differ by the stamp and are checked on their
    /// own), white space collapsed: the stamp paragraph under the header table may push a table row onto the next page.
    /// </summary>
    private static string Body(string pdf) => string.Join(' ', Enumerable.Range(1, Pages(pdf))
        .SelectMany(page => Poppler.Text(pdf, page).Split('\n', StringSplitOptions.RemoveEmptyEntries | StringSplitOptions.TrimEntries).SkipLast(2))
        .SelectMany(line => line.Split(' ', StringSplitOptions.RemoveEmptyEntries)));

    private static int Pages(string pdf) => int.Parse(Regex.Match(Poppler.Info(pdf), @"Pages:\s+(\d+)").Groups[1].Value, CultureInfo.InvariantCulture);

    private WebApplicationFactory<Program> Clocked() =>
        api.WithWebHostBuilder(b => b.ConfigureServices(s => s.AddSingleton<TimeProvider>(new FixedClock(new DateTimeOffset(2031, 7, 9, 10, 0, 0, TimeSpan.Zero)))));

    private static async Task<(string Id, string Hash)> CreateAsync(HttpClient client)
    {
        using var create = await client.PostAsync(new Uri(Studies.Route, UriKind.Relative), new StringContent(Studies.LocalDemo().ToJsonString(), Encoding.UTF8, "application/json"));
        var created = await Studies.ExpectAsync(create, HttpStatusCode.Created);
        return (created.Id(), created.GetProperty("revisions")[0].GetProperty("hash").GetString()!);
    }

    private static HttpRequestMessage Get(string path, string accept)
    {
        var request = new HttpRequestMessage(HttpMethod.Get, new Uri(path, UriKind.Relative));
        request.Headers.Accept.ParseAdd(accept);
        return request;
    }

    private static JsonSerializerOptions JsonOptions(WebApplicationFactory<Program> factory) =>
        factory.Services.GetRequiredService<Microsoft.Extensions.Options.IOptions<Microsoft.AspNetCore.Http.Json.JsonOptions>>().Value.SerializerOptions;

    /// <summary>A clock stopped at one instant.</summary>
    private sealed class FixedClock(DateTimeOffset now) : TimeProvider
    {
        public override DateTimeOffset GetUtcNow() => now;

        public override TimeZoneInfo LocalTimeZone => TimeZoneInfo.Utc;
    }
}
