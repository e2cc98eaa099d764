using System.Text;
using System.Text.Json;
using System.Text.Json.Nodes;

namespace SafetyMirror.District;

/// <summary>Writes a district as a batch: one FeatureCollection (Form A) or a GeoJSON text sequence (Form B, RFC 8142).</summary>
/// <remarks>UTF-8 without a byte order mark and with line feeds only, so the same district is the same bytes everywhere.</remarks>
public static class DistrictWriter
{
    /// <summary>The media type of Form A.</summary>
    public const string CollectionMediaType = "application/geo+json";

    /// <summary>The media type of Form B (RFC 8142).</summary>
    public const string SequenceMediaType = "application/geo+json-seq";

    /// <summary>The record separator that opens each text of a sequence (RFC 8142 §2).</summary>
    public const char RecordSeparator = '\u001e';

    private static readonly JsonSerializerOptions Compact = new() { WriteIndented = false };

    /// <summary>Form A: one FeatureCollection whose features carry their corner's id, with the batch's name, shared
    /// options and per-corner names and options as top-level members; one feature a line.</summary>
    public static string ToCollection(GeneratedDistrict district)
    {
        ArgumentNullException.ThrowIfNull(district);
        var corners = new JsonObject();
        foreach (var corner in district.Corners)
        {
            var entry = new JsonObject { ["name"] = corner.Name };
            if (corner.Options is not null)
            {
                entry["options"] = corner.Options.DeepClone();
            }

            corners[corner.Id] = entry;
        }

        var text = new StringBuilder();
        text.Append("{\n  \"type\": \"FeatureCollection\",\n");
        text.Append("  \"name\": ").Append(Json(JsonValue.Create(district.Name))).Append(",\n");
        text.Append("  \"options\": ").Append(Json(district.SharedOptions)).Append(",\n");
        text.Append("  \"corners\": {\n");
        text.AppendJoin(",\n", corners.Select(pair => $"    {Json(JsonValue.Create(pair.Key))}: {Json(pair.Value)}"));
        text.Append("\n  },\n  \"features\": [\n");
        text.AppendJoin(",\n", district.Corners.SelectMany(corner => corner.Features.Select(feature => "    " + Json(Tagged(feature, corner.Id)))));
        text.Append("\n  ]\n}\n");
        return text.ToString();
    }

    /// <summary>Form B: for each corner the record separator, its plan as a FeatureCollection with the corner's id, name and
    /// options (the shared ones, each member the corner overrides replaced) as top-level members, and a line feed.</summary>
    public static string ToSequence(GeneratedDistrict district)
    {
        ArgumentNullException.ThrowIfNull(district);
        var text = new StringBuilder();
        foreach (var corner in district.Corners)
        {
            var record = new JsonObject
            {
                ["type"] = "FeatureCollection",
                ["corner"] = corner.Id,
                ["name"] = corner.Name,
                ["options"] = OptionsOf(district, corner),
                ["features"] = new JsonArray([.. corner.Features.Select(feature => feature.DeepClone())]),
            };
            text.Append(RecordSeparator).Append(Json(record)).Append('\n');
        }

        return text.ToString();
    }

    /// <summary>The options a corner is judged with: the shared options, each top-level member the corner gives replaced by its own.</summary>
    public static JsonObject OptionsOf(GeneratedDistrict district, DistrictCorner corner)
    {
        ArgumentNullException.ThrowIfNull(district);
        ArgumentNullException.ThrowIfNull(corner);
        var options = district.SharedOptions.DeepClone().AsObject();
        foreach (var (member, value) in corner.Options ?? [])
        {
            options[member] = value?.DeepClone();
        }

        return options;
    }

    // The feature with its corner's id first among its properties, as Form A carries it.
    private static JsonObject Tagged(JsonObject feature, string cornerId)
    {
        var properties = new JsonObject { ["corner"] = cornerId };
        foreach (var (member, value) in feature["properties"]!.AsObject())
        {
            properties[member] = value?.DeepClone();
        }

        return new JsonObject
        {
            ["type"] = "Feature",
            ["id"] = feature["id"]!.DeepClone(),
            ["properties"] = properties,
            ["geometry"] = feature["geometry"]!.DeepClone(),
        };
    }

    private static string Json(JsonNode? node) => node?.ToJsonString(Compact) ?? "null";
}
