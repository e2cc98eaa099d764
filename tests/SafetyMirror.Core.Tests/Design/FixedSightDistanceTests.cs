using SafetyMirror.Core.Design;

namespace SafetyMirror.Core.Tests.Design;

public class FixedSightDistanceTests
{
    [Fact]
    public void Required_Any_IsTheCodeDistanceUnrounded()
    {
        // Invented local code value: the code's figure is used as given.
        var required = new FixedSightDistance(72.5, "Brookvale roads policy 4.2").Required(40);
        Assert.Equal((72.5, 72.5), (required.ComputedM, required.DesignM));
    }

    [Fact]
    public void Source_Any_IsTheReference() =>
        Assert.Equal("Brookvale roads policy 4.2", new FixedSightDistance(70, "Brookvale roads policy 4.2").Source);

    [Theory]
    [InlineData(0.99)]
    [InlineData(2000.01)]
    [InlineData(double.PositiveInfinity)]
    public void Constructor_DistanceOutOfRange_ThrowsStatingTheRange(double distanceM)
    {
        var error = Assert.Throws<ArgumentOutOfRangeException>(() => new FixedSightDistance(distanceM, "code"));
        Assert.Contains("from 1 to 2000 m", error.Message, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData(1)]
    [InlineData(2000)]
    public void Constructor_DistanceAtTheBounds_IsAccepted(double distanceM) =>
        Assert.Equal(distanceM, new FixedSightDistance(distanceM, "code").DistanceM);

    [Fact]
    public void Constructor_BlankReference_Throws() =>
        Assert.Throws<ArgumentException>(() => new FixedSightDistance(50, " "));

    [Fact]
    public void Required_SpeedOutOfRange_Throws() =>
        Assert.Throws<ArgumentOutOfRangeException>(() => new FixedSightDistance(50, "code").Required(250));

    [Fact]
    public void Required_CodeHeights_AreCarriedToTheResult()
    {
        // Invented local code setting its own eye and object heights.
        var required = new FixedSightDistance(45, "Brookvale roads policy 4.2", eyeHeightM: 1.05, objectHeightM: 0.26).Required(30);
        Assert.Equal((1.05, 0.26), (required.EyeHeightM, required.ObjectHeightM));
    }

    [Theory]
    [InlineData(-0.01, 0.6)]
    [InlineData(1.08, 5.01)]
    public void Constructor_HeightOutOfRange_ThrowsStatingTheRange(double eyeHeightM, double objectHeightM)
    {
        var error = Assert.Throws<ArgumentOutOfRangeException>(() => new FixedSightDistance(50, "code", eyeHeightM, objectHeightM));
        Assert.Contains("from 0 to 5 m", error.Message, StringComparison.Ordinal);
    }
}
