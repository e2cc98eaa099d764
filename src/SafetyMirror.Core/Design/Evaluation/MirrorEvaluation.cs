using SafetyMirror.Core.Optics;
using SafetyMirror.Core.Site;

namespace SafetyMirror.Core.Design.Evaluation;

/// <summary>Which leg of the light path an obstacle cuts, if one does.</summary>
public enum BlockedLeg
{
    /// <summary>Neither leg is blocked.</summary>
    None,

    /// <summary>The leg from the waiting driver's eye to the mirror.</summary>
    EyeToMirror,

    /// <summary>The leg from the mirror to the road user.</summary>
    MirrorToRoadUser,
}

/// <summary>Why a road user at a station is not shown in the mirror, if it is not.</summary>
public enum NotShownReason
{
    /// <summary>It is shown.</summary>
    None,

    /// <summary>The sphere reflects it, but outside the face.</summary>
    OutsideFace,

    /// <summary>No reflection at all: the road user is behind the mirror (or inside its sphere).</summary>
    NoReflection,

    /// <summary>An obstacle cuts one leg of the light path; see the blocked leg.</summary>
    Blocked,
}

/// <summary>One road user at one station, as the waiting driver sees it in the mirror.</summary>
/// <param name="StationM">Metres upstream from the conflict point.</param>
/// <param name="RoadUser">Who stands there, front face centred on the station, facing the direction of travel.</param>
/// <param name="Shown">Whether the reflection of its centre at half height lies on the face and neither leg is blocked.</param>
/// <param name="Reason">Why it is not shown, if not.</param>
/// <param name="BlockedLeg">Which leg an obstacle cuts, if one does.</param>
/// <param name="BlockedBy">The obstacle that cuts it.</param>
/// <param name="ReflectionPoint">Where its centre reflects on the sphere, local metres; null without a reflection.</param>
/// <param name="IncidenceDeg">Incidence angle at the reflection point, degrees.</param>
/// <param name="ApparentHeightArcmin">Angle at the eye between the images of its front's bottom-centre and top-centre; null unless shown.</param>
/// <param name="ApparentWidthArcmin">Angle at the eye between the images of its front's left and right edges at half height; null unless shown.</param>
/// <param name="EquivalentDistanceM">Distance at which its height, seen directly, would subtend the apparent height; null unless shown.</param>
/// <param name="PathLengthM">True light-path length eye → mirror → road user; null without a reflection.</param>
/// <param name="Recognisable">Shown, and its smaller apparent dimension reaches the recognition threshold.</param>
/// <param name="Detectable">Shown, and its smaller apparent dimension reaches the detection threshold.</param>
public sealed record StationView(
    double StationM,
    RoadUser RoadUser,
    bool Shown,
    NotShownReason Reason,
    BlockedLeg BlockedLeg,
    FeatureReference? BlockedBy,
    Vec3? ReflectionPoint,
    double? IncidenceDeg,
    double? ApparentHeightArcmin,
    double? ApparentWidthArcmin,
    double? EquivalentDistanceM,
    double? PathLengthM,
    bool Recognisable,
    bool Detectable)
{
    /// <summary>The smaller of the apparent height and width, in arc minutes; null unless shown.</summary>
    public double? SmallestApparentArcmin => Shown ? Math.Min(ApparentHeightArcmin!.Value, ApparentWidthArcmin!.Value) : null;
}

/// <summary>How far along an approach a road user stays recognisable in the mirror.</summary>
/// <param name="RoadUser">The road user.</param>
/// <param name="RecognisableToM">The farthest station where it is recognisable, in metres; null if nowhere.</param>
/// <param name="DetectableToM">The farthest station where it is detectable, in metres; null if nowhere.</param>
public sealed record RoadUserReach(RoadUser RoadUser, double? RecognisableToM, double? DetectableToM);

/// <summary>What the mirror does for one approach, summed up.</summary>
/// <param name="ShownFromM">Start of the continuous stretch the mirror shows the design road user on; null if none.</param>
/// <param name="ShownToM">End of that stretch; null if none.</param>
/// <param name="ProvidedSightDistanceM">Sight distance the mirror provides: the end of the shown stretch, 0 if none.</param>
/// <param name="NearBlindZoneM">Length from the conflict point that the mirror does not show before the stretch starts.</param>
/// <param name="Reach">Per road user, how far it stays recognisable and detectable.</param>
/// <param name="MeetsRequirement">The stretch reaches the required distance and the design road user is recognisable out to it.</param>
/// <param name="DirectMeetsRequirement">The direct view alone already gives the required distance.</param>
public sealed record ApproachSummary(
    double? ShownFromM,
    double? ShownToM,
    double ProvidedSightDistanceM,
    double NearBlindZoneM,
    IReadOnlyList<RoadUserReach> Reach,
    bool MeetsRequirement,
    bool DirectMeetsRequirement);

/// <summary>The evaluation of one approach.</summary>
/// <param name="Approach">The approach.</param>
/// <param name="Required">The sight distance it needs, with the method and parameters.</param>
/// <param name="DirectSightDistanceM">How far the waiting driver sees along it directly (2.5-D, object height per the method).</param>
/// <param name="DirectBlockedBy">The obstacle that ends the direct view, if one does.</param>
/// <param name="Stations">Each reported station and road user.</param>
/// <param name="Summary">The figures that decide.</param>
public sealed record ApproachEvaluation(
    Approach Approach,
    RequiredSightDistance Required,
    double DirectSightDistanceM,
    FeatureReference? DirectBlockedBy,
    IReadOnlyList<StationView> Stations,
    ApproachSummary Summary);

/// <summary>What the waiting driver sees of one approach directly, without a mirror.</summary>
/// <param name="Approach">The approach.</param>
/// <param name="Required">The sight distance it needs.</param>
/// <param name="DirectSightDistanceM">The continuous clear stretch from the conflict point (2.5-D, object height per the method).</param>
/// <param name="BlockedBy">The obstacle that ends it, if one does.</param>
public sealed record DirectView(Approach Approach, RequiredSightDistance Required, double DirectSightDistanceM, FeatureReference? BlockedBy)
{
    /// <summary>The direct view alone gives the required distance.</summary>
    public bool MeetsRequirement => DirectSightDistanceM >= Required.DesignM;
}

/// <summary>One siting rule checked: the value found, the limit, and where the limit comes from.</summary>
/// <param name="Code">Stable kebab-case code.</param>
/// <param name="Description">What is checked, in a sentence.</param>
/// <param name="Value">The value found.</param>
/// <param name="Limit">The limit it is held to.</param>
/// <param name="Unit">Unit of value and limit.</param>
/// <param name="Comparison">"at-least" or "at-most".</param>
/// <param name="Passes">Whether the value keeps within the limit.</param>
/// <param name="Source">Where the limit comes from.</param>
public sealed record RuleCheck(string Code, string Description, double Value, double Limit, string Unit, string Comparison, bool Passes, string Source);

/// <summary>Facts of the mirror itself on this site.</summary>
/// <param name="Mirror">The mirror in site metres.</param>
/// <param name="LowerEdgeHeightM">Height of the face's lowest point above the ground.</param>
/// <param name="DistanceFromEyeM">Straight distance from the waiting driver's eye to the face's centre.</param>
/// <param name="EyeSeesMirror">The eye is in front of the face and no obstacle cuts the line to its centre.</param>
/// <param name="EyeLineBlockedBy">The obstacle that hides the mirror from the eye, if one does.</param>
/// <param name="FieldOfView">What the eye sees of the road surface through the face.</param>
public sealed record MirrorFacts(
    ConvexMirror Mirror,
    double LowerEdgeHeightM,
    double DistanceFromEyeM,
    bool EyeSeesMirror,
    FeatureReference? EyeLineBlockedBy,
    FieldOfView FieldOfView);

/// <summary>The full evaluation of one mirror on one corner.</summary>
/// <param name="Eye">The waiting driver's eye used.</param>
/// <param name="Placement">The mirror as placed.</param>
/// <param name="Mirror">Facts of the mirror on the site.</param>
/// <param name="Approaches">Each approach, evaluated.</param>
/// <param name="Checks">The siting rules checked.</param>
/// <param name="Cautions">The cautions for this case.</param>
/// <param name="Options">The options used, defaults included.</param>
public sealed record MirrorEvaluation(
    Eye Eye,
    MirrorPlacement Placement,
    MirrorFacts Mirror,
    IReadOnlyList<ApproachEvaluation> Approaches,
    IReadOnlyList<RuleCheck> Checks,
    IReadOnlyList<Caution> Cautions,
    EvaluationOptions Options)
{
    /// <summary>Every approach meets its requirement through the mirror (or directly), and every rule passes.</summary>
    public bool MeetsAll => Approaches.All(a => a.Summary.MeetsRequirement || a.Summary.DirectMeetsRequirement) && Checks.All(c => c.Passes);
}
