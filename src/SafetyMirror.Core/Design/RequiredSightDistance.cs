using static System.FormattableString;

namespace SafetyMirror.Core.Design;

/// <summary>The sight distance one approach needs, with everything that went into it.</summary>
/// <param name="Method">The method and its parameters (reaction time, time gap, code reference...).</param>
/// <param name="ApproachSpeedKmh">Speed of the approach (posted or 85th percentile); converted when the plan gave mph.</param>
/// <param name="GradePercent">Grade of the approach, positive uphill for the approaching vehicle.</param>
/// <param name="Formula">The formula or rule that gave <paramref name="ComputedM"/>, in the method's units.</param>
/// <param name="ComputedM">The distance as computed, in metres (a US customary distance converted exactly).</param>
/// <param name="DesignM">The distance to design for (AASHTO methods round up to the next 5 m, or to the next 5 ft and then
/// convert exactly).</param>
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
    double ObjectHeightM)
{
    /// <summary>The units the formula and the design table are in.</summary>
    public DesignUnits Units => Method.Units;

    /// <summary>The published table the design value reproduces ("Table 3-1"); null for a local code's value.</summary>
    public string? Table { get; init; }

    /// <summary>The figures in feet and mph as the US customary formula and table give them; null for a metric requirement.</summary>
    public UsCustomaryFigures? UsCustomary { get; init; }

    /// <summary>The design value in the method's own unit, as its table prints it: "250 ft", "35 m".</summary>
    public string DesignText => UsCustomary is { } us ? Invariant($"{us.DesignFt:0.##} ft") : Invariant($"{DesignM:0.##} m");

    /// <summary>The computed value in the method's own unit, to 0.1: "246.2 ft", "31.2 m".</summary>
    public string ComputedText => UsCustomary is { } us ? Invariant($"{us.ComputedFt:0.0} ft") : Invariant($"{ComputedM:0.0} m");
}

/// <summary>A requirement's figures in US customary units, before any conversion.</summary>
/// <param name="SpeedMph">The speed V put in the formula, in mph (as the plan gave it, or converted from km/h).</param>
/// <param name="ComputedFt">The distance as computed, in feet.</param>
/// <param name="DesignFt">The design value, in feet: the computed distance rounded up to the next 5 ft.</param>
public sealed record UsCustomaryFigures(double SpeedMph, double ComputedFt, double DesignFt);
