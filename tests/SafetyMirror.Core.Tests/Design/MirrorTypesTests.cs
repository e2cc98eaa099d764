using SafetyMirror.Core.Design;
using SafetyMirror.Core.Optics;

namespace SafetyMirror.Core.Tests.Design;

public class MirrorTypesTests
{
    [Fact]
    public void Defaults_Order_IsSmallestFaceFirst()
    {
        var areas = MirrorTypes.Defaults.Select(type => type.Aperture.AreaM2).ToList();
        Assert.Equal(areas.Order(), areas);
    }

    [Theory]
    // Round sizes: Japanese road-mirror industry size table (domain notes §5); radii [memory, common practice].
    [InlineData("round-600", 0.6, 2.2)]
    [InlineData("round-800", 0.8, 3.0)]
    [InlineData("round-1000", 1.0, 3.6)]
    public void Find_RoundId_ReturnsDiameterAndRadius(string id, double diameterM, double radiusM)
    {
        var type = MirrorTypes.Find(id)!;
        Assert.Equal((diameterM, radiusM), (((RoundAperture)type.Aperture).DiameterM, type.RadiusM));
    }

    [Theory]
    // Rectangular sizes: Japanese road-mirror industry size table (domain notes §5); radii our pairing [memory, common practice].
    [InlineData("rectangular-450x600", 0.6, 0.45, 2.2)]
    [InlineData("rectangular-600x800", 0.8, 0.6, 3.0)]
    public void Find_RectangularId_ReturnsLandscapeSidesAndRadius(string id, double widthM, double heightM, double radiusM)
    {
        var type = MirrorTypes.Find(id)!;
        var face = (RectangularAperture)type.Aperture;
        Assert.Equal((widthM, heightM, radiusM), (face.WidthM, face.HeightM, type.RadiusM));
    }

    [Fact]
    public void Find_UnknownId_ReturnsNull() => Assert.Null(MirrorTypes.Find("round-1200"));

    [Theory]
    [InlineData(0.3)]
    [InlineData(0.29)]
    [InlineData(100.01)]
    [InlineData(2200)]
    public void Constructor_RadiusOutOfRange_ThrowsStatingTheRange(double radiusM)
    {
        var error = Assert.Throws<ArgumentOutOfRangeException>(() => new MirrorType("round-600", new RoundAperture(0.6), radiusM, "test"));
        Assert.Contains("greater than 0.3 m", error.Message, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData(0.31)]
    [InlineData(100)]
    public void Constructor_RadiusInRange_IsAccepted(double radiusM) =>
        Assert.Equal(radiusM, new MirrorType("round-600", new RoundAperture(0.6), radiusM, "test").RadiusM);

    [Theory]
    // Japanese road-mirror industry association material table (domain notes §5).
    [InlineData("acrylic", 0.85)]
    [InlineData("polycarbonate", 0.80)]
    [InlineData("strengthened-glass", 0.80)]
    [InlineData("stainless-steel", 0.60)]
    public void FaceMaterials_Find_ReturnsReflectance(string id, double reflectance) =>
        Assert.Equal(reflectance, FaceMaterials.Find(id)!.Reflectance);

    [Theory]
    [InlineData(-0.01)]
    [InlineData(1.01)]
    public void FaceMaterial_ReflectanceOutOfRange_ThrowsStatingTheRange(double reflectance)
    {
        var error = Assert.Throws<ArgumentOutOfRangeException>(() => new FaceMaterial("tin", "Tin", reflectance, "test"));
        Assert.Contains("from 0 to 1", error.Message, StringComparison.Ordinal);
    }
}
