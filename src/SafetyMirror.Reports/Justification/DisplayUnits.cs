using SafetyMirror.Core.Design;
using SafetyMirror.Reports.Plans;
using static System.FormattableString;

namespace SafetyMirror.Reports.Justification;

/// <summary>The units a report shows lengths and speeds in; the computation is always in SI units.</summary>
public enum UnitSystem
{
    /// <summary>Metres and km/h.</summary>
    Metric,

    /// <summary>Feet and mph, converted from the metric results.</summary>
    Imperial,
}

/// <summary>Formats lengths, heights and speeds in the report's unit system.</summary>
internal sealed class DisplayUnits(UnitSystem system)
{
    private const double KmPerMile = 1.609344;

    private bool Imperial => system == UnitSystem.Imperial;

    /// <summary>The unit of distances on plans and charts.</summary>
    public LengthUnit Length => Imperial ? LengthUnit.Foot : LengthUnit.Metre;

    /// <summary>A distance along the road: to 0.1 m, or to the foot.</summary>
    public string Distance(double metres) => Imperial ? Invariant($"{metres / LengthUnit.Foot.Metres:0} ft") : Invariant($"{metres:0.#} m");

    /// <summary>A stretch along the road, the unit written once: "0.7–35.7 m", or "2–117 ft".</summary>
    public string Range(double fromM, double toM) => Imperial
        ? Invariant($"{fromM / LengthUnit.Foot.Metres:0}–{toM / LengthUnit.Foot.Metres:0} ft")
        : Invariant($"{fromM:0.#}–{toM:0.#} m");

    /// <summary>A height or a short length on the mirror's mounting: to the centimetre, or to 0.1 ft.</summary>
    public string Height(double metres) => Imperial ? Invariant($"{metres / LengthUnit.Foot.Metres:0.0} ft") : Invariant($"{metres:0.00} m");

    /// <summary>A speed: km/h, or mph to 0.1.</summary>
    public string Speed(double kmh) => Imperial ? Invariant($"{kmh / KmPerMile:0.#} mph") : Invariant($"{kmh:0.#} km/h");

    /// <summary>
    /// The required sight distance with where it comes from, the way it was computed: "250 ft (AASHTO 2011, US customary,
    /// Table 3-1; computed 246.2 ft; 1.47·V·t + 1.075·V²/a)", its design value printed as its own table gives it.
    /// </summary>
    /// <remarks>A requirement in the other system also shows its own value: "76.2 m (250 ft, AASHTO 2011, US customary, …)",
    /// "115 ft (35 m, AASHTO metric; computed 31.2 m; …)".</remarks>
    public string Requirement(RequiredSightDistance required)
    {
        var own = required.Units == DesignUnits.UsCustomary;
        if (own == Imperial)
        {
            var citation = own ? $"AASHTO 2011, US customary, {required.Table}; " : "";
            return $"{required.DesignText} ({citation}computed {required.ComputedText}; {required.Formula})";
        }

        var system = own ? $"AASHTO 2011, US customary, {required.Table}" : "metric design value";
        return $"{Distance(required.DesignM)} ({required.DesignText}, {system}; computed {required.ComputedText}; {required.Formula})";
    }

    /// <summary>A deceleration: m/s², or ft/s².</summary>
    public string Deceleration(double metresPerSecond2) =>
        Imperial ? Invariant($"{metresPerSecond2 / LengthUnit.Foot.Metres:0.0} ft/s²") : Invariant($"{metresPerSecond2:0.0#} m/s²");

    /// <summary>A value with a unit of the siting rules ("m", "km/h" or none), in the report's units.</summary>
    public string Quantity(double value, string unit) => unit switch
    {
        "m" => Height(value),
        "km/h" => Speed(value),
        _ => Invariant($"{value:0.##} {unit}").TrimEnd(),
    };

    /// <summary>Metres in the report's length unit, for plotting.</summary>
    public double ToLength(double metres) => metres / Length.Metres;

    /// <summary>A round interval for distance ticks along an approach, in metres: 10 m, or 50 ft.</summary>
    public double TickIntervalM => Imperial ? 50 * LengthUnit.Foot.Metres : 10;

    /// <summary>What the conversion is, for the method section; null for metric.</summary>
    public string? ConversionNote => Imperial
        ? "Lengths and speeds are computed in SI units and shown converted: 1 ft = 0.3048 m, 1 mph = 1.609344 km/h. A required sight distance from AASHTO's US customary formula and table is shown in feet as that table gives it."
        : null;
}
