using SafetyMirror.Core.Optics;

namespace SafetyMirror.Core.Design.Glare;

/// <summary>The directions a mirror's face sends an eye's rays to: a fine set of unit vectors with an angular tolerance.</summary>
/// <remarks>
/// Built once per mirror and eye by tracing the eye's rays to points spread over the face (rings of the outline, as the field
/// of view is traced) and reflecting them. A direction the face sends a ray to lies within <see cref="ToleranceRad"/> of some
/// sample: the tolerance is the largest angle between neighbouring samples, with a tenth more for the curvature of the map
/// between them. The set answers "may the sun be in it?" with a cone test and then a dot product per sample; a yes is a
/// candidate only, for the exact reflection to decide.
/// </remarks>
public sealed class ReflectedDirections
{
    private readonly Vec3[] samples;
    private readonly Vec3 axis;
    private readonly double coneHalfAngleRad;

    private ReflectedDirections(Vec3[] samples, Vec3 axis, double coneHalfAngleRad, double toleranceRad)
    {
        this.samples = samples;
        this.axis = axis;
        this.coneHalfAngleRad = coneHalfAngleRad;
        ToleranceRad = toleranceRad;
    }

    /// <summary>How far a direction of the face's set may lie from the nearest sample, in radians.</summary>
    public double ToleranceRad { get; }

    /// <summary>Number of face points whose reflected ray is in the set (points the eye cannot see are left out).</summary>
    public int SampleCount => samples.Length;

    /// <summary>The reflected directions of the eye's rays over the face, on <paramref name="rings"/> rings of
    /// <paramref name="pointsPerRing"/> points each and the vertex.</summary>
    public static ReflectedDirections Trace(ConvexMirror mirror, Vec3 eye, int rings = 16, int pointsPerRing = 64)
    {
        ArgumentNullException.ThrowIfNull(mirror);
        Preconditions.InRange(rings, 1, 1000, "rings");
        Preconditions.InRange(pointsPerRing, 8, 10_000, "points");

        // grid[ring, i]: ring 0 is the vertex alone (every i), ring k is the outline scaled by k / rings.
        var grid = new Vec3?[rings + 1, pointsPerRing];
        var vertex = mirror.EyeRayTo(eye, 0, 0)?.ReflectedDirection;
        for (var i = 0; i < pointsPerRing; i++)
        {
            grid[0, i] = vertex;
            var (u, v) = mirror.Aperture.Rim((double)i / pointsPerRing);
            for (var ring = 1; ring <= rings; ring++)
            {
                var scale = (double)ring / rings;
                grid[ring, i] = mirror.EyeRayTo(eye, u * scale, v * scale)?.ReflectedDirection;
            }
        }

        var found = new List<Vec3>();
        var gap = 0.0;
        for (var ring = 0; ring <= rings; ring++)
        {
            for (var i = 0; i < pointsPerRing; i++)
            {
                if (grid[ring, i] is not { } direction)
                {
                    continue;
                }

                if (ring > 0 || i == 0)
                {
                    found.Add(direction);
                }

                if (grid[ring, (i + 1) % pointsPerRing] is { } along)
                {
                    gap = Math.Max(gap, Vec3.AngleBetween(direction, along));
                }

                if (ring < rings && grid[ring + 1, i] is { } outward)
                {
                    gap = Math.Max(gap, Vec3.AngleBetween(direction, outward));
                }
            }
        }

        if (found.Count == 0)
        {
            return new ReflectedDirections([], Vec3.Up, 0, 0);
        }

        var centre = vertex ?? found.Aggregate(Vec3.Zero, (sum, d) => sum + d).Normalized();
        var cone = found.Max(d => Vec3.AngleBetween(centre, d));
        return new ReflectedDirections([.. found], centre, cone, 1.1 * gap);
    }

    /// <summary>How far a direction stands outside the cone that holds the set and its tolerance widened by
    /// <paramref name="radiusRad"/>, in radians; zero or less inside it, +∞ for an empty set.</summary>
    public double AngleOutsideRad(Vec3 direction, double radiusRad) =>
        samples.Length == 0 ? double.PositiveInfinity : Vec3.AngleBetween(direction, axis) - (coneHalfAngleRad + radiusRad + ToleranceRad);

    /// <summary>Whether a direction may lie within <paramref name="radiusRad"/> of the set: no means surely not.</summary>
    public bool MayReach(Vec3 direction, double radiusRad)
    {
        if (samples.Length == 0)
        {
            return false;
        }

        var reach = radiusRad + ToleranceRad;
        if (Vec3.Dot(direction, axis) < Math.Cos(Math.Min(Math.PI, coneHalfAngleRad + reach)))
        {
            return false;
        }

        var least = Math.Cos(Math.Min(Math.PI, reach));
        foreach (var sample in samples)
        {
            if (Vec3.Dot(direction, sample) >= least)
            {
                return true;
            }
        }

        return false;
    }
}
