using SafetyMirror.Reports.Tests;

namespace SafetyMirror.Api.Tests.Features.Reports;

// North on the plan: a plan in local metres has no true north, so its arrow and captions say "plan north"; a WGS84 plan
// is drawn on a transverse Mercator projection centred on the site, where up is true north (common practice in surveying).
[Collection(ApiCollection.Name)]
public sealed class ReportNorthTests(ApiFactory api) : IDisposable
{
    private readonly Poppler poppler = new();

    public void Dispose() => poppler.Dispose();

    [Fact]
    public async Task Post_LocalMetresPlan_LabelsPlanNorthAndSaysItIsNotTrueNorth()
    {
        var text = Poppler.Flow(poppler.Write(await api.ReportAsync(DemoCorners.Report(), Reports.Pdf)));

        Assert.Contains("Plan N", text, StringComparison.Ordinal);
        Assert.Contains("plan north up", text, StringComparison.Ordinal);
        Assert.Contains("not true north", text, StringComparison.Ordinal);
        Assert.DoesNotContain("true north up", text, StringComparison.Ordinal);
    }

    [Fact]
    public async Task Post_Wgs84Plan_ShowsTrueNorth()
    {
        var body = DemoCorners.Report();
        body["plan"] = DemoCorners.Wgs84()["plan"]!.DeepClone();
        body["mirror"] = DemoCorners.Wgs84()["mirror"]!.DeepClone();

        var text = Poppler.Flow(poppler.Write(await api.ReportAsync(body, Reports.Pdf)));

        Assert.Contains("true north up", text, StringComparison.Ordinal);
        Assert.DoesNotContain("Plan N", text, StringComparison.Ordinal);
        Assert.DoesNotContain("plan north", text, StringComparison.Ordinal);
    }
}
