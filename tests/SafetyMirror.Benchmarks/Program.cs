using BenchmarkDotNet.Running;
using SafetyMirror.Benchmarks.Design;

if (args is ["grid", ..])
{
    GridComparison.Run();
    return;
}

BenchmarkSwitcher.FromAssembly(typeof(Program).Assembly).Run(args);
