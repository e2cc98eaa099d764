using SafetyMirror.Core.Design;

namespace SafetyMirror.Core.Tests.Design;

public class VisionCriteriaTests
{
    [Fact]
    public void Default_Recognition_IsTenArcmin() =>
        // EU Directive 2006/126/EC, Annex III: 0.5 decimal acuity, a recognisable (5-detail) letter subtends 10 arcmin.
        Assert.Equal(10, VisionCriteria.Default.Recognition.AngleArcmin);

    [Fact]
    public void Default_Detection_IsThreeArcmin() =>
        // FMVSS 111, S9.4: at least 3 arcmin across the shortest dimension of the test object.
        Assert.Equal(3, VisionCriteria.Default.Detection.AngleArcmin);

    [Fact]
    public void Default_Sources_NameTheirRegulations()
    {
        Assert.Contains("2006/126/EC", VisionCriteria.Default.Recognition.Source, StringComparison.Ordinal);
        Assert.Contains("FMVSS 111", VisionCriteria.Default.Detection.Source, StringComparison.Ordinal);
    }

    [Fact]
    public void AngleRad_SixtyArcmin_IsOneDegree() =>
        // One degree is 60 arcmin and π/180 rad (SI Brochure, 9th ed., non-SI units accepted for use with the SI).
        Assert.Equal(Math.PI / 180, new VisualThreshold(60, "test").AngleRad, 1e-15);

    [Theory]
    [InlineData(0.09)]
    [InlineData(60.01)]
    [InlineData(double.NaN)]
    public void VisualThreshold_OutOfRange_ThrowsStatingTheRange(double arcmin)
    {
        var error = Assert.Throws<ArgumentOutOfRangeException>(() => new VisualThreshold(arcmin, "test"));
        Assert.Contains("from 0.1 to 60 arcmin", error.Message, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData(0.1)]
    [InlineData(60)]
    public void VisualThreshold_AtTheBounds_IsAccepted(double arcmin) =>
        Assert.Equal(arcmin, new VisualThreshold(arcmin, "test").AngleArcmin);

    [Fact]
    public void Constructor_DetectionAboveRecognition_Throws()
    {
        var error = Assert.Throws<ArgumentOutOfRangeException>(
            () => new VisionCriteria(new VisualThreshold(5, "test"), new VisualThreshold(6, "test")));
        Assert.Contains("from 0.1 to 5 arcmin", error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Constructor_DetectionEqualToRecognition_IsAccepted() =>
        Assert.Equal(5, new VisionCriteria(new VisualThreshold(5, "test"), new VisualThreshold(5, "test")).Detection.AngleArcmin);
}
