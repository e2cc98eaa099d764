namespace SafetyMirror.Core.View;

/// <summary>The rendered view: RGB pixels, what each pixel shows, and the picture's angular scale.</summary>
/// <remarks>Pixels row by row from the top left; <see cref="Rgb"/> holds three bytes per pixel (red, green, blue).</remarks>
public sealed class ViewPicture
{
    private readonly SeenThing[] seen;

    internal ViewPicture(ViewCamera camera, byte[] rgb, SeenThing[] seen, IReadOnlyList<PlacedRoadUser> roadUsers)
    {
        Camera = camera;
        Rgb = rgb;
        this.seen = seen;
        RoadUsers = roadUsers;
    }

    /// <summary>The camera: where the picture looks from and its angular scale.</summary>
    public ViewCamera Camera { get; }

    /// <summary>Width in pixels.</summary>
    public int WidthPx => Camera.WidthPx;

    /// <summary>Height in pixels.</summary>
    public int HeightPx => Camera.HeightPx;

    /// <summary>Angle across the picture's width, in degrees.</summary>
    public double FieldOfViewDeg => Camera.FieldOfViewDeg;

    /// <summary>The angle one pixel spans at the picture's centre, in arc minutes.</summary>
    public double ArcminPerPixel => Camera.ArcminPerPixel;

    /// <summary>Red, green and blue bytes of each pixel, row by row from the top left.</summary>
    public ReadOnlyMemory<byte> Rgb { get; }

    /// <summary>The road users standing in the scene; a pixel that shows one names it by its index in this list.</summary>
    public IReadOnlyList<PlacedRoadUser> RoadUsers { get; }

    /// <summary>What the pixel at column x and row y shows.</summary>
    public SeenThing At(int xPx, int yPx) => seen[(yPx * WidthPx) + xPx];
}
