using System.Collections.Immutable;
using NetTopologySuite.Algorithm.Locate;
using NetTopologySuite.Geometries;
using SafetyMirror.Core.Optics;

namespace SafetyMirror.Core.Site;

/// <summary>A corner plan in local metres: eyes, approaches, obstacles, mounting zones and paved areas.</summary>
/// <remarks>
/// 2.5-D: the ground is the plane z = 0 and each obstacle is its footprint raised to its height.
/// Read one from GeoJSON with <see cref="SitePlanReader.Read"/>; <see cref="Frame"/> maps results back.
/// </remarks>
public sealed record SitePlan
{
    private readonly ObstacleIndex obstacleIndex;

    // Point-in-area tests for the paved areas, built once: the siting checks ask for hundreds of points of a face.
    private readonly (IndexedPointInAreaLocator Area, double KerbHeightM)[] footwayAreas;
    private readonly IndexedPointInAreaLocator[] carriagewayAreas;

    /// <summary>Creates a plan from features already in local metres.</summary>
    public SitePlan(
        PlanFrame frame,
        IEnumerable<Eye> eyes,
        IEnumerable<Approach> approaches,
        IEnumerable<Obstacle>? obstacles = null,
        IEnumerable<MountingZone>? mountingZones = null,
        IEnumerable<Carriageway>? carriageways = null,
        IEnumerable<Footway>? footways = null,
        IEnumerable<StopLine>? stopLines = null)
    {
        Frame = frame;
        Eyes = [.. eyes];
        Approaches = [.. approaches];
        Obstacles = [.. obstacles ?? []];
        MountingZones = [.. mountingZones ?? []];
        Carriageways = [.. carriageways ?? []];
        Footways = [.. footways ?? []];
        StopLines = [.. stopLines ?? []];
        obstacleIndex = new ObstacleIndex(Obstacles);
        footwayAreas = [.. Footways.Select(f => (new IndexedPointInAreaLocator(f.Area), f.KerbHeightM))];
        carriagewayAreas = [.. Carriageways.Select(c => new IndexedPointInAreaLocator(c.Area))];
    }

    /// <summary>How the plan's own coordinates map to these local metres and back.</summary>
    public PlanFrame Frame { get; }

    /// <summary>Waiting drivers' eye points.</summary>
    public ImmutableArray<Eye> Eyes { get; }

    /// <summary>Traffic streams the waiting driver must see.</summary>
    public ImmutableArray<Approach> Approaches { get; }

    /// <summary>Walls, buildings, hedges, parked vehicles.</summary>
    public ImmutableArray<Obstacle> Obstacles { get; }

    /// <summary>Where a mirror pole may stand.</summary>
    public ImmutableArray<MountingZone> MountingZones { get; }

    /// <summary>Carriageway areas.</summary>
    public ImmutableArray<Carriageway> Carriageways { get; }

    /// <summary>Footway areas.</summary>
    public ImmutableArray<Footway> Footways { get; }

    /// <summary>Where the waiting driver stops, if the plan draws it.</summary>
    public ImmutableArray<StopLine> StopLines { get; }

    /// <summary>The local clock of the site, when the plan names one (its <c>timeZone</c>); null otherwise.</summary>
    public TimeZoneInfo? TimeZone { get; init; }

    /// <summary>The plan with only some of its approaches (by index), everything else kept.</summary>
    public SitePlan WithApproaches(IEnumerable<int> indices) =>
        new(Frame, Eyes, indices.Select(i => Approaches[i]), Obstacles, MountingZones, Carriageways, Footways, StopLines) { TimeZone = TimeZone };

    /// <summary>Height of the paved surface at a local point: a footway's kerb height where one lies, else 0 (carriageway and ground).</summary>
    public double SurfaceHeightAt(double xM, double yM)
    {
        var point = new Coordinate(xM, yM);
        return footwayAreas.Where(f => f.Area.Locate(point) != Location.Exterior).Select(f => f.KerbHeightM).DefaultIfEmpty(0).Max();
    }

    /// <summary>Whether a local point lies on a carriageway.</summary>
    public bool IsOnCarriageway(double xM, double yM)
    {
        var point = new Coordinate(xM, yM);
        return carriagewayAreas.Any(c => c.Locate(point) != Location.Exterior);
    }

    /// <summary>The obstacle that blocks the straight sightline from one 3-D point to another nearest its start, or null.</summary>
    /// <remarks>
    /// The line is blocked where it passes over an obstacle's footprint lower than the obstacle's top; passing exactly
    /// at the top height, or only touching an outline at a point, is clear. Points in local metres, z above the ground.
    /// </remarks>
    public Obstacle? FirstObstacleBlocking(Vec3 from, Vec3 to) => obstacleIndex.FirstBlocking(from, to);

    /// <summary>Whether any obstacle blocks the straight sightline from one 3-D point to another.</summary>
    public bool IsBlocked(Vec3 from, Vec3 to) => FirstObstacleBlocking(from, to) is not null;

    /// <summary>The obstacle whose footprint contains the local point, or null; a point on an outline is outside.</summary>
    public Obstacle? ObstacleContaining(double xM, double yM) => obstacleIndex.Containing(new Coordinate(xM, yM));

    /// <summary>Whether the local point lies inside any obstacle's footprint.</summary>
    public bool IsInsideAnyObstacle(double xM, double yM) => ObstacleContaining(xM, yM) is not null;
}
