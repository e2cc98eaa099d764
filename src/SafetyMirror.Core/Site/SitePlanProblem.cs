namespace SafetyMirror.Core.Site;

/// <summary>One thing wrong with a plan: where it is and what to do about it.</summary>
/// <param name="Path">
/// Where in the FeatureCollection, JSON Pointer-like: <c>features[3].properties.heightM</c>,
/// <c>features[2].geometry.coordinates[0][4][1]</c>, <c>crs.properties.name</c>; empty for the whole document.
/// </param>
/// <param name="Message">A plain sentence for the engineer who drew the plan.</param>
public sealed record SitePlanProblem(string Path, string Message);
