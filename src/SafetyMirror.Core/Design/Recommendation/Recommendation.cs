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
}

/// <summary>One mirror of a design: which type, where and how it is set, which approaches it serves, and its evaluation.</summary>
/// <param name="Type">The catalogue entry.</param>
/// <param name="Placement">Position, centre height and aim.</param>
/// <param name="ServedApproaches">Indices of the plan's approaches this mirror is for.</param>
/// <param name="Evaluation">The full evaluation of this mirror on the corner.</param>
public sealed record MirrorDesign(MirrorType Type, MirrorPlacement Placement, IReadOnlyList<int> ServedApproaches, MirrorEvaluation Evaluation);

/// <summary>How a design holds up when the aim is off by the tolerance in any direction.</summary>
/// <param name="ToleranceDeg">The aim error tried, in degrees of azimuth and tilt.</param>
/// <param name="WorstCoverage">The smallest coverage over the aims tried (1 = still meets the requirement).</param>
/// <param name="WorstApparentHeightArcmin">The smallest apparent height of the design road user at the required distance
/// over the aims tried; null where it is not shown there at some aim.</param>
public sealed record Robustness(double ToleranceDeg, double WorstCoverage, double? WorstApparentHeightArcmin);

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
public sealed record Recommendation(
    RecommendationOutcome Outcome,
    IReadOnlyList<Alternative> Alternatives,
    IReadOnlyList<CandidateTried> Candidates,
    IReadOnlyList<string> MeasuresToConsider,
    IReadOnlyList<int> ServedApproaches,
    int Evaluations);
