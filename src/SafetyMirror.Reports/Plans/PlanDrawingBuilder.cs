using NetTopologySuite.Geometries;
using NetTopologySuite.LinearReferencing;
using SafetyMirror.Reports.Graphics;

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
public sealed partial class PlanDrawingBuilder
{
    private const double TextMm = 2.5;
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

    private List<LegendEntry> LegendEntries() =>
        items.SelectMany(item => item.Symbols().Select(symbol => new LegendEntry(item.Layer, symbol))).Distinct().ToList();

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
}
