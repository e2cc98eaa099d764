namespace SafetyMirror.Core.Optics;

/// <summary>A convex spherical mirror: a cap of a sphere, seen from outside.</summary>
/// <remarks>
/// The sphere's centre is <c>C = V − R·n</c>, behind the face. A sphere point belongs to the mirror when it
/// is on the front half of the sphere and its projection onto the plane tangent at the vertex lies inside
/// the aperture. The focal length is half the radius of curvature; images of real objects are virtual,
/// upright and reduced.
/// </remarks>
public sealed record ConvexMirror
{
    /// <summary>Creates a mirror from its vertex, its outward axis, its radius of curvature and its face.</summary>
    /// <exception cref="ArgumentOutOfRangeException">A non-finite vertex, a zero or non-finite axis, a radius
    /// that is not positive, or a face that does not fit on the sphere.</exception>
    public ConvexMirror(Vec3 vertex, Vec3 outwardNormal, double radiusM, Aperture aperture)
    {
        Vertex = Preconditions.Finite(vertex);
        Normal = Preconditions.Direction(outwardNormal);
        RadiusM = Preconditions.Positive(radiusM, "m");
        Aperture = aperture ?? throw new ArgumentNullException(nameof(aperture));
        if (!aperture.FitsOnSphereOf(radiusM))
        {
            throw new ArgumentOutOfRangeException(nameof(aperture), aperture,
                $"The face must fit on the sphere: half its largest extent ({aperture.CircumradiusM} m) must be less than the radius of curvature ({radiusM} m).");
        }

        Centre = Vertex - (RadiusM * Normal);
        // The face's horizontal axis; a face looking straight up or down takes east.
        var horizontal = Vec3.Cross(Normal, Vec3.Up);
        HorizontalAxis = horizontal.Length > 1e-9 ? horizontal.Normalized() : new Vec3(1, 0, 0);
        VerticalAxis = Vec3.Cross(HorizontalAxis, Normal);
    }

    /// <summary>Creates a mirror aimed by compass azimuth and downward tilt, both in degrees.</summary>
    /// <param name="vertex">Centre of the face, in site metres.</param>
    /// <param name="azimuthDeg">Direction the face looks, clockwise from north, 0 to 360.</param>
    /// <param name="tiltDownDeg">How far the axis points below horizontal, −90 to 90.</param>
    /// <param name="radiusM">Radius of curvature in metres.</param>
    /// <param name="aperture">The face outline.</param>
    public static ConvexMirror Aimed(Vec3 vertex, double azimuthDeg, double tiltDownDeg, double radiusM, Aperture aperture)
    {
        Preconditions.InRange(azimuthDeg, -360, 360, "degrees", nameof(azimuthDeg));
        Preconditions.InRange(tiltDownDeg, -90, 90, "degrees", nameof(tiltDownDeg));
        return new ConvexMirror(vertex, AxisFromAim(azimuthDeg, tiltDownDeg), radiusM, aperture);
    }

    /// <summary>The unit axis of a face looking toward a compass azimuth, tilted down by the given angle.</summary>
    public static Vec3 AxisFromAim(double azimuthDeg, double tiltDownDeg)
    {
        double azimuth = azimuthDeg * Math.PI / 180, tilt = tiltDownDeg * Math.PI / 180;
        return new Vec3(Math.Sin(azimuth) * Math.Cos(tilt), Math.Cos(azimuth) * Math.Cos(tilt), -Math.Sin(tilt));
    }

    /// <summary>Centre of the face, in site metres.</summary>
    public Vec3 Vertex { get; }

    /// <summary>Unit outward normal at the vertex: the mirror's axis, pointing at the road.</summary>
    public Vec3 Normal { get; }

    /// <summary>Radius of curvature in metres.</summary>
    public double RadiusM { get; }

    /// <summary>The face outline.</summary>
    public Aperture Aperture { get; }

    /// <summary>Centre of the sphere, behind the face.</summary>
    public Vec3 Centre { get; }

    /// <summary>Unit horizontal axis across the face (the aperture's u axis).</summary>
    public Vec3 HorizontalAxis { get; }

    /// <summary>Unit axis up the face (the aperture's v axis).</summary>
    public Vec3 VerticalAxis { get; }

    /// <summary>Focal length in metres, R/2; the focus is virtual, behind the face.</summary>
    public double FocalLengthM => RadiusM / 2;

    /// <summary>Compass azimuth of the axis in degrees, 0 to 360.</summary>
    public double AzimuthDeg => ((Math.Atan2(Normal.X, Normal.Y) * 180 / Math.PI) + 360) % 360;

    /// <summary>Downward tilt of the axis in degrees.</summary>
    public double TiltDownDeg => -Math.Asin(Math.Clamp(Normal.Z, -1, 1)) * 180 / Math.PI;

    /// <summary>Angle between the sphere radius through a point and the mirror's axis, in radians.</summary>
    public double OffAxisAngle(Vec3 pointOnSphere) => Vec3.AngleBetween(pointOnSphere - Centre, Normal);

    /// <summary>Whether a point of the sphere belongs to the face (front half, projection inside the aperture).</summary>
    public bool IsOnFace(Vec3 pointOnSphere)
    {
        var radial = pointOnSphere - Centre;
        return Vec3.Dot(radial, Normal) > 0
            && Aperture.Contains(Vec3.Dot(radial, HorizontalAxis), Vec3.Dot(radial, VerticalAxis));
    }

    /// <summary>The sphere point whose projection on the face plane is (u, v); (u, v) must be within the sphere's radius.</summary>
    public Vec3 PointOnFace(double uM, double vM)
    {
        var along = Math.Sqrt((RadiusM * RadiusM) - (uM * uM) - (vM * vM));
        return Centre + (along * Normal) + (uM * HorizontalAxis) + (vM * VerticalAxis);
    }

    /// <summary>The eye's ray to the face point whose projection on the face plane is (u, v), reflected there.</summary>
    /// <returns>The hit, or null when the eye meets another part of the sphere first or cannot see the point.</returns>
    public SurfaceHit? EyeRayTo(Vec3 eye, double uM, double vM)
    {
        var facePoint = PointOnFace(uM, vM);
        var hit = TraceRay(eye, facePoint - eye);
        return hit is { } h && Vec3.Distance(h.Point, facePoint) <= 1e-6 * Math.Max(1, RadiusM) ? hit : null;
    }

    /// <summary>Whether a point is strictly inside the sphere (where no reflection can reach it).</summary>
    public bool IsInsideSphere(Vec3 point) => (point - Centre).LengthSquared < RadiusM * RadiusM;

    /// <summary>The exact reflection point for an eye and a target (Alhazen's problem on the sphere).</summary>
    public Reflection Reflect(Vec3 eye, Vec3 target) => ReflectionSolver.Solve(this, eye, target);

    /// <summary>Traces a ray to its first hit on the sphere's outside and reflects it there.</summary>
    /// <returns>The hit, or null when the ray misses the sphere or starts inside it.</returns>
    public SurfaceHit? TraceRay(Vec3 origin, Vec3 direction)
    {
        var d = direction.Normalized();
        var toOrigin = origin - Centre;
        var b = Vec3.Dot(toOrigin, d);
        var c = toOrigin.LengthSquared - (RadiusM * RadiusM);
        var discriminant = (b * b) - c;
        if (c < 0 || b >= 0 || discriminant < 0)
        {
            return null; // inside the sphere, heading away from it, or passing by
        }

        // The nearer root, written to avoid cancellation when the ray grazes the sphere.
        var distance = c / (-b + Math.Sqrt(discriminant));
        var point = origin + (distance * d);
        var normal = (point - Centre) / RadiusM;
        var reflected = d - (2 * Vec3.Dot(d, normal) * normal);
        return new SurfaceHit(point, normal, reflected, distance, IsOnFace(point));
    }
}

/// <summary>Where a ray met the sphere and where it went after reflecting.</summary>
/// <param name="Point">The hit point on the sphere.</param>
/// <param name="Normal">The unit outward normal there.</param>
/// <param name="ReflectedDirection">The unit direction of the reflected ray.</param>
/// <param name="DistanceM">Distance from the ray's origin to the hit.</param>
/// <param name="IsOnFace">Whether the hit is on the mirror's face rather than elsewhere on the sphere.</param>
public readonly record struct SurfaceHit(Vec3 Point, Vec3 Normal, Vec3 ReflectedDirection, double DistanceM, bool IsOnFace);
