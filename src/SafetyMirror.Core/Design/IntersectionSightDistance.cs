using System.Runtime.CompilerServices;

namespace SafetyMirror.Core.Design;

/// <summary>AASHTO intersection sight distance for a driver departing from a stop: ISD = 0.278·V·t_g (metres, V in
/// km/h), or in US customary units 1.47·V·t_g (feet, V in mph).</summary>
/// <remarks>
/// The design value is rounded up to the next 5 m, or 5 ft (Tables 9-6 and 9-8). The time gap t_g depends on the manoeuvre (cases B1, B2, B3) and the departing vehicle, plus 0.5 s
/// (car) or 0.7 s (truck) for each extra lane crossed. AASHTO's adjustment for an upgrade on the minor
/// road is not applied; the approach grade does not enter the formula.
/// </remarks>
public sealed record IntersectionSightDistance : SightDistanceMethod
{
    /// <summary>Most extra lanes accepted.</summary>
    public const int MaximumExtraLanes = 10;

    /// <summary>Creates the method for a manoeuvre, a departing vehicle and the extra lanes it crosses.</summary>
    /// <remarks>
    /// Extra lanes from 0 to 10: lanes to cross beyond those of a two-lane road, turn lanes included.
    /// A turn into the near lane crosses no lane, so it takes none. <paramref name="units"/> chooses the metric or the US
    /// customary formula and table.
    /// </remarks>
    public IntersectionSightDistance(
        IntersectionManeuver maneuver = IntersectionManeuver.TurnAcrossTraffic,
        DepartingVehicle vehicle = DepartingVehicle.PassengerCar,
        int extraLanesCrossed = 0,
        DesignUnits units = DesignUnits.Metric)
    {
        Maneuver = Defined(maneuver);
        Vehicle = Defined(vehicle);
        Units = Defined(units);
        ExtraLanesCrossed = (int)Preconditions.InRange(extraLanesCrossed, 0, MaximumExtraLanes, "lanes");
        if (maneuver == IntersectionManeuver.TurnIntoNearLane && extraLanesCrossed != 0)
        {
            throw new ArgumentOutOfRangeException(
                nameof(extraLanesCrossed),
                extraLanesCrossed,
                $"{nameof(extraLanesCrossed)} must be 0 for a turn into the near lane, which crosses no lane; it was {extraLanesCrossed}.");
        }
    }

    /// <summary>The manoeuvre from the stop.</summary>
    public IntersectionManeuver Maneuver { get; }

    /// <summary>The vehicle departing from the stop.</summary>
    public DepartingVehicle Vehicle { get; }

    /// <summary>Lanes to cross beyond those of a two-lane road.</summary>
    public int ExtraLanesCrossed { get; }

    /// <summary>The time gap used, in seconds, extra lanes included.</summary>
    public double TimeGapS => BaseTimeGapS + (ExtraLanesCrossed * (Vehicle == DepartingVehicle.PassengerCar ? 0.5 : 0.7));

    /// <inheritdoc />
    public override DesignUnits Units { get; }

    /// <inheritdoc />
    public override string Source => Units == DesignUnits.Metric
        ? "AASHTO, A Policy on Geometric Design of Highways and Streets (2011), intersection sight distance, cases B1–B3 (as quoted in TxDOT Roadway Design Manual §13.5.2)"
        : "AASHTO, A Policy on Geometric Design of Highways and Streets (2011), intersection sight distance, cases B1–B3, US customary (Tables 9-6 and 9-8)";

    /// <inheritdoc />
    /// <remarks>US customary: 3.5 ft (1.0668 m).</remarks>
    public override double EyeHeightM => Units == DesignUnits.Metric ? 1.08 : 3.5 * MetresPerFoot;

    /// <inheritdoc />
    /// <remarks>US customary: 3.5 ft (1.0668 m).</remarks>
    public override double ObjectHeightM => EyeHeightM;

    private double BaseTimeGapS => (Maneuver, Vehicle) switch
    {
        (IntersectionManeuver.TurnAcrossTraffic, DepartingVehicle.PassengerCar) => 7.5,
        (IntersectionManeuver.TurnAcrossTraffic, DepartingVehicle.SingleUnitTruck) => 9.5,
        (IntersectionManeuver.TurnAcrossTraffic, _) => 11.5,
        (_, DepartingVehicle.PassengerCar) => 6.5,
        (_, DepartingVehicle.SingleUnitTruck) => 8.5,
        _ => 10.5,
    };

    // Case B1 is tabled in Table 9-6, cases B2 and B3 in Table 9-8 [memory].
    private protected override (double Distance, string Formula, string? Table) Compute(double speedKmh, double speedMph, double gradePercent) =>
        Units == DesignUnits.Metric
            ? (0.278 * speedKmh * TimeGapS, "0.278·V·t_g", CaseTable)
            : (1.47 * speedMph * TimeGapS, "1.47·V·t_g", CaseTable);

    private string CaseTable => Maneuver == IntersectionManeuver.TurnAcrossTraffic ? "Table 9-6" : "Table 9-8";

    private static T Defined<T>(T value, [CallerArgumentExpression(nameof(value))] string? name = null)
        where T : struct, Enum =>
        Enum.IsDefined(value)
            ? value
            : throw new ArgumentOutOfRangeException(name, value, $"{name} must be one of {string.Join(", ", Enum.GetNames<T>())}; it was {value}.");
}

/// <summary>The manoeuvre of a driver departing from a stop on the minor road (AASHTO cases B1–B3), named by what it
/// does to the major road's traffic so that it holds for either driving side.</summary>
public enum IntersectionManeuver
{
    /// <summary>Case B1: a turn across the near traffic stream into the far lane (a left turn where traffic keeps right).</summary>
    TurnAcrossTraffic,

    /// <summary>Case B2: a turn into the near lane (a right turn where traffic keeps right).</summary>
    TurnIntoNearLane,

    /// <summary>Case B3: straight across the major road.</summary>
    CrossingFromStop,
}

/// <summary>Which side of the road traffic keeps to.</summary>
public enum DrivingSide
{
    /// <summary>Traffic keeps right (most of the Americas and continental Europe).</summary>
    Right,

    /// <summary>Traffic keeps left (the United Kingdom, Ireland, Japan, Australia…).</summary>
    Left,
}

/// <summary>Turns named by their direction, mapped to the manoeuvre they are on a given driving side.</summary>
public static class IntersectionManeuvers
{
    /// <summary>The manoeuvre a left or right turn from a stop is: across traffic on the side opposite the one traffic keeps to.</summary>
    public static IntersectionManeuver Turn(bool leftTurn, DrivingSide side) =>
        leftTurn == (side == DrivingSide.Right) ? IntersectionManeuver.TurnAcrossTraffic : IntersectionManeuver.TurnIntoNearLane;
}

/// <summary>The design vehicle departing from the stop, which sets the time gap.</summary>
public enum DepartingVehicle
{
    /// <summary>Passenger car.</summary>
    PassengerCar,

    /// <summary>Single-unit truck.</summary>
    SingleUnitTruck,

    /// <summary>Combination truck (tractor and semitrailer).</summary>
    CombinationTruck,
}
