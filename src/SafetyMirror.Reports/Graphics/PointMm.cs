namespace SafetyMirror.Reports.Graphics;

/// <summary>A point on a drawing, in millimetres from its top-left corner.</summary>
/// <remarks>X grows to the right and Y grows downwards, as on a printed page.</remarks>
public readonly record struct PointMm(double X, double Y)
{
    /// <summary>Whether both coordinates are finite numbers.</summary>
    public bool IsFinite => double.IsFinite(X) && double.IsFinite(Y);
}
