using System.Net;
using System.Net.Http.Headers;
using System.Text;
using System.Text.Json;
using System.Text.Json.Nodes;

namespace SafetyMirror.Api.Tests.Requests;

/// <summary>Each request that once got a 500, a .NET type name or an unnamed field, answered as a 400 problem naming the field.</summary>
[Collection(ApiCollection.Name)]
public sealed class HostileRequestRegressionTests(ApiFactory api)
{
    private const string Evaluations = "/v1/evaluations";
    private const string Recommendations = "/v1/recommendations";
    private const string Reports = "/v1/reports";

    [Theory]
    [InlineData("\"id\": \"driver\"", "\"id\": \"\\ud800\"", "plan.features[0].id")]
    [InlineData("\"name\": \"Colliers Row eastbound\"", "\"name\": \"Colliers \\udc00\"", "plan.features[1].properties.name")]
    [InlineData("\"role\": \"eye\"", "\"role\": \"\\ud800\"", "plan.features[0].properties.role")]
    [InlineData("{ \"type\": \"Feature\", \"id\": \"driver\"", "{ \"type\": \"Feat\\ud800\", \"id\": \"driver\"", "plan.features[0].type")]
    [InlineData("\"eyeHeightM\": 1.08", "\"eyeHeightM\": 1.08, \"\\ud800\": 1", "plan.features[0].properties")]
    [InlineData("\"frame\": \"local-metres\",", "\"crs\": { \"type\": \"name\", \"properties\": { \"name\": \"\\ud800\" } },", "plan.crs.properties.name")]
    public async Task Post_LoneSurrogateInThePlan_Is400NamingTheString(string original, string spoiled, string path)
    {
        var body = Example("demo-corner-local.json").Replace(original, spoiled, StringComparison.Ordinal);

        var errors = await ErrorsAsync(Evaluations, Encoding.UTF8.GetBytes(body));

        Assert.True(errors.TryGetProperty(path, out _), errors.ToString());
    }

    [Fact]
    public async Task Post_InvalidUtf8InAPlanName_Is400NamingTheName()
    {
        var body = Encoding.UTF8.GetBytes(Example("demo-corner-local.json").Replace("Colliers Row eastbound", "Colliers Row ?", StringComparison.Ordinal));
        body[Array.IndexOf(body, (byte)'?')] = 0xFF; // never valid in UTF-8: RFC 3629, 1

        var errors = await ErrorsAsync(Evaluations, body);

        Assert.True(errors.TryGetProperty("plan.features[1].properties.name", out _), errors.ToString());
    }

    [Theory]
    [InlineData(Evaluations, "demo-corner-local.json")]
    [InlineData(Recommendations, "demo-recommendation-local.json")]
    public async Task Post_RoadUserListedTwice_Is400NamingTheSecond(string route, string example)
    {
        var body = JsonNode.Parse(Example(example))!;
        body["options"]!["roadUsers"] = new JsonArray(new JsonObject { ["id"] = "passenger-car" }, new JsonObject { ["id"] = "bicycle" }, new JsonObject { ["id"] = "bicycle" });

        var errors = await ErrorsAsync(route, Encoding.UTF8.GetBytes(body.ToJsonString()));

        Assert.Contains("listed twice", errors.GetProperty("options.roadUsers[2]")[0].GetString(), StringComparison.Ordinal);
    }

    [Fact]
    public async Task Post_DuplicateFeatureId_Is400NamingTheSecond()
    {
        var body = DemoCorners.Local();
        body.Feature(2)["id"] = "eastbound";

        var errors = await ErrorsAsync(Evaluations, Encoding.UTF8.GetBytes(body.ToJsonString()));

        Assert.Contains("already the id of features[1]", errors.GetProperty("plan.features[2].id")[0].GetString(), StringComparison.Ordinal);
    }

    [Fact]
    public async Task Post_ApproachFoldedFarBeyondItsSightDistance_Is400NamingTheLane()
    {
        // 245 strips of 400 m, 2 m apart: about 98 km of lane folded inside the plan's 1 km box.
        var body = DemoCorners.Local();
        body.Feature(1)["geometry"]!["coordinates"] = new JsonArray([.. Enumerable.Range(0, 245).SelectMany(i => i % 2 == 0
            ? new[] { new JsonArray(-200, 20 + (2 * i)), new JsonArray(200, 20 + (2 * i)) }
            : [new JsonArray(200, 20 + (2 * i)), new JsonArray(-200, 20 + (2 * i))])]);

        var errors = await ErrorsAsync(Evaluations, Encoding.UTF8.GetBytes(body.ToJsonString()));

        Assert.Contains("at most 2000 m", errors.GetProperty("plan.features[1].geometry.coordinates")[0].GetString(), StringComparison.Ordinal);
    }

    [Theory]
    [InlineData(4_000)]
    [InlineData(1_000_000)]
    public async Task Post_PdfReportWithAnOverlongApproachName_Is400NamingTheName(int length)
    {
        var body = DemoCorners.Report();
        body.Feature(1)["properties"]!["name"] = new string('W', length);

        var errors = await ErrorsAsync(Reports, Encoding.UTF8.GetBytes(body.ToJsonString()), "application/pdf");

        Assert.Contains("at most 200", errors.GetProperty("plan.features[1].properties.name")[0].GetString(), StringComparison.Ordinal);
    }

    [Fact]
    public async Task Post_PdfReportWithTheLongestApproachName_IsWritten()
    {
        var body = DemoCorners.Report();
        body.Feature(1)["properties"]!["name"] = new string('W', 200);

        using var response = await Send(Reports, Encoding.UTF8.GetBytes(body.ToJsonString()), "application/pdf");

        Assert.Equal(HttpStatusCode.OK, response.StatusCode);
    }

    [Fact]
    public async Task Post_MalformedNumberInsideThePlan_NamesTheMember()
    {
        var body = Example("demo-corner-local.json").Replace("\"speedKmh\": 30,", "\"speedKmh\": 3.0.1,", StringComparison.Ordinal);

        var errors = await ErrorsAsync(Evaluations, Encoding.UTF8.GetBytes(body));

        Assert.True(errors.TryGetProperty("plan.features[1].properties.speedKmh", out _), errors.ToString());
    }

    [Theory]
    [InlineData("\"radiusM\": 3.0", "\"radiusM\": \"3.0\"", "mirror.radiusM", "a finite JSON number from 0.3 to 50")]
    [InlineData("\"radiusM\": 3.0", "\"radiusM\": 1e400", "mirror.radiusM", "from 0.3 to 50")]
    [InlineData("\"radiusM\": 3.0", "\"radiusM\": 3.0, \"radiusMm\": 1", "mirror.radiusMm", "Unknown member \"radiusMm\"; the members here are: location,")]
    [InlineData("\"stationSpacingM\": 5", "\"stationSpacingM\": [5]", "options.stationSpacingM", "a finite JSON number from 0.5 to 100")]
    public async Task Post_WrongKindOfValue_NamesTheMemberAndNoDotNetType(string original, string spoiled, string path, string said)
    {
        var body = Example("demo-corner-local.json").Replace(original, spoiled, StringComparison.Ordinal);
        Assert.NotEqual(Example("demo-corner-local.json"), body);

        using var response = await Send(Evaluations, Encoding.UTF8.GetBytes(body));
        var text = await response.Content.ReadAsStringAsync();

        Assert.DoesNotContain("System.", text, StringComparison.Ordinal);
        Assert.DoesNotContain("SafetyMirror.", text, StringComparison.Ordinal);
        var problem = await response.AssertProblemAsync(HttpStatusCode.BadRequest);
        Assert.Contains(said, problem.GetProperty("errors").GetProperty(path)[0].GetString(), StringComparison.Ordinal);
    }

    [Fact]
    public async Task Post_NestingDeeperThanTheLimit_Is400NamingWhereItBreaks()
    {
        // The service reads at most 32 levels (ServiceJson.MaxDepth); this plan property goes 40 deep.
        var body = Example("demo-corner-local.json").Replace("\"eyeHeightM\": 1.08", "\"eyeHeightM\": 1.08, \"deep\": " + new string('[', 40) + new string(']', 40), StringComparison.Ordinal);

        var errors = await ErrorsAsync(Evaluations, Encoding.UTF8.GetBytes(body));

        Assert.Contains(errors.EnumerateObject(), e => e.Name.StartsWith("plan.features[0].properties.deep", StringComparison.Ordinal));
    }

    [Fact]
    public async Task Post_ServedApproachIdLongerThanAnyFeatureId_Is400NamingIt()
    {
        var body = JsonNode.Parse(Example("demo-recommendation-local.json"))!;
        body["options"]!["servedApproaches"] = new JsonArray("eastbound", new string('e', 100_000));

        var errors = await ErrorsAsync(Recommendations, Encoding.UTF8.GetBytes(body.ToJsonString()));

        Assert.Contains("At most 200 characters", errors.GetProperty("options.servedApproaches[1]")[0].GetString(), StringComparison.Ordinal);
    }

    [Theory]
    [InlineData(Evaluations, "application/json")]
    [InlineData(Reports, "application/pdf")]
    [InlineData(Reports, "text/html")]
    public async Task Post_EmptyBody_IsTitledProblemNamingTheBody(string route, string accept)
    {
        var errors = await ErrorsAsync(route, [], accept);

        Assert.True(errors.TryGetProperty("body", out _), errors.ToString());
    }

    [Theory]
    [InlineData("text/plain")]
    [InlineData(null)]
    public async Task Post_ReportNotSentAsJson_Is415ProblemWithATitle(string? contentType)
    {
        using var response = await Send(Reports, Encoding.UTF8.GetBytes(DemoCorners.Report().ToJsonString()), "application/pdf", contentType);

        var problem = await response.AssertProblemAsync(HttpStatusCode.UnsupportedMediaType);
        Assert.False(string.IsNullOrWhiteSpace(problem.GetProperty("title").GetString()));
    }

    private static string Example(string file) => File.ReadAllText(RepositoryFiles.PathOf("openapi", "examples", file));

    private async Task<JsonElement> ErrorsAsync(string route, byte[] body, string accept = "application/json")
    {
        using var response = await Send(route, body, accept);
        var problem = await response.AssertProblemAsync(HttpStatusCode.BadRequest);
        Assert.False(string.IsNullOrWhiteSpace(problem.GetProperty("title").GetString()));
        return problem.GetProperty("errors");
    }

    private async Task<HttpResponseMessage> Send(string route, byte[] body, string accept = "application/json", string? contentType = "application/json")
    {
        using var client = api.CreateClient();
        using var request = new HttpRequestMessage(HttpMethod.Post, new Uri(route, UriKind.Relative)) { Content = new ByteArrayContent(body) };
        request.Content.Headers.ContentType = contentType is null ? null : new MediaTypeHeaderValue(contentType);
        request.Headers.Accept.ParseAdd(accept);
        return await client.SendAsync(request);
    }
}
