using NetTopologySuite.Geometries;
using NetTopologySuite.Geometries.Utilities;
using ProjNet.CoordinateSystems;
using ProjNet.CoordinateSystems.Transformations;

namespace SafetyMirror.Core.Site;

/// <summary>How a plan's own coordinates map to local metres around the site, and back.</summary>
/// <remarks>
/// Local metres: x east, y north (true north), on a transverse Mercator centred on the site (central meridian and
/// latitude of origin at the site centre, scale 1, no false easting or northing), so distances are ground metres
/// to far better than a millimetre across a corner. A UTM plan goes through longitude/latitude to the same local
/// frame, so it gives the same local geometry as the same plan in WGS84. A local-metres plan is used as drawn.
/// Local geometries are 2-D: any altitude in the plan is dropped.
/// </remarks>
public sealed class PlanFrame
{
    private readonly MathTransform? toLocal;
    private readonly MathTransform? toPlan;

    private PlanFrame(PlanCoordinateSystem system, Coordinate? originLonLat, MathTransform? toLocal, MathTransform? toPlan, double? gridConvergenceDeg)
    {
        CoordinateSystem = system;
        OriginLonLat = originLonLat;
        GridConvergenceDeg = gridConvergenceDeg;
        this.toLocal = toLocal;
        this.toPlan = toPlan;
    }

    /// <summary>The frame of a plan drawn in local metres: coordinates are used as they are.</summary>
    public static PlanFrame LocalMetres { get; } = new(PlanCoordinateSystem.LocalMetres, null, null, null, null);

    /// <summary>The local frame of a site whose centre, in the plan's own coordinates, is given.</summary>
    /// <remarks>For local metres the centre is ignored and <see cref="LocalMetres"/> is returned.</remarks>
    public static PlanFrame CentredOn(PlanCoordinateSystem system, Coordinate planCentre)
    {
        if (system.IsLocalMetres)
        {
            return LocalMetres;
        }

        var transforms = new CoordinateTransformationFactory();
        var wgs84 = GeographicCoordinateSystem.WGS84;
        CoordinateSystem plan = system.UtmZone is { } zone ? Utm(zone, system.IsUtmNorth) : wgs84;
        var (lon, lat) = system.IsGeographic
            ? (planCentre.X, planCentre.Y)
            : transforms.CreateFromCoordinateSystems(plan, wgs84).MathTransform.Transform(planCentre.X, planCentre.Y);
        var local = TransverseMercator("Local metres", centralMeridianDeg: lon, latitudeOfOriginDeg: lat, scale: 1, falseEastingM: 0, falseNorthingM: 0);
        return new PlanFrame(
            system,
            new Coordinate(lon, lat),
            transforms.CreateFromCoordinateSystems(plan, local).MathTransform,
            transforms.CreateFromCoordinateSystems(local, plan).MathTransform,
            system.IsGeographic ? 0 : Convergence(transforms.CreateFromCoordinateSystems(wgs84, plan).MathTransform, lon, lat));
    }

    /// <summary>The angle from true north to the plan's own grid north at the site, in degrees, positive when grid north lies
    /// east of true north: the grid convergence of a UTM plan, 0 for WGS84, null for local metres (which has no true north).</summary>
    /// <remarks>The local frame itself has its y axis on true north at the site (a transverse Mercator centred there), so
    /// directions such as the sun's go into local metres unchanged; subtract this from a true azimuth to state it on the
    /// plan's own grid.</remarks>
    public double? GridConvergenceDeg { get; }

    /// <summary>What the plan's own coordinates mean.</summary>
    public PlanCoordinateSystem CoordinateSystem { get; }

    /// <summary>Longitude and latitude (degrees, WGS84) of the local origin; null for a local-metres plan.</summary>
    public Coordinate? OriginLonLat { get; }

    /// <summary>A plan point in local metres.</summary>
    public Coordinate ToLocal(Coordinate planPoint) => Apply(toLocal, planPoint);

    /// <summary>A local point (metres) in the plan's own coordinates.</summary>
    public Coordinate ToPlan(Coordinate localPoint) => Apply(toPlan, localPoint);

    /// <summary>A plan geometry in local metres (2-D).</summary>
    public Geometry ToLocal(Geometry planGeometry) => new Reprojection(toLocal).Transform(planGeometry);

    /// <summary>A local geometry (metres) in the plan's own coordinates (2-D), e.g. to return results.</summary>
    public Geometry ToPlan(Geometry localGeometry) => new Reprojection(toPlan).Transform(localGeometry);

    // The bearing of true north on the grid, from two points a small step apart along the meridian: no closed-form series needed.
    private static double Convergence(MathTransform lonLatToGrid, double lonDeg, double latDeg)
    {
        const double StepDeg = 1e-5;
        var (x0, y0) = lonLatToGrid.Transform(lonDeg, latDeg - StepDeg);
        var (x1, y1) = lonLatToGrid.Transform(lonDeg, latDeg + StepDeg);
        return -Math.Atan2(x1 - x0, y1 - y0) * 180 / Math.PI;
    }

    private static Coordinate Apply(MathTransform? transform, Coordinate point)
    {
        var (x, y) = transform?.Transform(point.X, point.Y) ?? (point.X, point.Y);
        return new Coordinate(x, y);
    }

    private static ProjectedCoordinateSystem Utm(int zone, bool north) =>
        TransverseMercator(
            $"WGS 84 / UTM zone {zone}{(north ? 'N' : 'S')}",
            centralMeridianDeg: (6 * zone) - 183,
            latitudeOfOriginDeg: 0,
            scale: 0.9996,
            falseEastingM: 500_000,
            falseNorthingM: north ? 0 : 10_000_000);

    private static ProjectedCoordinateSystem TransverseMercator(
        string name, double centralMeridianDeg, double latitudeOfOriginDeg, double scale, double falseEastingM, double falseNorthingM)
    {
        var factory = new CoordinateSystemFactory();
        var projection = factory.CreateProjection(name, "Transverse_Mercator",
        [
            new ProjectionParameter("latitude_of_origin", latitudeOfOriginDeg),
            new ProjectionParameter("central_meridian", centralMeridianDeg),
            new ProjectionParameter("scale_factor", scale),
            new ProjectionParameter("false_easting", falseEastingM),
            new ProjectionParameter("false_northing", falseNorthingM),
        ]);
        return factory.CreateProjectedCoordinateSystem(
            name,
            GeographicCoordinateSystem.WGS84,
            projection,
            LinearUnit.Metre,
            new AxisInfo("East", AxisOrientationEnum.East),
            new AxisInfo("North", AxisOrientationEnum.North));
    }

    /// <summary>Rebuilds a geometry with every coordinate transformed, keeping x and y only.</summary>
    private sealed class Reprojection(MathTransform? transform) : GeometryTransformer
    {
        protected override CoordinateSequence TransformCoordinates(CoordinateSequence coords, Geometry parent)
        {
            var result = Factory.CoordinateSequenceFactory.Create(coords.Count, Ordinates.XY);
            for (var i = 0; i < coords.Count; i++)
            {
                var (x, y) = transform?.Transform(coords.GetX(i), coords.GetY(i)) ?? (coords.GetX(i), coords.GetY(i));
                result.SetX(i, x);
                result.SetY(i, y);
            }

            return result;
        }
    }
}
