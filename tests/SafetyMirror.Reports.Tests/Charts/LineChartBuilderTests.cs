using System.Globalization;
using SafetyMirror.Reports.Charts;
using SafetyMirror.Reports.Graphics;

namespace SafetyMirror.Reports.Tests.Charts;

public sealed class LineChartBuilderTests
{
    // Invented curves shaped like apparent size against distance (k / d), not measured data.
    private static IEnumerable<(double X, double Y)> Curve(double k) =>
        Enumerable.Range(5, 56).Select(d => ((double)d, k / d));

    private static LineChartBuilder Chart() =>
        new LineChartBuilder(170, 95, "Distance (m)", "Apparent size (arcmin)")
            .AddSeries("Passenger car", Curve(1375))
            .AddSeries("Cyclist", Curve(515))
            .AddSeries("Pedestrian", Curve(430))
            .AddThreshold(12, "Recognition 12′")
            .AddThreshold(5, "Detection 5′")
            .AddMarker(22, "Required 22 m");

    private static List<Text> Texts(Drawing drawing) => drawing.Shapes.OfType<Text>().ToList();

    private static List<double> AxisNumbers(Drawing drawing, TextAnchor anchor) =>
        Texts(drawing)
            .Where(t => t.Anchor == anchor && t.RotationDeg == 0 && double.TryParse(t.Value, NumberStyles.Float, CultureInfo.InvariantCulture, out _))
            .Select(t => double.Parse(t.Value, CultureInfo.InvariantCulture))
            .ToList();

    [Fact]
    public void Build_Labels_NameAxesSeriesThresholdsAndMarkers()
    {
        var texts = Texts(Chart().Build()).Select(t => t.Value).ToList();

        Assert.All(
            new[] { "Distance (m)", "Apparent size (arcmin)", "Passenger car", "Cyclist", "Pedestrian", "Recognition 12′", "Detection 5′", "Required 22 m" },
            label => Assert.Contains(label, texts));
    }

    [Fact]
    public void Build_XTickLabels_AreEvenlySteppedRoundNumbersFromZero()
    {
        var xs = AxisNumbers(Chart().Build(), TextAnchor.Middle);

        Assert.Equal(0, xs[0]);
        Assert.True(xs[^1] >= 60, $"the axis must reach the last distance, 60 m; it ends at {xs[^1]}");
        AssertRoundSteps(xs);
    }

    [Fact]
    public void Build_YTickLabels_AreEvenlySteppedRoundNumbersFromZero()
    {
        // The y tick labels are the right-aligned numbers left of the axis.
        var ys = AxisNumbers(Chart().Build(), TextAnchor.End);

        Assert.Equal(0, ys[0]);
        Assert.True(ys[^1] >= 1375 / 5.0, $"the axis must reach the largest value, 275; it ends at {ys[^1]}");
        AssertRoundSteps(ys);
    }

    [Fact]
    public void Build_Series_HaveDistinctDashPatternsAndMarkers()
    {
        var drawing = Chart().Build();

        // Series lines are the polylines through many points (the axes have three).
        var dashes = drawing.Shapes.OfType<Polyline>().Where(l => l.Points.Count > 3).Select(l => string.Join(' ', l.Style.DashMm)).ToList();
        Assert.Equal(3, dashes.Count);
        Assert.Equal(3, dashes.Distinct().Count());
        var markerKinds = drawing.Shapes.Where(s => s is Circle || (s is Polygon p && p.Shell.Count is 3 or 4 && p.Style.Stroke is not null)).Select(s => s switch
        {
            Circle => "circle",
            Polygon { Shell.Count: 3 } => "triangle",
            _ => "four-sided",
        }).Distinct();
        Assert.Equal(3, markerKinds.Count());
    }

    [Fact]
    public void Build_Threshold_IsAHorizontalLineAcrossThePlot()
    {
        var drawing = new LineChartBuilder(170, 95, "x", "y").AddSeries("s", [(0, 0), (10, 20)]).AddThreshold(12, "T").Build();

        var threshold = drawing.Shapes.OfType<Polyline>().Single(l => l.Style.DashMm.SequenceEqual(Dashes.LongDashed));
        Assert.Equal(threshold.Points[0].Y, threshold.Points[1].Y, 9);
        Assert.True(threshold.Points[1].X - threshold.Points[0].X > 120, "the line spans the plot width");
    }

    [Fact]
    public void Build_Marker_IsAVerticalLine()
    {
        var drawing = new LineChartBuilder(170, 95, "x", "y").AddSeries("s", [(0, 0), (10, 20)]).AddMarker(4, "M").Build();

        var marker = drawing.Shapes.OfType<Polyline>().Single(l => l.Style.DashMm.SequenceEqual(Dashes.DashDot));
        Assert.Equal(marker.Points[0].X, marker.Points[1].X, 9);
    }

    [Fact]
    public void Build_ThresholdAboveTheData_WidensTheAxisToShowIt()
    {
        var drawing = new LineChartBuilder(170, 95, "x", "y").AddSeries("s", [(0, 1), (10, 3)]).AddThreshold(12, "T").Build();

        Assert.True(AxisNumbers(drawing, TextAnchor.End).Max() >= 12);
    }

    [Fact]
    public void AddSeries_Seventh_IsRefused()
    {
        var chart = new LineChartBuilder(170, 95, "x", "y");
        for (var i = 0; i < 6; i++)
        {
            chart.AddSeries($"s{i}", [(0, i), (1, i)]);
        }

        Assert.Throws<InvalidOperationException>(() => chart.AddSeries("s6", [(0, 6), (1, 6)]));
    }

    [Fact]
    public void AddSeries_NaNPoint_IsRefused()
    {
        Assert.Throws<ArgumentException>(() => new LineChartBuilder(170, 95, "x", "y").AddSeries("s", [(0, double.NaN)]));
    }

    private static void AssertRoundSteps(List<double> ticks)
    {
        var step = ticks[1] - ticks[0];
        var mantissa = step / Math.Pow(10, Math.Floor(Math.Log10(step)));
        Assert.Contains(Math.Round(mantissa, 9), new[] { 1.0, 2, 5 });
        Assert.All(ticks.Zip(ticks.Skip(1)), pair => Assert.Equal(step, pair.Second - pair.First, 9));
    }

    [Fact]
    public void ExtendXAxis_BeyondTheData_WidensTheAxisToIt()
    {
        var chart = new LineChartBuilder(170, 95, "Distance (m)", "Size").AddSeries("Car", Curve(1375)).ExtendXAxis(84).Build();

        // The curve ends at 60 m; the axis must reach 84 m, and round ticks of 10 or 20 m then end at 90 or 100.
        Assert.True(AxisNumbers(chart, TextAnchor.Middle).Max() >= 84);
    }

    /// <summary>What a text covers on paper: its backdrop box.</summary>
    private static NetTopologySuite.Geometries.Geometry Box(Text text) =>
        Paper.CreatePolygon([.. Symbols.Backdrop(text, Colour.White).Shell.Append(Symbols.Backdrop(text, Colour.White).Shell[0]).Select(p => new NetTopologySuite.Geometries.Coordinate(p.X, p.Y))]);

    /// <summary>The data curves on paper: the polylines of more than three points (axes have three, grid lines two).</summary>
    private static List<NetTopologySuite.Geometries.Geometry> Curves(Drawing drawing) =>
    [
        .. drawing.Shapes.OfType<Polyline>().Where(p => p.Points.Count > 3)
            .Select(p => (NetTopologySuite.Geometries.Geometry)Paper.CreateLineString([.. p.Points.Select(q => new NetTopologySuite.Geometries.Coordinate(q.X, q.Y))])),
    ];

    private static readonly NetTopologySuite.Geometries.GeometryFactory Paper = new();

    [Fact]
    public void Build_DataAlongTheThresholdsRightEnd_PutsItsLabelWhereItCoversNoData()
    {
        // A curve running just above and below the threshold over the right half, where the label would go first.
        var flat = Enumerable.Range(30, 31).Select(x => ((double)x, 5 + ((x % 2 == 0 ? 1 : -1) * 0.3)));
        var drawing = new LineChartBuilder(170, 95, "Distance (m)", "Size").AddSeries("Car", Enumerable.Range(0, 30).Select(x => ((double)x, 20.0)).Concat(flat))
            .AddThreshold(5, "Detection 5′").Build();

        var label = Texts(drawing).Single(t => t.Value == "Detection 5′");
        Assert.DoesNotContain(Curves(drawing), curve => curve.Intersects(Box(label)));
    }

    [Fact]
    public void Build_ThresholdAndMarkerLabels_CoverNoCurve()
    {
        var drawing = Chart().Build();

        foreach (var label in Texts(drawing).Where(t => t.Value is "Recognition 12′" or "Detection 5′" or "Required 22 m"))
        {
            Assert.DoesNotContain(Curves(drawing), curve => curve.Intersects(Box(label)));
        }
    }

    [Fact]
    public void CapYAxis_BelowTheData_CutsTheCurvesAtTheAxisAndSaysWhere()
    {
        var chart = new LineChartBuilder(170, 95, "Distance (m)", "Size").AddSeries("Car", Curve(1375)).CapYAxis(60);
        var drawing = chart.Build();

        // The curve starts at 1375 / 5 = 275, far above the cap; round ticks of 10 or 20 end the axis at 60.
        Assert.Equal(60, chart.YCutAt);
        Assert.Null(chart.XCutAt);
        var top = drawing.Shapes.OfType<Polyline>().Where(p => p.Points.Count == 3).Single().Points[0].Y;
        Assert.All(Curves(drawing).SelectMany(c => c.Coordinates), c => Assert.True(c.Y >= top - 1e-9));
    }

    [Fact]
    public void CapXAxis_BeforeTheDataEnd_CutsTheCurvesAndSaysWhere()
    {
        var chart = new LineChartBuilder(170, 95, "Distance (m)", "Size").AddSeries("Car", Curve(1375)).CapXAxis(40);
        chart.Build();

        Assert.Equal(40, chart.XCutAt);
    }

    [Fact]
    public void Build_DataWithinTheCaps_SaysNothingWasCut()
    {
        var chart = Chart().CapXAxis(1000).CapYAxis(1000);
        chart.Build();

        Assert.Null(chart.XCutAt);
        Assert.Null(chart.YCutAt);
    }
}

