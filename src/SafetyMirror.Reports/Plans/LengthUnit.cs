namespace SafetyMirror.Reports.Plans;

/// <summary>A unit for lengths shown on a plan (station labels and the scale bar): its symbol and its size in metres.</summary>
public sealed record LengthUnit
{
    /// <summary>Creates a unit; <paramref name="metres"/> is how many metres one unit is.</summary>
    public LengthUnit(string symbol, double metres)
    {
        ArgumentException.ThrowIfNullOrWhiteSpace(symbol);
        Symbol = symbol;
        Metres = Checks.Positive(metres, "m");
    }

    /// <summary>The metre.</summary>
    public static LengthUnit Metre { get; } = new("m", 1);

    /// <summary>The international foot, exactly 0.3048 m.</summary>
    public static LengthUnit Foot { get; } = new("ft", 0.3048);

    /// <summary>The symbol printed after a number, e.g. "m".</summary>
    public string Symbol { get; }

    /// <summary>One unit in metres.</summary>
    public double Metres { get; }
}
