using PdfSharp;
using PdfSharp.Drawing;
using PdfSharp.Pdf;
using SafetyMirror.Reports.Graphics;

namespace SafetyMirror.Reports.Tests.Graphics;

public sealed class PdfDrawingRendererTests : IDisposable
{
    // One millimetre is 72 / 25.4 pt: the PDF user unit is 1/72 inch (ISO 32000-1:2008, 8.3.2.3).
    private const double PtPerMm = 72 / 25.4;

    private readonly Poppler poppler = new();

    public void Dispose() => poppler.Dispose();

    private string RenderOnA4(Drawing drawing, XRect box)
    {
        using var document = new PdfDocument();
        var page = document.AddPage();
        page.Size = PageSize.A4;
        using (var graphics = XGraphics.FromPdfPage(page))
        {
            PdfDrawingRenderer.Render(drawing, graphics, box);
        }

        using var bytes = new MemoryStream();
        document.Save(bytes, closeStream: false);
        return poppler.Write(bytes.ToArray());
    }

    [Fact]
    public void Render_EveryShape_TextIsFoundByPdftotext()
    {
        var drawing = Samples.EveryShape();
        var pdf = RenderOnA4(drawing, new XRect(new XPoint(50, 50), PdfDrawingRenderer.NaturalSize(drawing)));

        Assert.Contains("Invented Quince Corner", Poppler.Text(pdf), StringComparison.Ordinal);
    }

    [Fact]
    public void Render_EveryShape_DrawsVectorsAndNoImage()
    {
        var drawing = Samples.EveryShape();
        var pdf = RenderOnA4(drawing, new XRect(new XPoint(50, 50), PdfDrawingRenderer.NaturalSize(drawing)));

        Assert.Empty(Poppler.Images(pdf));
    }

    [Fact]
    public void Render_AtNaturalSize_PutsAMillimetreOfDrawingOnAMillimetreOfPaper()
    {
        var drawing = new Drawing(120, 40,
        [
            new Text(new(10, 20), "West", 4),
            new Text(new(110, 20), "East", 4) { Anchor = TextAnchor.End },
        ]);
        var origin = new XPoint(60, 100);

        var words = Poppler.Words(RenderOnA4(drawing, new XRect(origin, PdfDrawingRenderer.NaturalSize(drawing))));

        var west = words.Single(w => w.Text == "West");
        var east = words.Single(w => w.Text == "East");
        // The glyph boxes start within a side bearing (well under 1 pt) of the anchor.
        Assert.Equal(origin.X + 10 * PtPerMm, west.XMin, 1.0);
        Assert.Equal(100 * PtPerMm, east.XMax - west.XMin, 1.5);
    }

    [Fact]
    public void Render_IntoAHalfSizeBox_ScalesUniformlyAndCentres()
    {
        var drawing = new Drawing(100, 50, [new Text(new(0.5, 25), "Left", 4), new Text(new(99.5, 25), "Right", 4) { Anchor = TextAnchor.End }]);
        var natural = PdfDrawingRenderer.NaturalSize(drawing);
        // Twice as tall as needed: the drawing is fitted to the width and centred vertically.
        var box = new XRect(100, 100, natural.Width / 2, natural.Height);

        var words = Poppler.Words(RenderOnA4(drawing, box));

        var left = words.Single(w => w.Text == "Left");
        var right = words.Single(w => w.Text == "Right");
        Assert.Equal(99 * PtPerMm / 2, right.XMax - left.XMin, 1.5);
        Assert.Equal(box.Y + box.Height / 2, (left.YMin + left.YMax) / 2, 3.0);
    }
}
