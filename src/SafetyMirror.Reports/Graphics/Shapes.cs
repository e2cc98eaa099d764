namespace SafetyMirror.Reports.Graphics;

/// <summary>One immutable element of a <see cref="Drawing"/>; the back-ends render each kind the same way.</summary>
public abstract record Shape;

/// <summary>An open line through two or more points.</summary>
public sealed record Polyline : Shape
{
    /// <summary>Creates a line through <paramref name="points"/>.</summary>
    public Polyline(IReadOnlyList<PointMm> points, Style style)
    {
        Points = Checks.Points(points, 2);
        Style = style ?? throw new ArgumentNullException(nameof(style));
    }

    /// <summary>The vertices in drawing order.</summary>
    public IReadOnlyList<PointMm> Points { get; }

    /// <summary>The stroke; fill and hatch are ignored for an open line.</summary>
    public Style Style { get; }
}

/// <summary>A closed area with optional holes, filled by the even-odd rule.</summary>
public sealed record Polygon : Shape
{
    /// <summary>Creates an area bounded by <paramref name="shell"/> with the given holes.</summary>
    /// <remarks>The rings need not repeat their first point at the end; the back-ends close them.</remarks>
    public Polygon(IReadOnlyList<PointMm> shell, Style style, IReadOnlyList<IReadOnlyList<PointMm>>? holes = null)
    {
        Shell = Checks.Points(shell, 3);
        Style = style ?? throw new ArgumentNullException(nameof(style));
        Holes = holes ?? [];
        foreach (var hole in Holes)
        {
            Checks.Points(hole, 3);
        }
    }

    /// <summary>The outer ring.</summary>
    public IReadOnlyList<PointMm> Shell { get; }

    /// <summary>The inner rings cut out of the area.</summary>
    public IReadOnlyList<IReadOnlyList<PointMm>> Holes { get; }

    /// <summary>The outline, fill and hatch.</summary>
    public Style Style { get; }

    /// <summary>The shell followed by the holes.</summary>
    internal IEnumerable<IReadOnlyList<PointMm>> Rings => Holes.Prepend(Shell);
}

/// <summary>A circle given by its centre and radius.</summary>
public sealed record Circle : Shape
{
    /// <summary>Creates a circle.</summary>
    public Circle(PointMm centre, double radiusMm, Style style)
    {
        Centre = centre.IsFinite ? centre : throw new ArgumentOutOfRangeException(nameof(centre), centre, "centre must have finite coordinates in mm.");
        RadiusMm = Checks.Positive(radiusMm, "mm");
        Style = style ?? throw new ArgumentNullException(nameof(style));
    }

    /// <summary>The centre.</summary>
    public PointMm Centre { get; }

    /// <summary>The radius in millimetres.</summary>
    public double RadiusMm { get; }

    /// <summary>The outline, fill and hatch.</summary>
    public Style Style { get; }
}

/// <summary>Where a text's anchor point sits along its baseline.</summary>
public enum TextAnchor
{
    /// <summary>The text starts at the anchor.</summary>
    Start,

    /// <summary>The text is centred on the anchor.</summary>
    Middle,

    /// <summary>The text ends at the anchor.</summary>
    End,
}

/// <summary>The weight of a text's typeface.</summary>
public enum FontWeight
{
    /// <summary>The regular face.</summary>
    Normal,

    /// <summary>The bold face.</summary>
    Bold,
}

/// <summary>One line of text on its baseline, in the report's typeface.</summary>
/// <remarks>
/// <see cref="SizeMm"/> is the em size (1 mm is about 2.83 pt). <see cref="RotationDeg"/> turns the text clockwise
/// on the page about its anchor; -90 reads from bottom to top.
/// </remarks>
public sealed record Text : Shape
{
    /// <summary>Creates a text whose baseline passes through <paramref name="at"/>.</summary>
    public Text(PointMm at, string value, double sizeMm)
    {
        At = at.IsFinite ? at : throw new ArgumentOutOfRangeException(nameof(at), at, "at must have finite coordinates in mm.");
        Value = value ?? throw new ArgumentNullException(nameof(value));
        SizeMm = Checks.Positive(sizeMm, "mm");
    }

    /// <summary>The anchor point on the baseline.</summary>
    public PointMm At { get; }

    /// <summary>The characters, exactly as the caller gave them; the back-ends escape them.</summary>
    public string Value { get; }

    /// <summary>The em size in millimetres.</summary>
    public double SizeMm { get; }

    /// <summary>Where <see cref="At"/> sits along the text.</summary>
    public TextAnchor Anchor { get; init; } = TextAnchor.Start;

    /// <summary>The face weight.</summary>
    public FontWeight Weight { get; init; } = FontWeight.Normal;

    /// <summary>The glyph colour.</summary>
    public Colour Colour { get; init; } = Colour.Black;

    /// <summary>The clockwise rotation about <see cref="At"/>, in degrees.</summary>
    public double RotationDeg { get; init => field = Checks.Finite(value, "degrees"); }
}
