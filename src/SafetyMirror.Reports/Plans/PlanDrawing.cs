using SafetyMirror.Reports.Graphics;

namespace SafetyMirror.Reports.Plans;

/// <summary>A plan drawn at a true scale, with the scale it was drawn at.</summary>
/// <remarks>The scale holds when the drawing is printed at its natural size (SVG in mm, PDF at its natural box).</remarks>
public sealed record PlanDrawing(Drawing Drawing, int ScaleDenominator, double ScaleBarLengthM);
