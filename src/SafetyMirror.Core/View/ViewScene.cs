using NetTopologySuite.Geometries;
using NetTopologySuite.Noding;
using SafetyMirror.Core.Optics;
using SafetyMirror.Core.Site;

namespace SafetyMirror.Core.View;

/// <summary>The corner as a simple 3-D scene for ray casting: the ground plane shaded by what the plan draws on it, obstacles as
/// flat-topped prisms, road users as boxes, and sky.</summary>
/// <remarks>
/// The ground is the plane z = 0 everywhere (a footway's kerb height is not raised: a few centimetres that the picture
/// cannot show). Obstacles and road users are first tested against their bounding boxes; only a ray that enters one is tested
/// against the walls and top. Safe for concurrent use once built.
/// </remarks>
public sealed class ViewScene
{
    /// <summary>Half the width of the drawn approach lines, in metres (a lane marking is 0.10–0.15 m wide: common practice).</summary>
    public const double ApproachLineHalfWidthM = 0.075;

    // Distances below this along a ray are its own start point: the reflected ray must not meet the mirror's own surroundings at 0.
    private const double StartClearanceM = 1e-6;

    private readonly Area[] carriageways;
    private readonly Area[] footways;
    private readonly Segment[] approachLines;
    private readonly Prism[] prisms;
    private readonly RoadUserBox[] boxes;

    /// <summary>Side of the square pole the mirror hangs on, in metres (common practice: a 76 mm steel post).</summary>
    public const double PoleSideM = 0.076;

    /// <summary>Builds the scene of a plan with road users placed on its approaches and, when given, the mirror's pole.</summary>
    /// <param name="plan">The corner.</param>
    /// <param name="roadUsers">Who stands on the approaches.</param>
    /// <param name="pole">The pole: the plan point it stands on and the height of its top; null for none.</param>
    public ViewScene(SitePlan plan, IReadOnlyList<PlacedRoadUser> roadUsers, (double XM, double YM, double TopM)? pole = null)
    {
        ArgumentNullException.ThrowIfNull(plan);
        ArgumentNullException.ThrowIfNull(roadUsers);
        carriageways = [.. plan.Carriageways.Select(c => new Area(c.Area))];
        footways = [.. plan.Footways.Select(f => new Area(f.Area))];
        approachLines = [.. plan.Approaches.SelectMany(a => Segment.Of(a.Line))];
        prisms =
        [
            .. plan.Obstacles.Select((o, i) => new Prism(o.Footprint, o.HeightM, SeenKind.Obstacle, (short)i)),
            .. pole is { } p ? [PoleOf(p.XM, p.YM, p.TopM)] : Array.Empty<Prism>(),
        ];
        boxes = [.. roadUsers.Select((u, i) => new RoadUserBox(u, (short)i))];
        RoadUsers = roadUsers;
    }

    /// <summary>The road users standing in the scene, in the order their pixels are indexed.</summary>
    public IReadOnlyList<PlacedRoadUser> RoadUsers { get; }

    /// <summary>What the ray first meets within <paramref name="maxDistanceM"/>, or null when nothing (sky, or nothing that near).</summary>
    /// <param name="origin">Where the ray starts, site metres.</param>
    /// <param name="direction">Unit direction.</param>
    /// <param name="maxDistanceM">Farthest distance that counts.</param>
    public SceneHit? Trace(Vec3 origin, Vec3 direction, double maxDistanceM)
    {
        var best = maxDistanceM;
        SceneHit? hit = null;

        // The ground first: it bounds the search for everything standing on it.
        if (direction.Z < 0 && origin.Z >= 0)
        {
            var t = -origin.Z / direction.Z;
            if (t > StartClearanceM && t < best)
            {
                best = t;
                hit = new SceneHit(SeenKind.Ground, 0, t, Vec3.Up);
            }
        }

        foreach (var prism in prisms)
        {
            if (prism.Intersect(origin, direction, StartClearanceM, best) is { } h)
            {
                best = h.DistanceM;
                hit = h;
            }
        }

        foreach (var box in boxes)
        {
            if (box.Intersect(origin, direction, StartClearanceM, best) is { } h)
            {
                best = h.DistanceM;
                hit = h;
            }
        }

        return hit is { Kind: SeenKind.Ground } ground ? ground with { Kind = GroundAt(origin + (ground.DistanceM * direction)) } : hit;
    }

    private static Prism PoleOf(double x, double y, double topM)
    {
        var half = PoleSideM / 2;
        var square = new GeometryFactory().ToGeometry(new Envelope(x - half, x + half, y - half, y + half));
        return new Prism(square, topM, SeenKind.Pole, 0);
    }

    /// <summary>What the plan draws on the ground at a point: an approach line, a footway, a carriageway, or other ground.</summary>
    public SeenKind GroundAt(Vec3 point)
    {
        var (x, y) = (point.X, point.Y);
        foreach (var line in approachLines)
        {
            if (line.IsWithin(x, y, ApproachLineHalfWidthM))
            {
                return SeenKind.ApproachLine;
            }
        }

        foreach (var footway in footways)
        {
            if (footway.Contains(x, y))
            {
                return SeenKind.Footway;
            }
        }

        foreach (var carriageway in carriageways)
        {
            if (carriageway.Contains(x, y))
            {
                return SeenKind.Carriageway;
            }
        }

        return SeenKind.Ground;
    }

    /// <summary>A polygonal area of the plan with a quick box test before the exact one.</summary>
    /// <remarks>An even–odd crossing count over every outline: no allocation per query, which matters at one query a pixel.
    /// A point exactly on an outline may fall either side; at a pixel's scale that cannot be seen.</remarks>
    private sealed class Area
    {
        private readonly Envelope box;
        private readonly Segment[] edges;

        public Area(Geometry area)
        {
            box = area.EnvelopeInternal;
            edges = Segment.OutlinesOf(area);
        }

        public bool Contains(double x, double y)
        {
            if (!box.Contains(x, y))
            {
                return false;
            }

            var inside = false;
            foreach (var e in edges)
            {
                if ((e.Y0 > y) != (e.Y1 > y) && x < e.X0 + ((y - e.Y0) * (e.X1 - e.X0) / (e.Y1 - e.Y0)))
                {
                    inside = !inside;
                }
            }

            return inside;
        }
    }

    /// <summary>A straight piece of a line on the ground.</summary>
    private readonly record struct Segment(double X0, double Y0, double X1, double Y1)
    {
        public static IEnumerable<Segment> Of(LineString line)
        {
            for (var i = 1; i < line.NumPoints; i++)
            {
                Coordinate a = line.GetCoordinateN(i - 1), b = line.GetCoordinateN(i);
                yield return new Segment(a.X, a.Y, b.X, b.Y);
            }
        }

        /// <summary>The edges of every ring of a polygonal geometry.</summary>
        public static Segment[] OutlinesOf(Geometry area) =>
            [.. SegmentStringUtil.ExtractSegmentStrings(area)
                .SelectMany(outline => outline.Coordinates.Zip(outline.Coordinates.Skip(1), (a, b) => new Segment(a.X, a.Y, b.X, b.Y)))];

        public bool IsWithin(double x, double y, double distanceM)
        {
            if (x < Math.Min(X0, X1) - distanceM || x > Math.Max(X0, X1) + distanceM
                || y < Math.Min(Y0, Y1) - distanceM || y > Math.Max(Y0, Y1) + distanceM)
            {
                return false;
            }

            double dx = X1 - X0, dy = Y1 - Y0;
            var s = Math.Clamp((((x - X0) * dx) + ((y - Y0) * dy)) / ((dx * dx) + (dy * dy)), 0, 1);
            double ex = X0 + (s * dx) - x, ey = Y0 + (s * dy) - y;
            return (ex * ex) + (ey * ey) <= distanceM * distanceM;
        }
    }

    /// <summary>An obstacle (or the pole): its footprint raised from the ground to its flat top.</summary>
    private sealed class Prism(Geometry footprint, double heightM, SeenKind kind, short index)
    {
        private readonly Envelope box = footprint.EnvelopeInternal;
        private readonly Area top = new(footprint);
        private readonly Segment[] walls = Segment.OutlinesOf(footprint);

        public SceneHit? Intersect(Vec3 o, Vec3 d, double near, double far)
        {
            // The bounding box only rules rays out; the exact tests below keep the bounds they were given, since a wall lies on
            // the box and rounding could put its hit a hair outside the clipped range.
            double enter = near, leave = far;
            if (!Slabs.Clip(o, d, new Vec3(box.MinX, box.MinY, 0), new Vec3(box.MaxX, box.MaxY, heightM), ref enter, ref leave))
            {
                return null;
            }

            SceneHit? hit = null;
            if (d.Z < 0 && o.Z > heightM)
            {
                var t = (heightM - o.Z) / d.Z;
                if (t >= near && t < far && top.Contains(o.X + (t * d.X), o.Y + (t * d.Y)))
                {
                    far = t;
                    hit = new SceneHit(kind, index, t, Vec3.Up);
                }
            }

            foreach (var wall in walls)
            {
                // The ray against the wall's plan line: o + t·d = a + s·(b − a), t in [near, far), s in [0, 1].
                double ex = wall.X1 - wall.X0, ey = wall.Y1 - wall.Y0;
                var denominator = (d.X * ey) - (d.Y * ex);
                if (Math.Abs(denominator) < 1e-15)
                {
                    continue;
                }

                double wx = wall.X0 - o.X, wy = wall.Y0 - o.Y;
                var t = ((wx * ey) - (wy * ex)) / denominator;
                var s = ((wx * d.Y) - (wy * d.X)) / denominator;
                var z = o.Z + (t * d.Z);
                if (t >= near && t < far && s >= 0 && s <= 1 && z >= 0 && z <= heightM)
                {
                    far = t;
                    var normal = new Vec3(ey, -ex, 0).Normalized();
                    hit = new SceneHit(kind, index, t, Vec3.Dot(normal, d) > 0 ? -normal : normal);
                }
            }

            return hit;
        }
    }

    /// <summary>A road user as a box: its front face centred on its station, its length behind it along the direction of travel.</summary>
    private sealed class RoadUserBox(PlacedRoadUser user, short index)
    {
        private readonly Vec3 front = user.Station.Position;
        private readonly Vec3 ahead = user.Station.Direction;
        private readonly Vec3 left = Vec3.Cross(Vec3.Up, user.Station.Direction);
        private readonly Vec3 min = new(-user.RoadUser.LengthM, -user.RoadUser.WidthM / 2, 0);
        private readonly Vec3 max = new(0, user.RoadUser.WidthM / 2, user.RoadUser.HeightM);

        // A box round it in site axes, for the quick test: its half-diagonal across the ground round the middle of its footprint.
        private readonly (Vec3 Min, Vec3 Max) around = AroundOf(user);

        public SceneHit? Intersect(Vec3 o, Vec3 d, double near, double far)
        {
            double quickNear = near, quickFar = far;
            if (!Slabs.Clip(o, d, around.Min, around.Max, ref quickNear, ref quickFar))
            {
                return null;
            }

            // In the box's own axes (ahead, left, up) it is axis-aligned.
            var offset = o - front;
            var localOrigin = new Vec3(Vec3.Dot(offset, ahead), Vec3.Dot(offset, left), offset.Z);
            var localDirection = new Vec3(Vec3.Dot(d, ahead), Vec3.Dot(d, left), d.Z);
            var entry = near;
            if (!Slabs.Clip(localOrigin, localDirection, min, max, ref entry, ref far) || entry <= near)
            {
                return null;
            }

            var p = localOrigin + (entry * localDirection);
            var (kind, normal) = Math.Abs(p.X - max.X) < 1e-9 ? (SeenKind.RoadUserFront, ahead)
                : Math.Abs(p.X - min.X) < 1e-9 ? (SeenKind.RoadUserBody, -ahead)
                : Math.Abs(p.Y - max.Y) < 1e-9 ? (SeenKind.RoadUserBody, left)
                : Math.Abs(p.Y - min.Y) < 1e-9 ? (SeenKind.RoadUserBody, -left)
                : (SeenKind.RoadUserBody, Vec3.Up);
            return new SceneHit(kind, index, entry, normal);
        }

        private static (Vec3 Min, Vec3 Max) AroundOf(PlacedRoadUser user)
        {
            var size = user.RoadUser;
            var middle = user.Station.Position - ((size.LengthM / 2) * user.Station.Direction);
            var reach = Math.Sqrt((size.LengthM * size.LengthM) + (size.WidthM * size.WidthM)) / 2;
            return (new Vec3(middle.X - reach, middle.Y - reach, 0), new Vec3(middle.X + reach, middle.Y + reach, size.HeightM));
        }
    }
}

/// <summary>Where a ray meets the scene: what, which one, how far along the ray, and the surface's unit normal there.</summary>
public readonly record struct SceneHit(SeenKind Kind, short Index, double DistanceM, Vec3 Normal);

/// <summary>The slab test of a ray against an axis-aligned box.</summary>
internal static class Slabs
{
    /// <summary>Narrows [near, far] to where the ray o + t·d is inside the box; false when nothing of it is.</summary>
    public static bool Clip(Vec3 o, Vec3 d, Vec3 min, Vec3 max, ref double near, ref double far) =>
        Axis(o.X, d.X, min.X, max.X, ref near, ref far)
        && Axis(o.Y, d.Y, min.Y, max.Y, ref near, ref far)
        && Axis(o.Z, d.Z, min.Z, max.Z, ref near, ref far);

    private static bool Axis(double o, double d, double min, double max, ref double near, ref double far)
    {
        if (Math.Abs(d) < 1e-300)
        {
            return o >= min && o <= max;
        }

        double t0 = (min - o) / d, t1 = (max - o) / d;
        if (t0 > t1)
        {
            (t0, t1) = (t1, t0);
        }

        near = Math.Max(near, t0);
        far = Math.Min(far, t1);
        return near <= far;
    }
}
