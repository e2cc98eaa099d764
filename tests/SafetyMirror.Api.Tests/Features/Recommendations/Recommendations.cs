using System.Text.Json;
using System.Text.Json.Nodes;
using Microsoft.AspNetCore.Mvc.Testing;

namespace SafetyMirror.Api.Tests.Features.Recommendations;

/// <summary>Sends requests to <c>POST /v1/recommendations</c> through the host's real HTTP pipeline, and builds their bodies.</summary>
internal static class Recommendations
{
    /// <summary>The route under test.</summary>
    public const string Route = "/v1/recommendations";

    /// <summary>The media type of the GIS layers answer (RFC 7946, 12).</summary>
    public const string GeoJson = "application/geo+json";

    /// <summary>A fresh copy of the committed demo recommendation request (the invented demo corner, with its mounting zone).</summary>
    public static JsonObject Demo() =>
        JsonNode.Parse(File.ReadAllText(RepositoryFiles.PathOf("openapi", "examples", "demo-recommendation-local.json")))!.AsObject();

    /// <summary>The plan's features of a request body.</summary>
    public static JsonArray Features(this JsonNode body) => body["plan"]!["features"]!.AsArray();

    /// <summary>The body without the plan's features of the given roles.</summary>
    public static JsonObject Without(this JsonObject body, params string[] roles)
    {
        foreach (var feature in body.Features().Where(f => roles.Contains((string?)f!["properties"]!["role"])).ToList())
        {
            body.Features().Remove(feature);
        }

        return body;
    }

    /// <summary>The body with every approach at the given speed, drawn at least so long.</summary>
    public static JsonObject WithApproaches(this JsonObject body, double speedKmh, double lengthM)
    {
        foreach (var approach in body.Features().Where(f => (string?)f!["properties"]!["role"] == "approach"))
        {
            approach!["properties"]!["speedKmh"] = speedKmh;

            // The approaches run along x towards x = 0 from their first position: push that one out.
            var start = approach["geometry"]!["coordinates"]![0]!.AsArray();
            start[0] = Math.Sign((double)start[0]!) * lengthM;
        }

        return body;
    }

    /// <summary>Sets the siting rules' speed limit, with a source invented for the test.</summary>
    public static JsonObject WithSpeedRule(this JsonObject body, double speedKmh)
    {
        body["options"]!["rules"] = new JsonObject { ["cautionAboveSpeedKmh"] = speedKmh, ["source"] = "a local rule invented for the test" };
        return body;
    }

    /// <summary>Posts a request body, asking for the given media type.</summary>
    public static Task<HttpResponseMessage> PostRecommendationAsync(this WebApplicationFactory<Program> api, JsonNode body, string accept = "application/json") =>
        api.PostJsonAsync(Route, body.ToJsonString(), accept);

    /// <summary>Posts a request body that must be answered with a recommendation, and returns the JSON answer.</summary>
    public static Task<JsonElement> RecommendAsync(this WebApplicationFactory<Program> api, JsonNode body) => api.PostForJsonAsync(Route, body);

    /// <summary>Posts an evaluation request and returns the JSON answer.</summary>
    public static Task<JsonElement> EvaluateAsync(this WebApplicationFactory<Program> api, JsonNode body) => api.PostForJsonAsync("/v1/evaluations", body);

    /// <summary>The strings of a JSON array member.</summary>
    public static List<string> Strings(this JsonElement array) => [.. array.EnumerateArray().Select(e => e.GetString()!)];
}
