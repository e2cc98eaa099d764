using NetTopologySuite.Geometries;
using SafetyMirror.Core.Optics;
using SafetyMirror.Core.Site;
using SafetyMirror.Core.Sun;
using SafetyMirror.Core.Tests.Design.Evaluation;

namespace SafetyMirror.Core.Tests.Design.Glare;

/// <summary>An invented corner placed on the earth, with mirrors aimed by hand so that the eye's ray at the vertex reflects
/// toward a chosen direction.</summary>
/// <remarks>The eye and the pole are those of <see cref="Corners"/>; the site stands at 50.31° N, 9.87° E (invented place).</remarks>
internal static class GlareCorner
{
    public const double LatitudeDeg = 50.31;
    public const double LongitudeDeg = 9.87;

    /// <summary>An afternoon in March with the sun low in the south-west (a day the default 7-day stride samples: 1 January + 77).</summary>
    public static readonly DateTimeOffset Afternoon = new(2026, 3, 19, 15, 0, 0, TimeSpan.Zero);

    public static readonly Vec3 Eye = Corners.Eye;

    public static readonly Vec3 Vertex = new(0, 7.5, 2.9);

    public static PlanFrame Frame { get; } = PlanFrame.CentredOn(PlanCoordinateSystem.Wgs84, new Coordinate(LongitudeDeg, LatitudeDeg));

    public static Vec3 SunAt(DateTimeOffset instant) => SolarCalculator.At(instant, LatitudeDeg, LongitudeDeg).Direction;

    /// <summary>A 400 mm face of radius 10 m at the pole whose normal bisects the directions to the eye and to
    /// <paramref name="direction"/>: by the law of reflection the eye's ray to the vertex leaves toward that direction.</summary>
    public static ConvexMirror AimedAt(Vec3 direction)
    {
        var towardEye = (Eye - Vertex).Normalized();
        return new ConvexMirror(Vertex, towardEye + direction, 10, new RoundAperture(0.4));
    }

    public static SitePlan Plan(TimeZoneInfo? zone = null, params Obstacle[] obstacles) =>
        new(Frame, [new Eye(Eye, new FeatureReference(0, "driver"))], [Corners.FromWest()], obstacles) { TimeZone = zone };

    /// <summary>A square tower of the given height whose centre stands so many metres from a point along a direction's
    /// horizontal bearing.</summary>
    public static Obstacle TowerToward(Vec3 from, Vec3 direction, double distanceM, double heightM)
    {
        var bearing = new Vec3(direction.X, direction.Y, 0).Normalized();
        var centre = from + (distanceM * bearing);
        return new Obstacle(Corners.Box(centre.X - 2, centre.Y - 2, centre.X + 2, centre.Y + 2), heightM, new FeatureReference(3, "tower"));
    }
}
