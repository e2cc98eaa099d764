using SafetyMirror.Core.Design;

namespace SafetyMirror.Core.Tests.Design;

public class BackingBoardRuleTests
{
    [Fact]
    public void FranceIisr_Board_IsOneAndAHalfDiametersWithStripes()
    {
        // France, IISR Art. 14 (amended 1981): square backing board 1.5 × the diameter with 5 cm black and white stripes (domain brief §6).
        var board = BackingBoardRule.FranceIisr;

        Assert.Equal(1.5, board.SideOverDiameter);
        Assert.Equal("5 cm black and white stripes", board.Pattern);
        Assert.Contains("IISR Art. 14", board.Source, StringComparison.Ordinal);
    }

    [Fact]
    public void Default_Rules_AskNoBackingBoard()
    {
        // The service's defaults (domain brief §6) are the clearance, the stop-line distance and the speed; no board among them.
        Assert.Null(SitingRules.Default.BackingBoard);
    }

    [Fact]
    public void Constructor_WithABoard_KeepsIt()
    {
        var rules = new SitingRules(2.3, 15, 50, "France, IISR Art. 14", backingBoard: BackingBoardRule.FranceIisr);

        Assert.Same(BackingBoardRule.FranceIisr, rules.BackingBoard);
    }
}
