using SafetyMirror.Core.Design;
using SafetyMirror.Core.Design.Evaluation;
using SafetyMirror.Core.Optics;
using SafetyMirror.Core.Site;

namespace SafetyMirror.Core.Tests.Design.Evaluation;

public class MirrorEvaluatorTests
{
    private static readonly EvaluationOptions Options = new();

    private static ApproachEvaluation West(SitePlan plan, MirrorPlacement? placement = null, EvaluationOptions? options = null) =>
        MirrorEvaluator.Evaluate(plan, placement ?? Corners.WestMirror(), options ?? Options).Evaluation!.Approaches[0];

    [Fact]
    public void Evaluate_BuildingAtTheCorner_DirectSightDistanceEndsWhereTheLineGrazesItsCorner()
    {
        // Elementary geometry: the line from the eye (0, −3) past the building's corner (−2, −1) meets the
        // lane y = 1.5 at x = −4.5, so the driver sees 4.5 m of it directly.
        var approach = West(Corners.Plan(Corners.FromWest(), Corners.WestBuilding()));
        Assert.Equal(4.5, approach.DirectSightDistanceM, MirrorEvaluator.BoundaryToleranceM);
        Assert.Equal("west-building", approach.DirectBlockedBy?.Id);
        Assert.False(approach.Summary.DirectMeetsRequirement);
    }

    [Fact]
    public void Evaluate_NoObstacles_ReproducesTheEngineFiguresExactly()
    {
        var placement = Corners.WestMirror();
        var mirror = placement.ToMirror();
        var approach = West(Corners.Plan(Corners.FromWest()), placement);
        var car = approach.Stations.First(v => v.RoadUser == RoadUsers.PassengerCar && v.StationM == 40);
        var front = approach.Approach.PointAtStation(40).Position;

        var height = ApparentSize.InMirror(mirror, Corners.Eye, front, front with { Z = RoadUsers.PassengerCar.HeightM });
        var centre = mirror.Reflect(Corners.Eye, front with { Z = RoadUsers.PassengerCar.HeightM / 2 });

        Assert.True(car.Shown);
        Assert.Equal(height.Arcmin, car.ApparentHeightArcmin);
        Assert.Equal(centre.PathLengthM, car.PathLengthM);
        Assert.Equal(centre.IncidenceDeg, car.IncidenceDeg);
        Assert.Equal(ApparentSize.EquivalentDirectDistanceM(RoadUsers.PassengerCar.HeightM, height.Angle), car.EquivalentDistanceM);
        Assert.True(approach.Summary.DirectMeetsRequirement);
    }

    [Fact]
    public void Evaluate_ObstacleAcrossTheRoadSideLeg_BlocksExactlyTheStationsWhoseLegCrossesIt()
    {
        // A 3 m kiosk in the street between the mirror and the far stations; every leg crosses it below 3 m
        // (the mirror is at 2.9 m), so a station is blocked exactly when its leg's plan line crosses the kiosk.
        var kiosk = new Obstacle(Corners.Box(-14, 5, -12, 6), 3, new FeatureReference(4, "kiosk"));
        var open = West(Corners.Plan(Corners.FromWest()));
        var blocked = West(Corners.Plan(Corners.FromWest(), kiosk));

        var changed = 0;
        foreach (var (before, after) in open.Stations.Zip(blocked.Stations))
        {
            var crosses = before.ReflectionPoint is { } p && Corners
                .Line((p.X, p.Y), (approachPoint(before).X, approachPoint(before).Y))
                .Intersects(kiosk.Footprint);
            if (before.Shown && crosses)
            {
                changed++;
                Assert.False(after.Shown);
                Assert.Equal(BlockedLeg.MirrorToRoadUser, after.BlockedLeg);
                Assert.Equal("kiosk", after.BlockedBy?.Id);
            }
            else
            {
                Assert.Equal(before, after);
            }
        }

        Assert.True(changed > 0);

        Vec3 approachPoint(StationView view) => open.Approach.PointAtStation(view.StationM).Position;
    }

    [Fact]
    public void Evaluate_ObstacleBetweenEyeAndMirror_BlocksTheEyeLegAndHidesTheMirror()
    {
        var van = new Obstacle(Corners.Box(-1.5, 2, 1.5, 3), 8, new FeatureReference(4, "tall-van"));
        var result = MirrorEvaluator.Evaluate(Corners.Plan(Corners.FromWest(), van), Corners.WestMirror(), Options).Evaluation!;

        Assert.False(result.Mirror.EyeSeesMirror);
        Assert.False(result.Checks.Single(c => c.Code == "eye-sees-mirror").Passes);
        Assert.All(result.Approaches[0].Stations.Where(v => v.Reason == NotShownReason.Blocked),
            v => Assert.Equal(BlockedLeg.EyeToMirror, v.BlockedLeg));
        Assert.DoesNotContain(result.Approaches[0].Stations, v => v.Shown);
    }

    [Fact]
    public void Evaluate_MirrorAimedFar_ReachesTheRequiredDistanceButLeavesTheNearStretchUnseen()
    {
        // AASHTO Green Book 2011, Table 3-1: 30 km/h needs 35 m of stopping sight distance.
        var approach = West(Corners.Plan(Corners.FromWest(), Corners.WestBuilding()));
        Assert.Equal(35, approach.Required.DesignM);
        Assert.True(approach.Summary.ProvidedSightDistanceM >= 35);
        Assert.True(approach.Summary.Reach[0].RecognisableToM >= 35);

        // Between the end of the direct view and the start of the shown stretch nothing shows the car: not met.
        var gap = approach.Summary.LongestUnseen!;
        Assert.Equal(approach.DirectSightDistanceM, gap.FromM, 1e-9);
        Assert.Equal(approach.Summary.ShownFromM!.Value, gap.ToM, 1e-9);
        Assert.Equal(gap.LengthM / (30 / 3.6), gap.Seconds, 1e-9);
        Assert.False(approach.Summary.MeetsRequirement);
        Assert.Equal(approach.Summary.ShownFromM, approach.Summary.NearBlindZoneM);
    }

    [Fact]
    public void Evaluate_ListedStations_ChangeWhatIsReportedButNotTheVerdict()
    {
        var plan = Corners.Plan(Corners.FromWest(), Corners.WestBuilding());
        var regular = West(plan);
        var listed = West(plan, options: Options with { StationsM = [0, 120] });

        Assert.Equal([0.0, 120.0], listed.Stations.Select(v => v.StationM).Distinct());
        Assert.Equivalent(regular.Summary, listed.Summary, strict: true);
        Assert.Equal(regular.DirectSightDistanceM, listed.DirectSightDistanceM);
    }

    [Fact]
    public void Evaluate_FasterApproach_IsNotMetByTheSameMirror()
    {
        // AASHTO Green Book 2011, Table 3-1: 60 km/h needs 85 m; the car is no longer recognisable that far out.
        var approach = West(Corners.Plan(Corners.FromWest(60), Corners.WestBuilding()));
        Assert.Equal(85, approach.Required.DesignM);
        Assert.False(approach.Summary.MeetsRequirement);
    }

    [Fact]
    public void Evaluate_StricterRecognitionThreshold_NeverReachesFarther()
    {
        var plan = Corners.Plan(Corners.FromWest(), Corners.WestBuilding());
        double? Reach(double arcmin) => West(plan, options: Options with
        {
            Vision = new VisionCriteria(new VisualThreshold(arcmin, "test value"), VisionCriteria.Default.Detection),
        }).Summary.Reach[0].RecognisableToM;

        Assert.True(Reach(12) <= Reach(10));
        Assert.True(Reach(10) <= Reach(5));
    }

    [Fact]
    public void Evaluate_ApparentSize_FallsWithDistanceAlongTheShownStretch()
    {
        var shown = West(Corners.Plan(Corners.FromWest(), Corners.WestBuilding())).Stations
            .Where(v => v.Shown && v.RoadUser == RoadUsers.PassengerCar).ToList();
        Assert.True(shown.Count > 5);
        Assert.All(shown.Zip(shown.Skip(1)), pair => Assert.True(pair.Second.ApparentHeightArcmin < pair.First.ApparentHeightArcmin));
    }

    [Fact]
    public void Evaluate_LowerEdge_MatchesTheTiltedCapGeometry()
    {
        // Elementary geometry: the lowest rim point of a round cap tilted down by τ sits (D/2)·cos τ below the
        // centre, raised by the sag s = R − √(R² − (D/2)²) times sin τ.
        var placement = Corners.WestMirror();
        var result = MirrorEvaluator.Evaluate(Corners.Plan(Corners.FromWest()), placement, Options).Evaluation!;
        var tilt = Angles.FromDeg(placement.TiltDownDeg);
        var sag = 2.2 - Math.Sqrt((2.2 * 2.2) - (0.3 * 0.3));
        Assert.Equal(2.9 - (0.3 * Math.Cos(tilt)) + (sag * Math.Sin(tilt)), result.Mirror.LowerEdgeHeightM, 1e-5);
        Assert.True(result.Checks.Single(c => c.Code == "lower-edge-clearance").Passes); // 2.3 m, France IISR Art. 14
    }

    [Fact]
    public void Evaluate_EveryResult_CarriesTheRuleChecksAndCautions()
    {
        var result = MirrorEvaluator.Evaluate(Corners.Plan(Corners.FromWest(60), Corners.WestBuilding()), Corners.WestMirror(), Options).Evaluation!;
        Assert.Equal(["lower-edge-clearance", "eye-to-mirror-distance", "approach-speed", "eye-sees-mirror"], result.Checks.Select(c => c.Code));
        Assert.All(result.Checks, c => Assert.False(string.IsNullOrWhiteSpace(c.Source)));
        Assert.False(result.Checks.Single(c => c.Code == "approach-speed").Passes);
        Assert.Equal(Decision.OutsideSitingRules, result.Verdict.Decision);
        Assert.DoesNotContain(result.Cautions, c => c.Code == "speed-above-limit");
        Assert.Contains(result.Cautions, c => c.Code == "looks-smaller-farther-slower");
        Assert.Contains(result.Cautions, c => c.Code == "local-rules-govern");
    }

    [Fact]
    public void Problems_ApproachShorterThanRequired_NamesItsGeometry()
    {
        var shortLane = new Approach(Corners.Line((-20, 1.5), (0, 1.5)), 30, 0, new FeatureReference(1));
        var problems = Problems(Corners.Plan(shortLane), Corners.WestMirror(), Options);
        Assert.Equal("features[1].geometry", Assert.Single(problems).Path);
        Assert.Contains("35 m", problems[0].Message);
    }

    [Fact]
    public void Problems_MirrorInsideAnObstacle_NamesTheMirrorLocation()
    {
        // A 3 m wall reaches the face (centre 2.9 m, lower rim 2.6 m).
        var wall = new Obstacle(Corners.Box(-1, 7, 1, 8), 3, new FeatureReference(2, "wall"));
        var problems = Problems(Corners.Plan(Corners.FromWest(), wall), Corners.WestMirror(), Options);
        Assert.Equal("mirror.location", Assert.Single(problems).Path);
    }

    [Fact]
    public void Problems_MirrorOnAPoleInALowHedge_IsAccepted()
    {
        var hedge = new Obstacle(Corners.Box(-1, 7, 1, 8), 0.8, new FeatureReference(2, "hedge"));
        Assert.Empty(Problems(Corners.Plan(Corners.FromWest(), hedge), Corners.WestMirror(), Options));
    }

    [Fact]
    public void Problems_UnknownEye_NamesTheOption()
    {
        var problems = Problems(Corners.Plan(Corners.FromWest()), Corners.WestMirror(), Options with { EyeIndex = 3 });
        Assert.Equal("options.eyeIndex", Assert.Single(problems).Path);
    }

    private static IReadOnlyList<SitePlanProblem> Problems(SitePlan plan, MirrorPlacement placement, EvaluationOptions options) =>
        MirrorEvaluator.Evaluate(plan, placement, options).Problems;
}
