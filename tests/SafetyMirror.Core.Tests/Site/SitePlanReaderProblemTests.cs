using System.Text;
using System.Text.Json;
using System.Text.Json.Nodes;
using SafetyMirror.Core.Site;

namespace SafetyMirror.Core.Tests.Site;

public class SitePlanReaderProblemTests
{
    private const string KnownRoles = "eye, approach, obstacle, mounting-zone, carriageway, footway";

    /// <summary>One way to spoil the demo corner, the path of the problem it must give, and a part of its message.</summary>
    private sealed record Spoiled(Action<JsonObject> Spoil, string Path, string MessagePart);

    private static readonly Dictionary<string, Spoiled> Cases = new()
    {
        ["not a FeatureCollection"] = new(plan => plan["type"] = "Feature", "type", "FeatureCollection"),
        ["no features array"] = new(plan => plan.Remove("features"), "features", "features array"),
        ["feature not an object"] = new(plan => plan["features"]![6] = 42, "features[6]", "Feature object"),
        ["feature type wrong"] = new(plan => plan["features"]![4]!["type"] = "Geometry", "features[4].type", "\"Feature\""),
        ["unknown role"] = new(plan => Properties(plan, 3)["role"] = "tree", "features[3].properties.role", $"Unknown role \"tree\"; the known roles are {KnownRoles}"),
        ["role not a string"] = new(plan => Properties(plan, 3)["role"] = 3, "features[3].properties.role", KnownRoles),
        ["missing role"] = new(plan => Properties(plan, 5).Remove("role"), "features[5].properties.role", "Missing role"),
        ["properties not an object"] = new(plan => plan["features"]![5]!["properties"] = "mounting-zone", "features[5].properties", "object"),
        ["missing eye"] = new(plan => Features(plan).RemoveAt(0), "features", "role \"eye\""),
        ["missing approach"] = new(plan => { Features(plan).RemoveAt(2); Features(plan).RemoveAt(1); }, "features", "role \"approach\""),
        ["missing geometry"] = new(plan => plan["features"]![3]!.AsObject().Remove("geometry"), "features[3].geometry", "Polygon or MultiPolygon"),
        ["null geometry"] = new(plan => plan["features"]![3]!["geometry"] = null, "features[3].geometry", "needs a geometry"),
        ["obstacle drawn as a line"] = new(
            plan => plan["features"]![3]!["geometry"] = DemoCorner.Geometry("LineString", new JsonArray(DemoCorner.LonLat(-30, -1), DemoCorner.LonLat(-1, -1))),
            "features[3].geometry.type", "An obstacle must be a Polygon or MultiPolygon; this one is a LineString"),
        ["eye drawn as a polygon"] = new(
            plan => plan["features"]![0]!["geometry"] = DemoCorner.Geometry("Polygon", DemoCorner.Rectangle(DemoCorner.LonLat, 1, -5, 2, -4)),
            "features[0].geometry.type", "An eye must be a Point"),
        ["approach shorter than 5 m"] = new(
            plan => Geometry(plan, 2)["coordinates"] = new JsonArray(DemoCorner.LonLat(4.5, 5.25), DemoCorner.LonLat(1.5, 5.25)),
            "features[2].geometry.coordinates", "at least 5 m"),
        ["approach through an obstacle"] = new(
            plan => Geometry(plan, 1)["coordinates"] = new JsonArray(DemoCorner.LonLat(-60, -0.75), DemoCorner.LonLat(1.5, -0.75)),
            "features[1].geometry.coordinates", "runs through obstacle \"Garden wall\""),
        ["approach running back over itself"] = new(
            plan => Geometry(plan, 1)["coordinates"] = new JsonArray(DemoCorner.LonLat(-60, 1.75), DemoCorner.LonLat(1.5, 1.75), DemoCorner.LonLat(-30, 1.75)),
            "features[1].geometry.coordinates", "runs back over itself"),
        ["approach with a repeated point"] = new(
            plan => Coordinates(plan, 1).Insert(2, DemoCorner.LonLat(-20, 1.75)),
            "features[1].geometry.coordinates[2]", "repeats position 1"),
        ["approach of one position"] = new(
            plan => Geometry(plan, 2)["coordinates"] = new JsonArray(DemoCorner.LonLat(1.5, 5.25)),
            "features[2].geometry.coordinates", "at least 2 positions"),
        ["self-intersecting obstacle"] = new(
            plan => Geometry(plan, 3)["coordinates"] = new JsonArray(new JsonArray(
                DemoCorner.LonLat(-30, -1), DemoCorner.LonLat(-1, -0.5), DemoCorner.LonLat(-1, -1), DemoCorner.LonLat(-30, -0.5), DemoCorner.LonLat(-30, -1))),
            "features[3].geometry.coordinates", "The polygon is not valid: Self-intersection at or near ("),
        ["ring not closed"] = new(
            plan => Coordinates(plan, 4)[0]!.AsArray().RemoveAt(4),
            "features[4].geometry.coordinates[0]", "does not end where it starts"),
        ["ring too short"] = new(
            plan => Geometry(plan, 4)["coordinates"] = new JsonArray(new JsonArray(DemoCorner.LonLat(4, -1), DemoCorner.LonLat(30, -1), DemoCorner.LonLat(4, -1))),
            "features[4].geometry.coordinates[0]", "at least 4 positions"),
        ["position of one number"] = new(plan => Coordinates(plan, 1)[1] = new JsonArray(9.87), "features[1].geometry.coordinates[1]", "[x, y]"),
        ["speed missing"] = new(plan => Properties(plan, 1).Remove("speedKmh"), "features[1].properties.speedKmh",
            "An approach needs speedKmh or speedMph: the design speed (posted or 85th percentile), from 5 to 200 km/h or from 5 to 120 mph; \"Harrow Fold Road eastbound\" (features[1]) gives neither"),
        ["speed in km/h and in mph"] = new(plan => Properties(plan, 1)["speedMph"] = 30, "features[1].properties.speedMph",
            "An approach takes speedKmh or speedMph, not both; \"Harrow Fold Road eastbound\" (features[1]) gives both"),
        ["speed in mph too high"] = new(plan => { Properties(plan, 1).Remove("speedKmh"); Properties(plan, 1)["speedMph"] = 121; }, "features[1].properties.speedMph",
            "from 5 to 120 mph; it is 121"),
        ["speed too high"] = new(plan => Properties(plan, 1)["speedKmh"] = 250, "features[1].properties.speedKmh", "from 5 to 200 km/h; it is 250"),
        ["speed too low"] = new(plan => Properties(plan, 1)["speedKmh"] = 4, "features[1].properties.speedKmh", "from 5 to 200 km/h"),
        ["speed as text"] = new(plan => Properties(plan, 1)["speedKmh"] = "50", "features[1].properties.speedKmh", "it is the string \"50\""),
        ["grade too steep"] = new(plan => Properties(plan, 2)["gradePercent"] = -16, "features[2].properties.gradePercent", "from -15 to 15 %"),
        ["obstacle height missing"] = new(plan => Properties(plan, 4).Remove("heightM"), "features[4].properties.heightM", "An obstacle needs heightM"),
        ["obstacle too low"] = new(plan => Properties(plan, 4)["heightM"] = 0.05, "features[4].properties.heightM", "from 0.1 to 100 m"),
        ["obstacle too high"] = new(plan => Properties(plan, 4)["heightM"] = 150, "features[4].properties.heightM", "from 0.1 to 100 m"),
        ["obstacle height NaN"] = new(plan => Properties(plan, 3)["heightM"] = "NaN", "features[3].properties.heightM", "it is the string \"NaN\""),
        ["obstacle height Infinity"] = new(plan => Properties(plan, 3)["heightM"] = "Infinity", "features[3].properties.heightM", "it is the string \"Infinity\""),
        ["obstacle height too large a number"] = new(plan => Properties(plan, 3)["heightM"] = JsonNode.Parse("1e400"), "features[3].properties.heightM", "1e400 is too large"),
        ["obstacle height null"] = new(plan => Properties(plan, 3)["heightM"] = null, "features[3].properties.heightM", "needs heightM"),
        ["eye too high"] = new(plan => Properties(plan, 0)["eyeHeightM"] = 5, "features[0].properties.eyeHeightM", "from 0.5 to 4 m"),
        ["eye too low"] = new(plan => Properties(plan, 0)["eyeHeightM"] = 0.3, "features[0].properties.eyeHeightM", "from 0.5 to 4 m"),
        ["coordinate NaN"] = new(plan => Coordinates(plan, 0)[0] = "NaN", "features[0].geometry.coordinates[0]", "the string \"NaN\""),
        ["coordinate too large a number"] = new(plan => Coordinates(plan, 0)[1] = JsonNode.Parse("-1e400"), "features[0].geometry.coordinates[1]", "too large"),
        ["longitude out of range"] = new(plan => Coordinates(plan, 0)[0] = 190.5, "features[0].geometry.coordinates[0]", "Longitude 190.5 is outside -180 to 180"),
        ["latitude out of range"] = new(plan => Coordinates(plan, 3)[0]![2]![1] = 95, "features[3].geometry.coordinates[0][2][1]", "Latitude 95 is outside -90 to 90"),
        ["plan larger than a corner"] = new(
            plan => Geometry(plan, 7)["coordinates"] = DemoCorner.Rectangle(DemoCorner.LonLat, 900, 7, 1100, 9.5),
            "features", "1160 m east-west and 14 m north-south; all of it must fit in 1000 m × 1000 m"),
        ["eye inside an obstacle"] = new(
            plan => Geometry(plan, 0)["coordinates"] = DemoCorner.LonLat(-10, -0.75),
            "features[0].geometry.coordinates", "inside obstacle \"Garden wall\" (features[3])"),
        ["unsupported crs"] = new(
            plan => plan["crs"] = Crs("urn:ogc:def:crs:EPSG::3857"),
            "crs.properties.name", "\"urn:ogc:def:crs:EPSG::3857\" is not supported; supported are WGS84 longitude/latitude (EPSG:4326, CRS84), the UTM zones"),
        ["linked crs"] = new(
            plan => plan["crs"] = new JsonObject { ["type"] = "link", ["properties"] = new JsonObject { ["href"] = "a.prj" } },
            "crs.type", "named crs"),
        ["unknown frame"] = new(plan => plan["frame"] = "local-feet", "frame", "\"local-metres\""),
        ["frame and crs together"] = new(
            plan => { plan["frame"] = "local-metres"; plan["crs"] = Crs("EPSG:32632"); },
            "frame", "not both"),
        ["feature id an object"] = new(plan => plan["features"]![2]!["id"] = new JsonObject(), "features[2].id", "string or a number"),
        ["name not a string"] = new(plan => Properties(plan, 2)["name"] = 7, "features[2].properties.name", "name must be a string"),
        ["too many features"] = new(
            plan => AddCopies(plan, 6, 493),
            "features", "The plan has 501 features; at most 500 are accepted"),
        ["too many vertices"] = new(
            plan =>
            {
                Geometry(plan, 5)["coordinates"] = new JsonArray([.. Enumerable.Range(0, 5_000).Select(i => DemoCorner.LonLat(-5 + (i * 0.0005), 8.5))]);
                AddCopies(plan, 5, 4);
            },
            "features", "at most 20000 are accepted"),
        ["duplicate id"] = new(plan => plan["features"]![2]!["id"] = 11, "features[2].id", "already the id of features[1]"),
        ["name too long"] = new(plan => Properties(plan, 3)["name"] = new string('x', 201), "features[3].properties.name", "at most 200 are accepted"),
        ["approach folded far beyond its sight distance"] = new(
            plan => Geometry(plan, 1)["coordinates"] = new JsonArray([.. Serpentine(strips: 6, lengthM: 400)]),
            "features[1].geometry.coordinates", "at most 2000 m are accepted"),
        ["mounting zone the size of a block"] = new(
            plan => plan["features"]![5]!["geometry"] = DemoCorner.Geometry("Polygon", DemoCorner.Rectangle(DemoCorner.LonLat, -40, 10, 40, 50)),
            "features[5].geometry.coordinates", "at most 2500 m² are accepted"),
        ["mounting zone line along a whole district"] = new(
            plan => plan["features"]![5]!["geometry"] = DemoCorner.Geometry("LineString", new JsonArray(DemoCorner.LonLat(-300, 10), DemoCorner.LonLat(300, 10))),
            "features[5].geometry.coordinates", "at most 500 m are accepted"),
        ["too many vertices in one geometry"] = new(
            plan => Geometry(plan, 5)["coordinates"] = new JsonArray([.. Enumerable.Range(0, 5_001).Select(i => DemoCorner.LonLat(-5 + (i * 0.0005), 8.5))]),
            "features[5].geometry.coordinates", "at most 5000 are accepted in one feature"),
    };

    public static TheoryData<string> CaseNames => [.. Cases.Keys];

    [Theory]
    [MemberData(nameof(CaseNames))]
    public void Read_SpoiledPlan_ReportsOneProblemAtItsPath(string name)
    {
        var (spoil, path, messagePart) = Cases[name];
        var plan = DemoCorner.Wgs84();
        spoil(plan);

        var result = DemoCorner.Read(plan);

        var problem = Assert.Single(result.Problems);
        Assert.Equal(path, problem.Path);
        Assert.Contains(messagePart, problem.Message, StringComparison.Ordinal);
        Assert.Null(result.Plan);
    }

    [Fact]
    public void Read_NotAnObject_ReportsTheWholeDocument()
    {
        var problem = Assert.Single(DemoCorner.Read(new JsonArray()).Problems);

        Assert.Equal(("", true), (problem.Path, problem.Message.Contains("FeatureCollection", StringComparison.Ordinal)));
    }

    [Fact]
    public void Read_PlanWithSeveralProblems_ReportsEveryOne()
    {
        var plan = DemoCorner.Wgs84();
        Properties(plan, 1)["speedKmh"] = 300;
        Properties(plan, 3)["role"] = "tree";
        Coordinates(plan, 4)[0]![1]![0] = "east";
        Properties(plan, 0)["eyeHeightM"] = 9;

        var paths = DemoCorner.Read(plan).Problems.Select(problem => problem.Path);

        Assert.Equal(
            ["features[0].properties.eyeHeightM", "features[1].properties.speedKmh", "features[3].properties.role", "features[4].geometry.coordinates[0][1][0]"],
            paths);
    }

    [Fact]
    public void Read_PolygonProblem_GivesItsPlaceInPlanCoordinates()
    {
        var plan = DemoCorner.Wgs84();
        Cases["self-intersecting obstacle"].Spoil(plan);
        var crossing = DemoCorner.LonLat(-15.5, -0.75); // where the bow tie's edges cross, by symmetry

        var message = Assert.Single(DemoCorner.Read(plan).Problems).Message;

        var numbers = message[(message.LastIndexOf('(') + 1)..message.LastIndexOf(')')].Split(", ").Select(double.Parse).ToArray();
        Assert.Equal((double)crossing[0]!, numbers[0], 1e-7);
        Assert.Equal((double)crossing[1]!, numbers[1], 1e-7);
    }

    [Theory]
    [InlineData(500, true)]
    [InlineData(501, false)]
    public void Read_FeatureCountAtTheLimit_IsAccepted(int featureCount, bool accepted)
    {
        var plan = DemoCorner.Wgs84();
        AddCopies(plan, 6, featureCount - 8);

        Assert.Equal(accepted, DemoCorner.Read(plan).Succeeded);
    }

    [Theory]
    [InlineData(12, true)]
    [InlineData(13, false)]
    public void Read_ApproachCountAtTheLimit_IsAccepted(int approachCount, bool accepted)
    {
        // Common practice: a crossroads of two dual carriageways has eight traffic streams; the limit leaves room for more.
        var plan = DemoCorner.Wgs84();
        for (var i = 2; i < approachCount; i++)
        {
            var copy = Features(plan)[2]!.DeepClone().AsObject();
            copy.Remove("id");
            Features(plan).Add(copy);
        }

        var read = DemoCorner.Read(plan);
        Assert.Equal(accepted, read.Succeeded);
        Assert.True(accepted || read.Problems.Any(p => p.Message.Contains("at most 12 are accepted", StringComparison.Ordinal)));
    }

    [Theory]
    [InlineData(5.0, true)]
    [InlineData(200.0, true)]
    [InlineData(4.99, false)]
    [InlineData(200.01, false)]
    public void Read_SpeedAtTheEndsOfItsRange_IsAccepted(double speedKmh, bool accepted)
    {
        var plan = DemoCorner.Wgs84();
        Properties(plan, 1)["speedKmh"] = speedKmh;

        Assert.Equal(accepted, DemoCorner.Read(plan).Succeeded);
    }

    [Fact]
    public void Read_OwnLimits_AreStatedInTheProblem()
    {
        var result = DemoCorner.Read(DemoCorner.Wgs84(), new SitePlanLimits { MaxExtentM = 100 });

        Assert.Contains("must fit in 100 m × 100 m", Assert.Single(result.Problems).Message, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("\\ud800")]
    [InlineData("\\udc00 tail")]
    public void Read_LoneSurrogateInAName_ReportsTheName(string escaped)
    {
        var text = DemoCorner.Wgs84().ToJsonString().Replace("Quillby Yard exit", escaped, StringComparison.Ordinal);
        using var plan = JsonDocument.Parse(text);

        var problem = Assert.Single(SitePlanReader.Read(plan.RootElement).Problems);

        Assert.Equal(("features[0].properties.name", true), (problem.Path, problem.Message.Contains("not valid Unicode", StringComparison.Ordinal)));
    }

    [Fact]
    public void Read_LoneSurrogateInATopLevelMemberName_ReportsThePlan()
    {
        var text = DemoCorner.Wgs84().ToJsonString().Replace("{\"type\":\"FeatureCollection\"", "{\"\\ud800\":1,\"type\":\"FeatureCollection\"", StringComparison.Ordinal);
        using var plan = JsonDocument.Parse(text);

        var problem = Assert.Single(SitePlanReader.Read(plan.RootElement).Problems);

        Assert.Equal("", problem.Path);
    }

    [Fact]
    public void Read_NumbersWherePositionsBelong_ListsTheFirstTenAndSaysThereAreMore()
    {
        var plan = DemoCorner.Wgs84();
        Geometry(plan, 1)["coordinates"] = new JsonArray([.. Enumerable.Repeat(0, 50_000).Select(zero => (JsonNode)zero)]);

        var problems = DemoCorner.Read(plan).Problems.ToList();

        Assert.Equal(11, problems.Count);
        Assert.Contains("only the first 10", problems[^1].Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Read_InvalidUtf8InAMemberName_ReportsItsObject()
    {
        var bytes = Encoding.UTF8.GetBytes(DemoCorner.Wgs84().ToJsonString());
        bytes[bytes.AsSpan().IndexOf("\"name\""u8) + 1] = 0xFF; // the first feature's "name" member; 0xFF is never valid in UTF-8: RFC 3629, 1
        using var plan = JsonDocument.Parse(bytes);

        var problem = Assert.Single(SitePlanReader.Read(plan.RootElement).Problems);

        Assert.Equal("features[0].properties", problem.Path);
    }

    // West and east along strips 1 m apart north of the road: a long lane folded into a small box, simple and never turning back.
    private static IEnumerable<JsonArray> Serpentine(int strips, double lengthM)
    {
        for (var i = 0; i < strips; i++)
        {
            var (from, to) = i % 2 == 0 ? (-lengthM / 2, lengthM / 2) : (lengthM / 2, -lengthM / 2);
            yield return DemoCorner.LonLat(from, 12 + i);
            yield return DemoCorner.LonLat(to, 12 + i);
        }
    }

    private static JsonArray Features(JsonObject plan) => plan["features"]!.AsArray();

    private static JsonObject Properties(JsonObject plan, int feature) => plan["features"]![feature]!["properties"]!.AsObject();

    private static JsonObject Geometry(JsonObject plan, int feature) => plan["features"]![feature]!["geometry"]!.AsObject();

    private static JsonArray Coordinates(JsonObject plan, int feature) => Geometry(plan, feature)["coordinates"]!.AsArray();

    private static JsonObject Crs(string name) => new() { ["type"] = "name", ["properties"] = new JsonObject { ["name"] = name } };

    private static void AddCopies(JsonObject plan, int feature, int count)
    {
        for (var i = 0; i < count; i++)
        {
            Features(plan).Add(Features(plan)[feature]!.DeepClone());
        }
    }
}
