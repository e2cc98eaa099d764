using MathNet.Numerics.RootFinding;
using SafetyMirror.Core.Design.Evaluation;
using SafetyMirror.Core.Optics;
using SafetyMirror.Core.Site;

namespace SafetyMirror.Core.Design.Installation;

/// <summary>Where on an approach a check pole must stand for the driver to see it at the centre of the face.</summary>
/// <param name="Approach">The approach the pole stands on.</param>
/// <param name="StationM">Distance of the pole upstream of the conflict point along the lane, in metres.</param>
/// <param name="HeightM">Height on the pole of the point seen at the face centre, in metres.</param>
/// <param name="XM">Local x of the pole's foot.</param>
/// <param name="YM">Local y of the pole's foot.</param>
/// <param name="MissM">Distance on the face from its centre to where that point reflects, in metres (0 when exactly at the centre;
/// infinite when no point of the lane reflects in the sphere at all).</param>
/// <param name="AboveCentreM">How far above the face centre that reflection lies, along the face's vertical, in metres (negative below).</param>
/// <param name="AtCentre">Whether the point reflects at the face centre (within <see cref="CheckTargets.CentreToleranceM"/>);
/// if not, it is the point of the approach whose reflection comes nearest the centre.</param>
public sealed record CheckTarget(Approach Approach, double StationM, double HeightM, double XM, double YM, double MissM, double AboveCentreM, bool AtCentre);

/// <summary>The check target at the aim as set, and where it moves with the aim off by the tolerance the verdict was tested at.</summary>
/// <param name="Target">The check target at the aim as set.</param>
/// <param name="ToleranceDeg">The aim tolerance, in degrees, either way in azimuth and in tilt.</param>
/// <param name="AzimuthOff">The targets with the azimuth off by minus and plus the tolerance.</param>
/// <param name="TiltOff">The targets with the tilt off by minus and plus the tolerance.</param>
public sealed record AimCheck(CheckTarget Target, double ToleranceDeg, IReadOnlyList<CheckTarget> AzimuthOff, IReadOnlyList<CheckTarget> TiltOff)
{
    /// <summary>The stretch of the lane, nearest and farthest station in metres, the target covers within the tolerance in azimuth.</summary>
    public (double FromM, double ToM) AzimuthStretchM => Stretch(AzimuthOff);

    /// <summary>The stretch of the lane the target covers within the tolerance in tilt.</summary>
    public (double FromM, double ToM) TiltStretchM => Stretch(TiltOff);

    /// <summary>The heights on the pole seen at the face centre within the tolerance in tilt, lowest and highest, in metres.</summary>
    public (double FromM, double ToM) TiltHeightsM => (TiltOff.Append(Target).Min(t => t.HeightM), TiltOff.Append(Target).Max(t => t.HeightM));

    private (double FromM, double ToM) Stretch(IReadOnlyList<CheckTarget> off) =>
        (off.Append(Target).Min(t => t.StationM), off.Append(Target).Max(t => t.StationM));
}

/// <summary>Finds check targets with the exact reflection on the sphere (Alhazen's problem), not a small-angle formula.</summary>
/// <remarks>
/// A pole stands on the lane line at a station; the driver sees the point of it whose light reflects at the face centre. Two
/// unknowns, the station and the height on the pole, meet two conditions, the reflection's horizontal and vertical offsets
/// on the face being zero: each is solved in turn by Brent's method on the other's latest value until both settle. Where no
/// station and height within the pole do it, the pole position whose reflection comes nearest the centre is returned, marked so.
/// </remarks>
public static class CheckTargets
{
    /// <summary>Height of the check pole, in metres: the AASHTO passenger car's height (domain brief §4).</summary>
    public const double PoleHeightM = 1.3;

    /// <summary>How near the face centre the reflection must fall to count as at the centre, in metres.</summary>
    public const double CentreToleranceM = 0.001;

    private const double ScanSpacingM = 0.5;
    private const int MaxScanSamples = 2000;
    private const int MaxRounds = 50;
    private const double SettledM = 1e-7;

    /// <summary>The check target and its spread within the evaluation's aim tolerance, for one approach a mirror serves.</summary>
    public static AimCheck For(MirrorPlacement placement, Vec3 eye, Approach approach, double aimToleranceDeg)
    {
        ArgumentNullException.ThrowIfNull(placement);
        ArgumentNullException.ThrowIfNull(approach);
        CheckTarget Off(double azimuthDeg, double tiltDeg) => Find(placement.AimedOffBy(azimuthDeg, tiltDeg).ToMirror(), eye, approach);
        var t = aimToleranceDeg;
        return new AimCheck(Find(placement.ToMirror(), eye, approach), t, [Off(-t, 0), Off(t, 0)], [Off(0, -t), Off(0, t)]);
    }

    /// <summary>The check target on the approach for a mirror seen from the eye.</summary>
    public static CheckTarget Find(ConvexMirror mirror, Vec3 eye, Approach approach)
    {
        ArgumentNullException.ThrowIfNull(mirror);
        ArgumentNullException.ThrowIfNull(approach);
        var length = approach.LengthM;
        var spacing = Math.Max(ScanSpacingM, length / MaxScanSamples);
        var stations = Enumerable.Range(0, (int)Math.Floor(length / spacing) + 1).Select(i => i * spacing).Append(length).Distinct().ToList();

        // Start from the station, with the pole's middle, whose reflection is nearest the centre, or the root of the
        // horizontal offset next to it.
        var height = PoleHeightM / 2;
        var offsets = stations.Select(s => Offset(mirror, eye, approach, s, height)).ToList();
        var found = Enumerable.Range(0, stations.Count).Where(i => offsets[i] is not null).ToList();
        if (found.Count == 0)
        {
            return Target(mirror, eye, approach, 0, height);
        }

        var nearest = found.MinBy(i => offsets[i]!.Value.Miss);

        // The first station lined up horizontally is the one nearest that station, found from the scan itself.
        var station = LinedUp(s => Offset(mirror, eye, approach, s, height)?.U, stations, [.. offsets.Select(o => o?.U)], stations[nearest]) ?? stations[nearest];
        for (var round = 0; round < MaxRounds; round++)
        {
            // Then near the station: as the height on the pole settles, the station that lines up moves a little.
            var nextHeight = Root(z => Offset(mirror, eye, approach, station, z)?.V, 0, PoleHeightM) ?? NearerEnd(mirror, eye, approach, station);
            var (from, to) = (Math.Max(0, station - (4 * spacing)), Math.Min(length, station + (4 * spacing)));
            var near = Enumerable.Range(0, (int)Math.Floor((to - from) / spacing) + 1).Select(i => from + (i * spacing)).Append(to).Distinct().ToList();
            double? U(double s) => Offset(mirror, eye, approach, s, nextHeight)?.U;
            var nextStation = LinedUp(U, near, [.. near.Select(U)], station) ?? station;
            var settled = Math.Abs(nextStation - station) < SettledM && Math.Abs(nextHeight - height) < SettledM;
            (station, height) = (nextStation, nextHeight);
            if (settled)
            {
                break;
            }
        }

        var target = Target(mirror, eye, approach, station, height);
        if (target.AtCentre)
        {
            return target;
        }

        // No point of the pole reflects at the centre: the pole's nearer end, at the station whose reflection comes nearest.
        var (lower, upper) = (Math.Max(0, station - (2 * spacing)), Math.Min(length, station + (2 * spacing)));
        return Target(mirror, eye, approach, Nearest(s => Offset(mirror, eye, approach, s, height)?.Miss ?? double.MaxValue, lower, upper), height);
    }

    /// <summary>Where a function with one minimum between two values has it, by golden-section search.</summary>
    private static double Nearest(Func<double, double> f, double from, double to)
    {
        var ratio = (Math.Sqrt(5) - 1) / 2;
        while (to - from > SettledM)
        {
            var (a, b) = (to - (ratio * (to - from)), from + (ratio * (to - from)));
            (from, to) = f(a) <= f(b) ? (from, b) : (a, to);
        }

        return (from + to) / 2;
    }

    /// <summary>Of the stations where the horizontal offset changes sign between two samples, the one nearest a given station,
    /// solved by Brent's method; null when it changes sign nowhere.</summary>
    private static double? LinedUp(Func<double, double?> horizontalOffset, IReadOnlyList<double> samples, IReadOnlyList<double?> values, double nearM) =>
        Enumerable.Range(0, samples.Count - 1)
            .Where(i => values[i] is { } a && values[i + 1] is { } b && Math.Sign(a) != Math.Sign(b))
            .OrderBy(i => Math.Abs(((samples[i] + samples[i + 1]) / 2) - nearM))
            .Select(i => Root(horizontalOffset, samples[i], samples[i + 1]))
            .FirstOrDefault();

    private static CheckTarget Target(ConvexMirror mirror, Vec3 eye, Approach approach, double stationM, double heightM)
    {
        var foot = approach.PointAtStation(stationM).Position;
        var offset = Offset(mirror, eye, approach, stationM, heightM);
        var miss = offset?.Miss ?? double.PositiveInfinity;
        return new CheckTarget(approach, stationM, heightM, foot.X, foot.Y, miss, offset?.V ?? 0, miss <= CentreToleranceM);
    }

    /// <summary>The end of the pole whose reflection is nearer the centre vertically, when no height on it reflects at the centre.</summary>
    private static double NearerEnd(ConvexMirror mirror, Vec3 eye, Approach approach, double stationM) =>
        Math.Abs(Offset(mirror, eye, approach, stationM, 0)?.V ?? double.PositiveInfinity)
            <= Math.Abs(Offset(mirror, eye, approach, stationM, PoleHeightM)?.V ?? double.PositiveInfinity) ? 0 : PoleHeightM;

    /// <summary>A root of the function between two values where it changes sign, or null when it does not.</summary>
    private static double? Root(Func<double, double?> f, double from, double to)
    {
        double F(double x) => f(x) ?? double.NaN;
        var (a, b) = (F(from), F(to));
        if (double.IsNaN(a) || double.IsNaN(b) || Math.Sign(a) == Math.Sign(b) && a != 0 && b != 0)
        {
            return null;
        }

        return Brent.TryFindRoot(F, from, to, 1e-10, 200, out var root) ? root : null;
    }

    /// <summary>Where the point of a pole reflects, as offsets from the face centre along the face's horizontal and vertical axes.</summary>
    private static (double U, double V, double Miss)? Offset(ConvexMirror mirror, Vec3 eye, Approach approach, double stationM, double heightM)
    {
        var target = approach.PointAtStation(stationM).Position with { Z = heightM };
        var reflection = mirror.Reflect(eye, target);
        if (!reflection.IsFound)
        {
            return null;
        }

        var offset = reflection.Point - mirror.Vertex;
        return (Vec3.Dot(offset, mirror.HorizontalAxis), Vec3.Dot(offset, mirror.VerticalAxis), offset.Length);
    }
}
