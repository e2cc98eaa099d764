using System.Runtime.CompilerServices;
using SafetyMirror.Reports.Graphics;

namespace SafetyMirror.Reports;

/// <summary>Argument checks whose messages state the allowed range.</summary>
internal static class Checks
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

    /// <summary>Throws unless <paramref name="value"/> is a finite number.</summary>
    public static double Finite(double value, string unit, [CallerArgumentExpression(nameof(value))] string? name = null)
    {
        if (!double.IsFinite(value))
        {
            throw new ArgumentOutOfRangeException(name, value, $"{name} must be a finite number of {unit}; it was {value}.");
        }

        return value;
    }

    /// <summary>Throws unless <paramref name="value"/> is finite and within [min, max].</summary>
    public static double InRange(double value, double min, double max, [CallerArgumentExpression(nameof(value))] string? name = null)
    {
        if (!double.IsFinite(value) || value < min || value > max)
        {
            throw new ArgumentOutOfRangeException(name, value, $"{name} must be a finite number from {min} to {max}; it was {value}.");
        }

        return value;
    }

    /// <summary>Throws unless the list has at least <paramref name="minimum"/> points and every point is finite.</summary>
    public static IReadOnlyList<PointMm> Points(IReadOnlyList<PointMm> points, int minimum, [CallerArgumentExpression(nameof(points))] string? name = null)
    {
        ArgumentNullException.ThrowIfNull(points, name);
        if (points.Count < minimum)
        {
            throw new ArgumentException($"{name} must have at least {minimum} points; it had {points.Count}.", name);
        }

        if (!points.All(p => p.IsFinite))
        {
            throw new ArgumentException($"{name} must have finite coordinates in mm.", name);
        }

        return points;
    }
}
