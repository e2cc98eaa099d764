namespace SafetyMirror.Reports.Graphics;

/// <summary>A vector drawing independent of output format: a viewport of a given size and the shapes on it.</summary>
/// <remarks>
/// The viewport spans (0, 0) to (<see cref="WidthMm"/>, <see cref="HeightMm"/>) millimetres; shapes are painted in
/// list order, later ones on top. Drawn at its natural size, one drawing millimetre is one millimetre on paper.
/// </remarks>
public sealed record Drawing
{
    /// <summary>Creates a drawing.</summary>
    public Drawing(double widthMm, double heightMm, IReadOnlyList<Shape> shapes)
    {
        WidthMm = Checks.Positive(widthMm, "mm");
        HeightMm = Checks.Positive(heightMm, "mm");
        Shapes = shapes ?? throw new ArgumentNullException(nameof(shapes));
    }

    /// <summary>The viewport width in millimetres.</summary>
    public double WidthMm { get; }

    /// <summary>The viewport height in millimetres.</summary>
    public double HeightMm { get; }

    /// <summary>The shapes in painting order.</summary>
    public IReadOnlyList<Shape> Shapes { get; }

    /// <summary>A short description for screen readers (the SVG title), or null.</summary>
    public string? Title { get; init; }
}
