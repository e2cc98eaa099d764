using NetTopologySuite.Geometries;
using NetTopologySuite.Geometries.Utilities;
using SafetyMirror.Core.Design.Evaluation;
using SafetyMirror.Core.Optics;
using SafetyMirror.Core.Site;
using SafetyMirror.Reports.Justification;

namespace SafetyMirror.Reports.Tests.Justification;

/// <summary>Variants of the invented corner for the site plan's tests: turned, faster, with a stop line, with the mirror aimed too far.</summary>
internal static class SitePlanCorners
{
    private static readonly GeometryFactory Factory = new();

    /// <summary>The invented corner's mirror aimed too far down the street, so part of the eastbound lane is seen neither way.</summary>
    public static MirrorPlacement MisaimedMirror { get; } = new(0, 7.5, 2.9, 220, 8, 2.2, new RoundAperture(0.6));

    /// <summary>The report case of a mirror on a plan, evaluated with the default options.</summary>
    public static ReportCase Evaluated(SitePlan plan, MirrorPlacement mirror) =>
        ReportCase.Of(plan, MirrorEvaluator.Evaluate(plan, mirror, new EvaluationOptions()).Evaluation
            ?? throw new InvalidOperationException("The sample corner must evaluate."));

    /// <summary>The invented corner with its default mirror.</summary>
    public static ReportCase Demo() => Evaluated(InventedCorner.Plan(), InventedCorner.Mirror);

    /// <summary>The invented corner with its street at <paramref name="speedKmh"/>, so the required distances grow.</summary>
    public static SitePlan Faster(double speedKmh)
    {
        var plan = InventedCorner.Plan();
        return new SitePlan(plan.Frame, plan.Eyes, plan.Approaches.Select(a => new Approach(a.Line, speedKmh, a.GradePercent, a.Feature)),
            plan.Obstacles, plan.MountingZones, plan.Carriageways, plan.Footways);
    }

    /// <summary>The invented corner with a stop line across the mews exit, half a metre short of the street.</summary>
    public static SitePlan WithStopLine()
    {
        var plan = InventedCorner.Plan();
        var stop = new StopLine(Factory.CreateLineString([new(-1.8, -0.5), new(1.8, -0.5)]), new FeatureReference(8, "stop", "Stop line at the mews exit"));
        return new SitePlan(plan.Frame, plan.Eyes, plan.Approaches, plan.Obstacles, plan.MountingZones, plan.Carriageways, plan.Footways, [stop]);
    }

    /// <summary>The invented corner and its mirror turned <paramref name="degrees"/> counter-clockwise about the plan's origin, so its street no longer runs east–west.</summary>
    public static ReportCase Turned(double degrees)
    {
        var turn = AffineTransformation.RotationInstance(degrees * Math.PI / 180);
        T Turn<T>(T geometry) where T : Geometry => (T)turn.Transform(geometry);
        Vec3 TurnPoint(Vec3 p)
        {
            var c = turn.Transform(new Coordinate(p.X, p.Y), new Coordinate());
            return new Vec3(c.X, c.Y, p.Z);
        }

        var plan = InventedCorner.Plan();
        var turned = new SitePlan(
            plan.Frame,
            plan.Eyes.Select(e => e with { Position = TurnPoint(e.Position) }),
            plan.Approaches.Select(a => new Approach(Turn(a.Line), a.SpeedKmh, a.GradePercent, a.Feature)),
            plan.Obstacles.Select(o => new Obstacle(Turn(o.Footprint), o.HeightM, o.Feature)),
            plan.MountingZones.Select(z => z with { Zone = Turn(z.Zone) }),
            plan.Carriageways.Select(c => c with { Area = Turn(c.Area) }),
            plan.Footways.Select(f => f with { Area = Turn(f.Area) }));
        var m = InventedCorner.Mirror;
        var at = TurnPoint(new Vec3(m.XM, m.YM, 0));
        // Turning the plan counter-clockwise takes a compass bearing (clockwise from north) back by the same angle.
        return Evaluated(turned, m with { XM = at.X, YM = at.Y, AzimuthDeg = m.AzimuthDeg - degrees });
    }
}
