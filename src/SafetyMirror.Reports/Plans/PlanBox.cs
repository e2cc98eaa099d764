using SafetyMirror.Reports.Graphics;

namespace SafetyMirror.Reports.Plans;

/// <summary>An upright box on a plan's paper, in millimetres from the drawing's top-left corner, and what it holds.</summary>
/// <param name="What">The label's text, or the kind of symbol ("marker", "arrow", "north arrow", "scale bar", "legend").</param>
/// <param name="Left">The left edge.</param>
/// <param name="Top">The top edge.</param>
/// <param name="Right">The right edge.</param>
/// <param name="Bottom">The bottom edge.</param>
public sealed record PlanBox(string What, double Left, double Top, double Right, double Bottom)
{
    /// <summary>A square box of half-width <paramref name="halfMm"/> centred on <paramref name="centre"/>.</summary>
    public static PlanBox Around(string what, PointMm centre, double halfMm) =>
        new(what, centre.X - halfMm, centre.Y - halfMm, centre.X + halfMm, centre.Y + halfMm);

    /// <summary>Whether the two boxes share some area (touching edges do not count).</summary>
    public bool Overlaps(PlanBox other) =>
        Left < other.Right && other.Left < Right && Top < other.Bottom && other.Top < Bottom;

    /// <summary>Whether this box lies wholly inside <paramref name="other"/>.</summary>
    public bool IsInside(PlanBox other) =>
        Left >= other.Left && Right <= other.Right && Top >= other.Top && Bottom <= other.Bottom;
}
