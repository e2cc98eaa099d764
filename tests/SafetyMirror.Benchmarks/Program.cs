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

if (args is ["batch", var districtFile, ..])
{
    // batch FILE [processes] [workers per process]; several processes need SAFETYMIRROR_TEST_POSTGRES.
    await BatchThroughput.RunAsync(
        districtFile,
        args.Length > 2 ? int.Parse(args[2], CultureInfo.InvariantCulture) : 1,
        args.Length > 3 ? int.Parse(args[3], CultureInfo.InvariantCulture) : Environment.ProcessorCount,
        Environment.GetEnvironmentVariable("SAFETYMIRROR_TEST_POSTGRES"));
    return;
}

BenchmarkSwitcher.FromAssembly(typeof(EvaluationBenchmarks).Assembly).Run(args);
