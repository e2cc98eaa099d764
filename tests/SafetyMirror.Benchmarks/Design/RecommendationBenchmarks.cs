using BenchmarkDotNet.Attributes;
using NetTopologySuite.Geometries;
using SafetyMirror.Core.Design.Evaluation;
using SafetyMirror.Core.Design.Recommendation;
using SafetyMirror.Core.Optics;
using SafetyMirror.Core.Site;

namespace SafetyMirror.Benchmarks.Design;

/// <summary>A recommendation for a typical corner: 2 approaches, 10 obstacles, 3 mounting zones, default catalogue.</summary>
/// <remarks>Target: at most 50 ms on one core. The corner is invented.</remarks>
[MemoryDiagnoser]
public class RecommendationBenchmarks
{
    private readonly SitePlan plan = TypicalCorner.Plan();
    private readonly SitePlan demo = DemoCorner.Plan();

    /// <summary>The typical corner: both directions hidden, so one search for one mirror and one per approach.</summary>
    [Benchmark]
    public Recommendation Recommend() => MirrorRecommender.Recommend(plan, new RecommendationOptions()).Recommendation!;

    /// <summary>The demo corner of openapi/examples: one approach to serve. Target: at most 50 ms.</summary>
    [Benchmark]
    public Recommendation RecommendDemo() => MirrorRecommender.Recommend(demo, new RecommendationOptions()).Recommendation!;
}

/// <summary>The invented demo corner of openapi/examples, read as the service reads it.</summary>
public static class DemoCorner
{
    /// <summary>The plan of demo-recommendation-local.json.</summary>
    public static SitePlan Plan()
    {
        using var request = Example("demo-recommendation-local.json");
        return SitePlanReader.Read(request.RootElement.GetProperty("plan"), SitePlanLimits.Default).Plan!;
    }

    /// <summary>The plan and the mirror of demo-corner-local.json (local metres, a round face).</summary>
    public static (SitePlan Plan, MirrorPlacement Mirror) Evaluation()
    {
        using var request = Example("demo-corner-local.json");
        var mirror = request.RootElement.GetProperty("mirror");
        var location = mirror.GetProperty("location").GetProperty("coordinates");
        var placement = new MirrorPlacement(
            location[0].GetDouble(), location[1].GetDouble(), mirror.GetProperty("centreHeightM").GetDouble(), mirror.GetProperty("azimuthDeg").GetDouble(),
            mirror.GetProperty("tiltDownDeg").GetDouble(), mirror.GetProperty("radiusM").GetDouble(), new RoundAperture(mirror.GetProperty("diameterM").GetDouble()));
        return (SitePlanReader.Read(request.RootElement.GetProperty("plan"), SitePlanLimits.Default).Plan!, placement);
    }

    private static System.Text.Json.JsonDocument Example(string file)
    {
        var folder = new DirectoryInfo(AppContext.BaseDirectory);
        while (folder is not null && !File.Exists(Path.Combine(folder.FullName, "SafetyMirror.sln")))
        {
            folder = folder.Parent;
        }

        return System.Text.Json.JsonDocument.Parse(File.ReadAllText(Path.Combine(folder?.FullName ?? ".", "openapi", "examples", file)));
    }
}

/// <summary>The invented typical corner shared by the recommendation benchmark and the grid comparison.</summary>
public static class TypicalCorner
{
    private static readonly GeometryFactory Factory = new();

    /// <summary>A driveway onto a 30 km/h street along y = 0..6: houses either side of the driveway hide both directions.</summary>
    public static SitePlan Plan(double speedKmh = 30) => new(
        PlanFrame.LocalMetres,
        eyes: [new Eye(new Vec3(0, -3, 1.08), new FeatureReference(0))],
        approaches:
        [
            new Approach(Line((-150, 1.5), (0, 1.5)), speedKmh, 0, new FeatureReference(1, "eastbound")),
            new Approach(Line((150, 4.5), (0, 4.5)), speedKmh, 0, new FeatureReference(2, "westbound")),
        ],
        obstacles:
        [
            Obstacle(3, -30, -20, -2, -1, 6),
            Obstacle(4, 2, -20, 30, -1, 6),
            .. Enumerable.Range(0, 8).Select(i => Obstacle(5 + i, -70 + (i * 18), 12, -58 + (i * 18), 24, 7)),
        ],
        mountingZones:
        [
            new MountingZone(Line((-8, 7.5), (8, 7.5)), new FeatureReference(13, "north-footway")),
            new MountingZone(Factory.CreatePoint(new Coordinate(-3, 7.8)), new FeatureReference(14, "lamp-column")),
            new MountingZone(Box(10, 6.5, 14, 9), new FeatureReference(15, "verge")),
        ]);

    private static Obstacle Obstacle(int index, double minX, double minY, double maxX, double maxY, double heightM) =>
        new(Box(minX, minY, maxX, maxY), heightM, new FeatureReference(index));

    private static LineString Line(params (double X, double Y)[] points) =>
        Factory.CreateLineString(points.Select(p => new Coordinate(p.X, p.Y)).ToArray());

    private static Polygon Box(double minX, double minY, double maxX, double maxY) =>
        (Polygon)Factory.ToGeometry(new Envelope(minX, maxX, minY, maxY));
}
