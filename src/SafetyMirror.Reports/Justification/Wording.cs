using System.Text.RegularExpressions;
using NetTopologySuite.Geometries;
using SafetyMirror.Core.Design;
using SafetyMirror.Core.Optics;
using SafetyMirror.Core.Site;
using static System.FormattableString;

namespace SafetyMirror.Reports.Justification;

/// <summary>How the report words the things it names: faces, methods, positions, features.</summary>
internal static partial class Wording
{
    /// <summary>"600 mm round face" or "600 × 450 mm rectangular face (width × height)".</summary>
    public static string Face(Aperture aperture) => aperture switch
    {
        RoundAperture round => Invariant($"{round.DiameterM * 1000:0} mm round face"),
        RectangularAperture r => Invariant($"{r.WidthM * 1000:0} × {r.HeightM * 1000:0} mm rectangular face (width × height)"),
        _ => "face",
    };

    /// <summary>"800 mm round, R 3.0 m" or "600 × 450 mm, R 2.2 m" (width × height): a mirror in a table cell.</summary>
    public static string MirrorShort(Aperture aperture, double radiusM) => aperture switch
    {
        RoundAperture round => Invariant($"{round.DiameterM * 1000:0} mm round, R {radiusM:0.0##} m"),
        RectangularAperture r => Invariant($"{r.WidthM * 1000:0} × {r.HeightM * 1000:0} mm, R {radiusM:0.0##} m"),
        _ => Invariant($"R {radiusM:0.0##} m"),
    };

    /// <summary>"600 mm round mirror, R 2.2 m": how an engineer names a mirror in a sentence.</summary>
    public static string Mirror(Aperture aperture, double radiusM) => aperture switch
    {
        RoundAperture round => Invariant($"{round.DiameterM * 1000:0} mm round mirror (radius of curvature {radiusM:0.0##} m)"),
        RectangularAperture r => Invariant($"{r.WidthM * 1000:0} × {r.HeightM * 1000:0} mm mirror (radius of curvature {radiusM:0.0##} m)"),
        _ => Invariant($"mirror (radius of curvature {radiusM:0.0##} m)"),
    };

    /// <summary>The method with its parameters, e.g. "AASHTO stopping sight distance, reaction time 2.5 s, deceleration 3.4 m/s²".</summary>
    public static string Method(SightDistanceMethod method, DisplayUnits units) => method switch
    {
        StoppingSightDistance { Units: DesignUnits.UsCustomary } s =>
            Invariant($"Stopping sight distance, US customary (feet, mph): reaction time {s.ReactionTimeS:0.0#} s, deceleration {s.DecelerationFtps2:0.0#} ft/s²"),
        StoppingSightDistance s => Invariant($"Stopping sight distance: reaction time {s.ReactionTimeS:0.0#} s, deceleration {units.Deceleration(s.DecelerationMps2)}"),
        IntersectionSightDistance { Units: DesignUnits.UsCustomary } i => Invariant(
            $"Intersection sight distance from a stop, US customary (feet, mph), case {Case(i.Maneuver)}: {Departing(i.Vehicle)} departing, {i.ExtraLanesCrossed} extra lane(s) crossed, time gap {i.TimeGapS:0.0#} s"),
        IntersectionSightDistance i => Invariant($"Intersection sight distance from a stop, case {Case(i.Maneuver)}: {Departing(i.Vehicle)} departing, {i.ExtraLanesCrossed} extra lane(s) crossed, time gap {i.TimeGapS:0.0#} s"),
        FixedSightDistance => "Fixed by local code",
        _ => method.GetType().Name,
    };

    /// <summary>Where a local point lies in the plan's own coordinates, written the way that system is read, optionally naming the system.</summary>
    public static string Position(PlanFrame frame, double xM, double yM, bool withSystem = true)
    {
        var p = frame.ToPlan(new Coordinate(xM, yM));
        var system = frame.CoordinateSystem;
        var (position, name) = system.IsLocalMetres
            ? (Invariant($"x {p.X:0.00} m, y {p.Y:0.00} m"), "plan coordinates, local metres")
            : system.IsGeographic
                ? (Invariant($"latitude {p.Y:0.0000000}°, longitude {p.X:0.0000000}°"), "WGS84")
                : (Invariant($"E {p.X:0.00} m, N {p.Y:0.00} m"), $"WGS 84 / UTM zone {system.UtmZone}{(system.IsUtmNorth ? "N" : "S")}, EPSG:{system.EpsgCode}");
        return withSystem ? $"{position} ({name})" : position;
    }

    /// <summary>
    /// A feature as the plan gives it: "corner-house (No. 2 Colliers Row)", its id or name alone, or for a feature with neither
    /// "unnamed obstacle, feature 4 of the plan"; never a JSON path, which a reader of the report cannot follow.
    /// </summary>
    public static string Feature(FeatureReference feature, string kind = "feature") => (feature.Id, feature.Name) switch
    {
        ({ } id, { } name) when id != name => $"{id} ({name})",
        ({ } id, _) => id,
        (_, { } name) => name,
        _ => Unnamed(feature, kind),
    };

    /// <summary>A feature by its name, or else its id, or else its place in the plan: for titles, where the id would only repeat the name.</summary>
    public static string FeatureName(FeatureReference feature, string kind = "feature") => feature.Name ?? feature.Id ?? Unnamed(feature, kind);

    private static string Unnamed(FeatureReference feature, string kind) => Invariant($"unnamed {kind}, feature {feature.Index + 1} of the plan");

    /// <summary>
    /// A sentence of the Core's, worded for the report's reader: a JSON path such as <c>features[3]</c> (the Core's last resort
    /// for a feature with neither id nor name) becomes "feature 4 of the plan", and provenance tags become plain words.
    /// </summary>
    public static string ForReader(string text) =>
        Provenance.Plain(JsonPath().Replace(text, m => Invariant($"feature {int.Parse(m.Groups[1].Value, System.Globalization.CultureInfo.InvariantCulture) + 1} of the plan")));

    /// <summary>"yes" or "no".</summary>
    public static string YesNo(bool value) => value ? "yes" : "no";

    /// <summary>A fraction as a whole percentage.</summary>
    public static string Percent(double fraction) => Invariant($"{fraction * 100:0} %");

    private static string Case(IntersectionManeuver maneuver) => maneuver switch
    {
        IntersectionManeuver.TurnAcrossTraffic => "B1 (turn across traffic)",
        IntersectionManeuver.TurnIntoNearLane => "B2 (turn into the near lane)",
        _ => "B3 (crossing)",
    };

    private static string Departing(DepartingVehicle vehicle) => vehicle switch
    {
        DepartingVehicle.PassengerCar => "passenger car",
        DepartingVehicle.SingleUnitTruck => "single-unit truck",
        _ => "combination truck",
    };

    [GeneratedRegex(@"features\[(\d+)\](\.[A-Za-z]+(\[\d+\])*)*")]
    private static partial Regex JsonPath();
}
