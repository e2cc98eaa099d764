using System.Net;
using System.Text.Json;
using System.Text.Json.Nodes;

namespace SafetyMirror.Api.Tests.Features.Recommendations;

// Requests no recommendation can be made for: 400 problem details naming the field (RFC 9457, 3.1).
[Collection(ApiCollection.Name)]
public sealed class RecommendationProblemTests(ApiFactory api)
{
    [Fact]
    public async Task PlanWithoutMountingZoneOrCarriageway_SaysWhatToAdd()
    {
        var errors = await ErrorsAsync(Recommendations.Demo().Without("mounting-zone", "carriageway"));

        var message = Assert.Single(errors.GetProperty("plan.features").Strings());
        Assert.Contains("\"mounting-zone\"", message, StringComparison.Ordinal);
        Assert.Contains("\"carriageway\"", message, StringComparison.Ordinal);
    }

    // The ranges the contract states for each member.
    [Theory]
    [InlineData("""{ "alternatives": 0 }""", "options.alternatives")]
    [InlineData("""{ "alternatives": 6 }""", "options.alternatives")]
    [InlineData("""{ "aimToleranceDeg": 11 }""", "options.aimToleranceDeg")]
    [InlineData("""{ "minCentreHeightM": 2.5, "maxCentreHeightM": 2.4 }""", "options.maxCentreHeightM")]
    [InlineData("""{ "catalogue": [] }""", "options.catalogue")]
    [InlineData("""{ "catalogue": [{ "id": "round-450" }] }""", "options.catalogue[0].id")]
    [InlineData("""{ "catalogue": [{ "id": "round-800" }, { "id": "round-800" }] }""", "options.catalogue[1].id")]
    [InlineData("""{ "catalogue": [{ "diameterM": 0.7, "radiusM": 2.6 }] }""", "options.catalogue[0].id")]
    [InlineData("""{ "servedApproaches": [] }""", "options.servedApproaches")]
    [InlineData("""{ "servedApproaches": ["eastbound", "northbound"] }""", "options.servedApproaches[1]")]
    [InlineData("""{ "glareYear": 2101 }""", "options.glareYear")]
    [InlineData("""{ "glareHoursPerYearAllowed": 10 }""", "options.glareHoursPerYearAllowed")] // the search does not weigh glare
    public async Task BadOption_IsNamed(string options, string path)
    {
        var errors = await ErrorsAsync(WithOptions(options));

        Assert.True(errors.TryGetProperty(path, out _), $"No problem at {path}: {errors}");
    }

    [Fact]
    public async Task CatalogueFaceWiderThanItsSphere_IsNamedAtItsRadius()
    {
        // A sphere of radius R has no cap wider than 2R: a 1 m face needs R above 0.5 m (geometry).
        var errors = await ErrorsAsync(WithOptions("""{ "catalogue": [{ "id": "round-1000-tight", "diameterM": 1.0, "radiusM": 0.45 }] }"""));

        Assert.Contains("fit on the sphere", Assert.Single(errors.GetProperty("options.catalogue[0].radiusM").Strings()), StringComparison.Ordinal);
    }

    [Fact]
    public async Task CatalogueFaceThatCannotHangBelowTheHighestCentre_IsNamedAtTheHeight()
    {
        // The 600 mm face needs its centre 0.3 m above the 2.3 m lower-edge clearance (France IISR Art. 14), above 2.55 m.
        var errors = await ErrorsAsync(WithOptions("""{ "catalogue": [{ "id": "round-600" }], "minCentreHeightM": 2.5, "maxCentreHeightM": 2.55 }"""));

        Assert.Contains("\"round-600\" cannot hang", Assert.Single(errors.GetProperty("options.maxCentreHeightM").Strings()), StringComparison.Ordinal);
    }

    [Fact]
    public async Task UnknownOptionMember_IsRefused()
    {
        using var response = await api.PostRecommendationAsync(WithOptions("""{ "searchRadiusM": 20 }"""));

        var problem = await response.AssertProblemAsync(HttpStatusCode.BadRequest);
        Assert.True(problem.GetProperty("errors").TryGetProperty("options.searchRadiusM", out _), problem.ToString());
    }

    [Fact]
    public async Task EvaluationWithARecommendationMember_IsStillRefused()
    {
        var body = DemoCorners.Local();
        body["options"]!["alternatives"] = 3;

        using var client = api.CreateClient();
        using var response = await client.PostAsync(new Uri("/v1/evaluations", UriKind.Relative), new StringContent(body.ToJsonString(), System.Text.Encoding.UTF8, "application/json"));

        var problem = await response.AssertProblemAsync(HttpStatusCode.BadRequest);
        Assert.True(problem.GetProperty("errors").TryGetProperty("options.alternatives", out _), problem.ToString());
    }

    private static JsonObject WithOptions(string options)
    {
        var body = Recommendations.Demo();
        foreach (var (name, value) in JsonNode.Parse(options)!.AsObject())
        {
            body["options"]![name] = value?.DeepClone();
        }

        return body;
    }

    private async Task<JsonElement> ErrorsAsync(JsonObject body)
    {
        using var response = await api.PostRecommendationAsync(body);
        var problem = await response.AssertProblemAsync(HttpStatusCode.BadRequest);
        return problem.GetProperty("errors");
    }
}
