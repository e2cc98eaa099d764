using SafetyMirror.Core.Optics;
using SafetyMirror.Core.Site;
using SafetyMirror.Core.Sun;

namespace SafetyMirror.Core.Design.Glare;

/// <summary>Whether the sun, from one direction, dazzles a waiting driver by way of a mirror or from behind it.</summary>
/// <remarks>
/// Directions are unit vectors in the plan's local metres toward the sun (x east, y true north, z up). In the mirror: some
/// point of the sun's disc reflects from the face into the eye, found by the exact reflection point (the sun as a target far
/// away along the direction), the eye sees that face point and nothing stands between the face point and the sun. Behind the
/// mirror: the sun's centre stands within the stated angle of the line from the eye to the mirror's vertex and nothing
/// stands between the eye and the sun. Obstacles are the plan's flat-topped prisms; the ground is level and the sun is only
/// counted while some of its disc is above the horizon.
/// </remarks>
public sealed class SunGlare
{
    /// <summary>How far away the sun is put for the reflection point, in metres: the parallax across a face is then below 1e-7 rad.</summary>
    private const double SunDistanceM = 1e7;

    /// <summary>Points round the disc's edge tried after its centre: the polygon then misses at most 0.005° of the disc's radius.</summary>
    private const int DiscEdgePoints = 16;

    private readonly SitePlan plan;
    private readonly ConvexMirror mirror;
    private readonly Vec3 eye;
    private readonly Vec3 towardMirror;
    private readonly double behindMirrorCos;
    private readonly double behindMirrorRad;
    private readonly ReflectedDirections directions;
    private readonly bool eyeSeesWholeFace;
    private readonly double tallestM;
    private readonly NetTopologySuite.Geometries.Envelope obstacleBox;

    /// <summary>Prepares the checks for one mirror and one eye; <paramref name="behindMirrorAngleDeg"/> is the angle from the
    /// eye→mirror line within which the sun counts as behind the mirror.</summary>
    public SunGlare(SitePlan plan, ConvexMirror mirror, Vec3 eye, double behindMirrorAngleDeg)
    {
        this.plan = plan ?? throw new ArgumentNullException(nameof(plan));
        this.mirror = mirror ?? throw new ArgumentNullException(nameof(mirror));
        this.eye = Preconditions.Finite(eye);
        Preconditions.InRange(behindMirrorAngleDeg, 0, 90, "degrees");
        towardMirror = (mirror.Vertex - eye).Normalized();
        behindMirrorRad = Angles.FromDeg(behindMirrorAngleDeg);
        behindMirrorCos = Math.Cos(behindMirrorRad);
        directions = ReflectedDirections.Trace(mirror, eye);
        eyeSeesWholeFace = EyeSeesVertexAndRim(plan, mirror, eye);
        tallestM = plan.Obstacles.Select(o => o.HeightM).DefaultIfEmpty(0).Max();
        obstacleBox = new NetTopologySuite.Geometries.Envelope();
        foreach (var obstacle in plan.Obstacles)
        {
            obstacleBox.ExpandToInclude(obstacle.Footprint.EnvelopeInternal);
        }
    }

    /// <summary>The sun's angular radius, in radians.</summary>
    public static double DiscRadiusRad { get; } = Angles.FromDeg(SunPosition.DiscDiameterDeg / 2);

    /// <summary>The directions the face sends the eye's rays to, precomputed for the quick test.</summary>
    public ReflectedDirections Directions => directions;

    /// <summary>Where on the face the sun's disc, seen from this direction, reflects into the eye unobstructed; null when it does not.</summary>
    /// <remarks>Cheap when the direction is far from the face's set (one cone test); otherwise up to 17 exact reflection points.</remarks>
    public Vec3? GlintPoint(Vec3 sunDirection)
    {
        if (IsBelowHorizon(sunDirection) || !directions.MayReach(sunDirection, DiscRadiusRad))
        {
            return null;
        }

        foreach (var direction in DiscPoints(sunDirection))
        {
            var sun = mirror.Vertex + (SunDistanceM * direction);
            if (ReflectionSolver.SurelyNotOnFace(mirror, eye, sun))
            {
                continue;
            }

            var reflection = mirror.Reflect(eye, sun);
            if (reflection.IsSeenInMirror && (eyeSeesWholeFace || !plan.IsBlocked(eye, reflection.Point)) && !IsShaded(reflection.Point, direction))
            {
                return reflection.Point;
            }
        }

        return null;
    }

    /// <summary>Whether no obstacle cuts the eye's lines to the vertex and to points round the rim: then the eye sees the
    /// whole face (obstacles are prisms standing on the ground, far larger than a face), and a glint's own line to the eye
    /// need not be checked again.</summary>
    private static bool EyeSeesVertexAndRim(SitePlan plan, ConvexMirror mirror, Vec3 eye)
    {
        const int RimPoints = 64;
        if (plan.IsBlocked(eye, mirror.Vertex))
        {
            return false;
        }

        for (var k = 0; k < RimPoints; k++)
        {
            var (u, v) = mirror.Aperture.Rim((double)k / RimPoints);
            if (plan.IsBlocked(eye, mirror.PointOnFace(u, v)))
            {
                return false;
            }
        }

        return true;
    }

    /// <summary>Whether the sun's centre stands within the stated angle of the eye→mirror line, unobstructed from the eye.</summary>
    public bool IsBehindMirror(Vec3 sunDirection) =>
        !IsBelowHorizon(sunDirection) && Vec3.Dot(sunDirection, towardMirror) >= behindMirrorCos && !IsShaded(eye, sunDirection);

    /// <summary>Whether the whole disc is below the horizon.</summary>
    private static bool IsBelowHorizon(Vec3 sunDirection) => sunDirection.Z <= -Math.Sin(DiscRadiusRad);

    /// <summary>How far the sun must still move before either kind of glare could begin, in radians (zero when it may now).</summary>
    /// <remarks>Glare needs the disc above the horizon and the sun inside the cone that holds the face's directions or
    /// within the stated angle of the eye→mirror line; this is the larger of the sun's distance below the horizon and its
    /// distance from the nearer of the two cones. A scan may step over the time the sun needs to cover it.</remarks>
    public double ClearanceRad(Vec3 sunDirection)
    {
        var belowHorizon = -Math.Asin(Math.Clamp(sunDirection.Z, -1, 1)) - DiscRadiusRad;
        var outsideCones = Math.Min(
            directions.AngleOutsideRad(sunDirection, DiscRadiusRad),
            Vec3.AngleBetween(sunDirection, towardMirror) - behindMirrorRad);
        return Math.Max(0, Math.Max(belowHorizon, outsideCones));
    }

    /// <summary>The angle between the direction and the eye→mirror line, in degrees.</summary>
    public double AngleFromMirrorLineDeg(Vec3 sunDirection) => Angles.ToDeg(Vec3.AngleBetween(sunDirection, towardMirror));

    /// <summary>Whether an obstacle stands between a point and the sun: the ray is followed until it has left every
    /// obstacle's box or risen above the tallest top.</summary>
    private bool IsShaded(Vec3 from, Vec3 sunDirection)
    {
        if (plan.Obstacles.Length == 0 || from.Z >= tallestM)
        {
            return false;
        }

        var horizontal = Math.Sqrt((sunDirection.X * sunDirection.X) + (sunDirection.Y * sunDirection.Y));
        var across = horizontal > 1e-12 ? FarthestCornerM(from) / horizontal : double.PositiveInfinity;
        var above = sunDirection.Z > 1e-12 ? (tallestM - from.Z) / sunDirection.Z : double.PositiveInfinity;
        var length = Math.Min(across, above) + 1;
        return double.IsFinite(length) && plan.IsBlocked(from, from + (length * sunDirection));
    }

    private double FarthestCornerM(Vec3 from)
    {
        var dx = Math.Max(Math.Abs(obstacleBox.MinX - from.X), Math.Abs(obstacleBox.MaxX - from.X));
        var dy = Math.Max(Math.Abs(obstacleBox.MinY - from.Y), Math.Abs(obstacleBox.MaxY - from.Y));
        return Math.Sqrt((dx * dx) + (dy * dy));
    }

    /// <summary>The disc's centre, then points round its edge.</summary>
    private static IEnumerable<Vec3> DiscPoints(Vec3 centre)
    {
        yield return centre;
        var helper = Math.Abs(centre.Z) < 0.9 ? Vec3.Up : new Vec3(1, 0, 0);
        var across = Vec3.Cross(centre, helper).Normalized();
        var other = Vec3.Cross(centre, across);
        double cos = Math.Cos(DiscRadiusRad), sin = Math.Sin(DiscRadiusRad);
        for (var k = 0; k < DiscEdgePoints; k++)
        {
            var angle = 2 * Math.PI * k / DiscEdgePoints;
            yield return (cos * centre) + (sin * ((Math.Cos(angle) * across) + (Math.Sin(angle) * other)));
        }
    }
}
