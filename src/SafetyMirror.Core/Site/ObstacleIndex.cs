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
    private readonly STRtree<Entry> tree = new();

    public ObstacleIndex(IEnumerable<Obstacle> obstacles)
    {
        foreach (var obstacle in obstacles)
        {
            tree.Insert(obstacle.Footprint.EnvelopeInternal, new Entry(
                obstacle,
                new IndexedPointInAreaLocator(obstacle.Footprint),
                new MCIndexSegmentSetMutualIntersector(SegmentStringUtil.ExtractSegmentStrings(obstacle.Footprint))));
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
        foreach (var entry in tree.Query(new Envelope(start, end)))
        {
            if (BlockedFraction(entry, sightline, from.Z, to.Z) is { } fraction && fraction < firstFraction)
            {
                (first, firstFraction) = (entry.Obstacle, fraction);
            }
        }

        return first;
    }

    /// <summary>How far along the sightline (0 to 1) it first passes below the obstacle's top, or null if never.</summary>
    /// <remarks>
    /// The sightline's height is linear along its plan projection, so over each piece inside the footprint it is lowest
    /// at one of the piece's ends. A piece along an outline counts as inside; a touch at a single point does not block.
    /// </remarks>
    private static double? BlockedFraction(Entry entry, LineSegment sightline, double fromZ, double toZ)
    {
        var cuts = new OutlineCrossings(sightline);
        entry.Outline.Process([new BasicSegmentString([sightline.P0, sightline.P1], null)], cuts);
        cuts.Fractions.Sort();
        var top = entry.Obstacle.HeightM;
        for (var i = 1; i < cuts.Fractions.Count; i++)
        {
            var (a, b) = (cuts.Fractions[i - 1], cuts.Fractions[i]);
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

    private sealed record Entry(Obstacle Obstacle, IndexedPointInAreaLocator Locator, MCIndexSegmentSetMutualIntersector Outline);

    /// <summary>Collects the fractions along the sightline where it meets an outline, with its two ends.</summary>
    private sealed class OutlineCrossings(LineSegment sightline) : ISegmentIntersector
    {
        private readonly RobustLineIntersector intersector = new();

        public List<double> Fractions { get; } = [0, 1];

        public bool IsDone => false;

        public void ProcessIntersections(ISegmentString e0, int segIndex0, ISegmentString e1, int segIndex1)
        {
            // e0 is the sightline (the query), e1 an outline of the footprint (the indexed set).
            intersector.ComputeIntersection(sightline.P0, sightline.P1, e1.Coordinates[segIndex1], e1.Coordinates[segIndex1 + 1]);
            for (var i = 0; i < intersector.IntersectionNum; i++)
            {
                Fractions.Add(Math.Clamp(sightline.ProjectionFactor(intersector.GetIntersection(i)), 0, 1));
            }
        }
    }
}
