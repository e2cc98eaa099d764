using System.Net;
using System.Text.Json.Nodes;
using SafetyMirror.Api.Tests.Access;
using SafetyMirror.Api.Tests.Features.Studies;
using StudyApi = SafetyMirror.Api.Tests.Features.Studies.Studies;

namespace SafetyMirror.Api.Tests.Pages;

// The study pages through the real pipeline in Development (loopback callers act as owner "local"), each test on a fresh SQLite file.
public sealed class StudyPageTests : IDisposable
{
    private readonly ConfiguredApi api = new(ConfiguredApi.Development);

    public void Dispose() => api.Dispose();

    [Fact]
    public async Task New_Get_IsAnAccessibleFormWithAntiforgeryToken()
    {
        using var client = api.CreateClient();

        using var response = await client.GetAsync(new Uri("/studies/new", UriKind.Relative));

        var html = await response.Content.ReadAsStringAsync();
        Assert.Equal(HttpStatusCode.OK, response.StatusCode);
        Assert.Equal("text/html", response.Content.Headers.ContentType?.MediaType);
        Assert.Contains("<html lang=\"en\">", html, StringComparison.Ordinal);
        Assert.Contains("<label for=\"plan\">", html, StringComparison.Ordinal);
        Assert.Contains("enctype=\"multipart/form-data\"", html, StringComparison.Ordinal);
        Assert.Contains("__RequestVerificationToken", html, StringComparison.Ordinal);
    }

    [Fact]
    public async Task New_Get_PolicyAllowsOwnStylesheetAndFormsOnly()
    {
        using var client = api.CreateClient();

        using var response = await client.GetAsync(new Uri("/studies/new", UriKind.Relative));

        var policy = response.Headers.GetValues("Content-Security-Policy").Single();
        Assert.Contains("style-src 'self'", policy, StringComparison.Ordinal);
        Assert.Contains("form-action 'self'", policy, StringComparison.Ordinal);
        Assert.DoesNotContain("unsafe-inline", policy, StringComparison.Ordinal);
        Assert.DoesNotContain("script-src", policy, StringComparison.Ordinal);
        Assert.Equal("DENY", response.Headers.GetValues("X-Frame-Options").Single());
    }

    [Fact]
    public async Task Create_DemoPlanAndMirror_RedirectsToStudyPageWithDecisionAndPlan()
    {
        using var client = api.CreateClient();
        var demo = DemoCorners.Local();

        using var response = await StudyPageForms.PostAsync(client, "/studies/new", "/studies", Fields(demo), demo["plan"]);

        var html = await response.Content.ReadAsStringAsync();
        Assert.Equal(HttpStatusCode.OK, response.StatusCode);
        Assert.Matches("^/studies/[0-9a-f-]{36}$", response.RequestMessage!.RequestUri!.AbsolutePath);
        Assert.Contains("<h1>Tansy Mews at Colliers Row</h1>", html, StringComparison.Ordinal);
        var evaluated = await StudyApi.ExpectAsync(await api.SendAsync(HttpMethod.Post, "/v1/evaluations", DemoCorners.Local()), HttpStatusCode.OK);
        Assert.Contains($"id=\"decision\">{evaluated.GetProperty("decision").GetString()}</p>", html, StringComparison.Ordinal);
        Assert.Contains("<figure>\n<svg", html, StringComparison.Ordinal);
        Assert.Contains("?format=pdf", html, StringComparison.Ordinal);
        Assert.Contains("makes vehicles look farther away and slower than they are", html, StringComparison.Ordinal);
    }

    [Fact]
    public async Task Create_RefusedPlan_ShowsThePathNextToTheUploadAndKeepsTheTypedTitle()
    {
        using var client = api.CreateClient();
        var demo = DemoCorners.Local();
        demo.Feature(3)["properties"]!["heightM"] = -5;

        using var response = await StudyPageForms.PostAsync(client, "/studies/new", "/studies", Fields(demo), demo["plan"]);

        var html = await response.Content.ReadAsStringAsync();
        Assert.Equal(HttpStatusCode.BadRequest, response.StatusCode);
        var uploadErrors = html[html.IndexOf("id=\"plan-errors\"", StringComparison.Ordinal)..];
        Assert.StartsWith("id=\"plan-errors\"><li><code>plan.features[3].properties.heightM</code>", uploadErrors, StringComparison.Ordinal);
        Assert.Contains("value=\"Tansy Mews at Colliers Row\"", html, StringComparison.Ordinal);
    }

    [Fact]
    public async Task Create_RefusedPlan_StoresNothing()
    {
        using var client = api.CreateClient();
        var demo = DemoCorners.Local();
        demo.Feature(3)["properties"]!["heightM"] = -5;

        using var response = await StudyPageForms.PostAsync(client, "/studies/new", "/studies", Fields(demo), demo["plan"]);

        Assert.Equal(HttpStatusCode.BadRequest, response.StatusCode);
        var list = await api.GetJsonAsync(StudyApi.Route);
        Assert.Equal(0, list.GetProperty("total").GetInt32());
    }

    [Fact]
    public async Task Create_WithoutAntiforgeryToken_Answers400AndStoresNothing()
    {
        using var client = api.CreateClient();
        using var form = new MultipartFormDataContent { { new StringContent("Forged"), "title" } };

        using var response = await client.PostAsync(new Uri("/studies", UriKind.Relative), form);

        Assert.Equal(HttpStatusCode.BadRequest, response.StatusCode);
        Assert.Equal(0, (await api.GetJsonAsync(StudyApi.Route)).GetProperty("total").GetInt32());
    }

    [Fact]
    public async Task Revise_NoteWithoutNewFile_KeepsThePlanAndListsTwoRevisions()
    {
        using var client = api.CreateClient();
        var created = await api.CreateAsync(StudyApi.LocalDemo());
        var page = $"/studies/{created.Id()}";
        var fields = new Dictionary<string, string>(StudyPageForms.DemoMirror(DemoCorners.Local())) { ["note"] = "Aim checked on site" };

        using var response = await StudyPageForms.PostAsync(client, page, $"{page}/revisions", fields, plan: null);

        var html = await response.Content.ReadAsStringAsync();
        Assert.Equal(HttpStatusCode.OK, response.StatusCode);
        Assert.Contains("<td>Aim checked on site</td>", html, StringComparison.Ordinal);
        Assert.Equal(2, (await api.GetJsonAsync($"{StudyApi.Route}/{created.Id()}")).GetProperty("revisions").GetArrayLength());
    }

    [Fact]
    public async Task Show_StudyPage_HoldsNothingThePagePolicyBlocks()
    {
        var created = await api.CreateAsync(StudyApi.LocalDemo());
        using var client = api.CreateClient();

        var html = await client.GetStringAsync(new Uri($"/studies/{created.Id()}", UriKind.Relative));

        // The policy allows the service's stylesheet only: no style attributes or elements, no scripts, nothing from elsewhere.
        Assert.DoesNotContain(" style=", html, StringComparison.Ordinal);
        Assert.DoesNotContain("<style", html, StringComparison.Ordinal);
        Assert.DoesNotContain("<script", html, StringComparison.Ordinal);
        Assert.DoesNotContain("http://", html.Replace("http://www.w3.org/", string.Empty, StringComparison.Ordinal), StringComparison.Ordinal);
    }

    [Fact]
    public async Task Show_StudyWithAMirror_ShowsTheRevisionsViewWithItsCautions()
    {
        var created = await api.CreateAsync(StudyApi.LocalDemo());
        using var client = api.CreateClient();

        var html = await client.GetStringAsync(new Uri($"/studies/{created.Id()}", UriKind.Relative));

        var source = $"/v1/studies/{created.Id()}/revisions/1/view";
        Assert.Contains($"<img id=\"view\" src=\"{source}\" width=\"600\" height=\"600\" alt=\"The mirror of revision 1", html, StringComparison.Ordinal);
        Assert.Contains("Left and right are reversed in the mirror", html, StringComparison.Ordinal);
        using var picture = await client.GetAsync(new Uri(source, UriKind.Relative));
        Assert.Equal("image/png", picture.Content.Headers.ContentType?.MediaType);
    }

    [Fact]
    public async Task Show_RecommendationStudy_ShowsNoDriversView()
    {
        // A recommendation's revision has no mirror of its own: its view route answers 409, so the page shows no broken picture.
        var body = StudyApi.LocalDemo();
        body.Remove("mirror");
        var created = await api.CreateAsync(body);
        using var client = api.CreateClient();

        var html = await client.GetStringAsync(new Uri($"/studies/{created.Id()}", UriKind.Relative));

        Assert.DoesNotContain("<img", html, StringComparison.Ordinal);
    }

    [Fact]
    public async Task Show_StudyPage_PolicyAllowsTheServicesOwnPictures()
    {
        var created = await api.CreateAsync(StudyApi.LocalDemo());
        using var client = api.CreateClient();

        using var response = await client.GetAsync(new Uri($"/studies/{created.Id()}", UriKind.Relative));

        Assert.Contains("img-src 'self' data:", response.Headers.GetValues("Content-Security-Policy").Single(), StringComparison.Ordinal);
    }

    [Fact]
    public async Task Show_RevisionForm_StartsFromTheStoredMirror()
    {
        var created = await api.CreateAsync(StudyApi.LocalDemo());
        using var client = api.CreateClient();

        var html = await client.GetStringAsync(new Uri($"/studies/{created.Id()}", UriKind.Relative));

        // demo-corner-local.json's mirror faces 231°.
        Assert.Contains("name=\"mirror.azimuthDeg\" value=\"231\"", html, StringComparison.Ordinal);
    }

    [Fact]
    public async Task List_TextSearch_LinksTheMatchingStudyOnly()
    {
        var wanted = await api.CreateAsync(StudyApi.LocalDemo("Birchwell Lane at Quarry Row"));
        var elsewhere = StudyApi.LocalDemo("Ostler Gate at Mill Wynd");
        elsewhere["site"] = "Ostler Gate / Mill Wynd";
        var other = await api.CreateAsync(elsewhere);
        using var client = api.CreateClient();

        var html = await client.GetStringAsync(new Uri("/studies?text=birchwell", UriKind.Relative));

        Assert.Contains($"<a href=\"/studies/{wanted.Id()}\">Birchwell Lane at Quarry Row</a>", html, StringComparison.Ordinal);
        Assert.DoesNotContain(other.Id(), html, StringComparison.Ordinal);
    }

    [Fact]
    public async Task List_MoreThanAPage_LinksTheNextPageOnly()
    {
        foreach (var title in new[] { "Ostler Gate", "Mill Wynd", "Quarry Row" })
        {
            await api.CreateAsync(StudyApi.LocalDemo(title));
        }

        using var client = api.CreateClient();

        var html = await client.GetStringAsync(new Uri("/studies?limit=2", UriKind.Relative));

        Assert.Contains("<h2>3 studies</h2>", html, StringComparison.Ordinal);
        Assert.Equal(2, html.Split("<tr><td><a href=\"/studies/").Length - 1);
        Assert.Contains("href=\"/studies?offset=2&amp;limit=2\" rel=\"next\"", html, StringComparison.Ordinal);
        Assert.DoesNotContain("rel=\"prev\"", html, StringComparison.Ordinal);
    }

    [Fact]
    public async Task List_BadBox_Answers400WithTheProblemBesideTheField()
    {
        using var client = api.CreateClient();

        using var response = await client.GetAsync(new Uri("/studies?bbox=1,2,3", UriKind.Relative));

        var html = await response.Content.ReadAsStringAsync();
        Assert.Equal(HttpStatusCode.BadRequest, response.StatusCode);
        Assert.Contains("id=\"search-bbox-errors\"><li>Four numbers", html, StringComparison.Ordinal);
    }

    [Fact]
    public async Task Show_UnknownStudy_Answers404()
    {
        using var client = api.CreateClient();

        using var response = await client.GetAsync(new Uri($"/studies/{Guid.NewGuid()}", UriKind.Relative));

        Assert.Equal(HttpStatusCode.NotFound, response.StatusCode);
    }

    [Theory]
    [InlineData("pdf", "application/pdf")]
    [InlineData("html", "text/html")]
    [InlineData("geojson", "application/geo+json")]
    [InlineData("json", "application/json")]
    public async Task GetRevision_FormatQuery_AnswersThatMediaType(string format, string mediaType)
    {
        var created = await api.CreateAsync(StudyApi.LocalDemo());
        using var client = api.CreateClient();

        using var response = await client.GetAsync(new Uri($"{StudyApi.Route}/{created.Id()}/revisions/1?format={format}", UriKind.Relative));

        Assert.Equal(HttpStatusCode.OK, response.StatusCode);
        Assert.Equal(mediaType, response.Content.Headers.ContentType?.MediaType);
    }

    [Fact]
    public async Task GetRevision_UnknownFormat_Answers400NamingFormat()
    {
        var created = await api.CreateAsync(StudyApi.LocalDemo());

        using var response = await api.SendAsync(HttpMethod.Get, $"{StudyApi.Route}/{created.Id()}/revisions/1?format=docx");

        var problem = await StudyApi.ExpectAsync(response, HttpStatusCode.BadRequest);
        Assert.True(problem.GetProperty("errors").TryGetProperty("format", out _));
    }

    private static Dictionary<string, string> Fields(JsonObject demo) => new(StudyPageForms.DemoMirror(demo))
    {
        ["title"] = "Tansy Mews at Colliers Row",
        ["site"] = "Tansy Mews exit onto Colliers Row",
        ["note"] = "Drawn from the site sketch",
        ["options.sightDistance.method"] = "stopping",
    };
}
