using NetTopologySuite.Geometries;
using SafetyMirror.Reports.Fonts;
using SafetyMirror.Reports.Graphics;
using GeometryPolygon = NetTopologySuite.Geometries.Polygon;
using Polygon = SafetyMirror.Reports.Graphics.Polygon;

namespace SafetyMirror.Reports.Plans;

// What a plan is built from: each item draws its shapes and symbols and asks for its labels.
public sealed partial class PlanDrawingBuilder
{
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
            var clearance = Layer.MarkerSizeMm / 2 + 1;
            // Beside the line first, centred on the symbol or slid along the line either way (near a map edge), then round it.
            var slide = TextLayout.Width(Caption, TextMm, FontWeight.Bold) / 2 - Layer.MarkerSizeMm / 2;
            var beside = new[] { sign, -sign }.SelectMany(side => new[] { 0, -slide, slide }.Select(along =>
                Beyond(new(at.X - ny * along, at.Y + nx * along), side * nx, side * ny, clearance, Caption, FontWeight.Bold)));
            canvas.Labels.Add(new LabelRequest(Caption, FontWeight.Bold, Colour.Black, [.. beside, .. Around(at, sign * nx, sign * ny, clearance, Caption, FontWeight.Bold)], Priority: 0));
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
