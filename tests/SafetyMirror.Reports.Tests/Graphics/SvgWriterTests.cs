using System.Xml.Linq;
using SafetyMirror.Reports.Graphics;

namespace SafetyMirror.Reports.Tests.Graphics;

public sealed class SvgWriterTests
{
    private static readonly XNamespace Svg = "http://www.w3.org/2000/svg";

    private static XElement Parse(Drawing drawing) => XElement.Parse(SvgWriter.ToSvg(drawing));

    [Fact]
    public void ToSvg_EveryShape_IsWellFormedXmlInTheSvgNamespace()
    {
        // System.Xml is the independent reader: it throws on anything that is not well-formed XML 1.0.
        var root = Parse(Samples.EveryShape());

        Assert.Equal(Svg + "svg", root.Name);
    }

    [Fact]
    public void ToSvg_EveryShape_WritesOneElementPerShape()
    {
        var root = Parse(Samples.EveryShape());

        Assert.Single(root.Descendants(Svg + "polyline"));
        Assert.Single(root.Descendants(Svg + "circle"));
        Assert.Single(root.Descendants(Svg + "text"));
        // A filled and hatched polygon is two paths of the same outline: the fill, then hatch and stroke.
        Assert.Equal(2, root.Elements(Svg + "path").Count());
    }

    [Fact]
    public void ToSvg_Viewport_IsSizedInMillimetres()
    {
        var root = Parse(Samples.EveryShape());

        Assert.Equal("100mm", root.Attribute("width")?.Value);
        Assert.Equal("60mm", root.Attribute("height")?.Value);
        Assert.Equal("0 0 100 60", root.Attribute("viewBox")?.Value);
    }

    [Fact]
    public void ToSvg_MarkupInText_IsEscapedAndReadsBackUnchanged()
    {
        const string hostile = "<script>alert(1)</script> & \"Elm\" 'Row'";

        var svg = SvgWriter.ToSvg(Samples.EveryShape(hostile) with { Title = hostile });
        var root = XElement.Parse(svg);

        Assert.DoesNotContain("<script>", svg, StringComparison.Ordinal);
        Assert.DoesNotContain(root.Descendants(), e => e.Name.LocalName == "script");
        Assert.Equal(hostile, root.Descendants(Svg + "text").Single().Value);
        Assert.Equal(hostile, root.Element(Svg + "title")?.Value);
    }

    [Fact]
    public void ToSvg_ControlCharacterInText_IsDropped()
    {
        // U+0001 is not an XML 1.0 character (XML 1.0, section 2.2), so it cannot be written at all.
        var root = Parse(Samples.EveryShape("Elm\u0001Row"));

        Assert.Equal("ElmRow", root.Descendants(Svg + "text").Single().Value);
    }

    [Fact]
    public void ToSvg_SharedHatch_IsDefinedOnceAndReferencedByEachArea()
    {
        var hatch = new Hatch(HatchKind.Diagonal, Colour.Black);
        var style = new Style { Hatch = hatch };
        var drawing = new Drawing(50, 50,
        [
            new Polygon([new(0, 0), new(10, 0), new(10, 10)], style),
            new Polygon([new(20, 20), new(30, 20), new(30, 30)], style),
        ]);

        var root = Parse(drawing);

        var pattern = Assert.Single(root.Descendants(Svg + "pattern"));
        var reference = $"url(#{pattern.Attribute("id")?.Value})";
        Assert.Equal(2, root.Elements(Svg + "path").Count(p => p.Attribute("fill")?.Value == reference));
    }

    [Fact]
    public void ToSvg_DashedLine_WritesTheDashesInMillimetres()
    {
        var root = Parse(Samples.EveryShape());

        Assert.Equal("2.5 1.2", root.Descendants(Svg + "polyline").Single().Attribute("stroke-dasharray")?.Value);
    }

    [Fact]
    public void ToSvg_PolygonWithHole_IsOnePathOfTwoRingsFilledEvenOdd()
    {
        var root = Parse(Samples.EveryShape());

        var path = root.Elements(Svg + "path").Last();
        Assert.Equal(2, path.Attribute("d")!.Value.Count(c => c == 'M'));
        Assert.Equal("evenodd", path.Attribute("fill-rule")?.Value);
    }

    [Fact]
    public void ToSvg_RotatedText_TurnsAboutItsAnchor()
    {
        var drawing = new Drawing(50, 50, [new Text(new(10, 40), "Distance", 3) { RotationDeg = -90 }]);

        var text = Parse(drawing).Descendants(Svg + "text").Single();

        Assert.Equal("rotate(-90 10 40)", text.Attribute("transform")?.Value);
    }
}
