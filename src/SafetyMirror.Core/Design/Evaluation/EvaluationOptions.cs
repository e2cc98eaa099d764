namespace SafetyMirror.Core.Design.Evaluation;

/// <summary>How a mirror is judged on a site: the sight distance rule, who must be seen, how well, where, and the siting values.</summary>
/// <remarks>Every member has a default with a published source; a result echoes the options it used.</remarks>
public sealed record EvaluationOptions
{
    /// <summary>The rule for the sight distance each approach needs (default: AASHTO stopping sight distance).</summary>
    public SightDistanceMethod SightDistance { get; init; } = new StoppingSightDistance();

    /// <summary>The road users checked; the first is the design road user the requirement is judged on.</summary>
    public IReadOnlyList<RoadUser> RoadUsers { get; init; } = [Design.RoadUsers.PassengerCar, Design.RoadUsers.Bicycle];

    /// <summary>The recognition and detection thresholds.</summary>
    public VisionCriteria Vision { get; init; } = VisionCriteria.Default;

    /// <summary>Explicit stations to report, in metres from the conflict point; null to use <see cref="StationSpacingM"/>.</summary>
    public IReadOnlyList<double>? StationsM { get; init; }

    /// <summary>Spacing of the reported stations when none are listed, in metres, from the conflict point outward.</summary>
    public double StationSpacingM { get; init; } = 5;

    /// <summary>The siting values the mirror is checked against.</summary>
    public SitingRules Rules { get; init; } = SitingRules.Default;

    /// <summary>Which of the plan's eye points is the waiting driver's (index into the plan's eyes).</summary>
    public int EyeIndex { get; init; }

    /// <summary>Rays spread over the face to trace the field of view on the road.</summary>
    public int FieldOfViewRays { get; init; } = 1000;

    /// <summary>The road users the verdict is judged on (each must be among <see cref="RoadUsers"/>); null or empty for the design road user alone.</summary>
    public IReadOnlyList<RoadUser>? DecisiveRoadUsers { get; init; }

    /// <summary>Longest stretch, out to the required distance, that neither the direct view nor the mirror may leave unseen, in metres.</summary>
    /// <remarks>No published rule states a tolerance; the default, none, is the service's own design rule (common practice).
    /// A gap no longer than <see cref="MirrorEvaluator.NegligibleGapM"/> counts as none.</remarks>
    public double MaxUnseenStretchM { get; init; }

    /// <summary>Aim error the verdict must survive, in degrees of azimuth and of tilt, each way (common practice: 2°).</summary>
    public double AimToleranceDeg { get; init; } = 2;

    /// <summary>Least ratio of the sight distance provided (recognisable) to the required distance that every aim tried must keep.</summary>
    public double MinMargin { get; init; } = 1;

    /// <summary>Which side of the road traffic keeps to; it names the intersection manoeuvres.</summary>
    public DrivingSide DrivingSide { get; init; } = DrivingSide.Right;

    /// <summary>The design road user: the first listed.</summary>
    public RoadUser DesignRoadUser => RoadUsers[0];

    /// <summary>The road users the verdict is judged on: those named decisive, or the design road user.</summary>
    public IReadOnlyList<RoadUser> Decisive => DecisiveRoadUsers is { Count: > 0 } decisive ? decisive : [DesignRoadUser];
}
