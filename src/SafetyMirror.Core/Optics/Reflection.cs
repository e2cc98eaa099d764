namespace SafetyMirror.Core.Optics;

/// <summary>What became of a request for the reflection point of an eye and a target.</summary>
public enum ReflectionOutcome
{
    /// <summary>Light from the target reaches the eye by one reflection on the sphere's front half.</summary>
    Reflected,

    /// <summary>The eye is inside the sphere, where no outside reflection can reach.</summary>
    EyeInsideSphere,

    /// <summary>The target is inside the sphere.</summary>
    TargetInsideSphere,

    /// <summary>No point of the sphere's front half sees both eye and target: the target is behind the mirror.</summary>
    BehindMirror,

    /// <summary>The root search did not converge (not expected for finite inputs; reported, not thrown).</summary>
    NotConverged,
}

/// <summary>The exact reflection of one target into one eye on a convex spherical mirror.</summary>
/// <remarks>All fields but <see cref="Outcome"/> are NaN (or false) unless the outcome is
/// <see cref="ReflectionOutcome.Reflected"/>. Angles are in radians, lengths in metres.</remarks>
/// <param name="Outcome">Whether a reflection exists, and if not, why.</param>
/// <param name="Point">The reflection point on the sphere.</param>
/// <param name="Normal">The unit outward normal at the reflection point.</param>
/// <param name="IncidenceAngle">Angle between the normal and the ray to the eye (equal to the one to the target).</param>
/// <param name="OffAxisAngle">Angle between the normal at the point and the mirror's axis.</param>
/// <param name="InsideAperture">Whether the point lies on the mirror's face.</param>
/// <param name="EyeLegM">Distance eye → reflection point.</param>
/// <param name="TargetLegM">Distance reflection point → target.</param>
public readonly record struct Reflection(
    ReflectionOutcome Outcome,
    Vec3 Point,
    Vec3 Normal,
    double IncidenceAngle,
    double OffAxisAngle,
    bool InsideAperture,
    double EyeLegM,
    double TargetLegM)
{
    /// <summary>True when a reflection point exists on the sphere's front half.</summary>
    public bool IsFound => Outcome == ReflectionOutcome.Reflected;

    /// <summary>True when a reflection point exists and lies on the face: the eye sees the target in the mirror.</summary>
    public bool IsSeenInMirror => IsFound && InsideAperture;

    /// <summary>Length of the light path target → mirror → eye.</summary>
    public double PathLengthM => EyeLegM + TargetLegM;

    /// <summary>Incidence angle in degrees.</summary>
    public double IncidenceDeg => IncidenceAngle * 180 / Math.PI;

    internal static Reflection None(ReflectionOutcome outcome) =>
        new(outcome, new Vec3(double.NaN, double.NaN, double.NaN), new Vec3(double.NaN, double.NaN, double.NaN),
            double.NaN, double.NaN, false, double.NaN, double.NaN);
}
