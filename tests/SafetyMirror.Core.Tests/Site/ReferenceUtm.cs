using ProjNet.CoordinateSystems;
using ProjNet.CoordinateSystems.Transformations;

namespace SafetyMirror.Core.Tests.Site;

/// <summary>WGS84 longitude/latitude to UTM by ProjNET's own built-in UTM definition, a general-purpose reference.</summary>
internal static class ReferenceUtm
{
    public static MathTransform FromWgs84(int zone, bool north) =>
        new CoordinateTransformationFactory()
            .CreateFromCoordinateSystems(GeographicCoordinateSystem.WGS84, ProjectedCoordinateSystem.WGS84_UTM(zone, north))
            .MathTransform;
}
