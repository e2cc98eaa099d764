using BenchmarkDotNet.Running;
using System.Globalization;
using SafetyMirror.Benchmarks.Design;
using SafetyMirror.Benchmarks.Service;

if (args is ["grid", ..])
{
    GridComparison.Run();
    return;
}

if (args is ["demo-throughput", var requestFile, ..])
{
    DemoThroughput.Run(requestFile, args.Length > 2 ? double.Parse(args[2], CultureInfo.InvariantCulture) : 10);
    return;
}

BenchmarkSwitcher.FromAssembly(typeof(EvaluationBenchmarks).Assembly).Run(args);
