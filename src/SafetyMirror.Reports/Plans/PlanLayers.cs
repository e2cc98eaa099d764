using SafetyMirror.Reports.Graphics;

namespace SafetyMirror.Reports.Plans;

/// <summary>The house layers of a corner plan, told apart in black-and-white print by fill, hatch, dashes and symbols.</summary>
public static class PlanLayers
{
    /// <summary>The paved roadway: flat light grey.</summary>
    public static PlanLayer Carriageway { get; } = new("Carriageway", new Style
    {
        Stroke = Colour.DarkGrey,
        StrokeWidthMm = 0.25,
        Fill = Colour.LightGrey,
    });

    /// <summary>Footway and verge: near white with a light diagonal hatch.</summary>
    public static PlanLayer Footway { get; } = new("Footway", new Style
    {
        Stroke = Colour.DarkGrey,
        StrokeWidthMm = 0.18,
        Fill = new Colour(245, 245, 245),
        Hatch = new Hatch(HatchKind.Diagonal, Colour.MidGrey, spacingMm: 1.6, lineWidthMm: 0.12),
    });

    /// <summary>What blocks the view (wall, hedge, building): cross-hatched with a heavy outline.</summary>
    public static PlanLayer Obstacle { get; } = new("Obstacle to sight", new Style
    {
        Stroke = Colour.Black,
        StrokeWidthMm = 0.4,
        Fill = new Colour(191, 191, 191),
        Hatch = new Hatch(HatchKind.Cross, Colour.Black, spacingMm: 1.4, lineWidthMm: 0.15),
    });

    /// <summary>The path of approaching traffic: a dash-dot centre line.</summary>
    public static PlanLayer Approach { get; } = new("Approach (lane centre)", Style.Line(Colour.Blue, 0.35, Dashes.DashDot));

    /// <summary>A direct line of sight: medium dashes.</summary>
    public static PlanLayer Sightline { get; } = new("Direct sight line", Style.Line(Colour.Red, 0.3, Dashes.Dashed));

    /// <summary>A line of sight by way of the mirror: dots.</summary>
    public static PlanLayer MirrorSightline { get; } = new("Sight line via mirror", Style.Line(Colour.Green, 0.35, Dashes.Dotted));

    /// <summary>The waiting driver's eye point: an open circle.</summary>
    public static PlanLayer EyePoint { get; } = new("Driver's eye point", new Style { Stroke = Colour.Black, StrokeWidthMm = 0.3, Fill = Colour.White })
    {
        Marker = MarkerKind.Circle,
        MarkerSizeMm = 2.4,
    };

    /// <summary>The mirror's centre: a solid diamond.</summary>
    public static PlanLayer Mirror { get; } = new("Mirror", new Style { Stroke = Colour.Black, StrokeWidthMm = 0.2, Fill = Colour.Black })
    {
        Marker = MarkerKind.Diamond,
        MarkerSizeMm = 3.2,
    };

    /// <summary>Distance ticks along an approach, labelled in metres.</summary>
    public static PlanLayer StationTicks { get; } = new("Distance along approach (m)", Style.Line(Colour.Blue, 0.25));

    /// <summary>A marked distance along an approach (for example the required sight distance): a solid triangle.</summary>
    public static PlanLayer StationMarker { get; } = new("Marked distance", new Style { Stroke = Colour.Black, StrokeWidthMm = 0.2, Fill = Colour.Black })
    {
        Marker = MarkerKind.Triangle,
        MarkerSizeMm = 3,
    };

    /// <summary>The required sight distance on an approach: a solid triangle.</summary>
    public static PlanLayer RequiredDistance { get; } = new("Required sight distance", StationMarker.Style)
    {
        Marker = MarkerKind.Triangle,
        MarkerSizeMm = 3,
    };

    /// <summary>The direction the mirror's face looks: a solid arrow from the mirror.</summary>
    public static PlanLayer MirrorAim { get; } = new("Mirror aim (face direction)", Style.Line(Colour.Black, 0.35));

    /// <summary>What the driver sees of the road in the mirror, the field of view less what obstacles hide from the mirror: a
    /// long-dashed outline, unfilled.</summary>
    public static PlanLayer FieldOfView { get; } = new("Road seen in the mirror", Style.Line(Colour.Green, 0.3, Dashes.LongDashed));

    // The three stretches along an approach are told apart in greyscale by width and pattern, not by colour alone:
    // a wide pale solid band, a narrower band of dark dashes and a row of heavy beads.

    /// <summary>The stretch of an approach the driver sees directly: a wide pale solid band under the lane line.</summary>
    public static PlanLayer SeenDirectly { get; } = new("Seen directly", Style.Line(Colour.Black, 2.2) with { Opacity = 0.2 });

    /// <summary>The stretch of an approach the mirror shows (beyond the direct view): a band of dark dashes.</summary>
    public static PlanLayer ShownInMirror { get; } = new("Shown in the mirror", Style.Line(Colour.Green, 1.3, [2.4, 1.1]) with { Opacity = 0.75 });

    /// <summary>The stretch of an approach within the required distance that neither view shows: a row of heavy beads.</summary>
    public static PlanLayer SeenNeitherWay { get; } = new("Seen neither way (unseen)", Style.Line(Colour.Red, 1.7, [0.01, 2.3]));

    /// <summary>The way traffic on an approach travels: a heavy arrow beside the lane.</summary>
    public static PlanLayer TravelDirection { get; } = new("Direction of travel", Style.Line(Colour.Blue, 0.55));

    /// <summary>Where the waiting driver stops: a heavy solid bar.</summary>
    public static PlanLayer StopLine { get; } = new("Stop line", Style.Line(Colour.Black, 0.9));
}
