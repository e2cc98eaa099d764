using System.Text.RegularExpressions;
using SafetyMirror.Core.Design.Evaluation;
using SafetyMirror.Reports.Documents;
using SafetyMirror.Reports.Justification;

namespace SafetyMirror.Reports.Tests.Justification;

// The installation sheet's pictures of the driver's view, read back by poppler's pdfimages and pdftotext and from the HTML.
public sealed partial class JustificationReportViewTests(JustificationReportTests.Rendered rendered) : IClassFixture<JustificationReportTests.Rendered>
{
    [Fact]
    public void ToPdf_OneMirror_EmbedsTheViewAtTheDesignAimAndTheTwoWorstAims()
    {
        Assert.True(Poppler.Images(rendered.EvaluationPdf).Count >= 3, string.Join('\n', Poppler.Images(rendered.EvaluationPdf)));
    }

    [Fact]
    public void ToPdf_OneMirror_PutsTheViewAfterTheAimCheck()
    {
        var aimCheck = rendered.Evaluation.IndexOf("Aim check, mirror M1", StringComparison.Ordinal);
        var view = rendered.Evaluation.IndexOf("What the driver will see once mirror M1 is mounted", StringComparison.Ordinal);

        Assert.InRange(view, aimCheck + 1, rendered.Evaluation.IndexOf("Inspection record", StringComparison.Ordinal));
    }

    [Fact]
    public void ToPdf_OneMirror_ShowsTheDesignCarComingAlongTheServedApproachInFourFrames()
    {
        // The invented corner's eastbound lane runs out beyond 80 m: all four frames, after the three pictures of the aims.
        Assert.Equal(7, Poppler.Images(rendered.EvaluationPdf).Count);
        Assert.Contains("blue, the passenger car at 80 m, 60 m, 40 m, 20 m from the conflict point", rendered.Evaluation, StringComparison.Ordinal);
    }

    [Fact]
    public void ToPdf_OneMirror_CaptionsEachViewWithItsAngularScaleAndAim()
    {
        var captions = ScaleCaption().Matches(rendered.Evaluation);

        Assert.Equal(3, captions.Count);
        Assert.Contains("Mirror M1 at the design aim", rendered.Evaluation, StringComparison.Ordinal);
        Assert.Equal(2, Regex.Matches(rendered.Evaluation, "Mirror M1 with the aim off by 2°").Count);
    }

    [Fact]
    public void ToPdf_OneMirror_CaptionsTheViewWithTheMirrorCautions()
    {
        var caption = rendered.Evaluation[rendered.Evaluation.IndexOf("Mirror M1 at the design aim", StringComparison.Ordinal)..];

        Assert.Contains("look smaller, farther away and slower than they are", caption[..1000], StringComparison.Ordinal);
        Assert.Contains("Left and right are reversed in the mirror", caption[..1000], StringComparison.Ordinal);
    }

    [Fact]
    public void ToHtml_OneMirror_EmbedsPngViewsSizedInMillimetres()
    {
        var html = JustificationReport.ForEvaluation(InventedCorner.Plan(), InventedCorner.Evaluation, InventedCorner.Header()).ToHtml(PaperSize.A4);

        var images = PngImage().Matches(html);

        Assert.Equal(3, images.Count);
        Assert.Equal(4, Regex.Matches(html, "style=\"width: 40mm; height: 30mm\"").Count);
        // A PNG file starts with the signature 89 50 4E 47 0D 0A 1A 0A (ISO/IEC 15948:2004, 5.2), base64 "iVBORw0KGgo".
        Assert.All(images, image => Assert.StartsWith("iVBORw0KGgo", image.Groups[1].Value, StringComparison.Ordinal));
    }

    [Fact]
    public void ToHtml_Page_AllowsItsInlineImagesOnly()
    {
        var html = JustificationReport.ForEvaluation(InventedCorner.Plan(), InventedCorner.Evaluation, InventedCorner.Header()).ToHtml(PaperSize.A4);

        Assert.Contains("default-src 'none'; style-src 'unsafe-inline'; img-src data:\"", html, StringComparison.Ordinal);
    }

    [Fact]
    public void ToPdf_NoAimTolerance_DrawsTheDesignAimOnly()
    {
        // With no tolerance tried there is no worse aim to show.
        var evaluation = InventedCorner.Evaluation with { Robustness = new AimRobustness(0, InventedCorner.Evaluation.Robustness.Cases) };

        var text = Poppler.Flow(rendered.Write(JustificationReport.ForEvaluation(InventedCorner.Plan(), evaluation, InventedCorner.Header()).ToPdf(PaperSize.A4), "no-tolerance.pdf"));

        Assert.Single(ScaleCaption().Matches(text));
    }

    [GeneratedRegex(@"[\d.]+° across, [\d.]+′ a pixel \(480 × 360 px printed 100 × 75 mm\)")]
    private static partial Regex ScaleCaption();

    [GeneratedRegex("<img src=\"data:image/png;base64,([A-Za-z0-9+/=]+)\" alt=\"[^\"]+\" style=\"width: 100mm; height: 75mm\" />")]
    private static partial Regex PngImage();
}
