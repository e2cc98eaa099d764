using PdfSharp.Drawing;
using SafetyMirror.Reports.Fonts;

namespace SafetyMirror.Reports.Graphics;

/// <summary>Draws a <see cref="Drawing"/> in vector form onto a region of a PDFsharp page.</summary>
/// <remarks>
/// Hatches are drawn as clipped lines (PDFsharp has no tiling patterns); dashes, caps, joins and opacity match the
/// SVG writer. The graphics state is saved and restored, so the caller's transform and clip are untouched.
/// </remarks>
public static class PdfDrawingRenderer
{
    /// <summary>Points per millimetre.</summary>
    public const double PointsPerMm = 72 / 25.4;

    /// <summary>Draws <paramref name="drawing"/> scaled uniformly to fit <paramref name="box"/> and centred in it.</summary>
    /// <remarks>
    /// <paramref name="box"/> is in the page's units (points, y down). A box of the drawing's natural size in points
    /// (<see cref="NaturalSize"/>) keeps one drawing millimetre one millimetre on paper, so a plan keeps its scale.
    /// </remarks>
    public static void Render(Drawing drawing, XGraphics graphics, XRect box)
    {
        ArgumentNullException.ThrowIfNull(drawing);
        ArgumentNullException.ThrowIfNull(graphics);
        ReportFonts.Register();
        var scale = Math.Min(box.Width / drawing.WidthMm, box.Height / drawing.HeightMm);
        if (!(scale > 0))
        {
            throw new ArgumentOutOfRangeException(nameof(box), box, "box must have a positive width and height.");
        }

        var state = graphics.Save();
        graphics.TranslateTransform(
            box.X + (box.Width - drawing.WidthMm * scale) / 2,
            box.Y + (box.Height - drawing.HeightMm * scale) / 2);
        graphics.ScaleTransform(scale);
        foreach (var shape in drawing.Shapes)
        {
            Draw(graphics, shape);
        }

        graphics.Restore(state);
    }

    /// <summary>The drawing's size in points at one drawing millimetre per paper millimetre.</summary>
    public static XSize NaturalSize(Drawing drawing)
    {
        ArgumentNullException.ThrowIfNull(drawing);
        return new XSize(drawing.WidthMm * PointsPerMm, drawing.HeightMm * PointsPerMm);
    }

    private static void Draw(XGraphics graphics, Shape shape)
    {
        switch (shape)
        {
            case Polyline line:
                if (Pen(line.Style) is { } pen)
                {
                    graphics.DrawLines(pen, line.Points.Select(ToPoint).ToArray());
                }

                break;
            case Polygon polygon:
                var path = new XGraphicsPath { FillMode = XFillMode.Alternate };
                foreach (var ring in polygon.Rings)
                {
                    path.AddPolygon(ring.Select(ToPoint).ToArray());
                }

                DrawArea(graphics, path, polygon.Style, polygon.Shell.Concat(polygon.Holes.SelectMany(h => h)));
                break;
            case Circle circle:
                var disc = new XGraphicsPath();
                var r = circle.RadiusMm;
                disc.AddEllipse(circle.Centre.X - r, circle.Centre.Y - r, 2 * r, 2 * r);
                DrawArea(graphics, disc, circle.Style, [new(circle.Centre.X - r, circle.Centre.Y - r), new(circle.Centre.X + r, circle.Centre.Y + r)]);
                break;
            case Text text:
                DrawText(graphics, text);
                break;
            default:
                throw new NotSupportedException($"No PDF form for {shape.GetType().Name}.");
        }
    }

    private static void DrawArea(XGraphics graphics, XGraphicsPath path, Style style, IEnumerable<PointMm> extent)
    {
        if (style.Fill is { } fill)
        {
            graphics.DrawPath(new XSolidBrush(ToColour(fill, style.Opacity)), path);
        }

        if (style.Hatch is { } hatch)
        {
            var state = graphics.Save();
            graphics.IntersectClip(path);
            var pen = new XPen(ToColour(hatch.Colour, style.Opacity), hatch.LineWidthMm);
            var points = extent.ToList();
            foreach (var line in HatchLines(hatch, points.Min(p => p.X), points.Min(p => p.Y), points.Max(p => p.X), points.Max(p => p.Y)))
            {
                graphics.DrawLine(pen, line.From, line.To);
            }

            graphics.Restore(state);
        }

        if (Pen(style) is { } outline)
        {
            graphics.DrawPath(outline, path);
        }
    }

    /// <summary>Lines of each hatch family covering the box, spaced along the family's normal.</summary>
    private static IEnumerable<(XPoint From, XPoint To)> HatchLines(Hatch hatch, double minX, double minY, double maxX, double maxY)
    {
        var (cx, cy) = ((minX + maxX) / 2, (minY + maxY) / 2);
        var reach = Math.Sqrt(Math.Pow(maxX - minX, 2) + Math.Pow(maxY - minY, 2)) / 2 + hatch.SpacingMm;
        var angles = hatch.Crossed ? [hatch.AngleDeg, hatch.AngleDeg + 90] : new[] { hatch.AngleDeg };
        foreach (var angle in angles)
        {
            // A vertical line turned clockwise by the angle, as the SVG pattern tile is.
            var a = angle * Math.PI / 180;
            var (dx, dy) = (-Math.Sin(a), Math.Cos(a));
            var (nx, ny) = (Math.Cos(a), Math.Sin(a));
            // Offsets are whole multiples of the spacing from the page origin, so neighbouring areas line up.
            var centre = cx * nx + cy * ny;
            var first = Math.Floor((centre - reach) / hatch.SpacingMm);
            var last = Math.Ceiling((centre + reach) / hatch.SpacingMm);
            for (var k = first; k <= last; k++)
            {
                var offset = (k + 0.5) * hatch.SpacingMm - centre;
                var (px, py) = (cx + nx * offset, cy + ny * offset);
                yield return (new XPoint(px - dx * reach, py - dy * reach), new XPoint(px + dx * reach, py + dy * reach));
            }
        }
    }

    private static void DrawText(XGraphics graphics, Text text)
    {
        var font = ReportFonts.Font(text.SizeMm, text.Weight);
        var format = text.Anchor switch
        {
            TextAnchor.Start => XStringFormats.BaseLineLeft,
            TextAnchor.Middle => XStringFormats.BaseLineCenter,
            _ => XStringFormats.BaseLineRight,
        };
        var state = graphics.Save();
        if (text.RotationDeg != 0)
        {
            graphics.RotateAtTransform(text.RotationDeg, ToPoint(text.At));
        }

        graphics.DrawString(text.Value, font, new XSolidBrush(ToColour(text.Colour, 1)), ToPoint(text.At), format);
        graphics.Restore(state);
    }

    private static XPen? Pen(Style style)
    {
        if (style.Stroke is not { } stroke)
        {
            return null;
        }

        var pen = new XPen(ToColour(stroke, style.Opacity), style.StrokeWidthMm)
        {
            LineCap = XLineCap.Round,
            LineJoin = XLineJoin.Round,
        };
        if (style.DashMm.Count > 0)
        {
            // PDFsharp counts dash lengths in pen widths.
            pen.DashPattern = style.DashMm.Select(d => d / style.StrokeWidthMm).ToArray();
        }

        return pen;
    }

    private static XPoint ToPoint(PointMm p) => new(p.X, p.Y);

    private static XColor ToColour(Colour colour, double opacity) =>
        XColor.FromArgb((int)Math.Round(opacity * 255), colour.R, colour.G, colour.B);
}
