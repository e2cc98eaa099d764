namespace SafetyMirror.Core.Design;

/// <summary>A way of fixing the sight distance an approach needs: a published method or a local code value.</summary>
/// <remarks>
/// The hierarchy is closed: <see cref="StoppingSightDistance"/>, <see cref="IntersectionSightDistance"/> and
/// <see cref="FixedSightDistance"/>. Each states where it comes from and the heights a sightline is checked at.
/// </remarks>
public abstract record SightDistanceMethod
{
    /// <summary>Highest approach speed accepted, in km/h.</summary>
    public const double MaximumSpeedKmh = 200;

    /// <summary>Lowest approach speed accepted, in km/h.</summary>
    public const double MinimumSpeedKmh = 5;

    /// <summary>Steepest grade accepted either way, in percent.</summary>
    public const double MaximumGradePercent = 15;

    private protected SightDistanceMethod()
    {
    }

    /// <summary>Where the method or value comes from, for the report.</summary>
    public abstract string Source { get; }

    /// <summary>Height of the driver's eye above the road the method assumes, in metres.</summary>
    public abstract double EyeHeightM { get; }

    /// <summary>Height above the road of the point that must stay visible, in metres.</summary>
    public abstract double ObjectHeightM { get; }

    /// <summary>The sight distance an approach at this speed and grade needs.</summary>
    /// <remarks>
    /// Speed from 5 to 200 km/h; grade from −15 to +15 percent, positive uphill in the direction of travel of
    /// the approaching vehicle. Out-of-range values throw <see cref="ArgumentOutOfRangeException"/>.
    /// </remarks>
    public RequiredSightDistance Required(double approachSpeedKmh, double gradePercent = 0)
    {
        Preconditions.InRange(approachSpeedKmh, MinimumSpeedKmh, MaximumSpeedKmh, "km/h");
        Preconditions.InRange(gradePercent, -MaximumGradePercent, MaximumGradePercent, "%");
        var (computedM, formula) = Compute(approachSpeedKmh, gradePercent);
        return new RequiredSightDistance(
            this, approachSpeedKmh, gradePercent, formula, computedM, DesignDistanceM(computedM), EyeHeightM, ObjectHeightM);
    }

    /// <summary>The distance in metres before rounding, and the formula that gave it.</summary>
    private protected abstract (double DistanceM, string Formula) Compute(double speedKmh, double gradePercent);

    /// <summary>The design value: AASHTO tables round the computed distance up to the next 5 m.</summary>
    private protected virtual double DesignDistanceM(double computedM) =>
        // Rounded to the micrometre first so float noise on an exact multiple of 5 m does not add 5 m.
        Math.Ceiling(Math.Round(computedM, 6) / 5) * 5;
}
