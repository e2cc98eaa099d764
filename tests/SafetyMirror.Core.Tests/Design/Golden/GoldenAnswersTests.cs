using System.Security.Cryptography;
using System.Text;
using System.Text.Json;
using System.Text.Json.Serialization;
using NetTopologySuite.Geometries;
using SafetyMirror.Core.Design;
using SafetyMirror.Core.Design.Evaluation;
using SafetyMirror.Core.Design.Recommendation;
using SafetyMirror.Core.Optics;
using SafetyMirror.Core.Site;
using SafetyMirror.Core.Tests.Design.Evaluation;

namespace SafetyMirror.Core.Tests.Design.Golden;

/// <summary>The full answers of the evaluation and the recommendation on a spread of corners, held to the answers recorded
/// before the evaluation was made faster: a change of speed must not change one digit of any answer.</summary>
/// <remarks>
/// Each answer is serialized whole (every double to its shortest round-trip form) and hashed; the hashes are in
/// golden-answers.txt beside this file. After a deliberate change of an answer, rerun with SAFETYMIRROR_GOLDEN_WRITE=1 to
/// record the new hashes. A mismatch writes the answer to the temp folder for comparison.
/// </remarks>
public class GoldenAnswersTests
{
    private static readonly JsonSerializerOptions Json = new()
    {
        WriteIndented = true,
        NumberHandling = JsonNumberHandling.AllowNamedFloatingPointLiterals,
        Converters = { new GeometryAsText(), new JsonStringEnumConverter() },
    };

    private static readonly MountingZone Verge = new(Corners.Line((-8, 7.5), (8, 7.5)), new FeatureReference(9, "verge"));

    public static TheoryData<string> Cases => [.. AllCases().Select(c => c.Name)];

    [Theory]
    [MemberData(nameof(Cases))]
    public void Answer_RecordedCorner_IsUnchanged(string name)
    {
        var answer = JsonSerializer.Serialize(AllCases().Single(c => c.Name == name).Answer(), Json);
        var hash = Convert.ToHexString(SHA256.HashData(Encoding.UTF8.GetBytes(answer)));
        var recorded = Recorded();
        if (Environment.GetEnvironmentVariable("SAFETYMIRROR_GOLDEN_WRITE") == "1")
        {
            recorded[name] = hash;
            File.WriteAllLines(GoldenFile, recorded.OrderBy(r => r.Key, StringComparer.Ordinal).Select(r => $"{r.Key} {r.Value}"));
            return;
        }

        if (!recorded.TryGetValue(name, out var expected) || expected != hash)
        {
            File.WriteAllText(Path.Combine(Path.GetTempPath(), $"golden-{name}.json"), answer);
        }

        Assert.Equal(recorded.GetValueOrDefault(name), hash);
    }

    private static string GoldenFile => Path.Combine(RepositoryRoot(), "tests", "SafetyMirror.Core.Tests", "Design", "Golden", "golden-answers.txt");

    private static Dictionary<string, string> Recorded() =>
        File.Exists(GoldenFile)
            ? File.ReadAllLines(GoldenFile).Where(l => l.Length > 0).Select(l => l.Split(' ')).ToDictionary(p => p[0], p => p[1])
            : [];

    private static IEnumerable<(string Name, Func<object> Answer)> AllCases()
    {
        var both = new EvaluationOptions { DecisiveRoadUsers = [RoadUsers.PassengerCar, RoadUsers.Bicycle] };
        var west = Corners.Plan(Corners.FromWest(), Corners.WestBuilding());
        var kiosk = new Obstacle(Corners.Box(-25, 2.2, -23, 3.8), 2.5, new FeatureReference(4, "kiosk"));
        var van = new Obstacle(Corners.Box(-40, 0.4, -34, 2.6), 2.6, new FeatureReference(5, "van"));
        var kinked = new Approach(Corners.Line((-90, 40), (-40, 1.5), (0, 1.5)), 30, 0, new FeatureReference(1, "kinked"));
        var twoWay = TwoWay(eastHidden: true);

        yield return ("example-demo-corner", () => EvaluateExample("demo-corner-local.json"));
        yield return ("example-demo-corner-unseen", () => EvaluateExample("demo-corner-unseen-local.json"));
        yield return ("example-demo-report", () => EvaluateExample("demo-report-local.json"));
        yield return ("example-demo-recommendation", () => Recommend(ExamplePlan("demo-recommendation-local.json"), new RecommendationOptions()));
        yield return ("west-building", () => Evaluate(west, Corners.WestMirror(), new EvaluationOptions()));
        yield return ("west-building-both-decisive", () => Evaluate(west, Corners.WestMirror(), both));
        yield return ("west-building-60kmh", () => Evaluate(Corners.Plan(Corners.FromWest(60), Corners.WestBuilding()), Corners.WestMirror(), new EvaluationOptions()));
        yield return ("west-open", () => Evaluate(Corners.Plan(Corners.FromWest()), Corners.WestMirror(), new EvaluationOptions()));
        yield return ("west-kiosk-van", () => Evaluate(Corners.Plan(Corners.FromWest(), Corners.WestBuilding(), kiosk, van), Corners.WestMirror(), both));
        yield return ("west-kinked", () => Evaluate(Corners.Plan(kinked, Corners.WestBuilding(), kiosk), Corners.WestMirror(), new EvaluationOptions()));
        yield return ("west-stations-and-allowance", () => Evaluate(west, Corners.WestMirror(1.6, 0.45),
            both with { StationsM = [0, 3.3, 17, 40, 500], MaxUnseenStretchM = 3, AimToleranceDeg = 3, MinMargin = 1.2 }));
        yield return ("west-intersection-rule", () => Evaluate(west, Corners.WestMirror() with { AzimuthDeg = 240, TiltDownDeg = 9 },
            new EvaluationOptions { SightDistance = new IntersectionSightDistance(), RoadUsers = [RoadUsers.PassengerCar, RoadUsers.Motorcycle, RoadUsers.Pedestrian] }));
        yield return ("west-rectangular", () => Evaluate(west, Corners.WestMirror() with { Aperture = new RectangularAperture(0.8, 0.6), RadiusM = 3 }, both));
        yield return ("two-way", () => Evaluate(twoWay, Corners.WestMirror() with { AzimuthDeg = 180 }, both));
        yield return ("direct-suffices", () => Evaluate(Corners.Plan(Corners.FromWest(), Corners.FromEast()), Corners.WestMirror(), new EvaluationOptions()));
        yield return ("typical-corner", () => Evaluate(TypicalCorner(), new MirrorPlacement(0, 7.5, 2.9, 220, 8, 2.2, new RoundAperture(0.6)), new EvaluationOptions()));
        yield return ("recommend-west", () => Recommend(TwoWay(eastHidden: false), new RecommendationOptions()));
        yield return ("recommend-two-way", () => Recommend(twoWay, new RecommendationOptions()));
        yield return ("recommend-two-way-both-decisive", () => Recommend(twoWay, new RecommendationOptions { Evaluation = both, Catalogue = [MirrorTypes.Find("round-600")!, MirrorTypes.Find("round-800")!] }));
    }

    private static SitePlan TwoWay(bool eastHidden) =>
        new(PlanFrame.LocalMetres, [new Eye(Corners.Eye, new FeatureReference(0))],
            [Corners.FromWest(), Corners.FromEast()],
            eastHidden ? [Corners.WestBuilding(), new Obstacle(Corners.Box(2, -20, 30, -1), 6, new FeatureReference(4, "east-building"))] : [Corners.WestBuilding()],
            [Verge]);

    // A driveway onto a street along y = 0..6 with a side road leaving north at x = 40, ten boxes about (invented).
    private static SitePlan TypicalCorner()
    {
        Approach Lane(int index, params (double X, double Y)[] points) => new(Corners.Line(points), 30, 0, new FeatureReference(index));
        return new SitePlan(
            PlanFrame.LocalMetres,
            [new Eye(Corners.Eye, new FeatureReference(0))],
            [Lane(1, (-245, 1.5), (0, 1.5)), Lane(2, (245, 4.5), (0, 4.5)), Lane(3, (41.5, 250), (41.5, 4.5), (0, 4.5))],
            Enumerable.Range(0, 10).Select(i => new Obstacle(
                Corners.Box(-32 + (i % 5 * 14), i < 5 ? -20 : 10, -22 + (i % 5 * 14), i < 5 ? -1 : 24), 2 + (i % 3 * 2), new FeatureReference(4 + i))));
    }

    private static MirrorEvaluation Evaluate(SitePlan plan, MirrorPlacement placement, EvaluationOptions options) =>
        MirrorEvaluator.Evaluate(plan, placement, options).Evaluation!;

    private static Core.Design.Recommendation.Recommendation Recommend(SitePlan plan, RecommendationOptions options) =>
        MirrorRecommender.Recommend(plan, options).Recommendation!;

    private static MirrorEvaluation EvaluateExample(string file)
    {
        using var request = JsonDocument.Parse(File.ReadAllText(Path.Combine(RepositoryRoot(), "openapi", "examples", file)));
        var mirror = request.RootElement.GetProperty("mirror");
        var location = mirror.GetProperty("location").GetProperty("coordinates");
        var placement = new MirrorPlacement(
            location[0].GetDouble(), location[1].GetDouble(), mirror.GetProperty("centreHeightM").GetDouble(), mirror.GetProperty("azimuthDeg").GetDouble(),
            mirror.GetProperty("tiltDownDeg").GetDouble(), mirror.GetProperty("radiusM").GetDouble(), new RoundAperture(mirror.GetProperty("diameterM").GetDouble()));
        return Evaluate(ExamplePlan(file), placement, new EvaluationOptions { StationSpacingM = 5 });
    }

    internal static SitePlan ExamplePlan(string file)
    {
        using var request = JsonDocument.Parse(File.ReadAllText(Path.Combine(RepositoryRoot(), "openapi", "examples", file)));
        return SitePlanReader.Read(request.RootElement.GetProperty("plan"), SitePlanLimits.Default).Plan!;
    }

    private static string RepositoryRoot()
    {
        var folder = new DirectoryInfo(AppContext.BaseDirectory);
        while (folder is not null && !File.Exists(Path.Combine(folder.FullName, "SafetyMirror.sln")))
        {
            folder = folder.Parent;
        }

        return folder?.FullName ?? throw new InvalidOperationException("The repository root (SafetyMirror.sln) was not found above the test folder.");
    }

    /// <summary>A geometry as its text, coordinates at full precision.</summary>
    private sealed class GeometryAsText : JsonConverter<Geometry>
    {
        public override bool CanConvert(Type typeToConvert) => typeof(Geometry).IsAssignableFrom(typeToConvert);

        public override Geometry Read(ref Utf8JsonReader reader, Type typeToConvert, JsonSerializerOptions options) => throw new NotSupportedException();

        public override void Write(Utf8JsonWriter writer, Geometry value, JsonSerializerOptions options) =>
            writer.WriteStringValue(string.Join(";", value.Coordinates.Select(c => FormattableString.Invariant($"{c.X:R},{c.Y:R}"))));
    }
}
