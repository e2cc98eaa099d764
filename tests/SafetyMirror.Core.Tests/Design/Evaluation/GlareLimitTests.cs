using System.Text.Json;
using NetTopologySuite.Geometries;
using SafetyMirror.Core.Design.Evaluation;
using SafetyMirror.Core.Design.Glare;
using SafetyMirror.Core.Optics;
using SafetyMirror.Core.Site;
using SafetyMirror.Core.Tests.Design.Golden;

namespace SafetyMirror.Core.Tests.Design.Evaluation;

// The WGS84 demo corner is invented (openapi/examples); its mirror glares on late winter and autumn afternoons by the
// Core's own scan. These tests check how a glare limit joins the siting checks, not the sun's position.
public sealed class GlareLimitTests
{
    private static readonly (SitePlan Plan, MirrorEvaluation Evaluation, GlareScan Scan) Demo = Wgs84Demo();

    [Fact]
    public void WithGlareLimit_Exceeded_FailsTheCheckAndPutsTheMirrorOutsideTheRules()
    {
        var limited = Demo.Evaluation.WithGlareLimit(Demo.Scan, 0);

        var check = Assert.Single(limited.Checks, c => c.Code == GlareLimit.Code);
        Assert.Equal((false, Decision.OutsideSitingRules), (check.Passes, limited.Verdict.Decision));
    }

    [Fact]
    public void WithGlareLimit_Kept_PassesAndKeepsTheVerdict()
    {
        var limited = Demo.Evaluation.WithGlareLimit(Demo.Scan, 8784);

        Assert.True(Assert.Single(limited.Checks, c => c.Code == GlareLimit.Code).Passes);
        Assert.Equal(Demo.Evaluation.Verdict.Decision, limited.Verdict.Decision);
    }

    [Fact]
    public void WithGlareLimit_NoScan_LeavesTheEvaluationAsItWas()
    {
        var local = Demo.Scan with { NotComputedReason = GlareScanner.LocalPlanReason, Eyes = [] };

        Assert.Same(Demo.Evaluation, Demo.Evaluation.WithGlareLimit(local, 0));
    }

    private static (SitePlan, MirrorEvaluation, GlareScan) Wgs84Demo()
    {
        var plan = GoldenAnswersTests.ExamplePlan("demo-corner-wgs84.json");
        // The demo mirror (openapi/examples/demo-corner-wgs84.json) at its longitude/latitude, moved into the plan's metres.
        var local = plan.Frame.ToLocal(new Coordinate(9.930083308, 49.780067431));
        var placement = new MirrorPlacement(local.X, local.Y, 2.95, 231, 5, 3.0, new RoundAperture(0.8));
        var evaluation = MirrorEvaluator.Evaluate(plan, placement, new EvaluationOptions { StationSpacingM = 5 }).Evaluation!;
        return (plan, evaluation, GlareScanner.Scan(plan, placement.ToMirror(), new GlareScanOptions(2026)));
    }
}
