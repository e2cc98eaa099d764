using System.Text.Json;
using NetTopologySuite.Geometries;
using SafetyMirror.Core.Design.Evaluation;
using SafetyMirror.Core.Design.Glare;
using SafetyMirror.Core.Optics;
using SafetyMirror.Core.Site;
using SafetyMirror.Reports.Documents;
using SafetyMirror.Reports.Justification;

namespace SafetyMirror.Reports.Tests.Justification;

// The WGS84 demo corner is invented (openapi/examples/demo-corner-wgs84.json). The section is checked against the Core's
// own scan and wording: this proves the report states the scan and draws it, not the sun's position.
public sealed class JustificationReportGlareTests : IDisposable
{
    private const int Year = 2026;

    private readonly Poppler poppler = new();

    public void Dispose() => poppler.Dispose();

    [Fact]
    public void ForEvaluation_Wgs84Demo_PdfHasTheSunGlareSubsectionAndItsSentences()
    {
        var (plan, evaluation) = Wgs84Demo();
        var scan = GlareScanner.Scan(plan, evaluation.Placement.ToMirror(), new GlareScanOptions(Year));

        var text = Poppler.Flow(poppler.Write(JustificationReport.ForEvaluation(plan, evaluation, InventedCorner.Header(), glare: scan).ToPdf(PaperSize.A4)));

        Assert.Contains("Sun glare", text, StringComparison.Ordinal);
        // The sentences as a reader gets them: the eye by its name, no JSON path of the request.
        Assert.Contains(Words(Wording.ForReader(GlareWording.Sentences(scan)[0])), text, StringComparison.Ordinal);
        ReaderWords.AssertPlain(text);
    }

    [Fact]
    public void ForEvaluation_Wgs84Demo_DrawsTheGlareChartWithItsMonthTicks()
    {
        var (plan, evaluation) = Wgs84Demo();
        var scan = GlareScanner.Scan(plan, evaluation.Placement.ToMirror(), new GlareScanOptions(Year));

        var page = JustificationReport.ForEvaluation(plan, evaluation, InventedCorner.Header(), glare: scan).ToHtml(PaperSize.A4);

        var chart = page[page.IndexOf("Sun glare through 2026", StringComparison.Ordinal)..];
        // The demo mirror glares between about 15:05 and 17:25 UTC (the Core scan), so the time axis has a 16:00 tick.
        Assert.All(["Jan", "Jun", "Dec", "16:00"], tick => Assert.Contains($">{tick}<", page, StringComparison.Ordinal));
        Assert.Contains("Sun glare through 2026 at the eye", chart, StringComparison.Ordinal);
    }

    [Fact]
    public void ForEvaluation_LocalPlan_SaysWhyThereIsNoGlareScan()
    {
        var scan = GlareScanner.Scan(InventedCorner.Plan(), InventedCorner.Mirror.ToMirror(), new GlareScanOptions(Year));

        var text = Poppler.Flow(poppler.Write(JustificationReport.ForEvaluation(InventedCorner.Plan(), InventedCorner.Evaluation, InventedCorner.Header(), glare: scan).ToPdf(PaperSize.A4)));

        Assert.Contains("Sun glare", text, StringComparison.Ordinal);
        Assert.Contains(Words(GlareScanner.LocalPlanReason), text, StringComparison.Ordinal);
    }

    // pdftotext breaks lines where the page does: compare word by word.
    private static string Words(string sentence) => string.Join(' ', sentence.Split(' ', StringSplitOptions.RemoveEmptyEntries));

    private static (SitePlan Plan, MirrorEvaluation Evaluation) Wgs84Demo()
    {
        using var request = JsonDocument.Parse(File.ReadAllText(Path.Combine(RepositoryRoot(), "openapi", "examples", "demo-corner-wgs84.json")));
        var plan = SitePlanReader.Read(request.RootElement.GetProperty("plan"), SitePlanLimits.Default).Plan!;
        var mirror = request.RootElement.GetProperty("mirror");
        var location = mirror.GetProperty("location").GetProperty("coordinates");
        var local = plan.Frame.ToLocal(new Coordinate(location[0].GetDouble(), location[1].GetDouble()));
        var placement = new MirrorPlacement(local.X, local.Y, mirror.GetProperty("centreHeightM").GetDouble(), mirror.GetProperty("azimuthDeg").GetDouble(),
            mirror.GetProperty("tiltDownDeg").GetDouble(), mirror.GetProperty("radiusM").GetDouble(), new RoundAperture(mirror.GetProperty("diameterM").GetDouble()));
        return (plan, MirrorEvaluator.Evaluate(plan, placement, new EvaluationOptions { StationSpacingM = 5 }).Evaluation!);
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
}
