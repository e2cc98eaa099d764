namespace SafetyMirror.Reports.Graphics;

/// <summary>An opaque sRGB colour; transparency is a property of <see cref="Style"/>.</summary>
public readonly record struct Colour(byte R, byte G, byte B)
{
    /// <summary>Black, for outlines, text and symbols.</summary>
    public static Colour Black { get; } = new(0, 0, 0);

    /// <summary>White, for the open half of symbols.</summary>
    public static Colour White { get; } = new(255, 255, 255);

    /// <summary>A dark grey that still reads as a line on a poor copier.</summary>
    public static Colour DarkGrey { get; } = new(77, 77, 77);

    /// <summary>A mid grey for hatching and secondary lines.</summary>
    public static Colour MidGrey { get; } = new(140, 140, 140);

    /// <summary>A light grey for area fills and grid lines.</summary>
    public static Colour LightGrey { get; } = new(217, 217, 217);

    /// <summary>A dark blue that prints as a dark grey.</summary>
    public static Colour Blue { get; } = new(31, 78, 156);

    /// <summary>A dark red that prints as a mid grey.</summary>
    public static Colour Red { get; } = new(178, 24, 43);

    /// <summary>A dark green that prints as a mid grey.</summary>
    public static Colour Green { get; } = new(27, 120, 55);

    /// <summary>The colour as a lower-case CSS hex triplet, for example <c>#1f4e9c</c>.</summary>
    public string Hex => $"#{R:x2}{G:x2}{B:x2}";
}
