using CsCheck;
using SafetyMirror.Core.Optics;

namespace SafetyMirror.Core.Tests.Optics;

public class ReflectionSolverTests
{
    // Property checks run over this many random layouts each.
    private const int Iterations = 2000;

    [Fact]
    public void Solve_AnyLayout_AnglesOfIncidenceAndReflectionAreEqual()
    {
        // Law of reflection (any optics text): the normal bisects the rays to the eye and to the target.
        Layout.Any.Sample(layout =>
        {
            var reflection = layout.Mirror.Reflect(layout.Eye, layout.Target);
            if (!reflection.IsFound)
            {
                return;
            }

            var toEye = Vec3.AngleBetween(reflection.Normal, layout.Eye - reflection.Point);
            var toTarget = Vec3.AngleBetween(reflection.Normal, layout.Target - reflection.Point);
            Assert.True(Math.Abs(toEye - toTarget) < 1e-9, $"incidence {toEye} ≠ reflection {toTarget} for {layout}");
        }, iter: Iterations);
    }

    [Fact]
    public void Solve_AnyLayout_IncidentRayReflectedRayAndNormalAreCoplanar()
    {
        Layout.Any.Sample(layout =>
        {
            var reflection = layout.Mirror.Reflect(layout.Eye, layout.Target);
            if (!reflection.IsFound)
            {
                return;
            }

            var toEye = (layout.Eye - reflection.Point).Normalized();
            var toTarget = (layout.Target - reflection.Point).Normalized();
            var outOfPlane = Vec3.Dot(reflection.Normal, Vec3.Cross(toEye, toTarget));
            Assert.True(Math.Abs(outOfPlane) < 1e-9, $"triple product {outOfPlane} for {layout}");
        }, iter: Iterations);
    }

    [Fact]
    public void Solve_EyeAndTargetSwapped_GivesTheSamePoint()
    {
        // Reversibility of light paths (any optics text).
        Layout.Any.Sample(layout =>
        {
            var forward = layout.Mirror.Reflect(layout.Eye, layout.Target);
            var backward = layout.Mirror.Reflect(layout.Target, layout.Eye);
            Assert.Equal(forward.Outcome, backward.Outcome);
            if (forward.IsFound)
            {
                Assert.True(Vec3.Distance(forward.Point, backward.Point) < 1e-9 * layout.Mirror.RadiusM, $"{forward.Point} vs {backward.Point}");
            }
        }, iter: Iterations);
    }

    [Fact]
    public void Solve_AnyLayout_PathIsALocalMinimumOfLength()
    {
        // Fermat's principle for a convex reflector: the light path is the shortest nearby path via the sphere.
        Layout.Any.Sample(layout =>
        {
            var mirror = layout.Mirror;
            var reflection = mirror.Reflect(layout.Eye, layout.Target);
            if (!reflection.IsFound)
            {
                return;
            }

            var radial = reflection.Point - mirror.Centre;
            var across1 = Vec3.Cross(radial, mirror.Normal).Length > 1e-9 ? Vec3.Cross(radial, mirror.Normal).Normalized() : mirror.HorizontalAxis;
            var across2 = Vec3.Cross(radial.Normalized(), across1);
            var step = 1e-4 * mirror.RadiusM;
            foreach (var direction in new[] { across1, -across1, across2, -across2, (across1 + across2).Normalized() })
            {
                var nearby = mirror.Centre + (mirror.RadiusM * (radial + (step * direction)).Normalized());
                var length = Vec3.Distance(layout.Eye, nearby) + Vec3.Distance(nearby, layout.Target);
                Assert.True(length >= reflection.PathLengthM - 1e-12, $"shorter path {length} < {reflection.PathLengthM}");
            }
        }, iter: Iterations);
    }

    [Fact]
    public void Solve_RandomLayouts_FindAReflectionInMostCases()
    {
        // Guards the properties above against passing vacuously.
        var found = 0;
        Layout.Any.Sample(layout => found += layout.Mirror.Reflect(layout.Eye, layout.Target).IsFound ? 1 : 0, iter: Iterations, threads: 1);
        Assert.True(found > Iterations * 0.9, $"only {found} of {Iterations} layouts reflected");
    }

    [Fact]
    public void SurelyNotOnFace_AnyLayout_NeverRulesOutAReflectionOnTheFace()
    {
        // The quick test may only answer yes where the exact solve finds no reflection on the face.
        Layout.Any.Sample(layout =>
            !ReflectionSolver.SurelyNotOnFace(layout.Mirror, layout.Eye, layout.Target)
            || !layout.Mirror.Reflect(layout.Eye, layout.Target).IsSeenInMirror, iter: Iterations * 10);
    }

    [Fact]
    public void SurelyNotOnFace_RandomLayouts_RulesOutAShareOfReflectionsOffTheFace()
    {
        // Guards the property above against passing vacuously: a share of the reflections off the face (about a quarter here, where the layouts keep most near the face; a tenth at least) is caught early.
        int off = 0, ruledOut = 0;
        Layout.Any.Sample(layout =>
        {
            if (!layout.Mirror.Reflect(layout.Eye, layout.Target).IsSeenInMirror)
            {
                off++;
                ruledOut += ReflectionSolver.SurelyNotOnFace(layout.Mirror, layout.Eye, layout.Target) ? 1 : 0;
            }
        }, iter: Iterations, threads: 1);
        Assert.True(off > 0 && ruledOut > off / 10, $"{ruledOut} of {off} reflections off the face ruled out");
    }

    [Theory]
    [InlineData(0.999999)]
    [InlineData(0.9999)]
    public void SurelyNotOnFace_PointJustInsideTheRim_IsNotRuledOut(double rimFraction)
    {
        var mirror = ConvexMirror.Aimed(new Vec3(0, 0, 3), 200, 10, 2.2, new RoundAperture(0.6));
        var eye = Layout.InFront(mirror, 8, 35, 200);
        var chosen = mirror.PointOnFace(0.3 * rimFraction * Math.Cos(0.7), 0.3 * rimFraction * Math.Sin(0.7));
        var normal = (chosen - mirror.Centre).Normalized();
        var incoming = (chosen - eye).Normalized();
        var target = chosen + (40 * (incoming - (2 * Vec3.Dot(incoming, normal) * normal)));

        Assert.False(ReflectionSolver.SurelyNotOnFace(mirror, eye, target));
    }

    [Theory]
    [InlineData(0.999999)]
    [InlineData(0.9999)]
    [InlineData(1.000001)]
    [InlineData(1.0001)]
    public void Solve_PointNearTheRim_ApertureFlagSwitchesExactlyAtTheRim(double rimFraction)
    {
        // Build the target so that the exact reflection point is a chosen sphere point just inside or outside the rim.
        var mirror = ConvexMirror.Aimed(new Vec3(0, 0, 3), 200, 10, 2.2, new RoundAperture(0.6));
        var eye = Layout.InFront(mirror, 8, 35, 200);
        var rimU = 0.3 * rimFraction;
        var chosen = mirror.PointOnFace(rimU * Math.Cos(0.7), rimU * Math.Sin(0.7));
        var normal = (chosen - mirror.Centre).Normalized();
        var incoming = (chosen - eye).Normalized();
        var target = chosen + (40 * (incoming - (2 * Vec3.Dot(incoming, normal) * normal)));

        var reflection = mirror.Reflect(eye, target);

        Assert.True(Vec3.Distance(reflection.Point, chosen) < 1e-9);
        Assert.Equal(rimFraction <= 1, reflection.InsideAperture);
    }

    [Fact]
    public void Solve_EyeInsideTheSphere_SaysSo()
    {
        var mirror = new ConvexMirror(Vec3.Zero, new Vec3(1, 0, 0), 2, new RoundAperture(1));
        var reflection = mirror.Reflect(new Vec3(-1, 0, 0), new Vec3(10, 3, 0));
        Assert.Equal(ReflectionOutcome.EyeInsideSphere, reflection.Outcome);
        Assert.False(reflection.IsSeenInMirror);
    }

    [Fact]
    public void Solve_TargetInsideTheSphere_SaysSo()
    {
        var mirror = new ConvexMirror(Vec3.Zero, new Vec3(1, 0, 0), 2, new RoundAperture(1));
        Assert.Equal(ReflectionOutcome.TargetInsideSphere, mirror.Reflect(new Vec3(10, 3, 0), new Vec3(-1, 0.5, 0)).Outcome);
    }

    [Fact]
    public void Solve_TargetBehindTheMirror_SaysSo()
    {
        var mirror = new ConvexMirror(Vec3.Zero, new Vec3(1, 0, 0), 2, new RoundAperture(1));
        Assert.Equal(ReflectionOutcome.BehindMirror, mirror.Reflect(new Vec3(10, 1, 0), new Vec3(-10, 1, 0)).Outcome);
    }

    [Fact]
    public void Solve_EyeAndTargetOnTheAxis_ReflectAtTheVertex()
    {
        var mirror = new ConvexMirror(new Vec3(1, 2, 3), new Vec3(0, -1, 0), 3, new RoundAperture(0.8));
        var reflection = mirror.Reflect(new Vec3(1, -5, 3), new Vec3(1, -50, 3));
        Assert.True(Vec3.Distance(reflection.Point, mirror.Vertex) < 1e-12);
        Assert.Equal(0, reflection.IncidenceAngle, 12);
        Assert.Equal(7 + 52, reflection.PathLengthM, 9);
    }

    [Fact]
    public void Solve_SymmetricPair_ReflectsOnTheAxisWithTheClosedFormIncidence()
    {
        // Eye and target mirror images of each other about the axis: by symmetry P is the vertex and the
        // incidence is atan(offset / distance) (closed form, elementary geometry).
        var mirror = new ConvexMirror(Vec3.Zero, new Vec3(1, 0, 0), 3, new RoundAperture(0.8));
        var reflection = mirror.Reflect(new Vec3(6, 2, 0), new Vec3(6, -2, 0));
        Assert.True(Vec3.Distance(reflection.Point, Vec3.Zero) < 1e-12);
        Assert.Equal(Math.Atan2(2, 6), reflection.IncidenceAngle, 12);
    }
}
