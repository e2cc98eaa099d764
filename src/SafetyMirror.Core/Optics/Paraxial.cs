namespace SafetyMirror.Core.Optics;

/// <summary>Paraxial (first-order) results for a convex mirror: checks and explanation, never the engine.</summary>
/// <remarks>Sign convention "real is positive": object distances are positive, the convex mirror's focal
/// length is −R/2 and its images, being virtual, have negative distances.</remarks>
public static class Paraxial
{
    /// <summary>The signed focal length of a convex mirror, −R/2.</summary>
    public static double FocalLengthM(double radiusM) => -Preconditions.Positive(radiusM, "m") / 2;

    /// <summary>Image distance from the mirror equation 1/do + 1/di = 1/f (negative: behind the mirror).</summary>
    public static double ImageDistanceM(double objectDistanceM, double radiusM)
    {
        Preconditions.Positive(objectDistanceM, "m");
        var f = FocalLengthM(radiusM);
        return 1 / ((1 / f) - (1 / objectDistanceM));
    }

    /// <summary>Lateral magnification m = −di/do (positive and below 1: upright and reduced).</summary>
    public static double Magnification(double objectDistanceM, double radiusM) =>
        -ImageDistanceM(objectDistanceM, radiusM) / objectDistanceM;

    /// <summary>
    /// Paraxial angle at the eye subtended by an object of height h at distance L in front of the mirror,
    /// the eye at distance d: h·f / (L·d + f·(L + d)) with f = R/2.
    /// </summary>
    public static double ApparentAngle(double heightM, double objectDistanceM, double eyeDistanceM, double radiusM)
    {
        var f = Preconditions.Positive(radiusM, "m") / 2;
        return heightM * f / ((objectDistanceM * eyeDistanceM) + (f * (objectDistanceM + eyeDistanceM)));
    }

    /// <summary>Coddington's tangential focal length for a narrow pencil at incidence θ: (R/2)·cos θ (virtual).</summary>
    public static double TangentialFocalLengthM(double radiusM, double incidence) =>
        Preconditions.Positive(radiusM, "m") / 2 * Math.Cos(incidence);

    /// <summary>Coddington's sagittal focal length for a narrow pencil at incidence θ: (R/2)/cos θ (virtual).</summary>
    public static double SagittalFocalLengthM(double radiusM, double incidence) =>
        Preconditions.Positive(radiusM, "m") / 2 / Math.Cos(incidence);
}
