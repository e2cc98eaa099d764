using System.Text.Json;
using System.Text.Json.Nodes;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Options;
using SafetyMirror.Api.Requests;
using SafetyMirror.Core.Design.Glare;
using SafetyMirror.Core.Site;

namespace SafetyMirror.Api.Tests.Features.Evaluations;

// The demo corners are invented (openapi/examples). The windows are compared with the Core's own year scan of the same
// mirror: this proves the answer states the scan faithfully, not the sun's position (the scan's tests check that against
// NOAA's published worked example).
[Collection(ApiCollection.Name)]
public sealed class GlareAnswerTests(ApiFactory api)
{
    private const int Year = 2026;

    [Fact]
    public async Task Wgs84Demo_GlareWindowsMatchTheCoreScanForTheYear()
    {
        var body = DemoCorners.Wgs84();
        body["options"]!["glareYear"] = Year;

        var glare = (await api.EvaluateAsync(body)).GetProperty("glare");

        var scan = CoreScan(body);
        var expected = scan.Eyes.SelectMany(e => e.InMirror.Windows.Concat(e.BehindMirror.Windows))
            .Select(w => $"{w.Start:yyyy-MM-dd HH:mm}-{w.End:HH:mm}").Order(StringComparer.Ordinal).ToList();
        var stated = glare.GetProperty("eyes").EnumerateArray().SelectMany(e => e.GetProperty("windows").EnumerateArray())
            .Select(w => $"{w.GetProperty("date").GetString()} {w.GetProperty("start").GetString()}-{w.GetProperty("end").GetString()}")
            .Order(StringComparer.Ordinal).ToList();
        Assert.Equal((true, Year), (glare.GetProperty("computed").GetBoolean(), glare.GetProperty("year").GetInt32()));
        Assert.Equal(expected, stated);
    }

    [Fact]
    public async Task Wgs84Demo_HoursPerYearAreTheCoreScansBothKinds()
    {
        var body = DemoCorners.Wgs84();
        body["options"]!["glareYear"] = Year;

        var eye = (await api.EvaluateAsync(body)).GetProperty("glare").GetProperty("eyes")[0];

        var scanned = CoreScan(body).Eyes[0];
        Assert.Equal(Math.Round(scanned.InMirror.HoursPerYear + scanned.BehindMirror.HoursPerYear, 1), eye.GetProperty("hoursPerYear").GetDouble(), 0.11);
    }

    [Fact]
    public async Task Wgs84DemoWithoutYear_StatesTheYearByTheServiceClock()
    {
        var glare = (await api.EvaluateAsync(DemoCorners.Wgs84())).GetProperty("glare");

        Assert.Equal(DateTime.UtcNow.Year, glare.GetProperty("year").GetInt32()); // the host runs on TimeProvider.System
    }

    [Fact]
    public async Task LocalDemo_GlareSaysWhyItIsAbsent()
    {
        var glare = (await api.EvaluateAsync(DemoCorners.Local())).GetProperty("glare");

        Assert.False(glare.GetProperty("computed").GetBoolean());
        Assert.Equal(GlareScanner.LocalPlanReason, glare.GetProperty("notComputedReason").GetString());
        Assert.Equal(GlareScanner.LocalPlanReason, glare.GetProperty("sentences")[0].GetString());
    }

    [Fact]
    public async Task Wgs84DemoWithGlareLimitExceeded_FailsTheGlareCheckAndLeavesTheRules()
    {
        var body = DemoCorners.Wgs84();
        body["options"]!["glareYear"] = Year;
        body["options"]!["glareHoursPerYearAllowed"] = 0;
        Assert.True(CoreScan(body).Eyes.Any(e => e.InMirror.HoursPerYear + e.BehindMirror.HoursPerYear > 0), "the demo mirror must glare at some time for this test");

        var answer = await api.EvaluateAsync(body);

        var check = answer.GetProperty("checks").EnumerateArray().Single(c => c.GetProperty("code").GetString() == "glare-hours-per-year");
        Assert.Equal((false, "outside-siting-rules"), (check.GetProperty("passes").GetBoolean(), answer.GetProperty("decision").GetString()));
    }

    [Fact]
    public async Task Wgs84DemoWithGenerousGlareLimit_PassesTheGlareCheckAndKeepsTheVerdict()
    {
        var body = DemoCorners.Wgs84();
        body["options"]!["glareYear"] = Year;
        body["options"]!["glareHoursPerYearAllowed"] = Ranges.MaxGlareHoursPerYear;

        var answer = await api.EvaluateAsync(body);

        var check = answer.GetProperty("checks").EnumerateArray().Single(c => c.GetProperty("code").GetString() == "glare-hours-per-year");
        Assert.Equal((true, "meets-requirement"), (check.GetProperty("passes").GetBoolean(), answer.GetProperty("decision").GetString()));
    }

    [Fact]
    public async Task GlareYearOutOfRange_IsA400NamingTheField()
    {
        var body = DemoCorners.Wgs84();
        body["options"]!["glareYear"] = 1800;

        using var response = await api.PostEvaluationAsync(body);

        Assert.Equal(System.Net.HttpStatusCode.BadRequest, response.StatusCode);
        Assert.Contains("options.glareYear", await response.Content.ReadAsStringAsync(), StringComparison.Ordinal);
    }

    private GlareScan CoreScan(JsonObject body)
    {
        var errors = new RequestErrors();
        using var plan = JsonDocument.Parse(body["plan"]!.ToJsonString());
        var site = CornerRequestReader.ReadPlan(plan.RootElement, SitePlanLimits.Default, errors)!;
        var mirror = CornerRequestReader.ReadMirror(body["mirror"].Deserialize<MirrorRequest>(api.Services.GetRequiredService<IOptions<Microsoft.AspNetCore.Http.Json.JsonOptions>>().Value.SerializerOptions), site.Frame, errors)!;
        Assert.True(errors.IsEmpty, string.Join("; ", errors.ToDictionary().Keys));
        return GlareScanner.Scan(site, mirror.ToMirror(), new GlareScanOptions(Year));
    }
}
