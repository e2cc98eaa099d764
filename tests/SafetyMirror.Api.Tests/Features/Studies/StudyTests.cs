using System.Net;
using System.Text;
using System.Text.Json;
using System.Text.RegularExpressions;
using System.Text.Json.Nodes;
using Microsoft.AspNetCore.Mvc.Testing;
using Microsoft.Extensions.DependencyInjection;
using SafetyMirror.Api.Tests.Access;
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
    public async Task GetRevision_AsPdf_NamesTheStudyRevisionAndHash()
    {
        var created = await api.CreateAsync(Studies.LocalDemo());
        var hash = created.GetProperty("revisions")[0].GetProperty("hash").GetString()!;

        using var response = await api.SendAsync(HttpMethod.Get, $"{Studies.Route}/{created.Id()}/revisions/1", headers: ("Accept", "application/pdf"));

        Assert.Equal(HttpStatusCode.OK, response.StatusCode);
        var text = Poppler.Flow(poppler.Write(await response.Content.ReadAsByteArrayAsync()));
        // The header table wraps the reference inside its cell, between the neighbouring cells' lines.
        Assert.Contains($"{created.Id()}rev1({hash[..12]})", Regex.Replace(text, @"\s+", string.Empty), StringComparison.Ordinal);
        Assert.Contains("Study", text, StringComparison.Ordinal);
        Assert.Contains("Birchwell Lane at Quarry Row", text, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("text/html")]
    [InlineData("application/pdf")]
    public async Task GetRevision_AsReport_EqualsTheReportRenderedDirectlyWithTheSameHeader(string accept)
    {
        using var clocked = api.WithWebHostBuilder(b => b.ConfigureServices(s => s.AddSingleton<TimeProvider>(new FixedClock(new DateTimeOffset(2031, 7, 9, 10, 0, 0, TimeSpan.Zero)))));
        using var client = clocked.CreateClient();
        using var create = await client.PostAsync(new Uri(Studies.Route, UriKind.Relative), new StringContent(Studies.LocalDemo().ToJsonString(), Encoding.UTF8, "application/json"));
        var created = await Studies.ExpectAsync(create, HttpStatusCode.Created);
        var hash = created.GetProperty("revisions")[0].GetProperty("hash").GetString()!;
        var direct = DemoCorners.Local();
        direct["report"] = new JsonObject
        {
            ["title"] = "Birchwell Lane at Quarry Row",
            ["site"] = "Birchwell Lane / Quarry Row, north-east corner",
            ["reference"] = $"Study {created.Id()} rev 1 ({hash[..12]})",
        };

        using var fromStudy = new HttpRequestMessage(HttpMethod.Get, new Uri($"{Studies.Route}/{created.Id()}/revisions/1", UriKind.Relative));
        fromStudy.Headers.Accept.ParseAdd(accept);
        using var stored = await client.SendAsync(fromStudy);
        using var posted = await client.SendAsync(Reports.Reports.Request(new Uri("/v1/reports", UriKind.Relative), direct, accept));

        Assert.Equal(HttpStatusCode.OK, stored.StatusCode);
        Assert.Equal(HttpStatusCode.OK, posted.StatusCode);
        var (fromRevision, fromRequest) = (await stored.Content.ReadAsByteArrayAsync(), await posted.Content.ReadAsByteArrayAsync());
        if (accept == "application/pdf")
        {
            // PDFsharp writes a random font-subset tag and document id and its own creation time into every PDF, so the
            // PDFs are compared as poppler reads them; the HTML page carries no such thing and is compared byte for byte.
            (fromRevision, fromRequest) = (Encoding.UTF8.GetBytes(Poppler.Text(poppler.Write(fromRevision, "stored.pdf"))), Encoding.UTF8.GetBytes(Poppler.Text(poppler.Write(fromRequest, "posted.pdf"))));
        }

        Assert.Equal(fromRequest, fromRevision);
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
    public async Task Create_NoMirror_StoresARecommendation()
    {
        var body = Studies.LocalDemo();
        body.Remove("mirror");

        var created = await api.CreateAsync(body);

        var revision = await api.GetJsonAsync($"{Studies.Route}/{created.Id()}/revisions/1");
        Assert.True(revision.GetProperty("recommendation").TryGetProperty("outcome", out _));
        Assert.Equal(JsonValueKind.Null, revision.GetProperty("request").GetProperty("mirror").ValueKind);
    }

    /// <summary>A clock stopped at one instant.</summary>
    private sealed class FixedClock(DateTimeOffset now) : TimeProvider
    {
        public override DateTimeOffset GetUtcNow() => now;

        public override TimeZoneInfo LocalTimeZone => TimeZoneInfo.Utc;
    }
}
