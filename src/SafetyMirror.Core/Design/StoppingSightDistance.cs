using static System.FormattableString;

namespace SafetyMirror.Core.Design;

/// <summary>AASHTO stopping sight distance: reaction distance plus braking distance, in metric or US customary units.</summary>
/// <remarks>
/// Metric, V in km/h, a in m/s², metres: level ground SSD = 0.278·V·t + 0.039·V²/a; on a grade G (decimal, + uphill)
/// the braking part is V²/(254·(a/9.81 + G)). US customary (<see cref="UsCustomary"/>), V in mph, a in ft/s², feet:
/// 1.47·V·t + 1.075·V²/a, on a grade V²/(30·(a/32.2 + G)). Either way the design value is rounded up to the next 5 units
/// (Table 3-1). The grade form at G = 0 is about 0.6 % shorter than the level form and rounds below the published
/// table at 90 km/h, so the level form is used whenever the grade is zero.
/// </remarks>
public sealed record StoppingSightDistance : SightDistanceMethod
{
    private const double GravityMps2 = 9.81;
    private const double GravityFtps2 = 32.2;

    /// <summary>Lowest US customary deceleration accepted, in ft/s² (about 1 m/s²).</summary>
    public const double MinimumDecelerationFtps2 = 3.3;

    /// <summary>Highest US customary deceleration accepted, in ft/s² (g in the customary formula).</summary>
    public const double MaximumDecelerationFtps2 = GravityFtps2;

    // The deceleration as given, in the units of the formula it goes into (m/s² or ft/s²).
    private readonly double deceleration;

    /// <summary>Creates the metric method; AASHTO's defaults are 2.5 s reaction and 3.4 m/s² deceleration.</summary>
    /// <remarks>Reaction time from 0.5 to 5 s; deceleration from 1 to 9.81 m/s².</remarks>
    public StoppingSightDistance(double reactionTimeS = 2.5, double decelerationMps2 = 3.4)
        : this(reactionTimeS, Preconditions.InRange(decelerationMps2, 1, GravityMps2, "m/s²"), DesignUnits.Metric)
    {
    }

    private StoppingSightDistance(double reactionTimeS, double deceleration, DesignUnits units)
    {
        ReactionTimeS = Preconditions.InRange(reactionTimeS, 0.5, 5, "s");
        this.deceleration = deceleration;
        Units = units;
    }

    /// <summary>The US customary method; AASHTO's defaults are 2.5 s reaction and 11.2 ft/s² deceleration.</summary>
    /// <remarks>Reaction time from 0.5 to 5 s; deceleration from 3.3 to 32.2 ft/s².</remarks>
    public static StoppingSightDistance UsCustomary(double reactionTimeS = 2.5, double decelerationFtps2 = 11.2) =>
        new(reactionTimeS, Preconditions.InRange(decelerationFtps2, MinimumDecelerationFtps2, MaximumDecelerationFtps2, "ft/s²"), DesignUnits.UsCustomary);

    /// <summary>Brake reaction time, in seconds.</summary>
    public double ReactionTimeS { get; }

    /// <summary>Deceleration rate on level ground, in m/s² (for the US customary method, its ft/s² converted exactly).</summary>
    public double DecelerationMps2 => Units == DesignUnits.Metric ? deceleration : deceleration * MetresPerFoot;

    /// <summary>Deceleration rate on level ground, in ft/s² (for the metric method, its m/s² converted exactly).</summary>
    public double DecelerationFtps2 => Units == DesignUnits.UsCustomary ? deceleration : deceleration / MetresPerFoot;

    /// <inheritdoc />
    public override DesignUnits Units { get; }

    /// <inheritdoc />
    public override string Source => Units == DesignUnits.Metric
        ? "AASHTO, A Policy on Geometric Design of Highways and Streets (2011), stopping sight distance (Table 3-1)"
        : "AASHTO, A Policy on Geometric Design of Highways and Streets (2011), stopping sight distance, US customary (Table 3-1; on a grade, Table 3-2)";

    /// <inheritdoc />
    /// <remarks>US customary: 3.5 ft (1.0668 m).</remarks>
    public override double EyeHeightM => Units == DesignUnits.Metric ? 1.08 : 3.5 * MetresPerFoot;

    /// <inheritdoc />
    /// <remarks>US customary: 2.0 ft (0.6096 m).</remarks>
    public override double ObjectHeightM => Units == DesignUnits.Metric ? 0.60 : 2.0 * MetresPerFoot;

    /// <inheritdoc />
    public override string? GradeProblem(double gradePercent)
    {
        // A downgrade steeper than the braking can hold: no finite stopping distance exists.
        var gravity = Units == DesignUnits.Metric ? GravityMps2 : GravityFtps2;
        if ((deceleration / gravity) + (gradePercent / 100) > 0)
        {
            return null;
        }

        var unit = Units == DesignUnits.Metric ? "m/s²" : "ft/s²";
        return Invariant($"{nameof(gradePercent)} must be greater than {-100 * deceleration / gravity:0.##} % for a deceleration of {deceleration} {unit}; it was {gradePercent}.");
    }

    private protected override (double Distance, string Formula, string? Table) Compute(double speedKmh, double speedMph, double gradePercent)
    {
        var metric = Units == DesignUnits.Metric;
        var (v, reaction, gravity) = metric ? (speedKmh, 0.278 * speedKmh * ReactionTimeS, GravityMps2) : (speedMph, 1.47 * speedMph * ReactionTimeS, GravityFtps2);
        if (gradePercent == 0)
        {
            return metric
                ? (reaction + (0.039 * v * v / deceleration), "0.278·V·t + 0.039·V²/a", "Table 3-1")
                : (reaction + (1.075 * v * v / deceleration), "1.47·V·t + 1.075·V²/a", "Table 3-1");
        }

        if (GradeProblem(gradePercent) is { } problem)
        {
            throw new ArgumentOutOfRangeException(nameof(gradePercent), gradePercent, problem);
        }

        var friction = (deceleration / gravity) + (gradePercent / 100);
        return metric
            ? (reaction + (v * v / (254 * friction)), "0.278·V·t + V²/(254·(a/9.81 + G))", "Table 3-2")
            : (reaction + (v * v / (30 * friction)), "1.47·V·t + V²/(30·(a/32.2 + G))", "Table 3-2");
    }
}
