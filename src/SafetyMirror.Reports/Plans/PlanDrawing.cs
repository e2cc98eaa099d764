using SafetyMirror.Reports.Graphics;

namespace SafetyMirror.Reports.Plans;

/// <summary>A plan drawn at a true scale, with the scale it was drawn at.</summary>
/// <remarks>The scale holds when the drawing is printed at its natural size (SVG in mm, PDF at its natural box).</remarks>
public sealed record PlanDrawing(Drawing Drawing, int ScaleDenominator, double ScaleBarLengthM)
{
    /// <summary>How far the plan is turned on the paper, degrees counter-clockwise; 0 keeps the plan's north up.</summary>
    public double RotationDeg { get; init; }

    /// <summary>The box of every label placed on the map; no two overlap and none overlaps a <see cref="SymbolBoxes"/> box.</summary>
    public IReadOnlyList<PlanBox> LabelBoxes { get; init; } = [];

    /// <summary>The boxes of the symbols labels keep clear of: point markers, arrows, the north arrow, the scale bar and the legend.</summary>
    public IReadOnlyList<PlanBox> SymbolBoxes { get; init; } = [];

    /// <summary>Where the map's content may go on the paper: the map's frame less its white margin.</summary>
    public PlanBox? ContentBox { get; init; }

    /// <summary>The labels that found no free place and were left out.</summary>
    public IReadOnlyList<string> LabelsLeftOut { get; init; } = [];
}
