using BenchmarkDotNet.Attributes;
using NetTopologySuite.Geometries;
using SafetyMirror.Core.Optics;
using SafetyMirror.Core.Site;

namespace SafetyMirror.Benchmarks.Site;

/// <summary>The sightline check an evaluation makes thousands of times, on a corner with 24 obstacles.</summary>
[MemoryDiagnoser]
public class SightlineBenchmarks
{
    private static readonly GeometryFactory Factory = new();

    // Invented corner: two rows of twelve 8 m × 10 m houses, 3 m apart, either side of a 7 m road along y = 0 to 7.
    private readonly SitePlan plan = new(
        PlanFrame.LocalMetres,
        eyes: [new Eye(new Vec3(1.5, -4.4, 1.08), new FeatureReference(0))],
        approaches: [new Approach(Factory.CreateLineString([new(-120, 1.75), new(1.5, 1.75)]), 50, 0, new FeatureReference(1))],
        obstacles: Enumerable.Range(0, 24).Select(i => new Obstacle(
            House(-130 + (11 * (i % 12)), i < 12 ? -12 : 9),
            HeightM: 7,
            new FeatureReference(2 + i))));

    /// <summary>From the eye to a car far down the road: passes between and into houses.</summary>
    [Benchmark]
    public Obstacle? BlockedSightline() => plan.FirstObstacleBlocking(new Vec3(1.5, -4.4, 1.08), new Vec3(-110, -1, 1.3));

    /// <summary>Along the open road: the index finds candidates nowhere near the line.</summary>
    [Benchmark]
    public Obstacle? ClearSightline() => plan.FirstObstacleBlocking(new Vec3(1.5, 1, 1.08), new Vec3(-110, 5, 1.3));

    /// <summary>From a mirror on a 9 m pole, along the south row over its 7 m roofs.</summary>
    [Benchmark]
    public Obstacle? SightlineOverTheRoofs() => plan.FirstObstacleBlocking(new Vec3(1.5, -7, 9), new Vec3(-110, -7, 8));

    private static Polygon House(double west, double south) =>
        Factory.CreatePolygon([new(west, south), new(west + 8, south), new(west + 8, south + 10), new(west, south + 10), new(west, south)]);
}
