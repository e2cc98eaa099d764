using System.ComponentModel;
using System.Text.Json;
using SafetyMirror.Api.Features.Recommendations;

namespace SafetyMirror.Api.Features.Batches;

/// <summary>How a district batch is posted, for the OpenAPI document.</summary>
public static class BatchDocumentation
{
    /// <summary>The description of POST /v1/batches: the grouping convention and the two forms.</summary>
    public const string PostDescription =
        "Takes many corners at once and answers 202 with the batch's location at once; workers (this instance and any others on the "
        + "same database) screen the corners in the background, each exactly as POST /v1/evaluations (a mirror given) or "
        + "POST /v1/recommendations (none) would, and keep each screened corner as a study of its own, revision 1.\n\n"
        + "Two forms. (1) One GeoJSON FeatureCollection (application/geo+json or application/json) whose every feature carries the "
        + "string property 'corner' naming the corner it belongs to (1 to 64 characters); the features of one corner are its plan, "
        + "exactly as a single plan's features. A feature with role 'mirror' (a Point, with the properties of an evaluation's "
        + "'mirror': centreHeightM, azimuthDeg, tiltDownDeg, radiusM, diameterM or widthM and heightM) is that corner's mirror to "
        + "evaluate; a corner without one gets a recommendation. Beside 'features': 'name' (the batch's), 'frame' (given to every "
        + "plan), 'options' (shared by every corner: a recommendation's options) and 'corners' (per-corner overrides keyed by corner "
        + "id: 'name' and 'options', whose members replace the shared ones). (2) A GeoJSON text sequence (RFC 8142, "
        + "application/geo+json-seq): each record (0x1E, JSON, line feed) is one corner's plan as a FeatureCollection, with beside "
        + "its features 'corner' (its id; record-N when absent), and optionally 'name', 'frame' and 'options'.\n\n"
        + "Only what stops the whole district answers 400 here (not a FeatureCollection, a feature without 'corner', an override for "
        + "no corner, shared options no corner could take, more corners than allowed); a corner that cannot be screened fails "
        + "alone, with problem details naming the offending fields of the posted batch (features[n]..., records[n]...), and the "
        + "other corners go on.";

    /// <summary>A district in one FeatureCollection: the features of all its corners, grouped by their 'corner' property.</summary>
    /// <param name="Type">"FeatureCollection".</param>
    /// <param name="Name">The batch's name.</param>
    /// <param name="Frame">The plan frame every corner's plan takes, as a single plan's 'frame'.</param>
    /// <param name="Features">Plan features (and at most one 'mirror' Point per corner), each with the property 'corner'.</param>
    /// <param name="Options">Options shared by every corner.</param>
    /// <param name="Corners">Per-corner overrides, keyed by corner id.</param>
    public sealed record District(
        [property: Description("\"FeatureCollection\".")] string Type,
        [property: Description("The batch's name, at most 200 characters.")] string? Name,
        [property: Description("The plan frame every corner's plan takes, as a single plan's 'frame'.")] JsonElement? Frame,
        [property: Description("Plan features of every corner, each with the string property 'corner'; at most one feature per corner with role 'mirror'.")] IReadOnlyList<JsonElement> Features,
        [property: Description("Options shared by every corner, as a recommendation's options.")] RecommendationOptionsRequest? Options,
        [property: Description("Per-corner overrides keyed by corner id.")] IReadOnlyDictionary<string, CornerOverride>? Corners);

    /// <summary>What one corner changes from the shared options.</summary>
    /// <param name="Name">The corner's readable name.</param>
    /// <param name="Options">Options whose members replace the shared ones for this corner.</param>
    public sealed record CornerOverride(
        [property: Description("The corner's readable name, at most 200 characters.")] string? Name,
        [property: Description("Options whose members replace the shared ones for this corner.")] RecommendationOptionsRequest? Options);
}
