using NetTopologySuite.Geometries;
using SafetyMirror.Reports.Fonts;
using SafetyMirror.Reports.Graphics;
using Polygon = SafetyMirror.Reports.Graphics.Polygon;

namespace SafetyMirror.Reports.Charts;

/// <summary>Builds an x–y line chart: round-numbered axes, named series, labelled threshold and marker lines, and a legend.</summary>
/// <remarks>
/// Both axes start from zero or below, so magnitudes compare honestly. Each series gets its own dash pattern and
/// marker (at most six series), so the chart reads in black and white. Threshold (horizontal) and marker (vertical)
/// lines are labelled where they are drawn, each label at the first of a few places where it covers no data, no other
/// label; the legend below the plot names the series. An axis may be capped (<see cref="CapXAxis"/>,
/// <see cref="CapYAxis"/>): what lies beyond is cut off and <see cref="XCutAt"/> / <see cref="YCutAt"/> say where, for
/// the caption to say so.
/// </remarks>
public sealed class LineChartBuilder
{
    private const double TickTextMm = 2.5;
    private const double AxisTextMm = 2.8;
    private const double NoteTextMm = 2.3;
    private const double LegendRowMm = 4.5;
    private const double LegendSymbolMm = 10;

    private static readonly (Colour Colour, IReadOnlyList<double> Dash, MarkerKind Marker, bool Solid)[] Looks =
    [
        (Colour.Blue, Dashes.Solid, MarkerKind.Circle, false),
        (Colour.Red, Dashes.Dashed, MarkerKind.Square, true),
        (Colour.Green, Dashes.Dotted, MarkerKind.Triangle, false),
        (Colour.Black, Dashes.DashDot, MarkerKind.Diamond, true),
        (Colour.DarkGrey, Dashes.LongDashed, MarkerKind.Circle, true),
        (Colour.Blue, Dashes.Dashed, MarkerKind.Square, false),
    ];

    /// <summary>Geometry in paper millimetres, for cutting the data to the plot and keeping labels off them.</summary>
    private static readonly GeometryFactory Paper = new();

    private readonly double widthMm;
    private readonly double heightMm;
    private readonly string xAxisLabel;
    private readonly string yAxisLabel;
    private readonly string? title;
    private readonly List<(string Name, IReadOnlyList<(double X, double Y)> Points)> series = [];
    private readonly List<(double Y, string Label)> thresholds = [];
    private readonly List<(double X, string Label)> markers = [];
    private readonly List<double> reach = [];
    private double? xCap;
    private double? yCap;

    /// <summary>Starts a chart of the given size on paper with axis titles that name their units, e.g. "Distance (m)".</summary>
    public LineChartBuilder(double widthMm, double heightMm, string xAxisLabel, string yAxisLabel, string? title = null)
    {
        this.widthMm = Checks.InRange(widthMm, 60, 2000);
        this.heightMm = Checks.InRange(heightMm, 40, 2000);
        this.xAxisLabel = xAxisLabel ?? throw new ArgumentNullException(nameof(xAxisLabel));
        this.yAxisLabel = yAxisLabel ?? throw new ArgumentNullException(nameof(yAxisLabel));
        this.title = title;
    }

    /// <summary>Adds a named series of (x, y) points, drawn joined in the order given.</summary>
    public LineChartBuilder AddSeries(string name, IEnumerable<(double X, double Y)> points)
    {
        ArgumentException.ThrowIfNullOrWhiteSpace(name);
        ArgumentNullException.ThrowIfNull(points);
        if (series.Count == Looks.Length)
        {
            throw new InvalidOperationException($"A chart shows at most {Looks.Length} series, so that each keeps its own line and marker.");
        }

        var list = points.ToList();
        if (list.Count == 0 || !list.All(p => double.IsFinite(p.X) && double.IsFinite(p.Y)))
        {
            throw new ArgumentException($"Series '{name}' must have at least one point, all with finite x and y.", nameof(points));
        }

        series.Add((name, list));
        return this;
    }

    /// <summary>Adds a labelled horizontal line at <paramref name="y"/>, such as a recognition threshold.</summary>
    public LineChartBuilder AddThreshold(double y, string label)
    {
        ArgumentNullException.ThrowIfNull(label);
        thresholds.Add((Checks.Finite(y, "y-axis units"), label));
        return this;
    }

    /// <summary>Adds a labelled vertical line at <paramref name="x"/>, such as the required distance.</summary>
    public LineChartBuilder AddMarker(double x, string label)
    {
        ArgumentNullException.ThrowIfNull(label);
        markers.Add((Checks.Finite(x, "x-axis units"), label));
        return this;
    }

    /// <summary>Widens the x axis to reach <paramref name="x"/>, drawing nothing there, so that the last data and markers keep clear of its end.</summary>
    public LineChartBuilder ExtendXAxis(double x)
    {
        reach.Add(Checks.Finite(x, "x-axis units"));
        return this;
    }

    /// <summary>The left edge of the plot at least this far from the chart's edge, so that charts drawn one above the other share their x axis on paper.</summary>
    public double MinPlotLeftMm { get; init; }

    /// <summary>After <see cref="Build"/>: where the x axis ends if some data lay beyond it and were cut off; otherwise null.</summary>
    public double? XCutAt { get; private set; }

    /// <summary>After <see cref="Build"/>: where the y axis ends if some data lay above it and were cut off; otherwise null.</summary>
    public double? YCutAt { get; private set; }

    /// <summary>Ends the x axis at the first round tick at or beyond <paramref name="x"/>, cutting off the data beyond it.</summary>
    public LineChartBuilder CapXAxis(double x)
    {
        xCap = Checks.Finite(x, "x-axis units");
        return this;
    }

    /// <summary>Ends the y axis at the first round tick at or above <paramref name="y"/>, cutting off the data above it.</summary>
    public LineChartBuilder CapYAxis(double y)
    {
        yCap = Checks.Finite(y, "y-axis units");
        return this;
    }

    /// <summary>Lays the chart out and draws it.</summary>
    /// <exception cref="InvalidOperationException">No series was added.</exception>
    public Drawing Build()
    {
        if (series.Count == 0)
        {
            throw new InvalidOperationException("A chart needs at least one series.");
        }

        const double margin = 3;
        var legendRows = LegendRows(widthMm - 2 * margin);
        var bottom = heightMm - margin - legendRows.Count * LegendRowMm - 2 - AxisTextMm - 2 - TickTextMm - 2.5;
        var top = margin + 1;
        var ys = series.SelectMany(s => s.Points).Select(p => p.Y).Concat(thresholds.Select(t => t.Y)).ToList();
        var yTicks = AxisTicks.For(Math.Min(0, ys.Min()), Capped(Math.Max(0, ys.Max()), yCap), Math.Clamp((int)((bottom - top) / 12), 2, 10));
        var yLabels = yTicks.Values.Select(Invariant.Number).ToList();
        var left = Math.Max(MinPlotLeftMm, margin + AxisTextMm + 2 + yLabels.Max(l => TextLayout.Width(l, TickTextMm, FontWeight.Normal)) + 2.5);
        var right = widthMm - margin - 2;
        var xs = series.SelectMany(s => s.Points).Select(p => p.X).Concat(markers.Select(m => m.X)).Concat(reach).ToList();
        var xTicks = AxisTicks.For(Math.Min(0, xs.Min()), Capped(Math.Max(0, xs.Max()), xCap), Math.Clamp((int)((right - left) / 18), 2, 10));
        var plot = new Plot(left, top, right, bottom, xTicks, yTicks);
        XCutAt = series.Any(s => s.Points.Any(p => p.X > xTicks.Max)) ? xTicks.Max : null;
        YCutAt = series.Any(s => s.Points.Any(p => p.Y > yTicks.Max)) ? yTicks.Max : null;

        var shapes = new List<Shape>();
        DrawAxes(shapes, plot, yLabels);
        var data = new List<Geometry>();
        for (var i = 0; i < series.Count; i++)
        {
            DrawSeries(shapes, data, plot, i);
        }

        var taken = new Taken(data);
        var labels = new List<Shape>();
        DrawThresholds(shapes, labels, plot, taken);
        DrawMarkers(shapes, labels, plot, taken);

        // Labels go over the series and every line, so that each stays readable.
        shapes.AddRange(labels);
        DrawLegend(shapes, legendRows, margin, heightMm - margin - legendRows.Count * LegendRowMm);
        return new Drawing(widthMm, heightMm, shapes) { Title = title };
    }

    private static double Capped(double max, double? cap) => cap is { } c && c < max ? c : max;

    /// <summary>Each threshold line, labelled above or below it at its right or left end, where the label covers no data.</summary>
    private void DrawThresholds(List<Shape> shapes, List<Shape> labels, Plot plot, Taken taken)
    {
        foreach (var (y, label) in thresholds.OrderByDescending(t => t.Y))
        {
            var py = plot.Y(y);
            shapes.Add(new Polyline([new(plot.Left, py), new(plot.Right, py)], Style.Line(Colour.DarkGrey, 0.3, Dashes.LongDashed)));
            Text At(double x, double baseline, TextAnchor anchor) => new(new(x, baseline), label, NoteTextMm) { Anchor = anchor, Colour = Colour.DarkGrey };
            var (above, below) = (py - 0.8, py + 0.8 + 0.76 * NoteTextMm);
            taken.Place(labels,
            [
                At(plot.Right - 1, above, TextAnchor.End), At(plot.Right - 1, below, TextAnchor.End),
                At(plot.Left + 1, above, TextAnchor.Start), At(plot.Left + 1, below, TextAnchor.Start),
                At((plot.Left + plot.Right) / 2, above, TextAnchor.Middle), At((plot.Left + plot.Right) / 2, below, TextAnchor.Middle),
            ]);
        }
    }

    /// <summary>Each marker line, its label turned to read upwards beside it, at the top or the foot, where it covers no data.</summary>
    private void DrawMarkers(List<Shape> shapes, List<Shape> labels, Plot plot, Taken taken)
    {
        foreach (var (x, label) in markers)
        {
            var px = plot.X(x);
            shapes.Add(new Polyline([new(px, plot.Top), new(px, plot.Bottom)], Style.Line(Colour.Black, 0.3, Dashes.DashDot)));
            Text At(double side, double y, TextAnchor anchor) => new(new(px + side, y), label, NoteTextMm) { Anchor = anchor, RotationDeg = -90 };
            var (leftOfLine, rightOfLine) = (-0.8, 0.8 + 0.76 * NoteTextMm);
            taken.Place(labels,
            [
                At(leftOfLine, plot.Top + 1, TextAnchor.End), At(rightOfLine, plot.Top + 1, TextAnchor.End),
                At(leftOfLine, plot.Bottom - 1, TextAnchor.Start), At(rightOfLine, plot.Bottom - 1, TextAnchor.Start),
            ]);
        }
    }

    private void DrawAxes(List<Shape> shapes, Plot plot, List<string> yLabels)
    {
        var grid = Style.Line(Colour.LightGrey, 0.15);
        var axis = Style.Line(Colour.Black, 0.3);
        for (var i = 0; i < plot.YTicks.Values.Count; i++)
        {
            var py = plot.Y(plot.YTicks.Values[i]);
            shapes.Add(new Polyline([new(plot.Left, py), new(plot.Right, py)], grid));
            shapes.Add(new Polyline([new(plot.Left - 1, py), new(plot.Left, py)], axis));
            shapes.Add(new Text(new(plot.Left - 1.8, py + TickTextMm * 0.36), yLabels[i], TickTextMm) { Anchor = TextAnchor.End });
        }

        foreach (var x in plot.XTicks.Values)
        {
            var px = plot.X(x);
            shapes.Add(new Polyline([new(px, plot.Top), new(px, plot.Bottom)], grid));
            shapes.Add(new Polyline([new(px, plot.Bottom), new(px, plot.Bottom + 1)], axis));
            shapes.Add(new Text(new(px, plot.Bottom + 1.5 + TickTextMm), Invariant.Number(x), TickTextMm) { Anchor = TextAnchor.Middle });
        }

        shapes.Add(new Polyline([new(plot.Left, plot.Top), new(plot.Left, plot.Bottom), new(plot.Right, plot.Bottom)], axis));
        shapes.Add(new Text(new((plot.Left + plot.Right) / 2, plot.Bottom + 2 + TickTextMm + 2 + AxisTextMm), xAxisLabel, AxisTextMm) { Anchor = TextAnchor.Middle });
        shapes.Add(new Text(new(3 + AxisTextMm, (plot.Top + plot.Bottom) / 2), yAxisLabel, AxisTextMm) { Anchor = TextAnchor.Middle, RotationDeg = -90 });
    }

    /// <summary>Draws a series cut to the plot, and adds what it covers on paper to <paramref name="data"/>.</summary>
    private void DrawSeries(List<Shape> shapes, List<Geometry> data, Plot plot, int index)
    {
        var points = series[index].Points.Select(p => new Coordinate(plot.X(p.X), plot.Y(p.Y))).ToArray();
        var (line, marker) = SeriesStyles(index);
        if (points.Length > 1)
        {
            var inside = Paper.CreateLineString(points).Intersection(plot.Area);
            foreach (var piece in Enumerable.Range(0, inside.NumGeometries).Select(inside.GetGeometryN).OfType<LineString>())
            {
                shapes.Add(new Polyline([.. piece.Coordinates.Select(c => new PointMm(c.X, c.Y))], line));
                data.Add(piece);
            }
        }

        // About eight markers per series, staggered between series so that they do not sit on each other.
        var every = Math.Max(1, points.Length / 8);
        for (var i = index * every / series.Count; i < points.Length; i += every)
        {
            var at = Paper.CreatePoint(points[i]);
            if (plot.Area.Covers(at))
            {
                shapes.Add(Symbols.Marker(Looks[index].Marker, new PointMm(points[i].X, points[i].Y), 2, marker));
                data.Add(at.Buffer(1.2, 4));
            }
        }
    }

    private static (Style Line, Style Marker) SeriesStyles(int index)
    {
        var look = Looks[index];
        return (
            Style.Line(look.Colour, 0.4, look.Dash),
            new Style { Stroke = look.Colour, StrokeWidthMm = 0.25, Fill = look.Solid ? look.Colour : Colour.White });
    }

    /// <summary>The series indices on each legend row, filling rows left to right.</summary>
    private List<List<int>> LegendRows(double width)
    {
        var rows = new List<List<int>> { new() };
        var used = 0.0;
        for (var i = 0; i < series.Count; i++)
        {
            var item = ItemWidth(i);
            if (used > 0 && used + item > width)
            {
                rows.Add([]);
                used = 0;
            }

            rows[^1].Add(i);
            used += item;
        }

        return rows;
    }

    private double ItemWidth(int index) => LegendSymbolMm + 1.5 + TextLayout.Width(series[index].Name, TickTextMm, FontWeight.Normal) + 5;

    private void DrawLegend(List<Shape> shapes, List<List<int>> rows, double left, double top)
    {
        for (var r = 0; r < rows.Count; r++)
        {
            var middle = top + (r + 0.5) * LegendRowMm;
            var x = left;
            foreach (var i in rows[r])
            {
                var (line, marker) = SeriesStyles(i);
                shapes.Add(new Polyline([new(x, middle), new(x + LegendSymbolMm, middle)], line));
                shapes.Add(Symbols.Marker(Looks[i].Marker, new(x + LegendSymbolMm / 2, middle), 2, marker));
                shapes.Add(new Text(new(x + LegendSymbolMm + 1.5, middle + TickTextMm * 0.36), series[i].Name, TickTextMm));
                x += ItemWidth(i);
            }
        }
    }

    /// <summary>What labels must keep clear of on paper: the data and the labels already placed.</summary>
    private sealed class Taken(List<Geometry> data)
    {
        private readonly List<Geometry> taken = [.. data];

        /// <summary>Places the first candidate that covers nothing taken (the first one if every candidate does), over a white backdrop.</summary>
        public void Place(List<Shape> labels, IReadOnlyList<Text> candidates)
        {
            var boxes = candidates.Select(c => (Text: c, Backdrop: Symbols.Backdrop(c, Colour.White))).ToList();
            var chosen = boxes.FirstOrDefault(b => !taken.Any(Box(b.Backdrop).Intersects));
            if (chosen.Text is null)
            {
                chosen = boxes[0];
            }

            taken.Add(Box(chosen.Backdrop));
            labels.Add(chosen.Backdrop);
            labels.Add(chosen.Text);
        }

        private static Geometry Box(Polygon backdrop) => Paper.CreatePolygon([.. backdrop.Shell.Append(backdrop.Shell[0]).Select(p => new Coordinate(p.X, p.Y))]);
    }

    /// <summary>The plot area on paper and the data-to-paper mapping of its axes.</summary>
    private sealed record Plot(double Left, double Top, double Right, double Bottom, AxisTicks XTicks, AxisTicks YTicks)
    {
        /// <summary>The plot's rectangle on paper, which the data are cut to.</summary>
        public Geometry Area { get; } = Paper.ToGeometry(new Envelope(Left, Right, Top, Bottom));

        public double X(double x) => Left + (x - XTicks.Min) / (XTicks.Max - XTicks.Min) * (Right - Left);

        public double Y(double y) => Bottom - (y - YTicks.Min) / (YTicks.Max - YTicks.Min) * (Bottom - Top);
    }
}
