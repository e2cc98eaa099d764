using NetTopologySuite.Geometries;
using NetTopologySuite.LinearReferencing;
using SafetyMirror.Core.Optics;

namespace SafetyMirror.Core.Site;

/// <summary>A point on an approach: where a road user stands, and which way it travels.</summary>
/// <param name="StationM">Distance upstream from the conflict point along the approach, in metres.</param>
/// <param name="Position">The point on the approach line, local metres, z = 0 (the ground).</param>
/// <param name="Direction">Unit horizontal vector in the direction of travel there.</param>
public readonly record struct StationPoint(double StationM, Vec3 Position, Vec3 Direction);

/// <summary>Traffic the waiting driver must see: a lane drawn in the direction of travel up to the conflict point.</summary>
/// <remarks>
/// Positions along it are stations: metres upstream from the conflict point (the line's last point),
/// so station 0 is the conflict point and station <see cref="LengthM"/> is where the line was started.
/// </remarks>
public sealed record Approach : SiteFeature
{
    /// <summary>Creates an approach; the line needs two or more points and no point repeated in a row.</summary>
    public Approach(LineString line, double speedKmh, double gradePercent, FeatureReference feature)
        : base(feature)
    {
        if (line.NumPoints < 2 || IndexOfRepeatedPoint(line) >= 0)
        {
            throw new ArgumentException("An approach needs two or more points, none repeated in a row.", nameof(line));
        }

        Line = line;
        SpeedKmh = Preconditions.InRange(speedKmh, SiteRanges.MinSpeedKmh, SiteRanges.MaxSpeedKmh, "km/h");
        GradePercent = Preconditions.InRange(gradePercent, SiteRanges.MinGradePercent, SiteRanges.MaxGradePercent, "%");
    }

    /// <summary>Creates an approach whose speed is given in mph: <see cref="SpeedMph"/> keeps it as given, and
    /// <see cref="SpeedKmh"/> is its exact conversion.</summary>
    /// <remarks>Speed from 5 to 120 mph.</remarks>
    public static Approach WithSpeedMph(LineString line, double speedMph, double gradePercent, FeatureReference feature) =>
        new(line, Preconditions.InRange(speedMph, SiteRanges.MinSpeedMph, SiteRanges.MaxSpeedMph, "mph") * SiteRanges.KmPerMile, gradePercent, feature)
        {
            SpeedMph = speedMph,
        };

    /// <summary>The lane's line in local metres, in the direction of travel, ending at the conflict point.</summary>
    public LineString Line { get; }

    /// <summary>Design speed (posted or 85th percentile), in km/h.</summary>
    public double SpeedKmh { get; }

    /// <summary>The design speed as the plan gave it in mph, so that a US customary formula uses it exactly; null when
    /// the plan gave km/h.</summary>
    public double? SpeedMph { get; private init; }

    /// <summary>Grade in the direction of travel, in percent; negative is downhill.</summary>
    public double GradePercent { get; }

    /// <summary>Length along the line, in metres: the largest station.</summary>
    public double LengthM => Line.Length;

    /// <summary>Where this traffic crosses the waiting driver's path (the line's last point), z = 0.</summary>
    public Vec3 ConflictPoint => new(Line.EndPoint.X, Line.EndPoint.Y, 0);

    /// <summary>The point at a station and the direction of travel there.</summary>
    /// <remarks>
    /// A road user at station s stands on the line, the middle of its front face there, facing the direction of travel.
    /// At a bend exactly, the direction is that of the segment leaving the bend (towards the conflict point).
    /// </remarks>
    /// <exception cref="ArgumentOutOfRangeException">The station is outside 0 to <see cref="LengthM"/>.</exception>
    public StationPoint PointAtStation(double stationM)
    {
        Preconditions.InRange(stationM, 0, LengthM, "m");
        var location = LengthLocationMap.GetLocation(Line, LengthM - stationM);
        var point = location.GetCoordinate(Line);
        var segment = location.GetSegment(Line);
        var direction = new Vec3(segment.P1.X - segment.P0.X, segment.P1.Y - segment.P0.Y, 0).Normalized();
        return new StationPoint(stationM, new Vec3(point.X, point.Y, 0), direction);
    }

    /// <summary>Index of the first point equal to the one before it, or -1 when there is none.</summary>
    internal static int IndexOfRepeatedPoint(LineString line)
    {
        for (var i = 1; i < line.NumPoints; i++)
        {
            if (line.GetCoordinateN(i).Equals2D(line.GetCoordinateN(i - 1)))
            {
                return i;
            }
        }

        return -1;
    }
}
