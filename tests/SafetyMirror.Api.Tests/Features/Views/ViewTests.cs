using System.Buffers.Binary;
using System.Globalization;
using System.Net;
using System.Text.Json.Nodes;
using SafetyMirror.Api.Features.Views;
using SafetyMirror.Api.Tests.Access;
using SafetyMirror.Api.Tests.Features.Studies;

namespace SafetyMirror.Api.Tests.Features.Views;

[Collection(ApiCollection.Name)]
public sealed class ViewTests(ApiFactory api)
{
    private const string Route = "/v1/views";

    // The PNG signature and the IHDR chunk that must follow it: W3C PNG Specification (Third Edition), 5.2 and 11.2.1.
    private static readonly byte[] PngSignature = [137, 80, 78, 71, 13, 10, 26, 10];

    [Fact]
    public async Task PostViews_DemoCorner_AnswersAPngOfTheStatedSize()
    {
        var body = DemoCorners.Local();
        body["view"] = new JsonObject { ["widthPx"] = 320, ["heightPx"] = 240 };

        using var response = await api.PostJsonAsync(Route, body.ToJsonString(), accept: "image/png");

        Assert.Equal(HttpStatusCode.OK, response.StatusCode);
        Assert.Equal("image/png", response.Content.Headers.ContentType?.MediaType);
        var png = await response.Content.ReadAsByteArrayAsync();
        Assert.Equal(PngSignature, png[..8]);
        Assert.Equal("IHDR", System.Text.Encoding.ASCII.GetString(png, 12, 4));
        Assert.Equal((320, 240), (BinaryPrimitives.ReadInt32BigEndian(png.AsSpan(16)), BinaryPrimitives.ReadInt32BigEndian(png.AsSpan(20))));
        KeepForLooking("view-demo-corner-local.png", png);
    }

    [Fact]
    public async Task PostViews_FieldOfViewGiven_StatesItAndThePixelScaleInHeaders()
    {
        var body = DemoCorners.Local();
        body["view"] = new JsonObject { ["widthPx"] = 100, ["heightPx"] = 100, ["fieldOfViewDeg"] = 10 };

        using var response = await api.PostJsonAsync(Route, body.ToJsonString(), accept: "image/png");

        Assert.Equal(HttpStatusCode.OK, response.StatusCode);
        Assert.Equal("10", Assert.Single(response.Headers.GetValues(ViewEndpoints.FieldOfViewHeader)));
        // Pin-hole camera geometry (any optics text): the focal length is (W/2) / tan(FOV/2) pixels, so a pixel at the centre spans atan(1/f).
        var expectedArcmin = Math.Atan(1 / (50 / Math.Tan(5 * Math.PI / 180))) * 180 * 60 / Math.PI;
        Assert.Equal(expectedArcmin, double.Parse(Assert.Single(response.Headers.GetValues(ViewEndpoints.ScaleHeader)), CultureInfo.InvariantCulture), 1e-4);
    }

    [Fact]
    public async Task PostViews_WidthAboveTheLimit_AnswersAProblemNamingTheField() =>
        await AssertProblemAtAsync(new JsonObject { ["widthPx"] = 100_000 }, "view.widthPx");

    [Fact]
    public async Task PostViews_UnknownApproach_AnswersAProblemNamingTheField() =>
        await AssertProblemAtAsync(new JsonObject { ["roadUsers"] = new JsonArray(new JsonObject { ["approach"] = "northbound", ["stationM"] = 20 }) },
            "view.roadUsers[0].approach");

    [Fact]
    public async Task PostViews_StationBeyondTheApproachEnd_AnswersAProblemNamingTheField() =>
        await AssertProblemAtAsync(new JsonObject { ["roadUsers"] = new JsonArray(new JsonObject { ["approach"] = "westbound", ["stationM"] = 500 }) },
            "view.roadUsers[0].stationM"); // the demo's westbound lane is drawn 120 m long

    [Fact]
    public async Task GetRevisionView_StoredEvaluation_AnswersAPng()
    {
        using var owner = new ConfiguredApi(ConfiguredApi.Development);
        var study = await owner.CreateAsync(Studies.Studies.LocalDemo());

        using var response = await owner.SendAsync(HttpMethod.Get, $"{Studies.Studies.Route}/{study.Id()}/revisions/1/view");

        Assert.Equal(HttpStatusCode.OK, response.StatusCode);
        Assert.Equal("image/png", response.Content.Headers.ContentType?.MediaType);
        Assert.Equal(PngSignature, (await response.Content.ReadAsByteArrayAsync())[..8]);
    }

    [Fact]
    public async Task GetRevisionView_StoredRecommendation_Answers409Problem()
    {
        using var owner = new ConfiguredApi(ConfiguredApi.Development);
        var body = Studies.Studies.LocalDemo();
        body.Remove("mirror");
        var study = await owner.CreateAsync(body);

        using var response = await owner.SendAsync(HttpMethod.Get, $"{Studies.Studies.Route}/{study.Id()}/revisions/1/view");

        await response.AssertProblemAsync(HttpStatusCode.Conflict);
    }

    [Fact]
    public async Task PostViews_WithoutKeyWhenEvaluationsAreClosed_Gets401Problem()
    {
        using var closed = new ConfiguredApi(ConfiguredApi.Production, ("Access:OpenEvaluations", "false"));

        using var response = await closed.SendAsync(HttpMethod.Post, Route, DemoCorners.Local());

        await response.AssertProblemAsync(HttpStatusCode.Unauthorized);
    }

    /// <summary>Posts the demo corner with the given view member and asserts a 400 problem with an error under the path.</summary>
    private async Task AssertProblemAtAsync(JsonObject view, string path)
    {
        var body = DemoCorners.Local();
        body["view"] = view;

        using var response = await api.PostJsonAsync(Route, body.ToJsonString());

        var problem = await response.AssertProblemAsync(HttpStatusCode.BadRequest);
        Assert.True(problem.GetProperty("errors").TryGetProperty(path, out _), problem.ToString());
    }

    /// <summary>Keeps the picture under the test output's artefacts folder, to look at.</summary>
    private static void KeepForLooking(string name, byte[] png)
    {
        var path = Path.Combine(AppContext.BaseDirectory, "artefacts", name);
        Directory.CreateDirectory(Path.GetDirectoryName(path)!);
        File.WriteAllBytes(path, png);
    }
}
