using SafetyMirror.Core.Design;
using SafetyMirror.Core.Design.Evaluation;
using SafetyMirror.Core.Design.Installation;
using SafetyMirror.Reports.Documents;
using SafetyMirror.Reports.Justification;
using static System.FormattableString;

namespace SafetyMirror.Reports.Tests.Justification;

// The installation and check sheet and the alternatives considered, read back from the PDF by poppler's pdftotext. The invented
// corner is the demo corner's geometry: eye (0, −3), eastbound lane along y = 1.5, corner house to (−2, −1), hedge (2–2.8, −12 to −1),
// carriageway y = 0 to 6, the 800 mm mirror at (6, 7.5).
public sealed class JustificationReportSheetTests(JustificationReportTests.Rendered rendered) : IClassFixture<JustificationReportTests.Rendered>
{
    [Fact]
    public void ToPdf_Evaluation_TiesThePoleSquareToTheKerb()
    {
        // Hand computation: the pole at y = 7.5 stands 1.5 m north of the carriageway's edge y = 6.
        Assert.Contains("1.50 m north of the nearest edge of Tanner Row (the kerb line), measured square to the edge", rendered.Evaluation, StringComparison.Ordinal);
    }

    [Fact]
    public void ToPdf_Evaluation_TiesThePoleToTheNearestObstacleCorner()
    {
        // Hand computation: from the hedge's corner (2.8, −1) to the pole (6, 7.5) is (3.2, 8.5): √82.49 = 9.08 m, bearing atan2(3.2, 8.5) = 20.6°.
        Assert.Contains("9.08 m on a bearing of 20.6° (north) from the corner of Low hedge of No. 1 at x 2.80 m, y -1.00 m", rendered.Evaluation, StringComparison.Ordinal);
    }

    [Fact]
    public void ToPdf_Evaluation_GivesTheAimCheckTargetAndItsStretchWithinTheTolerance()
    {
        // The figures are the Core's CheckTargets, whose target is checked against the law of reflection in its own tests.
        var check = CheckTargets.For(InventedCorner.Mirror, InventedCorner.Plan().Eyes[0].Position, InventedCorner.Plan().Approaches[0], 2);
        var (from, to) = check.AzimuthStretchM;

        var row = Between(rendered.Evaluation, "Aim check, mirror M1", "Stand at the driver's eye point");

        Assert.Contains("Hold a 1.30 m pole", row, StringComparison.Ordinal);
        Assert.Contains(Invariant($"{check.Target.StationM:0.#} m upstream of"), row, StringComparison.Ordinal);
        Assert.Contains("Its top 0.10 m below the", row, StringComparison.Ordinal);
        Assert.Contains(Invariant($"{from:0.#}–{to:0.#} m"), row, StringComparison.Ordinal);
    }

    [Fact]
    public void ToPdf_Evaluation_HasAnEmptyInspectionRecord()
    {
        var record = Between(rendered.Evaluation, "Inspection record", "Siting checks");

        Assert.All(["Date", "Cleaned", "Aim checked (target", "at centre)", "Damage or defects", "Initials"], column => Assert.Contains(column, record, StringComparison.Ordinal));
    }

    [Fact]
    public void ToPdf_Evaluation_SaysTheRuleSetAsksForNoBackingBoard()
    {
        Assert.Contains("As the local rule set requires: the siting values used here set no backing board", rendered.Evaluation, StringComparison.Ordinal);
    }

    [Fact]
    public void ToPdf_RulesWithABackingBoard_StateItsSizeAndSource()
    {
        // France, IISR Art. 14 (amended 1981): square backing board 1.5 × the diameter with 5 cm black and white stripes (domain brief §6);
        // for the 800 mm face, 1200 mm a side.
        var rules = new SitingRules(2.3, 15, 50, "France, IISR Art. 14", backingBoard: BackingBoardRule.FranceIisr);
        var evaluation = MirrorEvaluator.Evaluate(InventedCorner.Plan(), InventedCorner.Mirror, new EvaluationOptions { Rules = rules }).Evaluation!;

        var text = Poppler.Flow(rendered.Write(JustificationReport.ForEvaluation(InventedCorner.Plan(), evaluation, InventedCorner.Header()).ToPdf(PaperSize.A4), "board.pdf"));

        var row = Between(text, "Backing board", "Aim check");
        Assert.All(["Square, 1200 mm a side (1.5 × the", "diameter), 5 cm black and white", "stripes (France, IISR Art. 14"], part => Assert.Contains(part, row, StringComparison.Ordinal));
    }

    [Fact]
    public void ToPdf_Evaluation_NamesWhatEndsTheDirectView()
    {
        // README: the demo's eastbound direct view is 4.5 m; AASHTO Green Book 2011, Table 3-1: 30 km/h needs 35 m.
        Assert.Contains("Tanner Row eastbound (A): direct view 4.5 m of 35 m required, ended by No. 2 Tanner Row (corner house)", rendered.Evaluation, StringComparison.Ordinal);
    }

    [Fact]
    public void ToPdf_Evaluation_ClearingTheHouseMeetsWithItsFigures()
    {
        // Hand computation: with the house gone the 120 m lane is open; the sightline from the 1.08 m eye to the 0.60 m object
        // (AASHTO) is lowest over the house where it leaves it at y = −1, 2/4.5 of the way: 1.08 − 0.48·2/4.5 = 0.867 m.
        var row = Between(rendered.Evaluation, "Clear the obstruction", "Move the stop line");

        Assert.All(["Remove No. 2 Tanner Row", "or lower it to 0.86 m or less", "120 m", "35 m", "Meets"], figure => Assert.Contains(figure, row, StringComparison.Ordinal));
    }

    [Fact]
    public void ToPdf_Evaluation_MovingTheEyeForwardMeetsWithItsFigures()
    {
        // Hand computation: with the eye d forward (north) the house hides the lane beyond 2·(4.5 − d)/(2 − d), which is 35 m
        // (AASHTO Table 3-1, 30 km/h) at d = 61/33 = 1.848 m, so 1.85 m; there the view reaches 2·2.65/0.15 = 35.3 m, 1.15 m from the edge.
        var row = Between(rendered.Evaluation, "Move the stop line", "Lower the approach speed");

        Assert.All(["The driver's eye 1.85 m forward", "1.15 m short of", "35.3 m", "35 m", "Meets, eye"], figure => Assert.Contains(figure, row, StringComparison.Ordinal));
    }

    [Fact]
    public void ToPdf_Evaluation_LoweringTheSpeedIsRuledOutWithItsFigures()
    {
        // AASHTO SSD at 5 km/h: 0.278·5·2.5 + 0.039·25/3.4 = 3.76 m, rounded up to 5 m, more than the 4.5 m direct view (hand computation).
        var row = Between(rendered.Evaluation, "Lower the approach speed", "A measure marked");

        Assert.All(["No speed down to 5 km/h", "4.5 m", "5 m at 5", "Ruled out"], figure => Assert.Contains(figure, row, StringComparison.Ordinal));
    }

    [Fact]
    public void ToPdf_Recommendation_ListsTheMirrorDesignsAfterTheNoMirrorMeasures()
    {
        var withoutMirror = rendered.Recommendation.IndexOf("Without a mirror", StringComparison.Ordinal);
        var designs = rendered.Recommendation.IndexOf("Mirror designs", StringComparison.Ordinal);

        Assert.InRange(withoutMirror, 0, designs);
        Assert.Contains("Robustness to aim error", rendered.Recommendation[designs..], StringComparison.Ordinal);
    }

    /// <summary>The text from the first occurrence of one heading or row label to the next occurrence of another after it.</summary>
    private static string Between(string text, string from, string to)
    {
        var start = text.IndexOf(from, StringComparison.Ordinal);
        Assert.True(start >= 0, $"'{from}' not found");
        var end = text.IndexOf(to, start, StringComparison.Ordinal);
        return end < 0 ? text[start..] : text[start..end];
    }
}
