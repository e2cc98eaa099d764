using SafetyMirror.Core.Site;

namespace SafetyMirror.Core.Design;

/// <summary>The units a method's formula and design table are stated in.</summary>
public enum DesignUnits
{
    /// <summary>Metres and km/h (the Green Book's metric values).</summary>
    Metric,

    /// <summary>Feet and mph (the Green Book's US customary values, a table of their own, not a conversion of the metric one).</summary>
    UsCustomary,
}

/// <summary>A way of fixing the sight distance an approach needs: a published method or a local code value.</summary>
/// <remarks>
/// The hierarchy is closed: <see cref="StoppingSightDistance"/>, <see cref="IntersectionSightDistance"/> and
/// <see cref="FixedSightDistance"/>. Each states where it comes from, the heights a sightline is checked at and the
/// <see cref="Units"/> its formula and table are in. A US customary method computes in feet and mph and rounds up to
/// the next 5 ft, as its own table does; the requirement carries those figures and their exact metric conversion.
/// </remarks>
public abstract record SightDistanceMethod
{
    /// <summary>Highest approach speed accepted, in km/h.</summary>
    public const double MaximumSpeedKmh = 200;

    /// <summary>Lowest approach speed accepted, in km/h.</summary>
    public const double MinimumSpeedKmh = 5;

    /// <summary>Highest approach speed accepted, in mph (above 200 km/h).</summary>
    public const double MaximumSpeedMph = 125;

    /// <summary>Lowest approach speed accepted, in mph (below 5 km/h).</summary>
    public const double MinimumSpeedMph = 3;

    /// <summary>Steepest grade accepted either way, in percent.</summary>
    public const double MaximumGradePercent = 15;

    /// <summary>Metres in a foot (exact, by the international yard of 1959).</summary>
    public const double MetresPerFoot = 0.3048;

    private protected SightDistanceMethod()
    {
    }

    /// <summary>Where the method or value comes from, for the report.</summary>
    public abstract string Source { get; }

    /// <summary>The units the method's formula and design table are in.</summary>
    public abstract DesignUnits Units { get; }

    /// <summary>Height of the driver's eye above the road the method assumes, in metres.</summary>
    public abstract double EyeHeightM { get; }

    /// <summary>Height above the road of the point that must stay visible, in metres.</summary>
    public abstract double ObjectHeightM { get; }

    /// <summary>Why no distance exists on this grade (a downgrade steeper than the braking can hold), or null when one does.</summary>
    public virtual string? GradeProblem(double gradePercent) => null;

    /// <summary>The sight distance an approach at this speed and grade needs.</summary>
    /// <remarks>
    /// Speed from 5 to 200 km/h; grade from −15 to +15 percent, positive uphill in the direction of travel of
    /// the approaching vehicle. Out-of-range values throw <see cref="ArgumentOutOfRangeException"/>. A US customary
    /// method takes the speed converted to mph.
    /// </remarks>
    public RequiredSightDistance Required(double approachSpeedKmh, double gradePercent = 0)
    {
        Preconditions.InRange(approachSpeedKmh, MinimumSpeedKmh, MaximumSpeedKmh, "km/h");
        return Required(approachSpeedKmh, approachSpeedKmh / SiteRanges.KmPerMile, gradePercent);
    }

    /// <summary>The sight distance an approach at this speed in mph and this grade needs.</summary>
    /// <remarks>
    /// Speed from 3 to 125 mph; a US customary method uses it exactly as given, a metric one converted to km/h.
    /// Out-of-range values throw <see cref="ArgumentOutOfRangeException"/>.
    /// </remarks>
    public RequiredSightDistance RequiredAtMph(double approachSpeedMph, double gradePercent = 0)
    {
        Preconditions.InRange(approachSpeedMph, MinimumSpeedMph, MaximumSpeedMph, "mph");
        return Required(approachSpeedMph * SiteRanges.KmPerMile, approachSpeedMph, gradePercent);
    }

    /// <summary>The sight distance an approach needs, at its speed as the plan gave it (km/h or mph) and its grade.</summary>
    public RequiredSightDistance Required(Approach approach)
    {
        ArgumentNullException.ThrowIfNull(approach);
        return approach.SpeedMph is { } mph ? RequiredAtMph(mph, approach.GradePercent) : Required(approach.SpeedKmh, approach.GradePercent);
    }

    /// <summary>The distance before rounding in the method's length unit (m or ft), the formula that gave it, and the
    /// published table it reproduces (null for a local code's value).</summary>
    /// <remarks>Both speeds are given: the one the approach was entered in exactly, the other its conversion.</remarks>
    private protected abstract (double Distance, string Formula, string? Table) Compute(double speedKmh, double speedMph, double gradePercent);

    /// <summary>The design value in the method's length unit: AASHTO tables round the computed distance up to the next 5 m, or 5 ft.</summary>
    private protected virtual double DesignDistance(double computed) =>
        // Rounded to the millionth first so float noise on an exact multiple of 5 does not add 5.
        Math.Ceiling(Math.Round(computed, 6) / 5) * 5;

    private RequiredSightDistance Required(double speedKmh, double speedMph, double gradePercent)
    {
        Preconditions.InRange(gradePercent, -MaximumGradePercent, MaximumGradePercent, "%");
        var (computed, formula, table) = Compute(speedKmh, speedMph, gradePercent);
        var design = DesignDistance(computed);
        if (Units == DesignUnits.Metric)
        {
            return new RequiredSightDistance(this, speedKmh, gradePercent, formula, computed, design, EyeHeightM, ObjectHeightM) { Table = table };
        }

        return new RequiredSightDistance(
            this, speedKmh, gradePercent, formula, computed * MetresPerFoot, design * MetresPerFoot, EyeHeightM, ObjectHeightM)
        {
            Table = table,
            UsCustomary = new UsCustomaryFigures(speedMph, computed, design),
        };
    }
}
