using System.Globalization;
using System.Xml.Linq;
using SafetyMirror.Reports.Documents;
using SafetyMirror.Reports.Justification;

namespace SafetyMirror.Reports.Tests.Justification;

public sealed class ApproachChartsTests
{
    private static readonly XNamespace Svg = "http://www.w3.org/2000/svg";

    /// <summary>The charts of the report's HTML (figures after the "Apparent size and apparent distance" heading), as parsed SVG.</summary>
    private static List<XElement> Charts()
    {
        var html = JustificationReport.ForEvaluation(InventedCorner.Plan(), InventedCorner.Evaluation, InventedCorner.Header()).ToHtml(PaperSize.A4);
        var section = html[html.IndexOf("Apparent size and apparent distance", StringComparison.Ordinal)..];
        var charts = new List<XElement>();
        for (var at = section.IndexOf("<svg ", StringComparison.Ordinal); at >= 0; at = section.IndexOf("<svg ", at + 1, StringComparison.Ordinal))
        {
            charts.Add(XElement.Parse(section[at..(section.IndexOf("</svg>", at, StringComparison.Ordinal) + 6)]));
        }

        return charts;
    }

    /// <summary>The x axis's tick labels: centred numbers, each with where it stands on paper.</summary>
    private static List<(string Value, double XMm)> XTicks(XElement chart) =>
    [
        .. chart.Descendants(Svg + "text")
            .Where(t => (string?)t.Attribute("text-anchor") == "middle" && t.Attribute("transform") is null && double.TryParse(t.Value, NumberStyles.Float, CultureInfo.InvariantCulture, out _))
            .Select(t => (t.Value, double.Parse((string)t.Attribute("x")!, CultureInfo.InvariantCulture))),
    ];

    [Fact]
    public void ApproachCharts_OfOneApproach_ShareTheirXAxisOnPaper()
    {
        var charts = Charts();

        // The invented corner's eastbound lane is charted twice: apparent size, then how far away the car looks.
        Assert.True(charts.Count >= 2);
        var (size, distance) = (XTicks(charts[0]), XTicks(charts[1]));
        Assert.NotEmpty(size);
        Assert.Equal(size, distance);
    }

    [Fact]
    public void ApproachCharts_BothCharts_AreAgainstTheDistanceFromTheConflictPoint()
    {
        var charts = Charts();

        Assert.All(charts.Take(2), chart => Assert.Contains(chart.Descendants(Svg + "text"), t => t.Value == "Distance from the conflict point (m)"));
    }
}
