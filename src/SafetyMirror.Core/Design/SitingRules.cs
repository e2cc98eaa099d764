using System.Text.Json.Serialization;

namespace SafetyMirror.Core.Design;

/// <summary>The siting values a mirror is checked against, and where they come from.</summary>
/// <remarks>
/// The defaults follow one published example; local rules govern and may differ (Poland, for one,
/// requires 2.0 m of clearance). A caller changing a value states its own source.
/// </remarks>
public sealed record SitingRules
{
    /// <summary>Highest clearance (lower edge, or over a carriageway) a rule may ask, in metres.</summary>
    public const double MaximumClearanceM = 6;

    /// <summary>Shortest stop-line-to-mirror distance a rule may allow, in metres.</summary>
    public const double MinimumEyeToMirrorDistanceLimitM = 1;

    /// <summary>Longest stop-line-to-mirror distance a rule may allow, in metres.</summary>
    public const double MaximumEyeToMirrorDistanceLimitM = 100;

    /// <summary>Largest kerb offset a rule may ask of the face, in metres.</summary>
    public const double MaximumKerbOffsetM = 5;

    /// <summary>Clearance above a carriageway the face overhangs, in metres, by default.</summary>
    public const double DefaultCarriagewayClearanceM = 5.2;

    /// <summary>Least horizontal distance from the kerb line to the face's nearest edge, in metres, by default.</summary>
    public const double DefaultKerbOffsetM = 0.6;

    /// <summary>Where the default carriageway clearance comes from.</summary>
    public const string CarriagewayClearanceDefaultSource =
        "US MUTCD 2009 §2A.18: overhead signs at least 17 ft (5.2 m) above the roadway [memory]";

    /// <summary>Where the default kerb offset comes from.</summary>
    public const string KerbOffsetDefaultSource = "US MUTCD 2009 §2A.19: 2 ft (0.6 m) lateral offset for signs in urban areas [memory]";

    /// <summary>Creates siting values: clearances 0 to 6 m, stop-line distance 1 to 100 m, speed 5 to 200 km/h, kerb offset 0 to 5 m.</summary>
    /// <param name="minimumLowerEdgeClearanceM">Least height of the mirror's lower edge above the highest footway or carriageway below it.</param>
    /// <param name="maximumEyeToMirrorDistanceM">Greatest distance from the stop line (or, without one, the waiting driver's eye) to the mirror.</param>
    /// <param name="cautionAboveSpeedKmh">Highest approach speed at which a mirror is within the rules.</param>
    /// <param name="source">Where the values come from.</param>
    /// <param name="carriagewayClearanceM">Least height of any part of the face that overhangs a carriageway.</param>
    /// <param name="kerbOffsetM">Least horizontal distance from the kerb line to the face's nearest edge.</param>
    /// <param name="carriagewayClearanceSource">Where the carriageway clearance comes from; null for the default's source.</param>
    /// <param name="kerbOffsetSource">Where the kerb offset comes from; null for the default's source.</param>
    /// <param name="backingBoard">The backing board the rule set asks behind the face, or null when it asks none.</param>
    public SitingRules(
        double minimumLowerEdgeClearanceM,
        double maximumEyeToMirrorDistanceM,
        double cautionAboveSpeedKmh,
        string source,
        double carriagewayClearanceM = DefaultCarriagewayClearanceM,
        double kerbOffsetM = DefaultKerbOffsetM,
        string? carriagewayClearanceSource = null,
        string? kerbOffsetSource = null,
        BackingBoardRule? backingBoard = null)
    {
        BackingBoard = backingBoard;
        CarriagewayClearanceM = Preconditions.InRange(carriagewayClearanceM, 0, MaximumClearanceM, "m");
        KerbOffsetM = Preconditions.InRange(kerbOffsetM, 0, MaximumKerbOffsetM, "m");
        CarriagewayClearanceSource = carriagewayClearanceSource ?? CarriagewayClearanceDefaultSource;
        KerbOffsetSource = kerbOffsetSource ?? KerbOffsetDefaultSource;
        MinimumLowerEdgeClearanceM = Preconditions.InRange(minimumLowerEdgeClearanceM, 0, MaximumClearanceM, "m");
        MaximumEyeToMirrorDistanceM = Preconditions.InRange(
            maximumEyeToMirrorDistanceM, MinimumEyeToMirrorDistanceLimitM, MaximumEyeToMirrorDistanceLimitM, "m");
        CautionAboveSpeedKmh = Preconditions.InRange(
            cautionAboveSpeedKmh, SightDistanceMethod.MinimumSpeedKmh, SightDistanceMethod.MaximumSpeedKmh, "km/h");
        ArgumentException.ThrowIfNullOrWhiteSpace(source);
        Source = source;
    }

    /// <summary>The service's defaults: 2.3 m clearance (5.2 m over a carriageway), 0.6 m from the kerb, 15 m from the stop line, at most 50 km/h.</summary>
    public static SitingRules Default { get; } = new(
        2.3,
        15,
        50,
        "France, IISR Art. 14 (amended 1981): mounted above 2.30 m, stop line to mirror under 15 m, priority road at 50 km/h or less; "
        + "Poland requires at least 2.0 m (Rozporządzenie Ministra Infrastruktury, 3 July 2003)");

    /// <summary>Least height of any part of the face that overhangs a carriageway, in metres.</summary>
    public double CarriagewayClearanceM { get; }

    /// <summary>Least horizontal distance from the kerb line to the face's nearest edge, in metres.</summary>
    public double KerbOffsetM { get; }

    /// <summary>Where <see cref="CarriagewayClearanceM"/> comes from.</summary>
    public string CarriagewayClearanceSource { get; }

    /// <summary>Where <see cref="KerbOffsetM"/> comes from.</summary>
    public string KerbOffsetSource { get; }

    /// <summary>Least height of the lower edge above any footway or carriageway below it, in metres.</summary>
    public double MinimumLowerEdgeClearanceM { get; }

    /// <summary>Greatest distance from the stop line (or, without one, the waiting driver's eye) to the mirror, in metres.</summary>
    public double MaximumEyeToMirrorDistanceM { get; }

    /// <summary>Highest approach speed at which a mirror is within the rules, in km/h.</summary>
    public double CautionAboveSpeedKmh { get; }

    /// <summary>Where the values come from.</summary>
    public string Source { get; }

    /// <summary>The backing board the rule set asks behind the face, or null when it asks none (the defaults ask none).</summary>
    /// <remarks>Left out of a serialized answer when null, so answers from rule sets without one are unchanged by its addition.</remarks>
    [JsonIgnore(Condition = JsonIgnoreCondition.WhenWritingNull)]
    public BackingBoardRule? BackingBoard { get; }
}
