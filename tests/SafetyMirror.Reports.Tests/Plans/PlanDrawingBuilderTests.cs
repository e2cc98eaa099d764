using System.Xml.Linq;
using SafetyMirror.Reports.Graphics;
using SafetyMirror.Reports.Plans;

namespace SafetyMirror.Reports.Tests.Plans;

public sealed class PlanDrawingBuilderTests
{
    // Invented corner: a 40 m x 10 m road. On a 200 x 120 mm plan the legend panel takes 40 to 80 mm, so the map
    // has 108 to 148 mm of width inside its padding: 1:250 would need 160 mm, 1:500 needs 80 mm.
    private static readonly NetTopologySuite.Geometries.Polygon Road = Samples.Box(-20, 0, 20, 10);
    private static readonly NetTopologySuite.Geometries.LineString Approach = Samples.Line((0, 5), (-20, 5));

    private static PlanDrawingBuilder Corner() => new PlanDrawingBuilder(200, 120).Add(Road, PlanLayers.Carriageway);

    private static List<string> Texts(Drawing drawing) => drawing.Shapes.OfType<Text>().Select(t => t.Value).ToList();

    [Fact]
    public void Build_ExtentOf40By10m_DrawsAt1To500()
    {
        Assert.Equal(500, Corner().Build().ScaleDenominator);
    }

    [Fact]
    public void Build_Geometry_IsDrawnAtTheStatedScale()
    {
        var plan = Corner().Build();

        var road = plan.Drawing.Shapes.OfType<Polygon>().First();
        // 40 m at 1:500 is 80 mm on paper.
        Assert.Equal(80, road.Shell.Max(p => p.X) - road.Shell.Min(p => p.X), 9);
    }

    [Fact]
    public void Build_NorthOfLocalFrame_IsUpOnThePaper()
    {
        var plan = new PlanDrawingBuilder(200, 120).Add(Samples.Line((0, 0), (0, 10)), PlanLayers.Sightline).Build();

        var line = plan.Drawing.Shapes.OfType<Polyline>().First();
        Assert.True(line.Points[1].Y < line.Points[0].Y, "y = 10 m (north) must be higher on the page than y = 0");
    }

    [Fact]
    public void Build_ScaleBar_IsARoundLengthLabelledWithTheRatio()
    {
        var plan = Corner().Build();

        var texts = Texts(plan.Drawing);
        Assert.Contains("Scale 1:500", texts);
        Assert.Contains($"{plan.ScaleBarLengthM} m", texts);
        Assert.Contains(plan.ScaleBarLengthM, new[] { 5.0, 10, 20, 50 });
    }

    [Fact]
    public void Build_NorthArrow_IsLabelledN()
    {
        Assert.Contains("N", Texts(Corner().Build().Drawing));
    }

    [Fact]
    public void Build_Legend_ListsEachLayerUsedOnceAndNoOther()
    {
        var plan = Corner()
            .Add(Samples.Box(-20, 10, 20, 12), PlanLayers.Carriageway)
            .Add(Samples.Box(-20, -2, 20, 0), PlanLayers.Footway)
            .Add(Samples.Point(0, -4), PlanLayers.EyePoint)
            .Build();

        var texts = Texts(plan.Drawing);
        Assert.Single(texts, t => t == PlanLayers.Carriageway.Label);
        Assert.Single(texts, t => t == PlanLayers.Footway.Label);
        Assert.Single(texts, t => t == PlanLayers.EyePoint.Label);
        Assert.DoesNotContain(PlanLayers.Obstacle.Label, texts);
    }

    [Fact]
    public void Build_PolygonWithHole_KeepsTheHole()
    {
        var plan = new PlanDrawingBuilder(200, 120).Add(Samples.BoxWithHole(), PlanLayers.Obstacle).Build();

        Assert.Single(plan.Drawing.Shapes.OfType<Polygon>().First().Holes);
    }

    [Fact]
    public void Build_Point_IsDrawnAsTheLayerMarker()
    {
        var plan = new PlanDrawingBuilder(200, 120).Add(Samples.Point(3, 4), PlanLayers.EyePoint).Build();

        var marker = plan.Drawing.Shapes.OfType<Circle>().First();
        Assert.Equal(PlanLayers.EyePoint.MarkerSizeMm / 2, marker.RadiusMm, 9);
    }

    [Fact]
    public void AddStationTicks_Every5m_LabelsEachTickWhenTheyAre10mmApart()
    {
        // 5 m at 1:500 is 10 mm, more than the 7 mm labels need.
        var plan = Corner().AddStationTicks(Approach, 5, PlanLayers.StationTicks).Build();

        var texts = Texts(plan.Drawing);
        Assert.All(new[] { "0", "5", "10", "15", "20" }, label => Assert.Contains(label, texts));
    }

    [Fact]
    public void AddStationTicks_Every2m_LabelsEveryOtherTick()
    {
        // 2 m at 1:500 is 4 mm, too close for labels, so every second tick (8 mm apart) is labelled.
        var plan = Corner().AddStationTicks(Approach, 2, PlanLayers.StationTicks).Build();

        var texts = Texts(plan.Drawing);
        Assert.Contains("4", texts);
        Assert.DoesNotContain("2", texts);
        Assert.DoesNotContain("6", texts);
    }

    [Fact]
    public void AddStationTicks_Ticks_AreOneIntervalApartAtScale()
    {
        var plan = Corner().AddStationTicks(Approach, 5, PlanLayers.StationTicks).Build();

        var road = plan.Drawing.Shapes.OfType<Polygon>().First();
        // Vertical strokes of the tick style over the road: the map's ticks, not the legend's sample.
        var ticks = plan.Drawing.Shapes.OfType<Polyline>()
            .Where(l => l.Style == PlanLayers.StationTicks.Style && Math.Abs(l.Points[0].X - l.Points[1].X) < 1e-9)
            .Select(l => l.Points[0].X)
            .Where(x => x >= road.Shell.Min(p => p.X) && x <= road.Shell.Max(p => p.X))
            .Distinct()
            .Order()
            .ToList();
        // Stations 0 to 20 m every 5 m: five ticks, each 5 m x 1000 / 500 = 10 mm from the next.
        Assert.Equal(5, ticks.Count);
        Assert.All(ticks.Zip(ticks.Skip(1)), pair => Assert.Equal(10, pair.Second - pair.First, 9));
    }

    [Fact]
    public void AddStationMarker_Symbol_SitsAtTheStation()
    {
        var plan = Corner()
            .AddStationTicks(Approach, 20, PlanLayers.StationTicks)
            .AddStationMarker(Approach, 12, "Required 12 m", PlanLayers.StationMarker)
            .Build();

        var start = plan.Drawing.Shapes.OfType<Polyline>().First(l => l.Style == PlanLayers.StationTicks.Style).Points[0].X;
        var marker = plan.Drawing.Shapes.OfType<Polygon>().First(p => p.Style == PlanLayers.StationMarker.Style);
        // The approach runs west, so 12 m along it is 24 mm left of station 0 at 1:500.
        Assert.Equal(start - 24, marker.Shell.Average(p => p.X), 6);
        Assert.Contains("Required 12 m", Texts(plan.Drawing));
    }

    [Fact]
    public void AddStationMarker_BeyondTheLine_IsRefused()
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => Corner().AddStationMarker(Approach, 25, "Too far", PlanLayers.StationMarker));
    }

    [Fact]
    public void Build_NothingAdded_IsRefused()
    {
        Assert.Throws<InvalidOperationException>(() => new PlanDrawingBuilder(200, 120).Build());
    }

    [Fact]
    public void Build_Labels_EscapeIntoWellFormedSvg()
    {
        var layer = new PlanLayer("Hedge <b>& \"wall\"</b>", PlanLayers.Obstacle.Style);

        var svg = SvgWriter.ToSvg(new PlanDrawingBuilder(200, 120).Add(Road, layer).Build().Drawing);

        var texts = XElement.Parse(svg).Descendants().Where(e => e.Name.LocalName == "text").Select(e => e.Value);
        Assert.Contains("Hedge <b>& \"wall\"</b>", texts);
    }

    [Fact]
    public void Unit_Foot_LabelsTicksAndTheScaleBarInFeet()
    {
        // 1 ft = 0.3048 m exactly (international yard and pound, 1959): ticks every 15.24 m are 50 ft apart.
        var plan = new PlanDrawingBuilder(200, 120) { Unit = LengthUnit.Foot }
            .Add(Road, PlanLayers.Carriageway)
            .AddStationTicks(Samples.Line((0, 5), (-20, 5)), 15.24, PlanLayers.StationTicks)
            .Build();

        var texts = Texts(plan.Drawing);
        Assert.Contains("50", texts);
        Assert.Single(texts, t => t.EndsWith(" ft", StringComparison.Ordinal));
        Assert.DoesNotContain(texts, t => t.EndsWith(" m", StringComparison.Ordinal));
    }

    [Fact]
    public void AddStationTicks_RightSide_PutsTheLabelsAcrossTheLine()
    {
        // The approach runs west along y = 5 m: facing west, the left hand points south (down on the paper), the right north.
        var left = Corner().AddStationTicks(Approach, 5, PlanLayers.StationTicks).Build();
        var right = Corner().AddStationTicks(Approach, 5, PlanLayers.StationTicks, LabelSide.Right).Build();

        static double LabelY(PlanDrawing plan) => plan.Drawing.Shapes.OfType<Text>().First(t => t.Value == "10").At.Y;
        var lineY = left.Drawing.Shapes.OfType<Polyline>().First(l => l.Style == PlanLayers.StationTicks.Style).Points.Average(p => p.Y);
        Assert.True(LabelY(left) > lineY, "left of a westward line is south, down on the paper");
        Assert.True(LabelY(right) < lineY, "right of a westward line is north, up on the paper");
    }

    [Fact]
    public void AddLabel_Text_IsCentredOnThePointOverAWhiteBackdrop()
    {
        var plan = Corner().AddLabel(new NetTopologySuite.Geometries.Coordinate(0, 5), "h 2.0 m").Build();

        var shapes = plan.Drawing.Shapes.ToList();
        var label = shapes.OfType<Text>().Single(t => t.Value == "h 2.0 m");
        var road = shapes.OfType<Polygon>().First();
        Assert.Equal(TextAnchor.Middle, label.Anchor);
        // (0, 5) is the road's centre, the centre of the map.
        Assert.Equal((road.Shell.Min(p => p.X) + road.Shell.Max(p => p.X)) / 2, label.At.X, 6);
        Assert.Equal(Colour.White, ((Polygon)shapes[shapes.IndexOf(label) - 1]).Style.Fill);
        Assert.DoesNotContain("Label", Texts(plan.Drawing));
    }

    [Fact]
    public void AddArrow_East_PointsRightForItsLengthOnPaperWithALegendEntry()
    {
        var plan = Corner().AddArrow(new NetTopologySuite.Geometries.Coordinate(0, 5), 90, 10, PlanLayers.MirrorAim).Build();

        var shaft = plan.Drawing.Shapes.OfType<Polyline>().First(l => l.Style == PlanLayers.MirrorAim.Style);
        var head = plan.Drawing.Shapes.OfType<Polygon>().First(p => p.Style.Fill == PlanLayers.MirrorAim.Style.Stroke && p.Shell.Count == 3);
        // Azimuth 90° is east, to the right; the head's tip ends the 10 mm.
        Assert.Equal(shaft.Points[0].Y, shaft.Points[1].Y, 9);
        Assert.Equal(shaft.Points[0].X + 10, head.Shell[0].X, 9);
        Assert.Contains(PlanLayers.MirrorAim.Label, Texts(plan.Drawing));
    }
}
