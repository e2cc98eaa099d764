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

    /// <summary>Largest east–west and north–south span of the plan in local metres.</summary>
    public double MaxExtentM { get; init; } = 1000;
}
