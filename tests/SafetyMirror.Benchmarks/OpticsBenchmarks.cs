using BenchmarkDotNet.Attributes;
using SafetyMirror.Core.Optics;

namespace SafetyMirror.Benchmarks;

/// <summary>The engine's two inner costs: one exact reflection point and one field-of-view trace.</summary>
[MemoryDiagnoser]
public class OpticsBenchmarks
{
    private readonly ConvexMirror mirror = ConvexMirror.Aimed(new Vec3(0, 0, 2.9), 170, 8, 2.2, new RoundAperture(0.6));
    private readonly Vec3 eye = new(2.5, -9, 1.08);
    private readonly Vec3 target = new(-35, -14, 0.65);

    /// <summary>Target: under 2 µs.</summary>
    [Benchmark]
    public Reflection ReflectionPoint() => mirror.Reflect(eye, target);

    /// <summary>Target: under 1 ms for 1,000 rays.</summary>
    [Benchmark]
    public FieldOfView FieldOfView1000Rays() => FieldOfViewTracer.Trace(mirror, eye, 0, 200, 1000);
}
