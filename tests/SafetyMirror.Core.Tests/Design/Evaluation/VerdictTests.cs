using NetTopologySuite.Geometries;
using SafetyMirror.Core.Design;
using SafetyMirror.Core.Design.Evaluation;
using SafetyMirror.Core.Optics;
using SafetyMirror.Core.Site;

namespace SafetyMirror.Core.Tests.Design.Evaluation;

/// <summary>The honest verdict: no unseen stretch, recognisable at the required distance, robust to aim, inside the siting rules.</summary>
public class VerdictTests
{
    private static readonly GeometryFactory Factory = new();
    private static readonly EvaluationOptions Options = new();

    /// <summary>An 800 mm mirror (R 3.0 m) aimed so that, with the corner house, it meets every part of the verdict.</summary>
    private static MirrorPlacement Meeting() => new(6, 7.5, 2.95, 231, 5, 3.0, new RoundAperture(0.8));

    private static MirrorEvaluation Evaluate(MirrorPlacement placement, EvaluationOptions? options = null, params SiteFeature[] extra) =>
        MirrorEvaluator.Evaluate(Corners.Plan([Corners.FromWest(), Corners.WestBuilding(), .. extra]), placement, options ?? Options).Evaluation!;

    /// <summary>A post 8 m tall whose plan is a square of the given side, centred on the line from the mirror to station 17.5.</summary>
    private static Obstacle PostBetweenStations(double sideM)
    {
        // Halfway from the mirror (6, 7.5) to the eastbound lane at station 17.5, (−17.5, 1.5): between two reported stations.
        var (x, y) = (-5.75, 4.5);
        return new Obstacle(Corners.Box(x - (sideM / 2), y - (sideM / 2), x + (sideM / 2), y + (sideM / 2)), 8, new FeatureReference(5, "post"));
    }

    /// <summary>The stretch of the lane whose light path to the eye an obstacle cuts, by NetTopologySuite at 1 mm steps.</summary>
    /// <remarks>An independent model of the blocking: plain 2-D segment intersection from each car centre's reflection point,
    /// no sampling, event stations or bisection of ours.</remarks>
    private static double ShadowLengthM(Obstacle obstacle, ConvexMirror mirror, Approach approach)
    {
        var hidden = 0;
        for (var mm = 0; mm <= (int)(approach.LengthM * 1000); mm++)
        {
            var p = approach.PointAtStation(mm / 1000.0).Position;
            var at = mirror.Reflect(Corners.Eye, p with { Z = RoadUsers.PassengerCar.HeightM / 2 }).Point;
            var leg = Factory.CreateLineString([new Coordinate(at.X, at.Y), new Coordinate(p.X, p.Y)]);
            hidden += leg.Intersects(obstacle.Footprint) ? 1 : 0;
        }

        return hidden / 1000.0;
    }

    [Fact]
    public void Evaluate_AimedToMeetEverything_MeetsTheRequirement()
    {
        var evaluation = Evaluate(Meeting());

        Assert.Equal(Decision.MeetsRequirement, evaluation.Verdict.Decision);
        Assert.Null(evaluation.Approaches[0].Summary.LongestUnseen);
        Assert.True(evaluation.Robustness.Holds);
        Assert.Equal([RoadUsers.PassengerCar], evaluation.Verdict.Covered);
        Assert.Contains("for a passenger car", evaluation.Verdict.Sentence, StringComparison.Ordinal);
    }

    [Fact]
    public void Evaluate_ThinPostBetweenTwoStations_LeavesAMetreUnseenAndFails()
    {
        // Side 0.094 m: its shadow on the lane, measured independently below, is about 1 m, between stations 15 and 25.
        var post = PostBetweenStations(0.094);
        var evaluation = Evaluate(Meeting(), extra: post);
        var summary = evaluation.Approaches[0].Summary;
        var shadow = ShadowLengthM(post, Meeting().ToMirror(), Corners.FromWest());

        Assert.InRange(shadow, 0.8, 1.2);
        var gap = summary.LongestUnseen!;
        Assert.Equal(shadow, gap.LengthM, 0.012); // ends are located to 5 mm each
        Assert.InRange(gap.FromM, 15, 25);

        // Every reported station (every 5 m) still shows the car; only the located stretches see the post.
        Assert.All(evaluation.Approaches[0].Stations.Where(v => v.RoadUser == RoadUsers.PassengerCar && v.StationM is >= 10 and <= 35), v => Assert.True(v.Shown));
        Assert.Equal(Decision.DoesNotMeet, evaluation.Verdict.Decision);
    }

    [Fact]
    public void Evaluate_ThinPostCloseToTheMirror_IsFoundFromWhereverOnTheFaceThePathLeaves()
    {
        // A 6 cm post 1.2 m from the face: its shadow, cast from the reflection points (up to 0.4 m off the vertex), falls
        // metres away from where it falls from the vertex. An independent 1 mm scan measures about 1.1 m hidden.
        var post = new Obstacle(Corners.Box(4.95, 6.83, 5.01, 6.89), 8, new FeatureReference(5, "post"));
        var shadow = ShadowLengthM(post, Meeting().ToMirror(), Corners.FromWest());
        var evaluation = Evaluate(Meeting(), extra: post);

        Assert.InRange(shadow, 0.8, 1.5);
        Assert.Equal(shadow, evaluation.Approaches[0].Summary.LongestUnseen!.LengthM, 0.02);
        Assert.Equal(Decision.DoesNotMeet, evaluation.Verdict.Decision);
    }

    [Fact]
    public void Evaluate_AnyStationSpacing_GivesTheSameVerdictOnALaneThatBends()
    {
        // A lane that jinks round a parked trailer: where it turns, a car is seen end-on and its apparent width jumps.
        var kinked = new Approach(Corners.Line((-120, 1.5), (-10.8, 1.5), (-10, -0.5), (-9.2, 1.5), (0, 1.5)), 30, 0, new FeatureReference(1, "kinked"));
        var plan = Corners.Plan(kinked, Corners.WestBuilding());
        var verdicts = new[] { 0.5, 5, 20 }
            .Select(spacing => MirrorEvaluator.Evaluate(plan, Meeting(), Options with { StationSpacingM = spacing }).Evaluation!)
            .ToList();

        Assert.All(verdicts, v => Assert.Equal(verdicts[0].Verdict.Decision, v.Verdict.Decision));
        Assert.All(verdicts, v => Assert.Equal(verdicts[0].Approaches[0].Summary.LongestUnseen?.LengthM, v.Approaches[0].Summary.LongestUnseen?.LengthM));
    }

    [Fact]
    public void Evaluate_PostWhoseShadowIsFourCentimetres_CountsAsNoGap()
    {
        // A gap up to 5 cm counts as none (the service's own rule; common practice, no published source).
        var post = PostBetweenStations(0.0037);
        var shadow = ShadowLengthM(post, Meeting().ToMirror(), Corners.FromWest());
        var evaluation = Evaluate(Meeting(), extra: post);

        Assert.InRange(shadow, 0.02, 0.045);
        Assert.Null(evaluation.Approaches[0].Summary.LongestUnseen);
        Assert.Equal(Decision.MeetsRequirement, evaluation.Verdict.Decision);
    }

    [Fact]
    public void Evaluate_UnseenStretchAllowed_PassesAGapWithinTheAllowance()
    {
        var post = PostBetweenStations(0.094);
        var evaluation = Evaluate(Meeting(), Options with { MaxUnseenStretchM = 2 }, post);

        Assert.NotNull(evaluation.Approaches[0].Summary.LongestUnseen);
        Assert.True(evaluation.Approaches[0].Summary.MeetsRequirement, evaluation.Verdict.Sentence);
        Assert.Equal(Decision.MeetsRequirement, evaluation.Verdict.Decision);
    }

    [Fact]
    public void Evaluate_BicycleDecisive_NamesItAndFails()
    {
        var evaluation = Evaluate(Meeting(), Options with { DecisiveRoadUsers = [RoadUsers.PassengerCar, RoadUsers.Bicycle] });

        Assert.Equal(Decision.DoesNotMeet, evaluation.Verdict.Decision);
        Assert.Contains("for a passenger car and a bicycle with rider", evaluation.Verdict.Sentence, StringComparison.Ordinal);
    }

    [Fact]
    public void Evaluate_BicycleNotDecisive_IsNamedAsNotCovered()
    {
        var evaluation = Evaluate(Meeting());

        Assert.Equal([RoadUsers.Bicycle], evaluation.Verdict.NotCovered);
        Assert.Contains("bicycle with rider", evaluation.Verdict.Sentence, StringComparison.Ordinal);
        Assert.Contains("not covered", evaluation.Verdict.Sentence, StringComparison.Ordinal);
    }

    [Fact]
    public void Evaluate_Robustness_TriesTheAimAsSetAndFourOffByTheTolerance()
    {
        var evaluation = Evaluate(Meeting(), Options with { AimToleranceDeg = 1.5 });

        Assert.Equal([(0.0, 0.0), (1.5, 0.0), (-1.5, 0.0), (0.0, 1.5), (0.0, -1.5)],
            evaluation.Robustness.Cases.Select(c => (c.AzimuthOffsetDeg, c.TiltOffsetDeg)));
        Assert.All(evaluation.Robustness.Cases, c => Assert.True(c.Meets));
        Assert.Equal(evaluation.Robustness.Cases.Min(c => c.Margin), evaluation.Robustness.Worst.Margin);
    }

    [Fact]
    public void Evaluate_AimOffCaseFails_TheVerdictFailsThoughTheAimAsSetMeets()
    {
        // Off by 10°, the far end of the lane leaves the face: the aim as set meets, the verdict does not.
        var evaluation = Evaluate(Meeting(), Options with { AimToleranceDeg = 10 });

        Assert.True(evaluation.Robustness.Cases[0].Meets);
        Assert.False(evaluation.Robustness.Holds);
        Assert.Equal(Decision.DoesNotMeet, evaluation.Verdict.Decision);
    }

    [Fact]
    public void Evaluate_ProvidedSightDistance_IsTheLesserOfShownAndRecognisableAndFlagsTheDrawnEnd()
    {
        var summary = Evaluate(Meeting()).Approaches[0].Summary;
        var car = summary.Coverage[0];

        Assert.Equal(Math.Min(car.ShownToM!.Value, car.RecognisableToM!.Value), summary.ProvidedSightDistanceM);
        Assert.True(summary.ProvidedSightDistanceM < car.ShownToM); // recognisable to less than the 120 m drawn
        Assert.False(summary.ProvidedCutByApproachEnd);

        // A 5 km/h stretch of 40 m drawn (AASHTO SSD at 5 km/h is 5 m) is shown and recognisable to its very end.
        var shortLane = new Approach(Corners.Line((-40, 1.5), (0, 1.5)), 5, 0, new FeatureReference(1, "short"));
        var cut = MirrorEvaluator.Evaluate(Corners.Plan(shortLane, Corners.WestBuilding()), Meeting(), Options).Evaluation!.Approaches[0].Summary;
        Assert.Equal(40, cut.ProvidedSightDistanceM, 0.01);
        Assert.True(cut.ProvidedCutByApproachEnd);
    }

    [Fact]
    public void Evaluate_AboveTheRulesSpeed_IsOutsideTheSitingRulesWhateverItShows()
    {
        // France IISR Art. 14: priority road at 50 km/h or less.
        var plan = Corners.Plan(Corners.FromWest(55), Corners.WestBuilding());
        var evaluation = MirrorEvaluator.Evaluate(plan, Meeting(), Options).Evaluation!;

        Assert.Equal(Decision.OutsideSitingRules, evaluation.Verdict.Decision);
        Assert.Equal("approach-speed", Assert.Single(evaluation.Verdict.FailedChecks).Code);
        Assert.Contains("lower the approach speed to 50 km/h or less", evaluation.Verdict.Sentence, StringComparison.Ordinal);
    }

    [Fact]
    public void Evaluate_FaceOverTheCarriageway_IsHeldToTheHigherClearanceAndTheKerbOffset()
    {
        // US MUTCD 2009 §2A.18 (5.2 m over the roadway) and §2A.19 (0.6 m lateral offset) [memory].
        var street = new Carriageway(Corners.Box(-120, 0, 120, 6), new FeatureReference(6, "street"));
        var plan = new SitePlan(PlanFrame.LocalMetres, [new Eye(Corners.Eye, new FeatureReference(0))], [Corners.FromWest()], [Corners.WestBuilding()],
            carriageways: [street]);
        var overhanging = MirrorEvaluator.Evaluate(plan, Meeting() with { YM = 5.9 }, Options).Evaluation!;
        var setBack = MirrorEvaluator.Evaluate(plan, Meeting(), Options).Evaluation!;

        var clearance = overhanging.Checks.Single(c => c.Code == "carriageway-clearance");
        Assert.Equal(5.2, clearance.Limit);
        Assert.False(clearance.Passes);
        Assert.True(overhanging.Checks.Single(c => c.Code == "kerb-offset").Value < 0);
        Assert.Equal(Decision.OutsideSitingRules, overhanging.Verdict.Decision);
        Assert.DoesNotContain(setBack.Checks, c => c.Code == "carriageway-clearance");
        Assert.True(setBack.Checks.Single(c => c.Code == "kerb-offset").Passes);
    }

    [Fact]
    public void Evaluate_FaceOverAFootway_MeasuresTheClearanceAboveTheKerb()
    {
        // Lower edge about 2.41 m above the ground: 2.3 m clear over ground (France IISR Art. 14), not over a 0.12 m kerb.
        var low = Meeting() with { CentreHeightM = 2.80 };
        var footway = new Footway(Corners.Box(-120, 6, 120, 9), 0.12, new FeatureReference(7, "footway"));
        var plan = new SitePlan(PlanFrame.LocalMetres, [new Eye(Corners.Eye, new FeatureReference(0))], [Corners.FromWest()], [Corners.WestBuilding()],
            footways: [footway]);
        var onFootway = MirrorEvaluator.Evaluate(plan, low, Options).Evaluation!;
        var onGround = Evaluate(low);

        var lowerEdge = onFootway.Mirror.LowerEdgeHeightM;
        Assert.InRange(lowerEdge, 2.3, 2.42);
        Assert.Equal(lowerEdge - 0.12, onFootway.Checks.Single(c => c.Code == "lower-edge-clearance").Value, 0.02);
        Assert.False(onFootway.Checks.Single(c => c.Code == "lower-edge-clearance").Passes);
        Assert.True(onGround.Checks.Single(c => c.Code == "lower-edge-clearance").Passes);
    }

    [Fact]
    public void Evaluate_StopLineDrawn_MeasuresTheDistanceRuleFromIt()
    {
        // France IISR Art. 14 measures stop line to mirror; without a stop line the eye point stands for it.
        var stop = new StopLine(Corners.Line((-2, -1), (2, -1)), new FeatureReference(8, "stop-line"));
        var plan = new SitePlan(PlanFrame.LocalMetres, [new Eye(Corners.Eye, new FeatureReference(0))], [Corners.FromWest()], [Corners.WestBuilding()],
            stopLines: [stop]);
        var withLine = MirrorEvaluator.Evaluate(plan, Meeting(), Options).Evaluation!;
        var without = Evaluate(Meeting());

        // Elementary geometry: from (6, 7.5) to the segment (−2..2, −1) is √(4² + 8.5²) m.
        Assert.Equal(Math.Sqrt(16 + 72.25), withLine.Checks.Single(c => c.Code == "stop-line-to-mirror-distance").Value, 1e-6);
        Assert.Contains("eye point stands for it", without.Checks.Single(c => c.Code == "eye-to-mirror-distance").Description, StringComparison.Ordinal);
    }
}
