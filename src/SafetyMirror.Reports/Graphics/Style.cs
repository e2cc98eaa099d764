namespace SafetyMirror.Reports.Graphics;

/// <summary>How a shape is stroked and filled: stroke colour, width and dashes, fill colour, hatch and opacity.</summary>
/// <remarks>
/// Lengths are in millimetres on paper. Lines have round caps and joins, so a very short dash draws a dot.
/// A null <see cref="Stroke"/> draws no outline; a null <see cref="Fill"/> and <see cref="Hatch"/> leave the area open.
/// </remarks>
public sealed record Style
{
    /// <summary>The outline or line colour, or null for none.</summary>
    public Colour? Stroke { get; init; } = Colour.Black;

    /// <summary>The line width in millimetres.</summary>
    public double StrokeWidthMm { get; init => field = Checks.Positive(value, "mm"); } = 0.25;

    /// <summary>The dash pattern in millimetres: an even number of positive lengths, dash first; empty for a solid line.</summary>
    public IReadOnlyList<double> DashMm
    {
        get;
        init
        {
            ArgumentNullException.ThrowIfNull(value);
            if (value.Count % 2 != 0 || !value.All(d => double.IsFinite(d) && d > 0))
            {
                // An odd list repeats differently in SVG and PDF, so only even ones are accepted.
                throw new ArgumentException($"{nameof(DashMm)} must hold an even number of finite lengths greater than 0 mm.", nameof(value));
            }

            field = value;
        }
    } = Dashes.Solid;

    /// <summary>The area fill colour, or null for none.</summary>
    public Colour? Fill { get; init; }

    /// <summary>A hatch drawn over the fill, or null for none.</summary>
    public Hatch? Hatch { get; init; }

    /// <summary>The opacity of stroke, fill and hatch, from 0 (invisible) to 1 (opaque).</summary>
    public double Opacity { get; init => field = Checks.InRange(value, 0, 1); } = 1;

    /// <summary>A line of the given colour, width and dash pattern.</summary>
    public static Style Line(Colour colour, double widthMm, IReadOnlyList<double>? dashMm = null) =>
        new() { Stroke = colour, StrokeWidthMm = widthMm, DashMm = dashMm ?? Dashes.Solid };

    /// <summary>An area filled with one colour and no outline.</summary>
    public static Style Filled(Colour fill) => new() { Stroke = null, Fill = fill };
}
