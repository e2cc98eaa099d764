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
    public void For_Any_HasNoSpeedCaution_BecauseTheSpeedIsASitingCheck() =>
        Assert.DoesNotContain(Cautions.For(SitingRules.Default, CarOnly), caution => caution.Code == "speed-above-limit");

    [Theory]
    [MemberData(nameof(GeneralCodes))]
    public void For_Any_CarriesEveryGeneralCaution(string code) =>
        Assert.Contains(Cautions.For(SitingRules.Default, CarOnly), caution => caution.Code == code);

    [Fact]
    public void For_Any_CodesAreUnique()
    {
        var codes = Cautions.For(SitingRules.Default, CarOnly).Select(caution => caution.Code).ToList();
        Assert.Equal(codes.Count, codes.Distinct().Count());
    }

    [Fact]
    public void For_NoVulnerableUserChecked_SaysNoneWasChecked()
    {
        var caution = Cautions.For(SitingRules.Default, CarOnly).Single(caution => caution.Code == "pedestrians-and-cyclists");
        Assert.Contains("none was among the road users checked", caution.Text, StringComparison.Ordinal);
    }

    [Fact]
    public void For_CyclistChecked_NamesItInTheCaution()
    {
        var caution = Cautions.For(SitingRules.Default, [RoadUsers.PassengerCar, RoadUsers.Bicycle])
            .Single(caution => caution.Code == "pedestrians-and-cyclists");
        Assert.Contains("size check (here: Bicycle with rider) assumes", caution.Text, StringComparison.Ordinal);
    }

    [Fact]
    public void For_CustomRules_StatesTheValuesUsed()
    {
        // Rozporządzenie Ministra Infrastruktury, 3 July 2003: at least 2.0 m.
        var polish = new SitingRules(2.0, 15, 50, "Poland, Rozporządzenie Ministra Infrastruktury, 3 July 2003");
        var caution = Cautions.For(polish, CarOnly).Single(caution => caution.Code == "local-rules-govern");
        Assert.Contains("at least 2 m above footway", caution.Text, StringComparison.Ordinal);
    }

    [Fact]
    public void For_RaisedRuleSpeed_MovesTheSpeedCaution() =>
        Assert.DoesNotContain(
            Cautions.For(new SitingRules(2.3, 15, 70, "Brookvale roads policy"), CarOnly),
            caution => caution.Code == "speed-above-limit");
}
