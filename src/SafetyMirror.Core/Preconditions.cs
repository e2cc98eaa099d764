using System.Runtime.CompilerServices;

namespace SafetyMirror.Core;

/// <summary>Argument checks whose messages state the allowed range.</summary>
internal static class Preconditions
{
    /// <summary>Throws unless <paramref name="value"/> is finite and strictly positive.</summary>
    public static double Positive(double value, string unit, [CallerArgumentExpression(nameof(value))] string? name = null)
    {
        if (!double.IsFinite(value) || value <= 0)
        {
            throw new ArgumentOutOfRangeException(name, value, $"{name} must be a finite number greater than 0 {unit}; it was {value}.");
        }

        return value;
    }

    /// <summary>Throws unless <paramref name="value"/> is finite and within [min, max].</summary>
    public static double InRange(double value, double min, double max, string unit, [CallerArgumentExpression(nameof(value))] string? name = null)
    {
        if (!double.IsFinite(value) || value < min || value > max)
        {
            throw new ArgumentOutOfRangeException(name, value, $"{name} must be a finite number from {min} to {max} {unit}; it was {value}.");
        }

        return value;
    }

    /// <summary>Throws unless every component of <paramref name="value"/> is finite.</summary>
    public static Optics.Vec3 Finite(Optics.Vec3 value, [CallerArgumentExpression(nameof(value))] string? name = null)
    {
        if (!value.IsFinite)
        {
            throw new ArgumentOutOfRangeException(name, value, $"{name} must have finite x, y and z in metres; it was {value}.");
        }

        return value;
    }

    /// <summary>Throws unless the vector is finite and of non-zero length; returns it normalised.</summary>
    public static Optics.Vec3 Direction(Optics.Vec3 value, [CallerArgumentExpression(nameof(value))] string? name = null)
    {
        Finite(value, name);
        if (value.Length < 1e-12)
        {
            throw new ArgumentOutOfRangeException(name, value, $"{name} must be a direction of non-zero length; it was {value}.");
        }

        return value.Normalized();
    }
}
