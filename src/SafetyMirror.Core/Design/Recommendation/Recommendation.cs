using SafetyMirror.Core.Design.Evaluation;

namespace SafetyMirror.Core.Design.Recommendation;

/// <summary>What the recommendation concludes.</summary>
public enum RecommendationOutcome
{
    /// <summary>The direct view already gives the required sight distance on every served approach.</summary>
    NoMirrorNeeded,

    /// <summary>One mirror serves every served approach.</summary>
    OneMirror,

    /// <summary>Two mirrors are needed, one per approach (on one pole or two).</summary>
    TwoMirrors,

    /// <summary>No design in the search meets the requirement; the best achieved is reported.</summary>
    NoMirrorServes,

    /// <summary>The best design's view would do, but it breaks a siting check (the approach speed, a clearance…); what would bring it
    /// inside the rules is listed.</summary>
    OutsideSitingRules,
}

/// <summary>One mirror of a design: which type, where and how it is set, which approaches it serves, and its evaluation.</summary>
/// <param name="Type">The catalogue entry.</param>
/// <param name="Placement">Position, centre height and aim.</param>
/// <param name="ServedApproaches">Indices of the plan's approaches this mirror is for.</param>
/// <param name="Evaluation">The full evaluation of this mirror on the approaches it serves.</param>
public sealed record MirrorDesign(MirrorType Type, MirrorPlacement Placement, IReadOnlyList<int> ServedApproaches, MirrorEvaluation Evaluation);

/// <summary>How a design holds up when the aim is off by the tolerance in any direction, from the full evaluations.</summary>
/// <param name="ToleranceDeg">The aim error tried, in degrees of azimuth and tilt.</param>
/// <param name="Holds">The requirement holds at every aim tried, on every served approach.</param>
/// <param name="WorstMargin">The smallest provided ÷ required distance over the aims tried.</param>
/// <param name="WorstCoverage">The same, capped at 1 (1 = still meets the required distance).</param>
/// <param name="LongestUnseenM">The longest unseen stretch over the aims tried, in metres (0 if none).</param>
public sealed record Robustness(double ToleranceDeg, bool Holds, double WorstMargin, double WorstCoverage, double LongestUnseenM);

/// <summary>One ranked design: one mirror or two.</summary>
/// <param name="Mirrors">The mirrors.</param>
/// <param name="Score">The objective terms.</param>
/// <param name="Robustness">How it holds up under aim error.</param>
/// <param name="Rationale">Why it ranks where it does, in plain language.</param>
public sealed record Alternative(IReadOnlyList<MirrorDesign> Mirrors, DesignScore Score, Robustness Robustness, string Rationale);

/// <summary>A pole position the search tried, with the best it found there.</summary>
/// <param name="XM">Local x.</param>
/// <param name="YM">Local y.</param>
/// <param name="Score">The best score found at this position (coarse pass with the largest mirror, or fine pass).</param>
/// <param name="Stage">"coarse" or "fine".</param>
public sealed record CandidateTried(double XM, double YM, DesignScore Score, string Stage);

/// <summary>The answer of the recommendation search.</summary>
/// <param name="Outcome">What it concludes.</param>
/// <param name="Alternatives">Ranked designs, best first (empty when no mirror is needed).</param>
/// <param name="Candidates">Every pole position tried, with its score.</param>
/// <param name="MeasuresToConsider">What to do first or instead, in plain language (always includes removing the obstruction).</param>
/// <param name="ServedApproaches">Indices of the approaches the search had to serve.</param>
/// <param name="Evaluations">How many candidate evaluations the search made.</param>
/// <param name="Summary">The outcome in plain words, naming whom it covers (the same sentence the report states).</param>
public sealed record Recommendation(
    RecommendationOutcome Outcome,
    IReadOnlyList<Alternative> Alternatives,
    IReadOnlyList<CandidateTried> Candidates,
    IReadOnlyList<string> MeasuresToConsider,
    IReadOnlyList<int> ServedApproaches,
    int Evaluations,
    string Summary);

/// <summary>A recommendation, or the reasons it cannot be made.</summary>
/// <param name="Recommendation">The recommendation; null when there are problems.</param>
/// <param name="Problems">What stops it, each under the path of the offending input; empty on success.</param>
public sealed record RecommendationResult(Recommendation? Recommendation, IReadOnlyList<SafetyMirror.Core.Site.SitePlanProblem> Problems)
{
    /// <summary>Whether the recommendation was made.</summary>
    [System.Diagnostics.CodeAnalysis.MemberNotNullWhen(true, nameof(Recommendation))]
    public bool IsSuccess => Recommendation is not null;
}
