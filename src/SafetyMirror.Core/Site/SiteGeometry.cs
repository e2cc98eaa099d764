using NetTopologySuite.Geometries;

namespace SafetyMirror.Core.Site;

/// <summary>The geometry factory of every local-metres geometry: plain floating precision, no SRID.</summary>
internal static class SiteGeometry
{
    public static GeometryFactory Factory { get; } = new();
}
