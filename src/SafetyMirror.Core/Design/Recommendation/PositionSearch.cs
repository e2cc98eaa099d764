using NetTopologySuite.Geometries;
using SafetyMirror.Core.Design.Evaluation;
using SafetyMirror.Core.Optics;
using SafetyMirror.Core.Site;

namespace SafetyMirror.Core.Design.Recommendation;

/// <summary>One run of the search for one set of served approaches: positions coarse to fine, mirrors smallest first.</summary>
/// <remarks>
/// The quick <see cref="PlacementJudge"/> only orders positions, mirrors and aims. Whether a design meets the verdict, and
/// every figure of the alternatives returned, comes from the full evaluation (<see cref="MirrorEvaluator"/>).
/// </remarks>
internal sealed class PositionSearch
{
    /// <summary>Positions the fine pass keeps from the coarse one.</summary>
    private const int CoarseKeep = 2;

    /// <summary>A mirror that shows less than this fraction at a glance gets no aim search, unless it is the largest.</summary>
    private const double GlanceCoverageToTry = 0.5;

    /// <summary>A mirror per approach is the way when even the largest shows less than this of the approaches together.</summary>
    private const double TogetherCoverageToRefine = 0.5;

    /// <summary>Spacing of the neighbours of the best position, as a fraction of the coarse spacing.</summary>
    private const double NeighbourFraction = 1.0 / 3;

    /// <summary>Rays of the field of view traced while ranking: the verdict does not depend on it; the designs returned get the full trace.</summary>
    private const int RankingFieldOfViewRays = 9;

    private readonly SitePlan plan;
    private readonly RecommendationOptions options;
    private readonly IReadOnlyList<int> served;
    private readonly PlacementJudge judge;
    private readonly List<MirrorType> catalogue;
    private readonly List<Coordinate> positions;
    private readonly bool fixedPosition;
    private readonly CancellationToken cancellationToken;
    private readonly Dictionary<MirrorPlacement, Designed?> evaluated = [];
    private readonly Dictionary<MirrorPlacement, (DesignScore Score, double Value)> judgedRobust = [];

    public PositionSearch(SitePlan plan, RecommendationOptions options, IReadOnlyList<int> served, CancellationToken cancellationToken, Coordinate? onlyAt = null)
    {
        this.plan = plan;
        this.options = options;
        this.served = served;
        this.cancellationToken = cancellationToken;
        judge = new PlacementJudge(plan, options, served);
        catalogue = [.. options.Catalogue.OrderBy(t => t.Aperture.AreaM2).ThenBy(t => t.Id, StringComparer.Ordinal)];
        fixedPosition = onlyAt is not null;
        positions = onlyAt is { } at ? [at] : CandidatePositions.Spread(plan, judge.Eye, options);
    }

    /// <summary>Quick judgements plus full evaluations made.</summary>
    public int Evaluations => judge.Evaluations + evaluated.Count;

    public List<CandidateTried> Candidates { get; } = [];

    /// <summary>The best designs found, fully evaluated, best first.</summary>
    public List<Designed> Run()
    {
        // Coarse: rank positions by what the largest mirror that hangs there can do at and around its bisector aim.
        var coarse = positions.Select(p => LargestAt(p) is { } largest ? Glance(p, largest) : null).OfType<Trial>().ToList();
        Candidates.AddRange(coarse.Select(c => new CandidateTried(c.Position.X, c.Position.Y, c.Score, "coarse")));
        var ranked = coarse.OrderByDescending(c => c.Value).ToList();

        var found = new List<Trial>();
        if (served.Count == 1 || ranked.FirstOrDefault()?.Score.Coverage >= TogetherCoverageToRefine)
        {
            var top = ranked.Take(CoarseKeep).Select(c => c.Position).ToList();
            var fine = top.Concat(fixedPosition ? [] : top.Take(1).SelectMany(Neighbours))
                .DistinctBy(p => (Math.Round(p.X, 3), Math.Round(p.Y, 3))).ToList();
            foreach (var position in fine)
            {
                var here = SmallestThatServes(position).ToList();
                found.AddRange(here);
                if (here.OrderByDescending(t => t.Score).FirstOrDefault() is { } best)
                {
                    Candidates.Add(new CandidateTried(position.X, position.Y, best.Score, "fine"));
                }
            }
        }

        // Every design returned is fully evaluated; the quick judgement only chooses which to evaluate.
        var pool = (found.Count > 0 ? found : ranked)
            .OrderByDescending(t => t.Score.Standing == 0).ThenByDescending(t => t.Value).ThenBy(t => t.Position.X).ThenBy(t => t.Position.Y)
            .DistinctBy(t => (t.Position.X, t.Position.Y, t.Type.Id))
            .Take(options.Alternatives + 2)
            .Select(Evaluate).OfType<Designed>()
            .OrderByDescending(d => d.Score).ThenByDescending(d => d.Trial.Value).ThenBy(d => d.Trial.Position.X).ThenBy(d => d.Trial.Position.Y)
            .ToList();
        if (pool.Count == 0)
        {
            return [];
        }

        // The finished aim stands unless the full evaluation puts it in a lower standing than the aim it started from.
        var finished = Finish(pool[0]);
        if (finished.Score.Standing <= pool[0].Score.Standing)
        {
            pool[0] = finished;
        }

        // The designs returned are evaluated again with every reported station and the full field of view; the verdict and
        // its figures do not depend on either, so the ranking stands.
        return [.. pool.Take(options.Alternatives).OrderByDescending(d => d.Score)
            .Select(d => d with { Evaluation = MirrorEvaluator.EvaluateChecked(judge.ServedPlan, d.Trial.Placement, options.Evaluation, cancellationToken, plan) })];
    }

    /// <summary>Each mirror at a position, smallest first, until the full evaluation says one meets the verdict.</summary>
    private IEnumerable<Trial> SmallestThatServes(Coordinate position)
    {
        var largest = LargestAt(position);
        foreach (var type in catalogue)
        {
            cancellationToken.ThrowIfCancellationRequested();
            if (Glance(position, type) is not { } glance || (glance.Score.Coverage < GlanceCoverageToTry && type != largest))
            {
                continue;
            }

            var (placement, value) = AimTuning.Optimise(glance.Placement, JudgeRobust(glance.Placement).Value, p => JudgeRobust(p).Value);
            var trial = glance with { Placement = placement, Score = JudgeRobust(placement).Score, Value = value };
            yield return trial;
            if (trial.Score.Standing == 0 && Evaluate(trial) is { Score.Standing: 0 })
            {
                yield break; // a larger mirror here could only rank lower
            }
        }
    }

    /// <summary>The chosen design's aim finished by a compass search on the robust quick judgement, then evaluated again.</summary>
    private Designed Finish(Designed design)
    {
        var trial = design.Trial;
        var (placement, value) = AimTuning.Finish(trial.Placement, JudgeRobust(trial.Placement).Value, p => JudgeRobust(p).Value);
        return placement == trial.Placement ? design : Evaluate(trial with { Placement = placement, Value = value }) ?? design;
    }

    /// <summary>The full evaluation of a trial on the served approaches, with its score; null when the placement cannot be judged.</summary>
    private Designed? Evaluate(Trial trial)
    {
        cancellationToken.ThrowIfCancellationRequested();
        if (evaluated.TryGetValue(trial.Placement, out var known))
        {
            return known;
        }

        Designed? designed = null;
        if (CornerProblems.OfPlacement(judge.ServedPlan, trial.Placement, judge.Eye).Count == 0)
        {
            var ranking = options.Evaluation with { FieldOfViewRays = RankingFieldOfViewRays, StationsM = [] };
            var evaluation = MirrorEvaluator.EvaluateChecked(judge.ServedPlan, trial.Placement, ranking, cancellationToken, plan);
            designed = new Designed(trial, evaluation, Scoring.Of(evaluation, trial.Type.Aperture.AreaM2));
        }

        evaluated[trial.Placement] = designed;
        return designed;
    }

    /// <summary>The robust quick judgement, remembered: the aim searches come back to the same aims.</summary>
    private (DesignScore Score, double Value) JudgeRobust(MirrorPlacement placement)
    {
        if (!judgedRobust.TryGetValue(placement, out var judged))
        {
            judged = judge.JudgeRobust(placement);
            judgedRobust[placement] = judged;
        }

        return judged;
    }

    private MirrorType? LargestAt(Coordinate position) => catalogue.LastOrDefault(t => HeightAt(t, position) is not null);

    private double? HeightAt(MirrorType type, Coordinate position) =>
        MirrorRecommender.HeightFor(type, options, plan.SurfaceHeightAt(position.X, position.Y));

    private IEnumerable<Coordinate> Neighbours(Coordinate position)
    {
        var step = options.CandidateSpacingM * NeighbourFraction;
        var here = new Point(position);
        var zone = CandidatePositions.Zones(plan, options).MinBy(z => z.Distance(here))!;
        foreach (var (dx, dy) in new[] { (step, 0.0), (-step, 0.0), (0.0, step), (0.0, -step) })
        {
            var snapped = CandidatePositions.Snap(zone, new Coordinate(position.X + dx, position.Y + dy));
            if (!plan.IsInsideAnyObstacle(snapped.X, snapped.Y)
                && Vec3.HorizontalDistance(new Vec3(snapped.X, snapped.Y, 0), judge.Eye) <= options.Evaluation.Rules.MaximumEyeToMirrorDistanceM)
            {
                yield return snapped;
            }
        }
    }

    /// <summary>The best of the bisector aim and a few aims around it, by the quick judgement; null when the pole cannot carry this mirror.</summary>
    private Trial? Glance(Coordinate position, MirrorType type)
    {
        cancellationToken.ThrowIfCancellationRequested();
        if (HeightAt(type, position) is not { } height)
        {
            return null;
        }

        var (azimuth, tilt) = AimTuning.Bisector(new Vec3(position.X, position.Y, height), judge.Eye, judge.Targets);
        return AimTuning.GlanceOffsets
            .Select(d => new MirrorPlacement(position.X, position.Y, height, AimTuning.Wrap(azimuth + d.AzimuthDeg), AimTuning.Tilt(tilt + d.TiltDeg), type.RadiusM, type.Aperture))
            .Select(placement => (Placement: placement, Judged: judge.Judge(placement)))
            .Select(x => new Trial(position, type, x.Placement, x.Judged.Score, x.Judged.Value))
            .MaxBy(t => t.Value);
    }
}

/// <summary>A placement the search tried, with its quick judgement.</summary>
internal sealed record Trial(Coordinate Position, MirrorType Type, MirrorPlacement Placement, DesignScore Score, double Value);

/// <summary>A trial fully evaluated, with the score the evaluation gives it.</summary>
internal sealed record Designed(Trial Trial, MirrorEvaluation Evaluation, DesignScore Score);

/// <summary>The ranking terms of a design, from its full evaluation.</summary>
internal static class Scoring
{
    /// <summary>The score of one mirror from its full evaluation on the approaches it serves.</summary>
    public static DesignScore Of(MirrorEvaluation evaluation, double faceAreaM2)
    {
        var needing = evaluation.Approaches.Where(a => !a.Summary.DirectMeetsRequirement).ToList();
        var cases = evaluation.Robustness.Cases;
        var standing = evaluation.Verdict.Decision is Decision.MeetsRequirement or Decision.DirectViewSuffices ? 0
            : evaluation.Robustness.Holds ? 1 : 2;
        return new DesignScore(
            standing,
            needing.Count == 0 ? 1 : needing.SelectMany(a => a.Summary.Coverage).Min(c => Math.Min(1, c.Margin)),
            faceAreaM2,
            cases.Min(c => c.Margin),
            cases.Max(c => c.LongestUnseen?.LengthM ?? 0),
            needing.Count == 0 ? 0 : needing.Max(a => a.Summary.NearBlindZoneM),
            cases.Min(c => Math.Min(1, c.Margin)));
    }

    /// <summary>The robustness figures of one mirror from its full evaluation.</summary>
    public static Robustness RobustnessOf(MirrorEvaluation evaluation)
    {
        var cases = evaluation.Robustness.Cases;
        var margin = cases.Min(c => c.Margin);
        return new Robustness(evaluation.Robustness.ToleranceDeg, evaluation.Robustness.Holds, margin, Math.Min(1, margin), cases.Max(c => c.LongestUnseen?.LengthM ?? 0));
    }
}
