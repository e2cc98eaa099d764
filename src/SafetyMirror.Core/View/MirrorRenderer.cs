using SafetyMirror.Core.Design;
using SafetyMirror.Core.Optics;

namespace SafetyMirror.Core.View;

/// <summary>Casts one eye ray per pixel at the face, the backing board and the scene, and shades what it meets.</summary>
internal sealed class MirrorRenderer(ViewCamera camera, ConvexMirror mirror, ViewScene scene)
{
    /// <summary>The share of light the face returns: acrylic, the usual face.</summary>
    private static readonly double Reflectance = FaceMaterials.Find("acrylic")!.Reflectance;

    private readonly Aperture board = Grown(mirror.Aperture, DriverView.BoardMarginM);
    private readonly Aperture rimInside = Grown(mirror.Aperture, -DriverView.RimWidthM);

    // The board stands in the plane through the face's outermost rim point, square to the axis: the face bulges in front of it.
    private readonly Vec3 boardCentre = mirror.Centre + (Math.Sqrt((mirror.RadiusM * mirror.RadiusM) - (mirror.Aperture.CircumradiusM * mirror.Aperture.CircumradiusM)) * mirror.Normal);

    // Every point of the face and the board lies within this distance of the vertex: rays that pass farther off need no test.
    private readonly double reachM = Math.Sqrt(Math.Pow(mirror.Aperture.CircumradiusM + (2 * DriverView.BoardMarginM), 2)
        + Math.Pow(mirror.RadiusM - Math.Sqrt((mirror.RadiusM * mirror.RadiusM) - (mirror.Aperture.CircumradiusM * mirror.Aperture.CircumradiusM)), 2));

    public ViewPicture Render(CancellationToken cancellationToken)
    {
        var (width, height) = (camera.WidthPx, camera.HeightPx);
        var rgb = new byte[width * height * 3];
        var seen = new SeenThing[width * height];
        var eye = camera.Eye;
        for (var y = 0; y < height; y++)
        {
            cancellationToken.ThrowIfCancellationRequested();
            // The rays of one row differ only by steps along the picture's right: computed once per row, then stepped.
            var rowStart = (camera.FocalPx * camera.Forward) + ((0.5 - (width / 2.0)) * camera.Right) - ((y + 0.5 - (height / 2.0)) * camera.Up);
            for (var x = 0; x < width; x++)
            {
                var ray = (rowStart + (x * camera.Right)).Normalized();
                var (thing, colour) = Shade(eye, ray);
                var pixel = (y * width) + x;
                seen[pixel] = thing;
                rgb[pixel * 3] = colour.R;
                rgb[(pixel * 3) + 1] = colour.G;
                rgb[(pixel * 3) + 2] = colour.B;
            }
        }

        return new ViewPicture(camera, rgb, seen, scene.RoadUsers);
    }

    /// <summary>What the eye ray meets first: the face (then what the reflected ray meets), the board, or the scene.</summary>
    private (SeenThing Thing, Rgb Colour) Shade(Vec3 eye, Vec3 ray)
    {
        var nearMirror = Vec3.Cross(ray, mirror.Vertex - eye).LengthSquared <= reachM * reachM;
        var face = nearMirror && mirror.TraceRay(eye, ray) is { IsOnFace: true } hit ? hit : (SurfaceHit?)null;
        var boardDistance = nearMirror ? BoardDistance(eye, ray) : double.PositiveInfinity;
        var nearest = Math.Min(face?.DistanceM ?? double.PositiveInfinity, boardDistance);
        if (scene.Trace(eye, ray, nearest) is { } direct)
        {
            return (new SeenThing(direct.Kind, direct.Index, InMirror: false), Colour(direct, direct.DistanceM));
        }

        if (face is { } f && f.DistanceM <= boardDistance)
        {
            if (!OnFaceInside(f.Point))
            {
                return (new SeenThing(SeenKind.MirrorRim, 0, false), ViewPalette.Rim);
            }

            var reflected = scene.Trace(f.Point, f.ReflectedDirection, double.PositiveInfinity);
            var colour = reflected is { } r
                ? Colour(r, f.DistanceM + r.DistanceM)
                : ViewPalette.Sky(f.ReflectedDirection);
            return (new SeenThing(reflected?.Kind ?? SeenKind.Sky, reflected?.Index ?? 0, InMirror: true), colour.Scaled(Reflectance));
        }

        return double.IsFinite(boardDistance)
            ? (new SeenThing(SeenKind.BackingBoard, 0, false), ViewPalette.Board)
            : (new SeenThing(SeenKind.Sky, 0, false), ViewPalette.Sky(ray));
    }

    private Rgb Colour(SceneHit hit, double pathM) =>
        ViewPalette.Surface(hit, pathM, hit.Kind is SeenKind.RoadUserFront or SeenKind.RoadUserBody && scene.RoadUsers[hit.Index].AtRequiredDistance);

    /// <summary>Distance along the eye ray to the backing board from the front, or infinity when the ray misses it.</summary>
    private double BoardDistance(Vec3 eye, Vec3 ray)
    {
        var approach = Vec3.Dot(ray, mirror.Normal);
        if (approach >= 0)
        {
            return double.PositiveInfinity;
        }

        var t = Vec3.Dot(boardCentre - eye, mirror.Normal) / approach;
        var offset = eye + (t * ray) - boardCentre;
        return t > 0 && board.Contains(Vec3.Dot(offset, mirror.HorizontalAxis), Vec3.Dot(offset, mirror.VerticalAxis)) ? t : double.PositiveInfinity;
    }

    /// <summary>Whether a point of the face lies inside the rim.</summary>
    private bool OnFaceInside(Vec3 facePoint)
    {
        var radial = facePoint - mirror.Centre;
        return rimInside.Contains(Vec3.Dot(radial, mirror.HorizontalAxis), Vec3.Dot(radial, mirror.VerticalAxis));
    }

    /// <summary>The outline grown (or, with a negative margin, shrunk) by a margin on every side.</summary>
    private static Aperture Grown(Aperture aperture, double marginM) => aperture switch
    {
        RoundAperture round => new RoundAperture(Math.Max(1e-6, round.DiameterM + (2 * marginM))),
        RectangularAperture rectangle => new RectangularAperture(Math.Max(1e-6, rectangle.WidthM + (2 * marginM)), Math.Max(1e-6, rectangle.HeightM + (2 * marginM))),
        _ => throw new ArgumentOutOfRangeException(nameof(aperture), aperture, "Only round and rectangular faces can be drawn."),
    };
}
