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

    private static readonly StoppingSightDistance Customary = StoppingSightDistance.UsCustomary();

    [Theory]
    // AASHTO Green Book 2011, Table 3-1, US customary design stopping sight distance [memory]; each value checked by hand
    // against 1.47·V·2.5 + 1.075·V²/11.2 rounded up to the next 5 ft (35 mph: 128.6 + 117.6 = 246.2 ft → 250 ft).
    [InlineData(15, 80)]
    [InlineData(20, 115)]
    [InlineData(25, 155)]
    [InlineData(30, 200)]
    [InlineData(35, 250)]
    [InlineData(40, 305)]
    [InlineData(45, 360)]
    [InlineData(50, 425)]
    [InlineData(55, 495)]
    [InlineData(60, 570)]
    [InlineData(65, 645)]
    [InlineData(70, 730)]
    [InlineData(75, 820)]
    [InlineData(80, 910)]
    public void RequiredAtMph_UsCustomaryLevelGround_ReproducesDesignTable(double speedMph, double designFt) =>
        Assert.Equal(designFt, Customary.RequiredAtMph(speedMph).UsCustomary!.DesignFt);

    [Fact]
    public void RequiredAtMph_UsCustomaryLevelGround_ComputesTheFormula()
    {
        // AASHTO Green Book 2011, Eq. 3-2, US customary [memory], by hand: 1.47·35·2.5 + 1.075·35²/11.2 = 128.625 + 117.578 = 246.20 ft.
        Assert.Equal(246.20, Customary.RequiredAtMph(35).UsCustomary!.ComputedFt, 0.01);
    }

    [Theory]
    // AASHTO Green Book 2011, Table 3-2, US customary stopping sight distance on grades [memory], to the foot; the
    // formula 1.47·V·2.5 + V²/(30·(11.2/32.2 ± G)) is held within 1 ft of each (the table's own rounding is not known here).
    [InlineData(35, -3, 257)]
    [InlineData(35, -6, 271)]
    [InlineData(35, -9, 287)]
    [InlineData(35, 3, 237)]
    [InlineData(35, 6, 229)]
    [InlineData(35, 9, 222)]
    [InlineData(40, -6, 333)]
    [InlineData(50, -9, 507)]
    [InlineData(50, 6, 388)]
    [InlineData(60, -3, 598)]
    [InlineData(60, 9, 495)]
    [InlineData(80, -9, 1121)]
    [InlineData(80, 3, 859)]
    public void RequiredAtMph_UsCustomaryOnGrade_ReproducesGradeTable(double speedMph, double gradePercent, double tableFt) =>
        Assert.Equal(tableFt, Customary.RequiredAtMph(speedMph, gradePercent).UsCustomary!.ComputedFt, 1.0);

    [Fact]
    public void RequiredAtMph_UsCustomaryOnGrade_DesignIsRoundedUpToFiveFeet()
    {
        // 35 mph, 3 % downgrade: 257.1 ft computed (Table 3-2 [memory]: 257 ft), designed for 260 ft.
        var required = Customary.RequiredAtMph(35, -3);
        Assert.Equal((260.0, "Table 3-2"), (required.UsCustomary!.DesignFt, required.Table));
    }

    [Fact]
    public void RequiredAtMph_UsCustomary_DesignMetresAreTheFeetConvertedExactly()
    {
        // 1 ft = 0.3048 m exactly (international yard and pound agreement, 1959): 250 ft = 76.2 m.
        var required = Customary.RequiredAtMph(35);
        Assert.Equal(76.2, required.DesignM, 1e-12);
        Assert.Equal("250 ft", required.DesignText);
    }

    [Fact]
    public void RequiredAtMph_UsCustomary_SaysWhichSystemFormulaAndTableGaveIt()
    {
        var required = Customary.RequiredAtMph(35);
        Assert.Equal((DesignUnits.UsCustomary, "1.47·V·t + 1.075·V²/a", "Table 3-1"), (required.Units, required.Formula, required.Table));
        Assert.Contains("US customary", required.Method.Source, StringComparison.Ordinal);
    }

    [Fact]
    public void Required_Metric_HasNoUsCustomaryFigures()
    {
        var required = Aashto.Required(50);
        Assert.Equal((DesignUnits.Metric, (UsCustomaryFigures?)null, "65 m"), (required.Units, required.UsCustomary, required.DesignText));
    }

    [Fact]
    public void Required_UsCustomaryAtKmh_UsesTheSpeedConvertedToMph()
    {
        // 56.32704 km/h is 35 mph exactly (1 mile = 1.609344 km).
        Assert.Equal(250, Customary.Required(56.32704).UsCustomary!.DesignFt);
    }

    [Fact]
    public void UsCustomary_Defaults_AreAashtoReactionAndDeceleration() =>
        // AASHTO Green Book 2011, ch. 3, US customary: brake reaction 2.5 s, deceleration 11.2 ft/s² [memory].
        Assert.Equal((2.5, 11.2), (Customary.ReactionTimeS, Customary.DecelerationFtps2));

    [Fact]
    public void Required_UsCustomary_UsesCustomaryEyeAndObjectHeights()
    {
        // AASHTO Green Book 2011, ch. 3, US customary: driver's eye 3.5 ft, object 2.0 ft [memory]; 1 ft = 0.3048 m.
        var required = Customary.RequiredAtMph(35);
        Assert.Equal(1.0668, required.EyeHeightM, 1e-12);
        Assert.Equal(0.6096, required.ObjectHeightM, 1e-12);
    }

    [Theory]
    [InlineData(3.29, "from 3.3 to 32.2 ft/s²")]
    [InlineData(32.21, "from 3.3 to 32.2 ft/s²")]
    public void UsCustomary_DecelerationOutOfRange_ThrowsStatingTheRange(double decelerationFtps2, string range)
    {
        var error = Assert.Throws<ArgumentOutOfRangeException>(() => StoppingSightDistance.UsCustomary(decelerationFtps2: decelerationFtps2));
        Assert.Contains(range, error.Message, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData(2.99)]
    [InlineData(125.01)]
    public void RequiredAtMph_OutOfRange_ThrowsStatingTheRange(double speedMph)
    {
        var error = Assert.Throws<ArgumentOutOfRangeException>(() => Customary.RequiredAtMph(speedMph));
        Assert.Contains("from 3 to 125 mph", error.Message, StringComparison.Ordinal);
    }
}
