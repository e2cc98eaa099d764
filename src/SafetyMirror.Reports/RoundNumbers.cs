namespace SafetyMirror.Reports;

/// <summary>Round numbers of the 1, 2, 5 series (…, 0.5, 1, 2, 5, 10, 20, …) for ticks and scale bars.</summary>
internal static class RoundNumbers
{
    private static readonly double[] Mantissas = [1, 2, 5];

    /// <summary>The smallest number of the series not below <paramref name="value"/> (which must be positive).</summary>
    public static double AtLeast(double value) => Pick(Checks.Positive(value, ""), up: true);

    /// <summary>The largest number of the series not above <paramref name="value"/> (which must be positive).</summary>
    public static double AtMost(double value) => Pick(Checks.Positive(value, ""), up: false);

    private static double Pick(double value, bool up)
    {
        var decade = Math.Pow(10, Math.Floor(Math.Log10(value)));
        // The relative tolerance keeps a value that is already round (to the last bits) where it is.
        var candidates = Mantissas.Select(m => m * decade).Append(decade * 10);
        return up
            ? candidates.First(c => c >= value * (1 - 1e-9))
            : candidates.Last(c => c <= value * (1 + 1e-9));
    }
}
