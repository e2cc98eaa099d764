using BenchmarkDotNet.Attributes;
using SafetyMirror.Benchmarks.Design;
using SafetyMirror.Core.Design.Evaluation;
using SafetyMirror.Core.Site;
using SafetyMirror.Core.View;

namespace SafetyMirror.Benchmarks.View;

/// <summary>One 600 × 600 picture of what the waiting driver sees in the demo corner's mirror, against one evaluation of the same
/// corner in the same run (the machine is shared: compare the ratio).</summary>
/// <remarks>Target: at most 300 ms for the picture on one core. Run alone: <c>--filter '*DriverViewBenchmarks*'</c>.</remarks>
[MemoryDiagnoser]
public class DriverViewBenchmarks
{
    private readonly (SitePlan Plan, MirrorPlacement Mirror) demo = DemoCorner.Evaluation();
    private readonly EvaluationOptions options = new();
    private readonly ViewOptions view = new() { WidthPx = 600, HeightPx = 600 };

    /// <summary>One evaluation of the demo corner, the yardstick.</summary>
    [Benchmark(Baseline = true)]
    public MirrorEvaluation EvaluateDemo() => MirrorEvaluator.Evaluate(demo.Plan, demo.Mirror, options).Evaluation!;

    /// <summary>The picture, framed by default.</summary>
    [Benchmark]
    public ViewPicture Render600x600() => DriverView.Render(demo.Plan, demo.Mirror, options, view).Picture!;
}
