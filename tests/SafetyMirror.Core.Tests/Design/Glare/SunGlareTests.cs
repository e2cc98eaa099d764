using SafetyMirror.Core.Design.Glare;
using SafetyMirror.Core.Optics;
using SafetyMirror.Core.Sun;
using static SafetyMirror.Core.Tests.Design.Glare.GlareCorner;

namespace SafetyMirror.Core.Tests.Design.Glare;

public class SunGlareTests
{
    private static SunGlare For(ConvexMirror mirror, params SafetyMirror.Core.Site.Obstacle[] obstacles) =>
        new(Plan(null, obstacles), mirror, Eye, GlareScanOptions.DefaultBehindMirrorAngleDeg);

    [Fact]
    public void GlintPoint_SunWhereTheVertexRayReflects_IsTheVertex()
    {
        var sun = SunAt(Afternoon);
        Assert.True(sun.Z > Math.Sin(Angles.FromDeg(5)), "construction: the sun stands well above the horizon");

        var point = For(AimedAt(sun)).GlintPoint(sun);

        // Law of reflection by hand: the normal bisects the eye and the sun, so the sun reflects at the vertex.
        Assert.NotNull(point);
        Assert.True(Vec3.Distance(point.Value, Vertex) < 1e-4, $"glint at {point}");
    }

    [Theory]
    [InlineData(-1)]
    [InlineData(1)]
    public void GlintPoint_AnHourAwayFromTheAimedInstant_IsNone(int hours)
    {
        // An hour moves the sun about 15°·cos δ ≈ 15° across the sky in March (hour angle 15°/h, declination near 0); the
        // face's directions reach atan(D/2d) + 2·asin(D/2R) ≈ 1.1° + 2.3° = 3.4° from the vertex ray (paraxial half field of
        // view, domain brief §2, with d = 10.7 m): far outside.
        var mirror = AimedAt(SunAt(Afternoon));

        Assert.Null(For(mirror).GlintPoint(SunAt(Afternoon.AddHours(hours))));
    }

    [Fact]
    public void GlintPoint_SunJustOffTheFaceByLessThanItsRadius_StillGlares()
    {
        // A sun centred 0.2° beyond the farthest rim direction of the face's set (traced here, about 3.4° from the vertex
        // ray) still shows its edge in the face (disc radius 0.265°, domain brief §10); 0.4° beyond, none of it does.
        var mirror = AimedAt(SunAt(Afternoon));
        var glare = For(mirror);
        var edge = FarthestReach(mirror, SunAt(Afternoon));

        Assert.NotNull(glare.GlintPoint(Turn(edge.Direction, edge.Away, 0.2)));
        Assert.Null(glare.GlintPoint(Turn(edge.Direction, edge.Away, 0.4)));
    }

    [Fact]
    public void GlintPoint_SunWhollyBelowTheHorizon_IsNone()
    {
        var low = SunPosition.DirectionOf(235, -2);

        Assert.Null(For(AimedAt(low)).GlintPoint(low));
    }

    [Fact]
    public void GlintPoint_SunJustAboveTheHorizon_Glares()
    {
        var low = SunPosition.DirectionOf(235, 2);

        Assert.NotNull(For(AimedAt(low)).GlintPoint(low));
    }

    [Fact]
    public void GlintPoint_TowerBetweenFaceAndSun_IsNone()
    {
        var sun = SunAt(Afternoon);

        // 20 m toward the sun the ray has risen 20·tan(elevation) ≈ 7 m above the face: a 40 m tower hides it.
        Assert.Null(For(AimedAt(sun), TowerToward(Vertex, sun, 20, 40)).GlintPoint(sun));
    }

    [Fact]
    public void GlintPoint_LowTowerTowardTheSun_DoesNotHideIt()
    {
        var sun = SunAt(Afternoon);

        Assert.NotNull(For(AimedAt(sun), TowerToward(Vertex, sun, 20, 3)).GlintPoint(sun));
    }

    [Fact]
    public void GlintPoint_WallBetweenEyeAndFace_IsNone()
    {
        var sun = SunAt(Afternoon);
        var wall = new SafetyMirror.Core.Site.Obstacle(Evaluation.Corners.Box(-3, 2, 3, 2.5), 4, new(4, "wall"));

        Assert.Null(For(AimedAt(sun), wall).GlintPoint(sun));
    }

    [Fact]
    public void IsBehindMirror_SunOnTheEyeToMirrorLine_IsTrue()
    {
        Assert.True(For(AimedAt(SunAt(Afternoon))).IsBehindMirror((Vertex - Eye).Normalized()));
    }

    [Fact]
    public void IsBehindMirror_SunBeyondTheStatedAngle_IsFalse()
    {
        var line = (Vertex - Eye).Normalized();

        // Default 10° (common practice); 11° above the line is outside it, 9° inside.
        Assert.False(For(AimedAt(SunAt(Afternoon))).IsBehindMirror(Lift(line, 11)));
        Assert.True(For(AimedAt(SunAt(Afternoon))).IsBehindMirror(Lift(line, 9)));
    }

    [Fact]
    public void IsBehindMirror_BuildingBehindTheMirror_HidesTheSun()
    {
        var line = (Vertex - Eye).Normalized();

        Assert.False(For(AimedAt(SunAt(Afternoon)), TowerToward(Vertex, line, 15, 40)).IsBehindMirror(line));
    }

    /// <summary>The face direction farthest from the vertex ray's, and the unit step away from the vertex ray there.</summary>
    private static (Vec3 Direction, Vec3 Away) FarthestReach(ConvexMirror mirror, Vec3 vertexRay)
    {
        var farthest = Enumerable.Range(0, 360)
            .Select(k => mirror.Aperture.Rim(k / 360.0))
            .Select(rim => mirror.EyeRayTo(Eye, rim.UM, rim.VM)!.Value.ReflectedDirection)
            .MaxBy(d => Vec3.AngleBetween(d, vertexRay));
        var away = (farthest - (Vec3.Dot(farthest, vertexRay) * vertexRay)).Normalized();
        var tangent = (away - (Vec3.Dot(away, farthest) * farthest)).Normalized();
        return (farthest, tangent);
    }

    private static Vec3 Turn(Vec3 direction, Vec3 tangent, double degrees) =>
        (Math.Cos(Angles.FromDeg(degrees)) * direction) + (Math.Sin(Angles.FromDeg(degrees)) * tangent);

    private static Vec3 Lift(Vec3 direction, double degrees)
    {
        var up = (Vec3.Up - (Vec3.Dot(Vec3.Up, direction) * direction)).Normalized();
        return Turn(direction, up, degrees);
    }
}
