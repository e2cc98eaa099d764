using SafetyMirror.Core.Design;
using SafetyMirror.Core.Design.Evaluation;
using SafetyMirror.Core.Optics;
using SafetyMirror.Core.Site;

namespace SafetyMirror.Core.View;

/// <summary>A picture of the driver's view, or the reasons it cannot be made.</summary>
/// <param name="Picture">The picture; null when there are problems.</param>
/// <param name="Problems">What stops it, each under the path of the offending input; empty on success.</param>
public sealed record DriverViewResult(ViewPicture? Picture, IReadOnlyList<SitePlanProblem> Problems)
{
    /// <summary>Whether the picture was made.</summary>
    [System.Diagnostics.CodeAnalysis.MemberNotNullWhen(true, nameof(Picture))]
    public bool IsSuccess => Picture is not null;
}

/// <summary>What the waiting driver sees: the mirror face, exactly reflected, in its surroundings seen directly.</summary>
/// <remarks>
/// A pin-hole picture from the eye toward the face's centre. Each pixel's eye ray is traced: where it meets the face it is
/// reflected there by the law of reflection (<see cref="ConvexMirror.TraceRay"/>, no paraxial formula) and continues into the
/// scene; where it meets the backing board it is dark; elsewhere it goes on into the scene directly. The scene is the plan in
/// 3-D (<see cref="ViewScene"/>) with the design road user standing at the required sight distance on every approach, as the
/// evaluation places it, and any road users the caller adds.
/// </remarks>
public static class DriverView
{
    /// <summary>The backing board's margin round the face, in metres (common practice: a dark board a hand's width wider than the face).</summary>
    public const double BoardMarginM = 0.10;

    /// <summary>Width of the face's rim drawn round its edge, in metres (common practice: the frame's lip over the face).</summary>
    public const double RimWidthM = 0.02;

    /// <summary>Without a stated field of view, the picture spans this many times the board's angular width.</summary>
    public const double FramingFactor = 1.6;

    /// <summary>Least horizontal distance from the eye to the face's centre for a picture to have an up, in metres.</summary>
    public const double MinEyeToMirrorAcrossM = 0.01;

    /// <summary>Most pixels across either side of a picture.</summary>
    public const int MaxSidePx = 4096;

    /// <summary>Renders the view of the mirror placed on the plan, or says why it cannot.</summary>
    /// <remarks>Problem paths name the offending part: <c>mirror.location</c>, <c>options.eyeIndex</c>,
    /// <c>view.roadUsers[i].stationM</c>, <c>features[i].geometry</c>.</remarks>
    public static DriverViewResult Render(SitePlan plan, MirrorPlacement placement, EvaluationOptions options, ViewOptions view, CancellationToken cancellationToken = default)
    {
        ArgumentNullException.ThrowIfNull(plan);
        ArgumentNullException.ThrowIfNull(placement);
        ArgumentNullException.ThrowIfNull(options);
        ArgumentNullException.ThrowIfNull(view);
        Preconditions.InRange(view.WidthPx, 1, MaxSidePx, "pixels");
        Preconditions.InRange(view.HeightPx, 1, MaxSidePx, "pixels");
        var problems = CornerProblems.Of(plan, options);
        if (problems.Count == 0)
        {
            var eye = plan.Eyes[options.EyeIndex].Position;
            problems.AddRange(CornerProblems.OfPlacement(plan, placement, eye));
            if (Vec3.HorizontalDistance(eye, placement.ToMirror().Vertex) < MinEyeToMirrorAcrossM)
            {
                problems.Add(new("mirror.location", $"The mirror stands straight above or below the eye (less than {MinEyeToMirrorAcrossM} m across from it): a picture looking at it would have no up."));
            }
        }

        problems.AddRange(ExtraProblems(plan, view.ExtraRoadUsers));
        if (problems.Count > 0)
        {
            return new DriverViewResult(null, problems);
        }

        var mirror = placement.ToMirror();
        var eyePosition = plan.Eyes[options.EyeIndex].Position;
        var camera = new ViewCamera(eyePosition, mirror.Vertex, view.WidthPx, view.HeightPx, view.FieldOfViewDeg ?? FramingOf(mirror, eyePosition));
        var scene = new ViewScene(plan, RoadUsersOf(plan, options, view.ExtraRoadUsers), PoleOf(mirror));
        return new DriverViewResult(new MirrorRenderer(camera, mirror, scene).Render(cancellationToken), []);
    }

    /// <summary>The field of view, in degrees, that frames the backing board with room round it.</summary>
    public static double FramingOf(ConvexMirror mirror, Vec3 eye)
    {
        ArgumentNullException.ThrowIfNull(mirror);
        var boardRadiusM = mirror.Aperture.CircumradiusM + BoardMarginM;
        var halfAngle = Math.Atan(boardRadiusM / Vec3.Distance(eye, mirror.Vertex));
        return Math.Min(120, Angles.ToDeg(2 * halfAngle * FramingFactor));
    }

    /// <summary>The pole: behind the board's centre, clear of the face and the board however they tilt, up to halfway down the face,
    /// so that the board hides its top.</summary>
    private static (double XM, double YM, double TopM) PoleOf(ConvexMirror mirror)
    {
        var rimM = mirror.Aperture.CircumradiusM;
        var sagM = mirror.RadiusM - Math.Sqrt((mirror.RadiusM * mirror.RadiusM) - (rimM * rimM));
        var tiltReachM = (rimM + BoardMarginM) * Math.Abs(mirror.Normal.Z); // how far the board's edge leans back
        var depthM = sagM + tiltReachM + ViewScene.PoleSideM + 0.05;
        var behind = mirror.Vertex - (depthM * new Vec3(mirror.Normal.X, mirror.Normal.Y, 0).Normalized());
        return (behind.X, behind.Y, mirror.Vertex.Z - (rimM / 2));
    }

    /// <summary>The design road user at the required sight distance on every approach (at its end when shorter), then the extras.</summary>
    private static List<PlacedRoadUser> RoadUsersOf(SitePlan plan, EvaluationOptions options, IReadOnlyList<RoadUserAtStation> extras)
    {
        var design = options.DesignRoadUser;
        var placed = plan.Approaches.Select((approach, i) =>
        {
            var requiredM = options.SightDistance.Required(approach.SpeedKmh, approach.GradePercent).DesignM;
            return new PlacedRoadUser(i, approach.PointAtStation(Math.Min(requiredM, approach.LengthM)), design, AtRequiredDistance: true);
        }).ToList();
        placed.AddRange(extras.Select(e => new PlacedRoadUser(e.ApproachIndex, plan.Approaches[e.ApproachIndex].PointAtStation(e.StationM), e.RoadUser, AtRequiredDistance: false)));
        return placed;
    }

    private static IEnumerable<SitePlanProblem> ExtraProblems(SitePlan plan, IReadOnlyList<RoadUserAtStation> extras)
    {
        for (var i = 0; i < extras.Count; i++)
        {
            var extra = extras[i];
            if (extra.ApproachIndex < 0 || extra.ApproachIndex >= plan.Approaches.Length)
            {
                yield return new($"view.roadUsers[{i}].approach", $"The plan has {plan.Approaches.Length} approach(es); this names none of them.");
            }
            else if (!(extra.StationM >= 0 && extra.StationM <= plan.Approaches[extra.ApproachIndex].LengthM))
            {
                var approach = plan.Approaches[extra.ApproachIndex];
                yield return new($"view.roadUsers[{i}].stationM",
                    $"Must be from 0 to the approach's length, {approach.LengthM:F1} m ({approach.Feature}); it was {extra.StationM}.");
            }
        }
    }
}
