using SafetyMirror.Core.Design;
using SafetyMirror.Core.Design.Evaluation;

namespace SafetyMirror.Api.Requests;

/// <summary>Every range, count and length a request is held to, stated once.</summary>
/// <remarks>
/// Constants, so that the contracts carry them in <c>[Range]</c> and <c>[MaxLength]</c> attributes, which the OpenAPI
/// document states as minimum, maximum, maxLength and maxItems, while the readers check the same constants and name them
/// in their messages. Ranges that are facts of the Core (road user sizes, vision thresholds) are taken from it.
/// The plan's own limits (features, vertices, extent, lane length, zone area, text) are the Core's SitePlanLimits.
/// </remarks>
public static class Ranges
{
    /// <summary>Longest id (road user, catalogue entry, served approach), in characters.</summary>
    public const int MaxIdLength = 64;

    /// <summary>Longest name, source or reference, in characters.</summary>
    public const int MaxNameLength = 200;

    /// <summary>Longest text of a report header field, in characters.</summary>
    public const int MaxReportTextLength = 300;

    /// <summary>Lowest mirror or pole centre height, metres.</summary>
    public const double MinCentreHeightM = 0.5;

    /// <summary>Highest mirror or pole centre height, metres.</summary>
    public const double MaxCentreHeightM = 10;

    /// <summary>Smallest azimuth, degrees clockwise from true north.</summary>
    public const double MinAzimuthDeg = 0;

    /// <summary>Largest azimuth, degrees clockwise from true north.</summary>
    public const double MaxAzimuthDeg = 360;

    /// <summary>Most upward tilt (negative down-tilt), degrees.</summary>
    public const double MinTiltDownDeg = -30;

    /// <summary>Most downward tilt, degrees.</summary>
    public const double MaxTiltDownDeg = 60;

    /// <summary>Smallest radius of curvature, metres.</summary>
    public const double MinRadiusM = 0.3;

    /// <summary>Largest radius of curvature, metres.</summary>
    public const double MaxRadiusM = 50;

    /// <summary>Smallest face diameter, width or height, metres.</summary>
    public const double MinFaceM = 0.1;

    /// <summary>Largest face diameter, width or height, metres.</summary>
    public const double MaxFaceM = 3;

    /// <summary>Farthest a mirror may stand from the plan's centre, metres in each direction.</summary>
    public const double MaxMirrorOffsetM = 5000;

    /// <summary>Shortest perception–reaction time, seconds.</summary>
    public const double MinReactionTimeS = 0.5;

    /// <summary>Longest perception–reaction time, seconds.</summary>
    public const double MaxReactionTimeS = 5;

    /// <summary>Gentlest deceleration, m/s².</summary>
    public const double MinDecelerationMps2 = 1;

    /// <summary>Hardest deceleration, m/s² (1 g).</summary>
    public const double MaxDecelerationMps2 = 9.81;

    /// <summary>Gentlest deceleration in US customary units, ft/s² (about 1 m/s²).</summary>
    public const double MinDecelerationFtps2 = StoppingSightDistance.MinimumDecelerationFtps2;

    /// <summary>Hardest deceleration in US customary units, ft/s² (1 g as the customary formula takes it).</summary>
    public const double MaxDecelerationFtps2 = StoppingSightDistance.MaximumDecelerationFtps2;

    /// <summary>Most lanes crossed beyond a two-lane road.</summary>
    public const int MaxExtraLanesCrossed = IntersectionSightDistance.MaximumExtraLanes;

    /// <summary>Shortest fixed sight distance, metres.</summary>
    public const double MinFixedDistanceM = 1;

    /// <summary>Longest fixed sight distance, metres; also the farthest station.</summary>
    public const double MaxDistanceM = 2000;

    /// <summary>Most road users one request may check.</summary>
    public const int MaxRoadUsers = 10;

    /// <summary>Smallest road user dimension, metres.</summary>
    public const double MinRoadUserDimensionM = RoadUser.MinimumDimensionM;

    /// <summary>Largest road user dimension, metres.</summary>
    public const double MaxRoadUserDimensionM = RoadUser.MaximumDimensionM;

    /// <summary>Smallest detection or recognition threshold, arc minutes.</summary>
    public const double MinThresholdArcmin = VisualThreshold.MinimumArcmin;

    /// <summary>Largest detection or recognition threshold, arc minutes.</summary>
    public const double MaxThresholdArcmin = VisualThreshold.MaximumArcmin;

    /// <summary>Most stations listed.</summary>
    public const int MaxStations = MirrorEvaluator.MaxStationsPerApproach;

    /// <summary>Smallest station spacing, metres.</summary>
    public const double MinStationSpacingM = 0.5;

    /// <summary>Largest station spacing, metres.</summary>
    public const double MaxStationSpacingM = 100;

    /// <summary>Least lower-edge clearance a rule may set, metres.</summary>
    public const double MinClearanceM = 0;

    /// <summary>Most lower-edge clearance a rule may set, metres.</summary>
    public const double MaxClearanceM = SitingRules.MaximumClearanceM;

    /// <summary>Shortest largest eye-to-mirror distance a rule may set, metres.</summary>
    public const double MinEyeToMirrorM = SitingRules.MinimumEyeToMirrorDistanceLimitM;

    /// <summary>Longest largest eye-to-mirror distance a rule may set, metres.</summary>
    public const double MaxEyeToMirrorM = SitingRules.MaximumEyeToMirrorDistanceLimitM;

    /// <summary>Lowest speed a rule may name, km/h.</summary>
    public const double MinSpeedKmh = SightDistanceMethod.MinimumSpeedKmh;

    /// <summary>Highest speed a rule may name, km/h.</summary>
    public const double MaxSpeedKmh = SightDistanceMethod.MaximumSpeedKmh;

    /// <summary>Highest eye index: a plan holds at most 500 features (SitePlanLimits.MaxFeatures).</summary>
    public const int MaxEyeIndex = 499;

    /// <summary>Most served approaches listed.</summary>
    public const int MaxServedApproaches = 20;

    /// <summary>Most catalogue entries one request may list.</summary>
    public const int MaxCatalogueEntries = 20;

    /// <summary>Largest aim tolerance the verdict may be asked to survive, degrees.</summary>
    public const double MaxAimToleranceDeg = 10;

    /// <summary>Longest unseen stretch a request may allow, metres.</summary>
    public const double MaxUnseenStretchM = 100;

    /// <summary>Least margin (provided ÷ required distance) a request may ask every aim to keep.</summary>
    public const double MinMargin = 1;

    /// <summary>Greatest margin a request may ask for.</summary>
    public const double MaxMargin = 3;

    /// <summary>Largest kerb offset a request may ask of the face, metres.</summary>
    public const double MaxKerbOffsetM = SitingRules.MaximumKerbOffsetM;

    /// <summary>Most decisive road users listed: as many as road users checked.</summary>
    public const int MaxDecisiveRoadUsers = MaxRoadUsers;

    /// <summary>Most ranked alternatives one request may ask for.</summary>
    public const int MaxAlternatives = 5;

    /// <summary>Earliest year a glare scan may be asked for (NOAA's equations hold within a few centuries of 2000).</summary>
    public const int MinGlareYear = 1900;

    /// <summary>Latest year a glare scan may be asked for.</summary>
    public const int MaxGlareYear = 2100;

    /// <summary>Most hours of glare a year a limit may allow: every hour of a leap year.</summary>
    public const double MaxGlareHoursPerYear = 8784;

    /// <summary>Fewest pixels across either side of a picture of the driver's view.</summary>
    public const int MinViewSidePx = 16;

    /// <summary>Most pixels across either side of a picture of the driver's view: 1200 × 1200 is four times the default's work.</summary>
    public const int MaxViewSidePx = 1200;

    /// <summary>Narrowest field of view of a picture, degrees across.</summary>
    public const double MinFieldOfViewDeg = 0.5;

    /// <summary>Widest field of view of a picture, degrees across.</summary>
    public const double MaxFieldOfViewDeg = 120;

    /// <summary>Most road users a request may add to a picture.</summary>
    public const int MaxViewRoadUsers = 20;
}
