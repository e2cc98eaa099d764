using System.Text;
using System.Xml;

namespace SafetyMirror.Reports.Graphics;

/// <summary>Writes a <see cref="Drawing"/> as an SVG element for embedding into an HTML page.</summary>
/// <remarks>
/// The element is sized in millimetres with a matching viewBox, so it prints at the drawing's natural size.
/// It is written through <see cref="XmlWriter"/>, which escapes every text and attribute; characters XML cannot
/// carry are dropped. Hatch patterns get ids derived from their content, so several drawings on one page that
/// share an id also share the same definition.
/// </remarks>
public static class SvgWriter
{
    private const string Namespace = "http://www.w3.org/2000/svg";
    private const string FontFamily = "'DejaVu Sans', Verdana, sans-serif";

    /// <summary>The drawing as SVG markup, without an XML declaration.</summary>
    public static string ToSvg(Drawing drawing)
    {
        ArgumentNullException.ThrowIfNull(drawing);
        var output = new StringBuilder();
        var settings = new XmlWriterSettings { OmitXmlDeclaration = true, ConformanceLevel = ConformanceLevel.Fragment };
        using (var xml = XmlWriter.Create(output, settings))
        {
            xml.WriteStartElement("svg", Namespace);
            xml.WriteAttributeString("width", Invariant.Number(drawing.WidthMm) + "mm");
            xml.WriteAttributeString("height", Invariant.Number(drawing.HeightMm) + "mm");
            xml.WriteAttributeString("viewBox", $"0 0 {Invariant.Number(drawing.WidthMm)} {Invariant.Number(drawing.HeightMm)}");
            xml.WriteAttributeString("role", "img");
            if (drawing.Title is { } title)
            {
                xml.WriteAttributeString("aria-label", Invariant.XmlSafe(title));
                xml.WriteElementString("title", Namespace, Invariant.XmlSafe(title));
            }

            WriteHatchDefinitions(xml, drawing);
            foreach (var shape in drawing.Shapes)
            {
                WriteShape(xml, shape);
            }

            xml.WriteEndElement();
        }

        return output.ToString();
    }

    private static void WriteShape(XmlWriter xml, Shape shape)
    {
        switch (shape)
        {
            case Polyline line:
                xml.WriteStartElement("polyline", Namespace);
                xml.WriteAttributeString("points", string.Join(' ', line.Points.Select(p => $"{Invariant.Number(p.X)},{Invariant.Number(p.Y)}")));
                WriteStroke(xml, line.Style);
                xml.WriteAttributeString("fill", "none");
                xml.WriteEndElement();
                break;
            case Polygon polygon:
                WriteArea(xml, "path", polygon.Style, x =>
                {
                    x.WriteAttributeString("d", PathData(polygon));
                    x.WriteAttributeString("fill-rule", "evenodd");
                });
                break;
            case Circle circle:
                WriteArea(xml, "circle", circle.Style, x =>
                {
                    x.WriteAttributeString("cx", Invariant.Number(circle.Centre.X));
                    x.WriteAttributeString("cy", Invariant.Number(circle.Centre.Y));
                    x.WriteAttributeString("r", Invariant.Number(circle.RadiusMm));
                });
                break;
            case Text text:
                WriteText(xml, text);
                break;
            default:
                throw new NotSupportedException($"No SVG form for {shape.GetType().Name}.");
        }
    }

    /// <summary>Fill first, then the hatch with the outline, each as its own element of the same geometry.</summary>
    private static void WriteArea(XmlWriter xml, string element, Style style, Action<XmlWriter> geometry)
    {
        if (style.Fill is { } fill && style.Hatch is not null)
        {
            xml.WriteStartElement(element, Namespace);
            geometry(xml);
            WriteFill(xml, fill.Hex, style.Opacity);
            xml.WriteAttributeString("stroke", "none");
            xml.WriteEndElement();
        }

        xml.WriteStartElement(element, Namespace);
        geometry(xml);
        var paint = style.Hatch is { } hatch ? $"url(#{HatchId(hatch)})" : style.Fill?.Hex;
        if (paint is null)
        {
            xml.WriteAttributeString("fill", "none");
        }
        else
        {
            WriteFill(xml, paint, style.Opacity);
        }

        WriteStroke(xml, style);
        xml.WriteEndElement();
    }

    private static void WriteFill(XmlWriter xml, string paint, double opacity)
    {
        xml.WriteAttributeString("fill", paint);
        if (opacity < 1)
        {
            xml.WriteAttributeString("fill-opacity", Invariant.Number(opacity));
        }
    }

    private static void WriteStroke(XmlWriter xml, Style style)
    {
        if (style.Stroke is not { } stroke)
        {
            xml.WriteAttributeString("stroke", "none");
            return;
        }

        xml.WriteAttributeString("stroke", stroke.Hex);
        xml.WriteAttributeString("stroke-width", Invariant.Number(style.StrokeWidthMm));
        xml.WriteAttributeString("stroke-linecap", "round");
        xml.WriteAttributeString("stroke-linejoin", "round");
        if (style.DashMm.Count > 0)
        {
            xml.WriteAttributeString("stroke-dasharray", string.Join(' ', style.DashMm.Select(Invariant.Number)));
        }

        if (style.Opacity < 1)
        {
            xml.WriteAttributeString("stroke-opacity", Invariant.Number(style.Opacity));
        }
    }

    private static void WriteText(XmlWriter xml, Text text)
    {
        xml.WriteStartElement("text", Namespace);
        xml.WriteAttributeString("x", Invariant.Number(text.At.X));
        xml.WriteAttributeString("y", Invariant.Number(text.At.Y));
        xml.WriteAttributeString("font-family", FontFamily);
        xml.WriteAttributeString("font-size", Invariant.Number(text.SizeMm));
        if (text.Weight == FontWeight.Bold)
        {
            xml.WriteAttributeString("font-weight", "bold");
        }

        if (text.Anchor != TextAnchor.Start)
        {
            xml.WriteAttributeString("text-anchor", text.Anchor == TextAnchor.Middle ? "middle" : "end");
        }

        xml.WriteAttributeString("fill", text.Colour.Hex);
        if (text.RotationDeg != 0)
        {
            xml.WriteAttributeString("transform", $"rotate({Invariant.Number(text.RotationDeg)} {Invariant.Number(text.At.X)} {Invariant.Number(text.At.Y)})");
        }

        xml.WriteString(Invariant.XmlSafe(text.Value));
        xml.WriteEndElement();
    }

    private static string PathData(Polygon polygon) =>
        string.Join(' ', polygon.Rings.Select(ring =>
            "M" + string.Join(" L", ring.Select(p => $"{Invariant.Number(p.X)},{Invariant.Number(p.Y)}")) + " Z"));

    private static void WriteHatchDefinitions(XmlWriter xml, Drawing drawing)
    {
        var hatches = drawing.Shapes
            .Select(s => s switch { Polygon p => p.Style.Hatch, Circle c => c.Style.Hatch, _ => null })
            .OfType<Hatch>()
            .DistinctBy(HatchId)
            .ToList();
        if (hatches.Count == 0)
        {
            return;
        }

        xml.WriteStartElement("defs", Namespace);
        foreach (var hatch in hatches)
        {
            WritePattern(xml, hatch);
        }

        xml.WriteEndElement();
    }

    /// <summary>A tile with a vertical line through its middle, turned by the hatch angle; a cross adds the horizontal.</summary>
    private static void WritePattern(XmlWriter xml, Hatch hatch)
    {
        var s = Invariant.Number(hatch.SpacingMm);
        var middle = Invariant.Number(hatch.SpacingMm / 2);
        xml.WriteStartElement("pattern", Namespace);
        xml.WriteAttributeString("id", HatchId(hatch));
        xml.WriteAttributeString("patternUnits", "userSpaceOnUse");
        xml.WriteAttributeString("width", s);
        xml.WriteAttributeString("height", s);
        xml.WriteAttributeString("patternTransform", $"rotate({Invariant.Number(hatch.AngleDeg)})");
        WriteHatchLine(xml, hatch, middle, s, vertical: true);
        if (hatch.Crossed)
        {
            // The second family is at right angles to the first, so in the turned tile it is horizontal.
            WriteHatchLine(xml, hatch, middle, s, vertical: false);
        }

        xml.WriteEndElement();
    }

    private static void WriteHatchLine(XmlWriter xml, Hatch hatch, string middle, string size, bool vertical)
    {
        xml.WriteStartElement("line", Namespace);
        xml.WriteAttributeString("x1", vertical ? middle : "0");
        xml.WriteAttributeString("y1", vertical ? "0" : middle);
        xml.WriteAttributeString("x2", vertical ? middle : size);
        xml.WriteAttributeString("y2", vertical ? size : middle);
        xml.WriteAttributeString("stroke", hatch.Colour.Hex);
        xml.WriteAttributeString("stroke-width", Invariant.Number(hatch.LineWidthMm));
        xml.WriteEndElement();
    }

    private static string HatchId(Hatch hatch) =>
        $"hatch-{hatch.Kind.ToString().ToLowerInvariant()}-{hatch.Colour.Hex[1..]}-{Invariant.Number(hatch.SpacingMm).Replace('.', '_')}-{Invariant.Number(hatch.LineWidthMm).Replace('.', '_')}";
}
