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
}
