using SafetyMirror.Core.Optics;
using SafetyMirror.Core.Site;

namespace SafetyMirror.Core.Design.Evaluation;

/// <summary>The reasons a corner, or a mirror placed on it, cannot be judged: checked once, before any judging.</summary>
internal static class CornerProblems
{
    /// <summary>Problems of the plan with the options: an eye index out of range, approaches shorter than they must be seen.</summary>
    /// <remarks>Paths name the offending part: <c>options.eyeIndex</c>, <c>features[i].geometry</c>.</remarks>
    public static List<SitePlanProblem> Of(SitePlan plan, EvaluationOptions options)
    {
        ArgumentNullException.ThrowIfNull(plan);
        ArgumentNullException.ThrowIfNull(options);
        var problems = new List<SitePlanProblem>();
        if (options.EyeIndex < 0 || options.EyeIndex >= plan.Eyes.Length)
        {
            problems.Add(new("options.eyeIndex", $"The plan has {plan.Eyes.Length} eye point(s); eyeIndex must be from 0 to {plan.Eyes.Length - 1}."));
            return problems;
        }

        foreach (var user in options.Decisive.Where(u => !options.RoadUsers.Contains(u)))
        {
            problems.Add(new("options.decisiveRoadUsers", $"\"{user.Id}\" is not among the road users checked; list it in roadUsers too."));
        }

        foreach (var approach in plan.Approaches)
        {
            if (options.SightDistance.GradeProblem(approach.GradePercent) is { } steep)
            {
                problems.Add(new($"{approach.Feature.Path}.properties.gradePercent", $"No stopping distance exists on this downgrade: {steep} Check the grade, or the deceleration in options.sightDistance."));
                continue;
            }

            var required = options.SightDistance.Required(approach);
            if (approach.LengthM < required.DesignM)
            {
                problems.Add(new($"{approach.Feature.Path}.geometry",
                    $"The approach is {approach.LengthM:F1} m long; draw it at least as far as the required sight distance of {Math.Round(required.DesignM, 3)} m ({required.Formula}) so the mirror's reach can be judged."));
            }
        }

        return problems;
    }

    /// <summary>Problems of one placement on a plan already checked: a pole where an obstacle reaches the face, an eye inside the sphere.</summary>
    public static List<SitePlanProblem> OfPlacement(SitePlan plan, MirrorPlacement placement, Vec3 eye)
    {
        var problems = new List<SitePlanProblem>();

        // A pole may stand in a low hedge or on a wall; it may not stand where the obstacle would reach the face.
        if (plan.ObstacleContaining(placement.XM, placement.YM) is { } obstacle
            && obstacle.HeightM >= placement.CentreHeightM - placement.Aperture.CircumradiusM)
        {
            problems.Add(new("mirror.location", $"The mirror stands inside obstacle {obstacle.Feature}, which is {obstacle.HeightM} m high and would reach the face."));
        }

        if (placement.ToMirror().IsInsideSphere(eye))
        {
            problems.Add(new("mirror.location", $"The eye is within the mirror's radius of curvature ({placement.RadiusM} m) of its centre of curvature: move the mirror farther from the eye."));
        }

        return problems;
    }
}
