namespace SafetyMirror.Reports.Graphics;

/// <summary>How an area is hatched.</summary>
public enum HatchKind
{
    /// <summary>Parallel lines rising to the right (/).</summary>
    Diagonal,

    /// <summary>Parallel lines falling to the right (\).</summary>
    BackDiagonal,

    /// <summary>Both diagonals crossed (X).</summary>
    Cross,
}

/// <summary>A hatch of parallel lines drawn over an area's fill, so areas differ without colour.</summary>
/// <remarks>Spacing is the perpendicular distance between lines; both lengths are in millimetres.</remarks>
public sealed record Hatch
{
    /// <summary>Creates a hatch.</summary>
    public Hatch(HatchKind kind, Colour colour, double spacingMm = 1.5, double lineWidthMm = 0.15)
    {
        Kind = kind;
        Colour = colour;
        SpacingMm = Checks.Positive(spacingMm, "mm");
        LineWidthMm = Checks.Positive(lineWidthMm, "mm");
    }

    /// <summary>The direction of the lines.</summary>
    public HatchKind Kind { get; }

    /// <summary>The colour of the lines.</summary>
    public Colour Colour { get; }

    /// <summary>The perpendicular distance between neighbouring lines, in millimetres.</summary>
    public double SpacingMm { get; }

    /// <summary>The width of each line, in millimetres.</summary>
    public double LineWidthMm { get; }

    /// <summary>The angle of the (first) line family, in degrees clockwise from the page's vertical.</summary>
    internal double AngleDeg => Kind == HatchKind.BackDiagonal ? -45 : 45;

    /// <summary>Whether a second family runs at right angles to the first.</summary>
    internal bool Crossed => Kind == HatchKind.Cross;
}
