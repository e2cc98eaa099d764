using SafetyMirror.Reports.Graphics;

namespace SafetyMirror.Reports.Tests.Graphics;

public sealed class ShapeTests
{
    [Fact]
    public void Style_OddDashCount_IsRefused()
    {
        // SVG repeats an odd list twice and PDFsharp pads it, so the two back-ends would differ.
        Assert.Throws<ArgumentException>(() => new Style { DashMm = [2, 1, 0.5] });
    }

    [Fact]
    public void Style_OpacityAboveOne_IsRefused()
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => new Style { Opacity = 1.5 });
    }

    [Fact]
    public void Polyline_OnePoint_IsRefused()
    {
        Assert.Throws<ArgumentException>(() => new Polyline([new(0, 0)], new Style()));
    }

    [Fact]
    public void Polygon_NaNVertex_IsRefused()
    {
        Assert.Throws<ArgumentException>(() => new Polygon([new(0, 0), new(double.NaN, 1), new(1, 1)], new Style()));
    }

    [Fact]
    public void Drawing_ZeroWidth_IsRefused()
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => new Drawing(0, 10, []));
    }

    [Fact]
    public void Arrow_ShaftStopsAtTheHeadWhoseTipIsTheEnd()
    {
        var shapes = Symbols.Arrow(new(0, 0), new(10, 0), Style.Line(Colour.Black, 0.3), headLengthMm: 2);

        var shaft = Assert.IsType<Polyline>(shapes[0]);
        var head = Assert.IsType<Polygon>(shapes[1]);
        Assert.Equal(new PointMm(8, 0), shaft.Points[^1]);
        Assert.Equal(new PointMm(10, 0), head.Shell[0]);
    }

    [Fact]
    public void Marker_Triangle_HasItsCentroidOnThePoint()
    {
        var triangle = Assert.IsType<Polygon>(Symbols.Marker(MarkerKind.Triangle, new(20, 30), 3, new Style()));

        Assert.Equal(20, triangle.Shell.Average(p => p.X), 6);
        Assert.Equal(30, triangle.Shell.Average(p => p.Y), 2);
    }

    [Fact]
    public void Backdrop_MiddleAnchoredText_IsCentredOnTheAnchor()
    {
        var text = new Text(new(50, 20), "25 m", 2.5) { Anchor = TextAnchor.Middle };

        var box = Symbols.Backdrop(text, Colour.White);

        Assert.Equal(50, box.Shell.Average(p => p.X), 6);
        Assert.True(box.Shell.Max(p => p.X) - box.Shell.Min(p => p.X) > 4 * 2.5 * 0.5, "four characters are wider than two em");
    }

    [Fact]
    public void Backdrop_TextTurnedUpright_IsTallerThanWide()
    {
        var text = new Text(new(50, 20), "Required distance", 2.5) { RotationDeg = -90 };

        var box = Symbols.Backdrop(text, Colour.White);

        var width = box.Shell.Max(p => p.X) - box.Shell.Min(p => p.X);
        var height = box.Shell.Max(p => p.Y) - box.Shell.Min(p => p.Y);
        Assert.True(height > 5 * width, $"height {height} mm, width {width} mm");
    }
}
