using BenchmarkDotNet.Attributes;
using NetTopologySuite.Geometries;
using SafetyMirror.Core.Design.Evaluation;
using SafetyMirror.Core.Optics;
using SafetyMirror.Core.Site;

namespace SafetyMirror.Benchmarks.Design;

/// <summary>One evaluation of a typical corner: 3 approaches, 10 obstacles, 50 stations each, 2 road users.</summary>
/// <remarks>Target: at most 1 ms of compute on one core. The corner is invented.</remarks>
[MemoryDiagnoser]
public class EvaluationBenchmarks
{
    private static readonly GeometryFactory Factory = new();

    // A driveway (eye at the origin's south) onto a street along y = 0..6, and a side road leaving north at x = 40.
    private readonly SitePlan plan = new(
        PlanFrame.LocalMetres,
        eyes: [new Eye(new Vec3(0, -3, 1.08), new FeatureReference(0))],
        approaches:
        [
            Lane(1, (-245, 1.5), (0, 1.5)),
            Lane(2, (245, 4.5), (0, 4.5)),
            Lane(3, (41.5, 250), (41.5, 4.5), (0, 4.5)),
        ],
        obstacles: Enumerable.Range(0, 10).Select(i => new Obstacle(
            Box(-32 + (i % 5 * 14), i < 5 ? -20 : 10, -22 + (i % 5 * 14), i < 5 ? -1 : 24),
            HeightM: 2 + (i % 3 * 2),
            new FeatureReference(4 + i))));

    private readonly MirrorPlacement mirror = new(0, 7.5, 2.9, 220, 8, 2.2, new RoundAperture(0.6));

    // Stations every 5 m from 0 to 245 m: 50 per approach.
    private readonly EvaluationOptions options = new() { StationSpacingM = 5, FieldOfViewRays = 1000 };

    private readonly (SitePlan Plan, MirrorPlacement Mirror) demo = DemoCorner.Evaluation();

    /// <summary>The typical corner.</summary>
    [Benchmark]
    public MirrorEvaluation Evaluate() => MirrorEvaluator.Evaluate(plan, mirror, options).Evaluation!;

    /// <summary>The demo corner of openapi/examples (demo-corner-local.json), with its options (stations every 5 m, car and bicycle).</summary>
    [Benchmark]
    public MirrorEvaluation EvaluateDemo() => MirrorEvaluator.Evaluate(demo.Plan, demo.Mirror, options).Evaluation!;

    private static Approach Lane(int index, params (double X, double Y)[] points) =>
        new(Factory.CreateLineString(points.Select(p => new Coordinate(p.X, p.Y)).ToArray()), 30, 0, new FeatureReference(index));

    private static Polygon Box(double minX, double minY, double maxX, double maxY) =>
        (Polygon)Factory.ToGeometry(new Envelope(minX, maxX, minY, maxY));
}
