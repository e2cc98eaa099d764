using SafetyMirror.Core.Optics;

namespace SafetyMirror.Core.Tests.Optics;

public class ApertureTests
{
    [Theory]
    [InlineData(0.299, 0.399, true)]
    [InlineData(0.301, 0.0, false)]
    [InlineData(0.0, 0.401, false)]
    [InlineData(-0.299, -0.399, true)]
    public void RectangularAperture_PortraitFace_ContainsExactlyItsRectangle(double u, double v, bool inside)
    {
        var face = new RectangularAperture(0.6, 0.8);
        Assert.Equal(inside, face.Contains(u, v));
        Assert.False(face.LongSideHorizontal);
    }

    [Fact]
    public void RectangularAperture_Rim_WalksThePerimeterWithoutJumps()
    {
        var face = new RectangularAperture(0.45, 0.6);
        var previous = face.Rim(0);
        for (var i = 1; i <= 1000; i++)
        {
            var point = face.Rim(i / 1000.0);
            var step = Math.Sqrt(Math.Pow(point.UM - previous.UM, 2) + Math.Pow(point.VM - previous.VM, 2));
            Assert.True(step <= (2 * (0.45 + 0.6) / 1000) + 1e-12);
            Assert.True(Math.Abs(Math.Abs(point.UM) - 0.225) < 1e-12 || Math.Abs(Math.Abs(point.VM) - 0.3) < 1e-12);
            previous = point;
        }
    }

    [Fact]
    public void IsOnFace_RoundFace_MatchesTheOffAxisAngleLimit()
    {
        // Domain brief §2: a sphere point belongs to a round face when its off-axis angle is within asin(D / 2R).
        var mirror = new ConvexMirror(Vec3.Zero, new Vec3(0, 1, 0), 2.2, new RoundAperture(0.6));
        var limit = Math.Asin(0.6 / (2 * 2.2));
        foreach (var angle in new[] { limit * 0.999, limit * 1.001 })
        {
            var point = mirror.Centre + (2.2 * new Vec3(Math.Sin(angle), Math.Cos(angle), 0));
            Assert.Equal(angle <= limit, mirror.IsOnFace(point));
            Assert.Equal(angle, mirror.OffAxisAngle(point), 12);
        }
    }
}
