using System.Text.Json.Nodes;

namespace SafetyMirror.Api.Tests.District;

/// <summary>One corner of a batch, posted alone: the request body a single evaluation or recommendation takes.</summary>
internal sealed record SingleCornerRequest(string CornerId, string Route, JsonObject Body);

/// <summary>Splits a batch written as one FeatureCollection (Form A) into the single requests its corners stand for.</summary>
/// <remarks>
/// Read from the written text, not the generator's objects, so the tests see what a batch reader sees: each feature goes to
/// the corner its <c>corner</c> property names (that property dropped), a <c>mirror</c> feature becomes the evaluation's
/// mirror object, and the options are the shared ones with each member the corner gives replaced by its own.
/// </remarks>
internal static class DistrictRequests
{
    /// <summary>The single requests, in the order of the batch's <c>corners</c> member.</summary>
    public static List<SingleCornerRequest> FromCollection(string collection)
    {
        var batch = JsonNode.Parse(collection)!.AsObject();
        var byCorner = batch["features"]!.AsArray().Select(f => f!.AsObject()).ToLookup(f => (string)f["properties"]!["corner"]!);
        return [.. batch["corners"]!.AsObject().Select(pair => Request(pair.Key, byCorner[pair.Key], batch["options"]!.AsObject(), pair.Value!["options"]?.AsObject()))];
    }

    private static SingleCornerRequest Request(string cornerId, IEnumerable<JsonObject> features, JsonObject shared, JsonObject? own)
    {
        var plan = new JsonArray();
        JsonObject? mirror = null;
        foreach (var feature in features.Select(f => f.DeepClone().AsObject()))
        {
            var properties = feature["properties"]!.AsObject();
            properties.Remove("corner");
            if ((string?)properties["role"] == "mirror")
            {
                properties.Remove("role");
                mirror = new JsonObject { ["location"] = feature["geometry"]!.DeepClone() };
                foreach (var (member, value) in properties)
                {
                    mirror[member] = value?.DeepClone();
                }
            }
            else
            {
                plan.Add(feature);
            }
        }

        var options = shared.DeepClone().AsObject();
        foreach (var (member, value) in own ?? [])
        {
            options[member] = value?.DeepClone();
        }

        var body = new JsonObject { ["plan"] = new JsonObject { ["type"] = "FeatureCollection", ["features"] = plan }, ["options"] = options };
        if (mirror is not null)
        {
            body["mirror"] = mirror;
        }

        return new(cornerId, mirror is null ? "/v1/recommendations" : "/v1/evaluations", body);
    }
}
