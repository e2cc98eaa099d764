using System.Text.Json;
using System.Text.Json.Nodes;
using SafetyMirror.Api.Features.Recommendations;
using SafetyMirror.Api.Json;
using SafetyMirror.Api.Requests;
using SafetyMirror.Studies;

namespace SafetyMirror.Api.Features.Batches;

/// <summary>A posted district split into its corners, or the problems that refuse it as a whole.</summary>
/// <param name="Name">The batch's name.</param>
/// <param name="Corners">Each corner's own request, in the order the corners first appear.</param>
public sealed record SplitBatch(string Name, IReadOnlyList<NewBatchCorner> Corners);

/// <summary>Where a corner's request stood in the posted batch, so a corner's problems name the fields the engineer sent.</summary>
/// <param name="Prefix">"" for a feature collection, "records[n]." for a text sequence.</param>
/// <param name="Features">The posted index of each plan feature, in plan order.</param>
/// <param name="Mirror">The posted index of the mirror feature, or null.</param>
/// <param name="Overridden">The option names the corner's own override sets (they are named under <paramref name="OverridePath"/>).</param>
/// <param name="OverridePath">Where the corner's override stands, e.g. "corners.EB-0042.options".</param>
public sealed record CornerPaths(string Prefix, IReadOnlyList<int> Features, int? Mirror, IReadOnlyList<string> Overridden, string OverridePath);

/// <summary>
/// Reads a district: one GeoJSON FeatureCollection whose features carry a <c>corner</c> property, or a GeoJSON text
/// sequence (RFC 8142) of one FeatureCollection per corner.
/// </summary>
/// <remarks>
/// Only what stops the whole district is refused here (not JSON, not a FeatureCollection, a feature with no corner, shared
/// options that no corner could take); what is wrong with one corner fails that corner alone when it is screened.
/// </remarks>
public static class BatchReader
{
    /// <summary>The media type of a GeoJSON text sequence (RFC 8142).</summary>
    public const string SequenceMediaType = "application/geo+json-seq";

    /// <summary>The record separator that opens each text of a sequence.</summary>
    private const char RecordSeparator = '\u001e';

    /// <summary>The recommendation options that only steer the search for a mirror.</summary>
    private static readonly string[] SearchOnly = ["servedApproaches", "catalogue", "minCentreHeightM", "maxCentreHeightM", "alternatives"];

    private static readonly JsonDocumentOptions DocumentOptions = new() { MaxDepth = ServiceJson.MaxDepth };

    /// <summary>Splits a posted district; null with every batch-wide problem recorded.</summary>
    public static SplitBatch? Read(string body, string? contentType, int maxCorners, JsonSerializerOptions json, RequestErrors errors)
    {
        ArgumentNullException.ThrowIfNull(errors);
        return contentType?.StartsWith(SequenceMediaType, StringComparison.OrdinalIgnoreCase) == true
            ? ReadSequence(body, maxCorners, json, errors)
            : ReadCollection(body, maxCorners, json, errors);
    }

    private static SplitBatch? ReadCollection(string body, int maxCorners, JsonSerializerOptions json, RequestErrors errors)
    {
        JsonObject root;
        try
        {
            if (JsonNode.Parse(body, documentOptions: DocumentOptions) is not JsonObject parsed)
            {
                errors.Add("", "The body must be a GeoJSON FeatureCollection of corners.");
                return null;
            }

            root = parsed;
        }
        catch (JsonException e)
        {
            errors.Add("", $"The body is not JSON: {e.Message}");
            return null;
        }

        if ((string?)(root["type"] as JsonValue) != "FeatureCollection" || root["features"] is not JsonArray features)
        {
            errors.Add("type", "The body must be a GeoJSON FeatureCollection (\"type\": \"FeatureCollection\" with \"features\").");
            return null;
        }

        var name = Text(root["name"], "name", errors) ?? "District batch";
        var shared = ReadOptions(root["options"], "options", json, errors);
        var overrides = root["corners"] as JsonObject;
        if (root["corners"] is not null && overrides is null)
        {
            errors.Add("corners", "Per-corner overrides are an object keyed by corner id.");
        }

        // Group the features by corner, keeping the order in which corners first appear.
        var groups = new Dictionary<string, List<(int Index, JsonObject Feature)>>(StringComparer.Ordinal);
        for (var i = 0; i < features.Count; i++)
        {
            if (features[i] is not JsonObject feature || feature["properties"] is not JsonObject properties
                || properties["corner"] is not JsonValue cornerValue || !cornerValue.TryGetValue(out string? corner)
                || string.IsNullOrWhiteSpace(corner) || corner.Length > Ranges.MaxIdLength)
            {
                errors.Add($"features[{i}].properties.corner", $"Every feature names its corner: a text of 1 to {Ranges.MaxIdLength} characters.");
                continue;
            }

            if (!groups.TryGetValue(corner, out var group))
            {
                groups[corner] = group = [];
            }

            group.Add((i, feature));
        }

        if (groups.Count > maxCorners)
        {
            errors.Add("features", $"At most {maxCorners} corners in one batch; {groups.Count} were sent. Split the district.");
        }

        foreach (var (id, _) in overrides ?? [])
        {
            if (!groups.ContainsKey(id))
            {
                errors.Add($"corners.{id}", "No feature belongs to this corner.");
            }
        }

        if (!errors.IsEmpty)
        {
            return null;
        }

        if (groups.Count == 0)
        {
            errors.Add("features", "The batch holds no corner.");
            return null;
        }

        var corners = groups.Select(group =>
        {
            var own = overrides?[group.Key] as JsonObject;
            return Corner(group.Key, Text(own?["name"], "", null) ?? group.Key, root["frame"], group.Value, shared, own?["options"] as JsonObject,
                $"corners.{group.Key}.options", prefix: "");
        }).ToList();
        return new SplitBatch(name, corners);
    }

    private static SplitBatch? ReadSequence(string body, int maxCorners, JsonSerializerOptions json, RequestErrors errors)
    {
        var records = body.Split(RecordSeparator).Select(text => text.Trim()).ToList();
        if (records.Count == 0 || records[0].Length != 0)
        {
            errors.Add("", "A GeoJSON text sequence opens every text with the record separator (0x1E), as RFC 8142 says.");
            return null;
        }

        records.RemoveAt(0);
        records.RemoveAll(text => text.Length == 0);
        if (records.Count == 0 || records.Count > maxCorners)
        {
            errors.Add("", $"A batch holds 1 to {maxCorners} corners; {records.Count} were sent.");
            return null;
        }

        var corners = new List<NewBatchCorner>();
        var ids = new HashSet<string>(StringComparer.Ordinal);
        for (var n = 0; n < records.Count; n++)
        {
            var prefix = $"records[{n}].";
            JsonObject? plan = null;
            string? problem = null;
            try
            {
                plan = JsonNode.Parse(records[n], documentOptions: DocumentOptions) as JsonObject;
            }
            catch (JsonException e)
            {
                problem = $"Not JSON: {e.Message}";
            }

            var id = Text(plan?["corner"], "", null) is { Length: > 0 and <= Ranges.MaxIdLength } given ? given : $"record-{n + 1}";
            if (!ids.Add(id))
            {
                errors.Add($"records[{n}].corner", $"The corner id '{id}' is used by an earlier record.");
                continue;
            }

            if (plan is null || problem is not null || plan["features"] is not JsonArray features)
            {
                var failure = new RequestErrors();
                failure.Add($"records[{n}]", problem ?? "Each record is one corner's plan: a GeoJSON FeatureCollection.");
                corners.Add(new NewBatchCorner(id, id, new CornerInput("{}", null, "{}", "{}"), CornerFailure.Write(id, failure)));
                continue;
            }

            var group = features.Select((feature, i) => (i, feature as JsonObject ?? [])).ToList();
            corners.Add(Corner(id, Text(plan["name"], "", null) ?? id, plan["frame"], group, shared: null, plan["options"] as JsonObject,
                $"{prefix}options", prefix));
        }

        return errors.IsEmpty ? new SplitBatch("District batch", corners) : null;
    }

    /// <summary>One corner's request: its plan features (mirror apart), its mirror and its options, shared under its own.</summary>
    private static NewBatchCorner Corner(
        string id, string name, JsonNode? frame, List<(int Index, JsonObject Feature)> features, JsonObject? shared, JsonObject? own,
        string overridePath, string prefix)
    {
        var planFeatures = new JsonArray();
        var featureIndexes = new List<int>();
        var mirrors = new List<(int Index, JsonObject Feature)>();
        foreach (var (index, feature) in features)
        {
            var copy = (JsonObject)feature.DeepClone();
            if (copy["properties"] is JsonObject properties)
            {
                properties.Remove("corner");
                if ((string?)(properties["role"] as JsonValue) == "mirror")
                {
                    mirrors.Add((index, copy));
                    continue;
                }
            }

            planFeatures.Add(copy);
            featureIndexes.Add(index);
        }

        var plan = new JsonObject { ["type"] = "FeatureCollection" };
        if (frame is not null)
        {
            plan["frame"] = frame.DeepClone();
        }

        plan["features"] = planFeatures;
        var options = (JsonObject?)shared?.DeepClone() ?? [];
        if (mirrors.Count == 1)
        {
            // Shared options serve the whole district; those that only steer a search mean nothing where a mirror is given.
            foreach (var key in SearchOnly)
            {
                options.Remove(key);
            }
        }

        foreach (var (key, value) in own ?? [])
        {
            options[key] = value?.DeepClone();
        }

        var paths = new CornerPaths(prefix, featureIndexes, mirrors.Count == 1 ? mirrors[0].Index : null,
            own?.Select(o => o.Key).ToList() ?? [], overridePath);
        var input = new CornerInput(plan.ToJsonString(), mirrors.Count == 1 ? Mirror(mirrors[0].Feature) : null, options.ToJsonString(),
            JsonSerializer.Serialize(paths, BatchJson.Options));
        if (mirrors.Count > 1)
        {
            var failure = new RequestErrors();
            foreach (var (index, _) in mirrors.Skip(1))
            {
                failure.Add($"{prefix}features[{index}]", "A corner has at most one mirror to evaluate; this is another one.");
            }

            return new NewBatchCorner(id, name, input, CornerFailure.Write(id, failure));
        }

        return new NewBatchCorner(id, name, input);
    }

    /// <summary>The evaluation request's mirror from a mirror feature: its point is the location, its properties the rest.</summary>
    private static string Mirror(JsonObject feature)
    {
        var mirror = new JsonObject { ["location"] = feature["geometry"]?.DeepClone() };
        foreach (var (key, value) in feature["properties"] as JsonObject ?? [])
        {
            if (key is not "role" and not "name")
            {
                mirror[key] = value?.DeepClone();
            }
        }

        return mirror.ToJsonString();
    }

    /// <summary>The shared options, read once so that options no corner could take refuse the batch, not every corner.</summary>
    private static JsonObject? ReadOptions(JsonNode? node, string path, JsonSerializerOptions json, RequestErrors errors)
    {
        if (node is null)
        {
            return null;
        }

        if (node is not JsonObject options)
        {
            errors.Add(path, "The shared options are an object, as a recommendation's options are.");
            return null;
        }

        try
        {
            if (options.Deserialize<RecommendationOptionsRequest>(json) is { } read)
            {
                RequestChecks.Check(read, path, errors);
            }
        }
        catch (JsonException e)
        {
            errors.Add(e.Path is { Length: > 1 } at ? path + at.TrimStart('$') : path, e.Message);
        }

        return options;
    }

    private static string? Text(JsonNode? node, string path, RequestErrors? errors)
    {
        if (node is null)
        {
            return null;
        }

        if (node is JsonValue value && value.TryGetValue(out string? text) && text.Length <= Ranges.MaxNameLength)
        {
            return string.IsNullOrWhiteSpace(text) ? null : text.Trim();
        }

        errors?.Add(path, $"A text of at most {Ranges.MaxNameLength} characters.");
        return null;
    }
}

/// <summary>The JSON of what the batch keeps for itself (paths, outcomes): camelCase, compact.</summary>
internal static class BatchJson
{
    public static readonly JsonSerializerOptions Options = new(JsonSerializerDefaults.Web);
}
