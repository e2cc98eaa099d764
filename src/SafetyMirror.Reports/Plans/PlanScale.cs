namespace SafetyMirror.Reports.Plans;

/// <summary>The round plan scales (1:50, 1:100, 1:200, 1:250, 1:500, 1:1000, …) and the choice of one that fits.</summary>
/// <remarks>The series is 1, 2, 2.5 and 5 times a power of ten, the ratios printed on drafting scale rules.</remarks>
public static class PlanScale
{
    private const int Smallest = 50;
    private static readonly int[] Steps = [10, 20, 25, 50];

    /// <summary>The scale denominators in increasing order, from 1:50.</summary>
    public static IEnumerable<int> Denominators()
    {
        for (var decade = 1; decade <= 10_000_000; decade *= 10)
        {
            foreach (var step in Steps)
            {
                if (step * decade >= Smallest)
                {
                    yield return step * decade;
                }
            }
        }
    }

    /// <summary>The largest round scale (smallest denominator) at which an extent in metres fits a box in millimetres.</summary>
    /// <remarks>A zero extent (a single point) gets the largest scale, 1:50.</remarks>
    public static int Choose(double extentWidthM, double extentHeightM, double boxWidthMm, double boxHeightMm)
    {
        if (!(extentWidthM >= 0) || !(extentHeightM >= 0) || !double.IsFinite(extentWidthM) || !double.IsFinite(extentHeightM))
        {
            throw new ArgumentOutOfRangeException(nameof(extentWidthM), $"The extent must be finite and not negative; it was {extentWidthM} m by {extentHeightM} m.");
        }

        Checks.Positive(boxWidthMm, "mm");
        Checks.Positive(boxHeightMm, "mm");
        var fitting = Denominators().FirstOrDefault(d => extentWidthM * 1000 / d <= boxWidthMm && extentHeightM * 1000 / d <= boxHeightMm);
        return fitting > 0
            ? fitting
            : throw new ArgumentOutOfRangeException(nameof(extentWidthM), $"An extent of {extentWidthM} m by {extentHeightM} m does not fit a plan even at 1:{Denominators().Last()}.");
    }
}
