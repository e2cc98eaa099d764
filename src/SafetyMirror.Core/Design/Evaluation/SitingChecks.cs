using NetTopologySuite.Algorithm.Locate;
using NetTopologySuite.Geometries;
using NetTopologySuite.Algorithm;
using NetTopologySuite.Geometries.Utilities;
using SafetyMirror.Core.Optics;
using SafetyMirror.Core.Site;

namespace SafetyMirror.Core.Design.Evaluation;

/// <summary>The siting rules a placed mirror is checked against, each with its value, limit and source.</summary>
internal static class SitingChecks
{
    private static readonly GeometryFactory Factory = new();

    /// <summary>Points spread over the face (rim and inside), in site metres: where its height and footprint are measured.</summary>
    public static List<Vec3> FacePoints(ConvexMirror mirror)
    {
        var points = new List<Vec3>();
        for (var i = 0; i < 144; i++)
        {
            var (u, v) = mirror.Aperture.Rim(i / 144.0);
            points.Add(mirror.PointOnFace(u, v));
            points.Add(mirror.PointOnFace(u / 2, v / 2));
        }

        points.Add(mirror.Vertex);
        return points;
    }

    /// <summary>The checks for a mirror on a plan, in reading order.</summary>
    public static List<RuleCheck> For(SitePlan plan, MirrorFacts facts, Vec3 eye, SitingRules rules)
    {
        var mirror = facts.Mirror;
        var face = FacePoints(mirror);
        var checks = new List<RuleCheck>
        {
            new("lower-edge-clearance",
                "Height of the mirror's lower edge above the highest surface below it (a footway stands its kerb above the carriageway).",
                face.Min(p => p.Z - plan.SurfaceHeightAt(p.X, p.Y)), rules.MinimumLowerEdgeClearanceM, "m", "at-least", false, rules.Source),
        };

        var overCarriageway = face.Where(p => plan.IsOnCarriageway(p.X, p.Y)).ToList();
        if (overCarriageway.Count > 0)
        {
            checks.Add(new("carriageway-clearance", "Height above the carriageway of the lowest part of the face that overhangs it.",
                overCarriageway.Min(p => p.Z), rules.CarriagewayClearanceM, "m", "at-least", false, rules.CarriagewayClearanceSource));
        }

        if (plan.Carriageways.Length > 0)
        {
            var kerbs = plan.Carriageways.Select(c => (Kerb: KerbLines(c.Area), Inside: new IndexedPointInAreaLocator(c.Area))).ToList();
            checks.Add(new("kerb-offset",
                "Horizontal distance from the kerb line to the face's nearest edge (negative where the face overhangs the carriageway).",
                face.Min(p => KerbOffset(kerbs, p)), rules.KerbOffsetM, "m", "at-least", false, rules.KerbOffsetSource));
        }

        // The waiting driver's own stop line: the one nearest the eye, not a nearer one on another arm.
        var eyePoint = Factory.CreatePoint(new Coordinate(eye.X, eye.Y));
        checks.Add(plan.StopLines.MinBy(s => s.Line.Distance(eyePoint)) is { } stopLine
            ? new("stop-line-to-mirror-distance", "Horizontal distance from the waiting driver's stop line (the one nearest the eye) to the mirror.",
                stopLine.Line.Distance(Factory.CreatePoint(new Coordinate(mirror.Vertex.X, mirror.Vertex.Y))),
                rules.MaximumEyeToMirrorDistanceM, "m", "at-most", false, rules.Source)
            : new("eye-to-mirror-distance",
                "Horizontal distance from the waiting driver's eye to the mirror; the plan draws no stop line, so the eye point stands for it.",
                Vec3.HorizontalDistance(eye, mirror.Vertex), rules.MaximumEyeToMirrorDistanceM, "m", "at-most", false, rules.Source));

        var fastest = plan.Approaches.Max(a => a.SpeedKmh);
        checks.Add(new("approach-speed",
            "Highest approach speed at the corner; above the limit the siting values used allow no mirror, because a mirror that makes vehicles look farther and slower misleads more the faster they come.",
            fastest, rules.CautionAboveSpeedKmh, "km/h", "at-most", false, rules.Source));
        checks.Add(new("eye-sees-mirror", "The waiting driver's eye is in front of the face and sees its centre unobstructed (1 = yes).",
            facts.EyeSeesMirror ? 1 : 0, 1, "", "at-least", false, "common practice"));
        return [.. checks.Select(c => c with { Passes = c.Comparison == "at-least" ? c.Value >= c.Limit - 1e-9 : c.Value <= c.Limit + 1e-9 })];
    }

    /// <summary>Distance from a face point to the nearest carriageway; negative, its depth, when it lies over one.</summary>
    /// <remarks>The distance is the nearest of the outline's segments' either way, inside the area (to its boundary) or outside
    /// (to the area), as the distance operation finds it; the outline is taken apart once per check, not once per face point.</remarks>
    private static double KerbOffset(List<(Coordinate[][] Kerb, IndexedPointInAreaLocator Inside)> carriageways, Vec3 point)
    {
        var here = new Coordinate(point.X, point.Y);
        return carriageways.Min(c => c.Inside.Locate(here) != Location.Exterior ? -Nearest(c.Kerb, here) : Nearest(c.Kerb, here));
    }

    /// <summary>The rings of an area, as coordinate runs.</summary>
    private static Coordinate[][] KerbLines(Geometry area) => [.. LinearComponentExtracter.GetLines(area).Select(line => line.Coordinates)];

    private static double Nearest(Coordinate[][] lines, Coordinate point)
    {
        var nearest = double.PositiveInfinity;
        foreach (var line in lines)
        {
            for (var i = 0; i + 1 < line.Length; i++)
            {
                nearest = Math.Min(nearest, DistanceComputer.PointToSegment(point, line[i], line[i + 1]));
            }
        }

        return nearest;
    }
}
