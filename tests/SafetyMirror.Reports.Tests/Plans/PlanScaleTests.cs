using SafetyMirror.Reports.Plans;

namespace SafetyMirror.Reports.Tests.Plans;

public sealed class PlanScaleTests
{
    [Fact]
    public void Denominators_FollowTheDraftingSeries()
    {
        // 1:50, 1:100, 1:200, 1:500, 1:1000 are ISO 5455 scales [memory]; 1:250 and 1:2500 are common practice for site plans.
        Assert.Equal([50, 100, 200, 250, 500, 1000, 2000, 2500, 5000], PlanScale.Denominators().Take(9));
    }

    [Theory]
    // Extent (m) and box (mm) chosen by hand: the expected scale fits, the next larger one does not.
    [InlineData(20, 10, 113, 98, 200)]   // 1:200 -> 100 mm wide; 1:100 would need 200 mm
    [InlineData(25, 10, 113, 98, 250)]   // 1:200 -> 125 mm (too wide); 1:250 -> 100 mm
    [InlineData(50, 29, 113, 98, 500)]   // 1:250 -> 200 mm; 1:500 -> 100 mm
    [InlineData(80, 29, 113, 98, 1000)]  // 1:500 -> 160 mm; 1:1000 -> 80 mm
    [InlineData(10, 60, 113, 98, 1000)]  // the height decides: 1:500 -> 120 mm tall; 1:1000 -> 60 mm
    [InlineData(100, 10, 95, 98, 2000)]  // 1:1000 -> 100 mm (too wide by 5); 1:2000 -> 50 mm
    [InlineData(0, 0, 113, 98, 50)]      // a single point gets the largest scale
    public void Choose_Extent_PicksTheLargestRoundScaleThatFits(double widthM, double heightM, double boxWidthMm, double boxHeightMm, int expected)
    {
        Assert.Equal(expected, PlanScale.Choose(widthM, heightM, boxWidthMm, boxHeightMm));
    }

    [Fact]
    public void Choose_ExactFit_KeepsTheScale()
    {
        // 20 m at 1:200 is exactly 100 mm.
        Assert.Equal(200, PlanScale.Choose(20, 5, 100, 100));
    }

    [Fact]
    public void Choose_NegativeExtent_IsRefused()
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => PlanScale.Choose(-1, 5, 100, 100));
    }
}
