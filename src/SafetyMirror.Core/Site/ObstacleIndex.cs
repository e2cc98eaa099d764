using NetTopologySuite.Algorithm;
using NetTopologySuite.Algorithm.Locate;
using NetTopologySuite.Geometries;
using NetTopologySuite.Index.Strtree;
using NetTopologySuite.Noding;
using SafetyMirror.Core.Optics;

namespace SafetyMirror.Core.Site;

/// <summary>The obstacles of a plan, indexed for the thousands of sightline checks an evaluation makes.</summary>
/// <remarks>
/// Built once; safe for concurrent queries (the tree is built up front; NTS documents the outline intersector and the
/// point locator as thread-safe). A sightline is cut where it crosses an outline, and each piece between cuts is
/// inside or outside the footprint as a whole, so one point-in-area test per piece classifies it: no overlay needed.
/// </remarks>
internal sealed class ObstacleIndex
{
    /// <summary>A sightline this far above an obstacle's top all along, or this far to one side of its box, is clear of it: far
    /// above the rounding of the exact test, far below anything a plan states, in metres.</summary>
    private const double ClearanceM = 1e-9;

    private readonly STRtree<Entry> tree = new();

    public ObstacleIndex(IEnumerable<Obstacle> obstacles)
    {
        foreach (var obstacle in obstacles)
        {
            tree.Insert(obstacle.Footprint.EnvelopeInternal, new Entry(
                obstacle,
                new IndexedPointInAreaLocator(obstacle.Footprint),
                [.. SegmentStringUtil.ExtractSegmentStrings(obstacle.Footprint).Select(outline => outline.Coordinates)]));
        }

        tree.Build();
    }

    /// <summary>The obstacle whose interior contains the plan point, or null (a point on an outline is outside).</summary>
    public Obstacle? Containing(Coordinate point) =>
        tree.Query(new Envelope(point)).FirstOrDefault(entry => entry.Locator.Locate(point) == Location.Interior)?.Obstacle;

    /// <summary>The obstacle that blocks the 3-D segment nearest its start, or null when the segment is clear.</summary>
    public Obstacle? FirstBlocking(Vec3 from, Vec3 to)
    {
        var start = new Coordinate(from.X, from.Y);
        var end = new Coordinate(to.X, to.Y);
        if (start.Equals2D(end))
        {
            // A vertical segment: blocked where it stands inside an obstacle taller than its lower end.
            var below = Containing(start);
            return below is not null && Math.Min(from.Z, to.Z) < below.HeightM ? below : null;
        }

        var sightline = new LineSegment(start, end);
        Obstacle? first = null;
        var firstFraction = double.PositiveInfinity;
        var lowestZ = Math.Min(from.Z, to.Z);
        foreach (var entry in tree.Query(new Envelope(start, end)))
        {
            if (lowestZ >= entry.Obstacle.HeightM + ClearanceM || Misses(sightline, entry.Obstacle.Footprint.EnvelopeInternal))
            {
                continue;
            }

            if (BlockedFraction(entry, sightline, from.Z, to.Z) is { } fraction && fraction < firstFraction)
            {
                (first, firstFraction) = (entry.Obstacle, fraction);
            }
        }

        return first;
    }

    /// <summary>Whether the sightline's line passes clear of the box, every corner of it more than <see cref="ClearanceM"/> to one side.</summary>
    /// <remarks>Then it cannot meet the footprint inside the box, and skipping the exact test changes no answer: the margin is far
    /// above the rounding of the corners' offsets, so the exact test would have found no crossing either.</remarks>
    private static bool Misses(LineSegment sightline, Envelope box)
    {
        var (start, end) = (sightline.P0, sightline.P1);
        double dx = end.X - start.X, dy = end.Y - start.Y;
        var margin = ClearanceM * Math.Sqrt((dx * dx) + (dy * dy));
        double Side(double x, double y) => (dx * (y - start.Y)) - (dy * (x - start.X));
        var (a, b, c, d) = (Side(box.MinX, box.MinY), Side(box.MaxX, box.MinY), Side(box.MaxX, box.MaxY), Side(box.MinX, box.MaxY));
        return (a > margin && b > margin && c > margin && d > margin) || (a < -margin && b < -margin && c < -margin && d < -margin);
    }

    /// <summary>How far along the sightline (0 to 1) it first passes below the obstacle's top, or null if never.</summary>
    /// <remarks>
    /// The sightline's height is linear along its plan projection, so over each piece inside the footprint it is lowest
    /// at one of the piece's ends. A piece along an outline counts as inside; a touch at a single point does not block.
    /// </remarks>
    private static double? BlockedFraction(Entry entry, LineSegment sightline, double fromZ, double toZ)
    {
        var cuts = OutlineCrossings(entry, sightline);
        var top = entry.Obstacle.HeightM;
        for (var i = 1; i < cuts.Count; i++)
        {
            var (a, b) = (cuts[i - 1], cuts[i]);
            if (b - a < 1e-12 || entry.Locator.Locate(sightline.PointAlong((a + b) / 2)) == Location.Exterior)
            {
                continue;
            }

            var (heightA, heightB) = (fromZ + (a * (toZ - fromZ)), fromZ + (b * (toZ - fromZ)));
            if (heightA < top)
            {
                return a;
            }

            if (heightB < top)
            {
                return a + ((b - a) * (heightA - top) / (heightA - heightB));
            }
        }

        return null;
    }

    /// <summary>The fractions along the sightline where it meets an outline of the footprint, with its two ends, in order.</summary>
    /// <remarks>Every outline segment is tried: the intersector itself rejects one whose box misses the sightline's.</remarks>
    private static List<double> OutlineCrossings(Entry entry, LineSegment sightline)
    {
        var intersector = new RobustLineIntersector();
        var fractions = new List<double> { 0, 1 };
        foreach (var outline in entry.Outlines)
        {
            for (var k = 0; k + 1 < outline.Length; k++)
            {
                intersector.ComputeIntersection(sightline.P0, sightline.P1, outline[k], outline[k + 1]);
                for (var i = 0; i < intersector.IntersectionNum; i++)
                {
                    fractions.Add(Math.Clamp(sightline.ProjectionFactor(intersector.GetIntersection(i)), 0, 1));
                }
            }
        }

        fractions.Sort();
        return fractions;
    }

    private sealed record Entry(Obstacle Obstacle, IndexedPointInAreaLocator Locator, Coordinate[][] Outlines);
}
