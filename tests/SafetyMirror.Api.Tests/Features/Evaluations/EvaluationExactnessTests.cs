using System.Text.Json;
using System.Text.Json.Nodes;
using NetTopologySuite.Geometries;
using SafetyMirror.Core.Design;
using SafetyMirror.Core.Optics;
using SafetyMirror.Core.Site;

namespace SafetyMirror.Api.Tests.Features.Evaluations;

// The HTTP answer against the exact engine called directly on the same points. The corner is the invented demo
// with its corner house and hedge taken away, so nothing but the mirror's face decides what is shown.
[Collection(ApiCollection.Name)]
public sealed class EvaluationExactnessTests(ApiFactory api)
{
    // The answer gives figures to 1e-3 (mm, thousandths of a degree or arc minute): half of that, and a hair for binary rounding.
    private const double Rounding = 5e-4 + 1e-9;

    // An advertising column on the north footway, west of the mirror, between it and the eastbound lane. At 4 m it is
    // taller than the face's top edge (2.9 m + 0.3 m), so it blocks every mirror-to-road-user leg that crosses it in plan.
    private static readonly double[][] Column = [[-10, 6.3], [-9.5, 6.3], [-9.5, 6.5], [-10, 6.5], [-10, 6.3]];

    private static readonly GeometryFactory Geometries = new();

    [Fact]
    public async Task OpenCorner_GivesTheEnginesFiguresAtEveryStation()
    {
        var body = OpenCorner();
        var engine = Engine.Of(body);

        var answer = await api.EvaluateAsync(body);

        var options = answer.GetProperty("options");
        var recognition = Angles.FromArcmin(options.GetProperty("recognitionArcmin").GetDouble());
        var detection = Angles.FromArcmin(options.GetProperty("detectionArcmin").GetDouble());
        var stations = Stations(answer).ToList();
        Assert.Contains(stations, s => s.Station.GetProperty("shown").GetBoolean());
        foreach (var (approachIndex, station) in stations)
        {
            var view = engine.See(approachIndex, station);
            var at = $"approach {approachIndex} station {station.GetProperty("stationM")} {station.GetProperty("roadUser")}";
            Assert.True(view.Shown == station.GetProperty("shown").GetBoolean(), $"{at}: shown");
            Assert.Equal(view.NotShownReason, station.GetProperty("notShownReason").GetString());
            AssertRounded(view.Reflection.IsFound ? view.Reflection.Point.Z : null, station, "reflectionPointHeightM", at);
            AssertRounded(view.Reflection.IsFound ? view.Reflection.IncidenceDeg : null, station, "incidenceDeg", at);
            AssertRounded(view.Reflection.IsFound ? view.Reflection.PathLengthM : null, station, "pathLengthM", at);
            AssertRounded(view.Shown ? view.Height.Arcmin : null, station, "apparentHeightArcmin", at);
            AssertRounded(view.Shown ? view.Width.Arcmin : null, station, "apparentWidthArcmin", at);
            AssertRounded(view.Shown ? ApparentSize.EquivalentDirectDistanceM(view.User.HeightM, view.Height.Angle) : null, station, "equivalentDistanceM", at);
            var smallest = view.Shown ? Math.Min(view.Height.Angle, view.Width.Angle) : 0;
            Assert.True((view.Shown && smallest >= recognition) == station.GetProperty("recognisable").GetBoolean(), $"{at}: recognisable");
            Assert.True((view.Shown && smallest >= detection) == station.GetProperty("detectable").GetBoolean(), $"{at}: detectable");
        }
    }

    [Fact]
    public async Task ColumnAcrossTheMirrorLeg_BlocksExactlyTheShownStationsItCrosses()
    {
        var open = OpenCorner();
        var engine = Engine.Of(open);
        var openAnswer = await api.EvaluateAsync(open);
        var (withColumn, columnIndex) = WithColumn(open);

        var answer = await api.EvaluateAsync(withColumn);

        var column = Geometries.CreatePolygon([.. Column.Select(p => new Coordinate(p[0], p[1]))]);
        var before = Stations(openAnswer).ToList();
        var after = Stations(answer).ToList();
        var crossed = before.Select(b => b.Station.GetProperty("shown").GetBoolean() && column.Intersects(engine.MirrorLeg(b.ApproachIndex, b.Station))).ToList();
        // Some shown stations are crossed and some are not, or the test would prove nothing.
        Assert.Contains(true, crossed);
        Assert.Contains(before.Zip(crossed), p => p.First.Station.GetProperty("shown").GetBoolean() && !p.Second);
        Assert.Equal(before.Count, after.Count);
        foreach (var ((_, station), blocked) in after.Zip(crossed))
        {
            var at = $"station {station.GetProperty("stationM")} {station.GetProperty("roadUser")}";
            Assert.True(blocked == (station.GetProperty("notShownReason").GetString() == "blocked"), $"{at}: {station}");
            if (blocked)
            {
                Assert.False(station.GetProperty("shown").GetBoolean());
                Assert.Equal("mirror-to-road-user", station.GetProperty("blockedLeg").GetString());
                Assert.Equal(columnIndex, station.GetProperty("blockedBy").GetProperty("featureIndex").GetInt32());
                Assert.Equal("column", station.GetProperty("blockedBy").GetProperty("id").GetString());
            }
        }
    }

    [Fact]
    public async Task ColumnAcrossTheMirrorLeg_LeavesEveryOtherStationAsItWas()
    {
        var open = OpenCorner();
        var openAnswer = await api.EvaluateAsync(open);

        var answer = await api.EvaluateAsync(WithColumn(open).Body);

        var unchanged = Stations(openAnswer).Zip(Stations(answer)).Where(p => p.Second.Station.GetProperty("notShownReason").GetString() != "blocked").ToList();
        Assert.NotEmpty(unchanged);
        Assert.All(unchanged, p => Assert.Equal(p.First.Station.GetRawText(), p.Second.Station.GetRawText()));
    }

    /// <summary>The demo corner without its obstacles (features 3 and 4).</summary>
    private static JsonObject OpenCorner()
    {
        var body = DemoCorners.Local();
        var features = body["plan"]!["features"]!.AsArray();
        features.RemoveAt(4);
        features.RemoveAt(3);
        return body;
    }

    private static (JsonObject Body, int ColumnIndex) WithColumn(JsonObject open)
    {
        var body = open.DeepClone().AsObject();
        var features = body["plan"]!["features"]!.AsArray();
        features.Add(new JsonObject
        {
            ["type"] = "Feature",
            ["id"] = "column",
            ["properties"] = new JsonObject { ["role"] = "obstacle", ["name"] = "Advertising column", ["heightM"] = 4 },
            ["geometry"] = new JsonObject
            {
                ["type"] = "Polygon",
                ["coordinates"] = new JsonArray(new JsonArray([.. Column.Select(p => new JsonArray(p[0], p[1]))])),
            },
        });
        return (body, features.Count - 1);
    }

    private static IEnumerable<(int ApproachIndex, JsonElement Station)> Stations(JsonElement answer) =>
        answer.GetProperty("approaches").EnumerateArray().SelectMany(a =>
            a.GetProperty("stations").EnumerateArray().Select(s => (a.GetProperty("approach").GetProperty("featureIndex").GetInt32(), s)));

    private static void AssertRounded(double? engine, JsonElement station, string member, string at)
    {
        var http = station.GetProperty(member);
        if (engine is null)
        {
            Assert.True(http.ValueKind == JsonValueKind.Null, $"{at}: {member} is {http}, the engine gives none");
            return;
        }

        Assert.True(Math.Abs(http.GetDouble() - engine.Value) <= Rounding, $"{at}: {member} is {http}, the engine gives {engine}");
    }

    /// <summary>One road user at one station, as the engine sees it.</summary>
    private sealed record View(RoadUser User, Reflection Reflection, bool Shown, string? NotShownReason, MirrorView Height, MirrorView Width);

    /// <summary>The mirror, eye and approaches of a local-metres request, built directly in the Core.</summary>
    private sealed record Engine(ConvexMirror Mirror, Vec3 Eye, IReadOnlyDictionary<int, Approach> Approaches)
    {
        public static Engine Of(JsonObject body)
        {
            var m = body["mirror"]!;
            var at = m["location"]!["coordinates"]!;
            var mirror = ConvexMirror.Aimed(
                new Vec3(Number(at[0]), Number(at[1]), Number(m["centreHeightM"])), Number(m["azimuthDeg"]), Number(m["tiltDownDeg"]),
                Number(m["radiusM"]), new RoundAperture(Number(m["diameterM"])));
            var features = body["plan"]!["features"]!.AsArray();
            var eye = features.Single(f => Role(f) == "eye")!;
            var eyeAt = eye["geometry"]!["coordinates"]!;
            var approaches = features
                .Select((f, i) => (Feature: f!, Index: i))
                .Where(f => Role(f.Feature) == "approach")
                .ToDictionary(f => f.Index, f => new Approach(
                    Geometries.CreateLineString([.. f.Feature["geometry"]!["coordinates"]!.AsArray().Select(p => new Coordinate(Number(p![0]), Number(p[1])))]),
                    Number(f.Feature["properties"]!["speedKmh"]),
                    f.Feature["properties"]!["gradePercent"] is { } grade ? Number(grade) : 0,
                    new FeatureReference(f.Index)));
            return new Engine(mirror, new Vec3(Number(eyeAt[0]), Number(eyeAt[1]), Number(eye["properties"]!["eyeHeightM"])), approaches);
        }

        /// <summary>The road user's centre (half its height) at the station, reflected; its height (front bottom-centre to
        /// top-centre at the station point) and its width across the lane, in the mirror.</summary>
        public View See(int approachIndex, JsonElement station)
        {
            var (user, point, centre) = Target(approachIndex, station);
            var reflection = Mirror.Reflect(Eye, centre);
            var across = new Vec3(-point.Direction.Y, point.Direction.X, 0) * (user.WidthM / 2);
            var height = ApparentSize.InMirror(Mirror, Eye, point.Position, point.Position with { Z = user.HeightM });
            var width = ApparentSize.InMirror(Mirror, Eye, centre + across, centre - across);
            var reason = !reflection.IsFound ? "no-reflection" : !reflection.InsideAperture ? "outside-face" : null;
            return new View(user, reflection, reason is null, reason, height, width);
        }

        /// <summary>The plan line from the reflection point on the face to the road user's centre.</summary>
        public LineString MirrorLeg(int approachIndex, JsonElement station)
        {
            var (_, _, centre) = Target(approachIndex, station);
            var face = Mirror.Reflect(Eye, centre).Point;
            return Geometries.CreateLineString([new Coordinate(face.X, face.Y), new Coordinate(centre.X, centre.Y)]);
        }

        private (RoadUser User, StationPoint Point, Vec3 Centre) Target(int approachIndex, JsonElement station)
        {
            var user = RoadUsers.Find(station.GetProperty("roadUser").GetString()!)!;
            var point = Approaches[approachIndex].PointAtStation(station.GetProperty("stationM").GetDouble());
            return (user, point, point.Position with { Z = user.HeightM / 2 });
        }

        private static string? Role(JsonNode? feature) => feature!["properties"]!["role"]!.GetValue<string>();

        private static double Number(JsonNode? value) => value!.GetValue<double>();
    }
}
