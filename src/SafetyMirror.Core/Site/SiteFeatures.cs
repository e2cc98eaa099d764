using NetTopologySuite.Geometries;
using SafetyMirror.Core.Optics;

namespace SafetyMirror.Core.Site;

/// <summary>Which feature of the plan's FeatureCollection something came from, for messages and reports.</summary>
/// <param name="Index">Position in the <c>features</c> array, from 0.</param>
/// <param name="Id">The GeoJSON feature id, if it had one (a number is kept as its JSON text).</param>
/// <param name="Name">The feature's <c>name</c> property, if it had one.</param>
public sealed record FeatureReference(int Index, string? Id = null, string? Name = null)
{
    /// <summary>The feature's path in the plan, e.g. <c>features[3]</c>.</summary>
    public string Path => $"features[{Index}]";

    /// <summary>The name (or else the id) in quotes followed by the path, or the path alone.</summary>
    public override string ToString() => (Name ?? Id) is { } label ? $"\"{label}\" ({Path})" : Path;
}

/// <summary>A feature of the corner plan, in local metres.</summary>
public abstract record SiteFeature(FeatureReference Feature);

/// <summary>A waiting driver's eye point.</summary>
/// <param name="Position">Local metres; z is the eye height above the ground.</param>
/// <param name="Feature">Where it came from.</param>
public sealed record Eye(Vec3 Position, FeatureReference Feature) : SiteFeature(Feature)
{
    /// <summary>Eye height above the ground in metres.</summary>
    public double HeightM => Position.Z;
}

/// <summary>Something that blocks the view up to a height: a wall, building, hedge or parked vehicles.</summary>
/// <param name="Footprint">Polygon or MultiPolygon in local metres.</param>
/// <param name="HeightM">Height of its top above the ground, in metres; flat across the footprint.</param>
/// <param name="Feature">Where it came from.</param>
public sealed record Obstacle(Geometry Footprint, double HeightM, FeatureReference Feature) : SiteFeature(Feature)
{
    /// <summary>Polygon or MultiPolygon in local metres.</summary>
    public Geometry Footprint { get; } = Footprint is IPolygonal
        ? Footprint
        : throw new ArgumentException($"An obstacle footprint must be a Polygon or MultiPolygon; it was a {Footprint.GeometryType}.", nameof(Footprint));

    /// <summary>Height of its top above the ground, in metres.</summary>
    public double HeightM { get; } = Preconditions.InRange(HeightM, SiteRanges.MinObstacleHeightM, SiteRanges.MaxObstacleHeightM, "m");
}

/// <summary>Where a mirror pole may stand: a Point, LineString or Polygon in local metres.</summary>
public sealed record MountingZone(Geometry Zone, FeatureReference Feature) : SiteFeature(Feature);

/// <summary>A carriageway area (Polygon or MultiPolygon in local metres).</summary>
public sealed record Carriageway(Geometry Area, FeatureReference Feature) : SiteFeature(Feature);

/// <summary>A footway area (Polygon or MultiPolygon in local metres), standing a kerb above the carriageway.</summary>
/// <param name="Area">Polygon or MultiPolygon in local metres.</param>
/// <param name="KerbHeightM">Height of its surface above the carriageway (and the ground plane), in metres.</param>
/// <param name="Feature">Where it came from.</param>
public sealed record Footway(Geometry Area, double KerbHeightM, FeatureReference Feature) : SiteFeature(Feature);

/// <summary>Where the waiting driver stops: the line a siting rule measures the mirror's distance from.</summary>
/// <param name="Line">The stop line in local metres.</param>
/// <param name="Feature">Where it came from.</param>
public sealed record StopLine(LineString Line, FeatureReference Feature) : SiteFeature(Feature);
