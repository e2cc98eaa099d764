namespace SafetyMirror.Core.Design;

/// <summary>AASHTO stopping sight distance: reaction distance plus braking distance.</summary>
/// <remarks>
/// Level ground: SSD = 0.278·V·t + 0.039·V²/a. On a grade G (decimal, + uphill): braking part
/// V²/(254·(a/9.81 + G)). The grade form at G = 0 is about 0.6 % shorter than the level form and rounds
/// below the published table at 90 km/h, so the level form is used whenever the grade is zero.
/// </remarks>
public sealed record StoppingSightDistance : SightDistanceMethod
{
    private const double GravityMps2 = 9.81;

    /// <summary>Creates the method; AASHTO's defaults are 2.5 s reaction and 3.4 m/s² deceleration.</summary>
    /// <remarks>Reaction time from 0.5 to 5 s; deceleration from 1 to 9.81 m/s².</remarks>
    public StoppingSightDistance(double reactionTimeS = 2.5, double decelerationMps2 = 3.4)
    {
        ReactionTimeS = Preconditions.InRange(reactionTimeS, 0.5, 5, "s");
        DecelerationMps2 = Preconditions.InRange(decelerationMps2, 1, GravityMps2, "m/s²");
    }

    /// <summary>Brake reaction time, in seconds.</summary>
    public double ReactionTimeS { get; }

    /// <summary>Deceleration rate on level ground, in m/s².</summary>
    public double DecelerationMps2 { get; }

    /// <inheritdoc />
    public override string Source => "AASHTO, A Policy on Geometric Design of Highways and Streets (2011), stopping sight distance (Table 3-1)";

    /// <inheritdoc />
    public override double EyeHeightM => 1.08;

    /// <inheritdoc />
    public override double ObjectHeightM => 0.60;

    private protected override (double DistanceM, string Formula) Compute(double speedKmh, double gradePercent)
    {
        var reactionM = 0.278 * speedKmh * ReactionTimeS;
        if (gradePercent == 0)
        {
            return (reactionM + (0.039 * speedKmh * speedKmh / DecelerationMps2), "0.278·V·t + 0.039·V²/a");
        }

        var friction = (DecelerationMps2 / GravityMps2) + (gradePercent / 100);
        if (friction <= 0)
        {
            // A downgrade steeper than the braking can hold: no finite stopping distance exists.
            var steepestPercent = -100 * DecelerationMps2 / GravityMps2;
            throw new ArgumentOutOfRangeException(
                nameof(gradePercent),
                gradePercent,
                $"{nameof(gradePercent)} must be greater than {steepestPercent:0.##} % for a deceleration of {DecelerationMps2} m/s²; it was {gradePercent}.");
        }

        return (reactionM + (speedKmh * speedKmh / (254 * friction)), "0.278·V·t + V²/(254·(a/9.81 + G))");
    }
}
