using System.Text.Json.Nodes;

namespace SafetyMirror.Api.Tests.Features.Evaluations;

// The geo+json answer says which coordinates it is in, the way its plan said so.
[Collection(ApiCollection.Name)]
public sealed class GeoJsonLabelTests(ApiFactory api)
{
    [Fact]
    public async Task LocalMetresPlan_LayersCarryTheLocalMetresFrame()
    {
        var layers = await LayersAsync(DemoCorners.Local());

        Assert.Equal("local-metres", (string?)layers["frame"]);
        Assert.Null(layers["crs"]);
    }

    [Fact]
    public async Task Wgs84Plan_LayersCarryNoLabel()
    {
        // RFC 7946 §4: GeoJSON coordinates are WGS84 unless agreed otherwise; no member is needed.
        var layers = await LayersAsync(DemoCorners.Wgs84());

        Assert.Null(layers["frame"]);
        Assert.Null(layers["crs"]);
    }

    [Fact]
    public async Task UtmPlan_LayersCarryTheSameCrsAndComeBackInUtm()
    {
        // The demo corner moved to invented UTM zone 32N coordinates: the local metres shifted by a round offset.
        const double east = 560_000, north = 5_514_000;
        var body = DemoCorners.Local();
        var plan = body["plan"]!.AsObject();
        plan.Remove("frame");
        plan["crs"] = new JsonObject { ["type"] = "name", ["properties"] = new JsonObject { ["name"] = "urn:ogc:def:crs:EPSG::32632" } };
        Shift(plan["features"], east, north);
        Shift(body["mirror"]!["location"], east, north);

        var layers = await LayersAsync(body);

        Assert.Equal("urn:ogc:def:crs:EPSG::32632", (string?)layers["crs"]!["properties"]!["name"]);
        var mirror = layers["features"]!.AsArray().Single(f => (string?)f!["properties"]!["layer"] == "mirror")!;
        Assert.Equal(east + 6, (double)mirror["geometry"]!["coordinates"]![0]!, 1e-3); // the demo mirror stands at local (6, 7.5)
        Assert.Equal(north + 7.5, (double)mirror["geometry"]!["coordinates"]![1]!, 1e-3);
    }

    private async Task<JsonObject> LayersAsync(JsonObject body)
    {
        using var response = await api.PostEvaluationAsync(body, Evaluations.GeoJson);
        response.EnsureSuccessStatusCode();
        return JsonNode.Parse(await response.Content.ReadAsStringAsync())!.AsObject();
    }

    private static void Shift(JsonNode? node, double east, double north)
    {
        switch (node)
        {
            case JsonArray { Count: >= 2 } position when position[0] is JsonValue && position[1] is JsonValue:
                position[0] = (double)position[0]! + east;
                position[1] = (double)position[1]! + north;
                break;
            case JsonArray array:
                foreach (var item in array)
                {
                    Shift(item, east, north);
                }

                break;
            case JsonObject obj:
                foreach (var (key, value) in obj.ToList())
                {
                    if (key is "coordinates" or "features" or "geometry")
                    {
                        Shift(value, east, north);
                    }
                }

                break;
        }
    }
}
