using SafetyMirror.Core.Design;
using SafetyMirror.Core.Design.Evaluation;
using SafetyMirror.Core.Optics;
using SafetyMirror.Core.Site;
using SafetyMirror.Core.Tests.Design.Evaluation;
using SafetyMirror.Core.View;

namespace SafetyMirror.Core.Tests.View;

public class DriverViewTests
{
    // A narrow field of view and many pixels, so that one pixel spans well under an arc minute: 5° over 1000 px is 0.3 arcmin.
    private static readonly ViewOptions Fine = new() { WidthPx = 1000, HeightPx = 1000, FieldOfViewDeg = 5 };

    [Fact]
    public void Render_DesignCarAtRequiredDistance_HeightInPixelsAgreesWithTheEvaluationWithinOnePixel()
    {
        var plan = ViewCorners.Demo();
        var options = new EvaluationOptions { StationsM = [35] }; // AASHTO SSD at 30 km/h: 35 m (Green Book 2011, Table 3-1)
        var evaluation = MirrorEvaluator.Evaluate(plan, ViewCorners.DemoMirror, options).Evaluation!;
        var expectedArcmin = evaluation.Approaches[0].Stations.Single(s => s.RoadUser == RoadUsers.PassengerCar).ApparentHeightArcmin!.Value;

        var picture = ViewCorners.Render(plan, Fine, options);
        var car = picture.RoadUsers.ToList().FindIndex(u => u.ApproachIndex == 0 && u.AtRequiredDistance);
        Assert.Equal(35, picture.RoadUsers[car].Station.StationM);
        var front = ViewCorners.PixelsOf(picture, s => s is { Kind: SeenKind.RoadUserFront, InMirror: true } && s.Index == car);
        var column = front.Select(p => p.X).Order().ElementAt(front.Count / 2); // the front's centre line
        var heightPx = front.Count(p => p.X == column);

        Assert.InRange(heightPx, 20, 1000); // large enough for one pixel to be a small share of it
        Assert.Equal(expectedArcmin, heightPx * picture.ArcminPerPixel, picture.ArcminPerPixel);
    }

    [Fact]
    public void Render_HorizonInTheMirror_LiesWhereTheExactReflectionOfAFarGroundPointFalls()
    {
        var plan = ViewCorners.Street([Corners.FromWest()], []);
        var picture = ViewCorners.Render(plan, Fine);
        var mirror = ViewCorners.DemoMirror.ToMirror();

        // A ground point 10,000 km out lies on the horizon to far below a pixel (2.95 m / 1e7 m rad); it is taken in the compass
        // direction where the ray from the eye to the face's centre goes after reflecting there, so that it reflects near the centre.
        var toCentre = (mirror.Vertex - Corners.Eye).Normalized();
        var bounced = toCentre - (2 * Vec3.Dot(toCentre, mirror.Normal) * mirror.Normal);
        var far = (mirror.Vertex + (1e7 * new Vec3(bounced.X, bounced.Y, 0).Normalized())) with { Z = 0 };
        var reflection = mirror.Reflect(Corners.Eye, far); // Alhazen's problem, solved independently of the forward ray trace
        Assert.True(reflection.IsSeenInMirror);
        var (x, expectedY) = picture.Camera.Project(reflection.Point)!.Value;

        var column = (int)x;
        var rows = Enumerable.Range(0, picture.HeightPx).Where(y => picture.At(column, y).InMirror).ToList();
        var firstGround = rows.First(y => picture.At(column, y).Kind != SeenKind.Sky);
        Assert.All(rows.Where(y => y < firstGround), y => Assert.Equal(SeenKind.Sky, picture.At(column, y).Kind));
        Assert.Equal(expectedY, firstGround, 1.0); // the boundary between rows firstGround − 1 and firstGround, within a pixel
    }

    [Fact]
    public void Render_MarkerOnTheLeftOfTheLane_AppearsOnTheRightInTheMirror()
    {
        // Two posts either side of the eastbound lane 20 m up it; "left" as someone at the mirror sees it looking up the lane.
        Obstacle north = ViewCorners.Post(-20, 3.5, 3), south = ViewCorners.Post(-20, -0.5, 4);
        var plan = ViewCorners.Street([Corners.FromWest()], [north, south]);
        var picture = ViewCorners.Render(plan, new ViewOptions());
        var mirror = ViewCorners.DemoMirror.ToMirror();
        var lookingUpTheLane = new Vec3(-20, 1.5, 0) - mirror.Vertex;
        var northIsLeft = Vec3.Cross(lookingUpTheLane, new Vec3(-20, 3.5, 0) - mirror.Vertex).Z > 0;
        var (left, right) = northIsLeft ? ((short)0, (short)1) : ((short)1, (short)0);

        double MeanX(short index) => ViewCorners.PixelsOf(picture, s => s is { Kind: SeenKind.Obstacle, InMirror: true } && s.Index == index).Average(p => p.X);
        Assert.True(MeanX(left) > MeanX(right), "The post on the left of the lane must appear to the right of the other in the mirror.");
    }

    [Fact]
    public void Render_CarTheMirrorDoesNotShow_IsAbsentFromThePicture()
    {
        var plan = ViewCorners.Demo();
        var options = new EvaluationOptions { StationsM = [60] };
        var evaluation = MirrorEvaluator.Evaluate(plan, ViewCorners.DemoMirror, options).Evaluation!;
        var westbound = evaluation.Approaches[1].Stations.Single(s => s.RoadUser == RoadUsers.PassengerCar);
        Assert.False(westbound.Shown); // 60 m up the westbound lane the car stands behind the mirror's face

        var picture = ViewCorners.Render(plan, new ViewOptions { ExtraRoadUsers = [new RoadUserAtStation(1, 60, RoadUsers.PassengerCar)] }, options);
        var extra = (short)picture.RoadUsers.ToList().FindIndex(u => !u.AtRequiredDistance);
        Assert.Empty(ViewCorners.PixelsOf(picture, s => s.Kind is SeenKind.RoadUserFront or SeenKind.RoadUserBody && s.Index == extra));
    }

    [Fact]
    public void Render_MirrorStraightAboveTheEye_AnswersAProblemAtTheMirrorLocation()
    {
        var overhead = new MirrorPlacement(Corners.Eye.X, Corners.Eye.Y, 10, 180, 60, 0.3, new RoundAperture(0.3));

        var result = DriverView.Render(ViewCorners.Demo(), overhead, new EvaluationOptions(), new ViewOptions());

        Assert.False(result.IsSuccess);
        Assert.Contains(result.Problems, p => p.Path == "mirror.location");
    }

    [Fact]
    public void Render_EyeRaysThatMeetTheFace_ShowTheReflectionOrTheRimNeverThePoleOrBoard()
    {
        var picture = ViewCorners.Render(ViewCorners.Demo(), new ViewOptions { WidthPx = 200, HeightPx = 200 });
        var mirror = ViewCorners.DemoMirror.ToMirror();

        var wrong = Enumerable.Range(0, 200 * 200)
            .Select(i => (X: i % 200, Y: i / 200))
            .Where(p => mirror.TraceRay(Corners.Eye, picture.Camera.RayThrough(p.X + 0.5, p.Y + 0.5)) is { IsOnFace: true })
            .Where(p => picture.At(p.X, p.Y) is not ({ InMirror: true } or { Kind: SeenKind.MirrorRim }))
            .ToList();

        Assert.Empty(wrong);
    }
}
