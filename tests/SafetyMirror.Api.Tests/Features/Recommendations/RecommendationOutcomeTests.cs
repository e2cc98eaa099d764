using System.Text.Json;
using System.Text.Json.Nodes;

namespace SafetyMirror.Api.Tests.Features.Recommendations;

// The four outcomes, on variations of the invented demo corner.
[Collection(ApiCollection.Name)]
public sealed class RecommendationOutcomeTests(ApiFactory api)
{
    [Fact]
    public async Task CornerWithoutObstacles_NeedsNoMirror()
    {
        var answer = await api.RecommendAsync(Recommendations.Demo().Without("obstacle"));

        Assert.Equal("no-mirror-needed", answer.GetProperty("outcome").GetString());
        Assert.Empty(answer.GetProperty("alternatives").EnumerateArray());
        Assert.Equal(JsonValueKind.Null, answer.GetProperty("installation").ValueKind);
        Assert.NotEmpty(answer.GetProperty("measuresToConsider").EnumerateArray());
    }

    [Fact]
    public async Task CornerWithoutObstacles_StillCarriesTheCautionsOfAnEvaluationThere()
    {
        var answer = await api.RecommendAsync(Recommendations.Demo().Without("obstacle"));

        // The general cautions: those any mirror on the same corner, with the same options, would carry.
        var evaluated = await api.EvaluateAsync(DemoCorners.Local().Without("obstacle"));
        Assert.Equal(evaluated.GetProperty("cautions").GetRawText(), answer.GetProperty("cautions").GetRawText());
    }

    [Fact]
    public async Task CornerHiddenOnBothSides_NeedsTwoMirrorsEachServingOneApproach()
    {
        var body = Recommendations.Demo();
        body.Features().Add(Building("east-house", "No. 1 Colliers Row", 2, -20, 30, -1, heightM: 6));

        var answer = await api.RecommendAsync(body);

        Assert.Equal("two-mirrors", answer.GetProperty("outcome").GetString());
        var first = answer.GetProperty("alternatives")[0];
        Assert.True(first.GetProperty("meetsRequirement").GetBoolean());
        var served = first.GetProperty("mirrors").EnumerateArray()
            .Select(m => Assert.Single(m.GetProperty("servedApproaches").EnumerateArray()).GetProperty("id").GetString())
            .ToList();
        Assert.Equal(["eastbound", "westbound"], served.Order());
        Assert.Equal(2, answer.GetProperty("installation").GetProperty("mirrors").GetArrayLength());
    }

    [Fact]
    public async Task CornerHiddenOnBothSides_EachMirrorMeetsTheRequirementOnItsApproach()
    {
        var body = Recommendations.Demo();
        body.Features().Add(Building("east-house", "No. 1 Colliers Row", 2, -20, 30, -1, heightM: 6));

        var answer = await api.RecommendAsync(body);

        foreach (var mirror in answer.GetProperty("alternatives")[0].GetProperty("mirrors").EnumerateArray())
        {
            var id = mirror.GetProperty("servedApproaches")[0].GetProperty("id").GetString();
            var approach = mirror.GetProperty("evaluation").GetProperty("approaches").EnumerateArray()
                .Single(a => a.GetProperty("approach").GetProperty("id").GetString() == id);
            var summary = approach.GetProperty("summary");
            Assert.True(summary.GetProperty("meetsRequirement").GetBoolean(), id);
            Assert.Equal(35, summary.GetProperty("requiredSightDistanceM").GetDouble()); // AASHTO Green Book 2011, Table 3-1: 30 km/h
        }
    }

    [Fact]
    public async Task At80Kmh_NoMirrorServesAndTheBestAchievedIsReported()
    {
        // 80 km/h needs 130 m, drawn 150 m long so that the reach can be judged; a local rule (invented for the test)
        // allows mirrors up to 100 km/h, so only the view decides.
        var answer = await api.RecommendAsync(Recommendations.Demo().WithApproaches(speedKmh: 80, lengthM: 150).WithSpeedRule(100));

        Assert.Equal("no-mirror-serves", answer.GetProperty("outcome").GetString());
        Assert.Equal(JsonValueKind.Null, answer.GetProperty("installation").ValueKind);
        var best = answer.GetProperty("alternatives")[0];
        Assert.False(best.GetProperty("meetsRequirement").GetBoolean());
        Assert.InRange(best.GetProperty("score").GetProperty("coverage").GetDouble(), 0.01, 0.99);
        var eastbound = best.GetProperty("mirrors")[0].GetProperty("evaluation").GetProperty("approaches")[0].GetProperty("summary");
        Assert.Equal(130, eastbound.GetProperty("requiredSightDistanceM").GetDouble()); // AASHTO Green Book 2011, Table 3-1: 80 km/h
    }

    [Fact]
    public async Task At80Kmh_MeasuresNameRemovingTheObstructionAndLoweringTheSpeed()
    {
        var answer = await api.RecommendAsync(Recommendations.Demo().WithApproaches(speedKmh: 80, lengthM: 150).WithSpeedRule(100));

        var measures = answer.GetProperty("measuresToConsider").Strings();
        Assert.Contains(measures, m => m.Contains("obstruction", StringComparison.OrdinalIgnoreCase) && m.Contains("Remove", StringComparison.Ordinal));
        Assert.Contains(measures, m => m.Contains("Lower the speed", StringComparison.Ordinal));
    }

    [Fact]
    public async Task At55Kmh_IsOutsideTheSitingRulesAndNamesTheRemedy()
    {
        // France IISR Art. 14: priority road at 50 km/h or less; AASHTO Table 3-1 would need 75 m at 55 km/h.
        var answer = await api.RecommendAsync(Recommendations.Demo().WithApproaches(speedKmh: 55, lengthM: 120));

        Assert.Equal("outside-siting-rules", answer.GetProperty("outcome").GetString());
        Assert.Equal(JsonValueKind.Null, answer.GetProperty("installation").ValueKind);
        Assert.Contains("approach-speed 55 km/h against at most 50 km/h", answer.GetProperty("summary").GetString(), StringComparison.Ordinal);
        Assert.Contains(answer.GetProperty("measuresToConsider").Strings(), m => m.Contains("lower the approach speed to 50 km/h or less", StringComparison.Ordinal));
    }

    [Fact]
    public async Task ServedApproachById_ServesThatApproachOnly()
    {
        var body = Recommendations.Demo();
        body["options"]!["servedApproaches"] = new JsonArray("westbound");

        var answer = await api.RecommendAsync(body);

        // The westbound approach is seen directly over its whole drawn length (the demo corner's layout).
        Assert.Equal("no-mirror-needed", answer.GetProperty("outcome").GetString());
        Assert.Equal("westbound", Assert.Single(answer.GetProperty("servedApproaches").EnumerateArray()).GetProperty("id").GetString());
        Assert.Equal("westbound", answer.GetProperty("options").GetProperty("servedApproaches")[0].GetProperty("id").GetString());
    }

    [Fact]
    public async Task CustomCatalogue_IsSearchedAndEchoed()
    {
        var body = Recommendations.Demo();
        body["options"]!["catalogue"] = JsonNode.Parse("""[{ "id": "round-700", "diameterM": 0.7, "radiusM": 2.6, "source": "invented maker's sheet" }]""");

        var answer = await api.RecommendAsync(body);

        Assert.All(answer.GetProperty("alternatives").EnumerateArray(), a => Assert.Equal("round-700", a.GetProperty("mirrors")[0].GetProperty("catalogueId").GetString()));
        var entry = Assert.Single(answer.GetProperty("options").GetProperty("catalogue").EnumerateArray());
        Assert.Equal(Math.PI * 0.35 * 0.35, entry.GetProperty("faceAreaM2").GetDouble(), 1e-4); // area of a disc, π r²
        Assert.Equal("invented maker's sheet", entry.GetProperty("source").GetString());
    }

    private static JsonObject Building(string id, string name, double west, double south, double east, double north, double heightM) => new()
    {
        ["type"] = "Feature",
        ["id"] = id,
        ["properties"] = new JsonObject { ["role"] = "obstacle", ["name"] = name, ["heightM"] = heightM },
        ["geometry"] = new JsonObject
        {
            ["type"] = "Polygon",
            ["coordinates"] = new JsonArray(new JsonArray(
                new JsonArray(west, south), new JsonArray(east, south), new JsonArray(east, north), new JsonArray(west, north), new JsonArray(west, south))),
        },
    };
}
