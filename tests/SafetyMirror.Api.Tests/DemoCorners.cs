using System.Text.Json.Nodes;

namespace SafetyMirror.Api.Tests;

/// <summary>The invented demo corner of openapi/examples, as request bodies to change and send.</summary>
/// <remarks>Both files describe the same invented corner; the WGS84 one was projected from the local one.</remarks>
internal static class DemoCorners
{
    /// <summary>A fresh copy of the demo corner drawn in local metres.</summary>
    public static JsonObject Local() => Load("demo-corner-local.json");

    /// <summary>The same corner with the mirror aimed too far down the street: it leaves a stretch near the exit unseen.</summary>
    public static JsonObject Unseen() => Load("demo-corner-unseen-local.json");

    /// <summary>A fresh copy of the same corner in WGS84 longitude and latitude.</summary>
    public static JsonObject Wgs84() => Load("demo-corner-wgs84.json");

    /// <summary>A fresh copy of the demo report request: the local demo corner with its mirror and an invented header.</summary>
    public static JsonObject Report() => Load("demo-report-local.json");

    /// <summary>The feature at a position of a request body's plan.</summary>
    public static JsonObject Feature(this JsonNode body, int index) => body["plan"]!["features"]![index]!.AsObject();

    /// <summary>The body with every approach's speed given in mph instead of km/h.</summary>
    public static JsonObject WithSpeedMph(this JsonObject body, double speedMph)
    {
        foreach (var properties in body["plan"]!["features"]!.AsArray().Select(f => f!["properties"]!.AsObject()).Where(p => (string?)p["role"] == "approach"))
        {
            properties.Remove("speedKmh");
            properties["speedMph"] = speedMph;
        }

        return body;
    }

    private static JsonObject Load(string name) =>
        JsonNode.Parse(File.ReadAllText(RepositoryFiles.PathOf("openapi", "examples", name)))!.AsObject();
}
