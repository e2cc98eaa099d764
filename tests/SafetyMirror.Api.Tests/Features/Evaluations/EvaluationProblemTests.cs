using System.Net;
using System.Text;
using System.Text.Json;
using System.Text.Json.Nodes;
using NetTopologySuite.Geometries;
using NetTopologySuite.Operation.Valid;
using SafetyMirror.Core.Site;

namespace SafetyMirror.Api.Tests.Features.Evaluations;

// Each bad request is a 400 RFC 9457 problem whose errors name the field at fault, never a 500.
// Changes are made to the invented local demo corner: features 0 eye, 1 eastbound, 2 westbound, 3 corner house,
// 4 hedge, 5 carriageway, 6 footway, 7 mounting zone.
[Collection(ApiCollection.Name)]
public sealed class EvaluationProblemTests(ApiFactory api)
{
    // The roles a plan's features can have, as the request's plan description lists them.
    private const string KnownRoles = "eye, approach, obstacle, mounting-zone, carriageway, footway";

    [Fact]
    public Task UnknownRole_IsNamedAtTheRoleWithTheKnownRoles() =>
        AssertRejectedAsync(b => b.Feature(3)["properties"]!["role"] = "wall", "plan.features[3].properties.role", KnownRoles);

    [Fact]
    public Task PlanWithoutEye_IsNamedAtTheFeatures() =>
        AssertRejectedAsync(b => b["plan"]!["features"]!.AsArray().RemoveAt(0), "plan.features", "role \"eye\"");

    [Fact]
    public Task PlanWithoutApproach_IsNamedAtTheFeatures() =>
        AssertRejectedAsync(
            b =>
            {
                b["plan"]!["features"]!.AsArray().RemoveAt(2);
                b["plan"]!["features"]!.AsArray().RemoveAt(1);
            },
            "plan.features",
            "role \"approach\"");

    [Fact]
    public Task ApproachWithARepeatedPoint_IsNamedAtTheRepeat() =>
        AssertRejectedAsync(b => b.Feature(1)["geometry"]!["coordinates"] = Positions([-120, 1.5], [-40, 1.5], [-40, 1.5], [0, 1.5]),
            "plan.features[1].geometry.coordinates[2]", "repeats position 1");

    [Fact]
    public Task ApproachShorterThanTheSightDistance_IsNamedAtItsGeometry() =>
        // 30 km/h needs 35 m of stopping sight distance (AASHTO Green Book 2011, Table 3-1); 30 m are drawn.
        AssertRejectedAsync(b => b.Feature(2)["geometry"]!["coordinates"] = Positions([30, 4.5], [0, 4.5]),
            "plan.features[2].geometry", "35 m");

    [Fact]
    public Task ApproachWithSpeedInKmhAndInMph_IsNamedAtTheFeature() =>
        AssertRejectedAsync(b => b.Feature(1)["properties"]!["speedMph"] = 20,
            "plan.features[1].properties.speedMph", "An approach takes speedKmh or speedMph, not both; \"Colliers Row eastbound\" (features[1]) gives both");

    [Fact]
    public Task ApproachWithNeitherSpeed_IsNamedAtTheFeature() =>
        AssertRejectedAsync(b => b.Feature(1)["properties"]!.AsObject().Remove("speedKmh"),
            "plan.features[1].properties.speedKmh", "\"Colliers Row eastbound\" (features[1]) gives neither");

    [Fact]
    public Task DowngradeSteeperThanTheBrakingHolds_IsNamedAtTheGrade() =>
        // 1 m/s² holds a vehicle only on downgrades shallower than 100·1/9.81 = 10.19 % (braking part V²/(254·(a/9.81 + G))).
        AssertRejectedAsync(
            b =>
            {
                b.Feature(1)["properties"]!["gradePercent"] = -12;
                b["options"]!["sightDistance"]!["decelerationMps2"] = 1;
            },
            "plan.features[1].properties.gradePercent", "must be greater than -10.19 %");

    [Fact]
    public Task UnknownSightDistanceUnits_IsNamedWithTheKnownOnes() =>
        AssertRejectedAsync(b => b["options"]!["sightDistance"]!["units"] = "imperial", "options.sightDistance.units", "metric, us-customary");

    [Fact]
    public Task MetricDecelerationWithUsCustomaryUnits_IsRefusedNamingTheCustomaryOne() =>
        AssertRejectedAsync(
            b =>
            {
                b["options"]!["sightDistance"]!["units"] = "us-customary";
                b["options"]!["sightDistance"]!["decelerationMps2"] = 3.4;
            },
            "options.sightDistance.decelerationMps2", "Give decelerationFtps2");

    [Fact]
    public Task UsCustomaryUnitsWithAFixedDistance_IsRefusedAtTheUnits() =>
        AssertRejectedAsync(
            b => b["options"]!["sightDistance"] = new JsonObject { ["method"] = "fixed", ["distanceM"] = 40, ["reference"] = "Invented local code §1", ["units"] = "us-customary" },
            "options.sightDistance.units", "given in metres");

    [Fact]
    public async Task BowTiePolygon_IsNamedAtItsCoordinatesWithNetTopologySuitesReason()
    {
        double[][] bowTie = [[2, -12], [2.8, -1], [2.8, -12], [2, -1], [2, -12]];
        var reason = new IsValidOp(new GeometryFactory().CreatePolygon([.. bowTie.Select(p => new Coordinate(p[0], p[1]))])).ValidationError.Message;
        var body = DemoCorners.Local();
        body.Feature(4)["geometry"]!["coordinates"] = new JsonArray(Positions(bowTie));

        var errors = await ErrorsAsync(body);

        Assert.Contains(reason, MessagesAt(errors, "plan.features[4].geometry.coordinates"), StringComparison.Ordinal);
    }

    [Fact]
    public Task UnknownTimeZone_IsNamedAtThePlansTimeZone() =>
        AssertRejectedAsync(b => b["plan"]!["timeZone"] = "Middle/Nowhere", "plan.timeZone", "IANA time zone name");

    [Fact]
    public Task NegativeObstacleHeight_IsNamedAtTheHeight() =>
        AssertRejectedAsync(b => b.Feature(3)["properties"]!["heightM"] = -1, "plan.features[3].properties.heightM", "it is -1");

    [Fact]
    public Task MissingObstacleHeight_IsNamedAtTheHeight() =>
        AssertRejectedAsync(b => b.Feature(3)["properties"]!.AsObject().Remove("heightM"), "plan.features[3].properties.heightM", "needs heightM");

    [Fact]
    public Task SpeedOutOfRange_IsNamedAtTheSpeed() =>
        AssertRejectedAsync(b => b.Feature(1)["properties"]!["speedKmh"] = 300, "plan.features[1].properties.speedKmh", "it is 300");

    [Fact]
    public Task Wgs84LatitudeBeyond90_IsNamedAtTheLatitude() =>
        // Latitudes run from -90 to 90 degrees (common practice).
        AssertRejectedAsync(b => b.Feature(0)["geometry"]!["coordinates"] = new JsonArray(9.93, 95), "plan.features[0].geometry.coordinates[1]", "Latitude 95",
            DemoCorners.Wgs84());

    [Fact]
    public Task PlanLargerThanACorner_IsNamedAtTheFeatures() =>
        AssertRejectedAsync(b => b.Feature(2)["geometry"]!["coordinates"] = Positions([3000, 4.5], [0, 4.5]),
            "plan.features", $"{SitePlanLimits.Default.MaxExtentM} m × {SitePlanLimits.Default.MaxExtentM} m");

    [Fact]
    public Task EyeInsideAnObstacle_IsNamedAtTheEye() =>
        AssertRejectedAsync(b => b.Feature(0)["geometry"]!["coordinates"] = new JsonArray(-10, -10), "plan.features[0].geometry.coordinates", "corner house");

    [Fact]
    public Task MirrorInsideAnObstacle_IsNamedAtItsLocation() =>
        AssertRejectedAsync(b => b["mirror"]!["location"]!["coordinates"] = new JsonArray(-10, -10), "mirror.location", "corner house");

    [Fact]
    public Task PlanWithTooManyFeatures_IsNamedAtTheFeatures() =>
        AssertRejectedAsync(
            b =>
            {
                var features = b["plan"]!["features"]!.AsArray();
                while (features.Count <= SitePlanLimits.Default.MaxFeatures)
                {
                    features.Add(b.Feature(5).DeepClone());
                }
            },
            "plan.features",
            $"at most {SitePlanLimits.Default.MaxFeatures}");

    [Fact]
    public Task NegativeRadius_IsNamedAtTheRadius() =>
        AssertRejectedAsync(b => b["mirror"]!["radiusM"] = -1, "mirror.radiusM", "it was -1");

    [Fact]
    public async Task NegativeRadius_IsOneProblemAboutTheValueSent()
    {
        var body = DemoCorners.Local();
        body["mirror"]!["radiusM"] = -1;

        var errors = await ErrorsAsync(body);

        Assert.Contains("-1", Assert.Single(errors.GetProperty("mirror.radiusM").EnumerateArray()).GetString(), StringComparison.Ordinal);
    }

    [Fact]
    public Task FaceWiderThanItsSphere_IsNamedAtTheRadius() =>
        // A face 1.0 m across cannot lie on a sphere of radius 0.4 m: half its extent, 0.5 m, exceeds the radius.
        AssertRejectedAsync(
            b =>
            {
                b["mirror"]!["diameterM"] = 1.0;
                b["mirror"]!["radiusM"] = 0.4;
            },
            "mirror.radiusM",
            "(0.5 m)");

    [Fact]
    public Task RoundAndRectangularFaceAtOnce_IsNamedAtTheDiameter() =>
        AssertRejectedAsync(b => b["mirror"]!["widthM"] = 0.6, "mirror.diameterM", "not both");

    [Fact]
    public Task UnknownSightDistanceMethod_IsNamedAtTheMethod() =>
        AssertRejectedAsync(b => b["options"]!["sightDistance"]!["method"] = "braking", "options.sightDistance.method", "\"braking\"");

    [Fact]
    public Task UnknownRoadUser_IsNamedAtItsId() =>
        AssertRejectedAsync(b => b["options"]!["roadUsers"]!.AsArray().Add(new JsonObject { ["id"] = "tram" }), "options.roadUsers[2].id", "\"tram\"");

    [Fact]
    public Task DetectionAboveRecognition_IsNamedAtTheDetectionThreshold() =>
        AssertRejectedAsync(
            b =>
            {
                b["options"]!["recognitionArcmin"] = 10;
                b["options"]!["detectionArcmin"] = 12;
            },
            "options.detectionArcmin",
            "recognition threshold");

    [Fact]
    public Task StringWhereANumberBelongs_IsNamedAtTheMember() =>
        AssertRejectedAsync(b => b["mirror"]!["radiusM"] = "2.2", "mirror.radiusM", "Must be a finite JSON number from 0.3 to 50");

    [Fact]
    public Task UnknownMember_IsRejectedByName() =>
        AssertRejectedAsync(b => b["mirror"]!["radiusMm"] = 2200, "mirror.radiusMm", "Unknown member \"radiusMm\"");

    [Fact]
    public async Task MalformedJson_IsNamedWithItsLineAndByte()
    {
        // Two commas in a row: the second one, on line 3 at byte 20, cannot start a member (RFC 8259, 4).
        const string body = "{\n  \"mirror\": {\n    \"radiusM\": 2.2,,\n    \"diameterM\": 0.6\n  }\n}";

        using var response = await api.PostEvaluationTextAsync(body);

        var problem = await response.AssertProblemAsync(HttpStatusCode.BadRequest);
        Assert.Contains("line 3, byte 20", MessagesAt(problem.GetProperty("errors"), "mirror"), StringComparison.Ordinal);
    }

    [Fact]
    public async Task BodyOverTwoMebibytes_Gets413Problem()
    {
        // The service's own cap: 2 MiB (RequestLimits.MaxRequestBodyBytes); 413 Content Too Large: RFC 9110, 15.5.14.
        var body = DemoCorners.Local().ToJsonString() + new string(' ', 2 * 1024 * 1024);

        using var response = await api.PostEvaluationTextAsync(body);

        await response.AssertProblemAsync(HttpStatusCode.RequestEntityTooLarge);
    }

    [Fact]
    public async Task ChunkedBodyOverTwoMebibytes_Gets413ProblemFromKestrel()
    {
        // Without a Content-Length only the server can count the bytes: the in-memory test server does not, Kestrel does.
        using var kestrel = new ApiFactory();
        kestrel.UseKestrel(0);
        kestrel.StartServer();
        var body = DemoCorners.Local().ToJsonString() + new string(' ', 2 * 1024 * 1024);

        using var response = await kestrel.PostEvaluationTextAsync(body, chunked: true);

        await response.AssertProblemAsync(HttpStatusCode.RequestEntityTooLarge);
    }

    [Fact]
    public async Task SeveralProblems_AreAllListed()
    {
        var body = DemoCorners.Local();
        body.Feature(1)["properties"]!["speedKmh"] = 300;
        body.Feature(3)["properties"]!["heightM"] = -1;
        body["mirror"]!["radiusM"] = -1;
        body["options"]!["sightDistance"]!["method"] = "braking";

        var errors = await ErrorsAsync(body);

        Assert.Equal(
            ["mirror.radiusM", "options.sightDistance.method", "plan.features[1].properties.speedKmh", "plan.features[3].properties.heightM"],
            errors.EnumerateObject().Select(e => e.Name).Order(StringComparer.Ordinal));
    }

    [Fact]
    public async Task BadRequest_LeavesTheServiceAnswering()
    {
        var bad = DemoCorners.Local();
        bad.Feature(3)["properties"]!["heightM"] = -1;
        using var rejected = await api.PostEvaluationAsync(bad);
        await rejected.AssertProblemAsync(HttpStatusCode.BadRequest);

        var answer = await api.EvaluateAsync(DemoCorners.Local());

        Assert.Equal("meets-requirement", answer.GetProperty("decision").GetString());
    }

    private static JsonArray Positions(params double[][] positions) => [.. positions.Select(p => new JsonArray([.. p.Select(x => JsonValue.Create(x))]))];

    private static string MessagesAt(JsonElement errors, string path)
    {
        Assert.True(errors.TryGetProperty(path, out var messages), $"No problem at {path}; the problems were {errors}");
        return string.Join(" | ", messages.EnumerateArray().Select(m => m.GetString()));
    }

    private async Task AssertRejectedAsync(Action<JsonObject> change, string path, string said, JsonObject? body = null)
    {
        body ??= DemoCorners.Local();
        change(body);

        var errors = await ErrorsAsync(body);

        Assert.Contains(said, MessagesAt(errors, path), StringComparison.Ordinal);
    }

    private async Task<JsonElement> ErrorsAsync(JsonObject body)
    {
        using var response = await api.PostEvaluationAsync(body);
        var problem = await response.AssertProblemAsync(HttpStatusCode.BadRequest);
        return problem.GetProperty("errors");
    }
}
