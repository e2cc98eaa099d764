namespace SafetyMirror.Core.Optics;

/// <summary>Conversions between the engine's radians and the units people read.</summary>
public static class Angles
{
    /// <summary>Arc minutes in one radian.</summary>
    public const double ArcminPerRadian = 180 * 60 / Math.PI;

    /// <summary>Radians to arc minutes.</summary>
    public static double ToArcmin(double radians) => radians * ArcminPerRadian;

    /// <summary>Arc minutes to radians.</summary>
    public static double FromArcmin(double arcmin) => arcmin / ArcminPerRadian;

    /// <summary>Radians to degrees.</summary>
    public static double ToDeg(double radians) => radians * 180 / Math.PI;

    /// <summary>Degrees to radians.</summary>
    public static double FromDeg(double degrees) => degrees * Math.PI / 180;
}
