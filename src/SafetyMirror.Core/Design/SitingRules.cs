namespace SafetyMirror.Core.Design;

/// <summary>The siting values a mirror is checked against, and where they come from.</summary>
/// <remarks>
/// The defaults follow one published example; local rules govern and may differ (Poland, for one,
/// requires 2.0 m of clearance). A caller changing a value states its own source.
/// </remarks>
public sealed record SitingRules
{
    /// <summary>Creates siting values: clearance 0 to 6 m, eye distance 1 to 100 m, speed 5 to 200 km/h.</summary>
    /// <param name="minimumLowerEdgeClearanceM">Least height of the mirror's lower edge above any footway or carriageway below it.</param>
    /// <param name="maximumEyeToMirrorDistanceM">Greatest distance from the waiting driver's eye to the mirror.</param>
    /// <param name="cautionAboveSpeedKmh">Approach speed above which the result carries a speed caution.</param>
    /// <param name="source">Where the values come from.</param>
    public SitingRules(double minimumLowerEdgeClearanceM, double maximumEyeToMirrorDistanceM, double cautionAboveSpeedKmh, string source)
    {
        MinimumLowerEdgeClearanceM = Preconditions.InRange(minimumLowerEdgeClearanceM, 0, 6, "m");
        MaximumEyeToMirrorDistanceM = Preconditions.InRange(maximumEyeToMirrorDistanceM, 1, 100, "m");
        CautionAboveSpeedKmh = Preconditions.InRange(
            cautionAboveSpeedKmh, SightDistanceMethod.MinimumSpeedKmh, SightDistanceMethod.MaximumSpeedKmh, "km/h");
        ArgumentException.ThrowIfNullOrWhiteSpace(source);
        Source = source;
    }

    /// <summary>The service's defaults: 2.3 m clearance, 15 m from the eye, caution above 50 km/h.</summary>
    public static SitingRules Default { get; } = new(
        2.3,
        15,
        50,
        "France, IISR Art. 14 (amended 1981): mounted above 2.30 m, stop line to mirror under 15 m, priority road at 50 km/h or less; "
        + "Poland requires at least 2.0 m (Rozporządzenie Ministra Infrastruktury, 3 July 2003)");

    /// <summary>Least height of the lower edge above any footway or carriageway below it, in metres.</summary>
    public double MinimumLowerEdgeClearanceM { get; }

    /// <summary>Greatest distance from the waiting driver's eye to the mirror, in metres.</summary>
    public double MaximumEyeToMirrorDistanceM { get; }

    /// <summary>Approach speed above which the result carries a speed caution, in km/h.</summary>
    public double CautionAboveSpeedKmh { get; }

    /// <summary>Where the values come from.</summary>
    public string Source { get; }
}
