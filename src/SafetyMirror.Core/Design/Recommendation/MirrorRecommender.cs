using MathNet.Numerics;
using MathNet.Numerics.LinearAlgebra;
using MathNet.Numerics.Optimization;
using NetTopologySuite.Geometries;
using SafetyMirror.Core.Design.Evaluation;
using SafetyMirror.Core.Optics;
using SafetyMirror.Core.Site;
using static System.FormattableString;

namespace SafetyMirror.Core.Design.Recommendation;

/// <summary>Finds the mirror to install on a corner: where, which, how high and aimed where, ranked with the reasons.</summary>
/// <remarks>
/// Positions are searched coarse to fine: every candidate gets the largest catalogue mirror at its bisector aim (the
/// axis halfway between the eye and the required-distance point) and a few aims around it; the best positions and
/// their neighbours then get each catalogue mirror, smallest first, with the aim optimised by Nelder–Mead, until one
/// meets the requirement. Ranking follows <see cref="DesignScore"/>. When one mirror cannot serve every approach, a
/// mirror per approach is tried. No clock, no randomness: the same input gives the same answer.
/// </remarks>
public static class MirrorRecommender
{
    /// <summary>The reasons no recommendation can be made for this plan and options; empty when it can.</summary>
    public static IReadOnlyList<SitePlanProblem> Problems(SitePlan plan, RecommendationOptions options)
    {
        ArgumentNullException.ThrowIfNull(plan);
        ArgumentNullException.ThrowIfNull(options);
        var problems = new List<SitePlanProblem>();
        var evaluation = options.Evaluation;
        if (evaluation.EyeIndex < 0 || evaluation.EyeIndex >= plan.Eyes.Length)
        {
            problems.Add(new("options.eyeIndex", $"The plan has {plan.Eyes.Length} eye point(s); eyeIndex must be from 0 to {plan.Eyes.Length - 1}."));
            return problems;
        }

        foreach (var (index, i) in (options.ServedApproaches ?? []).Select((index, i) => (index, i)))
        {
            if (index < 0 || index >= plan.Approaches.Length)
            {
                problems.Add(new($"options.servedApproaches[{i}]", $"The plan has {plan.Approaches.Length} approach(es); use indices 0 to {plan.Approaches.Length - 1}."));
            }
        }

        foreach (var approach in plan.Approaches)
        {
            var required = evaluation.SightDistance.Required(approach.SpeedKmh, approach.GradePercent);
            if (approach.LengthM < required.DesignM)
            {
                problems.Add(new($"{approach.Feature.Path}.geometry",
                    $"The approach is {approach.LengthM:F1} m long; draw it at least as far as the required sight distance of {required.DesignM} m so the mirror's reach can be judged."));
            }
        }

        if (options.Catalogue.Count == 0)
        {
            problems.Add(new("options.catalogue", "The catalogue is empty: list at least one mirror."));
        }

        if (options.MinCentreHeightM > options.MaxCentreHeightM)
        {
            problems.Add(new("options.minCentreHeightM", $"The pole's lowest centre height ({options.MinCentreHeightM} m) is above its highest ({options.MaxCentreHeightM} m)."));
        }

        if (options.Catalogue.Count > 0 && options.Catalogue.All(t => HeightFor(t, options) is null))
        {
            problems.Add(new("options.maxCentreHeightM",
                $"No catalogue mirror can hang with its lower edge {evaluation.Rules.MinimumLowerEdgeClearanceM} m up and its centre at most {options.MaxCentreHeightM} m up: raise the pole's highest centre height."));
        }

        if (plan.MountingZones.Length == 0 && plan.Carriageways.Length == 0)
        {
            problems.Add(new("features",
                "Add a feature with role \"mounting-zone\" (Point, LineString or Polygon where a pole may stand) or a \"carriageway\" polygon, so pole positions can be proposed along its far edge."));
        }
        else if (problems.Count == 0 && CandidatePositions.Spread(plan, plan.Eyes[evaluation.EyeIndex].Position, options.CandidateSpacingM,
            evaluation.Rules.MaximumEyeToMirrorDistanceM).Count == 0)
        {
            problems.Add(new("features",
                $"No pole position is possible: every point of the mounting zones (or of the far kerb) is more than {evaluation.Rules.MaximumEyeToMirrorDistanceM} m from the eye or inside an obstacle."));
        }

        return problems;
    }

    /// <summary>Recommends a design; call <see cref="Problems"/> first: this throws on what it reports.</summary>
    public static Recommendation Recommend(SitePlan plan, RecommendationOptions options)
    {
        if (Problems(plan, options) is [var first, ..])
        {
            throw new ArgumentException($"{first.Path}: {first.Message}", nameof(plan));
        }

        var direct = MirrorEvaluator.DirectViews(plan, options.Evaluation);
        var served = options.ServedApproaches?.Distinct().Order().ToList()
            ?? [.. direct.Select((view, i) => (view, i)).Where(x => !x.view.MeetsRequirement).Select(x => x.i)];
        if (served.All(i => direct[i].MeetsRequirement))
        {
            var judged = served.Count > 0 ? [.. served.Select(i => direct[i])] : direct;
            return new Recommendation(RecommendationOutcome.NoMirrorNeeded, [], [], NoMirrorMeasures(judged), served, 0);
        }

        var single = new Search(plan, options, served);
        var alternatives = single.Run();
        var evaluations = single.Evaluations;
        var candidates = single.Candidates;
        var outcome = RecommendationOutcome.OneMirror;
        if (!alternatives[0].Score.MeetsRequirement && served.Count > 1)
        {
            var pair = Pairs(plan, options, served, ref evaluations, candidates);
            if (pair.Count > 0 && pair[0].Score.MeetsRequirement)
            {
                alternatives = pair;
                outcome = RecommendationOutcome.TwoMirrors;
            }
        }

        if (!alternatives[0].Score.MeetsRequirement)
        {
            outcome = RecommendationOutcome.NoMirrorServes;
        }

        return new Recommendation(outcome, alternatives, candidates, Measures(plan, direct, alternatives[0], served, options), served, evaluations);
    }

    /// <summary>The objective terms of a design over the approaches it serves (robustness not yet measured).</summary>
    public static DesignScore Score(IReadOnlyCollection<ApproachEvaluation> served, double faceAreaM2)
    {
        ArgumentNullException.ThrowIfNull(served);
        return new DesignScore(
            served.Min(Coverage),
            faceAreaM2,
            served.Min(a => (a.Summary.Reach[0].RecognisableToM ?? 0) / a.Required.DesignM),
            served.Max(a => a.Summary.NearBlindZoneM),
            double.NaN);
    }

    /// <summary>The fraction of the required distance out to which the stretch is shown and the design road user recognisable.</summary>
    public static double Coverage(ApproachEvaluation approach)
    {
        ArgumentNullException.ThrowIfNull(approach);
        var s = approach.Summary;
        var covered = s.ShownToM is { } to ? Math.Min(to, s.Reach[0].RecognisableToM ?? 0) : 0;
        return Math.Min(1, covered / approach.Required.DesignM);
    }

    /// <summary>How far above the clearance a face's lowest point is hung, in metres: room for the sag of a tilted face.</summary>
    public const double SagAllowanceM = 0.02;

    /// <summary>The lowest centre height at which a mirror's lower edge keeps the clearance, whatever the pole allows.</summary>
    public static double LowestCentreHeightM(MirrorType type, double clearanceM)
    {
        ArgumentNullException.ThrowIfNull(type);
        var halfHeight = type.Aperture switch
        {
            RectangularAperture r => r.HeightM / 2,
            _ => type.Aperture.CircumradiusM,
        };
        return clearanceM + halfHeight + SagAllowanceM;
    }

    /// <summary>The centre height the search hangs a mirror at: the lowest that keeps the clearance, within the pole's range; null if none.</summary>
    public static double? HeightFor(MirrorType type, RecommendationOptions options)
    {
        ArgumentNullException.ThrowIfNull(options);
        var height = Math.Max(options.MinCentreHeightM, LowestCentreHeightM(type, options.Evaluation.Rules.MinimumLowerEdgeClearanceM));
        return height <= options.MaxCentreHeightM ? Math.Round(height, 2) : null;
    }

    /// <summary>The aim a face takes to show the required-distance points to the eye: its axis bisects the two directions.</summary>
    public static (double AzimuthDeg, double TiltDownDeg) BisectorAim(Vec3 vertex, Vec3 eye, IEnumerable<Vec3> targets)
    {
        var toTargets = targets.Aggregate(Vec3.Zero, (sum, t) => sum + (t - vertex).Normalized()).Normalized();
        var axis = ((eye - vertex).Normalized() + toTargets).Normalized();
        var azimuth = (Angles.ToDeg(Math.Atan2(axis.X, axis.Y)) + 360) % 360;
        return (azimuth, -Angles.ToDeg(Math.Asin(Math.Clamp(axis.Z, -1, 1))));
    }

    private static List<Alternative> Pairs(SitePlan plan, RecommendationOptions options, List<int> served, ref int evaluations, List<CandidateTried> candidates)
    {
        // One mirror per approach: the best for each on its own, and the same on one pole where the first's pole serves the second.
        var perApproach = new List<Alternative>();
        foreach (var index in served)
        {
            var search = new Search(plan, options, [index]);
            perApproach.Add(search.Run()[0]);
            evaluations += search.Evaluations;
            candidates.AddRange(search.Candidates);
        }

        var pairs = new List<Alternative> { Combine(perApproach, "on separate poles where each serves its approach best") };
        if (served.Count == 2)
        {
            var pole = perApproach[0].Mirrors[0].Placement;
            var second = new Search(plan, options, [served[1]], onlyAt: new Coordinate(pole.XM, pole.YM));
            var samePole = second.Run()[0];
            evaluations += second.Evaluations;
            pairs.Add(Combine([perApproach[0], samePole], "two faces on one pole"));
        }

        return [.. pairs.OrderByDescending(p => p.Score).ThenBy(p => p.Mirrors.Select(m => (m.Placement.XM, m.Placement.YM)).Distinct().Count())];
    }

    private static Alternative Combine(List<Alternative> parts, string arrangement)
    {
        var mirrors = parts.SelectMany(p => p.Mirrors).ToList();
        var score = new DesignScore(
            parts.Min(p => p.Score.Coverage),
            parts.Sum(p => p.Score.FaceAreaM2),
            parts.Min(p => p.Score.Margin),
            parts.Max(p => p.Score.NearBlindZoneM),
            parts.Min(p => p.Score.Robustness));
        var robustness = new Robustness(parts[0].Robustness.ToleranceDeg, parts.Min(p => p.Robustness.WorstCoverage),
            parts.Any(p => p.Robustness.WorstApparentHeightArcmin is null) ? null : parts.Min(p => p.Robustness.WorstApparentHeightArcmin));
        var rationale = $"Two mirrors, {arrangement}: " + string.Join(" ", parts.Select(p => p.Rationale));
        return new Alternative(mirrors, score, robustness, rationale);
    }

    private static List<string> NoMirrorMeasures(IReadOnlyList<DirectView> direct) =>
    [
        Invariant($"No mirror is needed: the direct view gives the required sight distance on every approach to be served ({string.Join(", ", direct.Select(a => $"{a.DirectSightDistanceM:0.#} m against {a.Required.DesignM:0.#} m"))})."),
        "Keep the sight triangle clear: cut back vegetation and keep parking out of it.",
    ];

    private static List<string> Measures(SitePlan plan, IReadOnlyList<DirectView> direct, Alternative best, List<int> served, RecommendationOptions options)
    {
        var measures = new List<string>();
        var blockers = served.Select(i => direct[i].BlockedBy).OfType<FeatureReference>().Distinct().ToList();
        measures.Add(blockers.Count > 0
            ? $"Remove or lower the obstruction first: {string.Join(", ", blockers)} cuts the direct view; a mirror is a last resort."
            : "Remove or lower the obstruction first; a mirror is a last resort.");
        measures.Add("Consider moving the stop line or decision point forward, where the driver sees farther directly.");
        foreach (var index in served)
        {
            var approach = plan.Approaches[index];
            var achieved = best.Score.MeetsRequirement ? double.NaN : AchievedM(best, index);
            var requiredM = options.Evaluation.SightDistance.Required(approach.SpeedKmh, approach.GradePercent).DesignM;
            if (double.IsNaN(achieved) || achieved >= requiredM)
            {
                continue; // this approach is covered; another one falls short
            }

            var speeds = Enumerable.Range(1, (int)(approach.SpeedKmh / 5)).Select(k => approach.SpeedKmh - (5 * k)).Where(v => v >= 5);
            var lower = speeds.FirstOrDefault(v => options.Evaluation.SightDistance.Required(v, approach.GradePercent).DesignM <= achieved);
            var name = approach.Feature.Name ?? approach.Feature.Id ?? approach.Feature.Path;
            var ceiling = options.Evaluation.Rules.CautionAboveSpeedKmh;
            measures.Add(lower > 0
                ? Invariant($"Lower the speed on {name}: the best design covers {achieved:0.#} m, which meets the requirement at {lower:0} km/h or less")
                    + (lower > ceiling ? Invariant($" (still above the {ceiling:0} km/h the siting values allow for a mirror).") : ".")
                : Invariant($"On {name} the best design covers only {achieved:0.#} m: no speed limit within reach makes a mirror enough."));
        }

        return measures;
    }

    private static double AchievedM(Alternative best, int approachIndex)
    {
        var evaluation = best.Mirrors.First(m => m.ServedApproaches.Contains(approachIndex)).Evaluation;
        var approach = evaluation.Approaches[approachIndex];
        return Coverage(approach) * approach.Required.DesignM;
    }

    /// <summary>One run of the search for one set of served approaches.</summary>
    private sealed class Search
    {
        private const int CoarseKeep = 2;
        private const int AimIterations = 15;
        private const double ThinMargin = 1.1;
        private static readonly (double X, double Y)[] Compass = [(1, 0), (-1, 0), (0, 1), (0, -1), (1, 1), (-1, -1), (1, -1), (-1, 1)];

        private readonly SitePlan plan;
        private readonly RecommendationOptions options;
        private readonly List<int> served;
        private readonly PlacementJudge judge;
        private readonly List<MirrorType> catalogue;
        private readonly List<Coordinate> positions;
        private readonly bool fixedPosition;

        public Search(SitePlan plan, RecommendationOptions options, List<int> served, Coordinate? onlyAt = null)
        {
            this.plan = plan;
            this.options = options;
            this.served = served;
            judge = new PlacementJudge(plan, options, served);
            catalogue = [.. options.Catalogue.OrderBy(t => t.Aperture.AreaM2).ThenBy(t => t.Id, StringComparer.Ordinal)];
            fixedPosition = onlyAt is not null;
            positions = onlyAt is { } at ? [at] : CandidatePositions.Spread(plan, judge.Eye, options.CandidateSpacingM, options.Evaluation.Rules.MaximumEyeToMirrorDistanceM);
        }

        public int Evaluations => judge.Evaluations;

        public List<CandidateTried> Candidates { get; } = [];

        public List<Alternative> Run()
        {
            // Coarse: rank positions by what the largest mirror can do there at and around its bisector aim.
            var largest = catalogue.Last(t => HeightFor(t) is not null);
            var coarse = positions.Select(p => AimScan(p, largest)).OfType<Trial>().ToList();
            Candidates.AddRange(coarse.Select(c => new CandidateTried(c.Position.X, c.Position.Y, c.Score, "coarse")));
            var ranked = coarse.OrderByDescending(c => c.Value).ToList();

            // Where even the largest mirror shows little of the approaches together, a mirror per approach is the way:
            // the fine pass is left to the searches for one approach each.
            var found = new List<Trial>();
            if (served.Count == 1 || ranked.FirstOrDefault()?.Score.Coverage >= 0.5)
            {
                var top = ranked.Take(CoarseKeep).Select(c => c.Position).ToList();
                var fine = top.Concat(fixedPosition ? [] : top.Take(1).SelectMany(Neighbours))
                    .DistinctBy(p => (Math.Round(p.X, 3), Math.Round(p.Y, 3))).ToList();
                foreach (var position in fine)
                {
                    found.AddRange(SmallestThatServes(position));
                    if (found.Where(t => t.Position.Equals2D(position)).OrderByDescending(t => t.Score).FirstOrDefault() is { } best)
                    {
                        Candidates.Add(new CandidateTried(position.X, position.Y, best.Score, "fine"));
                    }
                }
            }

            var pool = found.Count > 0 ? found : ranked;
            var chosen = pool.OrderByDescending(t => t.Score).ThenByDescending(t => t.Value).ThenBy(t => t.Position.X).ThenBy(t => t.Position.Y)
                .DistinctBy(t => (t.Position.X, t.Position.Y, t.Type.Id)).Take(options.Alternatives).Select((t, rank) => rank == 0 ? Refined(t) : t).ToList();
            var alternatives = chosen.Select(WithRobustness).OrderByDescending(a => a.Score).ToList();
            return [.. alternatives.Select((a, rank) => a with { Rationale = Rationale(a, rank, alternatives, pool) })];
        }

        /// <summary>Each mirror at a position, smallest first, until one meets the requirement.</summary>
        private IEnumerable<Trial> SmallestThatServes(Coordinate position)
        {
            var largest = catalogue.Last(t => HeightFor(t) is not null);
            foreach (var type in catalogue)
            {
                // A mirror that shows little at its bisector aim is not worth an aim search, unless it is the last one.
                if (AimScan(position, type) is not { } glance || (glance.Score.Coverage < 0.5 && type != largest))
                {
                    continue;
                }

                var trial = Optimised(glance);
                yield return trial;
                if (trial.Score.MeetsRequirement)
                {
                    yield break; // a larger mirror here could only rank lower
                }
            }
        }

        private IEnumerable<Coordinate> Neighbours(Coordinate position)
        {
            var step = options.CandidateSpacingM / 3;
            var here = new Point(position);
            var zone = CandidatePositions.Zones(plan).MinBy(z => z.Distance(here))!;
            foreach (var (dx, dy) in new[] { (step, 0.0), (-step, 0.0), (0.0, step), (0.0, -step) })
            {
                var snapped = CandidatePositions.Snap(zone, new Coordinate(position.X + dx, position.Y + dy));
                if (!plan.IsInsideAnyObstacle(snapped.X, snapped.Y) && Distance2D(snapped, judge.Eye) <= options.Evaluation.Rules.MaximumEyeToMirrorDistanceM)
                {
                    yield return snapped;
                }
            }
        }

        /// <summary>The best of the bisector aim and four aims around it, or null when the pole cannot carry this mirror.</summary>
        private Trial? AimScan(Coordinate position, MirrorType type)
        {
            if (HeightFor(type) is not { } height)
            {
                return null;
            }

            var (azimuth, tilt) = BisectorAim(new Vec3(position.X, position.Y, height), judge.Eye, judge.Targets);
            return new[] { (0.0, 0.0), (-6.0, 0.0), (6.0, 0.0), (0.0, -4.0), (0.0, 4.0) }
                .Select(d => new MirrorPlacement(position.X, position.Y, height, Wrap(azimuth + d.Item1), Tilt(tilt + d.Item2), type.RadiusM, type.Aperture))
                .Select(placement => (Placement: placement, Judged: judge.Judge(placement)))
                .Select(x => new Trial(position, type, x.Placement, x.Judged.Score, x.Judged.Value))
                .MaxBy(t => t.Value);
        }

        /// <summary>A compass search that finishes a chosen design's aim to 0.05°, where Nelder–Mead stalls on the objective's small steps.</summary>
        private Trial Refined(Trial start)
        {
            var best = start;
            foreach (var step in new[] { 0.4, 0.2, 0.1, 0.05 })
            {
                var improved = true;
                while (improved)
                {
                    improved = false;
                    foreach (var (da, dt) in Compass)
                    {
                        var placement = best.Placement with { AzimuthDeg = Wrap(best.Placement.AzimuthDeg + (da * step)), TiltDownDeg = Tilt(best.Placement.TiltDownDeg + (dt * step)) };
                        var (score, value) = judge.Judge(placement);
                        if (value > best.Value)
                        {
                            best = best with { Placement = placement, Score = score, Value = value };
                            improved = true;
                        }
                    }
                }
            }

            return best;
        }

        /// <summary>The aim optimised by Nelder–Mead from the glance's best aim.</summary>
        private Trial Optimised(Trial start)
        {
            var best = start;
            double Objective(Vector<double> aim)
            {
                var placement = start.Placement with { AzimuthDeg = Wrap(aim[0]), TiltDownDeg = Tilt(aim[1]) };
                var (score, value) = judge.Judge(placement);
                if (value > best.Value)
                {
                    best = best with { Placement = placement, Score = score, Value = value };
                }

                return -value;
            }

            try
            {
                new NelderMeadSimplex(1e-9, AimIterations).FindMinimum(
                    ObjectiveFunction.Value(Objective),
                    Vector<double>.Build.Dense([start.Placement.AzimuthDeg, start.Placement.TiltDownDeg]),
                    Vector<double>.Build.Dense([3.0, 2.0]));
            }
            catch (MaximumIterationsException)
            {
                // The iteration budget is spent: the best aim seen so far stands.
            }

            return best;
        }

        private Alternative WithRobustness(Trial trial)
        {
            var tolerance = options.AimToleranceDeg;
            var design = options.Evaluation.DesignRoadUser;
            var worstCoverage = 1.0;
            double? worstHeight = double.PositiveInfinity;
            foreach (var (da, dt) in new[] { (tolerance, 0.0), (-tolerance, 0.0), (0.0, tolerance), (0.0, -tolerance) })
            {
                var off = trial.Placement with { AzimuthDeg = Wrap(trial.Placement.AzimuthDeg + da), TiltDownDeg = Tilt(trial.Placement.TiltDownDeg + dt) };
                worstCoverage = Math.Min(worstCoverage, judge.Judge(off).Score.Coverage);
                var viewer = new MirrorViewer(judge.ServedPlan, off.ToMirror(), judge.Eye, options.Evaluation.Vision);
                foreach (var (approach, requiredM) in judge.Required)
                {
                    var at = viewer.See(approach, Math.Min(requiredM, approach.LengthM), design);
                    worstHeight = at.ApparentHeightArcmin is { } h && worstHeight is { } w ? Math.Min(w, h) : null;
                }
            }

            var full = MirrorEvaluator.Evaluate(plan, trial.Placement, options.Evaluation);
            var score = Score([.. served.Select(i => full.Approaches[i])], trial.Type.Aperture.AreaM2) with { Robustness = worstCoverage };
            var mirror = new MirrorDesign(trial.Type, trial.Placement, served, full);
            return new Alternative([mirror], score, new Robustness(tolerance, worstCoverage, worstHeight), string.Empty);
        }

        private string Rationale(Alternative alternative, int rank, List<Alternative> ranked, List<Trial> found)
        {
            var mirror = alternative.Mirrors[0];
            var face = mirror.Type.Description;
            var user = options.Evaluation.DesignRoadUser.Name.ToLowerInvariant();
            var reach = string.Join("; ", served.Select(i =>
            {
                var a = mirror.Evaluation.Approaches[i];
                var name = a.Approach.Feature.Name ?? a.Approach.Feature.Id ?? a.Approach.Feature.Path;
                return Invariant($"on {name} it shows a {user} recognisably to {(a.Summary.Reach[0].RecognisableToM ?? 0):0.#} m against {a.Required.DesignM:0.#} m required");
            }));
            var text = alternative.Score.MeetsRequirement
                ? $"The {face} meets the requirement: {reach}."
                : $"The {face} comes closest but does not meet the requirement: {reach}.";
            if (rank == 0)
            {
                var smaller = found.Where(t => t.Type.Aperture.AreaM2 < mirror.Type.Aperture.AreaM2).OrderByDescending(t => t.Score).FirstOrDefault();
                if (alternative.Score.MeetsRequirement && smaller is not null)
                {
                    text += Invariant($" The smaller {smaller.Type.Description} reaches only {smaller.Score.Coverage:P0} of the required distance.");
                }
                else if (alternative.Score.MeetsRequirement && found.All(t => t.Type.Aperture.AreaM2 >= mirror.Type.Aperture.AreaM2))
                {
                    text += " It is the smallest mirror in the catalogue.";
                }
            }
            else
            {
                text += Invariant($" It ranks below the first on {Difference(alternative.Score, ranked[0].Score)}.");
            }

            text += Invariant($" Off its aim by {options.AimToleranceDeg:0.#}° it still covers {alternative.Robustness.WorstCoverage:P0} of the required distance.");
            if (alternative.Score.MeetsRequirement && (alternative.Score.Margin < ThinMargin || alternative.Robustness.WorstCoverage < 0.9))
            {
                text += Invariant($" Its reserve is thin (recognition distance {alternative.Score.Margin:0.00} × the required): a larger mirror, or a careful aim checked on site, gives more.");
            }

            return text;
        }

        private static string Difference(DesignScore mine, DesignScore first) =>
            Math.Abs(mine.Coverage - first.Coverage) > 1e-6 ? "coverage"
            : Math.Abs(mine.FaceAreaM2 - first.FaceAreaM2) > 1e-6 ? "face size"
            : Math.Abs(Math.Min(mine.Margin, DesignScore.MarginCap) - Math.Min(first.Margin, DesignScore.MarginCap)) > 1e-6 ? "margin of recognition distance"
            : Math.Abs(mine.NearBlindZoneM - first.NearBlindZoneM) > 1e-6 ? "near blind zone" : "robustness to aim error";

        private double? HeightFor(MirrorType type) => MirrorRecommender.HeightFor(type, options);

        private static double Distance2D(Coordinate a, Vec3 b) => Math.Sqrt(((a.X - b.X) * (a.X - b.X)) + ((a.Y - b.Y) * (a.Y - b.Y)));

        private static double Wrap(double azimuthDeg) => Math.Round(((azimuthDeg % 360) + 360) % 360, 6);

        private static double Tilt(double tiltDeg) => Math.Round(Math.Clamp(tiltDeg, -30, 60), 6);

        private sealed record Trial(Coordinate Position, MirrorType Type, MirrorPlacement Placement, DesignScore Score, double Value);
    }
}
