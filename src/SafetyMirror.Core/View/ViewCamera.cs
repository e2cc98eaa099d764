using SafetyMirror.Core.Optics;

namespace SafetyMirror.Core.View;

/// <summary>A pin-hole camera at the waiting driver's eye, looking at a point: one ray through the centre of each pixel.</summary>
/// <remarks>
/// Pixels count from the top left, x to the right and y down; pixel (i, j) covers [i, i + 1) × [j, j + 1), so its centre is at
/// (i + 0.5, j + 0.5). The field of view is the angle across the picture's width; pixels are square.
/// </remarks>
public sealed class ViewCamera
{
    /// <summary>Creates a camera at the eye looking at <paramref name="lookAt"/> with the given picture size and field of view.</summary>
    /// <exception cref="ArgumentOutOfRangeException">A size below 1 pixel, a field of view outside (0, 170] degrees, or a look-at
    /// point straight above or below the eye or on it.</exception>
    public ViewCamera(Vec3 eye, Vec3 lookAt, int widthPx, int heightPx, double fieldOfViewDeg)
    {
        Eye = Preconditions.Finite(eye);
        Preconditions.InRange(widthPx, 1, int.MaxValue, "pixels");
        Preconditions.InRange(heightPx, 1, int.MaxValue, "pixels");
        FieldOfViewDeg = Preconditions.InRange(fieldOfViewDeg, 1e-6, 170, "degrees");
        Forward = Preconditions.Direction(lookAt - eye);
        var right = Vec3.Cross(Forward, Vec3.Up);
        if (right.Length < 1e-9)
        {
            throw new ArgumentOutOfRangeException(nameof(lookAt), lookAt, "The camera cannot look straight up or down: its picture would have no up.");
        }

        Right = right.Normalized();
        Up = Vec3.Cross(Right, Forward);
        WidthPx = widthPx;
        HeightPx = heightPx;
        FocalPx = widthPx / 2.0 / Math.Tan(Angles.FromDeg(fieldOfViewDeg) / 2);
    }

    /// <summary>The eye, in site metres.</summary>
    public Vec3 Eye { get; }

    /// <summary>Unit direction of the picture's centre.</summary>
    public Vec3 Forward { get; }

    /// <summary>Unit direction to the picture's right (horizontal).</summary>
    public Vec3 Right { get; }

    /// <summary>Unit direction to the picture's top.</summary>
    public Vec3 Up { get; }

    /// <summary>Picture width in pixels.</summary>
    public int WidthPx { get; }

    /// <summary>Picture height in pixels.</summary>
    public int HeightPx { get; }

    /// <summary>Angle across the picture's width, in degrees.</summary>
    public double FieldOfViewDeg { get; }

    /// <summary>Distance from the pin-hole to the picture plane, in pixels.</summary>
    public double FocalPx { get; }

    /// <summary>The angle one pixel spans at the picture's centre, in arc minutes (off centre a pixel spans slightly less).</summary>
    public double ArcminPerPixel => Angles.ToArcmin(Math.Atan(1 / FocalPx));

    /// <summary>The angle across the picture's height, in degrees.</summary>
    public double VerticalFieldOfViewDeg => Angles.ToDeg(2 * Math.Atan(HeightPx / 2.0 / FocalPx));

    /// <summary>The unit ray from the eye through a point of the picture (pixel centres at half-integers).</summary>
    public Vec3 RayThrough(double xPx, double yPx) =>
        ((FocalPx * Forward) + ((xPx - (WidthPx / 2.0)) * Right) - ((yPx - (HeightPx / 2.0)) * Up)).Normalized();

    /// <summary>Where a point of the scene falls in the picture, in pixels; null when it is not in front of the eye.</summary>
    public (double XPx, double YPx)? Project(Vec3 point)
    {
        var offset = point - Eye;
        var depth = Vec3.Dot(offset, Forward);
        if (depth <= 0)
        {
            return null;
        }

        var scale = FocalPx / depth;
        return ((WidthPx / 2.0) + (Vec3.Dot(offset, Right) * scale), (HeightPx / 2.0) - (Vec3.Dot(offset, Up) * scale));
    }
}
