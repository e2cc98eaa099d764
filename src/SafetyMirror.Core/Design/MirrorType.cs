using SafetyMirror.Core.Optics;

namespace SafetyMirror.Core.Design;

/// <summary>A mirror that can be ordered: its face outline and radius of curvature.</summary>
public sealed record MirrorType
{
    /// <summary>Largest radius of curvature accepted, in metres; it catches millimetres given as metres.</summary>
    public const double MaximumRadiusM = 100;

    /// <summary>Creates a mirror type; the radius must exceed half the face's largest extent.</summary>
    /// <remarks>A smaller radius would make the face more than a hemisphere.</remarks>
    public MirrorType(string id, Aperture aperture, double radiusM, string source)
    {
        Id = MachineName.Require(id);
        ArgumentNullException.ThrowIfNull(aperture);
        ArgumentException.ThrowIfNullOrWhiteSpace(source);
        if (!double.IsFinite(radiusM) || !aperture.FitsOnSphereOf(radiusM) || radiusM > MaximumRadiusM)
        {
            throw new ArgumentOutOfRangeException(
                nameof(radiusM),
                radiusM,
                $"{nameof(radiusM)} must be greater than {aperture.CircumradiusM} m (half the face's largest extent) and at most {MaximumRadiusM} m; it was {radiusM}.");
        }

        Aperture = aperture;
        RadiusM = radiusM;
        Source = source;
    }

    /// <summary>A face as an engineer names it, a rectangle width × height (horizontal first): "600 mm round mirror (R 2.2 m)", "600 × 450 mm mirror (R 2.2 m)".</summary>
    public static string Describe(Aperture aperture, double radiusM) => aperture switch
    {
        RoundAperture round => FormattableString.Invariant($"{round.DiameterM * 1000:0} mm round mirror (R {radiusM:0.0##} m)"),
        RectangularAperture r => FormattableString.Invariant($"{r.WidthM * 1000:0} × {r.HeightM * 1000:0} mm mirror (R {radiusM:0.0##} m)"),
        _ => FormattableString.Invariant($"mirror (R {radiusM:0.0##} m)"),
    };

    /// <summary>This mirror as an engineer names it.</summary>
    public string Description => Describe(Aperture, RadiusM);

    /// <summary>Stable machine name, kebab-case, like "round-800".</summary>
    public string Id { get; }

    /// <summary>The outline of the face.</summary>
    public Aperture Aperture { get; }

    /// <summary>Radius of curvature of the convex face, in metres.</summary>
    public double RadiusM { get; }

    /// <summary>Where the size and radius come from.</summary>
    public string Source { get; }
}
