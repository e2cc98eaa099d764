namespace SafetyMirror.Reports.Charts;

/// <summary>Round tick values for a chart axis: a 1, 2 or 5 × 10ⁿ step and the range widened to whole steps.</summary>
public sealed record AxisTicks
{
    private AxisTicks(double min, double max, double step)
    {
        Min = min;
        Max = max;
        Step = step;
        var decimals = Math.Max(0, -(int)Math.Floor(Math.Log10(step)));
        var count = (int)Math.Round((max - min) / step);
        // Each value is rounded to the step's decimals so that 0.1 + 0.2 prints and compares as 0.3.
        Values = Enumerable.Range(0, count + 1).Select(i => Math.Round(min + i * step, decimals)).ToList();
    }

    /// <summary>The first tick, a whole multiple of <see cref="Step"/>.</summary>
    public double Min { get; }

    /// <summary>The last tick, a whole multiple of <see cref="Step"/>.</summary>
    public double Max { get; }

    /// <summary>The distance between ticks.</summary>
    public double Step { get; }

    /// <summary>The ticks from <see cref="Min"/> to <see cref="Max"/>.</summary>
    public IReadOnlyList<double> Values { get; }

    /// <summary>The smallest round step giving at most <paramref name="maxIntervals"/> intervals over [min, max].</summary>
    /// <remarks>An empty range (min = max) is widened by one unit each way, or by 10 % of the value if that is larger.</remarks>
    public static AxisTicks For(double min, double max, int maxIntervals)
    {
        Checks.Finite(min, "axis units");
        Checks.Finite(max, "axis units");
        ArgumentOutOfRangeException.ThrowIfLessThan(maxIntervals, 1);
        if (max < min)
        {
            throw new ArgumentOutOfRangeException(nameof(max), max, $"max must not be below min ({min}); it was {max}.");
        }

        if (max == min)
        {
            var pad = Math.Max(1, Math.Abs(min) * 0.1);
            (min, max) = (min - pad, max + pad);
        }

        var step = RoundNumbers.AtLeast((max - min) / maxIntervals);
        while (true)
        {
            var first = Math.Floor(min / step + 1e-9) * step;
            var last = Math.Ceiling(max / step - 1e-9) * step;
            // Widening to whole steps can add an interval; the next round step then fits.
            if (Math.Round((last - first) / step) <= maxIntervals)
            {
                return new AxisTicks(first, last, step);
            }

            step = RoundNumbers.AtLeast(step * 1.01);
        }
    }
}
