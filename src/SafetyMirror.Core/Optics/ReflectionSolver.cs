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

    /// <summary>Solves for the reflection point of <paramref name="target"/> seen from <paramref name="eye"/>.</summary>
    public static Reflection Solve(ConvexMirror mirror, Vec3 eye, Vec3 target)
    {
        ArgumentNullException.ThrowIfNull(mirror);
        Preconditions.Finite(eye);
        Preconditions.Finite(target);

        double r = mirror.RadiusM;
        Vec3 toEye = eye - mirror.Centre, toTarget = target - mirror.Centre;
        double e = toEye.Length, t = toTarget.Length;
        if (e <= r)
        {
            return Reflection.None(ReflectionOutcome.EyeInsideSphere);
        }

        if (t <= r)
        {
            return Reflection.None(ReflectionOutcome.TargetInsideSphere);
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
            return Reflection.None(ReflectionOutcome.BehindMirror);
        }

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
}
