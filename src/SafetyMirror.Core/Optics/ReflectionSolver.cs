using MathNet.Numerics.RootFinding;

namespace SafetyMirror.Core.Optics;

/// <summary>Alhazen's problem on a convex sphere: where light from a target reflects into an eye.</summary>
/// <remarks>
/// The reflection point lies in the plane through the sphere's centre C, the eye E and the target T. In
/// that plane, with C at the origin, E on the first axis at distance e and T at angle β and distance t,
/// the point is P(φ) = R(cos φ, sin φ). Light reflects at P when the normal bisects the directions to E and
/// T, that is when the tangential parts of the unit vectors P→E and P→T cancel:
/// <c>g(φ) = −e·sin φ / |E − P| + t·sin(β − φ) / |T − P| = 0</c>.
/// Only the arc both points can see counts: φ ≤ acos(R/e) and β − φ ≤ acos(R/t). At its ends one of the
/// two rays grazes the sphere, so g changes sign across the arc and Brent's method brackets the single
/// root (the convex case of the quartic in Fujimura et al., arXiv:1706.06924). Distances are written as
/// (e − R)² + 4eR·sin²(φ/2) so that very large radii (near plane mirrors) keep their precision.
/// </remarks>
public static class ReflectionSolver
{
    private const double AngleAccuracy = 1e-15;

    /// <summary>A margin far above the rounding of the quantities compared, far below anything that matters on a face.</summary>
    private const double OffFaceMargin = 1e-9;

    /// <summary>Solves for the reflection point of <paramref name="target"/> seen from <paramref name="eye"/>.</summary>
    public static Reflection Solve(ConvexMirror mirror, Vec3 eye, Vec3 target)
    {
        ArgumentNullException.ThrowIfNull(mirror);
        Preconditions.Finite(eye);
        Preconditions.Finite(target);
        if (PlaneOf(mirror, eye, target, out var plane) is { } none)
        {
            return Reflection.None(none);
        }

        var (r, e, t, axis1, axis2, beta, low, high) = plane;
        double phi;
        if (high - low <= AngleAccuracy)
        {
            phi = (low + high) / 2;
        }
        else
        {
            double Mismatch(double angle) =>
                (-e * Math.Sin(angle) / Leg(e, r, angle)) + (t * Math.Sin(beta - angle) / Leg(t, r, beta - angle));

            if (!Brent.TryFindRoot(Mismatch, low, high, AngleAccuracy, 200, out phi))
            {
                return Reflection.None(ReflectionOutcome.NotConverged);
            }
        }

        var normal = (Math.Cos(phi) * axis1) + (Math.Sin(phi) * axis2);
        var point = mirror.Centre + (r * normal);
        if (Vec3.Dot(normal, mirror.Normal) <= 0)
        {
            return Reflection.None(ReflectionOutcome.BehindMirror); // on the back half, inside the housing
        }

        var eyeLeg = eye - point;
        return new Reflection(
            ReflectionOutcome.Reflected,
            point,
            normal,
            Vec3.AngleBetween(normal, eyeLeg),
            Vec3.AngleBetween(normal, mirror.Normal),
            mirror.IsOnFace(point),
            eyeLeg.Length,
            Vec3.Distance(target, point));
    }

    /// <summary>Whether the target surely does not show on the face: there is no reflection, or every normal the root search
    /// could settle on is farther from the axis than the face reaches (or points behind it).</summary>
    /// <remarks>
    /// A cheap test before <see cref="Solve"/> when only "on the face or not" matters. The normal at angle φ of the plane of
    /// reflection makes n(φ)·axis = A·cos φ + B·sin φ with the mirror's axis, greatest at φ = atan2(B, A) or else at an end of
    /// the bracket [low, high] the root lies in. A point of the sphere whose normal makes d &gt; 0 with the axis projects onto
    /// the face plane at R·√(1 − d²) from its centre, which must not exceed the face's circumradius; the test only answers yes
    /// with a margin far above rounding, so it never disagrees with the exact reflection.
    /// </remarks>
    public static bool SurelyNotOnFace(ConvexMirror mirror, Vec3 eye, Vec3 target)
    {
        ArgumentNullException.ThrowIfNull(mirror);
        if (PlaneOf(mirror, eye, target, out var plane) is not null)
        {
            return true;
        }

        double a = Vec3.Dot(plane.Axis1, mirror.Normal), b = Vec3.Dot(plane.Axis2, mirror.Normal);
        var peak = Math.Atan2(b, a);
        var best = peak >= plane.Low && peak <= plane.High
            ? Math.Sqrt((a * a) + (b * b))
            : Math.Max((a * Math.Cos(plane.Low)) + (b * Math.Sin(plane.Low)), (a * Math.Cos(plane.High)) + (b * Math.Sin(plane.High)));
        var rim = mirror.Aperture.CircumradiusM / plane.RadiusM;
        return best < 0 ? best < -OffFaceMargin : 1 - (best * best) > (rim * rim) + OffFaceMargin;
    }

    /// <summary>The plane of reflection and the bracket of the root, or why there is no reflection.</summary>
    private static ReflectionOutcome? PlaneOf(ConvexMirror mirror, Vec3 eye, Vec3 target, out ReflectionPlane plane)
    {
        plane = default;
        double r = mirror.RadiusM;
        Vec3 toEye = eye - mirror.Centre, toTarget = target - mirror.Centre;
        double e = toEye.Length, t = toTarget.Length;
        if (e <= r)
        {
            return ReflectionOutcome.EyeInsideSphere;
        }

        if (t <= r)
        {
            return ReflectionOutcome.TargetInsideSphere;
        }

        // The plane of reflection: first axis toward the eye, second toward the target's side.
        var axis1 = toEye / e;
        var across = toTarget - (Vec3.Dot(toTarget, axis1) * axis1);
        var beta = Math.Atan2(across.Length, Vec3.Dot(toTarget, axis1));
        var axis2 = across.Length > 0 ? across.Normalized() : AnyPerpendicular(axis1);

        double eyeReach = Math.Acos(r / e), targetReach = Math.Acos(r / t);
        double low = Math.Max(0, beta - targetReach), high = Math.Min(beta, eyeReach);
        if (low > high)
        {
            return ReflectionOutcome.BehindMirror;
        }

        plane = new ReflectionPlane(r, e, t, axis1, axis2, beta, low, high);
        return null;
    }

    /// <summary>Distance from a point at distance d from the centre to the sphere point at angle a from it.</summary>
    private static double Leg(double d, double r, double a)
    {
        var halfSine = Math.Sin(a / 2);
        return Math.Sqrt(((d - r) * (d - r)) + (4 * d * r * halfSine * halfSine));
    }

    private static Vec3 AnyPerpendicular(Vec3 unit)
    {
        var helper = Math.Abs(unit.Z) < 0.9 ? Vec3.Up : new Vec3(1, 0, 0);
        return Vec3.Cross(unit, helper).Normalized();
    }

    /// <summary>The plane of reflection: the sphere's radius, the eye's and target's distances from its centre, the axes (toward
    /// the eye, toward the target's side), the target's angle from the first and the bracket of the normal's angle.</summary>
    private readonly record struct ReflectionPlane(
        double RadiusM, double EyeDistanceM, double TargetDistanceM, Vec3 Axis1, Vec3 Axis2, double Beta, double Low, double High);
}
