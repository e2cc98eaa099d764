using SafetyMirror.Reports.Graphics;
using SafetyMirror.Reports.Justification;
using SafetyMirror.Reports.Plans;

namespace SafetyMirror.Reports.Tests.Justification;

// The report's site plans read as a reviewer reads them, checked in the drawing model (boxes and shapes in mm), not in pixels.
public sealed class SitePlanFigureTests
{
    // The plan area of an A4 portrait page: 170 mm of content width, 125/170 of it in height.
    private const double WidthMm = 170;
    private const double HeightMm = 125;
    private static readonly DisplayUnits Metric = new(UnitSystem.Metric);

    public static TheoryData<string> Corners() => ["demo", "misaimed", "two mirrors", "55 km/h", "turned 35°", "stop line"];

    private static ReportCase Corner(string name) => name switch
    {
        "demo" => SitePlanCorners.Demo(),
        "misaimed" => SitePlanCorners.Evaluated(InventedCorner.Plan(), SitePlanCorners.MisaimedMirror),
        "two mirrors" => ReportCase.Of(InventedCorner.Plan(eastHouse: true), Core.Design.Recommendation.MirrorRecommender.Recommend(InventedCorner.Plan(eastHouse: true), new()).Recommendation!, new()),
        "55 km/h" => SitePlanCorners.Evaluated(SitePlanCorners.Faster(55), InventedCorner.Mirror),
        "turned 35°" => SitePlanCorners.Turned(35),
        _ => SitePlanCorners.Evaluated(SitePlanCorners.WithStopLine(), InventedCorner.Mirror),
    };

    private static IEnumerable<PlanDrawing> Plans(ReportCase report)
    {
        var whole = SitePlanFigure.Whole(report, Metric, WidthMm, HeightMm);
        yield return whole;
        if (SitePlanFigure.Detail(report, Metric, whole, WidthMm, HeightMm) is { } detail)
        {
            yield return detail;
        }
    }

    [Theory]
    [MemberData(nameof(Corners))]
    public void Whole_Corner_NoTwoLabelBoxesOverlap(string corner)
    {
        foreach (var plan in Plans(Corner(corner)))
        {
            var boxes = plan.LabelBoxes;
            var clashes = boxes.SelectMany((a, i) => boxes.Skip(i + 1).Where(a.Overlaps).Select(b => $"{a.What} / {b.What}")).ToList();
            Assert.True(clashes.Count == 0, string.Join("; ", clashes));
        }
    }

    [Theory]
    [MemberData(nameof(Corners))]
    public void Whole_Corner_NoLabelBoxOverlapsASymbol(string corner)
    {
        foreach (var plan in Plans(Corner(corner)))
        {
            var clashes = plan.LabelBoxes.SelectMany(l => plan.SymbolBoxes.Where(l.Overlaps).Select(s => $"{l.What} / {s.What}")).ToList();
            Assert.True(clashes.Count == 0, string.Join("; ", clashes));
        }
    }

    [Fact]
    public void Whole_DemoInFeet_NoLabelBoxOverlapsAnotherOrASymbol()
    {
        var plan = SitePlanFigure.Whole(SitePlanCorners.Demo(), new DisplayUnits(UnitSystem.Imperial), WidthMm, HeightMm);

        var boxes = plan.LabelBoxes;
        Assert.Empty(boxes.SelectMany((a, i) => boxes.Skip(i + 1).Where(a.Overlaps)));
        Assert.DoesNotContain(boxes, l => plan.SymbolBoxes.Any(l.Overlaps));
        Assert.Contains(boxes, b => b.What.EndsWith(" ft", StringComparison.Ordinal));
    }

    [Fact]
    public void Whole_Demo_PlacesTheRequiredDistancesAndTheLetters()
    {
        var placed = SitePlanFigure.Whole(SitePlanCorners.Demo(), Metric, WidthMm, HeightMm).LabelBoxes.Select(b => b.What).ToList();

        Assert.Equal(2, placed.Count(w => w == "Required 35 m"));
        Assert.Contains("A", placed);
        Assert.Contains("B", placed);
    }

    [Fact]
    public void Whole_Demo_DrawsAt1To500()
    {
        // The street runs across the page already; out to 35 m required (30 km/h, SitePlanCorners) and a little beyond
        // each way the plan spans 78 m, 156 mm at 1:500 within the 158 mm the A4 map has: the plan was 1:1000 before.
        Assert.Equal(500, SitePlanFigure.Whole(SitePlanCorners.Demo(), Metric, WidthMm, HeightMm).ScaleDenominator);
    }

    [Fact]
    public void Whole_StreetAt35Degrees_TurnsTheMainRoadAcrossThePage()
    {
        var plan = SitePlanFigure.Whole(SitePlanCorners.Turned(35), Metric, WidthMm, HeightMm);

        var lanes = plan.Drawing.Shapes.OfType<Polyline>().Where(l => l.Style == PlanLayers.Approach.Style).ToList();
        Assert.NotEmpty(lanes);
        Assert.All(lanes, lane =>
        {
            var (a, b) = (lane.Points[0], lane.Points[^1]);
            var slopeDeg = Math.Atan2(Math.Abs(b.Y - a.Y), Math.Abs(b.X - a.X)) * 180 / Math.PI;
            Assert.True(slopeDeg < 2, $"a lane runs {slopeDeg:0.0}° off across the page");
        });
    }

    [Fact]
    public void Whole_StreetAt35Degrees_TakesTheScaleOfTheStreetDrawnAcross()
    {
        // Turned back across the page, the turned corner is the demo corner again, so it fits the same round scale.
        Assert.Equal(
            SitePlanFigure.Whole(SitePlanCorners.Demo(), Metric, WidthMm, HeightMm).ScaleDenominator,
            SitePlanFigure.Whole(SitePlanCorners.Turned(35), Metric, WidthMm, HeightMm).ScaleDenominator);
    }

    [Fact]
    public void Whole_StreetAt35Degrees_NorthArrowPointsToPlanNorth()
    {
        var plan = SitePlanFigure.Whole(SitePlanCorners.Turned(35), Metric, WidthMm, HeightMm);

        // Eastbound lane A, drawn outward from its conflict point, heads west in the corner as drawn, and the corner is
        // turned 35° counter-clockwise: outward lies at 215° counter-clockwise from east, plan north at 90°, 125° apart.
        var lane = plan.Drawing.Shapes.OfType<Polyline>().First(l => l.Style == PlanLayers.Approach.Style);
        var box = plan.SymbolBoxes.Single(b => b.What == "north arrow");
        var half = plan.Drawing.Shapes.OfType<Polygon>().Single(p => p.Shell.Count == 3 && p.Style.Fill == Colour.Black && p.Shell.All(q => Inside(box, q)));
        var (tip, notch) = (half.Shell[0], half.Shell[2]);
        var between = Angle(tip.X - notch.X, tip.Y - notch.Y) - Angle(lane.Points[^1].X - lane.Points[0].X, lane.Points[^1].Y - lane.Points[0].Y);
        Assert.Equal(-125, Normalised(between), 1);
    }

    [Fact]
    public void Caption_TurnedPlan_SaysItIsTurnedAndNotNorthUp()
    {
        var report = SitePlanCorners.Turned(35);
        var caption = SitePlanFigure.Caption(SitePlanFigure.Whole(report, Metric, WidthMm, HeightMm), report, "Plan");

        Assert.Contains("rotated so the main road runs across the page; the north arrow shows plan north", caption, StringComparison.Ordinal);
        Assert.DoesNotContain("north up", caption, StringComparison.Ordinal);
    }

    [Fact]
    public void Caption_StreetAlreadyAcross_KeepsPlanNorthUp()
    {
        var report = SitePlanCorners.Demo();
        var plan = SitePlanFigure.Whole(report, Metric, WidthMm, HeightMm);

        Assert.Equal(0, plan.RotationDeg);
        Assert.Contains("plan north up", SitePlanFigure.Caption(plan, report, "Plan"), StringComparison.Ordinal);
    }

    [Fact]
    public void Whole_MisaimedMirror_DrawsTheThreeStretchesInStylesApartInGreyscale()
    {
        var plan = SitePlanFigure.Whole(Corner("misaimed"), Metric, WidthMm, HeightMm);

        PlanLayer[] stretches = [PlanLayers.SeenDirectly, PlanLayers.ShownInMirror, PlanLayers.SeenNeitherWay];
        var lines = plan.Drawing.Shapes.OfType<Polyline>().ToList();
        var texts = plan.Drawing.Shapes.OfType<Text>().Select(t => t.Value).ToList();
        Assert.All(stretches, layer => Assert.Contains(lines, l => l.Style == layer.Style));
        Assert.All(stretches, layer => Assert.Single(texts, t => t == layer.Label));
        // Apart by width and by dash pattern, so they stay apart without colour (common practice in drafting).
        Assert.Equal(3, stretches.Select(l => l.Style.StrokeWidthMm).Distinct().Count());
        Assert.Equal(3, stretches.Select(l => string.Join(",", l.Style.DashMm)).Distinct().Count());
    }

    [Fact]
    public void Whole_Demo_DrawsATravelArrowOnEachApproach()
    {
        var plan = SitePlanFigure.Whole(SitePlanCorners.Demo(), Metric, WidthMm, HeightMm);

        var legend = plan.SymbolBoxes.Single(b => b.What == "legend");
        Assert.Equal(2, plan.Drawing.Shapes.OfType<Polyline>().Count(l => l.Style == PlanLayers.TravelDirection.Style && !Inside(legend, l.Points[0])));
    }

    [Fact]
    public void Whole_Demo_NamesTheStreetFromThePlan()
    {
        var plan = SitePlanFigure.Whole(SitePlanCorners.Demo(), Metric, WidthMm, HeightMm);

        Assert.Contains(plan.LabelBoxes, b => b.What == "Tanner Row");
    }

    [Fact]
    public void Whole_PlanWithStopLine_DrawsItWithItsLegendEntry()
    {
        var plan = SitePlanFigure.Whole(Corner("stop line"), Metric, WidthMm, HeightMm);

        Assert.Contains(plan.Drawing.Shapes.OfType<Polyline>(), l => l.Style == PlanLayers.StopLine.Style);
        Assert.Contains(plan.Drawing.Shapes.OfType<Text>(), t => t.Value == PlanLayers.StopLine.Label);
    }

    [Fact]
    public void Whole_PlanWithoutStopLine_HasNoStopLineEntry()
    {
        var plan = SitePlanFigure.Whole(SitePlanCorners.Demo(), Metric, WidthMm, HeightMm);

        Assert.DoesNotContain(plan.Drawing.Shapes.OfType<Text>(), t => t.Value == PlanLayers.StopLine.Label);
    }

    private static bool Inside(PlanBox box, PointMm p) => p.X >= box.Left && p.X <= box.Right && p.Y >= box.Top && p.Y <= box.Bottom;

    /// <summary>Counter-clockwise from the page's right, in degrees (y grows downwards on paper).</summary>
    private static double Angle(double dx, double dy) => Math.Atan2(-dy, dx) * 180 / Math.PI;

    private static double Normalised(double degrees) => ((degrees % 360) + 540) % 360 - 180;
}
