using NetTopologySuite.Geometries;
using SafetyMirror.Core.Optics;
using SafetyMirror.Core.Site;

namespace SafetyMirror.Core.Design.Evaluation;

/// <summary>Where along an approach a condition holds, as stretches whose ends are located by bisection.</summary>
/// <remarks>
/// Sampling alone misses what lies between samples. The samples therefore include event stations: where a sightline from
/// the eye or the mirror grazes an obstacle's corner, the only places a thin obstacle can begin or end a blocked stretch.
/// Inside short shadows the samples are dense, so no blocked stretch longer than <see cref="DenseSpacingM"/> slips through.
/// </remarks>
internal static class StationIntervals
{
    /// <summary>Spacing of the samples inside the short shadow of an obstacle, in metres.</summary>
    public const double DenseSpacingM = 0.25;

    /// <summary>Shadows up to this long are sampled densely; longer ones (a building) at their ends and middle.</summary>
    public const double DenseShadowM = 10;

    /// <summary>The maximal stretches of the samples' span where the condition holds, ends located to the tolerance.</summary>
    public static List<(double FromM, double ToM)> Where(IReadOnlyList<double> samples, Func<double, bool> holds, double toleranceM)
    {
        var result = new List<(double, double)>();
        double? from = null;
        var previous = false;
        for (var i = 0; i < samples.Count; i++)
        {
            var now = holds(samples[i]);
            if (i > 0 && now != previous)
            {
                // The boundary between the two samples, on the side where the condition holds.
                var edge = now ? Boundary(samples[i], samples[i - 1], holds, toleranceM) : Boundary(samples[i - 1], samples[i], holds, toleranceM);
                if (now)
                {
                    from = edge;
                }
                else
                {
                    result.Add((from!.Value, edge));
                    from = null;
                }
            }
            else if (i == 0 && now)
            {
                from = samples[0];
            }

            previous = now;
        }

        if (from is { } start)
        {
            result.Add((start, samples[^1]));
        }

        return result;
    }

    /// <summary>Bisection between a station where a condition holds and one where it does not; returns the last where it holds.</summary>
    public static double Boundary(double holds, double fails, Func<double, bool> condition, double toleranceM)
    {
        while (Math.Abs(fails - holds) > toleranceM)
        {
            var middle = (holds + fails) / 2;
            if (condition(middle))
            {
                holds = middle;
            }
            else
            {
                fails = middle;
            }
        }

        return holds;
    }

    /// <summary>The samples for an approach: the regular stations plus the events of sightlines from the source points.</summary>
    /// <remarks>An obstacle whose events from all sources lie within <see cref="DenseShadowM"/> (a thin one) is sampled densely
    /// between them; a larger one, whose shadow the regular stations already catch, at its events and between consecutive ones.</remarks>
    public static List<double> Samples(SitePlan plan, Approach approach, IEnumerable<double> regular, params Vec3[] sources)
    {
        var samples = new SortedSet<double>(regular);
        foreach (var obstacle in plan.Obstacles)
        {
            // The events of one obstacle seen from every source point together: from wherever on the face the path leaves.
            var events = sources.SelectMany(source => Events(obstacle, approach, source)).Distinct().Order().ToList();
            if (events.Count == 0)
            {
                continue;
            }

            samples.UnionWith(events);
            var dense = events[^1] - events[0] <= DenseShadowM;
            for (var i = 1; i < events.Count; i++)
            {
                var gap = events[i] - events[i - 1];
                var steps = dense ? (int)Math.Ceiling(gap / DenseSpacingM) : 2;
                for (var k = 1; k < steps; k++)
                {
                    samples.Add(events[i - 1] + (gap * k / steps));
                }
            }
        }

        return [.. samples];
    }

    /// <summary>Stations where the line from the source through an obstacle corner meets the approach beyond that corner.</summary>
    private static List<double> Events(Obstacle obstacle, Approach approach, Vec3 source)
    {
        var stations = new SortedSet<double>();
        var line = approach.Line;
        var length = approach.LengthM;
        foreach (var corner in obstacle.Footprint.Coordinates)
        {
            double dx = corner.X - source.X, dy = corner.Y - source.Y;
            var along = 0.0;
            for (var i = 1; i < line.NumPoints; i++)
            {
                Coordinate a = line.GetCoordinateN(i - 1), b = line.GetCoordinateN(i);
                double ex = b.X - a.X, ey = b.Y - a.Y;
                var denominator = (dx * ey) - (dy * ex);
                var segment = Math.Sqrt((ex * ex) + (ey * ey));
                if (Math.Abs(denominator) > 1e-12)
                {
                    // source + t·(corner − source) = a + u·(b − a), with t beyond the corner and u on the segment.
                    double qx = a.X - source.X, qy = a.Y - source.Y;
                    var t = ((qx * ey) - (qy * ex)) / denominator;
                    var u = ((qx * dy) - (qy * dx)) / denominator;
                    if (t >= 1 && u is >= 0 and <= 1)
                    {
                        stations.Add(Math.Clamp(length - (along + (u * segment)), 0, length));
                    }
                }

                along += segment;
            }
        }

        return [.. stations];
    }
}
