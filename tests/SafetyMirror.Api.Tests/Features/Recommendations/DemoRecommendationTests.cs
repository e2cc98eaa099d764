using System.Net;
using System.Text.Json;
using System.Text.Json.Nodes;
using NetTopologySuite.Features;
using NetTopologySuite.Geometries;
using NetTopologySuite.IO.Converters;

namespace SafetyMirror.Api.Tests.Features.Recommendations;

// The committed demo recommendation: the invented corner of openapi/examples with its mounting zone.
[Collection(ApiCollection.Name)]
public sealed class DemoRecommendationTests(ApiFactory api)
{
    private static readonly JsonSerializerOptions GeoJsonReader = new() { Converters = { new GeoJsonConverterFactory() } };

    [Fact]
    public async Task Demo_AnswersOneMirrorWithRankedAlternatives()
    {
        var answer = await api.RecommendAsync(Recommendations.Demo());

        // The corner house hides the eastbound approach only; the westbound one is seen directly (the demo corner's layout).
        Assert.Equal("one-mirror", answer.GetProperty("outcome").GetString());
        var alternatives = answer.GetProperty("alternatives").EnumerateArray().ToList();
        Assert.InRange(alternatives.Count, 2, 3);
        Assert.Equal(Enumerable.Range(1, alternatives.Count), alternatives.Select(a => a.GetProperty("rank").GetInt32()));
        Assert.True(alternatives[0].GetProperty("meetsRequirement").GetBoolean());
    }

    [Fact]
    public async Task Demo_OnlyTheRecommendedDesignCarriesItsGlare()
    {
        var alternatives = (await api.RecommendAsync(Recommendations.Demo())).GetProperty("alternatives");

        var glare = alternatives.EnumerateArray().Select(a => a.GetProperty("mirrors")[0].GetProperty("evaluation").GetProperty("glare").ValueKind).ToList();
        Assert.Equal([JsonValueKind.Object, .. Enumerable.Repeat(JsonValueKind.Null, glare.Count - 1)], glare);
        Assert.True(glare.Count > 1, "the demo asks for 3 alternatives");
    }

    [Fact]
    public async Task Demo_RanksByCoverageThenByTheSmallerFace()
    {
        var answer = await api.RecommendAsync(Recommendations.Demo());

        // The ranking order the contract states: coverage first, then the smaller face.
        var scores = answer.GetProperty("alternatives").EnumerateArray().Select(a => a.GetProperty("score"))
            .Select(s => (Coverage: s.GetProperty("coverage").GetDouble(), Area: s.GetProperty("faceAreaM2").GetDouble())).ToList();
        foreach (var (better, worse) in scores.Zip(scores.Skip(1)))
        {
            Assert.True(better.Coverage > worse.Coverage || (better.Coverage == worse.Coverage && better.Area <= worse.Area), $"{better} ranks above {worse}");
        }
    }

    [Fact]
    public async Task FirstAlternative_EvaluationIsWhatTheEvaluationEndpointAnswersForItsMirror()
    {
        var request = Recommendations.Demo();
        var answer = await api.RecommendAsync(request);
        var embedded = answer.GetProperty("alternatives")[0].GetProperty("mirrors")[0].GetProperty("evaluation");

        var evaluated = await api.EvaluateAsync(EvaluationOf(request, embedded.GetProperty("mirror")));

        // Every figure, rule check and caution, as POST /v1/evaluations gives them for the same mirror. The embedded
        // evaluation covers the approach the mirror serves (eastbound); the endpoint also reports westbound, seen directly.
        Assert.NotEmpty(embedded.GetProperty("checks").EnumerateArray());
        Assert.NotEmpty(embedded.GetProperty("cautions").EnumerateArray());
        Assert.Equal("eastbound", Assert.Single(embedded.GetProperty("approaches").EnumerateArray()).GetProperty("approach").GetProperty("id").GetString());
        foreach (var member in new[] { "decision", "mirror", "checks", "robustness", "cautions", "covered", "notCovered" })
        {
            Assert.True(JsonNode.DeepEquals(JsonNode.Parse(evaluated.GetProperty(member).GetRawText()), JsonNode.Parse(embedded.GetProperty(member).GetRawText())), member);
        }

        Assert.True(JsonNode.DeepEquals(JsonNode.Parse(evaluated.GetProperty("approaches")[0].GetRawText()), JsonNode.Parse(embedded.GetProperty("approaches")[0].GetRawText())));
    }

    [Fact]
    public async Task Demo_CautionsAreThoseOfTheFirstAlternativesEvaluation()
    {
        var answer = await api.RecommendAsync(Recommendations.Demo());

        var evaluation = answer.GetProperty("alternatives")[0].GetProperty("mirrors")[0].GetProperty("evaluation");
        Assert.Equal(Codes(evaluation.GetProperty("cautions")), Codes(answer.GetProperty("cautions")));
        Assert.Contains("looks-smaller-farther-slower", Codes(answer.GetProperty("cautions")));
    }

    [Fact]
    public async Task InstallationSheet_AgreesWithTheFirstAlternativesEvaluation()
    {
        var answer = await api.RecommendAsync(Recommendations.Demo());

        var design = answer.GetProperty("alternatives")[0].GetProperty("mirrors")[0];
        var evaluated = design.GetProperty("evaluation").GetProperty("mirror");
        var sheet = Assert.Single(answer.GetProperty("installation").GetProperty("mirrors").EnumerateArray());
        Assert.Equal(design.GetProperty("catalogueId").GetString(), sheet.GetProperty("catalogueId").GetString());
        Assert.Equal(Coordinates(evaluated.GetProperty("location")), Coordinates(sheet.GetProperty("pole")));
        Assert.Equal(evaluated.GetProperty("centreHeightM").GetDouble(), sheet.GetProperty("centreHeightM").GetDouble(), 1e-4);
        Assert.Equal(evaluated.GetProperty("lowerEdgeHeightM").GetDouble(), sheet.GetProperty("lowerEdgeHeightM").GetDouble(), 1e-3);
        Assert.Equal(evaluated.GetProperty("azimuthDeg").GetDouble(), sheet.GetProperty("azimuthDeg").GetDouble(), 0.05);
        Assert.Equal(evaluated.GetProperty("tiltDownDeg").GetDouble(), sheet.GetProperty("tiltDownDeg").GetDouble(), 0.05);
        Assert.Equal(evaluated.GetProperty("radiusM").GetDouble(), sheet.GetProperty("radiusM").GetDouble());
        Assert.All(new[] { "diameterM", "widthM", "heightM" }, face => Assert.Equal(evaluated.GetProperty(face).GetRawText(), sheet.GetProperty(face).GetRawText()));
        Assert.Equal(Codes(design.GetProperty("evaluation").GetProperty("cautions")), Codes(sheet.GetProperty("cautions")));
    }

    [Fact]
    public async Task InstallationSheet_GivesTheAimToATenthOfADegree()
    {
        var answer = await api.RecommendAsync(Recommendations.Demo());

        var sheet = answer.GetProperty("installation").GetProperty("mirrors")[0];
        Assert.All(new[] { "azimuthDeg", "tiltDownDeg" }, aim =>
        {
            var tenths = sheet.GetProperty(aim).GetDouble() * 10;
            Assert.Equal(Math.Round(tenths), tenths, 1e-9);
        });
    }

    [Fact]
    public async Task SameRequestTwice_GetsTheSameAnswer()
    {
        using var first = await api.PostRecommendationAsync(Recommendations.Demo());
        using var second = await api.PostRecommendationAsync(Recommendations.Demo());

        Assert.Equal(HttpStatusCode.OK, first.StatusCode);
        Assert.Equal(await first.Content.ReadAsStringAsync(), await second.Content.ReadAsStringAsync());
    }

    [Fact]
    public async Task GeoJsonAnswer_ReadsBackWithTheMirrorLayersAndEveryCandidateTried()
    {
        using var response = await api.PostRecommendationAsync(Recommendations.Demo(), Recommendations.GeoJson);
        Assert.Equal(Recommendations.GeoJson, response.Content.Headers.ContentType?.MediaType);
        var layers = JsonSerializer.Deserialize<FeatureCollection>(await response.Content.ReadAsStringAsync(), GeoJsonReader)!;
        var answer = await api.RecommendAsync(Recommendations.Demo());

        var mirror = Assert.Single(layers, f => (string)f.Attributes["layer"] == "mirror");
        Assert.Equal(answer.GetProperty("installation").GetProperty("mirrors")[0].GetProperty("catalogueId").GetString(), (string)mirror.Attributes["catalogueId"]);
        var candidates = layers.Where(f => (string)f.Attributes["layer"] == "candidate").ToList();
        Assert.All(candidates, c => Assert.IsType<Point>(c.Geometry));
        Assert.Equal(
            answer.GetProperty("candidates").EnumerateArray().Select(c => Coordinates(c.GetProperty("position"))),
            candidates.Select(c => (c.Geometry.Coordinate.X, c.Geometry.Coordinate.Y)));
        Assert.All(candidates, c => Assert.Contains((string)c.Attributes["stage"], new[] { "coarse", "fine" }));
    }

    [Fact]
    public async Task GeoJsonAnswer_FieldOfViewLayerOverlapsNoObstacle()
    {
        using var response = await api.PostRecommendationAsync(Recommendations.Demo(), Recommendations.GeoJson);
        var layers = JsonSerializer.Deserialize<FeatureCollection>(await response.Content.ReadAsStringAsync(), GeoJsonReader)!;
        var obstacles = Recommendations.Demo()["plan"]!["features"]!.AsArray()
            .Where(f => (string?)f!["properties"]!["role"] == "obstacle")
            .Select(f => JsonSerializer.Deserialize<Geometry>(f!["geometry"]!.ToJsonString(), GeoJsonReader)!)
            .ToList();

        var field = Assert.Single(layers, f => (string)f.Attributes["layer"] == "field-of-view");
        Assert.NotEmpty(obstacles);
        Assert.All(obstacles, o => Assert.True(field.Geometry.Intersection(o).Area < 1e-6, field.Geometry.ToText()));
    }

    // The evaluation request for a mirror as the recommendation evaluated it, with the same plan and corner options.
    private static JsonObject EvaluationOf(JsonObject recommendation, JsonElement mirror)
    {
        var options = recommendation["options"]!.AsObject();
        foreach (var member in new[] { "minCentreHeightM", "maxCentreHeightM", "aimToleranceDeg", "alternatives" })
        {
            options.Remove(member);
        }

        var face = new JsonObject();
        foreach (var member in new[] { "location", "centreHeightM", "azimuthDeg", "tiltDownDeg", "radiusM", "diameterM", "widthM", "heightM" })
        {
            if (mirror.GetProperty(member).ValueKind != JsonValueKind.Null)
            {
                face[member] = JsonNode.Parse(mirror.GetProperty(member).GetRawText());
            }
        }

        return new JsonObject { ["plan"] = recommendation["plan"]!.DeepClone(), ["mirror"] = face, ["options"] = options.DeepClone() };
    }

    private static (double X, double Y) Coordinates(JsonElement point)
    {
        var xy = point.GetProperty("coordinates");
        return (xy[0].GetDouble(), xy[1].GetDouble());
    }

    private static List<string> Codes(JsonElement cautions) => [.. cautions.EnumerateArray().Select(c => c.GetProperty("code").GetString()!)];
}
