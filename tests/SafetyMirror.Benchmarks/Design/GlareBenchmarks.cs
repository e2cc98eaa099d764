using BenchmarkDotNet.Attributes;
using NetTopologySuite.Geometries;
using SafetyMirror.Core.Design.Glare;
using SafetyMirror.Core.Optics;
using SafetyMirror.Core.Site;

namespace SafetyMirror.Benchmarks.Design;

/// <summary>A year's sun-glare scan of one mirror for one eye: every 5 minutes on every 7th day, 10 obstacles.</summary>
/// <remarks>Target: at most 200 ms. The corner is invented, placed at 50.31° N, 9.87° E in Central European time; its
/// 600 mm face (R 2.2 m) on the north footway looks south-west at the driver, tilted up 2°, so that the low afternoon sun
/// glares in it for some weeks of the year; the buildings stand clear of the driver's view of it.</remarks>
[MemoryDiagnoser]
public class GlareBenchmarks
{
    private static readonly GeometryFactory Factory = new();

    private readonly SitePlan plan = new(
        PlanFrame.CentredOn(PlanCoordinateSystem.Wgs84, new Coordinate(9.87, 50.31)),
        eyes: [new Eye(new Vec3(0, -3, 1.08), new FeatureReference(0))],
        approaches: [new Approach(Factory.CreateLineString([new Coordinate(-245, 1.5), new Coordinate(0, 1.5)]), 30, 0, new FeatureReference(1))],
        obstacles: Enumerable.Range(0, 10).Select(i => new Obstacle(
            Box(-60 + (i % 5 * 25), i < 5 ? -20 : 12, -45 + (i % 5 * 25), i < 5 ? -6 : 30),
            HeightM: 3 + (i % 3 * 3),
            new FeatureReference(2 + i))))
    {
        TimeZone = TimeZoneInfo.FindSystemTimeZoneById("Europe/Berlin"),
    };

    private readonly ConvexMirror mirror = ConvexMirror.Aimed(new Vec3(0, 7.5, 2.9), 215, -2, 2.2, new RoundAperture(0.6));

    private readonly GlareScanOptions options = new(2026);

    /// <summary>The year's scan: glare in the mirror and the sun behind it.</summary>
    [Benchmark]
    public GlareScan YearScan() => GlareScanner.Scan(plan, mirror, options);

    private static Polygon Box(double minX, double minY, double maxX, double maxY) =>
        (Polygon)Factory.ToGeometry(new Envelope(minX, maxX, minY, maxY));
}
