using SafetyMirror.Core.Optics;

namespace SafetyMirror.Core.Sun;

/// <summary>Where the sun stands, seen from one place on the earth at one instant.</summary>
/// <remarks>Angles in degrees. The azimuth is clockwise from true north; the elevation is the apparent one, with the
/// atmosphere's refraction added to the geometric elevation.</remarks>
/// <param name="AzimuthDeg">Compass azimuth from true north, 0 to 360.</param>
/// <param name="ElevationDeg">Apparent elevation above the astronomical horizon (geometric plus refraction).</param>
/// <param name="GeometricElevationDeg">Elevation without the atmosphere.</param>
/// <param name="RefractionDeg">What the atmosphere lifts the sun by.</param>
/// <param name="DeclinationDeg">The sun's apparent declination.</param>
/// <param name="RightAscensionDeg">The sun's apparent right ascension, 0 to 360.</param>
/// <param name="EquationOfTimeMin">Apparent minus mean solar time, in minutes.</param>
/// <param name="HourAngleDeg">Local hour angle, −180 to 180, negative before solar noon.</param>
public readonly record struct SunPosition(
    double AzimuthDeg,
    double ElevationDeg,
    double GeometricElevationDeg,
    double RefractionDeg,
    double DeclinationDeg,
    double RightAscensionDeg,
    double EquationOfTimeMin,
    double HourAngleDeg)
{
    /// <summary>Angular diameter of the sun's disc, in degrees (it varies from 0.524° to 0.542° over the year).</summary>
    public const double DiscDiameterDeg = 0.53;

    /// <summary>Whether any part of the disc stands above the astronomical horizon.</summary>
    public bool IsAboveHorizon => ElevationDeg > -DiscDiameterDeg / 2;

    /// <summary>The unit direction toward the sun: x east, y true north, z up.</summary>
    public Vec3 Direction => DirectionOf(AzimuthDeg, ElevationDeg);

    /// <summary>The unit direction of a compass azimuth and an elevation, both in degrees: x east, y north, z up.</summary>
    public static Vec3 DirectionOf(double azimuthDeg, double elevationDeg)
    {
        double azimuth = Angles.FromDeg(azimuthDeg), elevation = Angles.FromDeg(elevationDeg);
        return new Vec3(Math.Sin(azimuth) * Math.Cos(elevation), Math.Cos(azimuth) * Math.Cos(elevation), Math.Sin(elevation));
    }
}
