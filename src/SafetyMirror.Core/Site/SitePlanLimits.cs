namespace SafetyMirror.Core.Site;

/// <summary>How much one plan may hold; the defaults fit a street corner with room to spare.</summary>
/// <remarks>The limits keep one request's work bounded; the API states them in its OpenAPI document.</remarks>
public sealed record SitePlanLimits
{
    /// <summary>The limits used when none are given.</summary>
    public static SitePlanLimits Default { get; } = new();

    /// <summary>Most features a plan may have.</summary>
    public int MaxFeatures { get; init; } = 500;

    /// <summary>Most positions (vertices) a plan may have, over all its features.</summary>
    public int MaxVertices { get; init; } = 20_000;

    /// <summary>Most positions (vertices) one feature's geometry may have.</summary>
    public int MaxVerticesPerGeometry { get; init; } = 5_000;

    /// <summary>Largest east–west and north–south span of the plan in local metres.</summary>
    public double MaxExtentM { get; init; } = 1000;

    /// <summary>Most approaches in one plan: a crossroads of dual carriageways has eight traffic streams; each approach is a whole
    /// evaluation's worth of work, five times over for the aim tolerance.</summary>
    public int MaxApproaches { get; init; } = 12;

    /// <summary>Longest approach, in metres along the line: beyond any required sight distance the service computes.</summary>
    public double MaxApproachLengthM { get; init; } = 2000;

    /// <summary>Largest area of one mounting-zone polygon, in square metres (a 50 m × 50 m block holds any corner's footway).</summary>
    public double MaxMountingZoneAreaM2 { get; init; } = 2500;

    /// <summary>Longest mounting-zone line, in metres along it (a footway edge along a whole block and more).</summary>
    public double MaxMountingZoneLengthM { get; init; } = 500;

    /// <summary>Longest string (an id, a name, a role, a member name) anywhere in the plan, in characters.</summary>
    public int MaxTextLength { get; init; } = 200;
}
