using SafetyMirror.Core.Design.Recommendation;
using SafetyMirror.Core.Site;
using SafetyMirror.Core.Tests.Design.Evaluation;
using NetTopologySuite.Geometries;
namespace SafetyMirror.Core.Tests.Design.Recommendation;
public class ProbeTests
{
    [Fact]
    public void Probe()
    {
        var f = new GeometryFactory();
        var zone = new MountingZone(f.CreateLineString([new Coordinate(-8, 7.5), new Coordinate(8, 7.5)]), new FeatureReference(5, "verge"));
        var plan = new SitePlan(PlanFrame.LocalMetres, [new Eye(Corners.Eye, new FeatureReference(0))], [Corners.FromWest(), Corners.FromEast()], [Corners.WestBuilding(),
            new Obstacle(Corners.Box(2, -20, 30, -1), 6, new FeatureReference(4, "east-building"))], [zone]);
        var sw = System.Diagnostics.Stopwatch.StartNew();
        var r = MirrorRecommender.Recommend(plan, new RecommendationOptions());
        var lines = new List<string> { $"{r.Outcome} evals {r.Evaluations} ms {sw.ElapsedMilliseconds} served {string.Join(",", r.ServedApproaches)}" };
        foreach (var a in r.Alternatives) { lines.Add($"{a.Score} {a.Robustness}"); foreach (var m in a.Mirrors) lines.Add($"  {m.Type.Id} {m.Placement}"); lines.Add("  " + a.Rationale); }
        lines.AddRange(r.MeasuresToConsider);
        lines.AddRange(r.Candidates.Select(c => $"{c.Stage} {c.XM:F1},{c.YM:F1} {c.Score.Coverage:F2}"));
        File.WriteAllLines("/tmp/probe3.txt", lines);
    }
}
