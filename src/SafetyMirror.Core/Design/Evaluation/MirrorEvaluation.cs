using NetTopologySuite.Geometries;
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

/// <summary>A stretch of an approach, out to the required distance, that neither the direct view nor the mirror shows recognisably.</summary>
/// <param name="FromM">Its start, metres from the conflict point.</param>
/// <param name="ToM">Its end.</param>
/// <param name="Seconds">How long a vehicle at the approach speed spends in it.</param>
public sealed record UnseenStretch(double FromM, double ToM, double Seconds)
{
    /// <summary>Its length in metres.</summary>
    public double LengthM => ToM - FromM;
}

/// <summary>How one decisive road user is covered on one approach, by the direct view and the mirror together.</summary>
/// <param name="RoadUser">The road user.</param>
/// <param name="ShownFromM">Start of the first continuous stretch the mirror shows it on; null if none.</param>
/// <param name="ShownToM">End of that stretch; null if none.</param>
/// <param name="RecognisableToM">The farthest station, from the start of that stretch, where it is recognisable; null if nowhere.</param>
/// <param name="ProvidedSightDistanceM">Sight distance the mirror provides for it: how far out the mirror keeps it shown and
/// recognisable, from where it first does, with no gap longer than allowed (the lesser of how far it is shown and how far it
/// stays recognisable); 0 if the mirror never shows it recognisably. Never the end of the drawn lane unless it reaches it.</param>
/// <param name="CutByApproachEnd">The provided distance ends where the drawn approach ends: the mirror may show farther.</param>
/// <param name="Unseen">The stretches out to the required distance seen neither directly nor recognisably in the mirror.</param>
/// <param name="Margin">Provided ÷ required distance; infinite when the direct view alone suffices.</param>
/// <param name="Meets">The direct view suffices, or no unseen stretch is longer than allowed and the margin reaches the least allowed.</param>
public sealed record UserCoverage(
    RoadUser RoadUser,
    double? ShownFromM,
    double? ShownToM,
    double? RecognisableToM,
    double ProvidedSightDistanceM,
    bool CutByApproachEnd,
    IReadOnlyList<UnseenStretch> Unseen,
    double Margin,
    bool Meets)
{
    /// <summary>The longest unseen stretch, or null when there is none.</summary>
    public UnseenStretch? LongestUnseen => Unseen.MaxBy(u => u.LengthM);
}

/// <summary>What the mirror does for one approach, summed up.</summary>
/// <param name="ShownFromM">Start of the continuous stretch the mirror shows the design road user on; null if none.</param>
/// <param name="ShownToM">End of that stretch; null if none.</param>
/// <param name="ProvidedSightDistanceM">Sight distance the mirror provides for the design road user: the lesser of how far the
/// stretch is shown and how far it stays recognisable, 0 if none.</param>
/// <param name="ProvidedCutByApproachEnd">The provided distance ends at the end of the drawn approach, so it may be more.</param>
/// <param name="NearBlindZoneM">Length from the conflict point that the mirror does not show before the stretch starts.</param>
/// <param name="Reach">Per road user, how far it stays recognisable and detectable.</param>
/// <param name="Coverage">Per decisive road user, the direct view and the mirror together against the requirement.</param>
/// <param name="MeetsRequirement">Every decisive road user is covered: no unseen stretch beyond the allowance, recognisable
/// out to the required distance (at the aim as set; the aim tolerance is judged in <see cref="MirrorEvaluation.Robustness"/>).</param>
/// <param name="DirectMeetsRequirement">The direct view alone already gives the required distance.</param>
public sealed record ApproachSummary(
    double? ShownFromM,
    double? ShownToM,
    double ProvidedSightDistanceM,
    bool ProvidedCutByApproachEnd,
    double NearBlindZoneM,
    IReadOnlyList<RoadUserReach> Reach,
    IReadOnlyList<UserCoverage> Coverage,
    bool MeetsRequirement,
    bool DirectMeetsRequirement)
{
    /// <summary>The longest unseen stretch over the decisive road users, or null when there is none.</summary>
    public UnseenStretch? LongestUnseen => Coverage.Select(c => c.LongestUnseen).OfType<UnseenStretch>().MaxBy(u => u.LengthM);

    /// <summary>The smallest margin over the decisive road users.</summary>
    public double Margin => Coverage.Min(c => c.Margin);
}

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
/// <param name="FieldOfView">What the eye sees of the road surface through the face, traced as if nothing stood in the way.</param>
/// <param name="VisibleFieldOfView">The part of that field of view no obstacle hides from the mirror.</param>
public sealed record MirrorFacts(
    ConvexMirror Mirror,
    double LowerEdgeHeightM,
    double DistanceFromEyeM,
    bool EyeSeesMirror,
    FeatureReference? EyeLineBlockedBy,
    FieldOfView FieldOfView,
    VisibleFieldOfView VisibleFieldOfView);

/// <summary>The part of the mirror's traced field of view on the road that no obstacle hides from the mirror: the traced
/// outline less the obstacles' footprints and the shadows they cast from the face's centre (see <see cref="SightShadows"/>).</summary>
/// <remarks>The shadows start at the face's centre (its vertex), where the evaluation measures the mirror from; the point
/// each road point really reflects at lies on the face, at most half its diameter away. The leg from the eye to the face
/// is not cut here: <see cref="MirrorFacts.EyeSeesMirror"/> says whether the eye sees the face at all. The outline is worked
/// out when first read, so the many evaluations a recommendation search makes and drops do not pay for it.</remarks>
public sealed class VisibleFieldOfView
{
    private readonly Lazy<Geometry?> outline;

    /// <summary>The part of the traced outline seen from the viewpoint at the target height past the obstacles.</summary>
    /// <param name="traced">The traced outline, site metres; null when the trace found none.</param>
    /// <param name="obstacles">The plan's obstacles.</param>
    /// <param name="viewpoint">The face's centre.</param>
    /// <param name="targetHeightM">Height above the road where the sightlines end.</param>
    public VisibleFieldOfView(Polygon? traced, IReadOnlyList<Obstacle> obstacles, Vec3 viewpoint, double targetHeightM)
    {
        outline = new(() => traced is null ? null : SightShadows.SeenPart(traced, obstacles, viewpoint, targetHeightM));
        ViewpointHeightM = viewpoint.Z;
        TargetHeightM = targetHeightM;
    }

    /// <summary>Polygon or MultiPolygon in site metres; null when the traced outline is null or nothing of it is seen.</summary>
    public Geometry? Outline => outline.Value;

    /// <summary>Height of the face's centre above the ground, where the sightlines to the road start.</summary>
    public double ViewpointHeightM { get; }

    /// <summary>Height above the road where they end: the design road user's centre, the point whose reflection decides
    /// whether the road user is shown.</summary>
    public double TargetHeightM { get; }

    /// <summary>Its area in square metres, 0 when nothing is seen.</summary>
    public double AreaM2 => Outline?.Area ?? 0;
}

/// <summary>One aim tried for robustness: the aim as set, or off by the tolerance one way.</summary>
/// <param name="AzimuthOffsetDeg">Azimuth error tried, degrees (positive clockwise).</param>
/// <param name="TiltOffsetDeg">Tilt error tried, degrees (positive further down).</param>
/// <param name="Meets">Every approach still meets the requirement (or needs no mirror) for every decisive road user.</param>
/// <param name="Margin">Smallest provided ÷ required over the approaches that need the mirror, and their decisive users.</param>
/// <param name="LongestUnseen">Longest unseen stretch over those, or null.</param>
/// <param name="ProvidedSightDistanceM">Smallest sight distance the mirror provides over those.</param>
public sealed record AimCase(double AzimuthOffsetDeg, double TiltOffsetDeg, bool Meets, double Margin, UnseenStretch? LongestUnseen, double ProvidedSightDistanceM);

/// <summary>How the design holds with the aim off by the tolerance, each way in azimuth and in tilt.</summary>
/// <param name="ToleranceDeg">The aim error tried.</param>
/// <param name="Cases">The aim as set, then azimuth +t, −t, tilt +t, −t.</param>
public sealed record AimRobustness(double ToleranceDeg, IReadOnlyList<AimCase> Cases)
{
    /// <summary>The requirement holds at all five aims.</summary>
    public bool Holds => Cases.All(c => c.Meets);

    /// <summary>The worst case: the smallest margin, then the longest unseen stretch.</summary>
    public AimCase Worst => Cases.OrderBy(c => c.Meets).ThenBy(c => c.Margin).ThenByDescending(c => c.LongestUnseen?.LengthM ?? 0).First();
}

/// <summary>What the evaluation decides.</summary>
public enum Decision
{
    /// <summary>The mirror meets the requirement on every approach for every decisive road user, at every aim within the
    /// tolerance, and passes every siting check.</summary>
    MeetsRequirement,

    /// <summary>The mirror falls short on some approach, for some decisive road user, or at some aim within the tolerance.</summary>
    DoesNotMeet,

    /// <summary>The mirror breaks a siting check (whatever it shows).</summary>
    OutsideSitingRules,

    /// <summary>The direct view already gives the required sight distance on every approach: no mirror is needed.</summary>
    DirectViewSuffices,
}

/// <summary>The verdict on a mirror, with what it rests on.</summary>
/// <param name="Decision">What is decided.</param>
/// <param name="Covered">The decisive road users the requirement is met for (empty unless met).</param>
/// <param name="NotCovered">Road users checked but not decisive that are not recognisable out to the required distance on some approach.</param>
/// <param name="FailedChecks">The siting checks not passed.</param>
/// <param name="Sentence">The decision in plain words, naming whom it covers.</param>
public sealed record Verdict(Decision Decision, IReadOnlyList<RoadUser> Covered, IReadOnlyList<RoadUser> NotCovered, IReadOnlyList<RuleCheck> FailedChecks, string Sentence)
{
    /// <summary>The stable kebab-case code of the decision.</summary>
    public string Code => Decision switch
    {
        Decision.MeetsRequirement => "meets-requirement",
        Decision.DoesNotMeet => "does-not-meet",
        Decision.OutsideSitingRules => "outside-siting-rules",
        _ => "direct-view-suffices",
    };
}

/// <summary>The full evaluation of one mirror on one corner.</summary>
/// <param name="Eye">The waiting driver's eye used.</param>
/// <param name="Placement">The mirror as placed.</param>
/// <param name="Mirror">Facts of the mirror on the site.</param>
/// <param name="Approaches">Each approach, evaluated.</param>
/// <param name="Checks">The siting rules checked.</param>
/// <param name="Robustness">The verdict's figures with the aim off by the tolerance.</param>
/// <param name="Verdict">What is decided, and the sentence that says it.</param>
/// <param name="Cautions">The cautions for this case.</param>
/// <param name="Options">The options used, defaults included.</param>
public sealed record MirrorEvaluation(
    Eye Eye,
    MirrorPlacement Placement,
    MirrorFacts Mirror,
    IReadOnlyList<ApproachEvaluation> Approaches,
    IReadOnlyList<RuleCheck> Checks,
    AimRobustness Robustness,
    Verdict Verdict,
    IReadOnlyList<Caution> Cautions,
    EvaluationOptions Options)
{
    /// <summary>The verdict is <see cref="Decision.MeetsRequirement"/>.</summary>
    public bool MeetsAll => Verdict.Decision == Decision.MeetsRequirement;
}

/// <summary>An evaluation, or the reasons it cannot be made.</summary>
/// <param name="Evaluation">The evaluation; null when there are problems.</param>
/// <param name="Problems">What stops it, each under the path of the offending input; empty on success.</param>
public sealed record EvaluationResult(MirrorEvaluation? Evaluation, IReadOnlyList<SitePlanProblem> Problems)
{
    /// <summary>Whether the evaluation was made.</summary>
    [System.Diagnostics.CodeAnalysis.MemberNotNullWhen(true, nameof(Evaluation))]
    public bool IsSuccess => Evaluation is not null;
}
