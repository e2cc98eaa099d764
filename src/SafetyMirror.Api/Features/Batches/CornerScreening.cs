using System.Text.Json;
using System.Text.Json.Nodes;
using System.Text.RegularExpressions;
using NetTopologySuite.Geometries;
using SafetyMirror.Api.Features.Recommendations;
using SafetyMirror.Api.Features.Studies;
using SafetyMirror.Api.Requests;
using SafetyMirror.Studies;

namespace SafetyMirror.Api.Features.Batches;

/// <summary>What a screened corner came to, as the batch lists it and its GIS layer draws it.</summary>
/// <param name="Kind">"evaluation" (a mirror was given) or "recommendation".</param>
/// <param name="Decision">The evaluation's decision or the recommendation's outcome.</param>
/// <param name="Summary">The sentences that state it, as the study states them.</param>
/// <param name="Location">Where the corner is: its driver's eye, in the plan's coordinates.</param>
/// <param name="Geographic">Whether the plan's coordinates are WGS84 longitude and latitude.</param>
/// <param name="Approaches">Per approach judged: required, direct and mirror sight distance and the longest unseen stretch.</param>
/// <param name="Mirrors">The face evaluated, or the faces recommended (none when no mirror serves or none is needed).</param>
public sealed record CornerOutcome(
    string Kind, string Decision, string Summary, Point? Location, bool Geographic, IReadOnlyList<CornerApproach> Approaches,
    IReadOnlyList<CornerFace> Mirrors)
{
    /// <summary>The approach that decides: one that fails if any does, else the one with the least sight distance for its requirement.</summary>
    public CornerApproach? Critical => Approaches.OrderBy(a => a.Meets).ThenBy(a => Math.Max(a.DirectM, a.MirrorM) / a.RequiredM).FirstOrDefault();

    /// <summary>The longest stretch left unseen on any approach, metres, or null when none is.</summary>
    public double? LongestUnseenM => Approaches.Max(a => a.LongestUnseenM);
}

/// <summary>One approach's figures, as the full evaluation states them.</summary>
/// <param name="Approach">The approach's feature id (or #index).</param>
/// <param name="RequiredM">Sight distance required for its speed.</param>
/// <param name="DirectM">Sight distance the direct view gives.</param>
/// <param name="MirrorM">Sight distance the mirror provides (0 when it shows nothing recognisable).</param>
/// <param name="LongestUnseenM">Longest stretch neither view shows within the required distance, or null.</param>
/// <param name="Meets">Whether the approach meets its requirement.</param>
public sealed record CornerApproach(string Approach, double RequiredM, double DirectM, double MirrorM, double? LongestUnseenM, bool Meets);

/// <summary>A mirror face at a corner: where its pole stands and how it is set.</summary>
public sealed record CornerFace(Point Pole, double? DiameterM, double? WidthM, double? HeightM, double RadiusM, double CentreHeightM, double AzimuthDeg, double TiltDownDeg);

/// <summary>Screens one corner of a batch exactly as a single study is answered, and keeps it as a study of its own.</summary>
public static class CornerScreening
{
    /// <summary>Evaluates the corner's mirror, or recommends one; the result to record, success or failure.</summary>
    public static CornerResult Screen(ClaimedCorner corner, BatchRecord batch, string worker, JsonSerializerOptions json, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(corner);
        ArgumentNullException.ThrowIfNull(batch);
        var errors = new RequestErrors();
        var input = Read(corner.Input, json, errors);
        var run = input is null || !errors.IsEmpty ? null : StudyRuns.Run(input, batch.CreatedAt.UtcDateTime.Year, json, errors, cancellationToken);
        if (input is null || run is null || !errors.IsEmpty)
        {
            var paths = JsonSerializer.Deserialize<CornerPaths>(corner.Input.PathsJson, BatchJson.Options);
            return CornerResult.Failed(corner.Position, worker, CornerFailure.Write(corner.Corner, errors, paths));
        }

        var answer = JsonNode.Parse(run.AnswerJson)!;
        var outcome = new CornerOutcome(
            run.EvaluationJson is null ? "recommendation" : "evaluation",
            (string?)answer["decision"] ?? (string?)answer["outcome"] ?? "",
            (string?)answer["summary"] ?? "",
            EyeOf(input.Plan),
            run.Plan.Frame.CoordinateSystem.IsGeographic,
            Approaches(answer),
            input.Mirror is { } mirror ? [Face(mirror)] : Installed(run.AnswerJson, json));
        var (point, extent) = StudyRuns.Place(run.Plan, input.Plan);
        var study = new NewStudy(corner.Name, $"{batch.Name}: corner {corner.Corner}", point, extent, batch.Owner);
        var revision = StudyRuns.Content(input, run, batch.Owner, $"Screened in batch {batch.Id} ({batch.Name}), corner {corner.Corner}.", json);
        return CornerResult.Screened(corner.Position, worker, JsonSerializer.Serialize(outcome, json), study, revision);
    }

    /// <summary>The corner's request as a study takes it; null with the problem recorded when its mirror or options are not their contracts.</summary>
    private static StudyInput? Read(CornerInput input, JsonSerializerOptions json, RequestErrors errors)
    {
        using var plan = JsonDocument.Parse(input.PlanJson);
        var mirror = Deserialize<MirrorRequest>(input.MirrorJson, "mirror", json, errors);
        var options = Deserialize<RecommendationOptionsRequest>(input.OptionsJson, "options", json, errors);
        if (!errors.IsEmpty)
        {
            return null;
        }

        if (mirror is not null)
        {
            RequestChecks.Check(mirror, "mirror", errors);
        }

        if (options is not null)
        {
            RequestChecks.Check(options, "options", errors);
        }

        return new StudyInput(plan.RootElement.Clone(), mirror, options);
    }

    private static T? Deserialize<T>(string? text, string path, JsonSerializerOptions json, RequestErrors errors)
        where T : class
    {
        try
        {
            return text is null ? null : JsonSerializer.Deserialize<T>(text, json);
        }
        catch (JsonException e)
        {
            errors.Add(e.Path is { Length: > 1 } at ? path + at.TrimStart('$') : path, e.Message);
            return null;
        }
    }

    private static CornerFace Face(MirrorRequest mirror) => new(
        mirror.Location!, mirror.DiameterM, mirror.WidthM, mirror.HeightM, mirror.RadiusM ?? 0, mirror.CentreHeightM ?? 0,
        mirror.AzimuthDeg ?? 0, mirror.TiltDownDeg ?? 0);

    /// <summary>The approaches of the evaluation, or of the first alternative's mirrors for a recommendation (none when no mirror is needed).</summary>
    private static List<CornerApproach> Approaches(JsonNode answer)
    {
        return [.. StudyRuns.Evaluations(answer)
            .SelectMany(e => e["approaches"]!.AsArray().OfType<JsonNode>())
            .Select(a => (Id: (string?)a["approach"]?["id"] ?? $"#{(int?)a["approach"]?["featureIndex"]}", Summary: a["summary"]!))
            .Select(a => new CornerApproach(
                a.Id,
                (double)a.Summary["requiredSightDistanceM"]!,
                (double)a.Summary["directSightDistanceM"]!,
                (double)a.Summary["providedSightDistanceM"]!,
                (double?)a.Summary["longestUnseen"]?["lengthM"],
                (bool)a.Summary["meetsRequirement"]!))];
    }

    /// <summary>The faces of the installation sheet: present only when the recommendation meets the requirement.</summary>
    private static IReadOnlyList<CornerFace> Installed(string answerJson, JsonSerializerOptions json)
    {
        var answer = JsonSerializer.Deserialize<RecommendationAnswer>(answerJson, json);
        return answer?.Installation?.Mirrors.Select(m => new CornerFace(
            m.Pole, m.DiameterM, m.WidthM, m.HeightM, m.RadiusM, m.CentreHeightM, m.AzimuthDeg, m.TiltDownDeg)).ToList() ?? [];
    }

    /// <summary>The first driver's eye of the plan, in the plan's own coordinates.</summary>
    private static Point? EyeOf(JsonElement plan)
    {
        foreach (var feature in plan.GetProperty("features").EnumerateArray())
        {
            if (feature.TryGetProperty("properties", out var properties) && properties.TryGetProperty("role", out var role)
                && role.ValueEquals("eye") && feature.GetProperty("geometry").GetProperty("coordinates") is { } at)
            {
                return new Point(at[0].GetDouble(), at[1].GetDouble());
            }
        }

        return null;
    }

    // Only the installation sheet of a stored recommendation is read back.
    private sealed record RecommendationAnswer(InstallationSheetResponse? Installation);
}

/// <summary>A corner's failure as RFC 9457 problem details whose <c>errors</c> name the fields of the posted batch.</summary>
public static partial class CornerFailure
{
    /// <summary>The problem details, as JSON, of a corner that cannot be screened.</summary>
    public static string Write(string corner, RequestErrors errors, CornerPaths? paths = null)
    {
        ArgumentNullException.ThrowIfNull(errors);
        var named = new JsonObject();
        foreach (var (path, messages) in errors.ToDictionary())
        {
            named[paths is null ? path : InBatch(path, paths)] = new JsonArray([.. messages.Select(m => JsonValue.Create(m))]);
        }

        return new JsonObject
        {
            ["type"] = "https://tools.ietf.org/html/rfc9110#section-15.5.1",
            ["title"] = $"Corner {corner} cannot be screened as sent; the other corners go on.",
            ["status"] = StatusCodes.Status400BadRequest,
            ["detail"] = "Each entry under 'errors' names the field of the posted batch that holds a problem.",
            ["corner"] = corner,
            ["errors"] = named,
        }.ToJsonString();
    }

    /// <summary>A path of the corner's own request, said in the posted batch's terms.</summary>
    public static string InBatch(string path, CornerPaths paths)
    {
        ArgumentNullException.ThrowIfNull(paths);
        if (PlanFeature().Match(path) is { Success: true } feature && int.Parse(feature.Groups[1].Value, System.Globalization.CultureInfo.InvariantCulture) is var i
            && i < paths.Features.Count)
        {
            return $"{paths.Prefix}features[{paths.Features[i]}]{feature.Groups[2].Value}";
        }

        if (paths.Mirror is { } mirror && (path == "mirror" || path.StartsWith("mirror.", StringComparison.Ordinal)))
        {
            var member = path.Length > "mirror.".Length ? path["mirror.".Length..] : "";
            return member.Length == 0 ? $"{paths.Prefix}features[{mirror}]"
                : member.StartsWith("location", StringComparison.Ordinal) ? $"{paths.Prefix}features[{mirror}].geometry{member["location".Length..]}"
                : $"{paths.Prefix}features[{mirror}].properties.{member}";
        }

        if (path.StartsWith("options", StringComparison.Ordinal))
        {
            var member = path.Length > "options.".Length ? path["options.".Length..] : "";
            var top = member.Split('.', '[')[0];
            return paths.Overridden.Contains(top) ? paths.OverridePath + path["options".Length..] : paths.Prefix.Length > 0 ? paths.Prefix + path : path;
        }

        return path.StartsWith("plan", StringComparison.Ordinal) ? paths.Prefix + path["plan".Length..].TrimStart('.') : paths.Prefix + path;
    }

    [GeneratedRegex(@"^plan\.features\[(\d+)\](.*)$")]
    private static partial Regex PlanFeature();
}
