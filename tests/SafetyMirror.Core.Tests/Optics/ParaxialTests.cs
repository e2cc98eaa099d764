using SafetyMirror.Core.Optics;

namespace SafetyMirror.Core.Tests.Optics;

public class ParaxialTests
{
    // A mirror at the origin looking along +x: distances in front are +x, virtual images have x < 0.
    private static ConvexMirror FacingPlusX(double radiusM, double diameterM) =>
        new(Vec3.Zero, new Vec3(1, 0, 0), radiusM, new RoundAperture(diameterM));

    [Fact]
    public void ImageDistance_OpenStaxConvexMirrorExample_MatchesTheBookWithinItsRounding()
    {
        // OpenStax College Physics 2e, §25.7, "Image in a Convex Mirror": object 12.0 cm away,
        // R = 0.800 cm → image −0.384 cm, m = 0.0320 (the book rounds; exact arithmetic gives −0.387 cm).
        var image = Paraxial.ImageDistanceM(0.120, 0.00800);
        Assert.Equal(-0.00384, image, 0.00384 * 0.01);
        Assert.Equal(0.0320, Paraxial.Magnification(0.120, 0.00800), 0.0320 * 0.01);
        Assert.Equal(-0.00400, Paraxial.FocalLengthM(0.00800), 1e-12);
    }

    [Fact]
    public void ImageDistance_OpenStaxCorneaProblem_MatchesTheBook()
    {
        // OpenStax University Physics Vol. 3, §2.2 (cornea as a convex mirror): object 1.50 cm high at
        // 3.00 cm, f = −0.376 cm → image 0.167 cm high (m = +0.111), 0.334 cm behind the surface.
        Assert.Equal(-0.00334, Paraxial.ImageDistanceM(0.0300, 0.00752), 0.000005);
        Assert.Equal(0.111, Paraxial.Magnification(0.0300, 0.00752), 0.0005);
        Assert.Equal(0.00167, 0.0150 * Paraxial.Magnification(0.0300, 0.00752), 0.000005);
    }

    [Fact]
    public void ExactEngine_OpenStaxConvexMirrorExample_ReproducesTheParaxialImage()
    {
        // Same example as above (OpenStax College Physics 2e, §25.7), solved by exact reflection with a narrow pencil.
        var mirror = FacingPlusX(0.00800, 0.004);
        var image = VirtualImage.Of(mirror, new Vec3(0.120, 0, 0), new Vec3(0.5, 0, 0), new Vec3(0, 1, 0), 1e-6);
        Assert.Equal(Paraxial.ImageDistanceM(0.120, 0.00800), image.X, 0.00387 * 1e-5);
        Assert.Equal(-0.00384, image.X, 0.00384 * 0.01); // the book's rounded figure
    }

    [Fact]
    public void ExactEngine_FarTargetNearTheAxis_ConvergesToParaxialImageAndMagnification()
    {
        // Mirror equation and m = −di/do (OpenStax College Physics 2e, §25.7): the exact image of an
        // off-axis point approaches (di, m·h) as the offset h shrinks.
        var mirror = FacingPlusX(3.0, 1.0);
        const double objectDistance = 40;
        var paraxialImage = Paraxial.ImageDistanceM(objectDistance, 3.0);
        var magnification = Paraxial.Magnification(objectDistance, 3.0);
        foreach (var offset in new[] { 0.4, 0.1, 0.01 })
        {
            var image = VirtualImage.Of(mirror, new Vec3(objectDistance, offset, 0), new Vec3(6, 0, 0), new Vec3(0, 0, 1), 1e-5);
            Assert.Equal(paraxialImage, image.X, Math.Abs(paraxialImage) * 0.01);
            Assert.Equal(magnification * offset, image.Y, magnification * offset * 0.01);
        }
    }

    [Fact]
    public void ExactEngine_ApparentAngle_ErrorAgainstParaxialShrinksWithTheSquareOfTheOffset()
    {
        // Paraxial angle h·f / (L·d + f·(L + d)), f = R/2, from the mirror equation; exact minus paraxial is
        // third order in the offset, so the relative error falls fourfold each time the offset halves.
        var mirror = FacingPlusX(3.0, 1.0);
        var eye = new Vec3(5, 0, 0);
        const double distance = 40;
        double RelativeError(double offset)
        {
            var view = ApparentSize.InMirror(mirror, eye, new Vec3(distance, 0, 0), new Vec3(distance, offset, 0));
            var paraxial = Paraxial.ApparentAngle(offset, distance, 5, 3.0);
            return Math.Abs(view.Angle - paraxial) / paraxial;
        }

        double e1 = RelativeError(4), e2 = RelativeError(2), e3 = RelativeError(1);
        Assert.InRange(e1 / e2, 3.5, 4.5);
        Assert.InRange(e2 / e3, 3.5, 4.5);
        Assert.True(e3 < 1e-3);
    }

    [Theory]
    [InlineData(1e3)]
    [InlineData(1e5)]
    public void ExactEngine_RadiusWithoutBound_BehavesAsAPlaneMirror(double radiusM)
    {
        // Plane mirror (any optics text): the image is as far behind the mirror as the object is in front,
        // and the light path is as long as the straight line from the eye to the image.
        var mirror = FacingPlusX(radiusM, 1.0);
        var eye = new Vec3(4, 1, 0.5);
        var target = new Vec3(30, -6, 1);
        var mirrored = new Vec3(-target.X, target.Y, target.Z);

        var reflection = mirror.Reflect(eye, target);
        var image = VirtualImage.Of(mirror, target, eye, new Vec3(0, 0, 1), 1e-4);

        var tolerance = 3000 / radiusM; // the departure from a plane falls as 1/R
        Assert.Equal(Vec3.Distance(eye, mirrored), reflection.PathLengthM, tolerance);
        Assert.True(Vec3.Distance(mirrored, image) < 30 * tolerance, $"image {image} vs {mirrored}");
        Assert.Equal(1, Paraxial.Magnification(30, radiusM), 100 / radiusM);
    }

    [Theory]
    [InlineData(0)]
    [InlineData(15)]
    [InlineData(30)]
    [InlineData(45)]
    [InlineData(60)]
    public void ExactEngine_NarrowObliquePencil_ReproducesCoddingtonFocalLengths(double incidenceDeg)
    {
        // Coddington's equations for a mirror (standard textbook result, [memory]; domain brief §2):
        // a parallel pencil at incidence θ focuses at (R/2)·cos θ in the tangential plane and (R/2)/cos θ
        // in the sagittal plane, both virtual, measured along the reflected chief ray.
        const double radius = 2.0;
        var mirror = FacingPlusX(radius, 1.0);
        var theta = Angles.FromDeg(incidenceDeg);
        var incoming = new Vec3(-Math.Cos(theta), -Math.Sin(theta), 0);
        var origin = -10 * incoming;
        var chief = mirror.TraceRay(origin, incoming)!.Value;

        double FocusAlongChief(Vec3 offset)
        {
            var neighbour = mirror.TraceRay(origin + offset, incoming)!.Value;
            var meeting = VirtualImage.ClosestMeeting(chief.Point, chief.ReflectedDirection, neighbour.Point, neighbour.ReflectedDirection);
            return -Vec3.Dot(meeting - chief.Point, chief.ReflectedDirection);
        }

        const double spread = 1e-5;
        var tangential = FocusAlongChief(spread * new Vec3(-Math.Sin(theta), Math.Cos(theta), 0));
        var sagittal = FocusAlongChief(new Vec3(0, 0, spread));
        Assert.Equal(Paraxial.TangentialFocalLengthM(radius, theta), tangential, 1e-4);
        Assert.Equal(Paraxial.SagittalFocalLengthM(radius, theta), sagittal, 1e-4);
    }

    [Fact]
    public void ApparentSize_DistantObjects_TendToTheRatioRoverRPlusTwoD()
    {
        // Domain brief §2 (from the mirror equation): for distant objects the size against a plane mirror
        // tends to R / (R + 2d).
        const double radius = 3.0, eyeDistance = 8;
        var mirror = FacingPlusX(radius, 1.0);
        var eye = new Vec3(eyeDistance, 0, 0);
        var convex = ApparentSize.InMirror(mirror, eye, new Vec3(2000, 0, 0), new Vec3(2000, 1, 0)).Angle;
        var plane = ApparentSize.Direct(eye, new Vec3(-2000, 0, 0), new Vec3(-2000, 1, 0));
        Assert.Equal(radius / (radius + (2 * eyeDistance)), convex / plane, 0.01);
    }

    [Fact]
    public void EquivalentDirectDistance_ConvexMirror_LooksSeveralTimesFartherThanThePath()
    {
        // Domain brief §2: convex mirrors make vehicles look several times farther away.
        var mirror = ConvexMirror.Aimed(new Vec3(0, 0, 2.8), 180, 5, 2.2, new RoundAperture(0.6));
        var eye = new Vec3(3, -8, 1.08);
        var carFront = Layout.InFront(mirror, 40, 25, 0);
        var bottom = carFront with { Z = 0 };
        var top = carFront with { Z = 1.3 }; // passenger car height, AASHTO design vehicle P (domain brief §4)
        var view = ApparentSize.InMirror(mirror, eye, bottom, top);

        var looksAt = ApparentSize.EquivalentDirectDistanceM(1.3, view.Angle);
        Assert.True(view.IsSeen);
        Assert.InRange(looksAt / view.First.PathLengthM, 2, 20);
    }

    [Fact]
    public void EquivalentDirectDistance_AngleSeenDirectly_GivesTheDistanceBack()
    {
        // Elementary geometry: an object of height h, centred, at distance L subtends 2·atan(h / 2L).
        var angle = 2 * Math.Atan(1.3 / 2 / 50);
        Assert.Equal(50, ApparentSize.EquivalentDirectDistanceM(1.3, angle), 9);
    }
}
