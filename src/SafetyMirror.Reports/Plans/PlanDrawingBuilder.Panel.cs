using NetTopologySuite.Geometries;
using SafetyMirror.Reports.Fonts;
using SafetyMirror.Reports.Graphics;
using Polygon = SafetyMirror.Reports.Graphics.Polygon;

namespace SafetyMirror.Reports.Plans;

// The panel beside or below the map: layouts, north arrow, scale bar and legend.
public sealed partial class PlanDrawingBuilder
{
    private const double PanelPaddingMm = 3;
    private const double LoosePaddingMm = 6;
    private const double TightPaddingMm = 4;
    private const double SymbolWidthMm = 8;
    private const double ScaleBarRoomMm = 40;

    /// <summary>The scale as a ratio over an alternating bar of a round length that fits <paramref name="roomMm"/>.</summary>
    private static (double Bottom, double LengthM) ScaleBar(List<Shape> shapes, List<PlanBox> symbols, double x, double top, double roomMm, int scale, LengthUnit unit)
    {
        var left = x + 1.5;
        var length = RoundNumbers.AtMost(roomMm * scale / 1000 / unit.Metres);
        var mmPerUnit = 1000.0 * unit.Metres / scale;
        var leading = Math.Round(length / Math.Pow(10, Math.Floor(Math.Log10(length))));
        var segments = leading == 2 ? 4 : 5;
        var y = top + 8;
        shapes.Add(new Text(new(x, y - 2), $"Scale 1:{scale}", TextMm) { Weight = FontWeight.Bold });
        var segmentMm = length * mmPerUnit / segments;
        for (var i = 0; i < segments; i++)
        {
            var sx = left + i * segmentMm;
            shapes.Add(new Polygon(
                [new(sx, y), new(sx + segmentMm, y), new(sx + segmentMm, y + 1.6), new(sx, y + 1.6)],
                new Style { Stroke = Colour.Black, StrokeWidthMm = 0.15, Fill = i % 2 == 0 ? Colour.Black : Colour.White }));
        }

        shapes.Add(new Text(new(left, y + 4.6), "0", TextMm) { Anchor = TextAnchor.Middle });
        shapes.Add(new Text(new(left + length * mmPerUnit, y + 4.6), $"{Invariant.Number(length)} {unit.Symbol}", TextMm) { Anchor = TextAnchor.Middle });
        symbols.Add(new PlanBox("scale bar", x, y - 5, left + length * mmPerUnit + 6, y + 6));
        return (y + 6, length * unit.Metres);
    }

    /// <summary>The panel on the right, and with <see cref="FitToContent"/> also the band below, each at the largest scale it allows.</summary>
    private IEnumerable<Layout> Layouts(List<LegendEntry> legend, Envelope extent)
    {
        var panelWidth = PanelWidth(legend);
        var mapWidth = widthMm - panelWidth;
        var right = Scale(extent, mapWidth, heightMm);
        if (right is { } rightScale)
        {
            var panelHeight = StackedPanel(new Frame(mapWidth, 0, panelWidth, heightMm), rightScale, legend).Draw([], []).Bottom + PanelPaddingMm;
            var height = FitToContent ? Math.Min(heightMm, Math.Max(panelHeight, MapHeight(extent, rightScale))) : heightMm;
            yield return new Layout(widthMm, height, rightScale, new Frame(0, 0, mapWidth, height), StackedPanel(new Frame(mapWidth, 0, panelWidth, height), rightScale, legend));
        }

        if (!FitToContent)
        {
            yield break;
        }

        var bandHeight = Band(new Frame(0, 0, widthMm, 0), 1000, legend).Draw([], []).Bottom + PanelPaddingMm;
        if (heightMm - bandHeight > 2 * MapPaddingMm && Scale(extent, widthMm, heightMm - bandHeight) is { } belowScale)
        {
            var mapHeight = Math.Min(heightMm - bandHeight, MapHeight(extent, belowScale));
            yield return new Layout(widthMm, mapHeight + bandHeight, belowScale, new Frame(0, 0, widthMm, mapHeight), Band(new Frame(0, mapHeight, widthMm, bandHeight), belowScale, legend));
        }
    }

    /// <summary>The white space round the map's content: less when the drawing is fitted to it, where every millimetre may decide the scale.</summary>
    private double MapPaddingMm => FitToContent ? TightPaddingMm : LoosePaddingMm;

    private double MapHeight(Envelope extent, int scale) => extent.Height * 1000 / scale + 2 * MapPaddingMm;

    private int? Scale(Envelope extent, double mapWidthMm, double mapHeightMm)
    {
        var (width, height) = (mapWidthMm - 2 * MapPaddingMm, mapHeightMm - 2 * MapPaddingMm);
        return width > 0 && height > 0 ? PlanScale.Choose(extent.Width, extent.Height, width, height) : null;
    }

    private PanelDrawer StackedPanel(Frame panel, int scale, List<LegendEntry> legend) => new((shapes, symbols) =>
    {
        shapes.Add(new Polyline([new(panel.X, 0.2), new(panel.X, panel.Height - 0.2)], Style.Line(Colour.Black, 0.35)));
        var x = panel.X + panel.Width / 2;
        var y = NorthArrow(shapes, symbols, x, panel.Y + PanelPaddingMm, NorthLabel, -RotationDeg);
        var left = panel.X + PanelPaddingMm;
        var (barY, barLengthM) = ScaleBar(shapes, symbols, left, y, panel.Width - 2 * PanelPaddingMm - 6, scale, Unit);
        var bottom = DrawLegend(shapes, symbols, left, barY, panel.X + panel.Width - PanelPaddingMm, legend, columns: 1);
        return (bottom, barLengthM);
    });

    /// <summary>A band below the map: the north arrow, the scale bar beside it, then the legend in as many columns as fit.</summary>
    private PanelDrawer Band(Frame band, int scale, List<LegendEntry> legend) => new((shapes, symbols) =>
    {
        shapes.Add(new Polyline([new(0.2, band.Y), new(band.Width - 0.2, band.Y)], Style.Line(Colour.Black, 0.35)));
        var arrowBottom = NorthArrow(shapes, symbols, band.X + PanelPaddingMm + 6, band.Y + PanelPaddingMm, NorthLabel, -RotationDeg);
        var barLeft = band.X + PanelPaddingMm + 16;
        var (barBottom, barLengthM) = ScaleBar(shapes, symbols, barLeft, band.Y + PanelPaddingMm - 2, ScaleBarRoomMm - 6, scale, Unit);
        var legendLeft = barLeft + ScaleBarRoomMm;
        var bottom = DrawLegend(shapes, symbols, legendLeft, band.Y + PanelPaddingMm - 2, band.X + band.Width - PanelPaddingMm, legend, columns: 0);
        return (Math.Max(Math.Max(arrowBottom, barBottom), bottom), barLengthM);
    });

    private double PanelWidth(List<LegendEntry> legend)
    {
        var widest = legend.Select(e => TextLayout.Width(e.Layer.Label, TextMm, FontWeight.Normal)).DefaultIfEmpty(0).Max();
        var wanted = 2 * PanelPaddingMm + SymbolWidthMm + 2 + widest;
        return Math.Clamp(wanted, 40, widthMm * 0.4);
    }

    /// <summary>A north arrow under its bold label: a split head, left half solid, turned to <paramref name="bearingDeg"/> clockwise from up.</summary>
    private static double NorthArrow(List<Shape> shapes, List<PlanBox> symbols, double x, double top, string label, double bearingDeg)
    {
        shapes.Add(new Text(new(x, top + 3.5), label, 3.5) { Anchor = TextAnchor.Middle, Weight = FontWeight.Bold });
        var centre = new PointMm(x, top + 10.5);
        var b = bearingDeg * Math.PI / 180;
        // Clockwise on paper, where y grows downwards.
        PointMm Turn(double dx, double dy) => new(centre.X + dx * Math.Cos(b) - dy * Math.Sin(b), centre.Y + dx * Math.Sin(b) + dy * Math.Cos(b));
        PointMm tip = Turn(0, -5.5), notch = Turn(0, 1.5), left = Turn(-2.8, 4), right = Turn(2.8, 4);
        shapes.Add(new Polygon([tip, left, notch], new Style { Stroke = Colour.Black, StrokeWidthMm = 0.2, Fill = Colour.Black }));
        shapes.Add(new Polygon([tip, notch, right], new Style { Stroke = Colour.Black, StrokeWidthMm = 0.2, Fill = Colour.White }));
        symbols.Add(new PlanBox("north arrow", x - 6, top, x + 6, top + 16.5));
        return top + 16.5;
    }

    /// <summary>The legend from <paramref name="left"/> to <paramref name="right"/>, in the given number of columns (0: as many as fit); returns its foot.</summary>
    private static double DrawLegend(List<Shape> shapes, List<PlanBox> symbols, double left, double top, double right, List<LegendEntry> legend, int columns)
    {
        var labelOffset = SymbolWidthMm + 2;
        var widest = legend.Select(e => TextLayout.Width(e.Layer.Label, TextMm, FontWeight.Normal)).DefaultIfEmpty(0).Max();
        var columnWidth = columns == 1 ? right - left : labelOffset + widest + 4;
        var count = columns > 0 ? columns : Math.Max(1, (int)Math.Floor((right - left + 4) / columnWidth));
        var labelWidth = columns == 1 ? right - left - labelOffset : widest + 0.5;
        var y = top + 5;
        shapes.Add(new Text(new(left, y), "Legend", TextMm) { Weight = FontWeight.Bold });
        y += 2;
        var perColumn = (int)Math.Ceiling(legend.Count / (double)count);
        var bottom = y;
        foreach (var (column, entries) in legend.Chunk(Math.Max(1, perColumn)).Select((e, i) => (i, e)))
        {
            var x = left + column * columnWidth;
            var rowTop = y;
            foreach (var entry in entries)
            {
                var lines = TextLayout.Wrap(entry.Layer.Label, TextMm, FontWeight.Normal, labelWidth);
                var rowHeight = Math.Max(5.5, lines.Count * TextMm * 1.25 + 2);
                var middle = rowTop + rowHeight / 2;
                shapes.AddRange(LegendSymbol(entry, x, middle));
                var firstBaseline = middle - (lines.Count - 1) * TextMm * 1.25 / 2 + TextMm * 0.35;
                shapes.AddRange(lines.Select((line, i) => new Text(new(x + labelOffset, firstBaseline + i * TextMm * 1.25), line, TextMm)));
                rowTop += rowHeight;
            }

            bottom = Math.Max(bottom, rowTop);
        }

        symbols.Add(new PlanBox("legend", left, top, right, bottom));
        return bottom;
    }

    private static IEnumerable<Shape> LegendSymbol(LegendEntry entry, double x, double middle)
    {
        var style = entry.Layer.Style;
        var (left, right) = (new PointMm(x, middle), new PointMm(x + SymbolWidthMm, middle));
        return entry.Symbol switch
        {
            SymbolKind.Area => [new Polygon([new(x, middle - 2), new(x + SymbolWidthMm, middle - 2), new(x + SymbolWidthMm, middle + 2), new(x, middle + 2)], style)],
            SymbolKind.Line => [new Polyline([left, right], style)],
            SymbolKind.Ticks => new[] { 1.0, 4, 7 }.Select(dx => (Shape)new Polyline([new(x + dx, middle - 1.2), new(x + dx, middle + 1.2)], style)).Prepend(new Polyline([left, right], style)),
            SymbolKind.Arrow => Graphics.Symbols.Arrow(left, right, style),
            _ => [Symbols.Marker(entry.Layer.Marker, new(x + SymbolWidthMm / 2, middle), entry.Layer.MarkerSizeMm, style)],
        };
    }

    /// <summary>Draws a panel (north arrow, scale bar, legend) and gives its foot and the scale bar's length in metres.</summary>
    private sealed record PanelDrawer(Func<List<Shape>, List<PlanBox>, (double Bottom, double BarLengthM)> Draw);

    /// <summary>One way to lay the drawing out: its size, scale, the map's frame and the panel.</summary>
    private sealed record Layout(double WidthMm, double HeightMm, int Scale, Frame Map, PanelDrawer Panel)
    {
        public double DrawPanel(List<Shape> shapes, List<PlanBox> symbols) => Panel.Draw(shapes, symbols).BarLengthM;
    }
}
