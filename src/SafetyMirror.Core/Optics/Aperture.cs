namespace SafetyMirror.Core.Optics;

/// <summary>The outline of a mirror's face, seen straight on along its axis.</summary>
/// <remarks>
/// Membership is tested on the projection of a sphere point onto the plane tangent at the vertex:
/// u along the face's horizontal axis, v along its vertical axis (up the face), both in metres.
/// For a round face this is the same as the off-axis angle being within asin(D / 2R).
/// </remarks>
public abstract record Aperture
{
    /// <summary>Half the largest extent across the face, in metres; bounds every point of the face.</summary>
    public abstract double CircumradiusM { get; }

    /// <summary>Area of the face outline, in square metres.</summary>
    public abstract double AreaM2 { get; }

    /// <summary>The smallest extent across the face, in metres.</summary>
    public abstract double MinimumExtentM { get; }

    /// <summary>Whether the face fits on a sphere of this radius of curvature: half its largest extent must be less, or the
    /// face would be more than a hemisphere.</summary>
    public bool FitsOnSphereOf(double radiusM) => CircumradiusM < radiusM;

    /// <summary>Whether the projected point (u, v) lies on or inside the outline.</summary>
    public abstract bool Contains(double uM, double vM);

    /// <summary>
    /// A point of the outline for a parameter s in [0, 1), walking once round anticlockwise from +u.
    /// Scaling it by k in [0, 1] gives concentric interior outlines, used to spread rays over the face.
    /// </summary>
    public abstract (double UM, double VM) Rim(double s);
}

/// <summary>A round face of the given diameter.</summary>
public sealed record RoundAperture : Aperture
{
    /// <summary>Creates a round face; the diameter must be positive.</summary>
    public RoundAperture(double diameterM) => DiameterM = Preconditions.Positive(diameterM, "m");

    /// <summary>Diameter of the face in metres.</summary>
    public double DiameterM { get; }

    /// <inheritdoc />
    public override double CircumradiusM => DiameterM / 2;

    /// <inheritdoc />
    public override double AreaM2 => Math.PI * DiameterM * DiameterM / 4;

    /// <inheritdoc />
    public override double MinimumExtentM => DiameterM;

    /// <inheritdoc />
    public override bool Contains(double uM, double vM) => (uM * uM) + (vM * vM) <= CircumradiusM * CircumradiusM;

    /// <inheritdoc />
    public override (double UM, double VM) Rim(double s)
    {
        var angle = 2 * Math.PI * s;
        return (CircumradiusM * Math.Cos(angle), CircumradiusM * Math.Sin(angle));
    }
}

/// <summary>A rectangular face: width along the face's horizontal axis, height up the face.</summary>
public sealed record RectangularAperture : Aperture
{
    /// <summary>Creates a rectangular face; both sides must be positive.</summary>
    public RectangularAperture(double widthM, double heightM)
    {
        WidthM = Preconditions.Positive(widthM, "m");
        HeightM = Preconditions.Positive(heightM, "m");
    }

    /// <summary>Horizontal side in metres.</summary>
    public double WidthM { get; }

    /// <summary>Vertical side in metres.</summary>
    public double HeightM { get; }

    /// <summary>True when the long side is horizontal (landscape); a square counts as horizontal.</summary>
    public bool LongSideHorizontal => WidthM >= HeightM;

    /// <inheritdoc />
    public override double CircumradiusM => Math.Sqrt((WidthM * WidthM) + (HeightM * HeightM)) / 2;

    /// <inheritdoc />
    public override double AreaM2 => WidthM * HeightM;

    /// <inheritdoc />
    public override double MinimumExtentM => Math.Min(WidthM, HeightM);

    /// <inheritdoc />
    public override bool Contains(double uM, double vM) => Math.Abs(uM) <= WidthM / 2 && Math.Abs(vM) <= HeightM / 2;

    /// <inheritdoc />
    public override (double UM, double VM) Rim(double s)
    {
        // Walk the perimeter at uniform arc length, starting at the middle of the right side.
        double w = WidthM, h = HeightM, perimeter = 2 * (w + h);
        var d = (((s % 1) + 1) % 1) * perimeter;
        if (d < h / 2)
        {
            return (w / 2, d);
        }

        d -= h / 2;
        if (d < w)
        {
            return ((w / 2) - d, h / 2);
        }

        d -= w;
        if (d < h)
        {
            return (-w / 2, (h / 2) - d);
        }

        d -= h;
        if (d < w)
        {
            return (-(w / 2) + d, -h / 2);
        }

        d -= w;
        return (w / 2, -(h / 2) + d);
    }
}
