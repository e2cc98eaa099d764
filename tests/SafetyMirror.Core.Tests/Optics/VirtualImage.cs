using SafetyMirror.Core.Optics;

namespace SafetyMirror.Core.Tests.Optics;

/// <summary>Locates the virtual image of a point with the exact engine: where a narrow pencil of eye rays,
/// extended behind the mirror, comes together.</summary>
public static class VirtualImage
{
    public static Vec3 Of(ConvexMirror mirror, Vec3 target, Vec3 eye, Vec3 spreadDirection, double spreadM)
    {
        var a = mirror.Reflect(eye + (spreadM * spreadDirection), target);
        var b = mirror.Reflect(eye - (spreadM * spreadDirection), target);
        Assert.True(a.IsFound && b.IsFound);
        return ClosestMeeting(a.Point, a.Point - (eye + (spreadM * spreadDirection)), b.Point, b.Point - (eye - (spreadM * spreadDirection)));
    }

    /// <summary>Midpoint of the shortest segment between two lines (point, direction).</summary>
    public static Vec3 ClosestMeeting(Vec3 p, Vec3 u, Vec3 q, Vec3 v)
    {
        var w = p - q;
        double a = Vec3.Dot(u, u), b = Vec3.Dot(u, v), c = Vec3.Dot(v, v), d = Vec3.Dot(u, w), e = Vec3.Dot(v, w);
        var denominator = (a * c) - (b * b);
        double s = ((b * e) - (c * d)) / denominator, t = ((a * e) - (b * d)) / denominator;
        return ((p + (s * u)) + (q + (t * v))) / 2;
    }
}
