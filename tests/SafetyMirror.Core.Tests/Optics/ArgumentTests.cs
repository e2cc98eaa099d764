using SafetyMirror.Core.Optics;

namespace SafetyMirror.Core.Tests.Optics;

public class ArgumentTests
{
    private static readonly Vec3 Axis = new(1, 0, 0);

    [Theory]
    [InlineData(-1.0)]
    [InlineData(0.0)]
    [InlineData(double.NaN)]
    [InlineData(double.PositiveInfinity)]
    public void ConvexMirror_RadiusNotPositive_ThrowsStatingTheRange(double radius)
    {
        var error = Assert.Throws<ArgumentOutOfRangeException>(() => new ConvexMirror(Vec3.Zero, Axis, radius, new RoundAperture(0.6)));
        Assert.Contains("greater than 0", error.Message);
    }

    [Theory]
    [InlineData(0.0)]
    [InlineData(-0.6)]
    [InlineData(double.NaN)]
    public void RoundAperture_DiameterNotPositive_ThrowsStatingTheRange(double diameter)
    {
        var error = Assert.Throws<ArgumentOutOfRangeException>(() => new RoundAperture(diameter));
        Assert.Contains("greater than 0", error.Message);
    }

    [Fact]
    public void RectangularAperture_ZeroSide_Throws() =>
        Assert.Throws<ArgumentOutOfRangeException>(() => new RectangularAperture(0.6, 0));

    [Fact]
    public void ConvexMirror_NormalOfZeroLength_Throws()
    {
        var error = Assert.Throws<ArgumentOutOfRangeException>(() => new ConvexMirror(Vec3.Zero, Vec3.Zero, 2, new RoundAperture(0.6)));
        Assert.Contains("non-zero length", error.Message);
    }

    [Fact]
    public void ConvexMirror_NaNVertex_Throws() =>
        Assert.Throws<ArgumentOutOfRangeException>(() => new ConvexMirror(new Vec3(double.NaN, 0, 0), Axis, 2, new RoundAperture(0.6)));

    [Fact]
    public void ConvexMirror_FaceWiderThanTheSphere_ThrowsNamingBothSizes()
    {
        var error = Assert.Throws<ArgumentOutOfRangeException>(() => new ConvexMirror(Vec3.Zero, Axis, 0.5, new RoundAperture(1.2)));
        Assert.Contains("0.6 m", error.Message);
    }

    [Theory]
    [InlineData(400, 0)]
    [InlineData(0, 95)]
    [InlineData(double.NaN, 0)]
    public void Aimed_AngleOutOfRange_ThrowsStatingTheRange(double azimuth, double tilt)
    {
        var error = Assert.Throws<ArgumentOutOfRangeException>(() => ConvexMirror.Aimed(Vec3.Zero, azimuth, tilt, 2.2, new RoundAperture(0.6)));
        Assert.Contains("from", error.Message);
    }

    [Fact]
    public void Reflect_NaNTarget_Throws()
    {
        var mirror = new ConvexMirror(Vec3.Zero, Axis, 2, new RoundAperture(0.6));
        Assert.Throws<ArgumentOutOfRangeException>(() => mirror.Reflect(new Vec3(5, 0, 0), new Vec3(double.NaN, 1, 0)));
    }

    [Fact]
    public void Aimed_AzimuthAndTilt_ReadBackFromTheAxis()
    {
        // Compass convention: azimuth clockwise from north (domain brief §2).
        var mirror = ConvexMirror.Aimed(Vec3.Zero, 135, 12, 2.2, new RoundAperture(0.6));
        Assert.Equal(135, mirror.AzimuthDeg, 9);
        Assert.Equal(12, mirror.TiltDownDeg, 9);
        Assert.Equal(1.1, mirror.FocalLengthM, 12);
    }
}
