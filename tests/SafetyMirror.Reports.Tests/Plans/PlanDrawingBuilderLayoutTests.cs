using Coordinate = NetTopologySuite.Geometries.Coordinate;
using LineString = NetTopologySuite.Geometries.LineString;
using SafetyMirror.Reports.Graphics;
using SafetyMirror.Reports.Plans;

namespace SafetyMirror.Reports.Tests.Plans;

// Turning, fitting and labelling a plan, checked in the drawing model. Invented geometry, no real place.
public sealed class PlanDrawingBuilderLayoutTests
{
    // A 78 m line at 35° to the east: turned back across a 170 mm wide plan whose fitted map keeps 4 mm each side, it is
    // 156 mm long at 1:500 (162 mm free) and would be 312 mm at 1:250; left as it is, its 63.9 m × 44.7 m box is what must fit.
    private static readonly LineString Street = Samples.Line((0, 0), (78 * Math.Cos(35 * Math.PI / 180), 78 * Math.Sin(35 * Math.PI / 180)));

    [Fact]
    public void Build_TurnedSoTheLineRunsAcross_TakesTheLargestRoundScaleThatFits()
    {
        var plan = new PlanDrawingBuilder(170, 125) { RotationDeg = -35, FitToContent = true }.Add(Street, PlanLayers.Approach).Build();

        Assert.Equal(500, plan.ScaleDenominator);
        var line = plan.Drawing.Shapes.OfType<Polyline>().First(l => l.Style == PlanLayers.Approach.Style);
        // 78 m at 1:500 is 156 mm on paper, and the line runs level.
        Assert.Equal(156, line.Points[1].X - line.Points[0].X, 6);
        Assert.Equal(line.Points[0].Y, line.Points[1].Y, 6);
    }

    [Fact]
    public void Build_FitToContent_TrimsTheDrawingToTheMapAndLegend()
    {
        var plan = new PlanDrawingBuilder(170, 125) { RotationDeg = -35, FitToContent = true }.Add(Street, PlanLayers.Approach).Build();

        Assert.True(plan.Drawing.HeightMm < 125, $"the drawing is {plan.Drawing.HeightMm} mm tall");
        Assert.Equal(170, plan.Drawing.WidthMm);
    }

    [Fact]
    public void Build_WithoutFitToContent_KeepsTheSizeGiven()
    {
        var plan = new PlanDrawingBuilder(170, 125).Add(Street, PlanLayers.Approach).Build();

        Assert.Equal(125, plan.Drawing.HeightMm);
        Assert.Equal(0, plan.RotationDeg);
    }

    [Fact]
    public void AddStationMarker_TwoMarkersAtOnePlace_PlacesTheSecondLabelClearOfTheFirst()
    {
        var plan = new PlanDrawingBuilder(200, 120)
            .Add(Samples.Box(-20, 0, 20, 10), PlanLayers.Carriageway)
            .AddStationMarker(Samples.Line((0, 5), (-20, 5)), 10, "Required 10 m", PlanLayers.StationMarker)
            .AddStationMarker(Samples.Line((0, 5), (-20, 5)), 10, "Shown to 10 m", PlanLayers.StationMarker)
            .Build();

        Assert.Equal(2, plan.LabelBoxes.Count);
        Assert.False(plan.LabelBoxes[0].Overlaps(plan.LabelBoxes[1]));
        Assert.DoesNotContain(plan.LabelBoxes, l => plan.SymbolBoxes.Any(l.Overlaps));
    }

    [Fact]
    public void AddLabel_OnlyPlaceTaken_LeavesTheLabelOut()
    {
        var plan = new PlanDrawingBuilder(200, 120)
            .Add(Samples.Box(-20, 0, 20, 10), PlanLayers.Carriageway)
            .AddLabel([new Coordinate(0, 5)], "first")
            .AddLabel([new Coordinate(0, 5)], "second")
            .Build();

        Assert.Equal(["first"], plan.LabelBoxes.Select(b => b.What));
        Assert.Equal(["second"], plan.LabelsLeftOut);
        Assert.DoesNotContain(plan.Drawing.Shapes.OfType<Text>(), t => t.Value == "second");
    }

    [Fact]
    public void AddTravelArrow_OutwardLine_PointsBackToTheLineStart()
    {
        // The line runs west from its start at x = 0, so traffic travelling to the start goes east: right on the paper.
        var plan = new PlanDrawingBuilder(200, 120)
            .Add(Samples.Box(-20, 0, 20, 10), PlanLayers.Carriageway)
            .AddTravelArrow(Samples.Line((0, 5), (-20, 5)), 10, 8, PlanLayers.TravelDirection, LabelSide.Left)
            .Build();

        var shaft = plan.Drawing.Shapes.OfType<Polyline>().First(l => l.Style == PlanLayers.TravelDirection.Style);
        Assert.True(shaft.Points[1].X > shaft.Points[0].X);
        Assert.Contains(plan.Drawing.Shapes.OfType<Text>(), t => t.Value == PlanLayers.TravelDirection.Label);
    }

    [Fact]
    public void AddStreetName_WideRoad_PutsTheNameInsideTheRoadClearOfItsLines()
    {
        var plan = new PlanDrawingBuilder(200, 120)
            .Add(Samples.Box(-20, 0, 20, 10), PlanLayers.Carriageway)
            .Add(Samples.Line((-20, 2), (20, 2)), PlanLayers.Approach)
            .AddStreetName(Samples.Box(-20, 0, 20, 10), "Invented Lane")
            .Build();

        var road = plan.Drawing.Shapes.OfType<Polygon>().First(p => p.Style == PlanLayers.Carriageway.Style).Shell;
        var name = plan.LabelBoxes.Single(b => b.What == "Invented Lane");
        var lane = plan.Drawing.Shapes.OfType<Polyline>().First(l => l.Style == PlanLayers.Approach.Style).Points[0].Y;
        Assert.True(name.Left >= road.Min(p => p.X) && name.Right <= road.Max(p => p.X) && name.Top >= road.Min(p => p.Y) && name.Bottom <= road.Max(p => p.Y));
        Assert.False(name.Top < lane + 0.5 && name.Bottom > lane - 0.5, "the name covers the lane line");
    }
}
