using SafetyMirror.Core.Design;
using SafetyMirror.Core.Design.Alternatives;
using SafetyMirror.Core.Design.Evaluation;
using SafetyMirror.Core.Site;
using SafetyMirror.Core.Tests.Design.Evaluation;
using SafetyMirror.Core.Tests.Design.Golden;

namespace SafetyMirror.Core.Tests.Design.Alternatives;

public class NoMirrorOptionsTests
{
    // An invented corner: the eye at (0, −3), the eastbound lane along y = 1.5 at 40 km/h, a 6 m house whose corner at
    // (−14.4, −1) ends the direct view, a 6 m street along y = 0 to 6. Hand computation: the sightline from the eye to the lane
    // point s metres west crosses y = −1 at x = −s·2/4.5, so the house hides every point beyond s = 14.4·4.5/2 = 32.4 m.
    private static readonly Obstacle House = new(Corners.Box(-30, -20, -14.4, -1), 6, new FeatureReference(3, "house", "Corner house"));

    private static SitePlan Corner(params Obstacle[] obstacles) => new(
        PlanFrame.LocalMetres,
        [new Eye(Corners.Eye, new FeatureReference(0, "driver"))],
        [Corners.FromWest(40)],
        obstacles,
        carriageways: [new Carriageway(Corners.Box(-120, 0, 120, 6), new FeatureReference(4, "street", "Street"))]);

    private static readonly EvaluationOptions Options = new();

    [Fact]
    public void For_HiddenApproach_StatesTheDirectViewAndItsBlocker()
    {
        var options = Assert.Single(NoMirrorOptions.For(Corner(House), Options));

        // Hand computation above: 32.4 m; AASHTO Green Book 2011, Table 3-1: 40 km/h needs 50 m.
        Assert.Equal(32.4, options.DirectM, 2);
        Assert.Equal(50, options.RequiredM);
        Assert.Equal("house", options.BlockedBy?.Id);
    }

    [Fact]
    public void Clearing_OnlyBlockerRemoved_DirectViewMeetsTheRequirement()
    {
        var clearing = NoMirrorOptions.Clearing(Corner(House), Corners.Eye, Corners.FromWest(40), Options);

        // With the house gone nothing blocks the 120 m lane: 120 m ≥ 50 m (AASHTO Green Book 2011, Table 3-1, 40 km/h).
        Assert.True(clearing.Meets);
        Assert.Equal("house", Assert.Single(clearing.Cleared).Id);
        Assert.Equal(120, clearing.DirectM, 2);
    }

    [Fact]
    public void Clearing_OnlyBlocker_MayKeepTheHeightTheSightlinePassesOver()
    {
        var clearing = NoMirrorOptions.Clearing(Corner(House), Corners.Eye, Corners.FromWest(40), Options);

        // Hand computation: the sightline from the 1.08 m eye to the 0.60 m object (AASHTO, domain brief §3) is lowest over the
        // house where it leaves it, at y = −1, 2/4.5 of the way: 1.08 − 0.48·2/4.5 = 0.8667 m, so 0.86 m to the centimetre below.
        Assert.Equal(0.86, clearing.LowerToM!.Value, 9);
    }

    [Fact]
    public void Forward_HiddenApproach_EyeMovesUntilTheViewReachesTheRequiredDistance()
    {
        var forward = NoMirrorOptions.Forward(Corner(House), Corners.Eye, Corners.FromWest(40), Options);

        // Hand computation: with the eye d metres forward (north), the house hides the lane beyond 14.4·(4.5 − d)/(2 − d);
        // that is 50 m (AASHTO Table 3-1, 40 km/h) at d = (50·2 − 14.4·4.5)/(50 − 14.4) = 0.9888 m: 0.99 m to the centimetre above.
        Assert.True(forward.Meets);
        Assert.Equal(0.99, forward.ForwardM!.Value, 9);
        Assert.Equal(3, forward.LimitM, 9);
        Assert.Equal(0, forward.BearingDeg, 9);
    }

    [Fact]
    public void Forward_PlanWithoutCarriageway_IsRuledOutWithItsReason()
    {
        var forward = NoMirrorOptions.Forward(Corners.Plan(Corners.FromWest(40), House), Corners.Eye, Corners.FromWest(40), Options);

        Assert.False(forward.Meets);
        Assert.Equal("the plan draws no carriageway edge to move toward", forward.Reason);
    }

    [Fact]
    public void LowerSpeed_HiddenApproach_MeetsAtTheFoundSpeed()
    {
        var lower = NoMirrorOptions.LowerSpeed(Corner(House), Corners.Eye, Corners.FromWest(40), Options);

        // AASHTO Green Book 2011 SSD, 0.278·V·2.5 + 0.039·V²/3.4 rounded up to 5 m (hand computation):
        // 29 km/h gives 29.80 m, so 30 m ≤ 32.4 m; 30 km/h gives 31.17 m, so 35 m > 32.4 m.
        Assert.Equal(29, lower.SpeedKmh);
        Assert.Equal(30, lower.RequiredM);
        Assert.True(new ApproachCheck(Corner(House), 29).DirectMeets);
    }

    [Fact]
    public void LowerSpeed_HiddenApproach_DoesNotMeetOneKmhAboveTheFoundSpeed()
    {
        var lower = NoMirrorOptions.LowerSpeed(Corner(House), Corners.Eye, Corners.FromWest(40), Options);

        Assert.False(new ApproachCheck(Corner(House), lower.SpeedKmh!.Value + 1).DirectMeets);
    }

    [Fact]
    public void LowerSpeed_DemoCorner_IsRuledOutEvenAtTheLowestSpeed()
    {
        var demo = GoldenAnswersTests.ExamplePlan("demo-report-local.json");

        var lower = NoMirrorOptions.LowerSpeed(demo, demo.Eyes[0].Position, demo.Approaches[0], Options);

        // The demo's eastbound direct view is 4.5 m (README); AASHTO SSD at 5 km/h, the method's lowest, is
        // 0.278·5·2.5 + 0.039·25/3.4 = 3.76 m, rounded up to 5 m > 4.5 m (hand computation).
        Assert.False(lower.Meets);
        Assert.Equal(5, lower.LowestTriedKmh);
        Assert.Equal(5, lower.RequiredM);
    }

    [Fact]
    public void For_DemoCorner_ClearingTheCornerHouseMeets()
    {
        var demo = GoldenAnswersTests.ExamplePlan("demo-report-local.json");

        var eastbound = Assert.Single(NoMirrorOptions.For(demo, Options));

        // The demo plan: the corner house (6 m) hides the eastbound lane; the hedge (0.8 m) stands east of the exit.
        Assert.Equal("corner-house", eastbound.BlockedBy?.Id);
        Assert.True(eastbound.Clearing.Meets);
        Assert.Equal("corner-house", Assert.Single(eastbound.Clearing.Cleared).Id);
        Assert.True(eastbound.Clearing.DirectM >= eastbound.RequiredM);
    }

    /// <summary>The evaluation's own direct-view judgement of the corner's lane at a given speed, through the public façade.</summary>
    private sealed record ApproachCheck(SitePlan Plan, double SpeedKmh)
    {
        public bool DirectMeets
        {
            get
            {
                var plan = new SitePlan(Plan.Frame, Plan.Eyes, [Corners.FromWest(SpeedKmh)], Plan.Obstacles, carriageways: Plan.Carriageways);
                var view = Assert.Single(MirrorEvaluator.DirectViews(plan, Options));
                return view.MeetsRequirement;
            }
        }
    }
}
