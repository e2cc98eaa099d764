using CsCheck;
using SafetyMirror.Core.Design;

namespace SafetyMirror.Core.Tests.Design;

public class StoppingSightDistanceTests
{
    private static readonly StoppingSightDistance Aashto = new();

    [Theory]
    // AASHTO Green Book 2011, Table 3-1, design stopping sight distance [memory]; also quoted in TxDOT Roadway Design Manual §4.11.1.
    [InlineData(20, 20)]
    [InlineData(30, 35)]
    [InlineData(40, 50)]
    [InlineData(50, 65)]
    [InlineData(60, 85)]
    [InlineData(70, 105)]
    [InlineData(80, 130)]
    [InlineData(90, 160)]
    [InlineData(100, 185)]
    public void Required_LevelGround_ReproducesDesignTable(double speedKmh, double designM) =>
        Assert.Equal(designM, Aashto.Required(speedKmh).DesignM);

    [Fact]
    public void Required_LevelGround_ComputesTheFormula()
    {
        // AASHTO Green Book 2011, Eq. 3-2 [memory], by hand: 0.278·90·2.5 + 0.039·90²/3.4 = 62.55 + 92.91 = 155.46 m.
        Assert.Equal(155.46, Aashto.Required(90).ComputedM, 0.01);
    }

    [Fact]
    public void Required_Downhill_IsLongerThanLevel() =>
        Assert.True(Aashto.Required(80, -6).ComputedM > Aashto.Required(80).ComputedM);

    [Fact]
    public void Required_Uphill_IsShorterThanLevel() =>
        Assert.True(Aashto.Required(80, 6).ComputedM < Aashto.Required(80).ComputedM);

    [Fact]
    public void Required_GradeFormNearZeroGrade_IsWithinOnePercentOfLevelForm()
    {
        // Domain notes §3: the grade form at G = 0 gives 154.6 m against 155.5 m at 90 km/h (about 0.6 % shorter).
        var level = Aashto.Required(90).ComputedM;
        var gradeForm = Aashto.Required(90, 1e-9).ComputedM;
        Assert.Equal(154.6, gradeForm, 0.1);
        Assert.InRange((level - gradeForm) / level, 0, 0.01);
    }

    [Fact]
    public void Required_OnGrade_ComputesTheGradeFormula()
    {
        // AASHTO Green Book 2011, Eq. 3-3 [memory], by hand: 0.278·100·2.5 + 100²/(254·(3.4/9.81 − 0.05)) = 69.5 + 132.7 = 202.2 m.
        Assert.Equal(202.2, Aashto.Required(100, -5).ComputedM, 0.1);
    }

    [Fact]
    public void Required_Any_DesignIsComputedRoundedUpToFiveMetres() =>
        Gen.Select(Gen.Double[5, 200], Gen.Double[-15, 15]).Sample((speed, grade) =>
        {
            var required = Aashto.Required(speed, grade);
            Assert.Equal(0, required.DesignM % 5);
            Assert.InRange(required.DesignM - required.ComputedM, -1e-6, 5);
        });

    [Fact]
    public void Required_Any_GrowsWithSpeed() =>
        Gen.Select(Gen.Double[5, 199], Gen.Double[-15, 15]).Sample((speed, grade) =>
            Assert.True(Aashto.Required(speed + 1, grade).ComputedM > Aashto.Required(speed, grade).ComputedM));

    [Fact]
    public void Required_Any_UsesAashtoEyeAndObjectHeights()
    {
        // AASHTO Green Book 2011, ch. 3: driver's eye 1.08 m, object 0.60 m for stopping sight distance [memory].
        var required = Aashto.Required(50);
        Assert.Equal((1.08, 0.60), (required.EyeHeightM, required.ObjectHeightM));
    }

    [Fact]
    public void Constructor_Defaults_AreAashtoReactionAndDeceleration() =>
        // AASHTO Green Book 2011, ch. 3: brake reaction 2.5 s, deceleration 3.4 m/s² (domain notes §3).
        Assert.Equal((2.5, 3.4), (Aashto.ReactionTimeS, Aashto.DecelerationMps2));

    [Fact]
    public void Required_LevelAndGrade_NameTheirFormula()
    {
        Assert.Contains("0.039", Aashto.Required(50).Formula, StringComparison.Ordinal);
        Assert.Contains("254", Aashto.Required(50, 2).Formula, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData(4.99, 0, "from 5 to 200 km/h")]
    [InlineData(200.01, 0, "from 5 to 200 km/h")]
    [InlineData(double.NaN, 0, "from 5 to 200 km/h")]
    [InlineData(50, -15.01, "from -15 to 15 %")]
    [InlineData(50, 15.01, "from -15 to 15 %")]
    public void Required_OutOfRange_ThrowsStatingTheRange(double speedKmh, double gradePercent, string range)
    {
        var error = Assert.Throws<ArgumentOutOfRangeException>(() => Aashto.Required(speedKmh, gradePercent));
        Assert.Contains(range, error.Message, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData(5, 0)]
    [InlineData(200, 0)]
    [InlineData(50, -15)]
    [InlineData(50, 15)]
    public void Required_AtTheBounds_IsAccepted(double speedKmh, double gradePercent) =>
        Assert.True(Aashto.Required(speedKmh, gradePercent).DesignM > 0);

    [Theory]
    [InlineData(0.49, 3.4, "from 0.5 to 5 s")]
    [InlineData(5.01, 3.4, "from 0.5 to 5 s")]
    [InlineData(2.5, 0.99, "from 1 to 9.81 m/s²")]
    [InlineData(2.5, 9.82, "from 1 to 9.81 m/s²")]
    public void Constructor_OutOfRange_ThrowsStatingTheRange(double reactionTimeS, double decelerationMps2, string range)
    {
        var error = Assert.Throws<ArgumentOutOfRangeException>(() => new StoppingSightDistance(reactionTimeS, decelerationMps2));
        Assert.Contains(range, error.Message, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData(0.5, 1)]
    [InlineData(5, 9.81)]
    public void Constructor_AtTheBounds_IsAccepted(double reactionTimeS, double decelerationMps2) =>
        Assert.Equal(reactionTimeS, new StoppingSightDistance(reactionTimeS, decelerationMps2).ReactionTimeS);

    [Fact]
    public void Required_DowngradeSteeperThanBrakingHolds_Throws()
    {
        // 1 m/s² holds a vehicle only on downgrades shallower than 100·1/9.81 = 10.19 %.
        var weakBrakes = new StoppingSightDistance(decelerationMps2: 1);
        var error = Assert.Throws<ArgumentOutOfRangeException>(() => weakBrakes.Required(50, -12));
        Assert.Contains("greater than -10.19 %", error.Message, StringComparison.Ordinal);
    }
}
