using NetTopologySuite.Geometries;
using SafetyMirror.Api.Requests;
using SafetyMirror.Core.Design;
using SafetyMirror.Core.Design.Evaluation;
using SafetyMirror.Core.Optics;
using SafetyMirror.Core.Site;
using static System.FormattableString;

namespace SafetyMirror.Api.Features.Evaluations;

/// <summary>Maps a Core evaluation to the response contract, geometry back in the plan's coordinates.</summary>
public static class EvaluationMapping
{
    private static readonly GeometryFactory Factory = new();

    /// <summary>The response for an evaluation of a mirror on a plan, with its glare section when one was scanned.</summary>
    public static EvaluationResponse ToResponse(this MirrorEvaluation evaluation, SitePlan plan, GlareResponse? glare = null)
    {
        var (decision, summary) = Decide(evaluation);
        return new EvaluationResponse(
            decision,
            summary,
            [.. evaluation.Verdict.Covered.Select(u => u.Id)],
            [.. evaluation.Verdict.NotCovered.Select(u => u.Id)],
            Robustness(evaluation.Robustness),
            Ref(evaluation.Eye.Feature),
            evaluation.Eye.HeightM,
            Mirror(evaluation, plan.Frame),
            [.. evaluation.Checks.Select(c => new RuleCheckResponse(c.Code, c.Description, Round(c.Value), c.Limit, c.Unit, c.Comparison, c.Passes, c.Source))],
            [.. evaluation.Approaches.Select(Approach)],
            [.. evaluation.Cautions.Select(c => new CautionResponse(c.Code, c.Text))],
            Options(evaluation.Options),
            glare);
    }

    /// <summary>The decision code and the plain sentences that state it (written once, in the Core).</summary>
    public static (string Decision, string Summary) Decide(MirrorEvaluation evaluation) => (evaluation.Verdict.Code, evaluation.Verdict.Sentence);

    private static UnseenStretchResponse Unseen(UnseenStretch u) => new(Round(u.FromM), Round(u.ToM), Round(u.LengthM), Round(u.Seconds, 100));

    private static AimCaseResponse AimCase(AimCase c) => new(c.AzimuthOffsetDeg, c.TiltOffsetDeg, c.Meets,
        double.IsFinite(c.Margin) ? Round(c.Margin) : null, c.LongestUnseen is { } u ? Unseen(u) : null, Round(c.ProvidedSightDistanceM));

    private static RobustnessResponse Robustness(AimRobustness r) => new(r.ToleranceDeg, r.Holds, AimCase(r.Worst), [.. r.Cases.Select(AimCase)]);

    private static MirrorResponse Mirror(MirrorEvaluation evaluation, PlanFrame frame)
    {
        var placement = evaluation.Placement;
        var facts = evaluation.Mirror;
        var field = facts.FieldOfView;
        var outline = field.Outline is null ? null : (Polygon)frame.ToPlan(field.Outline);
        var range = evaluation.Approaches.Max(a => a.Approach.LengthM) + facts.DistanceFromEyeM;
        return new MirrorResponse(
            Factory.CreatePoint(frame.ToPlan(new Coordinate(placement.XM, placement.YM))),
            placement.CentreHeightM,
            Round(facts.LowerEdgeHeightM),
            placement.AzimuthDeg,
            placement.TiltDownDeg,
            placement.RadiusM,
            facts.Mirror.FocalLengthM,
            (placement.Aperture as RoundAperture)?.DiameterM,
            (placement.Aperture as RectangularAperture)?.WidthM,
            (placement.Aperture as RectangularAperture)?.HeightM,
            Round(facts.DistanceFromEyeM),
            facts.EyeSeesMirror,
            RefOrNull(facts.EyeLineBlockedBy),
            new FieldOfViewResponse(outline, Math.Round(field.Outline?.Area ?? 0, 1),
                facts.VisibleFieldOfView.Outline is { } visible ? frame.ToPlan(visible) : null, Math.Round(facts.VisibleFieldOfView.AreaM2, 1), field.RaysTraced, field.RaysOnPlane, field.RaysUpward,
                field.RaysBeyondRange, field.RaysOffFace, Round(range)));
    }

    private static ApproachResponse Approach(ApproachEvaluation approach)
    {
        var s = approach.Summary;
        return new ApproachResponse(
            Ref(approach.Approach.Feature),
            approach.Approach.SpeedKmh,
            approach.Approach.GradePercent,
            Round(approach.Approach.LengthM),
            Required(approach.Required),
            RefOrNull(approach.DirectBlockedBy),
            new ApproachSummaryResponse(
                Round(s.ShownFromM),
                Round(s.ShownToM),
                approach.Required.DesignM,
                Round(approach.DirectSightDistanceM),
                Round(s.ProvidedSightDistanceM),
                s.ProvidedCutByApproachEnd,
                Round(s.NearBlindZoneM),
                s.LongestUnseen is { } longest ? Unseen(longest) : null,
                [.. s.Reach.Select(r => new ReachResponse(r.RoadUser.Id, Round(r.RecognisableToM), Round(r.DetectableToM)))],
                [.. s.Coverage.Select(c => new CoverageResponse(c.RoadUser.Id, Round(c.ShownFromM), Round(c.ShownToM), Round(c.RecognisableToM),
                    Round(c.ProvidedSightDistanceM), c.CutByApproachEnd, [.. c.Unseen.Select(Unseen)], double.IsFinite(c.Margin) ? Round(c.Margin) : null, c.Meets))],
                s.MeetsRequirement,
                s.DirectMeetsRequirement),
            [.. approach.Stations.Select(Station)]);
    }

    private static StationResponse Station(StationView v) => new(
        Round(v.StationM),
        v.RoadUser.Id,
        v.Shown,
        v.Reason switch
        {
            NotShownReason.OutsideFace => "outside-face",
            NotShownReason.NoReflection => "no-reflection",
            NotShownReason.Blocked => "blocked",
            _ => null,
        },
        v.BlockedLeg switch
        {
            BlockedLeg.EyeToMirror => "eye-to-mirror",
            BlockedLeg.MirrorToRoadUser => "mirror-to-road-user",
            _ => null,
        },
        RefOrNull(v.BlockedBy),
        Round(v.ReflectionPoint?.Z, 1000),
        Round(v.IncidenceDeg),
        Round(v.ApparentHeightArcmin),
        Round(v.ApparentWidthArcmin),
        Round(v.EquivalentDistanceM),
        Round(v.PathLengthM),
        v.Recognisable,
        v.Detectable);

    private static RequiredResponse Required(RequiredSightDistance required)
    {
        var (method, parameters) = required.Method switch
        {
            StoppingSightDistance s when s.Units == DesignUnits.UsCustomary => ("stopping", new Dictionary<string, object>
            {
                ["reactionTimeS"] = s.ReactionTimeS,
                ["decelerationFtps2"] = s.DecelerationFtps2,
            }),
            StoppingSightDistance s => ("stopping", new Dictionary<string, object>
            {
                ["reactionTimeS"] = s.ReactionTimeS,
                ["decelerationMps2"] = s.DecelerationMps2,
            }),
            IntersectionSightDistance i => ("intersection", new Dictionary<string, object>
            {
                ["maneuver"] = CornerRequestReader.Maneuvers.Single(m => m.Value == i.Maneuver).Key,
                ["aashtoCase"] = i.Maneuver switch { IntersectionManeuver.TurnAcrossTraffic => "B1", IntersectionManeuver.TurnIntoNearLane => "B2", _ => "B3" },
                ["departingVehicle"] = CornerRequestReader.Vehicles.Single(m => m.Value == i.Vehicle).Key,
                ["extraLanesCrossed"] = i.ExtraLanesCrossed,
                ["timeGapS"] = i.TimeGapS,
            }),
            FixedSightDistance f => ("fixed", new Dictionary<string, object> { ["distanceM"] = f.DistanceM }),
            _ => ("other", new Dictionary<string, object>()),
        };
        // V in the formula: mph for the US customary one, km/h for the metric one.
        if (required.UsCustomary is { } us)
        {
            parameters["speedMph"] = us.SpeedMph;
        }
        else
        {
            parameters["speedKmh"] = required.ApproachSpeedKmh;
        }

        parameters["gradePercent"] = required.GradePercent;
        return new RequiredResponse(method, required.Formula, parameters, Round(required.ComputedM),
            required.UsCustomary is null ? required.DesignM : Round(required.DesignM),
            required.EyeHeightM, required.ObjectHeightM, required.Method.Source,
            UnitsName(required.Units), required.Table, Round(required.UsCustomary?.ComputedFt), required.UsCustomary?.DesignFt);
    }

    private static string UnitsName(DesignUnits units) => CornerRequestReader.Units.Single(u => u.Value == units).Key;

    /// <summary>The contract for the evaluation options used, defaults included.</summary>
    public static OptionsResponse Options(EvaluationOptions options) => new(
        options.SightDistance switch
        {
            StoppingSightDistance => "stopping",
            IntersectionSightDistance => "intersection",
            _ => "fixed",
        },
        [.. options.RoadUsers.Select(u => new RoadUserResponse(u.Id, u.Name, u.HeightM, u.WidthM, u.LengthM, u.IsVulnerable, u.Source))],
        options.Vision.Recognition.AngleArcmin,
        options.Vision.Recognition.Source,
        options.Vision.Detection.AngleArcmin,
        options.Vision.Detection.Source,
        options.StationsM,
        options.StationSpacingM,
        options.Rules.MinimumLowerEdgeClearanceM,
        options.Rules.MaximumEyeToMirrorDistanceM,
        options.Rules.CautionAboveSpeedKmh,
        options.Rules.Source,
        options.EyeIndex,
        [.. options.Decisive.Select(u => u.Id)],
        options.MaxUnseenStretchM,
        options.AimToleranceDeg,
        options.MinMargin,
        options.DrivingSide == DrivingSide.Left ? "left" : "right",
        options.Rules.CarriagewayClearanceM,
        options.Rules.KerbOffsetM,
        UnitsName(options.SightDistance.Units));

    /// <summary>The contract for a feature reference.</summary>
    public static FeatureRefResponse Ref(FeatureReference feature) => new(feature.Index, feature.Id, feature.Name);

    private static FeatureRefResponse? RefOrNull(FeatureReference? feature) => feature is null ? null : Ref(feature);

    // Figures go out to the millimetre (or the hundredth of an arc minute): more digits would only suggest false precision.
    private static double Round(double value, double per = 1000) => Math.Round(value * per) / per;

    private static double? Round(double? value, double per = 1000) => value is { } v ? Round(v, per) : null;
}
