using System.Net;
using System.Text;
using System.Text.Json.Nodes;
using System.Text.RegularExpressions;
using SafetyMirror.Reports.Tests;

namespace SafetyMirror.Api.Tests.Features.Reports;

// POST /v1/reports on the invented demo corner: what a road authority's reviewer checks on paper (one not-an-approval
// statement, the sign-off block) and the paper options, read back by poppler and from the HTML.
[Collection(ApiCollection.Name)]
public sealed partial class ReportLayoutTests(ApiFactory api) : IDisposable
{
    private readonly Poppler poppler = new();

    public void Dispose() => poppler.Dispose();

    private async Task<string> PdfAsync(JsonNode body) => poppler.Write(await api.ReportAsync(body, Reports.Pdf));

    private async Task<string> HtmlAsync(JsonNode body) => Encoding.UTF8.GetString(await api.ReportAsync(body, Reports.Html));

    [Fact]
    public async Task Post_AcceptPdf_SaysItIsNotAnApprovalExactlyOnce()
    {
        var text = Poppler.Flow(await PdfAsync(DemoCorners.Report()));

        Assert.Single(NotAnApproval().Matches(text));
    }

    [Fact]
    public async Task Post_AcceptHtml_SaysItIsNotAnApprovalExactlyOnce()
    {
        var html = await HtmlAsync(DemoCorners.Report());

        Assert.Single(NotAnApproval().Matches(html));
    }

    [Fact]
    public async Task Post_AcceptPdf_SignOffHasTheRegistrationNumberAndTheSealBox()
    {
        var text = Poppler.Flow(await PdfAsync(DemoCorners.Report()));
        var signOff = text[text.LastIndexOf("Sign-off", StringComparison.Ordinal)..];

        Assert.Contains("Registration (licence) no.", signOff, StringComparison.Ordinal);
        Assert.Contains("Seal or stamp", signOff, StringComparison.Ordinal);
    }

    [Fact]
    public async Task Post_AcceptHtml_SignOffHasTheRegistrationNumberAndTheSealBox()
    {
        var html = await HtmlAsync(DemoCorners.Report());
        var signOff = html[html.LastIndexOf("<h1>Sign-off</h1>", StringComparison.Ordinal)..];

        Assert.Contains("<th>Registration (licence) no.</th>", signOff, StringComparison.Ordinal);
        Assert.Contains(">Seal or stamp</text>", signOff, StringComparison.Ordinal);
    }

    [Fact]
    public async Task Post_PlanPagesLandscape_TurnsThePlanPagesOnly()
    {
        var body = DemoCorners.Report();
        body["report"]!["paper"] = "A3";
        body["report"]!["planPagesLandscape"] = true;

        var pdf = await PdfAsync(body);

        var sizes = Poppler.PageSizes(pdf);
        var planPage = Enumerable.Range(1, sizes.Count).First(p => Poppler.Text(pdf, p).Contains("true scale when printed", StringComparison.Ordinal));
        // A3 turned: 420 x 297 mm (ISO 216), 1191 x 842 pt.
        Assert.Equal((1191.0, 842.0), sizes[planPage - 1]);
        Assert.Equal((842.0, 1191.0), sizes[0]);
    }

    [Fact]
    public async Task Post_AcceptHtmlTabloid_SetsThePrintedPageSize()
    {
        var body = DemoCorners.Report();
        body["report"]!["paper"] = "Tabloid";

        var html = await HtmlAsync(body);

        Assert.Contains("size: 11in 17in;", html, StringComparison.Ordinal);
    }

    [Fact]
    public async Task Post_PlanPagesLandscapeNotABoolean_Is400()
    {
        var body = DemoCorners.Report();
        body["report"]!["planPagesLandscape"] = "yes";

        using var response = await api.PostReportAsync(body, Reports.Pdf);

        await response.AssertProblemAsync(HttpStatusCode.BadRequest);
    }

    [GeneratedRegex("not (an )?approval", RegexOptions.IgnoreCase)]
    private static partial Regex NotAnApproval();
}
