using PdfSharp.Fonts;
using SafetyMirror.Reports.Documents;
using SafetyMirror.Reports.Fonts;

namespace SafetyMirror.Reports.Tests.Fonts;

public sealed class ReportFontsTests : IDisposable
{
    private readonly Poppler poppler = new();

    public void Dispose() => poppler.Dispose();

    [Fact]
    public void Register_FromManyThreadsAtOnce_InstallsOneResolver()
    {
        Parallel.For(0, 16, _ => ReportFonts.Register());
        var first = GlobalFontSettings.FontResolver;

        ReportFonts.Register();

        Assert.NotNull(first);
        Assert.Same(first, GlobalFontSettings.FontResolver);
    }

    [Fact]
    public void Resolver_AnyBoldFamily_ServesTheEmbeddedTrueTypeBoldFace()
    {
        ReportFonts.Register();
        var resolver = GlobalFontSettings.FontResolver!;

        var face = resolver.ResolveTypeface("Some Family Not On This Machine", true, false)!.FaceName;
        var bytes = resolver.GetFont(face)!;

        Assert.Equal("DejaVuSans-Bold", face);
        // A TrueType file starts with the sfnt version 0x00010000 (OpenType spec, "Organization of an OpenType Font").
        Assert.Equal(new byte[] { 0, 1, 0, 0 }, bytes[..4]);
    }

    [Fact]
    public void Report_UsesOnlyTheEmbeddedFaces()
    {
        using var writer = new PdfReportWriter("Invented font check", PaperSize.A4);
        writer.Heading("Bold heading", 2);
        writer.Paragraph("Regular text.");

        var rows = Poppler.Fonts(poppler.Write(writer.ToBytes()))
            .Split('\n', StringSplitOptions.RemoveEmptyEntries).Skip(2).ToList();

        // pdffonts columns: name, type, encoding, emb, sub, uni; subset names carry a six-letter prefix.
        Assert.Equal(2, rows.Count);
        Assert.All(rows, row => Assert.Matches(@"^[A-Z]{6}\+DejaVu Sans\S*\s.*\syes\s+yes\s+yes\s", row));
    }
}
