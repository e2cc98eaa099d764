using SafetyMirror.Core.Design.Evaluation;
using SafetyMirror.Core.Design.Installation;
using SafetyMirror.Core.Optics;
using SafetyMirror.Core.Site;
using SafetyMirror.Core.Tests.Design.Golden;

namespace SafetyMirror.Core.Tests.Design.Installation;

public class CheckTargetsTests
{
    // The demo corner's mirror (openapi/examples/demo-report-local.json): 800 mm, R 3.0 m, at (6, 7.5), centre 2.95 m, 231°, 5° down;
    // tilted 8° down instead, the ray from the eye reflected at its centre meets the lane within a 1.3 m pole (invented variant).
    private static readonly MirrorPlacement DemoMirror = new(6, 7.5, 2.95, 231, 5, 3.0, new RoundAperture(0.8));
    private static readonly MirrorPlacement Mirror = DemoMirror with { TiltDownDeg = 8 };
    private static readonly SitePlan Demo = GoldenAnswersTests.ExamplePlan("demo-report-local.json");
    private static readonly Vec3 Eye = Demo.Eyes[0].Position;
    private static readonly Approach Eastbound = Demo.Approaches[0];

    [Fact]
    public void Find_MirrorAimedAtTheLane_TargetLiesOnTheLaneWithinThePole()
    {
        var target = CheckTargets.Find(Mirror.ToMirror(), Eye, Eastbound);

        // The eastbound lane runs along y = 1.5 (the demo plan), the pole from the road to 1.3 m.
        Assert.True(target.AtCentre);
        Assert.Equal(1.5, target.YM, 9);
        Assert.Equal(-target.StationM, target.XM, 9);
        Assert.InRange(target.HeightM, 0, CheckTargets.PoleHeightM);
    }

    [Fact]
    public void Find_MirrorAimedAtTheLane_TargetIsWhereTheRayFromTheEyeReflectedAtTheFaceCentreGoes()
    {
        var target = CheckTargets.Find(Mirror.ToMirror(), Eye, Eastbound);

        // Independent check, the law of reflection at the face centre: the normal there is the aim direction
        // n = (sin az·cos t, cos az·cos t, −sin t); the ray from the eye, d, leaves as r = d − 2(d·n)n. The target must lie on it.
        double az = 231 * Math.PI / 180, tilt = 8 * Math.PI / 180;
        double[] n = [Math.Sin(az) * Math.Cos(tilt), Math.Cos(az) * Math.Cos(tilt), -Math.Sin(tilt)];
        double[] centre = [6, 7.5, 2.95], eye = [0, -3, 1.08], point = [target.XM, target.YM, target.HeightM];
        var d = Unit([centre[0] - eye[0], centre[1] - eye[1], centre[2] - eye[2]]);
        var dn = (d[0] * n[0]) + (d[1] * n[1]) + (d[2] * n[2]);
        double[] r = [d[0] - (2 * dn * n[0]), d[1] - (2 * dn * n[1]), d[2] - (2 * dn * n[2])];
        var toTarget = Unit([point[0] - centre[0], point[1] - centre[1], point[2] - centre[2]]);

        Assert.Equal(r[0], toTarget[0], 6);
        Assert.Equal(r[1], toTarget[1], 6);
        Assert.Equal(r[2], toTarget[2], 6);
    }

    [Fact]
    public void For_MirrorAimedAtTheLane_TargetMovesAlongTheLaneWithTheAimOffByTheTolerance()
    {
        var check = CheckTargets.For(Mirror, Eye, Eastbound, 2);

        // The aim tolerance the verdict is tested at: 2° either way (domain brief §9, common practice); turning the face moves
        // the target along the lane on both sides of where it stands at the aim as set.
        Assert.Equal(2, check.ToleranceDeg);
        Assert.True(check.AzimuthStretchM.FromM < check.Target.StationM);
        Assert.True(check.AzimuthStretchM.ToM > check.Target.StationM);
    }

    [Fact]
    public void Find_DemoMirror_NearestPointIsThePoleTopBelowTheCentre()
    {
        var target = CheckTargets.Find(DemoMirror.ToMirror(), Eye, Eastbound);

        // Tilted 5° down, the ray from the eye reflected at the centre passes over a 1.3 m pole (it meets the lane within the
        // pole only from about 8° down, see above): the pole's top is the nearest point, its reflection below the centre.
        Assert.False(target.AtCentre);
        Assert.Equal(CheckTargets.PoleHeightM, target.HeightM);
        Assert.True(target.AboveCentreM < 0);
    }

    [Fact]
    public void Find_FaceAimedAwayFromTheLane_GivesTheNearestPointAndSaysItIsNotAtTheCentre()
    {
        // The same face turned to look north-east, away from the eastbound lane: no point of the lane reflects at its centre.
        var target = CheckTargets.Find((Mirror with { AzimuthDeg = 45 }).ToMirror(), Eye, Eastbound);

        Assert.False(target.AtCentre);
        Assert.Equal(double.PositiveInfinity, target.MissM);
    }

    private static double[] Unit(double[] v)
    {
        var length = Math.Sqrt((v[0] * v[0]) + (v[1] * v[1]) + (v[2] * v[2]));
        return [v[0] / length, v[1] / length, v[2] / length];
    }
}
