using SafetyMirror.Core.Design;

namespace SafetyMirror.Core.Tests.Design;

public class SitingRulesTests
{
    [Fact]
    public void Default_Values_FollowTheFrenchRule()
    {
        // France, IISR Art. 14: mounted above 2.30 m, stop line to mirror under 15 m, priority road at 50 km/h or less.
        var rules = SitingRules.Default;
        Assert.Equal((2.3, 15.0, 50.0), (rules.MinimumLowerEdgeClearanceM, rules.MaximumEyeToMirrorDistanceM, rules.CautionAboveSpeedKmh));
    }

    [Fact]
    public void Default_Source_NotesThePolishClearance() =>
        // Rozporządzenie Ministra Infrastruktury, 3 July 2003: at least 2.0 m.
        Assert.Contains("2.0 m", SitingRules.Default.Source, StringComparison.Ordinal);

    [Theory]
    [InlineData(-0.01, 15, 50, "from 0 to 6 m")]
    [InlineData(6.01, 15, 50, "from 0 to 6 m")]
    [InlineData(2.3, 0.99, 50, "from 1 to 100 m")]
    [InlineData(2.3, 100.01, 50, "from 1 to 100 m")]
    [InlineData(2.3, 15, 4.99, "from 5 to 200 km/h")]
    [InlineData(2.3, 15, 200.01, "from 5 to 200 km/h")]
    public void Constructor_OutOfRange_ThrowsStatingTheRange(double clearanceM, double eyeDistanceM, double speedKmh, string range)
    {
        var error = Assert.Throws<ArgumentOutOfRangeException>(() => new SitingRules(clearanceM, eyeDistanceM, speedKmh, "test"));
        Assert.Contains(range, error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Constructor_PolishClearance_IsAccepted() =>
        // Rozporządzenie Ministra Infrastruktury, 3 July 2003: at least 2.0 m.
        Assert.Equal(2.0, new SitingRules(2.0, 15, 50, "Poland, 3 July 2003").MinimumLowerEdgeClearanceM);
}
