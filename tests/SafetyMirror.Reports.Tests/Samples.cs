using NetTopologySuite.Geometries;
using SafetyMirror.Reports.Graphics;
using NtsPolygon = NetTopologySuite.Geometries.Polygon;
using Polygon = SafetyMirror.Reports.Graphics.Polygon;

namespace SafetyMirror.Reports.Tests;

/// <summary>Invented sample data for the layout tests: a made-up T-junction and a made-up drawing, no real place.</summary>
internal static class Samples
{
    private static readonly GeometryFactory Factory = new();

    /// <summary>An axis-aligned rectangle in local metres.</summary>
    public static NtsPolygon Box(double x0, double y0, double x1, double y1) =>
        Factory.CreatePolygon([new(x0, y0), new(x1, y0), new(x1, y1), new(x0, y1), new(x0, y0)]);

    /// <summary>A line through the given local-metre points.</summary>
    public static LineString Line(params (double X, double Y)[] points) =>
        Factory.CreateLineString(points.Select(p => new Coordinate(p.X, p.Y)).ToArray());

    /// <summary>A point in local metres.</summary>
    public static Point Point(double x, double y) => Factory.CreatePoint(new Coordinate(x, y));

    /// <summary>A polygon with one square hole.</summary>
    public static NtsPolygon BoxWithHole() => Factory.CreatePolygon(
        Factory.CreateLinearRing([new(0, 0), new(10, 0), new(10, 10), new(0, 10), new(0, 0)]),
        [Factory.CreateLinearRing([new(4, 4), new(6, 4), new(6, 6), new(4, 6), new(4, 4)])]);

    /// <summary>One shape of each kind on a 100 × 60 mm viewport, with an invented place name.</summary>
    public static Drawing EveryShape(string label = "Invented Quince Corner") => new(100, 60,
    [
        new Polygon([new(5, 5), new(45, 5), new(45, 35), new(5, 35)], new Style { Fill = Colour.LightGrey, Hatch = new Hatch(HatchKind.Cross, Colour.Black) },
            [[new(20, 15), new(30, 15), new(30, 25), new(20, 25)]]),
        new Polyline([new(50, 10), new(95, 50)], Style.Line(Colour.Red, 0.3, Dashes.Dashed)),
        new Circle(new(70, 20), 4, new Style { Fill = Colour.White }),
        new Text(new(50, 55), label, 3.5) { Weight = FontWeight.Bold },
    ])
    { Title = "Sample drawing" };
}
