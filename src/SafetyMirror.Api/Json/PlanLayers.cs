using System.Text.Json;
using System.Text.Json.Nodes;
using Microsoft.AspNetCore.Http.HttpResults;
using NetTopologySuite.Features;
using SafetyMirror.Core.Site;

namespace SafetyMirror.Api.Json;

/// <summary>GIS layers in the plan's own coordinates, labelled with the plan's coordinate system so a GIS places them.</summary>
/// <remarks>
/// RFC 7946 layers are WGS84 and need no label. A projected plan's layers carry the older <c>crs</c> member that
/// GIS readers honour (the same member the plan came with); a local-metres plan's carry <c>"frame": "local-metres"</c>,
/// as its plan did, since no coordinate system exists for them.
/// </remarks>
public static class PlanLayers
{
    /// <summary>The media type of the GIS layers answer (RFC 7946, 12).</summary>
    public const string MediaType = "application/geo+json";

    /// <summary>Whether the client asked for the GIS layers rather than the JSON figures.</summary>
    public static bool AreWanted(HttpRequest request) =>
        request.Headers.Accept.Any(accept => accept?.Contains(MediaType, StringComparison.OrdinalIgnoreCase) == true);

    /// <summary>The layers as a geo+json answer, labelled for the plan's coordinates.</summary>
    public static JsonHttpResult<JsonObject> Answer(FeatureCollection layers, PlanFrame frame, JsonSerializerOptions options)
    {
        ArgumentNullException.ThrowIfNull(frame);
        var document = JsonSerializer.SerializeToNode(layers, options)!.AsObject();
        var system = frame.CoordinateSystem;
        if (system.IsLocalMetres)
        {
            document["frame"] = "local-metres";
        }
        else if (!system.IsGeographic && system.Urn is { } urn)
        {
            document["crs"] = new JsonObject { ["type"] = "name", ["properties"] = new JsonObject { ["name"] = urn } };
        }

        return TypedResults.Json(document, options, MediaType);
    }
}
