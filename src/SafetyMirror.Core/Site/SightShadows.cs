using NetTopologySuite.Geometries;
using NetTopologySuite.Geometries.Utilities;
using NetTopologySuite.Operation.Overlay;
using NetTopologySuite.Operation.OverlayNG;
using SafetyMirror.Core.Optics;

namespace SafetyMirror.Core.Site;

/// <summary>What obstacles hide of the ground from a raised viewpoint: the 2.5-D sightline test of
/// <see cref="SitePlan.FirstObstacleBlocking"/> turned into areas.</summary>
/// <remarks>
/// A ground point P counts as seen when the sightline from the viewpoint V (height hv) to a target over P at height ht
/// passes no obstacle's footprint lower than its top. Take a footprint point Q at horizontal distance d from V on the way
/// to P, with P = V + s·(Q − V), s = D/d ≥ 1. The sightline's height over Q is hv + (ht − hv)/s, so an obstacle of height
/// h hides P exactly when hv + (ht − hv)/s &lt; h, that is when <c>s·(h − hv) &gt; ht − hv</c>:
/// <list type="bullet">
/// <item>h &lt; hv: for s &lt; (hv − ht)/(hv − h), none at all when h ≤ ht (a bounded shadow ending at D = d·(hv − ht)/(hv − h));</item>
/// <item>h = hv: for every s when ht &lt; hv (an unbounded shadow), none otherwise;</item>
/// <item>h &gt; hv: for s &gt; (ht − hv)/(h − hv), negative when ht &lt; hv (an unbounded shadow from the footprint on).</item>
/// </list>
/// So the hidden area is the union of the footprint scaled about V by every s in that range: the footprint at each end of
/// the range and the quadrilateral each outline edge sweeps in between. An unbounded range is cut where the scaled
/// footprint has left the area asked about. Footprints themselves are never seen ground, whatever their height.
/// Level ground: the kerb height of footways is not counted, as the blocking test does not count it either.
/// </remarks>
public static class SightShadows
{
    private static readonly GeometryFactory Factory = new();

    /// <summary>The part of a ground area seen from the viewpoint at the target height, or null when none of it is.</summary>
    /// <param name="area">The ground area (Polygon or MultiPolygon), local metres.</param>
    /// <param name="obstacles">The obstacles that may hide part of it.</param>
    /// <param name="viewpoint">Where the sightlines start, local metres, z above the ground.</param>
    /// <param name="targetHeightM">Height above the ground of the point over each ground point that must be seen.</param>
    public static Geometry? SeenPart(Geometry area, IEnumerable<Obstacle> obstacles, Vec3 viewpoint, double targetHeightM)
    {
        ArgumentNullException.ThrowIfNull(area);
        ArgumentNullException.ThrowIfNull(obstacles);
        Preconditions.Finite(viewpoint);
        Preconditions.InRange(targetHeightM, 0, SiteRanges.MaxObstacleHeightM, "m");
        var box = area.EnvelopeInternal;
        // One union of every obstacle's pieces: each overlay pass nodes all its input again.
        var hidden = obstacles
            .SelectMany(o => Hidden(o, viewpoint, targetHeightM, box))
            .Where(piece => piece.EnvelopeInternal.Intersects(box))
            .ToList();
        var seen = hidden.Count == 0 ? area : OverlayNGRobust.Overlay(area, OverlayNGRobust.Union(Factory.BuildGeometry(hidden)), SpatialFunction.Difference);
        return seen.IsEmpty ? null : seen;
    }

    /// <summary>The pieces of ground an obstacle hides from the viewpoint, its footprint included, as far as the box reaches.</summary>
    private static List<Geometry> Hidden(Obstacle obstacle, Vec3 viewpoint, double targetHeightM, Envelope box)
    {
        var footprint = obstacle.Footprint;
        var (h, hv, ht) = (obstacle.HeightM, viewpoint.Z, targetHeightM);
        var centre = new Coordinate(viewpoint.X, viewpoint.Y);

        // The range of scale factors s ≥ 1 for which s·(h − hv) > ht − hv (see the remarks).
        var far = FarthestScale(footprint, centre, box);
        var (from, to) = h < hv ? (1.0, Math.Min((hv - ht) / (hv - h), far))
            : h > hv ? (Math.Max(1, (ht - hv) / (h - hv)), far)
            : ht < hv ? (1.0, far) : (1.0, 1.0);
        if (to <= from)
        {
            return [footprint];
        }

        var parts = new List<Geometry> { footprint, Scaled(footprint, centre, from), Scaled(footprint, centre, to) };
        foreach (var ring in Rings(footprint))
        {
            var c = ring.Coordinates;
            for (var i = 0; i + 1 < c.Length; i++)
            {
                var quad = Factory.CreatePolygon(
                    [At(c[i], centre, from), At(c[i + 1], centre, from), At(c[i + 1], centre, to), At(c[i], centre, to), At(c[i], centre, from)]);
                if (quad.Area > 0)
                {
                    parts.Add(quad);
                }
            }
        }

        return parts;
    }

    /// <summary>The scale about the centre beyond which the footprint lies wholly outside the box (every point of it
    /// farther from the centre than the box's farthest corner).</summary>
    private static double FarthestScale(Geometry footprint, Coordinate centre, Envelope box)
    {
        var reach = new[] { (box.MinX, box.MinY), (box.MaxX, box.MinY), (box.MaxX, box.MaxY), (box.MinX, box.MaxY) }
            .Max(corner => Math.Sqrt(Math.Pow(corner.Item1 - centre.X, 2) + Math.Pow(corner.Item2 - centre.Y, 2)));
        var nearest = footprint.Distance(Factory.CreatePoint(centre));

        // A viewpoint over the footprint itself (a pole in a low hedge) leaves no finite scale: use a large one.
        return Math.Max(1, (reach + 1) / Math.Max(nearest, 1e-6 * (reach + 1)));
    }

    private static IEnumerable<LinearRing> Rings(Geometry footprint) =>
        Enumerable.Range(0, footprint.NumGeometries)
            .Select(footprint.GetGeometryN)
            .OfType<Polygon>()
            .SelectMany(p => p.InteriorRings.Prepend(p.ExteriorRing))
            .Cast<LinearRing>();

    private static Geometry Scaled(Geometry footprint, Coordinate centre, double scale) =>
        AffineTransformation.ScaleInstance(scale, scale, centre.X, centre.Y).Transform(footprint);

    private static Coordinate At(Coordinate point, Coordinate centre, double scale) =>
        new(centre.X + (scale * (point.X - centre.X)), centre.Y + (scale * (point.Y - centre.Y)));
}
