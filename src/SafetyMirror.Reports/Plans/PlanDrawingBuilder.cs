using NetTopologySuite.Geometries;
using NetTopologySuite.LinearReferencing;
using SafetyMirror.Reports.Fonts;
using SafetyMirror.Reports.Graphics;
using GeometryPolygon = NetTopologySuite.Geometries.Polygon;
using Polygon = SafetyMirror.Reports.Graphics.Polygon;

namespace SafetyMirror.Reports.Plans;

/// <summary>Builds a plan from geometries in local metres: fitted at a round scale, with north arrow, scale bar and legend.</summary>
/// <remarks>
/// Coordinates are local metres with x to the east and y to the north, so north is up on the plan. The map takes
/// the left part of the drawing; a panel on the right holds the north arrow, the scale bar and one legend entry
/// per layer and kind of symbol used, in the order first added. Geometry is painted in the order added, labels over it.
/// The panel has room for about a dozen legend entries on a 120 mm tall plan; more run past its foot. Station labels
/// and the scale bar are in <see cref="Unit"/>, metres by default.
/// </remarks>
public sealed class PlanDrawingBuilder
{
    private const double TextMm = 2.5;
    private const double PanelPaddingMm = 3;
    private const double MapPaddingMm = 6;
    private const double SymbolWidthMm = 8;
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
    /// <paramref name="side"/> of the line, looking along it from its start.
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
    /// <remarks>The label goes on <paramref name="side"/> of the line (by default the right, opposite the tick labels).</remarks>
    public PlanDrawingBuilder AddStationMarker(LineString line, double stationM, string label, PlanLayer layer, LabelSide side = LabelSide.Right)
    {
        ArgumentNullException.ThrowIfNull(line);
        ArgumentNullException.ThrowIfNull(label);
        ArgumentNullException.ThrowIfNull(layer);
        Checks.InRange(stationM, 0, line.Length);
        items.Add(new Mark(line, stationM, label, layer, side));
        return this;
    }

    /// <summary>Adds a text centred on a point, over a white backdrop, drawn over every geometry; it has no legend entry.</summary>
    public PlanDrawingBuilder AddLabel(Coordinate at, string text)
    {
        ArgumentNullException.ThrowIfNull(at);
        ArgumentNullException.ThrowIfNull(text);
        items.Add(new Caption(Factory.CreatePoint(at), text));
        return this;
    }

    /// <summary>Adds an arrow from a point towards a compass bearing, of a fixed length on paper whatever the scale.</summary>
    /// <param name="from">Where the arrow starts, local metres.</param>
    /// <param name="azimuthDeg">The bearing, degrees clockwise from north (up on the plan).</param>
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

    /// <summary>Lays the plan out and draws it.</summary>
    /// <exception cref="InvalidOperationException">Nothing with a position was added.</exception>
    public PlanDrawing Build()
    {
        var extent = new Envelope();
        foreach (var item in items)
        {
            extent.ExpandToInclude(item.Geometry.EnvelopeInternal);
        }

        if (extent.IsNull)
        {
            throw new InvalidOperationException("A plan needs at least one non-empty geometry.");
        }

        var legend = LegendEntries();
        var panelWidth = PanelWidth(legend);
        var map = new Frame(0, 0, widthMm - panelWidth, heightMm);
        var scale = PlanScale.Choose(extent.Width, extent.Height, map.Width - 2 * MapPaddingMm, map.Height - 2 * MapPaddingMm);
        var paper = new Paper(extent.Centre, new PointMm(map.Width / 2, map.Height / 2), 1000.0 / scale);

        var shapes = new List<Shape>();
        var labels = new List<Shape>();
        foreach (var item in items)
        {
            item.Draw(paper, shapes, labels);
        }

        // Labels go over every geometry, so no later line runs through one.
        shapes.AddRange(labels);

        var panel = new Frame(map.Width, 0, panelWidth, heightMm);
        shapes.Add(new Polyline([new(0.2, 0.2), new(widthMm - 0.2, 0.2), new(widthMm - 0.2, heightMm - 0.2), new(0.2, heightMm - 0.2), new(0.2, 0.2)], Style.Line(Colour.Black, 0.35)));
        shapes.Add(new Polyline([new(panel.X, 0.2), new(panel.X, heightMm - 0.2)], Style.Line(Colour.Black, 0.35)));
        var y = NorthArrow(shapes, panel, NorthLabel);
        var (barY, barLengthM) = ScaleBar(shapes, panel, y, scale, Unit);
        DrawLegend(shapes, panel, barY, legend);
        return new PlanDrawing(new Drawing(widthMm, heightMm, shapes) { Title = title }, scale, barLengthM);
    }

    private List<LegendEntry> LegendEntries() =>
        items.SelectMany(item => item.Symbols().Select(symbol => new LegendEntry(item.Layer, symbol))).Distinct().ToList();

    private double PanelWidth(List<LegendEntry> legend)
    {
        var widest = legend.Select(e => TextLayout.Width(e.Layer.Label, TextMm, FontWeight.Normal)).DefaultIfEmpty(0).Max();
        var wanted = 2 * PanelPaddingMm + SymbolWidthMm + 2 + widest;
        return Math.Clamp(wanted, 40, widthMm * 0.4);
    }

    /// <summary>A north arrow centred at the top of the panel: a split head, left half solid, under its bold label.</summary>
    private static double NorthArrow(List<Shape> shapes, Frame panel, string label)
    {
        var x = panel.X + panel.Width / 2;
        var top = panel.Y + PanelPaddingMm;
        shapes.Add(new Text(new(x, top + 3.5), label, 3.5) { Anchor = TextAnchor.Middle, Weight = FontWeight.Bold });
        PointMm tip = new(x, top + 5), notch = new(x, top + 12), left = new(x - 2.8, top + 14.5), right = new(x + 2.8, top + 14.5);
        shapes.Add(new Polygon([tip, left, notch], new Style { Stroke = Colour.Black, StrokeWidthMm = 0.2, Fill = Colour.Black }));
        shapes.Add(new Polygon([tip, notch, right], new Style { Stroke = Colour.Black, StrokeWidthMm = 0.2, Fill = Colour.White }));
        return top + 14.5;
    }

    /// <summary>The scale as a ratio over an alternating bar of a round length that fits the panel.</summary>
    private static (double Bottom, double LengthM) ScaleBar(List<Shape> shapes, Frame panel, double top, int scale, LengthUnit unit)
    {
        var left = panel.X + PanelPaddingMm + 1.5;
        var room = panel.Width - 2 * PanelPaddingMm - 6;
        var length = RoundNumbers.AtMost(room * scale / 1000 / unit.Metres);
        var mmPerUnit = 1000.0 * unit.Metres / scale;
        var leading = Math.Round(length / Math.Pow(10, Math.Floor(Math.Log10(length))));
        var segments = leading == 2 ? 4 : 5;
        var y = top + 8;
        shapes.Add(new Text(new(panel.X + PanelPaddingMm, y - 2), $"Scale 1:{scale}", TextMm) { Weight = FontWeight.Bold });
        var segmentMm = length * mmPerUnit / segments;
        for (var i = 0; i < segments; i++)
        {
            var x = left + i * segmentMm;
            shapes.Add(new Polygon(
                [new(x, y), new(x + segmentMm, y), new(x + segmentMm, y + 1.6), new(x, y + 1.6)],
                new Style { Stroke = Colour.Black, StrokeWidthMm = 0.15, Fill = i % 2 == 0 ? Colour.Black : Colour.White }));
        }

        shapes.Add(new Text(new(left, y + 4.6), "0", TextMm) { Anchor = TextAnchor.Middle });
        shapes.Add(new Text(new(left + length * mmPerUnit, y + 4.6), $"{Invariant.Number(length)} {unit.Symbol}", TextMm) { Anchor = TextAnchor.Middle });
        return (y + 6, length * unit.Metres);
    }

    private static void DrawLegend(List<Shape> shapes, Frame panel, double top, List<LegendEntry> legend)
    {
        var x = panel.X + PanelPaddingMm;
        var labelX = x + SymbolWidthMm + 2;
        var labelWidth = panel.X + panel.Width - PanelPaddingMm - labelX;
        var y = top + 5;
        shapes.Add(new Text(new(x, y), "Legend", TextMm) { Weight = FontWeight.Bold });
        y += 2;
        foreach (var entry in legend)
        {
            var lines = TextLayout.Wrap(entry.Layer.Label, TextMm, FontWeight.Normal, labelWidth);
            var rowHeight = Math.Max(5.5, lines.Count * TextMm * 1.25 + 2);
            var middle = y + rowHeight / 2;
            shapes.AddRange(LegendSymbol(entry, x, middle));
            var firstBaseline = middle - (lines.Count - 1) * TextMm * 1.25 / 2 + TextMm * 0.35;
            shapes.AddRange(lines.Select((line, i) => new Text(new(labelX, firstBaseline + i * TextMm * 1.25), line, TextMm)));
            y += rowHeight;
        }
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

    /// <summary>A text centred just beyond <paramref name="point"/> in direction (nx, ny), clear of it by <paramref name="clearanceMm"/>.</summary>
    private static Text Label(PointMm point, double nx, double ny, double clearanceMm, string value, FontWeight weight)
    {
        // Half the label's extent along the direction, so its nearest edge sits at the clearance.
        var halfExtent = Math.Abs(nx) * TextLayout.Width(value, TextMm, weight) / 2 + Math.Abs(ny) * TextMm * 0.36;
        var distance = clearanceMm + halfExtent;
        return new Text(new(point.X + nx * distance, point.Y + ny * distance + TextMm * 0.36), value, TextMm)
        {
            Anchor = TextAnchor.Middle,
            Weight = weight,
        };
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

    /// <summary>Local metres to paper millimetres: the extent's centre goes to the map's centre, y flips.</summary>
    private sealed record Paper(Coordinate Centre, PointMm MapCentre, double MmPerM)
    {
        public PointMm ToPaper(Coordinate c) =>
            new(MapCentre.X + (c.X - Centre.X) * MmPerM, MapCentre.Y - (c.Y - Centre.Y) * MmPerM);

        public IReadOnlyList<PointMm> ToPaper(IEnumerable<Coordinate> coordinates) => coordinates.Select(ToPaper).ToList();
    }

    private abstract record Item(Geometry Geometry, PlanLayer Layer)
    {
        /// <summary>Adds the item's geometry to <paramref name="shapes"/> and its labels to <paramref name="labels"/>.</summary>
        public abstract void Draw(Paper paper, List<Shape> shapes, List<Shape> labels);

        public abstract IEnumerable<SymbolKind> Symbols();
    }

    private sealed record Features(Geometry Geometry, PlanLayer Layer) : Item(Geometry, Layer)
    {
        public override void Draw(Paper paper, List<Shape> shapes, List<Shape> labels) => shapes.AddRange(Leaves(Geometry).Select(leaf => leaf switch
        {
            Point point => Graphics.Symbols.Marker(Layer.Marker, paper.ToPaper(point.Coordinate), Layer.MarkerSizeMm, Layer.Style),
            LineString line => new Polyline(paper.ToPaper(line.Coordinates), Layer.Style),
            GeometryPolygon polygon => new Polygon(
                paper.ToPaper(polygon.Shell.Coordinates),
                Layer.Style,
                polygon.Holes.Select(hole => paper.ToPaper(hole.Coordinates)).ToList()),
            _ => throw new NotSupportedException($"A plan cannot draw a {leaf.GeometryType}."),
        }));

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
        public override void Draw(Paper paper, List<Shape> shapes, List<Shape> labels)
        {
            var labelEvery = (int)Math.Max(1, Math.Ceiling(7 / (IntervalM * paper.MmPerM)));
            var count = (int)Math.Floor(Line.Length / IntervalM + 1e-9);
            for (var i = 0; i <= count; i++)
            {
                var stationM = i * IntervalM;
                var (at, nx, ny) = Station(Line, stationM, paper);
                shapes.Add(new Polyline([new(at.X - nx * 1.2, at.Y - ny * 1.2), new(at.X + nx * 1.2, at.Y + ny * 1.2)], Layer.Style));
                if (i % labelEvery == 0)
                {
                    var sign = Side == LabelSide.Left ? 1 : -1;
                    var label = Label(at, sign * nx, sign * ny, 1.8, Invariant.Number(stationM / Unit.Metres), FontWeight.Normal) with { Colour = Layer.Style.Stroke ?? Colour.Black };
                    labels.Add(Graphics.Symbols.Backdrop(label, Colour.White));
                    labels.Add(label);
                }
            }
        }

        public override IEnumerable<SymbolKind> Symbols() => [SymbolKind.Ticks];
    }

    private sealed record Mark(LineString Line, double StationM, string Caption, PlanLayer Layer, LabelSide Side) : Item(Line, Layer)
    {
        public override void Draw(Paper paper, List<Shape> shapes, List<Shape> labels)
        {
            var (at, nx, ny) = Station(Line, StationM, paper);
            shapes.Add(Graphics.Symbols.Marker(Layer.Marker, at, Layer.MarkerSizeMm, Layer.Style));
            var sign = Side == LabelSide.Left ? 1 : -1;
            var label = Label(at, sign * nx, sign * ny, Layer.MarkerSizeMm / 2 + 1, Caption, FontWeight.Bold);
            labels.Add(Graphics.Symbols.Backdrop(label, Colour.White));
            labels.Add(label);
        }

        public override IEnumerable<SymbolKind> Symbols() => [SymbolKind.Point];
    }

    private sealed record Caption(Point At, string Value) : Item(At, LabelLayer)
    {
        private static readonly PlanLayer LabelLayer = new("Label", Style.Line(Colour.Black, 0.1));

        public override void Draw(Paper paper, List<Shape> shapes, List<Shape> labels)
        {
            var at = paper.ToPaper(At.Coordinate);
            var text = new Text(new(at.X, at.Y + TextMm * 0.36), Value, TextMm) { Anchor = TextAnchor.Middle };
            labels.Add(Graphics.Symbols.Backdrop(text, Colour.White));
            labels.Add(text);
        }

        public override IEnumerable<SymbolKind> Symbols() => [];
    }

    private sealed record Bearing(Point From, double AzimuthDeg, double LengthMm, PlanLayer Layer) : Item(From, Layer)
    {
        public override void Draw(Paper paper, List<Shape> shapes, List<Shape> labels)
        {
            var start = paper.ToPaper(From.Coordinate);
            var a = AzimuthDeg * Math.PI / 180;
            // Clockwise from north, with y growing downwards on paper.
            var end = new PointMm(start.X + Math.Sin(a) * LengthMm, start.Y - Math.Cos(a) * LengthMm);
            shapes.AddRange(Graphics.Symbols.Arrow(start, end, Layer.Style));
        }

        public override IEnumerable<SymbolKind> Symbols() => [SymbolKind.Arrow];
    }
}
