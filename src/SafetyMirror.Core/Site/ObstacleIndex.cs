using NetTopologySuite.Geometries;
using NetTopologySuite.Geometries.Prepared;
using NetTopologySuite.Index.Strtree;
using SafetyMirror.Core.Optics;

namespace SafetyMirror.Core.Site;

/// <summary>The obstacles of a plan, indexed for the thousands of sightline checks an evaluation makes.</summary>
/// <remarks>Built once; safe for concurrent queries (the tree is built up front, prepared geometries lock).</remarks>
internal sealed class ObstacleIndex
{
    private readonly STRtree<Entry> tree = new();

    public ObstacleIndex(IEnumerable<Obstacle> obstacles)
    {
        foreach (var obstacle in obstacles)
        {
            tree.Insert(obstacle.Footprint.EnvelopeInternal, new Entry(obstacle, PreparedGeometryFactory.Prepare(obstacle.Footprint)));
        }

        tree.Build();
    }

    /// <summary>The obstacle whose interior contains the plan point, or null (a point on an outline is outside).</summary>
    public Obstacle? Containing(Coordinate point)
    {
        var geometry = SiteGeometry.Factory.CreatePoint(point);
        return tree.Query(new Envelope(point)).FirstOrDefault(entry => entry.Prepared.Contains(geometry))?.Obstacle;
    }

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

        var segment = new LineSegment(start, end);
        var line = segment.ToGeometry(SiteGeometry.Factory);
        Obstacle? first = null;
        var firstFraction = double.PositiveInfinity;
        foreach (var entry in tree.Query(line.EnvelopeInternal))
        {
            if (entry.Prepared.Intersects(line)
                && BlockedFraction(entry.Obstacle, line, segment, from.Z, to.Z) is { } fraction
                && fraction < firstFraction)
            {
                (first, firstFraction) = (entry.Obstacle, fraction);
            }
        }

        return first;
    }

    /// <summary>How far along the segment (0 to 1) it first passes below the obstacle's top, or null if never.</summary>
    /// <remarks>
    /// The segment's height is linear along its plan projection, so over each piece inside the footprint it is lowest
    /// at one of the piece's ends. A piece that only touches the footprint at a point does not block.
    /// </remarks>
    private static double? BlockedFraction(Obstacle obstacle, LineString line, LineSegment segment, double fromZ, double toZ)
    {
        var inside = obstacle.Footprint.Intersection(line);
        double? first = null;
        for (var i = 0; i < inside.NumGeometries; i++)
        {
            if (inside.GetGeometryN(i) is not LineString { Length: > 0 } piece)
            {
                continue;
            }

            var a = segment.ProjectionFactor(piece.StartPoint.Coordinate);
            var b = segment.ProjectionFactor(piece.EndPoint.Coordinate);
            var (entry, exit) = a <= b ? (a, b) : (b, a);
            var entryZ = fromZ + (entry * (toZ - fromZ));
            var exitZ = fromZ + (exit * (toZ - fromZ));
            double? blocked = entryZ < obstacle.HeightM
                ? entry
                : exitZ < obstacle.HeightM
                    ? entry + ((exit - entry) * (entryZ - obstacle.HeightM) / (entryZ - exitZ))
                    : null;
            if (blocked < (first ?? double.PositiveInfinity))
            {
                first = blocked;
            }
        }

        return first;
    }

    private sealed record Entry(Obstacle Obstacle, IPreparedGeometry Prepared);
}
