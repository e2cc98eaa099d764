using SafetyMirror.Reports.Graphics;

namespace SafetyMirror.Reports.Plans;

/// <summary>A named layer of a plan: the label its legend entry shows and the style its geometries are drawn in.</summary>
/// <remarks>Points are drawn as <see cref="Marker"/> symbols of <see cref="MarkerSizeMm"/> with the same style.</remarks>
public sealed record PlanLayer
{
    /// <summary>Creates a layer.</summary>
    public PlanLayer(string label, Style style)
    {
        ArgumentException.ThrowIfNullOrWhiteSpace(label);
        Label = label;
        Style = style ?? throw new ArgumentNullException(nameof(style));
    }

    /// <summary>The legend text.</summary>
    public string Label { get; }

    /// <summary>The stroke, fill and hatch of the layer's shapes.</summary>
    public Style Style { get; }

    /// <summary>The symbol drawn for each point.</summary>
    public MarkerKind Marker { get; init; } = MarkerKind.Circle;

    /// <summary>The width of the point symbol, in millimetres on paper.</summary>
    public double MarkerSizeMm { get; init => field = Checks.Positive(value, "mm"); } = 2.5;
}
