using CsCheck;
using SafetyMirror.Core.Design.Glare;
using SafetyMirror.Core.Optics;
using SafetyMirror.Core.Tests.Optics;

namespace SafetyMirror.Core.Tests.Design.Glare;

public class ReflectedDirectionsTests
{
    [Fact]
    public void MayReach_ReflectedDirectionOfAnyFacePoint_IsTrue()
    {
        // The quick test must never lose a direction the face really sends a ray to: every face point's exact reflected
        // eye ray lies within the set's tolerance.
        var cases =
            from layout in Layout.Any
            from s in Gen.Double[0, 1]
            from k in Gen.Double[0, 1]
            select (layout, s, k);

        cases.Sample(c =>
        {
            var (layout, s, k) = c;
            var set = ReflectedDirections.Trace(layout.Mirror, layout.Eye);
            var (u, v) = layout.Mirror.Aperture.Rim(s);
            var hit = layout.Mirror.EyeRayTo(layout.Eye, u * k, v * k);
            return hit is not { } h || set.MayReach(h.ReflectedDirection, 0);
        }, iter: 300);
    }

    [Fact]
    public void MayReach_DirectionBackTowardTheFace_IsFalse()
    {
        var mirror = ConvexMirror.Aimed(new Vec3(0, 0, 2.8), 180, 5, 3, new RoundAperture(0.6));
        var set = ReflectedDirections.Trace(mirror, new Vec3(0, -10, 1.1));

        Assert.False(set.MayReach(-mirror.Normal, SunGlare.DiscRadiusRad));
    }
}
