using MathNet.Numerics.LinearAlgebra;
using MathNet.Numerics.Optimization;
using SafetyMirror.Core.Design.Evaluation;
using SafetyMirror.Core.Optics;

namespace SafetyMirror.Core.Design.Recommendation;

/// <summary>Where to aim a face: a first guess from geometry, then Nelder–Mead, then a compass search to finish.</summary>
internal static class AimTuning
{
    /// <summary>Nelder–Mead iterations per aim search: the objective is a step function, so more rarely pays.</summary>
    public const int NelderMeadIterations = 15;

    /// <summary>Nelder–Mead's first steps, degrees of azimuth and tilt.</summary>
    public const double InitialAzimuthStepDeg = 3;

    /// <summary>Nelder–Mead's first steps, degrees of tilt.</summary>
    public const double InitialTiltStepDeg = 2;

    /// <summary>The compass search's steps, degrees, coarse to fine: the chosen aim is finished to the last.</summary>
    public static readonly double[] CompassStepsDeg = [0.4, 0.2, 0.1, 0.05];

    /// <summary>The aims a first glance tries around the bisector aim, degrees of azimuth and tilt.</summary>
    public static readonly (double AzimuthDeg, double TiltDeg)[] GlanceOffsets = [(0, 0), (-6, 0), (6, 0), (0, -4), (0, 4)];

    private static readonly (double X, double Y)[] Compass = [(1, 0), (-1, 0), (0, 1), (0, -1), (1, 1), (-1, -1), (1, -1), (-1, 1)];

    /// <summary>The aim a face takes to show the given points to the eye: its axis bisects the two directions.</summary>
    public static (double AzimuthDeg, double TiltDownDeg) Bisector(Vec3 vertex, Vec3 eye, IEnumerable<Vec3> targets)
    {
        var toTargets = targets.Aggregate(Vec3.Zero, (sum, t) => sum + (t - vertex).Normalized()).Normalized();
        var axis = ((eye - vertex).Normalized() + toTargets).Normalized();
        var azimuth = (Angles.ToDeg(Math.Atan2(axis.X, axis.Y)) + 360) % 360;
        return (azimuth, -Angles.ToDeg(Math.Asin(Math.Clamp(axis.Z, -1, 1))));
    }

    /// <summary>The best aim Nelder–Mead finds from a start, by the given objective (higher is better).</summary>
    public static (MirrorPlacement Placement, double Value) Optimise(MirrorPlacement start, double startValue, Func<MirrorPlacement, double> objective)
    {
        var best = (Placement: start, Value: startValue);
        double Minimised(Vector<double> aim)
        {
            var placement = start with { AzimuthDeg = Wrap(aim[0]), TiltDownDeg = Tilt(aim[1]) };
            var value = objective(placement);
            if (value > best.Value)
            {
                best = (placement, value);
            }

            return -value;
        }

        try
        {
            new NelderMeadSimplex(1e-9, NelderMeadIterations).FindMinimum(
                ObjectiveFunction.Value(Minimised),
                Vector<double>.Build.Dense([start.AzimuthDeg, start.TiltDownDeg]),
                Vector<double>.Build.Dense([InitialAzimuthStepDeg, InitialTiltStepDeg]));
        }
        catch (MaximumIterationsException)
        {
            // The iteration budget is spent: the best aim seen so far stands.
        }

        return best;
    }

    /// <summary>A compass search that finishes an aim, where Nelder–Mead stalls on the objective's small steps.</summary>
    public static (MirrorPlacement Placement, double Value) Finish(MirrorPlacement start, double startValue, Func<MirrorPlacement, double> objective)
    {
        var best = (Placement: start, Value: startValue);
        foreach (var step in CompassStepsDeg)
        {
            var improved = true;
            while (improved)
            {
                improved = false;
                foreach (var (da, dt) in Compass)
                {
                    var placement = best.Placement with { AzimuthDeg = Wrap(best.Placement.AzimuthDeg + (da * step)), TiltDownDeg = Tilt(best.Placement.TiltDownDeg + (dt * step)) };
                    var value = objective(placement);
                    if (value > best.Value)
                    {
                        best = (placement, value);
                        improved = true;
                    }
                }
            }
        }

        return best;
    }

    /// <summary>An azimuth in [0, 360), rounded to the micro-degree so that equal aims compare equal.</summary>
    public static double Wrap(double azimuthDeg) => Math.Round(((azimuthDeg % 360) + 360) % 360, 6);

    /// <summary>A tilt within what a bracket allows, −30° to 60°, rounded to the micro-degree.</summary>
    public static double Tilt(double tiltDeg) => Math.Round(Math.Clamp(tiltDeg, -30, 60), 6);
}
