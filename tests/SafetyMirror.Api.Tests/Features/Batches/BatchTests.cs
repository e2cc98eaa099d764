using System.Diagnostics;
using System.Net;
using System.Text;
using System.Text.Json;
using System.Text.Json.Nodes;
using SafetyMirror.Api.Tests.Access;
using SafetyMirror.Api.Tests.Features.Studies;

namespace SafetyMirror.Api.Tests.Features.Batches;

// District batches through the real pipeline and the real job engine (Hangfire on its SQLite file), in Development
// (loopback callers act as owner "local"), each test on fresh files.
public sealed class BatchTests : IDisposable
{
    private readonly ConfiguredApi api = new(ConfiguredApi.Development, ("Service:Role", "all"), ("Batches:CornersPerJob", "2"), ("Batches:PollSeconds", "0.2"));

    public void Dispose() => api.Dispose();

    [Fact]
    public async Task Post_CollectionOfCorners_ScreensEveryCornerAsTheSingleRoutesDoAndKeepsEachAsAStudy()
    {
        using var client = api.CreateClient();
        var district = Districts.Collection(("EB-1", true), ("EB-2", false));

        var id = await Districts.SubmitAsync(client, district.ToJsonString());
        var batch = await Districts.WaitUntilFinishedAsync(client, id);

        Assert.Equal(2, batch.GetProperty("counts").GetProperty("done").GetInt32());
        var corners = batch.GetProperty("corners").EnumerateArray().ToList();
        var evaluated = corners[0].GetProperty("outcome");
        var alone = await api.PostForJsonAsync("/v1/evaluations", DemoCorners.Local());
        Assert.Equal("evaluation", evaluated.GetProperty("kind").GetString());
        Assert.Equal(alone.GetProperty("decision").GetString(), evaluated.GetProperty("decision").GetString());
        Assert.Equal(alone.GetProperty("summary").GetString(), evaluated.GetProperty("summary").GetString());
        Assert.Equal("recommendation", corners[1].GetProperty("outcome").GetProperty("kind").GetString());

        // Each screened corner is a study of its own, whose stored answer is the one the batch lists.
        foreach (var corner in corners)
        {
            using var study = await client.GetAsync(new Uri(corner.GetProperty("study").GetString()!, UriKind.Relative));
            Assert.Equal(HttpStatusCode.OK, study.StatusCode);
            using var body = JsonDocument.Parse(await study.Content.ReadAsStringAsync());
            Assert.Equal(corner.GetProperty("outcome").GetProperty("decision").GetString(),
                body.RootElement.GetProperty("revisions")[0].GetProperty("decision").GetString());
        }
    }

    [Fact]
    public async Task Post_MalformedCorner_FailsAloneWithProblemNamingTheFeatureOfTheBatch()
    {
        using var client = api.CreateClient();
        var district = Districts.Collection(("EB-1", true), ("EB-2", true), ("EB-3", true));
        var hedge = Districts.IndexOf(district, "EB-2", "obstacle");
        district["features"]![hedge]!["properties"]!["heightM"] = -3;

        var id = await Districts.SubmitAsync(client, district.ToJsonString());
        var batch = await Districts.WaitUntilFinishedAsync(client, id);

        var counts = batch.GetProperty("counts");
        Assert.Equal((2, 1), (counts.GetProperty("done").GetInt32(), counts.GetProperty("failed").GetInt32()));
        var failed = batch.GetProperty("corners")[1];
        Assert.Equal("failed", failed.GetProperty("status").GetString());
        var problem = failed.GetProperty("problem");
        Assert.Equal(400, problem.GetProperty("status").GetInt32()); // RFC 9457 problem details, kept with the corner
        Assert.True(problem.GetProperty("errors").TryGetProperty($"features[{hedge}].properties.heightM", out _), problem.ToString());
    }

    [Fact]
    public async Task Post_MirrorOutOfRange_NamesTheMirrorFeatureProperty()
    {
        using var client = api.CreateClient();
        var district = Districts.Collection(("EB-1", true));
        var mirror = Districts.IndexOf(district, "EB-1", "mirror");
        district["features"]![mirror]!["properties"]!["radiusM"] = 900;

        var batch = await Districts.WaitUntilFinishedAsync(client, await Districts.SubmitAsync(client, district.ToJsonString()));

        var problem = batch.GetProperty("corners")[0].GetProperty("problem");
        Assert.True(problem.GetProperty("errors").TryGetProperty($"features[{mirror}].properties.radiusM", out _), problem.ToString());
    }

    [Fact]
    public async Task Post_TextSequence_ReadsOneCornerPerRecord()
    {
        // RFC 8142: each GeoJSON text opens with the record separator 0x1E and ends with a line feed.
        using var client = api.CreateClient();
        var demo = DemoCorners.Local();
        var records = new StringBuilder();
        foreach (var corner in new[] { "SEQ-1", "SEQ-2" })
        {
            var plan = demo["plan"]!.DeepClone().AsObject();
            plan["corner"] = corner;
            records.Append('\u001e').Append(plan.ToJsonString()).Append('\n');
        }

        var batch = await Districts.WaitUntilFinishedAsync(client, await Districts.SubmitAsync(client, records.ToString(), "application/geo+json-seq"));

        Assert.Equal(["SEQ-1", "SEQ-2"], batch.GetProperty("corners").EnumerateArray().Select(c => c.GetProperty("corner").GetString()));
        Assert.Equal(2, batch.GetProperty("counts").GetProperty("done").GetInt32());
    }

    [Fact]
    public async Task Post_SharedOptionsAndOverride_TheOverrideWinsForItsCornerOnly()
    {
        using var client = api.CreateClient();
        var district = Districts.Collection(("EB-1", true), ("EB-2", true));
        district["options"] = new JsonObject { ["sightDistance"] = new JsonObject { ["method"] = "fixed", ["distanceM"] = 30, ["reference"] = "Eastbrook local rule 4 (invented)" } };
        district["corners"] = new JsonObject
        {
            ["EB-2"] = new JsonObject
            {
                ["name"] = "Tansy Mews exit",
                ["options"] = new JsonObject { ["sightDistance"] = new JsonObject { ["method"] = "fixed", ["distanceM"] = 60, ["reference"] = "Eastbrook local rule 5 (invented)" } },
            },
        };

        var batch = await Districts.WaitUntilFinishedAsync(client, await Districts.SubmitAsync(client, district.ToJsonString()));

        var corners = batch.GetProperty("corners");
        Assert.Equal("Tansy Mews exit", corners[1].GetProperty("name").GetString());
        Assert.Equal(30, corners[0].GetProperty("outcome").GetProperty("critical").GetProperty("requiredM").GetDouble());
        Assert.Equal(60, corners[1].GetProperty("outcome").GetProperty("critical").GetProperty("requiredM").GetDouble());
    }

    [Fact]
    public async Task Post_SharedSearchOptions_SteerRecommendationsAndLeaveEvaluatedCornersAlone()
    {
        using var client = api.CreateClient();
        var district = Districts.Collection(("EB-1", true), ("EB-2", false));
        district["options"] = new JsonObject { ["minCentreHeightM"] = 2.6, ["maxCentreHeightM"] = 3.5 };

        var batch = await Districts.WaitUntilFinishedAsync(client, await Districts.SubmitAsync(client, district.ToJsonString()));

        Assert.Equal(2, batch.GetProperty("counts").GetProperty("done").GetInt32());
        var face = batch.GetProperty("corners")[1].GetProperty("outcome").GetProperty("mirrors")[0];
        Assert.InRange(face.GetProperty("centreHeightM").GetDouble(), 2.6, 3.5);
    }

    [Fact]
    public async Task Post_FeatureWithoutCorner_Answers400NamingItAndStoresNothing()
    {
        using var client = api.CreateClient();
        var district = Districts.Collection(("EB-1", true));
        district["features"]![3]!["properties"]!.AsObject().Remove("corner");

        using var response = await Districts.PostAsync(client, district.ToJsonString());

        var problem = await response.AssertProblemAsync(HttpStatusCode.BadRequest);
        Assert.True(problem.GetProperty("errors").TryGetProperty("features[3].properties.corner", out _), problem.ToString());
    }

    [Theory]
    [InlineData("{\"type\": \"Feature\"}", "type")]
    [InlineData("[1, 2]", "")]
    [InlineData("{\"type\": \"FeatureCollection\", \"features\": []}", "features")]
    [InlineData("{\"type\": \"FeatureCollection\", \"features\": [], \"options\": {\"recognitionArcmin\": \"ten\"}}", "options.recognitionArcmin")]
    public async Task Post_NotADistrict_Answers400NamingTheField(string body, string field)
    {
        using var client = api.CreateClient();

        using var response = await Districts.PostAsync(client, body);

        var problem = await response.AssertProblemAsync(HttpStatusCode.BadRequest);
        Assert.True(problem.GetProperty("errors").TryGetProperty(field, out _), problem.ToString());
    }

    [Fact]
    public async Task Post_OverrideForNoCorner_Answers400()
    {
        using var client = api.CreateClient();
        var district = Districts.Collection(("EB-1", true));
        district["corners"] = new JsonObject { ["EB-9"] = new JsonObject { ["name"] = "Nowhere" } };

        using var response = await Districts.PostAsync(client, district.ToJsonString());

        var problem = await response.AssertProblemAsync(HttpStatusCode.BadRequest);
        Assert.True(problem.GetProperty("errors").TryGetProperty("corners.EB-9", out _), problem.ToString());
    }

    [Fact]
    public async Task Layer_GeoJsonAndGeoPackage_AreReadByGdalWithAPointPerCorner()
    {
        using var client = api.CreateClient();
        var district = Districts.Collection(("EB-1", true), ("EB-2", true), ("EB-3", true));
        district["features"]![Districts.IndexOf(district, "EB-3", "obstacle")]!["properties"]!["heightM"] = -1;
        var id = await Districts.SubmitAsync(client, district.ToJsonString());
        await Districts.WaitUntilFinishedAsync(client, id);
        var folder = Directory.CreateTempSubdirectory("safetymirror-layer-");
        try
        {
            var geoJson = Path.Combine(folder.FullName, "district.geojson");
            var package = Path.Combine(folder.FullName, "district.gpkg");
            await File.WriteAllBytesAsync(geoJson, await client.GetByteArrayAsync(new Uri($"{Districts.Route}/{id}/layer", UriKind.Relative)));
            using (var request = new HttpRequestMessage(HttpMethod.Get, new Uri($"{Districts.Route}/{id}/layer", UriKind.Relative)))
            {
                request.Headers.Accept.ParseAdd("application/geopackage+sqlite3");
                using var response = await client.SendAsync(request);
                Assert.Equal("application/geopackage+sqlite3", response.Content.Headers.ContentType?.MediaType);
                await File.WriteAllBytesAsync(package, await response.Content.ReadAsByteArrayAsync());
            }

            // GDAL's ogrinfo, an independent reader of both formats (OGC GeoPackage 1.3; RFC 7946).
            foreach (var (file, driver) in new[] { (geoJson, "GeoJSON"), (package, "GPKG") })
            {
                var info = await Ogrinfo(file);
                Assert.Contains($"using driver `{driver}' successful", info, StringComparison.Ordinal);
                Assert.Contains("Feature Count: 3", info, StringComparison.Ordinal);
                Assert.Contains("decision (String) = meets-requirement", info, StringComparison.Ordinal);
                Assert.Contains("status (String) = failed", info, StringComparison.Ordinal);
                Assert.Contains("caution (String) = Screening only", info, StringComparison.Ordinal);
            }
        }
        finally
        {
            folder.Delete(recursive: true);
        }
    }

    [Fact]
    public async Task CancelThenResume_EveryCornerIsRecordedOnceWithOneStudy()
    {
        using var client = api.CreateClient();
        var corners = Enumerable.Range(1, 24).Select(i => ($"EB-{i}", true)).ToArray();
        var id = await Districts.SubmitAsync(client, Districts.Collection(corners).ToJsonString());

        using (var cancel = await client.PostAsync(new Uri($"{Districts.Route}/{id}/cancel", UriKind.Relative), null))
        {
            Assert.Equal(HttpStatusCode.OK, cancel.StatusCode);
        }

        // Workers stop within a corner: after a moment nothing runs and the rest waits.
        JsonElement held;
        var deadline = DateTime.UtcNow + TimeSpan.FromMinutes(1);
        do
        {
            await Task.Delay(500);
            held = await Districts.GetAsync(client, id);
        }
        while (held.GetProperty("counts").GetProperty("running").GetInt32() > 0 && DateTime.UtcNow < deadline);
        Assert.Equal("cancelled", held.GetProperty("state").GetString());
        Assert.True(held.GetProperty("counts").GetProperty("pending").GetInt32() > 0, held.GetProperty("counts").ToString());

        using (var resume = await client.PostAsync(new Uri($"{Districts.Route}/{id}/resume", UriKind.Relative), null))
        {
            Assert.Equal(HttpStatusCode.Accepted, resume.StatusCode);
        }

        var batch = await Districts.WaitUntilFinishedAsync(client, id);
        Assert.Equal(24, batch.GetProperty("counts").GetProperty("done").GetInt32());
        var studies = batch.GetProperty("corners").EnumerateArray().Select(c => c.GetProperty("study").GetString()).ToList();
        Assert.Equal(24, studies.Distinct().Count());
        using var list = await client.GetAsync(new Uri("/v1/studies?limit=500", UriKind.Relative));
        using var listed = JsonDocument.Parse(await list.Content.ReadAsStringAsync());
        Assert.Equal(24, listed.RootElement.GetProperty("total").GetInt32());
    }

    [Fact]
    public async Task TwoHostsInOneProcess_EachScreensItsOwnBatchWithItsOwnStore()
    {
        // Hangfire keeps some settings process-wide; each host must still build its jobs from its own services.
        using var other = new ConfiguredApi(ConfiguredApi.Development, ("Service:Role", "all"), ("Batches:PollSeconds", "0.2"));
        using var otherClient = other.CreateClient();
        using var client = api.CreateClient();

        var mine = await Districts.SubmitAsync(client, Districts.Collection(("EB-1", true)).ToJsonString());
        var theirs = await Districts.SubmitAsync(otherClient, Districts.Collection(("WB-1", true)).ToJsonString());

        Assert.Equal(1, (await Districts.WaitUntilFinishedAsync(client, mine)).GetProperty("counts").GetProperty("done").GetInt32());
        Assert.Equal(1, (await Districts.WaitUntilFinishedAsync(otherClient, theirs)).GetProperty("counts").GetProperty("done").GetInt32());
    }

    [Fact]
    public async Task Get_UnknownBatch_Answers404()
    {
        using var client = api.CreateClient();

        using var response = await client.GetAsync(new Uri($"{Districts.Route}/{Guid.NewGuid()}", UriKind.Relative));

        await response.AssertProblemAsync(HttpStatusCode.NotFound);
    }

    private static async Task<string> Ogrinfo(string file)
    {
        var start = new ProcessStartInfo("ogrinfo") { ArgumentList = { "-al", file }, RedirectStandardOutput = true, RedirectStandardError = true };
        using var process = Process.Start(start) ?? throw new InvalidOperationException("ogrinfo did not start: install gdal-bin.");
        var output = await process.StandardOutput.ReadToEndAsync();
        await process.WaitForExitAsync();
        Assert.True(process.ExitCode == 0, await process.StandardError.ReadToEndAsync());
        return output;
    }
}
