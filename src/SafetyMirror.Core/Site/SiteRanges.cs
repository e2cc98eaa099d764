namespace SafetyMirror.Core.Site;

/// <summary>The physical ranges a corner plan's values must lie in, and the defaults for omitted values.</summary>
/// <remarks>Constants, so that request contracts can state them in validation attributes and OpenAPI.</remarks>
public static class SiteRanges
{
    /// <summary>Driver's eye height of a passenger car, used when an eye gives none (AASHTO Green Book).</summary>
    public const double DefaultEyeHeightM = 1.08;

    /// <summary>Lowest eye height accepted, in metres (below any seated driver).</summary>
    public const double MinEyeHeightM = 0.5;

    /// <summary>Highest eye height accepted, in metres (above a truck cab).</summary>
    public const double MaxEyeHeightM = 4;

    /// <summary>Lowest approach speed accepted, in km/h.</summary>
    public const double MinSpeedKmh = 5;

    /// <summary>Highest approach speed accepted, in km/h.</summary>
    public const double MaxSpeedKmh = 200;

    /// <summary>Lowest approach speed accepted in mph.</summary>
    public const double MinSpeedMph = 5;

    /// <summary>Highest approach speed accepted in mph (193 km/h).</summary>
    public const double MaxSpeedMph = 120;

    /// <summary>Kilometres in a mile (exact, by the international yard of 1959).</summary>
    public const double KmPerMile = 1.609344;

    /// <summary>Grade used when an approach gives none, in percent.</summary>
    public const double DefaultGradePercent = 0;

    /// <summary>Steepest downgrade accepted, in percent (negative is downhill in the direction of travel).</summary>
    public const double MinGradePercent = -15;

    /// <summary>Steepest upgrade accepted, in percent.</summary>
    public const double MaxGradePercent = 15;

    /// <summary>Lowest obstacle height accepted, in metres.</summary>
    public const double MinObstacleHeightM = 0.1;

    /// <summary>Highest obstacle height accepted, in metres.</summary>
    public const double MaxObstacleHeightM = 100;

    /// <summary>Height of a footway above the carriageway when a footway gives none, in metres (a kerb face is typically
    /// 0.10–0.15 m [memory, common practice]).</summary>
    public const double DefaultKerbHeightM = 0.12;

    /// <summary>Highest kerb accepted, in metres.</summary>
    public const double MaxKerbHeightM = 0.5;

    /// <summary>Shortest approach accepted, in metres along the line.</summary>
    public const double MinApproachLengthM = 5;
}
