using NetTopologySuite.Geometries;
using NetTopologySuite.LinearReferencing;
using NetTopologySuite.Operation.Distance;
using SafetyMirror.Core.Optics;
using SafetyMirror.Core.Site;

namespace SafetyMirror.Core.Design.Recommendation;

/// <summary>Where a pole may go: points spread over the plan's mounting zones, or along the far kerb when it has none.</summary>
internal static class CandidatePositions
{
    private static readonly GeometryFactory Factory = new();

    /// <summary>How far behind the far kerb a proposed pole stands, in metres: the kerb offset the rules ask of the face's
    /// nearest edge, plus the largest face's half extent, so that any catalogue face, however aimed, keeps it.</summary>
    public static double KerbSetbackM(RecommendationOptions options) =>
        options.Evaluation.Rules.KerbOffsetM + options.Catalogue.Select(t => t.Aperture.CircumradiusM).DefaultIfEmpty(0).Max();

    /// <summary>Candidate positions, deterministic and in plan order, within reach of the eye and outside obstacles.</summary>
    public static List<Coordinate> Spread(SitePlan plan, Vec3 eye, RecommendationOptions options)
    {
        var spacingM = options.CandidateSpacingM;
        var maxEyeDistanceM = options.Evaluation.Rules.MaximumEyeToMirrorDistanceM;
        var points = plan.MountingZones.Length > 0
            ? plan.MountingZones.SelectMany(zone => Over(zone.Zone, spacingM))
            : FarKerb(plan, eye, spacingM, maxEyeDistanceM, KerbSetbackM(options));
        return points
            .Where(p => Vec3.HorizontalDistance(new Vec3(p.X, p.Y, 0), eye) <= maxEyeDistanceM)
            .Where(p => !plan.IsInsideAnyObstacle(p.X, p.Y))
            .DistinctBy(p => (Math.Round(p.X, 3), Math.Round(p.Y, 3)))
            .ToList();
    }

    /// <summary>Where poles may stand: the mounting zones, or else the kerb lines set back behind each carriageway.</summary>
    public static IEnumerable<Geometry> Zones(SitePlan plan, RecommendationOptions options) => plan.MountingZones.Length > 0
        ? plan.MountingZones.Select(z => z.Zone)
        : plan.Carriageways.Select(c => c.Area.Buffer(KerbSetbackM(options)).Boundary);

    /// <summary>The point of a zone nearest to a wanted point (the wanted point itself when it lies in the zone).</summary>
    public static Coordinate Snap(Geometry zone, Coordinate wanted) =>
        DistanceOp.NearestPoints(zone, Factory.CreatePoint(wanted))[0];

    /// <summary>Points over a zone: itself for a point, every <paramref name="spacingM"/> along a line, a grid over a polygon.</summary>
    public static IEnumerable<Coordinate> Over(Geometry zone, double spacingM)
    {
        switch (zone)
        {
            case Point point:
                yield return point.Coordinate;
                break;
            case LineString line:
                var indexed = new LengthIndexedLine(line);
                var steps = Math.Max(1, (int)Math.Ceiling(line.Length / spacingM));
                for (var i = 0; i <= steps; i++)
                {
                    yield return indexed.ExtractPoint(line.Length * i / steps);
                }

                break;
            default:
                var box = zone.EnvelopeInternal;
                var any = false;
                for (var x = box.MinX + (spacingM / 2); x <= box.MaxX; x += spacingM)
                {
                    for (var y = box.MinY + (spacingM / 2); y <= box.MaxY; y += spacingM)
                    {
                        var c = new Coordinate(x, y);
                        if (zone.Contains(Factory.CreatePoint(c)))
                        {
                            any = true;
                            yield return c;
                        }
                    }
                }

                if (!any)
                {
                    yield return zone.InteriorPoint.Coordinate;
                }

                break;
        }
    }

    /// <summary>The far edge of the carriageway as seen from the eye, set back onto the footway, within reach of the eye.</summary>
    /// <remarks>A kerb point is on the far edge when the line from the eye to it crosses the carriageway first.</remarks>
    private static IEnumerable<Coordinate> FarKerb(SitePlan plan, Vec3 eye, double spacingM, double maxEyeDistanceM, double setbackM)
    {
        var eyePoint = new Coordinate(eye.X, eye.Y);
        foreach (var carriageway in plan.Carriageways)
        {
            var area = carriageway.Area;
            foreach (var edge in Over(area.Boundary is LineString ring ? ring : ((MultiLineString)area.Boundary).Geometries.OfType<LineString>().First(), spacingM / 2))
            {
                var distance = edge.Distance(eyePoint);
                if (distance > maxEyeDistanceM || distance < 1e-6)
                {
                    continue;
                }

                var fromEye = Factory.CreateLineString([eyePoint, edge]);
                var crossed = fromEye.Intersection(area).Length;
                if (crossed < distance * 0.25)
                {
                    continue; // a near kerb: the line reaches it without crossing the road
                }

                var away = new Coordinate(edge.X + ((edge.X - eye.X) / distance * setbackM), edge.Y + ((edge.Y - eye.Y) / distance * setbackM));
                if (!area.Contains(Factory.CreatePoint(away)))
                {
                    yield return away;
                }
            }
        }
    }
}
