using System.ComponentModel;
using System.ComponentModel.DataAnnotations;
using System.Text.Json;
using System.Text.Json.Serialization;
using SafetyMirror.Api.Requests;

namespace SafetyMirror.Api.Requests;

/// <summary>How the required sight distance is fixed for each approach.</summary>
[JsonUnmappedMemberHandling(JsonUnmappedMemberHandling.Disallow)]
public sealed record SightDistanceRequest
{
    /// <summary>"stopping" (AASHTO SSD, default), "intersection" (AASHTO ISD from a stop) or "fixed" (a local code's distance).</summary>
    [Description("\"stopping\" (AASHTO stopping sight distance, the default), \"intersection\" (AASHTO intersection sight distance from a stop) or \"fixed\" (a local code's distance).")]
    [MaxLength(Ranges.MaxIdLength)]
    public string? Method { get; init; }

    /// <summary>"metric" or "us-customary": the units of the formula and design table.</summary>
    [Description("The units of the formula and design table: \"metric\" (metres and km/h, AASHTO's metric values; the default) or \"us-customary\" (feet and mph, AASHTO's US customary formula and its own tables, rounded up to the next 5 ft, not the metric value converted). A report in imperial units uses \"us-customary\" unless this says otherwise. Applies to \"stopping\" and \"intersection\"; a fixed distance is given in metres.")]
    [MaxLength(Ranges.MaxIdLength)]
    public string? Units { get; init; }

    /// <summary>Stopping: perception–reaction time, s (default 2.5).</summary>
    [Description("Stopping: perception–reaction time in seconds, 0.5 to 5 (default 2.5, AASHTO).")]
    [Range(Ranges.MinReactionTimeS, Ranges.MaxReactionTimeS)]
    public double? ReactionTimeS { get; init; }

    /// <summary>Stopping: deceleration, m/s² (default 3.4).</summary>
    [Description("Stopping with metric units: deceleration in m/s², 1 to 9.81 (default 3.4, AASHTO); give decelerationFtps2 instead with units \"us-customary\".")]
    [Range(Ranges.MinDecelerationMps2, Ranges.MaxDecelerationMps2)]
    public double? DecelerationMps2 { get; init; }

    /// <summary>Stopping, US customary: deceleration, ft/s² (default 11.2).</summary>
    [Description("Stopping with units \"us-customary\": deceleration in ft/s², 3.3 to 32.2 (default 11.2, AASHTO); give decelerationMps2 instead with metric units.")]
    [Range(Ranges.MinDecelerationFtps2, Ranges.MaxDecelerationFtps2)]
    public double? DecelerationFtps2 { get; init; }

    /// <summary>Intersection: the manoeuvre.</summary>
    [Description("Intersection: \"turn-across-traffic\" (case B1, default), \"turn-into-near-lane\" (B2) or \"crossing-from-stop\" (B3); \"left-turn-from-stop\" and \"right-turn-from-stop\" are read on options.drivingSide (a left turn crosses traffic where it keeps right).")]
    [MaxLength(Ranges.MaxIdLength)]
    public string? Maneuver { get; init; }

    /// <summary>Intersection: the departing vehicle.</summary>
    [Description("Intersection: \"passenger-car\" (default), \"single-unit-truck\" or \"combination-truck\".")]
    [MaxLength(Ranges.MaxIdLength)]
    public string? DepartingVehicle { get; init; }

    /// <summary>Intersection: extra lanes crossed.</summary>
    [Description("Intersection: lanes crossed beyond those of a two-lane road, 0 to 10 (default 0; 0 for a right turn).")]
    [Range(0, Ranges.MaxExtraLanesCrossed)]
    public int? ExtraLanesCrossed { get; init; }

    /// <summary>Fixed: the distance, m.</summary>
    [Description("Fixed: the required distance in metres, 1 to 2000.")]
    [Range(Ranges.MinFixedDistanceM, Ranges.MaxDistanceM)]
    public double? DistanceM { get; init; }

    /// <summary>Fixed: the local code it comes from.</summary>
    [Description("Fixed: the local code or document the distance comes from, at most 200 characters.")]
    [MaxLength(Ranges.MaxNameLength)]
    public string? Reference { get; init; }
}

/// <summary>A road user to check: a named design user by id, or a custom one with its silhouette.</summary>
[JsonUnmappedMemberHandling(JsonUnmappedMemberHandling.Disallow)]
public sealed record RoadUserRequest
{
    /// <summary>A design road user's id, or a custom user's own id.</summary>
    [Description("A design road user: \"passenger-car\", \"single-unit-truck\", \"city-bus\", \"bicycle\", \"motorcycle\" or \"pedestrian\". Omit it for a custom user.")]
    [MaxLength(Ranges.MaxIdLength)]
    public string? Id { get; init; }

    /// <summary>Custom: the name.</summary>
    [Description("Custom user: its name, at most 200 characters.")]
    [MaxLength(Ranges.MaxNameLength)]
    public string? Name { get; init; }

    /// <summary>Custom: silhouette height, m.</summary>
    [Description("Custom user: height of its silhouette in metres, 0.1 to 30.")]
    [Range(Ranges.MinRoadUserDimensionM, Ranges.MaxRoadUserDimensionM)]
    public double? HeightM { get; init; }

    /// <summary>Custom: silhouette width, m.</summary>
    [Description("Custom user: width of its front in metres, 0.1 to 30.")]
    [Range(Ranges.MinRoadUserDimensionM, Ranges.MaxRoadUserDimensionM)]
    public double? WidthM { get; init; }

    /// <summary>Custom: length, m.</summary>
    [Description("Custom user: length in metres, 0.1 to 30 (default: its width).")]
    [Range(Ranges.MinRoadUserDimensionM, Ranges.MaxRoadUserDimensionM)]
    public double? LengthM { get; init; }

    /// <summary>Custom: whether it is a pedestrian or cyclist.</summary>
    [Description("Custom user: true for a pedestrian, cyclist or other vulnerable road user (default false).")]
    public bool? Vulnerable { get; init; }
}

/// <summary>The siting values to check the mirror against; each defaults to the service's published example.</summary>
[JsonUnmappedMemberHandling(JsonUnmappedMemberHandling.Disallow)]
public sealed record SitingRulesRequest
{
    /// <summary>Least lower-edge height, m.</summary>
    [Description("Least height of the mirror's lower edge above footway or carriageway, metres, 0 to 6 (default 2.3, France IISR Art. 14).")]
    [Range(Ranges.MinClearanceM, Ranges.MaxClearanceM)]
    public double? MinimumLowerEdgeClearanceM { get; init; }

    /// <summary>Largest eye-to-mirror distance, m.</summary>
    [Description("Largest distance from the driver's eye to the mirror, metres, 1 to 100 (default 15, France IISR Art. 14).")]
    [Range(Ranges.MinEyeToMirrorM, Ranges.MaxEyeToMirrorM)]
    public double? MaximumEyeToMirrorDistanceM { get; init; }

    /// <summary>Speed above which a caution is given, km/h.</summary>
    [Description("Approach speed above which the result carries a speed caution and the speed check fails, km/h, 5 to 200 (default 50).")]
    [Range(Ranges.MinSpeedKmh, Ranges.MaxSpeedKmh)]
    public double? CautionAboveSpeedKmh { get; init; }

    /// <summary>Least height of a face over a carriageway, m.</summary>
    [Description("Least height above the carriageway of any part of the face that overhangs it, metres, 0 to 6 (default 5.2, US MUTCD 2009 §2A.18 overhead signs [memory]).")]
    [Range(Ranges.MinClearanceM, Ranges.MaxClearanceM)]
    public double? CarriagewayClearanceM { get; init; }

    /// <summary>Least lateral offset of the face from the kerb, m.</summary>
    [Description("Least horizontal distance from the kerb line to the face's nearest edge, metres, 0 to 5 (default 0.6, US MUTCD 2009 §2A.19 urban lateral offset [memory]).")]
    [Range(0, Ranges.MaxKerbOffsetM)]
    public double? KerbOffsetM { get; init; }

    /// <summary>Where changed values come from.</summary>
    [Description("Where the values come from, at most 200 characters; required when any value is changed.")]
    [MaxLength(Ranges.MaxNameLength)]
    public string? Source { get; init; }
}

/// <summary>How a corner is judged: the same options serve evaluations and recommendations.</summary>
/// <remarks>Not sealed: the recommendation's options add their search members to these.</remarks>
[JsonUnmappedMemberHandling(JsonUnmappedMemberHandling.Disallow)]
public record CornerOptionsRequest
{
    /// <summary>The sight distance rule.</summary>
    public SightDistanceRequest? SightDistance { get; init; }

    /// <summary>Road users to check; the first is the design road user.</summary>
    [Description("Road users to check, 1 to 10; the first is the design road user the requirement is judged on (default: passenger-car, bicycle).")]
    [MinLength(1), MaxLength(Ranges.MaxRoadUsers)]
    public IReadOnlyList<RoadUserRequest>? RoadUsers { get; init; }

    /// <summary>Recognition threshold, arcmin.</summary>
    [Description("Recognition threshold on the smaller apparent dimension, arc minutes, 0.1 to 60 (default 10: EU Directive 2006/126/EC Annex III, 0.5 decimal acuity).")]
    [Range(Ranges.MinThresholdArcmin, Ranges.MaxThresholdArcmin)]
    public double? RecognitionArcmin { get; init; }

    /// <summary>Detection threshold, arcmin.</summary>
    [Description("Detection threshold, arc minutes, 0.1 to 60 and not above recognition (default 3: FMVSS 111 S9.4).")]
    [Range(Ranges.MinThresholdArcmin, Ranges.MaxThresholdArcmin)]
    public double? DetectionArcmin { get; init; }

    /// <summary>Explicit stations, m.</summary>
    [Description("Stations to report, metres upstream from each approach's conflict point, at most 400, each 0 to 2000; stations beyond an approach's end are left out for it.")]
    [MaxLength(Ranges.MaxStations)]
    public IReadOnlyList<double>? StationsM { get; init; }

    /// <summary>Station spacing, m.</summary>
    [Description("Spacing of reported stations when none are listed, metres, 0.5 to 100 (default 5).")]
    [Range(Ranges.MinStationSpacingM, Ranges.MaxStationSpacingM)]
    public double? StationSpacingM { get; init; }

    /// <summary>Siting values.</summary>
    public SitingRulesRequest? Rules { get; init; }

    /// <summary>Road users the verdict is judged on.</summary>
    [Description("Ids of the road users (among roadUsers) the verdict is judged on, 1 to 10 (default: the design road user, the first listed). Name the bicycle too to require that a cyclist be recognisable.")]
    [MinLength(1)]
    [MaxLength(Ranges.MaxDecisiveRoadUsers)]
    public IReadOnlyList<string>? DecisiveRoadUsers { get; init; }

    /// <summary>Longest unseen stretch allowed, m.</summary>
    [Description("Longest stretch, out to the required distance, that neither the direct view nor the mirror may leave unseen, metres, 0 to 100 (default 0: none; common practice, no published source). A gap of 5 cm or less counts as none.")]
    [Range(0, Ranges.MaxUnseenStretchM)]
    public double? MaxUnseenStretchM { get; init; }

    /// <summary>Aim error the verdict must survive, degrees.</summary>
    [Description("Aim error in azimuth and in tilt, each way, that the verdict must survive, degrees, 0 to 10 (default 2, common practice: wind, vandalism and installation move the aim).")]
    [Range(0, Ranges.MaxAimToleranceDeg)]
    public double? AimToleranceDeg { get; init; }

    /// <summary>Least margin the worst aim must keep.</summary>
    [Description("Least ratio of the sight distance provided (recognisable) to the required distance that every aim within the tolerance must keep, 1 to 3 (default 1).")]
    [Range(Ranges.MinMargin, Ranges.MaxMargin)]
    public double? MinMargin { get; init; }

    /// <summary>Which side traffic keeps to.</summary>
    [MaxLength(Ranges.MaxIdLength)]
    [Description("\"right\" (default) or \"left\": the side traffic keeps to; intersection sight distance names its cases by manoeuvre, and a left or right turn is read on this side.")]
    public string? DrivingSide { get; init; }

    /// <summary>Which eye point of the plan is the driver's.</summary>
    [Description("Which of the plan's eye features is the waiting driver's, counting eye features from 0 in plan order, 0 to 499 (default 0).")]
    [Range(0, Ranges.MaxEyeIndex)]
    public int? EyeIndex { get; init; }

    /// <summary>The year the sun glare is scanned for.</summary>
    [Description("The calendar year the sun glare is scanned for on a georeferenced plan, 1900 to 2100 (default: the current year by the service's clock when the request is answered; the answer states the year used, so send it to repeat an answer exactly).")]
    [Range(Ranges.MinGlareYear, Ranges.MaxGlareYear)]
    public int? GlareYear { get; init; }

    /// <summary>Most hours of sun glare a year allowed, h.</summary>
    [Description("Most hours a year the low sun may dazzle the waiting driver by way of the mirror (reflected or behind it, the worst eye point), 0 to 8784; when exceeded the checks fail and the mirror is outside the rules (default: none, glare is reported only).")]
    [Range(0, Ranges.MaxGlareHoursPerYear)]
    public double? GlareHoursPerYearAllowed { get; init; }
}

/// <summary>The mirror to evaluate, in the plan's coordinates.</summary>
[JsonUnmappedMemberHandling(JsonUnmappedMemberHandling.Disallow)]
public sealed record MirrorRequest
{
    /// <summary>The point under the face's centre (GeoJSON Point, plan coordinates).</summary>
    [Description("GeoJSON Point under the face's centre, in the plan's coordinates.")]
    public NetTopologySuite.Geometries.Point? Location { get; init; }

    /// <summary>Centre height, m.</summary>
    [Description("Height of the face's centre above the ground, metres, 0.5 to 10.")]
    [Range(Ranges.MinCentreHeightM, Ranges.MaxCentreHeightM)]
    public double? CentreHeightM { get; init; }

    /// <summary>Azimuth, degrees.</summary>
    [Description("Direction the face looks, degrees clockwise from true north, 0 to 360 (on a projected plan, true north, not grid north).")]
    [Range(Ranges.MinAzimuthDeg, Ranges.MaxAzimuthDeg)]
    public double? AzimuthDeg { get; init; }

    /// <summary>Downward tilt, degrees.</summary>
    [Description("How far the face's axis points below horizontal, degrees, −30 to 60 (default 0).")]
    [Range(Ranges.MinTiltDownDeg, Ranges.MaxTiltDownDeg)]
    public double? TiltDownDeg { get; init; }

    /// <summary>Radius of curvature, m.</summary>
    [Description("Radius of curvature, metres, 0.3 to 50.")]
    [Range(Ranges.MinRadiusM, Ranges.MaxRadiusM)]
    public double? RadiusM { get; init; }

    /// <summary>Round face diameter, m.</summary>
    [Description("Diameter of a round face, metres, 0.1 to 3. Give this, or widthM and heightM.")]
    [Range(Ranges.MinFaceM, Ranges.MaxFaceM)]
    public double? DiameterM { get; init; }

    /// <summary>Rectangular face width, m.</summary>
    [Description("Width of a rectangular face, metres, 0.1 to 3.")]
    [Range(Ranges.MinFaceM, Ranges.MaxFaceM)]
    public double? WidthM { get; init; }

    /// <summary>Rectangular face height, m.</summary>
    [Description("Height of a rectangular face, metres, 0.1 to 3.")]
    [Range(Ranges.MinFaceM, Ranges.MaxFaceM)]
    public double? HeightM { get; init; }
}

/// <summary>A corner and one mirror to judge on it.</summary>
[JsonUnmappedMemberHandling(JsonUnmappedMemberHandling.Disallow)]
public sealed record EvaluationRequest
{
    /// <summary>The corner plan: an RFC 7946 FeatureCollection.</summary>
    [Description("The corner plan: an RFC 7946 GeoJSON FeatureCollection whose features carry properties.role (eye, approach, obstacle, mounting-zone, carriageway, footway); an approach gives its speed as speedKmh or speedMph, exactly one. WGS84 by default; a projected plan names its CRS in a top-level \"crs\" member (UTM EPSG codes); \"frame\": \"local-metres\" takes x/y in metres.")]
    public JsonElement Plan { get; init; }

    /// <summary>The mirror.</summary>
    public MirrorRequest? Mirror { get; init; }

    /// <summary>The options; every one has a default that the answer echoes.</summary>
    public CornerOptionsRequest? Options { get; init; }
}
