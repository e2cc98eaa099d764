namespace SafetyMirror.Core.Design.Recommendation;

/// <summary>How good a design is, compared in the order the recommendation ranks by.</summary>
/// <param name="Coverage">Smallest, over the served approaches, of the fraction of the required distance out to which the
/// stretch is shown and the design road user recognisable (1 = requirement met on every approach).</param>
/// <param name="FaceAreaM2">Total face area (smaller is cheaper, catches less wind and glare).</param>
/// <param name="Margin">Smallest, over the served approaches, of recognition distance ÷ required distance.</param>
/// <param name="NearBlindZoneM">Longest near blind zone over the served approaches.</param>
/// <param name="Robustness">Worst coverage kept when the aim is off by the tolerance; NaN until measured.</param>
public readonly record struct DesignScore(double Coverage, double FaceAreaM2, double Margin, double NearBlindZoneM, double Robustness)
    : IComparable<DesignScore>
{
    private const double Tie = 1e-6;

    /// <summary>True when every served approach is covered out to its required distance.</summary>
    public bool MeetsRequirement => Coverage >= 1 - Tie;

    /// <summary>Positive when this design ranks ahead of the other: coverage, then the smaller face, then margin,
    /// then the shorter blind zone, then robustness.</summary>
    public int CompareTo(DesignScore other)
    {
        // A term not measured (NaN) on either side decides nothing.
        int Better(double mine, double theirs, bool higherWins) =>
            double.IsNaN(mine) || double.IsNaN(theirs) || Math.Abs(mine - theirs) <= Tie * Math.Max(1, Math.Abs(theirs)) ? 0
            : (mine > theirs) == higherWins ? 1 : -1;

        var order = Better(Coverage, other.Coverage, higherWins: true);
        if (order == 0)
        {
            order = Better(FaceAreaM2, other.FaceAreaM2, higherWins: false);
        }

        if (order == 0)
        {
            order = Better(Math.Min(Margin, MarginCap), Math.Min(other.Margin, MarginCap), higherWins: true);
        }

        if (order == 0)
        {
            order = Better(NearBlindZoneM, other.NearBlindZoneM, higherWins: false);
        }

        if (order == 0)
        {
            order = Better(Robustness, other.Robustness, higherWins: true);
        }

        return order;
    }

    /// <summary>Margins beyond this do not make a design better: twice the required distance is plenty.</summary>
    public const double MarginCap = 2;
}
