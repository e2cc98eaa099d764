using NetTopologySuite.Geometries;
using NetTopologySuite.Geometries.Prepared;
using NetTopologySuite.Operation.Distance;
using SafetyMirror.Core.Design;
using SafetyMirror.Core.Design.Evaluation;
using SafetyMirror.Core.Optics;
using SafetyMirror.Core.Site;
using SafetyMirror.Core.Tests.Design.Golden;
using SafetyMirror.Core.Tests.Site;

namespace SafetyMirror.Core.Tests.Design.Evaluation;

/// <summary>The visible field of view of the demo corners, held against the plan's own 2.5-D sightline test from the face's
/// centre at every point of a 1 m grid over the traced field of view (points nearer than 5 cm to the visible outline, where the
/// two may round differently, left out).</summary>
public class VisibleFieldOfViewTests
{
    private const double GridStepM = 1;
    private const double EdgeM = 0.05;

    private static readonly GeometryFactory Factory = new();

    public static TheoryData<string> DemoCorners => ["demo-corner", "quillby-yard", "west-kiosk-van"];

    [Theory]
    [MemberData(nameof(DemoCorners))]
    public void VisibleFieldOfView_DemoCorner_OverlapsNoObstacle(string corner)
    {
        var (plan, evaluation) = Evaluate(corner);
        var visible = evaluation.Mirror.VisibleFieldOfView.Outline!;

        Assert.All(plan.Obstacles, o => Assert.True(visible.Intersection(o.Footprint).Area < 1e-6, $"{o.Feature} overlaps the visible field of view."));
    }

    [Theory]
    [MemberData(nameof(DemoCorners))]
    public void VisibleFieldOfView_DemoCorner_EverySeenPointHasAClearSightlineFromTheMirror(string corner)
    {
        var (plan, evaluation) = Evaluate(corner);
        var facts = evaluation.Mirror;

        var blocked = GridPoints(facts, inVisible: true)
            .Where(p => plan.IsBlocked(facts.Mirror.Vertex, Target(p, facts.VisibleFieldOfView)))
            .ToList();

        Assert.Empty(blocked);
    }

    [Theory]
    [MemberData(nameof(DemoCorners))]
    public void VisibleFieldOfView_DemoCorner_EveryPointLeftOutIsBlockedOrUnderAnObstacle(string corner)
    {
        var (plan, evaluation) = Evaluate(corner);
        var facts = evaluation.Mirror;

        var clear = GridPoints(facts, inVisible: false)
            .Where(p => !plan.IsInsideAnyObstacle(p.X, p.Y) && !plan.IsBlocked(facts.Mirror.Vertex, Target(p, facts.VisibleFieldOfView)))
            .ToList();

        Assert.Empty(clear);
    }

    [Fact]
    public void VisibleFieldOfView_DemoCorner_IsSmallerThanTheTracedOneByTheCornerHousesShadow()
    {
        var (_, evaluation) = Evaluate("demo-corner");
        var facts = evaluation.Mirror;

        Assert.True(facts.VisibleFieldOfView.AreaM2 < facts.FieldOfView.Outline!.Area);
        Assert.Equal(facts.Mirror.Vertex.Z, facts.VisibleFieldOfView.ViewpointHeightM);
        Assert.Equal(RoadUsers.PassengerCar.HeightM / 2, facts.VisibleFieldOfView.TargetHeightM);
    }

    /// <summary>Grid points inside the traced field of view, clear of the visible outline by the edge margin, inside or outside it.</summary>
    private static List<Coordinate> GridPoints(MirrorFacts facts, bool inVisible)
    {
        var traced = PreparedGeometryFactory.Prepare(facts.FieldOfView.Outline!);
        var visible = facts.VisibleFieldOfView.Outline!;
        var inside = PreparedGeometryFactory.Prepare(visible);
        var edge = new IndexedFacetDistance(visible.Boundary);
        var box = facts.FieldOfView.Outline!.EnvelopeInternal;
        var points = new List<Coordinate>();
        for (var x = Math.Floor(box.MinX); x <= box.MaxX; x += GridStepM)
        {
            for (var y = Math.Floor(box.MinY); y <= box.MaxY; y += GridStepM)
            {
                var point = Factory.CreatePoint(new Coordinate(x, y));
                if (traced.Contains(point) && inside.Contains(point) == inVisible && edge.Distance(point) > EdgeM)
                {
                    points.Add(point.Coordinate);
                }
            }
        }

        Assert.NotEmpty(points);
        return points;
    }

    private static Vec3 Target(Coordinate ground, VisibleFieldOfView visible) => new(ground.X, ground.Y, visible.TargetHeightM);

    private static (SitePlan Plan, MirrorEvaluation Evaluation) Evaluate(string corner)
    {
        if (corner == "demo-corner")
        {
            return (GoldenAnswersTests.ExamplePlan("demo-corner-local.json"), GoldenAnswersTests.EvaluateExample("demo-corner-local.json"));
        }

        var (plan, placement) = corner == "quillby-yard"
            ? (DemoCorner.Read(DemoCorner.LocalMetres()).Plan!, new MirrorPlacement(1.5, 8.5, 2.8, 215, 6, 3.0, new RoundAperture(0.8)))
            : (Corners.Plan(Corners.FromWest(), Corners.WestBuilding(),
                    new Obstacle(Corners.Box(-25, 2.2, -23, 3.8), 2.5, new FeatureReference(4, "kiosk")),
                    new Obstacle(Corners.Box(-40, 0.4, -34, 2.6), 2.6, new FeatureReference(5, "van"))),
                Corners.WestMirror());
        // The Quillby Yard lanes are drawn shorter than a stopping distance at 50 km/h: judge them against 40 m (invented).
        var options = new EvaluationOptions { SightDistance = new FixedSightDistance(40, "demo") };
        return (plan, MirrorEvaluator.Evaluate(plan, placement, options).Evaluation!);
    }
}
