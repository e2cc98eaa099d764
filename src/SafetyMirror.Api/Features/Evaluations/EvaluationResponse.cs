using NetTopologySuite.Geometries;

namespace SafetyMirror.Api.Features.Evaluations;

/// <summary>The feature of the plan something refers to.</summary>
/// <param name="FeatureIndex">Position in the plan's features array.</param>
/// <param name="Id">The feature's id, if it had one.</param>
/// <param name="Name">The feature's name, if it had one.</param>
public sealed record FeatureRefResponse(int FeatureIndex, string? Id, string? Name);

/// <summary>One caution, worded for the case.</summary>
/// <param name="Code">Stable kebab-case code.</param>
/// <param name="Text">The caution in one sentence.</param>
public sealed record CautionResponse(string Code, string Text);

/// <summary>One siting rule checked.</summary>
/// <param name="Code">Stable kebab-case code.</param>
/// <param name="Description">What is checked.</param>
/// <param name="Value">The value found.</param>
/// <param name="Limit">The limit.</param>
/// <param name="Unit">Unit of value and limit.</param>
/// <param name="Comparison">"at-least" or "at-most".</param>
/// <param name="Passes">Whether the value keeps within the limit.</param>
/// <param name="Source">Where the limit comes from.</param>
public sealed record RuleCheckResponse(string Code, string Description, double Value, double Limit, string Unit, string Comparison, bool Passes, string Source);

/// <summary>What the eye sees of the road surface through the face.</summary>
/// <param name="Outline">The area of the road surface the face's rays land on, plan coordinates, before obstacles; null if the mirror shows no road.</param>
/// <param name="AreaM2">Its area in square metres.</param>
/// <param name="VisibleOutline">The part of <paramref name="Outline"/> the driver actually sees: less the obstacles' footprints and the shadows they cast from the face's centre (Polygon or MultiPolygon); null if nothing is seen.</param>
/// <param name="VisibleAreaM2">Its area in square metres.</param>
/// <param name="RaysTraced">Rays traced from the eye over the face.</param>
/// <param name="RaysOnRoad">Rays that land on the road within range.</param>
/// <param name="RaysAboveHorizon">Rays reflected upward, never meeting the road.</param>
/// <param name="RaysBeyondRange">Rays landing beyond the range limit (the outline is clipped there).</param>
/// <param name="RaysOffFace">Rays that cannot reflect toward the eye.</param>
/// <param name="RangeLimitM">Horizontal distance from the mirror at which the outline is clipped.</param>
public sealed record FieldOfViewResponse(
    Polygon? Outline, double AreaM2, Geometry? VisibleOutline, double VisibleAreaM2, int RaysTraced, int RaysOnRoad, int RaysAboveHorizon, int RaysBeyondRange, int RaysOffFace, double RangeLimitM);

/// <summary>The mirror as evaluated, and its facts on the site.</summary>
/// <param name="Location">Point under the face's centre, plan coordinates.</param>
/// <param name="CentreHeightM">Height of the face's centre.</param>
/// <param name="LowerEdgeHeightM">Height of the face's lowest point.</param>
/// <param name="AzimuthDeg">Direction the face looks, clockwise from north.</param>
/// <param name="TiltDownDeg">Downward tilt of the axis.</param>
/// <param name="RadiusM">Radius of curvature.</param>
/// <param name="FocalLengthM">Focal length, R/2 (virtual, behind the face).</param>
/// <param name="DiameterM">Round face diameter, or null.</param>
/// <param name="WidthM">Rectangular face width, or null.</param>
/// <param name="HeightM">Rectangular face height, or null.</param>
/// <param name="DistanceFromEyeM">Straight distance from the driver's eye to the face's centre.</param>
/// <param name="EyeSeesMirror">The eye is in front of the face and sees its centre unobstructed.</param>
/// <param name="EyeLineBlockedBy">The obstacle that hides the mirror from the eye, if one does.</param>
/// <param name="FieldOfView">What the eye sees of the road through the face.</param>
public sealed record MirrorResponse(
    Point Location,
    double CentreHeightM,
    double LowerEdgeHeightM,
    double AzimuthDeg,
    double TiltDownDeg,
    double RadiusM,
    double FocalLengthM,
    double? DiameterM,
    double? WidthM,
    double? HeightM,
    double DistanceFromEyeM,
    bool EyeSeesMirror,
    FeatureRefResponse? EyeLineBlockedBy,
    FieldOfViewResponse FieldOfView);

/// <summary>The sight distance an approach needs, and how it was found.</summary>
/// <param name="Method">"stopping", "intersection" or "fixed".</param>
/// <param name="Formula">The formula with the values put in.</param>
/// <param name="Parameters">The method's parameters, names carrying units.</param>
/// <param name="ComputedM">The distance before rounding.</param>
/// <param name="RequiredSightDistanceM">The design value (AASHTO rounds up to the next 5 m).</param>
/// <param name="EyeHeightM">Eye height the method assumes.</param>
/// <param name="ObjectHeightM">Object height used for the direct sightline.</param>
/// <param name="Source">Where the method or value comes from, naming the unit system.</param>
/// <param name="Units">"metric" or "us-customary": the units of the formula and table that gave the requirement.</param>
/// <param name="Table">The published table the design value reproduces ("Table 3-1"); null for a fixed distance.</param>
/// <param name="ComputedFt">US customary: the distance before rounding, in feet; null for metric.</param>
/// <param name="RequiredSightDistanceFt">US customary: the design value in feet as its table gives it (up to the next 5 ft); requiredSightDistanceM is this converted exactly. Null for metric.</param>
public sealed record RequiredResponse(
    string Method, string Formula, IReadOnlyDictionary<string, object> Parameters, double ComputedM, double RequiredSightDistanceM,
    double EyeHeightM, double ObjectHeightM, string Source, string Units, string? Table, double? ComputedFt, double? RequiredSightDistanceFt);

/// <summary>One road user at one station, seen in the mirror.</summary>
/// <param name="StationM">Metres upstream from the conflict point.</param>
/// <param name="RoadUser">The road user's id.</param>
/// <param name="Shown">Shown in the mirror: its centre reflects on the face and neither leg is blocked.</param>
/// <param name="NotShownReason">"outside-face", "no-reflection" or "blocked"; null when shown.</param>
/// <param name="BlockedLeg">"eye-to-mirror" or "mirror-to-road-user" when an obstacle cuts one; else null.</param>
/// <param name="BlockedBy">The obstacle that cuts it.</param>
/// <param name="ReflectionPointHeightM">Height of the reflection point on the face; null without a reflection.</param>
/// <param name="IncidenceDeg">Incidence angle at the reflection point.</param>
/// <param name="ApparentHeightArcmin">Apparent height in the mirror; null unless shown.</param>
/// <param name="ApparentWidthArcmin">Apparent width across the lane in the mirror; null unless shown.</param>
/// <param name="EquivalentDistanceM">Distance at which it would look this tall seen directly; null unless shown.</param>
/// <param name="PathLengthM">True light path eye → mirror → road user.</param>
/// <param name="Recognisable">Its smaller apparent dimension reaches the recognition threshold.</param>
/// <param name="Detectable">Its smaller apparent dimension reaches the detection threshold.</param>
public sealed record StationResponse(
    double StationM,
    string RoadUser,
    bool Shown,
    string? NotShownReason,
    string? BlockedLeg,
    FeatureRefResponse? BlockedBy,
    double? ReflectionPointHeightM,
    double? IncidenceDeg,
    double? ApparentHeightArcmin,
    double? ApparentWidthArcmin,
    double? EquivalentDistanceM,
    double? PathLengthM,
    bool Recognisable,
    bool Detectable);

/// <summary>How far one road user stays recognisable and detectable.</summary>
/// <param name="RoadUser">The road user's id.</param>
/// <param name="RecognisableToM">Farthest station where it is recognisable; null if nowhere.</param>
/// <param name="DetectableToM">Farthest station where it is detectable; null if nowhere.</param>
public sealed record ReachResponse(string RoadUser, double? RecognisableToM, double? DetectableToM);

/// <summary>A stretch out to the required distance seen neither directly nor recognisably in the mirror.</summary>
/// <param name="FromM">Its start, metres from the conflict point.</param>
/// <param name="ToM">Its end.</param>
/// <param name="LengthM">Its length.</param>
/// <param name="Seconds">How long a vehicle at the approach speed spends in it.</param>
public sealed record UnseenStretchResponse(double FromM, double ToM, double LengthM, double Seconds);

/// <summary>How one decisive road user is covered on one approach, by the direct view and the mirror together.</summary>
/// <param name="RoadUser">The road user's id.</param>
/// <param name="ShownFromM">Start of the first stretch the mirror shows it on; null if none.</param>
/// <param name="ShownToM">End of that stretch; null if none.</param>
/// <param name="RecognisableToM">Farthest station where it is shown and recognisable; null if nowhere.</param>
/// <param name="ProvidedSightDistanceM">Sight distance the mirror provides for it: the lesser of shownToM and recognisableToM.</param>
/// <param name="ProvidedCutByApproachEnd">The provided distance ends where the drawn approach ends, so the mirror may show farther.</param>
/// <param name="Unseen">Stretches out to the required distance seen neither directly nor recognisably in the mirror.</param>
/// <param name="Margin">Provided ÷ required distance; null when the direct view alone suffices.</param>
/// <param name="Meets">The direct view suffices, or nothing longer than allowed is unseen and the margin is reached.</param>
public sealed record CoverageResponse(
    string RoadUser,
    double? ShownFromM,
    double? ShownToM,
    double? RecognisableToM,
    double ProvidedSightDistanceM,
    bool ProvidedCutByApproachEnd,
    IReadOnlyList<UnseenStretchResponse> Unseen,
    double? Margin,
    bool Meets);

/// <summary>One aim tried for robustness.</summary>
/// <param name="AzimuthOffsetDeg">Azimuth error tried (positive clockwise).</param>
/// <param name="TiltOffsetDeg">Tilt error tried (positive further down).</param>
/// <param name="Meets">Every approach still meets the requirement for every decisive road user.</param>
/// <param name="Margin">Smallest provided ÷ required distance; null when no approach needs the mirror.</param>
/// <param name="LongestUnseen">Longest unseen stretch, or null.</param>
/// <param name="ProvidedSightDistanceM">Smallest sight distance the mirror provides.</param>
public sealed record AimCaseResponse(double AzimuthOffsetDeg, double TiltOffsetDeg, bool Meets, double? Margin, UnseenStretchResponse? LongestUnseen, double ProvidedSightDistanceM);

/// <summary>The verdict's figures with the aim off by the tolerance, each way in azimuth and tilt.</summary>
/// <param name="ToleranceDeg">The aim error tried.</param>
/// <param name="Holds">The requirement holds at all five aims.</param>
/// <param name="Worst">The worst case.</param>
/// <param name="Cases">The aim as set, then azimuth +t, −t, tilt +t, −t.</param>
public sealed record RobustnessResponse(double ToleranceDeg, bool Holds, AimCaseResponse Worst, IReadOnlyList<AimCaseResponse> Cases);

/// <summary>The figures that decide for one approach.</summary>
/// <param name="ShownFromM">Start of the continuous stretch shown (design road user); null if none.</param>
/// <param name="ShownToM">End of that stretch; null if none.</param>
/// <param name="RequiredSightDistanceM">The distance required.</param>
/// <param name="DirectSightDistanceM">The distance seen directly.</param>
/// <param name="ProvidedSightDistanceM">The distance the mirror provides for the design road user: the lesser of how far the
/// stretch is shown and how far it stays recognisable, never the end of the drawn lane.</param>
/// <param name="ProvidedCutByApproachEnd">The provided distance ends where the drawn approach ends, so the mirror may show farther.</param>
/// <param name="NearBlindZoneM">Length next to the conflict point the mirror does not show.</param>
/// <param name="LongestUnseen">The longest stretch out to the required distance seen neither directly nor recognisably in the mirror,
/// over the decisive road users; null when none.</param>
/// <param name="RoadUsers">Per road user, how far it stays recognisable and detectable.</param>
/// <param name="Coverage">Per decisive road user, the direct view and the mirror together against the requirement.</param>
/// <param name="MeetsRequirement">At the aim as set: every decisive road user is covered with no unseen stretch beyond the allowance
/// and recognisable out to the required distance (the aim tolerance is judged in the evaluation's robustness).</param>
/// <param name="DirectMeetsRequirement">The direct view alone gives the required distance.</param>
public sealed record ApproachSummaryResponse(
    double? ShownFromM,
    double? ShownToM,
    double RequiredSightDistanceM,
    double DirectSightDistanceM,
    double ProvidedSightDistanceM,
    bool ProvidedCutByApproachEnd,
    double NearBlindZoneM,
    UnseenStretchResponse? LongestUnseen,
    IReadOnlyList<ReachResponse> RoadUsers,
    IReadOnlyList<CoverageResponse> Coverage,
    bool MeetsRequirement,
    bool DirectMeetsRequirement);

/// <summary>One approach, evaluated.</summary>
/// <param name="Approach">The approach feature.</param>
/// <param name="SpeedKmh">Its speed.</param>
/// <param name="GradePercent">Its grade in the direction of travel.</param>
/// <param name="LengthM">Its drawn length.</param>
/// <param name="Required">The sight distance required, with method and parameters.</param>
/// <param name="DirectBlockedBy">The obstacle that ends the direct view, if one does.</param>
/// <param name="Summary">The figures that decide.</param>
/// <param name="Stations">Each reported station and road user.</param>
public sealed record ApproachResponse(
    FeatureRefResponse Approach,
    double SpeedKmh,
    double GradePercent,
    double LengthM,
    RequiredResponse Required,
    FeatureRefResponse? DirectBlockedBy,
    ApproachSummaryResponse Summary,
    IReadOnlyList<StationResponse> Stations);

/// <summary>A road user checked, with its silhouette and source.</summary>
/// <param name="Id">Stable id.</param>
/// <param name="Name">Name.</param>
/// <param name="HeightM">Silhouette height.</param>
/// <param name="WidthM">Front width.</param>
/// <param name="LengthM">Length.</param>
/// <param name="Vulnerable">Pedestrian, cyclist or similar.</param>
/// <param name="Source">Where the dimensions come from.</param>
public sealed record RoadUserResponse(string Id, string Name, double HeightM, double WidthM, double LengthM, bool Vulnerable, string Source);

/// <summary>The options the evaluation used, defaults included.</summary>
/// <param name="SightDistanceMethod">"stopping", "intersection" or "fixed".</param>
/// <param name="RoadUsers">The road users checked; the first is the design road user.</param>
/// <param name="RecognitionArcmin">Recognition threshold.</param>
/// <param name="RecognitionSource">Its source.</param>
/// <param name="DetectionArcmin">Detection threshold.</param>
/// <param name="DetectionSource">Its source.</param>
/// <param name="StationsM">Explicit stations, or null.</param>
/// <param name="StationSpacingM">Station spacing when none are listed.</param>
/// <param name="MinimumLowerEdgeClearanceM">Siting value used.</param>
/// <param name="MaximumEyeToMirrorDistanceM">Siting value used.</param>
/// <param name="CautionAboveSpeedKmh">Siting value used.</param>
/// <param name="RulesSource">Where the siting values come from.</param>
/// <param name="EyeIndex">Which eye point was used.</param>
/// <param name="DecisiveRoadUsers">The road users the verdict is judged on.</param>
/// <param name="MaxUnseenStretchM">Longest unseen stretch allowed.</param>
/// <param name="AimToleranceDeg">Aim error the verdict must survive.</param>
/// <param name="MinMargin">Least provided ÷ required distance every aim must keep.</param>
/// <param name="DrivingSide">"right" or "left".</param>
/// <param name="CarriagewayClearanceM">Siting value used: clearance over a carriageway.</param>
/// <param name="KerbOffsetM">Siting value used: the face's least distance from the kerb.</param>
/// <param name="SightDistanceUnits">"metric" or "us-customary": the units of the sight distance formula and table.</param>
public sealed record OptionsResponse(
    string SightDistanceMethod,
    IReadOnlyList<RoadUserResponse> RoadUsers,
    double RecognitionArcmin,
    string RecognitionSource,
    double DetectionArcmin,
    string DetectionSource,
    IReadOnlyList<double>? StationsM,
    double StationSpacingM,
    double MinimumLowerEdgeClearanceM,
    double MaximumEyeToMirrorDistanceM,
    double CautionAboveSpeedKmh,
    string RulesSource,
    int EyeIndex,
    IReadOnlyList<string> DecisiveRoadUsers,
    double MaxUnseenStretchM,
    double AimToleranceDeg,
    double MinMargin,
    string DrivingSide,
    double CarriagewayClearanceM,
    double KerbOffsetM,
    string SightDistanceUnits);

/// <summary>The evaluation of one mirror on one corner.</summary>
/// <param name="Decision">"meets-requirement", "does-not-meet", "outside-siting-rules" or "direct-view-suffices".</param>
/// <param name="Summary">The decision in plain sentences, naming whom it covers (the report states the same).</param>
/// <param name="Covered">Ids of the decisive road users the requirement is met for (empty unless met).</param>
/// <param name="NotCovered">Ids of road users checked but not decisive that are not recognisable out to the required distance.</param>
/// <param name="Robustness">The verdict's figures with the aim off by the tolerance.</param>
/// <param name="Eye">The eye feature used.</param>
/// <param name="EyeHeightM">Its height.</param>
/// <param name="Mirror">The mirror and its facts.</param>
/// <param name="Checks">Siting rules checked.</param>
/// <param name="Approaches">Each approach, evaluated.</param>
/// <param name="Cautions">The cautions for this case.</param>
/// <param name="Options">The options used.</param>
/// <param name="Glare">The year's sun glare at the mirror, or why it is absent; null on a recommendation's alternatives other than the recommended design.</param>
public sealed record EvaluationResponse(
    string Decision,
    string Summary,
    IReadOnlyList<string> Covered,
    IReadOnlyList<string> NotCovered,
    RobustnessResponse Robustness,
    FeatureRefResponse Eye,
    double EyeHeightM,
    MirrorResponse Mirror,
    IReadOnlyList<RuleCheckResponse> Checks,
    IReadOnlyList<ApproachResponse> Approaches,
    IReadOnlyList<CautionResponse> Cautions,
    OptionsResponse Options,
    GlareResponse? Glare);
