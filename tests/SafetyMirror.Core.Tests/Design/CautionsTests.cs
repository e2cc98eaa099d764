using SafetyMirror.Core.Design;

namespace SafetyMirror.Core.Tests.Design;

public class CautionsTests
{
    private static readonly RoadUser[] CarOnly = [RoadUsers.PassengerCar];

    // Domain notes §7, the cautions every result carries.
    public static TheoryData<string> GeneralCodes { get; } =
    [
        "last-resort", "looks-smaller-farther-slower", "left-right-reversed", "blind-zones", "pedestrians-and-cyclists",
        "needs-inspection", "drivers-may-over-rely", "local-rules-govern", "not-an-approval",
    ];

    [Fact]
    public void For_FastApproach_WarnsWithBothSpeeds()
    {
        // France, IISR Art. 14: priority road at 50 km/h or less.
        var speed = Assert.Single(Cautions.For(60, SitingRules.Default, CarOnly), caution => caution.Code == "speed-above-limit");
        Assert.Contains("60 km/h is above 50 km/h", speed.Text, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData(30)]
    [InlineData(50)]
    public void For_ApproachAtOrBelowRuleSpeed_HasNoSpeedCaution(double speedKmh) =>
        Assert.DoesNotContain(Cautions.For(speedKmh, SitingRules.Default, CarOnly), caution => caution.Code == "speed-above-limit");

    [Theory]
    [MemberData(nameof(GeneralCodes))]
    public void For_SlowApproach_CarriesEveryGeneralCaution(string code) =>
        Assert.Contains(Cautions.For(30, SitingRules.Default, CarOnly), caution => caution.Code == code);

    [Theory]
    [MemberData(nameof(GeneralCodes))]
    public void For_FastApproach_CarriesEveryGeneralCaution(string code) =>
        Assert.Contains(Cautions.For(90, SitingRules.Default, CarOnly), caution => caution.Code == code);

    [Fact]
    public void For_Any_CodesAreUnique()
    {
        var codes = Cautions.For(90, SitingRules.Default, CarOnly).Select(caution => caution.Code).ToList();
        Assert.Equal(codes.Count, codes.Distinct().Count());
    }

    [Fact]
    public void For_NoVulnerableUserChecked_SaysNoneWasChecked()
    {
        var caution = Cautions.For(30, SitingRules.Default, CarOnly).Single(caution => caution.Code == "pedestrians-and-cyclists");
        Assert.Contains("none was among the road users checked", caution.Text, StringComparison.Ordinal);
    }

    [Fact]
    public void For_CyclistChecked_NamesItInTheCaution()
    {
        var caution = Cautions.For(30, SitingRules.Default, [RoadUsers.PassengerCar, RoadUsers.Bicycle])
            .Single(caution => caution.Code == "pedestrians-and-cyclists");
        Assert.Contains("size check (here: Bicycle with rider) assumes", caution.Text, StringComparison.Ordinal);
    }

    [Fact]
    public void For_CustomRules_StatesTheValuesUsed()
    {
        // Rozporządzenie Ministra Infrastruktury, 3 July 2003: at least 2.0 m.
        var polish = new SitingRules(2.0, 15, 50, "Poland, Rozporządzenie Ministra Infrastruktury, 3 July 2003");
        var caution = Cautions.For(30, polish, CarOnly).Single(caution => caution.Code == "local-rules-govern");
        Assert.Contains("at least 2 m above footway", caution.Text, StringComparison.Ordinal);
    }

    [Fact]
    public void For_RaisedRuleSpeed_MovesTheSpeedCaution() =>
        Assert.DoesNotContain(
            Cautions.For(60, new SitingRules(2.3, 15, 70, "Brookvale roads policy"), CarOnly),
            caution => caution.Code == "speed-above-limit");

    [Fact]
    public void For_SpeedOutOfRange_ThrowsStatingTheRange()
    {
        var error = Assert.Throws<ArgumentOutOfRangeException>(() => Cautions.For(0, SitingRules.Default, CarOnly));
        Assert.Contains("from 5 to 200 km/h", error.Message, StringComparison.Ordinal);
    }
}
