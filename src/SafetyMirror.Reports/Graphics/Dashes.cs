namespace SafetyMirror.Reports.Graphics;

/// <summary>Named dash patterns in millimetres (dash, gap, dash, gap …) that stay apart in black-and-white print.</summary>
/// <remarks>A dash of 0.01 mm with the round line cap draws a dot as wide as the line.</remarks>
public static class Dashes
{
    /// <summary>An unbroken line.</summary>
    public static IReadOnlyList<double> Solid { get; } = [];

    /// <summary>Medium dashes.</summary>
    public static IReadOnlyList<double> Dashed { get; } = [2.5, 1.2];

    /// <summary>Round dots.</summary>
    public static IReadOnlyList<double> Dotted { get; } = [0.01, 0.9];

    /// <summary>Long dash, dot: the drafting convention for a centre line.</summary>
    public static IReadOnlyList<double> DashDot { get; } = [5, 1.2, 0.01, 1.2];

    /// <summary>Long dashes.</summary>
    public static IReadOnlyList<double> LongDashed { get; } = [6, 2];
}
