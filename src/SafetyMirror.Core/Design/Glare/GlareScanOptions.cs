namespace SafetyMirror.Core.Design.Glare;

/// <summary>How a year of sun glare is sampled, and when the sun counts as behind the mirror.</summary>
/// <param name="Year">The calendar year scanned in the plan's local time, 1900 to 2100 (NOAA's equations hold to about 0.01°
/// within a few centuries of 2000).</param>
public sealed record GlareScanOptions(int Year)
{
    /// <summary>Default angle from the eye→mirror line within which the sun counts as behind the mirror, in degrees.</summary>
    /// <remarks>Common practice: disability glare from a bright source falls off with the square of its angle from the line
    /// of sight (Stiles–Holladay, L = 10·E/θ² with θ in degrees [memory]) and is severe within about 10°.</remarks>
    public const double DefaultBehindMirrorAngleDeg = 10;

    /// <summary>Largest day stride: every month keeps at least one sampled day.</summary>
    public const int MaxDayStride = 28;

    /// <summary>Minutes between samples of a day, 1 to 60 (default 5).</summary>
    public int StepMinutes { get; init; } = 5;

    /// <summary>Days between sampled days, 1 (every day) to 28 (default 7: every 7th day from 1 January).</summary>
    public int DayStride { get; init; } = 7;

    /// <summary>Angle from the eye→mirror line within which the sun counts as behind the mirror, in degrees (0.5 to 45).</summary>
    public double BehindMirrorAngleDeg { get; init; } = DefaultBehindMirrorAngleDeg;

    /// <summary>Throws when a setting is out of its range.</summary>
    internal void Validate()
    {
        Preconditions.InRange(Year, 1900, 2100, "years", nameof(Year));
        Preconditions.InRange(StepMinutes, 1, 60, "minutes", nameof(StepMinutes));
        Preconditions.InRange(DayStride, 1, MaxDayStride, "days", nameof(DayStride));
        Preconditions.InRange(BehindMirrorAngleDeg, 0.5, 45, "degrees", nameof(BehindMirrorAngleDeg));
    }
}
