namespace SafetyMirror.Core.Optics;

/// <summary>How large two points of a target look to an eye, through a mirror and directly.</summary>
/// <param name="First">The reflection of the first point.</param>
/// <param name="Second">The reflection of the second point.</param>
/// <param name="Angle">Angle at the eye between the two images, in radians; NaN unless both reflect.</param>
public readonly record struct MirrorView(Reflection First, Reflection Second, double Angle)
{
    /// <summary>True when both points reflect on the mirror's face.</summary>
    public bool IsSeen => First.IsSeenInMirror && Second.IsSeenInMirror;

    /// <summary>The angle in arc minutes.</summary>
    public double Arcmin => Angles.ToArcmin(Angle);
}

/// <summary>Exact apparent sizes: the angle at the eye between the rays to two points or their images.</summary>
/// <remarks>No paraxial formula is involved: each point is reflected exactly and the angle is measured
/// between the eye rays to the two reflection points.</remarks>
public static class ApparentSize
{
    /// <summary>The angle at the eye between the mirror images of points a and b.</summary>
    public static MirrorView InMirror(ConvexMirror mirror, Vec3 eye, Vec3 a, Vec3 b)
    {
        ArgumentNullException.ThrowIfNull(mirror);
        Reflection first = mirror.Reflect(eye, a), second = mirror.Reflect(eye, b);
        var angle = first.IsFound && second.IsFound
            ? Vec3.AngleBetween(first.Point - eye, second.Point - eye)
            : double.NaN;
        return new MirrorView(first, second, angle);
    }

    /// <summary>The angle at the eye between points a and b seen directly, in radians.</summary>
    public static double Direct(Vec3 eye, Vec3 a, Vec3 b) => Vec3.AngleBetween(a - eye, b - eye);

    /// <summary>
    /// How far away a target of the given size looks: the distance at which, seen directly and face on,
    /// it would subtend the given angle.
    /// </summary>
    /// <param name="sizeM">The target's extent (height or width) in metres.</param>
    /// <param name="angle">The angle it subtends in the mirror, in radians.</param>
    public static double EquivalentDirectDistanceM(double sizeM, double angle)
    {
        Preconditions.Positive(sizeM, "m");
        Preconditions.InRange(angle, double.Epsilon, Math.PI - 1e-12, "radians");
        return sizeM / 2 / Math.Tan(angle / 2);
    }
}
