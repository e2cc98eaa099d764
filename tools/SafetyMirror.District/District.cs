using System.Text.Json.Nodes;

namespace SafetyMirror.District;

/// <summary>What to generate: how many corners, from which seed, and how many carry a mirror or a flaw.</summary>
public sealed record DistrictOptions
{
    /// <summary>How many corners, 1 to 10,000.</summary>
    public int Corners { get; init; } = 200;

    /// <summary>The seed: the same options give the same district, byte for byte.</summary>
    public int Seed { get; init; } = 7;

    /// <summary>Share of the well-formed corners that carry a given mirror to evaluate (0 to 1); the rest ask for a recommendation.</summary>
    public double MirrorShare { get; init; }

    /// <summary>Share of the corners that are malformed on purpose (0 to 1), rounded to a whole number of corners.</summary>
    public double MalformedShare { get; init; } = 0.03;

    /// <summary>The options of the committed demo, openapi/examples/demo-district.geojson: mirrors on about half the corners.</summary>
    public static DistrictOptions Demo { get; } = new() { Corners = 24, Seed = 2026, MirrorShare = 0.5, MalformedShare = 0.1 };
}

/// <summary>The situation a corner was drawn to show; the service's decision is what it answers, not this.</summary>
public enum CornerSituation
{
    /// <summary>Everything stands back behind the driver's eye: the direct view should be enough.</summary>
    OpenView,

    /// <summary>A wall, hedge or building at the back of the footway hides the traffic: a mirror may serve.</summary>
    Blind,

    /// <summary>Blind, and an approach faster than the mirror siting rules allow (60 or 70 km/h).</summary>
    FastApproach,

    /// <summary>Blind, and the approach bends behind a building on the far side a short way up the street: nothing may serve.</summary>
    HiddenBend,
}

/// <summary>How a malformed corner is broken.</summary>
public enum CornerFlawKind
{
    /// <summary>An obstacle with a negative height.</summary>
    NegativeObstacleHeight,

    /// <summary>No eye feature at all.</summary>
    MissingEye,

    /// <summary>An approach whose LineString has a single position.</summary>
    SingleVertexApproach,

    /// <summary>An obstacle polygon whose ring crosses itself (a bow tie).</summary>
    SelfCrossingObstacle,

    /// <summary>A feature with a role the plan does not know.</summary>
    UnknownRole,

    /// <summary>A given mirror whose radius of curvature is below the smallest accepted.</summary>
    MirrorRadiusOutOfRange,
}

/// <summary>The flaw put into a malformed corner, and the id of the feature that carries it (null when the flaw is a missing feature).</summary>
public sealed record CornerFlaw(CornerFlawKind Kind, string? FeatureId);

/// <summary>One corner of the district: its plan features in WGS84 (and its mirror feature, if any), without the batch's corner property.</summary>
/// <remarks>The JSON nodes are the generator's own: the writers copy them, and callers should too before changing them.</remarks>
public sealed record DistrictCorner(
    string Id,
    string Name,
    CornerSituation Situation,
    IReadOnlyList<JsonObject> Features,
    JsonObject? Options,
    CornerFlaw? Flaw)
{
    /// <summary>The feature whose role is "mirror", if the corner carries a mirror to evaluate.</summary>
    public JsonObject? Mirror => Features.FirstOrDefault(f => (string?)f["properties"]?["role"] == DistrictGenerator.MirrorRole);
}

/// <summary>A generated district: its name, the options all its corners share, and the corners.</summary>
public sealed record GeneratedDistrict(string Name, JsonObject SharedOptions, IReadOnlyList<DistrictCorner> Corners);
