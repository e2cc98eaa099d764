using NetTopologySuite.Geometries;
using SafetyMirror.Core.Optics;

namespace SafetyMirror.Core.Tests.Optics;

public class FieldOfViewTests
{
    private static readonly GeometryFactory Factory = new();
    private static readonly Vec3 Eye = new(2.5, -9, 1.08); // AASHTO passenger-car eye height 1.08 m (domain brief §3)

    // A pole-mounted mirror across the road from a driveway, looking back toward it and down the road.
    private static ConvexMirror CornerMirror(double radiusM = 2.2, double diameterM = 0.6) =>
        ConvexMirror.Aimed(new Vec3(0, 0, 2.9), 170, 8, radiusM, new RoundAperture(diameterM));

    [Fact]
    public void Trace_CornerMirror_CountsEveryRayOnce()
    {
        var view = FieldOfViewTracer.Trace(CornerMirror(), Eye, 0, 200, 1000);
        Assert.InRange(view.RaysTraced, 900, 1000);
        Assert.Equal(view.RaysTraced, view.RaysOnPlane + view.RaysUpward + view.RaysBeyondRange + view.RaysOffFace);
        Assert.NotNull(view.Outline);
        Assert.True(view.Outline!.IsValid);
    }

    [Fact]
    public void Trace_CornerMirror_OutlineAgreesWithTheInverseSolver()
    {
        // Two independent computations: forward tracing (this outline) and the exact reflection point
        // for a ground point (Alhazen's problem). Points well inside must be seen; well outside (and within
        // the range limit, where the outline is clipped), not.
        var mirror = CornerMirror();
        const double Range = 200;
        var outline = FieldOfViewTracer.Trace(mirror, Eye, 0, Range, 4000).Outline!;
        var margin = 0.02 * Math.Sqrt(outline.Area);
        var inner = outline.Buffer(-margin);
        var outer = outline.Buffer(margin);
        var box = outer.EnvelopeInternal;
        var checkedInside = 0;
        for (var i = 0; i <= 40; i++)
        {
            for (var j = 0; j <= 40; j++)
            {
                var x = box.MinX + (box.Width * i / 40);
                var y = box.MinY + (box.Height * j / 40);
                var ground = Factory.CreatePoint(new Coordinate(x, y));
                var seen = mirror.Reflect(Eye, new Vec3(x, y, 0)).IsSeenInMirror;
                if (inner.Contains(ground))
                {
                    checkedInside++;
                    Assert.True(seen, $"({x:F2}, {y:F2}) is inside the outline but not seen");
                }
                else if (!outer.Contains(ground) && Math.Sqrt((x * x) + (y * y)) < Range - margin)
                {
                    Assert.False(seen, $"({x:F2}, {y:F2}) is outside the outline but seen");
                }
            }
        }

        Assert.True(checkedInside > 50);
    }

    [Fact]
    public void Trace_NearlyPlaneMirror_MatchesTheVirtualEyeConstruction()
    {
        // Plane mirror (any optics text): what the eye sees through the face is the ground cut by the
        // cone from the eye's mirror image through the rim. Compared with NetTopologySuite's area and
        // overlay of the two polygons.
        var mirror = ConvexMirror.Aimed(new Vec3(0, 0, 2.9), 170, 25, 1e6, new RoundAperture(0.8));
        var view = FieldOfViewTracer.Trace(mirror, Eye, 0, 500, 4000);

        var n = mirror.Normal;
        var virtualEye = Eye - (2 * Vec3.Dot(Eye - mirror.Vertex, n) * n);
        var expected = new List<Coordinate>();
        for (var i = 0; i < 256; i++)
        {
            var (u, v) = mirror.Aperture.Rim(i / 256.0);
            var rimPoint = mirror.Vertex + (u * mirror.HorizontalAxis) + (v * mirror.VerticalAxis);
            var s = virtualEye.Z / (virtualEye.Z - rimPoint.Z);
            var ground = virtualEye + (s * (rimPoint - virtualEye));
            expected.Add(new Coordinate(ground.X, ground.Y));
        }

        expected.Add(expected[0].Copy());
        var analytic = Factory.CreatePolygon(expected.ToArray());

        Assert.Equal(0, view.RaysUpward);
        var mismatch = view.Outline!.SymmetricDifference(analytic).Area / analytic.Area;
        Assert.True(mismatch < 0.01, $"outlines differ by {mismatch:P2}");
    }

    [Fact]
    public void Trace_MirrorAimedAboveTheHorizon_CountsUpwardRaysAndStaysWithinRange()
    {
        var mirror = ConvexMirror.Aimed(new Vec3(0, 0, 2.9), 170, -20, 2.2, new RoundAperture(0.6));
        const double range = 80;
        var view = FieldOfViewTracer.Trace(mirror, Eye, 0, range, 1000);

        Assert.True(view.RaysUpward > 0);
        var foot = Factory.CreatePoint(new Coordinate(0, 0));
        Assert.All(view.Outline!.Coordinates, c => Assert.True(foot.Distance(Factory.CreatePoint(c)) <= range + 1e-6));
    }

    [Fact]
    public void Trace_ShortRangeLimit_CountsRaysBeyondIt()
    {
        var view = FieldOfViewTracer.Trace(CornerMirror(), Eye, 0, 10, 1000);
        Assert.True(view.RaysBeyondRange > 0);
    }

    [Fact]
    public void Trace_EyeOnTheAxis_HalfFieldMatchesTheApproximation()
    {
        // Domain brief §2: half field of view ≈ atan(D/2d) + 2·asin(D/2R) for an eye on the axis at distance d.
        // The exact rim ray is compared with it; the sag of the face makes a small difference.
        const double radius = 2.2, diameter = 0.6, distance = 8;
        var mirror = new ConvexMirror(Vec3.Zero, new Vec3(0, 1, 0), radius, new RoundAperture(diameter));
        var eye = new Vec3(0, distance, 0);
        var rimPoint = mirror.PointOnFace(diameter / 2, 0);
        var hit = mirror.TraceRay(eye, rimPoint - eye)!.Value;
        var exact = Vec3.AngleBetween(hit.ReflectedDirection, mirror.Normal);
        var approximate = Math.Atan(diameter / 2 / distance) + (2 * Math.Asin(diameter / 2 / radius));
        Assert.Equal(approximate, exact, approximate * 0.02);
    }
}
