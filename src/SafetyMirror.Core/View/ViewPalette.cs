using SafetyMirror.Core.Optics;

namespace SafetyMirror.Core.View;

/// <summary>An sRGB colour, one byte a channel.</summary>
public readonly record struct Rgb(byte R, byte G, byte B)
{
    /// <summary>The colour with every channel multiplied by a factor from 0 to 1.</summary>
    public Rgb Scaled(double factor) => new((byte)(R * factor), (byte)(G * factor), (byte)(B * factor));

    /// <summary>This colour mixed with another: 0 keeps this one, 1 gives the other.</summary>
    public Rgb Mixed(Rgb other, double share) =>
        new((byte)(R + ((other.R - R) * share)), (byte)(G + ((other.G - G) * share)), (byte)(B + ((other.B - B) * share)));
}

/// <summary>The colours of the driver's view and how surfaces are shaded: flat, lit by one fixed sun, fading into haze with distance.</summary>
internal static class ViewPalette
{
    public static readonly Rgb Board = new(28, 28, 30);
    public static readonly Rgb Rim = new(190, 192, 196);

    private static readonly Rgb Horizon = new(206, 218, 230);
    private static readonly Rgb Zenith = new(112, 150, 204);
    private static readonly Rgb Ground = new(128, 146, 96);
    private static readonly Rgb Carriageway = new(86, 88, 92);
    private static readonly Rgb Footway = new(172, 166, 154);
    private static readonly Rgb ApproachLine = new(240, 232, 140);
    private static readonly Rgb Obstacle = new(176, 124, 98);
    private static readonly Rgb Pole = new(118, 122, 128);
    private static readonly Rgb DesignRoadUser = new(200, 36, 36);
    private static readonly Rgb OtherRoadUser = new(40, 96, 210);

    // High in the south-west of the picture's world, so that walls facing different ways differ in shade.
    private static readonly Vec3 Sun = new Vec3(-0.45, -0.55, 0.7).Normalized();

    /// <summary>Distance at which haze has taken about 63 % of a surface's colour, in metres.</summary>
    private const double HazeM = 1500;

    /// <summary>The sky in a direction: pale at the horizon, deeper toward the zenith.</summary>
    public static Rgb Sky(Vec3 direction) => Horizon.Mixed(Zenith, Math.Clamp(direction.Z / 0.5, 0, 1));

    /// <summary>A surface the ray met after travelling <paramref name="pathM"/> from the eye; a road user at the required distance
    /// is red, one the caller placed blue, its front face lighter than its body.</summary>
    public static Rgb Surface(SceneHit hit, double pathM, bool atRequiredDistance)
    {
        var roadUser = atRequiredDistance ? DesignRoadUser : OtherRoadUser;
        var colour = hit.Kind switch
        {
            SeenKind.Carriageway => Carriageway,
            SeenKind.Footway => Footway,
            SeenKind.ApproachLine => ApproachLine,
            SeenKind.Obstacle => Obstacle,
            SeenKind.Pole => Pole,
            SeenKind.RoadUserFront => roadUser.Mixed(new Rgb(255, 255, 255), 0.3),
            SeenKind.RoadUserBody => roadUser,
            _ => Ground,
        };
        var lit = colour.Scaled(0.62 + (0.38 * Math.Max(0, Vec3.Dot(hit.Normal, Sun))));
        return lit.Mixed(Horizon, 1 - Math.Exp(-pathM / HazeM));
    }
}
