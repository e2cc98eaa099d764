using CsCheck;
using SafetyMirror.Core.Optics;

namespace SafetyMirror.Core.Tests.Optics;

/// <summary>Random but physically sensible corners: a mirror on a pole, an eye and a target in front of it.</summary>
public sealed record Layout(ConvexMirror Mirror, Vec3 Eye, Vec3 Target)
{
    private static readonly Vec3 Pole = new(0, 0, 2.8);

    /// <summary>A point in front of the mirror at the given distance, turned off the axis by the given angles.</summary>
    public static Vec3 InFront(ConvexMirror mirror, double distanceM, double offAxisDeg, double aroundDeg)
    {
        double off = Angles.FromDeg(offAxisDeg), around = Angles.FromDeg(aroundDeg);
        var direction = (Math.Cos(off) * mirror.Normal)
            + (Math.Sin(off) * ((Math.Cos(around) * mirror.HorizontalAxis) + (Math.Sin(around) * mirror.VerticalAxis)));
        return mirror.Vertex + (distanceM * direction);
    }

    public static readonly Gen<Layout> Any =
        from radius in Gen.Double[0.5, 10]
        from faceShare in Gen.Double[0.05, 0.9]
        from azimuth in Gen.Double[0, 360]
        from tilt in Gen.Double[-10, 30]
        from eyeDistance in Gen.Double[1, 30]
        from eyeOff in Gen.Double[0, 60]
        from eyeAround in Gen.Double[0, 360]
        from targetDistance in Gen.Double[1, 200]
        from targetOff in Gen.Double[0, 80]
        from targetAround in Gen.Double[0, 360]
        let mirror = ConvexMirror.Aimed(Pole, azimuth, tilt, radius, new RoundAperture(2 * radius * faceShare))
        select new Layout(
            mirror,
            InFront(mirror, eyeDistance, eyeOff, eyeAround),
            InFront(mirror, targetDistance, targetOff, targetAround));
}
