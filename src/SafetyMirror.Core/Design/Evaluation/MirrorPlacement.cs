using SafetyMirror.Core.Optics;

namespace SafetyMirror.Core.Design.Evaluation;

/// <summary>A mirror as it would be installed: where its pole stands, how high, aimed where, and which mirror.</summary>
/// <param name="XM">Local x of the point under the mirror's centre, in metres.</param>
/// <param name="YM">Local y of the point under the mirror's centre, in metres.</param>
/// <param name="CentreHeightM">Height of the face's centre above the ground, in metres.</param>
/// <param name="AzimuthDeg">Direction the face looks, clockwise from north, in degrees.</param>
/// <param name="TiltDownDeg">How far the face's axis points below horizontal, in degrees.</param>
/// <param name="RadiusM">Radius of curvature, in metres.</param>
/// <param name="Aperture">The face outline.</param>
public sealed record MirrorPlacement(
    double XM,
    double YM,
    double CentreHeightM,
    double AzimuthDeg,
    double TiltDownDeg,
    double RadiusM,
    Aperture Aperture)
{
    /// <summary>The mirror this placement describes, in site metres.</summary>
    public ConvexMirror ToMirror() =>
        ConvexMirror.Aimed(new Vec3(XM, YM, CentreHeightM), AzimuthDeg, TiltDownDeg, RadiusM, Aperture);

    /// <summary>The same mirror with its aim off by the given errors, as the aim tolerance is tried.</summary>
    /// <param name="azimuthOffsetDeg">Azimuth error, degrees, positive clockwise; the result stays within [0, 360).</param>
    /// <param name="tiltOffsetDeg">Tilt error, degrees, positive further down.</param>
    public MirrorPlacement AimedOffBy(double azimuthOffsetDeg, double tiltOffsetDeg) =>
        this with { AzimuthDeg = ((AzimuthDeg + azimuthOffsetDeg) % 360 + 360) % 360, TiltDownDeg = TiltDownDeg + tiltOffsetDeg };
}
