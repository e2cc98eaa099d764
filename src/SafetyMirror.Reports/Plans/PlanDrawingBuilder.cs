using NetTopologySuite.Geometries;
using NetTopologySuite.LinearReferencing;
using SafetyMirror.Reports.Fonts;
using SafetyMirror.Reports.Graphics;
using GeometryPolygon = NetTopologySuite.Geometries.Polygon;
using Polygon = SafetyMirror.Reports.Graphics.Polygon;

namespace SafetyMirror.Reports.Plans;

/// <summary>Builds a plan from geometries in local metres: fitted at a round scale, with north arrow, scale bar and legend.</summary>
/// <remarks>
/// Coordinates are local metres with x to the east and y to the north; north is up on the plan unless
/// <see cref="RotationDeg"/> turns it. The map takes the left part of the drawing; a panel on the right (or, with
/// <see cref="FitToContent"/>, a band below when that gives the larger scale) holds the north arrow, the scale bar and
/// one legend entry per layer and kind of symbol used, in the order first added. Geometry is painted in the order added,
/// labels over it. Labels are placed last, each at the first of its candidate places that overlaps no other label and no
/// symbol (point markers, arrows, north arrow, scale bar, legend) and stays inside the map; a label with no free place
/// is left out. The panel has room for about a dozen legend entries on a 120 mm tall plan; more run past its foot.
/// Station labels and the scale bar are in <see cref="Unit"/>, metres by default.
/// </remarks>
public sealed class PlanDrawingBuilder
{
    private const double TextMm = 2.5;
    private const double PanelPaddingMm = 3;
    private const double LoosePaddingMm = 6;
    private const double TightPaddingMm = 4;
    private const double SymbolWidthMm = 8;
    private const double ScaleBarRoomMm = 40;
    private static readonly GeometryFactory Factory = new();

    private readonly double widthMm;
    private readonly double heightMm;
    private readonly string? title;
    private readonly List<Item> items = [];

    /// <summary>The word over the north arrow: "N" for true north, "Plan N" where the plan has no true north.</summary>
    public string NorthLabel { get; init; } = "N";

    /// <summary>Starts a plan of the given size on paper.</summary>
    /// <param name="widthMm">The drawing width in millimetres (at least 80).</param>
    /// <param name="heightMm">The drawing height in millimetres (at least 60).</param>
    /// <param name="title">A short description for screen readers, or null.</param>
    public PlanDrawingBuilder(double widthMm, double heightMm, string? title = null)
    {
        this.widthMm = Checks.InRange(widthMm, 80, 2000);
        this.heightMm = Checks.InRange(heightMm, 60, 2000);
        this.title = title;
    }

    /// <summary>The unit of the station labels and the scale bar; the geometry stays in local metres.</summary>
    public LengthUnit Unit { get; init; } = LengthUnit.Metre;

    /// <summary>How far to turn the plan on the paper, degrees counter-clockwise; the north arrow turns with it.</summary>
    public double RotationDeg { get; init => field = Checks.InRange(value, -180, 180); }

    /// <summary>
    /// Whether the legend may go below the map when that gives a larger scale (or the same scale in less paper), and the
    /// drawing is trimmed to the height the map and legend use; otherwise the drawing keeps the size it was given.
    /// </summary>
    public bool FitToContent { get; init; }

    /// <summary>Adds a geometry (point, line, polygon or a collection of them) drawn in the layer's style.</summary>
    public PlanDrawingBuilder Add(Geometry geometry, PlanLayer layer)
    {
        ArgumentNullException.ThrowIfNull(geometry);
        ArgumentNullException.ThrowIfNull(layer);
        items.Add(new Features(geometry, layer));
        return this;
    }

    /// <summary>Adds ticks across <paramref name="line"/> every <paramref name="intervalM"/> metres from its start, labelled in <see cref="Unit"/>.</summary>
    /// <remarks>
    /// Ticks sit at 0, interval, 2 × interval … up to the line's length; labels thin out to keep about 7 mm apart. For
    /// round labels in feet, give the interval as a round number of feet in metres (50 ft is 15.24 m). The labels go on
    /// <paramref name="side"/> of the line, looking along it from its start, or across it where that side is taken.
    /// </remarks>
    public PlanDrawingBuilder AddStationTicks(LineString line, double intervalM, PlanLayer layer, LabelSide side = LabelSide.Left)
    {
        ArgumentNullException.ThrowIfNull(line);
        ArgumentNullException.ThrowIfNull(layer);
        Checks.Positive(intervalM, "m");
        items.Add(new Ticks(line, intervalM, layer, Unit, side));
        return this;
    }

    /// <summary>Adds a symbol with a label at <paramref name="stationM"/> metres along <paramref name="line"/> from its start.</summary>
    /// <remarks>The label goes on <paramref name="side"/> of the line (by default the right, opposite the tick labels) if free, else around the symbol.</remarks>
    public PlanDrawingBuilder AddStationMarker(LineString line, double stationM, string label, PlanLayer layer, LabelSide side = LabelSide.Right)
    {
        ArgumentNullException.ThrowIfNull(line);
        ArgumentNullException.ThrowIfNull(label);
        ArgumentNullException.ThrowIfNull(layer);
        Checks.InRange(stationM, 0, line.Length);
        items.Add(new Mark(line, stationM, label, layer, side));
        return this;
    }

    /// <summary>Adds a text centred on a point (or, where that is taken, beside it), over a white backdrop; it has no legend entry.</summary>
    public PlanDrawingBuilder AddLabel(Coordinate at, string text)
    {
        ArgumentNullException.ThrowIfNull(at);
        ArgumentNullException.ThrowIfNull(text);
        items.Add(new Caption([Factory.CreatePoint(at)], text, Beside: true));
        return this;
    }

    /// <summary>Adds a text centred on the first of <paramref name="places"/> that is free, or none; it has no legend entry.</summary>
    public PlanDrawingBuilder AddLabel(IReadOnlyList<Coordinate> places, string text)
    {
        ArgumentNullException.ThrowIfNull(places);
        ArgumentNullException.ThrowIfNull(text);
        items.Add(new Caption([.. places.Select(Factory.CreatePoint)], text, Beside: false));
        return this;
    }

    /// <summary>Adds a street name, upright, along <paramref name="road"/> (its area or line): inside it where there is room, else beside it, clear of every drawn line.</summary>
    public PlanDrawingBuilder AddStreetName(Geometry road, string name)
    {
        ArgumentNullException.ThrowIfNull(road);
        ArgumentException.ThrowIfNullOrWhiteSpace(name);
        items.Add(new StreetName(road, name));
        return this;
    }

    /// <summary>Adds an arrow from a point towards a compass bearing, of a fixed length on paper whatever the scale.</summary>
    /// <param name="from">Where the arrow starts, local metres.</param>
    /// <param name="azimuthDeg">The bearing, degrees clockwise from the plan's north.</param>
    /// <param name="lengthMm">The arrow's length on paper, more than its 2.5 mm head.</param>
    /// <param name="layer">The layer whose stroke the arrow takes.</param>
    public PlanDrawingBuilder AddArrow(Coordinate from, double azimuthDeg, double lengthMm, PlanLayer layer)
    {
        ArgumentNullException.ThrowIfNull(from);
        ArgumentNullException.ThrowIfNull(layer);
        Checks.Finite(azimuthDeg, "degrees");
        Checks.InRange(lengthMm, 3, 100);
        items.Add(new Bearing(Factory.CreatePoint(from), azimuthDeg, lengthMm, layer));
        return this;
    }

    /// <summary>Adds an arrow beside <paramref name="line"/> at <paramref name="stationM"/>, pointing back towards the line's start (the way traffic on an outward-drawn approach travels).</summary>
    /// <param name="line">The line, drawn from where traffic is going.</param>
    /// <param name="stationM">Where along the line the arrow's middle sits.</param>
    /// <param name="lengthMm">The arrow's length on paper, more than its 2.5 mm head.</param>
    /// <param name="layer">The layer whose stroke the arrow takes.</param>
    /// <param name="side">The side of the line it goes on, looking along the line from its start.</param>
    public PlanDrawingBuilder AddTravelArrow(LineString line, double stationM, double lengthMm, PlanLayer layer, LabelSide side)
    {
        ArgumentNullException.ThrowIfNull(line);
        ArgumentNullException.ThrowIfNull(layer);
        Checks.InRange(stationM, 0, line.Length);
        Checks.InRange(lengthMm, 3, 100);
        items.Add(new Travel(line, stationM, lengthMm, layer, side));
        return this;
    }

    /// <summary>Lays the plan out and draws it.</summary>
    /// <exception cref="InvalidOperationException">Nothing with a position was added.</exception>
    public PlanDrawing Build()
    {
        var rotation = RotationDeg * Math.PI / 180;
        var extent = new Envelope();
        foreach (var item in items)
        {
            foreach (var c in item.Geometry.Coordinates)
            {
                extent.ExpandToInclude(Paper.Turn(c, rotation));
            }
        }

        if (extent.IsNull)
        {
            throw new InvalidOperationException("A plan needs at least one non-empty geometry.");
        }

        var legend = LegendEntries();
        var layout = Layouts(legend, extent)
            .OrderBy(l => l.Scale)
            .ThenBy(l => l.WidthMm * l.HeightMm)
            .First();
        var paper = new Paper(extent.Centre, new PointMm(layout.Map.X + layout.Map.Width / 2, layout.Map.Y + layout.Map.Height / 2), 1000.0 / layout.Scale, rotation);

        var canvas = new Canvas(paper);
        foreach (var item in items)
        {
            item.Draw(canvas);
        }

        var shapes = canvas.Shapes;
        var symbols = canvas.Symbols;
        var panel = new List<Shape>();
        var barLengthM = layout.DrawPanel(panel, symbols);
        var (labels, leftOut) = PlaceLabels(canvas, layout.Map);
        shapes.AddRange(labels.SelectMany(l => new Shape[] { Graphics.Symbols.Backdrop(l.Text, Colour.White), l.Text }));
        shapes.Add(new Polyline([new(0.2, 0.2), new(layout.WidthMm - 0.2, 0.2), new(layout.WidthMm - 0.2, layout.HeightMm - 0.2), new(0.2, layout.HeightMm - 0.2), new(0.2, 0.2)], Style.Line(Colour.Black, 0.35)));
        shapes.AddRange(panel);
        return new PlanDrawing(new Drawing(layout.WidthMm, layout.HeightMm, shapes) { Title = title }, layout.Scale, barLengthM)
        {
            RotationDeg = RotationDeg,
            LabelBoxes = [.. labels.Select(l => l.Box)],
            SymbolBoxes = symbols,
            LabelsLeftOut = leftOut,
            ContentBox = new PlanBox("map content", layout.Map.X + MapPaddingMm, layout.Map.Y + MapPaddingMm, layout.Map.X + layout.Map.Width - MapPaddingMm, layout.Map.Y + layout.Map.Height - MapPaddingMm),
        };
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

    private List<LegendEntry> LegendEntries() =>
        items.SelectMany(item => item.Symbols().Select(symbol => new LegendEntry(item.Layer, symbol))).Distinct().ToList();

    private double PanelWidth(List<LegendEntry> legend)
    {
        var widest = legend.Select(e => TextLayout.Width(e.Layer.Label, TextMm, FontWeight.Normal)).DefaultIfEmpty(0).Max();
        var wanted = 2 * PanelPaddingMm + SymbolWidthMm + 2 + widest;
        return Math.Clamp(wanted, 40, widthMm * 0.4);
    }

    /// <summary>Places the labels, most important first, each at its first free candidate inside the map.</summary>
    private static (List<PlacedLabel> Placed, List<string> LeftOut) PlaceLabels(Canvas canvas, Frame map)
    {
        var inside = new PlanBox("map", map.X + 0.5, map.Y + 0.5, map.X + map.Width - 0.5, map.Y + map.Height - 0.5);
        var placed = new List<PlacedLabel>();
        var leftOut = new List<string>();
        foreach (var request in canvas.Labels.OrderBy(l => l.Priority))
        {
            var free = request.Candidates
                .Select(at => new Text(at, request.Value, TextMm) { Anchor = TextAnchor.Middle, Weight = request.Weight, Colour = request.Colour })
                .Select(text => new PlacedLabel(text, BoxOf(text)))
                .FirstOrDefault(l => l.Box.IsInside(inside)
                    && !canvas.Symbols.Any(l.Box.Overlaps)
                    && !placed.Any(p => p.Box.Overlaps(l.Box))
                    && !(request.AvoidLines && canvas.Lines.Any(l.Box.Overlaps)));
            if (free is null)
            {
                leftOut.Add(request.Value);
            }
            else
            {
                placed.Add(free);
            }
        }

        return (placed, leftOut);
    }

    /// <summary>The box of an upright text's backdrop.</summary>
    private static PlanBox BoxOf(Text text)
    {
        var shell = Graphics.Symbols.Backdrop(text, Colour.White).Shell;
        return new PlanBox(text.Value, shell.Min(p => p.X), shell.Min(p => p.Y), shell.Max(p => p.X), shell.Max(p => p.Y));
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

    /// <summary>Where a text's baseline middle goes for it to sit just beyond <paramref name="point"/> in direction (nx, ny), clear of it by <paramref name="clearanceMm"/>.</summary>
    private static PointMm Beyond(PointMm point, double nx, double ny, double clearanceMm, string value, FontWeight weight)
    {
        // Half the label's extent along the direction, so its nearest edge sits at the clearance.
        var halfExtent = Math.Abs(nx) * TextLayout.Width(value, TextMm, weight) / 2 + Math.Abs(ny) * TextMm * 0.5;
        var distance = clearanceMm + halfExtent;
        return new(point.X + nx * distance, point.Y + ny * distance + TextMm * 0.26);
    }

    /// <summary>Places around a point in eight directions, starting with (nx, ny) and turning away from it both ways.</summary>
    private static IEnumerable<PointMm> Around(PointMm point, double nx, double ny, double clearanceMm, string value, FontWeight weight)
    {
        foreach (var turnDeg in new[] { 0, 45, -45, 90, -90, 135, -135, 180 })
        {
            var t = turnDeg * Math.PI / 180;
            yield return Beyond(point, nx * Math.Cos(t) - ny * Math.Sin(t), nx * Math.Sin(t) + ny * Math.Cos(t), clearanceMm, value, weight);
        }
    }

    /// <summary>The unit normal to the left of the line's direction at a station, on paper.</summary>
    private static (PointMm At, double Nx, double Ny) Station(LineString line, double stationM, Paper paper)
    {
        var indexed = new LengthIndexedLine(line);
        var step = Math.Min(0.05, line.Length / 100);
        var at = paper.ToPaper(indexed.ExtractPoint(stationM));
        var behind = paper.ToPaper(indexed.ExtractPoint(Math.Max(0, stationM - step)));
        var ahead = paper.ToPaper(indexed.ExtractPoint(Math.Min(line.Length, stationM + step)));
        var (dx, dy) = (ahead.X - behind.X, ahead.Y - behind.Y);
        var length = Math.Sqrt(dx * dx + dy * dy);
        // Y grows downwards on paper, so (dy, -dx) is the left-hand side.
        return (at, dy / length, -dx / length);
    }

    /// <summary>Small boxes every millimetre along a line on paper, half as wide as <paramref name="halfWidthMm"/>: a line's footprint for the collision check.</summary>
    private static IEnumerable<PlanBox> AlongLine(string what, IReadOnlyList<PointMm> points, double halfWidthMm)
    {
        for (var i = 1; i < points.Count; i++)
        {
            var (a, b) = (points[i - 1], points[i]);
            var steps = Math.Max(1, (int)Math.Ceiling(Math.Sqrt((b.X - a.X) * (b.X - a.X) + (b.Y - a.Y) * (b.Y - a.Y))));
            for (var s = 0; s <= steps; s++)
            {
                yield return PlanBox.Around(what, new(a.X + (b.X - a.X) * s / steps, a.Y + (b.Y - a.Y) * s / steps), halfWidthMm);
            }
        }
    }

    /// <summary>An arrow drawn over a white casing, so it stays legible where it crosses other lines, and its footprint.</summary>
    private static void DrawArrow(Canvas canvas, PointMm from, PointMm to, Style style)
    {
        canvas.Shapes.Add(new Polyline([from, to], Style.Line(Colour.White, style.StrokeWidthMm + 0.8)));
        canvas.Shapes.AddRange(Graphics.Symbols.Arrow(from, to, style));
        canvas.Symbols.AddRange(AlongLine("arrow", [from, to], 1));
    }

    private enum SymbolKind
    {
        Area,
        Line,
        Point,
        Ticks,
        Arrow,
    }

    private sealed record LegendEntry(PlanLayer Layer, SymbolKind Symbol);

    private sealed record Frame(double X, double Y, double Width, double Height);

    /// <summary>Draws a panel (north arrow, scale bar, legend) and gives its foot and the scale bar's length in metres.</summary>
    private sealed record PanelDrawer(Func<List<Shape>, List<PlanBox>, (double Bottom, double BarLengthM)> Draw);

    /// <summary>One way to lay the drawing out: its size, scale, the map's frame and the panel.</summary>
    private sealed record Layout(double WidthMm, double HeightMm, int Scale, Frame Map, PanelDrawer Panel)
    {
        public double DrawPanel(List<Shape> shapes, List<PlanBox> symbols) => Panel.Draw(shapes, symbols).BarLengthM;
    }

    private sealed record LabelRequest(string Value, FontWeight Weight, Colour Colour, IReadOnlyList<PointMm> Candidates, int Priority, bool AvoidLines = false);

    private sealed record PlacedLabel(Text Text, PlanBox Box);

    /// <summary>What the items draw on: the shapes, the symbols' boxes, the drawn lines' footprints and the labels still to place.</summary>
    private sealed record Canvas(Paper Paper)
    {
        public List<Shape> Shapes { get; } = [];

        public List<PlanBox> Symbols { get; } = [];

        public List<PlanBox> Lines { get; } = [];

        public List<LabelRequest> Labels { get; } = [];
    }

    /// <summary>Local metres to paper millimetres: turned by the rotation, the extent's centre to the map's centre, y flipped.</summary>
    private sealed record Paper(Coordinate Centre, PointMm MapCentre, double MmPerM, double RotationRad)
    {
        public static Coordinate Turn(Coordinate c, double rotationRad) =>
            new(c.X * Math.Cos(rotationRad) - c.Y * Math.Sin(rotationRad), c.X * Math.Sin(rotationRad) + c.Y * Math.Cos(rotationRad));

        public PointMm ToPaper(Coordinate c)
        {
            var turned = Turn(c, RotationRad);
            return new(MapCentre.X + (turned.X - Centre.X) * MmPerM, MapCentre.Y - (turned.Y - Centre.Y) * MmPerM);
        }

        public IReadOnlyList<PointMm> ToPaper(IEnumerable<Coordinate> coordinates) => coordinates.Select(ToPaper).ToList();
    }

    private abstract record Item(Geometry Geometry, PlanLayer Layer)
    {
        /// <summary>Draws the item's geometry and symbols on the canvas and asks for its labels.</summary>
        public abstract void Draw(Canvas canvas);

        public abstract IEnumerable<SymbolKind> Symbols();
    }

    private sealed record Features(Geometry Geometry, PlanLayer Layer) : Item(Geometry, Layer)
    {
        public override void Draw(Canvas canvas)
        {
            foreach (var leaf in Leaves(Geometry))
            {
                switch (leaf)
                {
                    case Point point:
                        var at = canvas.Paper.ToPaper(point.Coordinate);
                        canvas.Shapes.Add(Graphics.Symbols.Marker(Layer.Marker, at, Layer.MarkerSizeMm, Layer.Style));
                        canvas.Symbols.Add(PlanBox.Around("marker", at, Layer.MarkerSizeMm / 2));
                        break;
                    case LineString line:
                        var points = canvas.Paper.ToPaper(line.Coordinates);
                        canvas.Shapes.Add(new Polyline(points, Layer.Style));
                        canvas.Lines.AddRange(AlongLine(Layer.Label, points, Math.Max(0.5, Layer.Style.StrokeWidthMm / 2)));
                        break;
                    case GeometryPolygon polygon:
                        canvas.Shapes.Add(new Polygon(
                            canvas.Paper.ToPaper(polygon.Shell.Coordinates),
                            Layer.Style,
                            polygon.Holes.Select(hole => canvas.Paper.ToPaper(hole.Coordinates)).ToList()));
                        break;
                    default:
                        throw new NotSupportedException($"A plan cannot draw a {leaf.GeometryType}.");
                }
            }
        }

        public override IEnumerable<SymbolKind> Symbols() => Leaves(Geometry).Select(leaf => leaf switch
        {
            Point => SymbolKind.Point,
            LineString => SymbolKind.Line,
            _ => SymbolKind.Area,
        });

        private static IEnumerable<Geometry> Leaves(Geometry geometry) => geometry switch
        {
            { IsEmpty: true } => [],
            GeometryCollection collection => Enumerable.Range(0, collection.NumGeometries).SelectMany(i => Leaves(collection.GetGeometryN(i))),
            _ => [geometry],
        };
    }

    private sealed record Ticks(LineString Line, double IntervalM, PlanLayer Layer, LengthUnit Unit, LabelSide Side) : Item(Line, Layer)
    {
        public override void Draw(Canvas canvas)
        {
            var labelEvery = (int)Math.Max(1, Math.Ceiling(7 / (IntervalM * canvas.Paper.MmPerM)));
            var count = (int)Math.Floor(Line.Length / IntervalM + 1e-9);
            for (var i = 0; i <= count; i++)
            {
                var stationM = i * IntervalM;
                var (at, nx, ny) = Station(Line, stationM, canvas.Paper);
                canvas.Shapes.Add(new Polyline([new(at.X - nx * 1.2, at.Y - ny * 1.2), new(at.X + nx * 1.2, at.Y + ny * 1.2)], Layer.Style));
                if (i % labelEvery == 0)
                {
                    var sign = Side == LabelSide.Left ? 1 : -1;
                    var value = Invariant.Number(stationM / Unit.Metres);
                    canvas.Labels.Add(new LabelRequest(value, FontWeight.Normal, Layer.Style.Stroke ?? Colour.Black,
                        [Beyond(at, sign * nx, sign * ny, 1.8, value, FontWeight.Normal), Beyond(at, -sign * nx, -sign * ny, 1.8, value, FontWeight.Normal)], Priority: 2));
                }
            }
        }

        public override IEnumerable<SymbolKind> Symbols() => [SymbolKind.Ticks];
    }

    private sealed record Mark(LineString Line, double StationM, string Caption, PlanLayer Layer, LabelSide Side) : Item(Line, Layer)
    {
        public override void Draw(Canvas canvas)
        {
            var (at, nx, ny) = Station(Line, StationM, canvas.Paper);
            canvas.Shapes.Add(Graphics.Symbols.Marker(Layer.Marker, at, Layer.MarkerSizeMm, Layer.Style));
            canvas.Symbols.Add(PlanBox.Around("marker", at, Layer.MarkerSizeMm / 2));
            var sign = Side == LabelSide.Left ? 1 : -1;
            canvas.Labels.Add(new LabelRequest(Caption, FontWeight.Bold, Colour.Black, [.. Around(at, sign * nx, sign * ny, Layer.MarkerSizeMm / 2 + 1, Caption, FontWeight.Bold)], Priority: 0));
        }

        public override IEnumerable<SymbolKind> Symbols() => [SymbolKind.Point];
    }

    private sealed record Caption(IReadOnlyList<Point> Places, string Value, bool Beside) : Item(Factory.CreateMultiPoint([.. Places]), LabelLayer)
    {
        private static readonly PlanLayer LabelLayer = new("Label", Style.Line(Colour.Black, 0.1));

        public override void Draw(Canvas canvas)
        {
            var centres = Places.Select(p => canvas.Paper.ToPaper(p.Coordinate)).ToList();
            var candidates = centres.Select(at => new PointMm(at.X, at.Y + TextMm * 0.26));
            if (Beside)
            {
                candidates = candidates.Concat(centres.SelectMany(at => Around(at, 0, -1, 2.2, Value, FontWeight.Normal)));
            }

            canvas.Labels.Add(new LabelRequest(Value, FontWeight.Normal, Colour.Black, [.. candidates], Priority: 1));
        }

        public override IEnumerable<SymbolKind> Symbols() => [];
    }

    private sealed record StreetName(Geometry Road, string Value) : Item(Road, NameLayer)
    {
        private const double GridMm = 1.5;
        private static readonly PlanLayer NameLayer = new("Street name", Style.Line(Colour.Black, 0.1));

        public override void Draw(Canvas canvas)
        {
            // The road as drawn on paper, to keep the name on it or just beside it.
            var onPaper = Factory.CreateGeometry(Road);
            onPaper.Apply(new PaperFilter(canvas.Paper));
            var near = onPaper.Buffer(1.2);
            var envelope = near.EnvelopeInternal;
            var centre = canvas.Paper.MapCentre;
            var candidates = new List<(PointMm At, bool Inside, double Distance)>();
            for (var x = envelope.MinX; x <= envelope.MaxX; x += GridMm)
            {
                for (var y = envelope.MinY; y <= envelope.MaxY; y += GridMm)
                {
                    var text = new Text(new(x, y), Value, TextMm) { Anchor = TextAnchor.Middle, Weight = FontWeight.Bold };
                    var box = BoxOf(text);
                    var boxShape = Factory.ToGeometry(new Envelope(box.Left, box.Right, box.Top, box.Bottom));
                    if (near.Intersects(boxShape))
                    {
                        candidates.Add((text.At, onPaper.Covers(boxShape), Math.Abs(x - centre.X) + Math.Abs(y - centre.Y)));
                    }
                }
            }

            // Inside the road first; then away from the corner at the map's centre, where the other labels crowd.
            var ordered = candidates.OrderByDescending(c => c.Inside).ThenByDescending(c => Math.Min(c.Distance, 45)).ThenBy(c => c.Distance).Select(c => c.At);
            canvas.Labels.Add(new LabelRequest(Value, FontWeight.Bold, Colour.DarkGrey, [.. ordered], Priority: 3, AvoidLines: true));
        }

        public override IEnumerable<SymbolKind> Symbols() => [];

        private sealed class PaperFilter(Paper paper) : ICoordinateSequenceFilter
        {
            public bool Done => false;

            public bool GeometryChanged => true;

            public void Filter(CoordinateSequence seq, int i)
            {
                var at = paper.ToPaper(seq.GetCoordinate(i));
                seq.SetX(i, at.X);
                seq.SetY(i, at.Y);
            }
        }
    }

    private sealed record Bearing(Point From, double AzimuthDeg, double LengthMm, PlanLayer Layer) : Item(From, Layer)
    {
        public override void Draw(Canvas canvas)
        {
            var start = canvas.Paper.ToPaper(From.Coordinate);
            // Clockwise from the plan's north, which the rotation turns counter-clockwise on the paper; y grows downwards.
            var a = AzimuthDeg * Math.PI / 180 - canvas.Paper.RotationRad;
            var end = new PointMm(start.X + Math.Sin(a) * LengthMm, start.Y - Math.Cos(a) * LengthMm);
            DrawArrow(canvas, start, end, Layer.Style);
        }

        public override IEnumerable<SymbolKind> Symbols() => [SymbolKind.Arrow];
    }

    private sealed record Travel(LineString Line, double StationM, double LengthMm, PlanLayer Layer, LabelSide Side) : Item(Line, Layer)
    {
        private const double OffsetMm = 2.8;

        public override void Draw(Canvas canvas)
        {
            var (at, nx, ny) = Station(Line, StationM, canvas.Paper);
            var sign = Side == LabelSide.Left ? 1 : -1;
            // Along the line is (-ny, nx); traffic travels back towards the line's start.
            var middle = new PointMm(at.X + sign * nx * OffsetMm, at.Y + sign * ny * OffsetMm);
            var half = LengthMm / 2;
            DrawArrow(canvas, new(middle.X - ny * half, middle.Y + nx * half), new(middle.X + ny * half, middle.Y - nx * half), Layer.Style);
        }

        public override IEnumerable<SymbolKind> Symbols() => [SymbolKind.Arrow];
    }
}
