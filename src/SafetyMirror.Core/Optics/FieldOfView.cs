using NetTopologySuite.Geometries;
using NetTopologySuite.Geometries.Utilities;

namespace SafetyMirror.Core.Optics;

/// <summary>What an eye sees of a horizontal plane through a mirror: the outline and how the rays fared.</summary>
/// <param name="Outline">The seen area of the plane, in site metres (x, y), clipped at the range limit;
/// null when fewer than three rim rays reach the plane.</param>
/// <param name="RaysTraced">Rays sent from the eye to points spread over the face.</param>
/// <param name="RaysOnPlane">Rays that reflect and meet the plane within the range limit.</param>
/// <param name="RaysUpward">Rays that reflect away from the plane and never meet it.</param>
/// <param name="RaysBeyondRange">Rays that meet the plane farther than the range limit from the mirror.</param>
/// <param name="RaysOffFace">Rays that cannot reflect: the point is on the sphere's far side from the eye.</param>
public sealed record FieldOfView(
    Polygon? Outline,
    int RaysTraced,
    int RaysOnPlane,
    int RaysUpward,
    int RaysBeyondRange,
    int RaysOffFace);

/// <summary>Forward ray tracing from an eye over a mirror's face onto a horizontal plane.</summary>
/// <remarks>
/// Rays go from the eye to points on concentric copies of the face outline (the rim and scaled-down
/// rims), are reflected by the law of reflection, and are intersected with the plane z = h. The outline
/// is the image of the rim ring. Rim rays that go upward or land beyond the range limit are placed on the
/// range circle round the mirror, along their horizontal direction, so the outline stays bounded: the
/// counts in the result say how many rays this applied to.
/// </remarks>
public static class FieldOfViewTracer
{
    private static readonly GeometryFactory Factory = new();

    /// <summary>Traces about <paramref name="rayCount"/> rays (at least 9) and returns the seen outline.</summary>
    /// <param name="mirror">The mirror.</param>
    /// <param name="eye">The eye, in site metres.</param>
    /// <param name="planeHeightM">Height of the plane the rays are intersected with (0 for the road surface).</param>
    /// <param name="rangeLimitM">Largest horizontal distance from the mirror that counts as a hit.</param>
    /// <param name="rayCount">Number of rays to spread over the face.</param>
    public static FieldOfView Trace(ConvexMirror mirror, Vec3 eye, double planeHeightM, double rangeLimitM, int rayCount = 1000)
    {
        ArgumentNullException.ThrowIfNull(mirror);
        Preconditions.Finite(eye);
        Preconditions.InRange(planeHeightM, -100, 100, "m");
        Preconditions.Positive(rangeLimitM, "m");
        Preconditions.InRange(rayCount, 9, 1_000_000, "rays");
        if (mirror.IsInsideSphere(eye))
        {
            throw new ArgumentOutOfRangeException(nameof(eye), eye, "The eye must be outside the mirror's sphere.");
        }

        // Rings of equal point count from the rim inward; the centre gets one ray of its own.
        var perRing = Math.Max(8, (int)Math.Round(Math.Sqrt(rayCount * 4.0)));
        var rings = Math.Max(1, (rayCount - 1) / perRing);
        var tracer = new RayCounter(mirror, eye, planeHeightM, rangeLimitM);
        var rim = new List<Coordinate>(perRing + 1);

        tracer.Trace(0, 0);
        for (var ring = rings; ring >= 1; ring--)
        {
            var scale = (double)ring / rings;
            for (var i = 0; i < perRing; i++)
            {
                var (u, v) = mirror.Aperture.Rim((double)i / perRing);
                var landing = tracer.Trace(u * scale, v * scale);
                if (ring == rings && landing is { } point)
                {
                    rim.Add(new Coordinate(point.X, point.Y));
                }
            }
        }

        return new FieldOfView(OutlineOf(rim), tracer.Traced, tracer.OnPlane, tracer.Upward, tracer.BeyondRange, tracer.OffFace);
    }

    private static Polygon? OutlineOf(List<Coordinate> rim)
    {
        if (rim.Count < 3)
        {
            return null;
        }

        rim.Add(rim[0].Copy());
        var ring = Factory.CreatePolygon(rim.ToArray());
        if (ring.IsValid)
        {
            return ring.Shell.IsCCW ? ring : (Polygon)ring.Reverse();
        }

        // A ring folded by clipping: keep the largest valid piece of it.
        return GeometryFixer.Fix(ring) switch
        {
            Polygon polygon => polygon,
            MultiPolygon many => many.Geometries.Cast<Polygon>().MaxBy(p => p.Area),
            _ => null,
        };
    }

    /// <summary>Traces single rays and keeps the tallies.</summary>
    private sealed class RayCounter(ConvexMirror mirror, Vec3 eye, double planeHeightM, double rangeLimitM)
    {
        public int Traced { get; private set; }

        public int OnPlane { get; private set; }

        public int Upward { get; private set; }

        public int BeyondRange { get; private set; }

        public int OffFace { get; private set; }

        /// <summary>Where the ray through face point (u, v) lands, clipped to the range circle; null if it cannot reflect.</summary>
        public Vec3? Trace(double u, double v)
        {
            Traced++;
            if (mirror.EyeRayTo(eye, u, v) is not { } h)
            {
                OffFace++; // the eye sees another part of the sphere first, or cannot see this point at all
                return null;
            }

            var r = h.ReflectedDirection;
            var rise = planeHeightM - h.Point.Z;
            var horizontal = new Vec3(r.X, r.Y, 0);
            var travel = rise * r.Z > 0 ? rise / r.Z : double.PositiveInfinity;
            if (double.IsPositiveInfinity(travel))
            {
                Upward++;
                return OnRangeCircle(h.Point, horizontal);
            }

            var landing = h.Point + (travel * r);
            if (Vec3.Distance(new Vec3(landing.X, landing.Y, 0), new Vec3(mirror.Vertex.X, mirror.Vertex.Y, 0)) > rangeLimitM)
            {
                BeyondRange++;
                return OnRangeCircle(h.Point, horizontal);
            }

            OnPlane++;
            return landing;
        }

        private Vec3? OnRangeCircle(Vec3 from, Vec3 horizontal)
        {
            if (horizontal.Length < 1e-12)
            {
                return null;
            }

            // Solve |from + s·dir − foot| = range for s > 0 in the plane.
            var dir = horizontal.Normalized();
            var offset = new Vec3(from.X - mirror.Vertex.X, from.Y - mirror.Vertex.Y, 0);
            var b = Vec3.Dot(offset, dir);
            var s = -b + Math.Sqrt(Math.Max(0, (b * b) - offset.LengthSquared + (rangeLimitM * rangeLimitM)));
            var point = from + (s * dir);
            return new Vec3(point.X, point.Y, planeHeightM);
        }
    }
}
