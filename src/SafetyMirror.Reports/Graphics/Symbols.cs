using SafetyMirror.Reports.Fonts;

namespace SafetyMirror.Reports.Graphics;

/// <summary>The outline of a point symbol.</summary>
public enum MarkerKind
{
    /// <summary>A circle.</summary>
    Circle,

    /// <summary>A square standing on a side.</summary>
    Square,

    /// <summary>A triangle pointing up.</summary>
    Triangle,

    /// <summary>A square standing on a corner.</summary>
    Diamond,
}

/// <summary>Composite symbols built from the basic shapes: point markers and arrows.</summary>
public static class Symbols
{
    /// <summary>A point marker of the given kind centred on <paramref name="centre"/>.</summary>
    /// <remarks><paramref name="sizeMm"/> is the width of the symbol's bounding box.</remarks>
    public static Shape Marker(MarkerKind kind, PointMm centre, double sizeMm, Style style)
    {
        var r = Checks.Positive(sizeMm, "mm") / 2;
        var (x, y) = (centre.X, centre.Y);
        return kind switch
        {
            MarkerKind.Circle => new Circle(centre, r, style),
            MarkerKind.Square => new Polygon([new(x - r, y - r), new(x + r, y - r), new(x + r, y + r), new(x - r, y + r)], style),
            // The centroid sits on the point, so the triangle's base is lower than its apex is high.
            MarkerKind.Triangle => new Polygon([new(x, y - 1.15 * r), new(x + r, y + 0.58 * r), new(x - r, y + 0.58 * r)], style),
            _ => new Polygon([new(x, y - r), new(x + r, y), new(x, y + r), new(x - r, y)], style),
        };
    }

    /// <summary>A straight arrow from <paramref name="from"/> to <paramref name="to"/> with a filled head at the end.</summary>
    /// <remarks>The shaft stops at the head's base so a thick or dashed line does not poke through the tip.</remarks>
    public static IReadOnlyList<Shape> Arrow(PointMm from, PointMm to, Style style, double headLengthMm = 2.5)
    {
        ArgumentNullException.ThrowIfNull(style);
        Checks.Positive(headLengthMm, "mm");
        var (dx, dy) = (to.X - from.X, to.Y - from.Y);
        var length = Math.Sqrt(dx * dx + dy * dy);
        if (!(length > headLengthMm))
        {
            throw new ArgumentException($"The arrow must be longer than its head ({headLengthMm} mm); it was {length} mm.", nameof(to));
        }

        var (ux, uy) = (dx / length, dy / length);
        var halfWidth = headLengthMm * 0.35;
        var baseCentre = new PointMm(to.X - ux * headLengthMm, to.Y - uy * headLengthMm);
        var head = new Polygon(
            [to, new(baseCentre.X - uy * halfWidth, baseCentre.Y + ux * halfWidth), new(baseCentre.X + uy * halfWidth, baseCentre.Y - ux * halfWidth)],
            new Style { Stroke = null, Fill = style.Stroke ?? Colour.Black, Opacity = style.Opacity });
        return [new Polyline([from, baseCentre], style), head];
    }

    /// <summary>A filled box a little larger than <paramref name="text"/>, to paint under it so it stays legible over lines.</summary>
    /// <remarks>The box follows the text's anchor and rotation; its size comes from the report typeface's metrics.</remarks>
    public static Polygon Backdrop(Text text, Colour fill, double paddingMm = 0.4)
    {
        ArgumentNullException.ThrowIfNull(text);
        var width = TextLayout.Width(text.Value, text.SizeMm, text.Weight);
        var start = text.Anchor switch { TextAnchor.Start => 0, TextAnchor.Middle => -width / 2, _ => -width };
        // Ascent and descent of DejaVu Sans are about 0.76 and 0.24 em for Latin letters and digits.
        var (left, right) = (start - paddingMm, start + width + paddingMm);
        var (top, bottom) = (-0.76 * text.SizeMm - paddingMm, 0.24 * text.SizeMm + paddingMm);
        var a = text.RotationDeg * Math.PI / 180;
        var (cos, sin) = (Math.Cos(a), Math.Sin(a));
        PointMm Place(double x, double y) => new(text.At.X + x * cos - y * sin, text.At.Y + x * sin + y * cos);
        return new Polygon([Place(left, top), Place(right, top), Place(right, bottom), Place(left, bottom)], Style.Filled(fill));
    }
}
