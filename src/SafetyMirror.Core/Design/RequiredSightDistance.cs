namespace SafetyMirror.Core.Design;

/// <summary>The sight distance one approach needs, with everything that went into it.</summary>
/// <param name="Method">The method and its parameters (reaction time, time gap, code reference...).</param>
/// <param name="ApproachSpeedKmh">Speed of the approach (posted or 85th percentile).</param>
/// <param name="GradePercent">Grade of the approach, positive uphill for the approaching vehicle.</param>
/// <param name="Formula">The formula or rule that gave <paramref name="ComputedM"/>.</param>
/// <param name="ComputedM">The distance as computed.</param>
/// <param name="DesignM">The distance to design for (AASHTO methods round up to the next 5 m).</param>
/// <param name="EyeHeightM">Driver's eye height for the sightline check.</param>
/// <param name="ObjectHeightM">Height of the point that must stay visible at <paramref name="DesignM"/>.</param>
public sealed record RequiredSightDistance(
    SightDistanceMethod Method,
    double ApproachSpeedKmh,
    double GradePercent,
    string Formula,
    double ComputedM,
    double DesignM,
    double EyeHeightM,
    double ObjectHeightM);
