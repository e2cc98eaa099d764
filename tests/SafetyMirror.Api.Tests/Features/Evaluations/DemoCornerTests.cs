using System.Text.Json;

namespace SafetyMirror.Api.Tests.Features.Evaluations;

// The demo corner is invented (openapi/examples): a mews exit onto a 30 km/h street, a corner house hiding the
// eastbound lane, a 600 mm mirror of radius 2.2 m on the far footway. The figures compared are the service's own.
[Collection(ApiCollection.Name)]
public sealed class DemoCornerTests(ApiFactory api)
{
    // The WGS84 file was projected from the local one by the project's own transverse Mercator, so this proves the
    // service reads both frames to the same corner (within 1 cm and 0.01 arcmin), not the projection itself.
    private const double LengthToleranceM = 0.01;
    private const double AngleToleranceArcmin = 0.01;

    private static readonly string[] SummaryLengths = ["shownFromM", "shownToM", "directSightDistanceM", "providedSightDistanceM", "nearBlindZoneM"];
    private static readonly string[] StationLengths = ["reflectionPointHeightM", "pathLengthM", "equivalentDistanceM"];
    private static readonly string[] StationAngles = ["apparentHeightArcmin", "apparentWidthArcmin"];

    [Fact]
    public async Task LocalDemo_MeetsTheRequirement()
    {
        var answer = await api.EvaluateAsync(DemoCorners.Local());

        Assert.Equal("meets-requirement", answer.GetProperty("decision").GetString());
    }

    [Fact]
    public async Task LocalDemo_EvaluatesBothApproachesAgainstTheStoppingSightDistance()
    {
        var answer = await api.EvaluateAsync(DemoCorners.Local());

        var approaches = answer.GetProperty("approaches").EnumerateArray().ToList();
        Assert.Equal(["eastbound", "westbound"], approaches.Select(a => a.GetProperty("approach").GetProperty("id").GetString()));
        // 30 km/h: design stopping sight distance 35 m (AASHTO Green Book 2011, Table 3-1).
        Assert.All(approaches, a => Assert.Equal(35, a.GetProperty("summary").GetProperty("requiredSightDistanceM").GetDouble()));
    }

    [Fact]
    public async Task LocalDemo_CarriesTheSafetyCautions()
    {
        var answer = await api.EvaluateAsync(DemoCorners.Local());

        var cautions = answer.GetProperty("cautions").EnumerateArray().ToDictionary(c => c.GetProperty("code").GetString()!, c => c.GetProperty("text").GetString());
        // What every result must say (the project's safety rules): vehicles look farther and slower, a mirror does not
        // replace removing the obstruction, it needs upkeep, and local rules govern.
        Assert.Superset(new HashSet<string> { "looks-smaller-farther-slower", "last-resort", "needs-inspection", "local-rules-govern" }, cautions.Keys.ToHashSet());
        Assert.All(cautions.Values, text => Assert.False(string.IsNullOrWhiteSpace(text)));
    }

    [Fact]
    public async Task LocalDemo_ChecksNameTheirSourceAndAgreeWithTheirLimit()
    {
        var answer = await api.EvaluateAsync(DemoCorners.Local());

        var checks = answer.GetProperty("checks").EnumerateArray().ToList();
        Assert.NotEmpty(checks);
        Assert.All(checks, check =>
        {
            Assert.False(string.IsNullOrWhiteSpace(check.GetProperty("source").GetString()));
            var value = check.GetProperty("value").GetDouble();
            var limit = check.GetProperty("limit").GetDouble();
            var within = check.GetProperty("comparison").GetString() == "at-least" ? value >= limit : value <= limit;
            Assert.Equal(within, check.GetProperty("passes").GetBoolean());
        });
    }

    [Fact]
    public async Task Wgs84Demo_GivesTheLocalDemosFiguresStationByStation()
    {
        var local = await api.EvaluateAsync(DemoCorners.Local());
        var wgs84 = await api.EvaluateAsync(DemoCorners.Wgs84());

        Assert.Equal(local.GetProperty("decision").GetString(), wgs84.GetProperty("decision").GetString());
        AssertNear(local.GetProperty("mirror"), wgs84.GetProperty("mirror"), ["lowerEdgeHeightM", "distanceFromEyeM"], LengthToleranceM, "mirror");
        var localApproaches = local.GetProperty("approaches").EnumerateArray().ToList();
        var wgs84Approaches = wgs84.GetProperty("approaches").EnumerateArray().ToList();
        Assert.Equal(localApproaches.Count, wgs84Approaches.Count);
        foreach (var (l, w) in localApproaches.Zip(wgs84Approaches))
        {
            var id = l.GetProperty("approach").GetProperty("id").GetString();
            AssertNear(l, w, ["lengthM"], LengthToleranceM, id!);
            AssertNear(l.GetProperty("summary"), w.GetProperty("summary"), SummaryLengths, LengthToleranceM, $"{id} summary");
            foreach (var (lr, wr) in l.GetProperty("summary").GetProperty("roadUsers").EnumerateArray().Zip(w.GetProperty("summary").GetProperty("roadUsers").EnumerateArray()))
            {
                AssertNear(lr, wr, ["recognisableToM", "detectableToM"], LengthToleranceM, $"{id} reach of {lr.GetProperty("roadUser")}");
            }

            var localStations = l.GetProperty("stations").EnumerateArray().ToList();
            var wgs84Stations = w.GetProperty("stations").EnumerateArray().ToList();
            Assert.Equal(localStations.Count, wgs84Stations.Count);
            foreach (var (ls, ws) in localStations.Zip(wgs84Stations))
            {
                var at = $"{id} station {ls.GetProperty("stationM")} {ls.GetProperty("roadUser")}";
                Assert.Equal(ls.GetProperty("stationM").GetDouble(), ws.GetProperty("stationM").GetDouble(), LengthToleranceM);
                Assert.Equal(ls.GetProperty("shown").GetBoolean(), ws.GetProperty("shown").GetBoolean());
                Assert.Equal(ls.GetProperty("notShownReason").ToString(), ws.GetProperty("notShownReason").ToString());
                AssertNear(ls, ws, StationLengths, LengthToleranceM, at);
                AssertNear(ls, ws, StationAngles, AngleToleranceArcmin, at);
            }
        }
    }

    [Fact]
    public async Task Wgs84Demo_ReturnsTheMirrorWhereTheRequestPutIt()
    {
        var request = DemoCorners.Wgs84();

        var answer = await api.EvaluateAsync(request);

        var sent = request["mirror"]!["location"]!["coordinates"]!.AsArray().Select(c => c!.GetValue<double>()).ToList();
        var returned = answer.GetProperty("mirror").GetProperty("location").GetProperty("coordinates").EnumerateArray().Select(c => c.GetDouble()).ToList();
        Assert.Equal(2, returned.Count);
        Assert.Equal(sent[0], returned[0], 1e-9);
        Assert.Equal(sent[1], returned[1], 1e-9);
    }

    [Fact]
    public async Task Wgs84Demo_ReturnsTheFieldOfViewInLongitudeAndLatitude()
    {
        var request = DemoCorners.Wgs84();

        var answer = await api.EvaluateAsync(request);

        // The seen road lies within a few hundred metres of the mirror: within 0.01° of it in both axes.
        var mirror = request["mirror"]!["location"]!["coordinates"]!.AsArray().Select(c => c!.GetValue<double>()).ToList();
        var ring = answer.GetProperty("mirror").GetProperty("fieldOfView").GetProperty("outline").GetProperty("coordinates")[0].EnumerateArray().ToList();
        Assert.NotEmpty(ring);
        Assert.All(ring, position =>
        {
            Assert.Equal(mirror[0], position[0].GetDouble(), 0.01);
            Assert.Equal(mirror[1], position[1].GetDouble(), 0.01);
        });
    }

    /// <summary>Each named member is null in both or a number in both, and the numbers agree within the tolerance.</summary>
    private static void AssertNear(JsonElement expected, JsonElement actual, string[] members, double tolerance, string where)
    {
        foreach (var member in members)
        {
            var e = expected.GetProperty(member);
            var a = actual.GetProperty(member);
            Assert.True(e.ValueKind == a.ValueKind, $"{where}: {member} is {e} in local metres but {a} in WGS84.");
            if (e.ValueKind == JsonValueKind.Number)
            {
                var difference = Math.Abs(e.GetDouble() - a.GetDouble());
                Assert.True(difference <= tolerance, $"{where}: {member} is {e} in local metres but {a} in WGS84.");
            }
        }
    }
}
