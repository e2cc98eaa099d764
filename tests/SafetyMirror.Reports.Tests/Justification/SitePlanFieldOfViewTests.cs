using System.Globalization;
using System.Text.RegularExpressions;
using NetTopologySuite.Geometries;
using NetTopologySuite.Geometries.Utilities;
using SafetyMirror.Core.Design.Evaluation;
using SafetyMirror.Reports.Documents;
using SafetyMirror.Reports.Graphics;
using SafetyMirror.Reports.Justification;
using SafetyMirror.Reports.Plans;
using DrawnPolygon = SafetyMirror.Reports.Graphics.Polygon;

namespace SafetyMirror.Reports.Tests.Justification;

/// <summary>The field of view on the report's plans: the road seen in the mirror, not the trace that runs behind the house.</summary>
public class SitePlanFieldOfViewTests
{
    private static readonly GeometryFactory Factory = new();

    [Fact]
    public void Plans_CornerWithHouse_DrawTheFieldOfViewClearOfTheHouse()
    {
        // Both in paper millimetres on the same plan: the drawn field of view and the drawn house may only touch.
        Assert.All(PlansOf(InventedCorner.Evaluation), plan =>
        {
            var field = Drawn(plan.Drawing, PlanLayers.FieldOfView);
            Assert.False(field.IsEmpty);
            Assert.True(field.Intersection(Drawn(plan.Drawing, PlanLayers.Obstacle)).Area < 1e-6);
        });
    }

    [Fact]
    public void Plans_CornerWithHouse_DrawTheVisibleFieldOfViewAndNotTheHiddenTrace()
    {
        var facts = InventedCorner.Evaluation.Mirror;
        var hidden = facts.FieldOfView.Outline!.Difference(facts.VisibleFieldOfView.Outline!);

        var plans = PlansOf(InventedCorner.Evaluation);

        // Geometric construction: on the whole plan the trace runs over the drawn house; on every plan what the house hides of
        // the trace is not drawn, and all that is drawn is seen.
        Assert.Contains(plans, plan => ToPaper(plan).Transform(hidden).Intersection(Drawn(plan.Drawing, PlanLayers.Obstacle)).Area > 1);
        Assert.All(plans, plan =>
        {
            var field = Drawn(plan.Drawing, PlanLayers.FieldOfView);
            var toPaper = ToPaper(plan);
            Assert.True(field.Intersection(toPaper.Transform(hidden)).Area < 1e-3, "hidden road drawn");
            Assert.True(field.Difference(toPaper.Transform(facts.VisibleFieldOfView.Outline!)).Area < 1e-3, "more than the visible drawn");
        });
    }

    /// <summary>Site metres to the plan's paper millimetres: true scale, north up, the easternmost obstacle side (the hedge's,
    /// x = 2.8 m) and the street's south edge (y = 0) where the plan draws them.</summary>
    private static AffineTransformation ToPaper((Drawing Drawing, int ScaleDenominator) plan)
    {
        var mmPerM = 1000.0 / plan.ScaleDenominator;
        var road = Drawn(plan.Drawing, PlanLayers.Carriageway).EnvelopeInternal;
        var obstacles = Drawn(plan.Drawing, PlanLayers.Obstacle).EnvelopeInternal;
        Assert.Equal(6 * mmPerM, road.Height, 1e-6); // the street is 6 m wide (InventedCorner)
        return new AffineTransformation(mmPerM, 0, obstacles.MaxX - (2.8 * mmPerM), 0, -mmPerM, road.MaxY);
    }

    /// <summary>The report's plans (the figures that draw the carriageway) with the scale their captions state.</summary>
    private static List<(Drawing Drawing, int ScaleDenominator)> PlansOf(MirrorEvaluation evaluation)
    {
        var figures = new FigureCollector();
        JustificationReport.ForEvaluation(InventedCorner.Plan(), evaluation, InventedCorner.Header()).WriteTo(figures, new ReportLayout(PaperSize.A4));
        var plans = figures.Figures
            .Where(f => f.Drawing.Shapes.OfType<DrawnPolygon>().Any(p => p.Style == PlanLayers.Carriageway.Style))
            .Select(f => (f.Drawing, int.Parse(Regex.Match(f.Caption, @"at 1:(\d+)").Groups[1].Value, CultureInfo.InvariantCulture)))
            .ToList();
        Assert.NotEmpty(plans);
        return plans;
    }

    /// <summary>What the plan draws in a layer's style, in paper millimetres; the legend's sample of the style (drawn after
    /// its heading) left out.</summary>
    private static Geometry Drawn(Drawing plan, PlanLayer layer) =>
        Factory.BuildGeometry(plan.Shapes
            .TakeWhile(shape => shape is not Text { Value: "Legend" })
            .OfType<DrawnPolygon>()
            .Where(p => p.Style == layer.Style)
            .Select(Area)
            .ToList()).Union();

    private static NetTopologySuite.Geometries.Polygon Area(DrawnPolygon drawn) =>
        Factory.CreatePolygon(Ring(drawn.Shell), [.. drawn.Holes.Select(Ring)]);

    private static LinearRing Ring(IReadOnlyList<PointMm> points) =>
        Factory.CreateLinearRing([.. points.Select(p => new Coordinate(p.X, p.Y)), new Coordinate(points[0].X, points[0].Y)]);

    /// <summary>Keeps the figures a report writes and drops the rest.</summary>
    private sealed class FigureCollector : IReportWriter
    {
        public List<(Drawing Drawing, string Caption)> Figures { get; } = [];

        public void Heading(string text, int level)
        {
        }

        public void Section(string heading, PageOrientation orientation)
        {
        }

        public void Paragraph(string text)
        {
        }

        public void BulletList(IReadOnlyList<string> items)
        {
        }

        public void Picture(byte[] png, double widthMm, double heightMm, string altText, string caption)
        {
        }

        public void PictureRow(IReadOnlyList<(byte[] Png, string AltText)> pictures, double widthMm, double heightMm, string caption)
        {
        }

        public void Table(ReportTable table)
        {
        }

        public void Figure(Drawing drawing, string caption) => Figures.Add((drawing, caption));
    }
}
