namespace SafetyMirror.Core.Optics;

/// <summary>A point or direction in site space: metres, x east, y north, z up.</summary>
/// <remarks>A small double-precision value type: the engine's inner loops must not allocate.</remarks>
public readonly record struct Vec3(double X, double Y, double Z)
{
    /// <summary>The zero vector.</summary>
    public static Vec3 Zero => default;

    /// <summary>Unit vector up (+z).</summary>
    public static Vec3 Up => new(0, 0, 1);

    /// <summary>Euclidean length.</summary>
    public double Length => Math.Sqrt((X * X) + (Y * Y) + (Z * Z));

    /// <summary>Squared length, for comparisons without a square root.</summary>
    public double LengthSquared => (X * X) + (Y * Y) + (Z * Z);

    /// <summary>This vector scaled to length 1; a zero vector stays zero.</summary>
    public Vec3 Normalized()
    {
        var length = Length;
        return length > 0 ? this / length : Zero;
    }

    /// <summary>Dot product.</summary>
    public static double Dot(Vec3 a, Vec3 b) => (a.X * b.X) + (a.Y * b.Y) + (a.Z * b.Z);

    /// <summary>Cross product (right-handed).</summary>
    public static Vec3 Cross(Vec3 a, Vec3 b) =>
        new((a.Y * b.Z) - (a.Z * b.Y), (a.Z * b.X) - (a.X * b.Z), (a.X * b.Y) - (a.Y * b.X));

    /// <summary>Angle between two non-zero vectors in radians, accurate near 0 and π.</summary>
    /// <remarks>Uses atan2(|a×b|, a·b) rather than acos, which loses half its digits near 0.</remarks>
    public static double AngleBetween(Vec3 a, Vec3 b) => Math.Atan2(Cross(a, b).Length, Dot(a, b));

    /// <summary>Distance between two points.</summary>
    public static double Distance(Vec3 a, Vec3 b) => (a - b).Length;

    /// <summary>Distance between two points seen from above (z ignored), in metres.</summary>
    public static double HorizontalDistance(Vec3 a, Vec3 b) => Math.Sqrt(((a.X - b.X) * (a.X - b.X)) + ((a.Y - b.Y) * (a.Y - b.Y)));

    /// <summary>True when every component is a finite number.</summary>
    public bool IsFinite => double.IsFinite(X) && double.IsFinite(Y) && double.IsFinite(Z);

#pragma warning disable CS1591 // operators are self-explanatory
    public static Vec3 operator +(Vec3 a, Vec3 b) => new(a.X + b.X, a.Y + b.Y, a.Z + b.Z);
    public static Vec3 operator -(Vec3 a, Vec3 b) => new(a.X - b.X, a.Y - b.Y, a.Z - b.Z);
    public static Vec3 operator -(Vec3 a) => new(-a.X, -a.Y, -a.Z);
    public static Vec3 operator *(Vec3 a, double s) => new(a.X * s, a.Y * s, a.Z * s);
    public static Vec3 operator *(double s, Vec3 a) => new(a.X * s, a.Y * s, a.Z * s);
    public static Vec3 operator /(Vec3 a, double s) => new(a.X / s, a.Y / s, a.Z / s);
#pragma warning restore CS1591
}
