using System.Diagnostics;
using SafetyMirror.Core.Design;
using SafetyMirror.Core.Design.Evaluation;
using SafetyMirror.Core.Design.Recommendation;
using SafetyMirror.Core.Optics;

namespace SafetyMirror.Benchmarks.Design;

/// <summary>The recommendation search against a dense brute-force grid over the same variables, in one run.</summary>
/// <remarks>
/// One approach of the typical corner (the eastbound lane) is served; the grid covers every candidate position at
/// 0.5 m, every catalogue mirror, the lowest and the highest centre height, and azimuth and tilt every 1° within
/// ±30° and ±15° of the bisector aim. Both are judged by the same <see cref="PlacementJudge.JudgeRobust"/>: the worst of
/// the aim as set and the four aims off by the tolerance.
/// Run with: dotnet run -c Release --project tests/SafetyMirror.Benchmarks -- grid
/// </remarks>
public static class GridComparison
{
    public static void Run()
    {
        var plan = TypicalCorner.Plan();
        var options = new RecommendationOptions { ServedApproaches = [0] };

        var watch = Stopwatch.StartNew();
        var recommendation = MirrorRecommender.Recommend(plan, options).Recommendation!;
        var searchMs = watch.Elapsed.TotalMilliseconds;
        var best = recommendation.Alternatives[0];
        var judge = new PlacementJudge(plan, options, [0]);
        var searchJudged = judge.JudgeRobust(best.Mirrors[0].Placement);

        watch.Restart();
        var grid = new PlacementJudge(plan, options, [0]);
        var (gridBest, gridValue, gridPlacement) = (default(DesignScore), double.NegativeInfinity, (MirrorPlacement?)null);
        var eye = grid.Eye;
        var positions = plan.MountingZones.SelectMany(zone => GridPoints(zone.Zone)).ToList();
        foreach (var type in options.Catalogue.OrderBy(t => t.Aperture.AreaM2))
        {
            foreach (var p in positions.Where(p => Vec3.HorizontalDistance(new Vec3(p.X, p.Y, 0), eye) <= 15))
            {
                if (MirrorRecommender.HeightFor(type, options, plan.SurfaceHeightAt(p.X, p.Y)) is not { } low)
                {
                    continue;
                }

                foreach (var height in new[] { low, options.MaxCentreHeightM }.Distinct())
                {
                    var (azimuth, tilt) = MirrorRecommender.BisectorAim(new Vec3(p.X, p.Y, height), eye, grid.Targets);
                    for (var da = -30; da <= 30; da++)
                    {
                        for (var dt = -15; dt <= 15; dt++)
                        {
                            var placement = new MirrorPlacement(p.X, p.Y, height, ((azimuth + da) % 360 + 360) % 360, Math.Clamp(tilt + dt, -30, 60), type.RadiusM, type.Aperture);
                            var (score, value) = grid.JudgeRobust(placement);
                            if (score.CompareTo(gridBest) > 0 || (score.CompareTo(gridBest) == 0 && value > gridValue))
                            {
                                (gridBest, gridValue, gridPlacement) = (score, value, placement);
                            }
                        }
                    }
                }
            }
        }

        var gridMs = watch.Elapsed.TotalMilliseconds;
        Console.WriteLine($"search: {recommendation.Evaluations} evaluations, {searchMs:F0} ms; best {best.Mirrors[0].Type.Id} at ({best.Mirrors[0].Placement.XM:F2}, {best.Mirrors[0].Placement.YM:F2}), value {searchJudged.Value:F3}, coverage {searchJudged.Score.Coverage:F4}, blind zone {searchJudged.Score.NearBlindZoneM:F3}");
        Console.WriteLine($"grid:   {grid.Evaluations} evaluations, {gridMs:F0} ms; best {gridPlacement?.Aperture} at ({gridPlacement?.XM:F2}, {gridPlacement?.YM:F2}), value {gridValue:F3}, coverage {gridBest.Coverage:F4}, blind zone {gridBest.NearBlindZoneM:F3}");
        Console.WriteLine($"objective ratio search/grid: {searchJudged.Value / gridValue:F5}; evaluations ratio grid/search: {(double)grid.Evaluations / recommendation.Evaluations:F1}");
        Console.WriteLine($"same face area: {Math.Abs(searchJudged.Score.FaceAreaM2 - gridBest.FaceAreaM2) < 1e-9}");
    }

    private static IEnumerable<NetTopologySuite.Geometries.Coordinate> GridPoints(NetTopologySuite.Geometries.Geometry zone) =>
        zone switch
        {
            NetTopologySuite.Geometries.Point point => [point.Coordinate],
            _ => CandidatePointsAt(zone, 0.5),
        };

    private static IEnumerable<NetTopologySuite.Geometries.Coordinate> CandidatePointsAt(NetTopologySuite.Geometries.Geometry zone, double spacing)
    {
        if (zone is NetTopologySuite.Geometries.LineString line)
        {
            var indexed = new NetTopologySuite.LinearReferencing.LengthIndexedLine(line);
            for (var d = 0.0; d <= line.Length + 1e-9; d += spacing)
            {
                yield return indexed.ExtractPoint(d);
            }

            yield break;
        }

        var box = zone.EnvelopeInternal;
        for (var x = box.MinX; x <= box.MaxX + 1e-9; x += spacing)
        {
            for (var y = box.MinY; y <= box.MaxY + 1e-9; y += spacing)
            {
                if (zone.Covers(zone.Factory.CreatePoint(new NetTopologySuite.Geometries.Coordinate(x, y))))
                {
                    yield return new NetTopologySuite.Geometries.Coordinate(x, y);
                }
            }
        }
    }
}
