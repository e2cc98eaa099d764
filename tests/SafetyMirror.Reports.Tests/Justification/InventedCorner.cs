using NetTopologySuite.Geometries;
using SafetyMirror.Core.Design.Evaluation;
using SafetyMirror.Core.Design.Recommendation;
using SafetyMirror.Core.Optics;
using SafetyMirror.Core.Site;
using SafetyMirror.Reports.Justification;

namespace SafetyMirror.Reports.Tests.Justification;

/// <summary>An invented corner: a mews exit onto a 30 km/h street, a corner house hiding the traffic from the west, a low hedge to the east.</summary>
/// <remarks>Local metres, x east, y north; the street runs along y = 0 to 6 with a footway to y = 9. No real place.</remarks>
internal static class InventedCorner
{
    private static readonly GeometryFactory Factory = new();

    /// <summary>The header every sample report carries.</summary>
    public static ReportHeader Header(string title = "Invented Sorrel Mews exit: sight distance justification") =>
        new(title, "Sorrel Mews exit onto Tanner Row (invented)", "INV-2025-007", "Sorrel Mews residents (invented)", "R. Example (invented)", new DateOnly(2025, 3, 14));

    /// <summary>The corner; without the house both directions are open, and with a second house to the east instead of the hedge both are hidden.</summary>
    public static SitePlan Plan(bool withHouse = true, bool eastHouse = false) => new(
        PlanFrame.LocalMetres,
        eyes: [new Eye(new Vec3(0, -3, 1.08), new FeatureReference(0, "driver", "Driver waiting at the Sorrel Mews exit"))],
        approaches:
        [
            new Approach(Line((-120, 1.5), (-40, 1.5), (0, 1.5)), 30, 0, new FeatureReference(1, "eastbound", "Tanner Row eastbound")),
            new Approach(Line((120, 4.5), (0, 4.5)), 30, 0, new FeatureReference(2, "westbound", "Tanner Row westbound")),
        ],
        obstacles:
        [
            .. withHouse ? [new Obstacle(Box(-30, -20, -2, -1), 6, new FeatureReference(3, "house", "No. 2 Tanner Row (corner house)"))] : Array.Empty<Obstacle>(),
            eastHouse
                ? new Obstacle(Box(2, -20, 30, -1), 6, new FeatureReference(4, "east-house", "No. 1 Tanner Row"))
                : new Obstacle(Box(2, -12, 2.8, -1), 0.8, new FeatureReference(4, "hedge", "Low hedge of No. 1")),
        ],
        mountingZones: [new MountingZone(Line((-8, 7.5), (8, 7.5)), new FeatureReference(7, "verge", "Footway edge opposite the exit"))],
        carriageways: [new Carriageway(Box(-120, 0, 120, 6), new FeatureReference(5, "carriageway", "Tanner Row"))],
        footways: [new Footway(Box(-120, 6, 120, 9), SiteRanges.DefaultKerbHeightM, new FeatureReference(6, "footway", "North footway"))]);

    /// <summary>A 600 mm round mirror of radius 2.2 m across the street, aimed south-west and tilted down.</summary>
    public static MirrorPlacement Mirror { get; } = new(6, 7.5, 2.95, 231, 5, 3.0, new RoundAperture(0.8));

    /// <summary>That mirror evaluated on the corner with the default options.</summary>
    public static MirrorEvaluation Evaluation { get; } = MirrorEvaluator.Evaluate(Plan(), Mirror, new EvaluationOptions()).Evaluation!;

    /// <summary>The recommendation for the corner with the default options.</summary>
    public static Recommendation Recommendation { get; } = MirrorRecommender.Recommend(Plan(), new RecommendationOptions()).Recommendation!;

    private static LineString Line(params (double X, double Y)[] points) =>
        Factory.CreateLineString(points.Select(p => new Coordinate(p.X, p.Y)).ToArray());

    private static Polygon Box(double x0, double y0, double x1, double y1) =>
        Factory.CreatePolygon([new(x0, y0), new(x1, y0), new(x1, y1), new(x0, y1), new(x0, y0)]);
}
