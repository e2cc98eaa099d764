namespace SafetyMirror.Core.Design;

/// <summary>A sight distance fixed by a local code or policy, used as given.</summary>
public sealed record FixedSightDistance : SightDistanceMethod
{
    /// <summary>Creates the method from a distance and the code it comes from.</summary>
    /// <remarks>
    /// Distance from 1 to 2000 m. The heights default to the AASHTO driver's eye (1.08 m) and stopping
    /// object (0.60 m); pass the code's own where it sets them, each from 0 to 5 m.
    /// </remarks>
    public FixedSightDistance(double distanceM, string reference, double eyeHeightM = 1.08, double objectHeightM = 0.60)
    {
        DistanceM = Preconditions.InRange(distanceM, 1, 2000, "m");
        ArgumentException.ThrowIfNullOrWhiteSpace(reference);
        Source = reference;
        EyeHeightM = Preconditions.InRange(eyeHeightM, 0, 5, "m");
        ObjectHeightM = Preconditions.InRange(objectHeightM, 0, 5, "m");
    }

    /// <summary>The distance the code requires, in metres.</summary>
    public double DistanceM { get; }

    /// <summary>Free-text reference to the code, clause and edition.</summary>
    public override string Source { get; }

    /// <inheritdoc />
    /// <remarks>Always metric: the distance is given in metres.</remarks>
    public override DesignUnits Units => DesignUnits.Metric;

    /// <inheritdoc />
    public override double EyeHeightM { get; }

    /// <inheritdoc />
    public override double ObjectHeightM { get; }

    private protected override (double Distance, string Formula, string? Table) Compute(double speedKmh, double speedMph, double gradePercent) =>
        (DistanceM, "fixed by local code", null);

    // The code's figure is already a design value: no rounding.
    private protected override double DesignDistance(double computed) => computed;
}
