namespace SafetyMirror.Core.Design.Recommendation;

/// <summary>How good a design is, compared in the order the recommendation ranks by.</summary>
/// <param name="Standing">0: meets the verdict (requirement at every aim within the tolerance, every siting check);
/// 1: its view would meet it but a siting check fails; 2: its view falls short.</param>
/// <param name="Coverage">Smallest, over the served approaches and decisive road users, of the fraction of the required distance
/// provided at the aim as set (1 = reached).</param>
/// <param name="FaceAreaM2">Total face area (smaller is cheaper, catches less wind and glare).</param>
/// <param name="Margin">Smallest provided ÷ required distance over the aims within the tolerance (the worst case).</param>
/// <param name="UnseenM">Longest unseen stretch over the aims within the tolerance, in metres.</param>
/// <param name="NearBlindZoneM">Longest near blind zone over the served approaches at the aim as set.</param>
/// <param name="Robustness">Worst coverage over the aims within the tolerance; NaN until measured.</param>
public readonly record struct DesignScore(int Standing, double Coverage, double FaceAreaM2, double Margin, double UnseenM, double NearBlindZoneM, double Robustness)
    : IComparable<DesignScore>
{
    /// <summary>Margins beyond this do not make a design better: twice the required distance is plenty.</summary>
    public const double MarginCap = 2;

    /// <summary>True when the design meets the verdict.</summary>
    public bool MeetsRequirement => Standing == 0;

    /// <summary>The ranking key: each term quantised, so that equal-looking scores are equal and the order is total and transitive.</summary>
    /// <remarks>Larger is better in every place. A term not measured (NaN) counts as the worst value.</remarks>
    public (long Standing, long Coverage, long Face, long Margin, long Unseen, long BlindZone, long Robustness) Key => (
        -Standing,
        Higher(Coverage, 1e4),
        Lower(FaceAreaM2, 1e5),
        Higher(Math.Min(Margin, MarginCap), 1e3),
        Lower(UnseenM, 1e2),
        Lower(NearBlindZoneM, 1e2),
        Higher(Robustness, 1e4));

    /// <summary>Positive when this design ranks ahead of the other: standing, coverage, the smaller face, the worst-case
    /// margin, the shorter unseen stretch and blind zone, then robustness.</summary>
    public int CompareTo(DesignScore other) => Key.CompareTo(other.Key);

    private static long Higher(double value, double perUnit) => double.IsNaN(value) ? long.MinValue : (long)Math.Round(Math.Clamp(value, -1e9, 1e9) * perUnit);

    private static long Lower(double value, double perUnit) => double.IsNaN(value) ? long.MinValue : -(long)Math.Round(Math.Clamp(value, -1e9, 1e9) * perUnit);

    /// <summary>Compares two scores by rank.</summary>
    public static bool operator <(DesignScore left, DesignScore right) => left.CompareTo(right) < 0;

    /// <summary>Compares two scores by rank.</summary>
    public static bool operator >(DesignScore left, DesignScore right) => left.CompareTo(right) > 0;

    /// <summary>Compares two scores by rank.</summary>
    public static bool operator <=(DesignScore left, DesignScore right) => left.CompareTo(right) <= 0;

    /// <summary>Compares two scores by rank.</summary>
    public static bool operator >=(DesignScore left, DesignScore right) => left.CompareTo(right) >= 0;
}
