using SafetyMirror.Core.Design.Evaluation;
using SafetyMirror.Core.Design.Glare;

namespace SafetyMirror.Core.Design.Recommendation;

/// <summary>What the recommendation searches over and how it ranks what it finds.</summary>
public sealed record RecommendationOptions
{
    /// <summary>How each candidate is judged (sight distance rule, road users, thresholds, siting values).</summary>
    public EvaluationOptions Evaluation { get; init; } = new();

    /// <summary>Indices (into the plan's approaches) of the approaches the mirror must serve; null for all.</summary>
    public IReadOnlyList<int>? ServedApproaches { get; init; }

    /// <summary>The mirrors that can be ordered; ranked by face area, smallest first.</summary>
    public IReadOnlyList<MirrorType> Catalogue { get; init; } = MirrorTypes.Defaults;

    /// <summary>Lowest centre height the pole allows, in metres.</summary>
    public double MinCentreHeightM { get; init; } = 2.5;

    /// <summary>Highest centre height the pole allows, in metres.</summary>
    public double MaxCentreHeightM { get; init; } = 4.0;

    /// <summary>Aim error the verdict must survive, in degrees of azimuth and of tilt (the evaluation's option).</summary>
    public double AimToleranceDeg => Evaluation.AimToleranceDeg;

    /// <summary>How many ranked alternatives to return.</summary>
    public int Alternatives { get; init; } = 3;

    /// <summary>The year's glare scan that breaks ties: on a georeferenced plan, designs that rank equal on every other term
    /// are ordered by their hours of sun glare a year, fewer first; null leaves ties in search order.</summary>
    public GlareScanOptions? GlareTieBreak { get; init; }

    /// <summary>Spacing of candidate pole positions along and across mounting zones, in metres, for the coarse pass.</summary>
    public double CandidateSpacingM { get; init; } = 3;
}
