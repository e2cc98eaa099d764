using NetTopologySuite.Geometries;
using SafetyMirror.Core.Design;
using SafetyMirror.Core.Design.Evaluation;
using SafetyMirror.Core.Design.Recommendation;
using SafetyMirror.Core.Optics;
using SafetyMirror.Core.Site;
using SafetyMirror.Core.Tests.Design.Evaluation;

namespace SafetyMirror.Core.Tests.Design.Recommendation;

public class RecommenderTests
{
    private static readonly GeometryFactory Factory = new();

    private static MountingZone Verge() =>
        new(Corners.Line((-8, 7.5), (8, 7.5)), new FeatureReference(9, "verge", "Footway edge opposite the exit"));

    private static MountingZone LampColumn() =>
        new(Factory.CreatePoint(new Coordinate(0, 7.5)), new FeatureReference(9, "lamp-column"));

    // The test corner (invented): the driveway's view west is hidden by the corner house; east is open.
    private static SitePlan Corner(double speedKmh = 30, MountingZone? zone = null, bool withHouse = true, bool eastHidden = false)
    {
        var obstacles = new List<Obstacle>();
        if (withHouse)
        {
            obstacles.Add(Corners.WestBuilding());
        }

        if (eastHidden)
        {
            obstacles.Add(new Obstacle(Corners.Box(2, -20, 30, -1), 6, new FeatureReference(4, "east-building")));
        }

        return new SitePlan(PlanFrame.LocalMetres, [new Eye(Corners.Eye, new FeatureReference(0))],
            [Corners.FromWest(speedKmh), Corners.FromEast(speedKmh)], obstacles, [zone ?? Verge()]);
    }

    [Fact]
    public void Recommend_OneMountingPoint_FindsTheAimABruteForceScanFinds()
    {
        // Known by construction: one pole position and one mirror leave only the aim to choose; a dense scan of
        // azimuth and tilt by the same judge (0.5° over ±20°, then 0.02° around its best) is the reference.
        var plan = Corner(zone: LampColumn());
        var options = new RecommendationOptions { Catalogue = [MirrorTypes.Find("round-600")!], ServedApproaches = [0] };
        var found = MirrorRecommender.Recommend(plan, options).Recommendation!.Alternatives[0].Mirrors[0].Placement;

        var judge = new PlacementJudge(plan, options, [0]);
        var (azimuth, tilt) = MirrorRecommender.BisectorAim(new Vec3(0, 7.5, found.CentreHeightM), judge.Eye, judge.Targets);
        var best = Scan(judge, found, azimuth, tilt, half: 20, step: 0.5);
        best = Scan(judge, found, best.AzimuthDeg, best.TiltDownDeg, half: 0.6, step: 0.02);

        // The search must do as well as the scan by the same measure (the worst of the aim as set and the four aims off by the
        // tolerance), with the azimuth found to 0.25°. Tilt is left loose: along a level road the blind zone hardly depends on
        // it, so the measure itself fixes it only to about 1°.
        var (foundValue, scanValue) = (judge.JudgeRobust(found).Value, judge.JudgeRobust(best).Value);
        Assert.True(foundValue >= scanValue - (1e-5 * Math.Abs(scanValue)), $"search {foundValue} < scan {scanValue}");
        Assert.Equal(best.AzimuthDeg, found.AzimuthDeg, 0.25);
        Assert.Equal(best.TiltDownDeg, found.TiltDownDeg, 1.0);
    }

    private static MirrorPlacement Scan(PlacementJudge judge, MirrorPlacement at, double azimuth, double tilt, double half, double step)
    {
        var best = (Placement: at, Value: double.NegativeInfinity);
        var steps = (int)Math.Round(half / step);
        for (var i = -steps; i <= steps; i++)
        {
            for (var j = -steps; j <= steps; j++)
            {
                var placement = at with { AzimuthDeg = azimuth + (i * step), TiltDownDeg = tilt + (j * step) };
                var value = judge.JudgeRobust(placement).Value;
                if (value > best.Value)
                {
                    best = (placement, value);
                }
            }
        }

        return best.Placement;
    }

    [Fact]
    public void Recommend_DemoCorner_RecommendsOneMirrorThatMeetsTheRequirement()
    {
        var recommendation = MirrorRecommender.Recommend(Corner(), new RecommendationOptions()).Recommendation!;

        Assert.Equal(RecommendationOutcome.OneMirror, recommendation.Outcome);
        Assert.Equal([0], recommendation.ServedApproaches); // the east is seen directly
        var first = recommendation.Alternatives[0];
        Assert.True(first.Score.MeetsRequirement);
        Assert.True(first.Mirrors[0].Evaluation.Approaches[0].Summary.MeetsRequirement);
        Assert.NotEmpty(first.Rationale);
        Assert.InRange(recommendation.Alternatives.Count, 1, 3);
        Assert.Contains(recommendation.Candidates, c => c.Stage == "fine");
    }

    [Fact]
    public void Recommend_SameInput_GivesTheSameAnswer()
    {
        var a = MirrorRecommender.Recommend(Corner(), new RecommendationOptions()).Recommendation!;
        var b = MirrorRecommender.Recommend(Corner(), new RecommendationOptions()).Recommendation!;
        Assert.Equal(a.Alternatives.Select(x => x.Mirrors[0].Placement), b.Alternatives.Select(x => x.Mirrors[0].Placement));
        Assert.Equal(a.Evaluations, b.Evaluations);
    }

    [Fact]
    public void Recommend_ObstacleRemoved_SaysNoMirrorIsNeeded()
    {
        var recommendation = MirrorRecommender.Recommend(Corner(withHouse: false), new RecommendationOptions()).Recommendation!;
        Assert.Equal(RecommendationOutcome.NoMirrorNeeded, recommendation.Outcome);
        Assert.Empty(recommendation.Alternatives);
    }

    [Theory]
    [InlineData(20, 30)]
    [InlineData(30, 40)]
    public void Recommend_HigherSpeed_NeverYieldsASmallerMirror(double slower, double faster)
    {
        var options = new RecommendationOptions();
        var slow = MirrorRecommender.Recommend(Corner(slower), options).Recommendation!.Alternatives[0];
        var fast = MirrorRecommender.Recommend(Corner(faster), options).Recommendation!.Alternatives[0];
        Assert.True(slow.Score.MeetsRequirement && fast.Score.MeetsRequirement);
        Assert.True(fast.Score.FaceAreaM2 >= slow.Score.FaceAreaM2, $"{fast.Score.FaceAreaM2} m² at {faster} km/h < {slow.Score.FaceAreaM2} m² at {slower} km/h");
    }

    [Fact]
    public void Recommend_LargerCatalogue_NeverYieldsAWorseBestAlternative()
    {
        var small = new RecommendationOptions { Catalogue = [MirrorTypes.Find("round-600")!] };
        var large = small with { Catalogue = MirrorTypes.Defaults };
        var fromSmall = MirrorRecommender.Recommend(Corner(40), small).Recommendation!.Alternatives[0].Score;
        var fromLarge = MirrorRecommender.Recommend(Corner(40), large).Recommendation!.Alternatives[0].Score;
        Assert.True(fromLarge.Coverage >= fromSmall.Coverage - 1e-9, $"{fromLarge} < {fromSmall}");
    }

    [Fact]
    public void Recommend_HiddenOnBothSides_RecommendsAMirrorPerApproach()
    {
        var recommendation = MirrorRecommender.Recommend(Corner(eastHidden: true), new RecommendationOptions()).Recommendation!;
        Assert.Equal(RecommendationOutcome.TwoMirrors, recommendation.Outcome);
        var mirrors = recommendation.Alternatives[0].Mirrors;
        Assert.Equal(2, mirrors.Count);
        Assert.Equal([[0], [1]], mirrors.Select(m => m.ServedApproaches.ToArray()));
        Assert.All(mirrors, m => Assert.True(Assert.Single(m.Evaluation.Approaches).Summary.MeetsRequirement));
        Assert.All(mirrors, m => Assert.Equal(Decision.MeetsRequirement, m.Evaluation.Verdict.Decision));
    }

    [Fact]
    public void Recommend_AboveTheRulesSpeed_IsOutsideTheSitingRulesAndSaysWhatWouldBringItInside()
    {
        // France IISR Art. 14: priority road at 50 km/h or less; no design at 60 km/h is inside the rules.
        var recommendation = MirrorRecommender.Recommend(Corner(60), new RecommendationOptions()).Recommendation!;
        Assert.Equal(RecommendationOutcome.OutsideSitingRules, recommendation.Outcome);
        Assert.Contains("approach-speed 60 km/h against at most 50 km/h", recommendation.Summary, StringComparison.Ordinal);
        Assert.Contains(recommendation.MeasuresToConsider, m => m.Contains("lower the approach speed to 50 km/h or less", StringComparison.Ordinal));
    }

    [Fact]
    public void Recommend_FastStreamSeenDirectly_StillHoldsTheMirrorToTheCornersSpeedRule()
    {
        // The westbound stream at 55 km/h needs no mirror, but the siting rule is the corner's (France IISR Art. 14:
        // priority road at 50 km/h or less): the recommendation and the evaluation of its design agree.
        var plan = new SitePlan(PlanFrame.LocalMetres, [new Eye(Corners.Eye, new FeatureReference(0))],
            [Corners.FromWest(30), Corners.FromEast(55)], [Corners.WestBuilding()], [Verge()]);
        var recommendation = MirrorRecommender.Recommend(plan, new RecommendationOptions()).Recommendation!;
        var design = recommendation.Alternatives[0].Mirrors[0];
        var evaluated = MirrorEvaluator.Evaluate(plan, design.Placement, new EvaluationOptions()).Evaluation!;

        Assert.Equal(RecommendationOutcome.OutsideSitingRules, recommendation.Outcome);
        Assert.Equal(Decision.OutsideSitingRules, evaluated.Verdict.Decision);
        Assert.Equal(Decision.OutsideSitingRules, design.Evaluation.Verdict.Decision);
    }

    [Fact]
    public void Recommend_TooFastForAnyMirror_SaysSoWithMeasuresToConsider()
    {
        // AASHTO Green Book 2011, Table 3-1: 60 km/h needs 85 m, beyond what any catalogue mirror shows recognisably here;
        // the speed rule is lifted (a local rule allowing 100 km/h, invented for the test) so only the view decides.
        var rules = new SitingRules(2.3, 15, 100, "a local rule allowing mirrors up to 100 km/h (invented for the test)");
        var options = new RecommendationOptions { Evaluation = new EvaluationOptions { Rules = rules } };
        var recommendation = MirrorRecommender.Recommend(Corner(60), options).Recommendation!;
        Assert.Equal(RecommendationOutcome.NoMirrorServes, recommendation.Outcome);
        Assert.False(recommendation.Alternatives[0].Score.MeetsRequirement);
        Assert.Contains(recommendation.MeasuresToConsider, m => m.Contains("Remove or lower the obstruction", StringComparison.Ordinal));
        Assert.Contains(recommendation.MeasuresToConsider, m => m.Contains("speed", StringComparison.Ordinal));
    }

    [Fact]
    public void Recommend_ChosenDesign_CarriesEveryRuleCheckAndCaution()
    {
        var evaluation = MirrorRecommender.Recommend(Corner(), new RecommendationOptions()).Recommendation!.Alternatives[0].Mirrors[0].Evaluation;
        Assert.Equal(["lower-edge-clearance", "eye-to-mirror-distance", "approach-speed", "eye-sees-mirror"], evaluation.Checks.Select(c => c.Code));
        Assert.All(evaluation.Checks, c => Assert.True(c.Passes, c.Code));
        Assert.Contains(evaluation.Cautions, c => c.Code == "last-resort");
        Assert.Contains(evaluation.Cautions, c => c.Code == "not-an-approval");
    }

    [Fact]
    public void Problems_NoMountingZoneAndNoCarriageway_SaysWhatToAdd()
    {
        var plan = new SitePlan(PlanFrame.LocalMetres, [new Eye(Corners.Eye, new FeatureReference(0))], [Corners.FromWest()], [Corners.WestBuilding()]);
        var problem = Assert.Single(Problems(plan, new RecommendationOptions()));
        Assert.Equal("features", problem.Path);
        Assert.Contains("mounting-zone", problem.Message);
        Assert.Contains("carriageway", problem.Message);
    }

    [Fact]
    public void Problems_PoleTooLowForEveryMirror_NamesTheHeightLimit()
    {
        // Lower edge at least 2.3 m (France IISR Art. 14): a 2.4 m centre leaves no room for any catalogue face.
        var problems = Problems(Corner(), new RecommendationOptions { MinCentreHeightM = 2.2, MaxCentreHeightM = 2.4 });
        Assert.Equal("options.maxCentreHeightM", Assert.Single(problems).Path);
    }

    [Fact]
    public void Recommend_PoleTooLowForTheLargestMirror_SearchesTheOthers()
    {
        // 2.3 m clearance + 0.5 m (half the 1000 mm face) + 2 cm sag allowance exceeds 2.75 m; the 800 mm face still hangs.
        var recommendation = MirrorRecommender.Recommend(Corner(), new RecommendationOptions { MaxCentreHeightM = 2.75 }).Recommendation!;
        Assert.DoesNotContain(recommendation.Alternatives.SelectMany(a => a.Mirrors), m => m.Type.Id == "round-1000");
        Assert.NotEmpty(recommendation.Alternatives);
    }

    [Fact]
    public void Recommend_OnlyACarriageway_ProposesPolesAlongItsFarEdge()
    {
        var street = new Carriageway(Corners.Box(-120, 0, 120, 6), new FeatureReference(5, "street"));
        var plan = new SitePlan(PlanFrame.LocalMetres, [new Eye(Corners.Eye, new FeatureReference(0))],
            [Corners.FromWest(), Corners.FromEast()], [Corners.WestBuilding()], carriageways: [street]);
        var recommendation = MirrorRecommender.Recommend(plan, new RecommendationOptions()).Recommendation!;

        // Far edge y = 6, set back onto the footway by the kerb offset (0.6 m, US MUTCD 2009 §2A.19 [memory]) plus the largest
        // catalogue face's half extent (0.5 m), within 15 m of the eye (France IISR Art. 14).
        Assert.All(recommendation.Candidates, c => Assert.InRange(c.YM, 6.0, 7.2));
        Assert.True(recommendation.Alternatives[0].Score.MeetsRequirement);
    }

    private static IReadOnlyList<SitePlanProblem> Problems(SitePlan plan, RecommendationOptions options) =>
        MirrorRecommender.Recommend(plan, options).Problems;
}
