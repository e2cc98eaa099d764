using System.Diagnostics;
using Microsoft.AspNetCore.Hosting;
using Microsoft.AspNetCore.Mvc.Testing;
using Microsoft.AspNetCore.TestHost;
using Microsoft.Extensions.DependencyInjection;
using OpenTelemetry;
using OpenTelemetry.Exporter;
using OpenTelemetry.Metrics;
using OpenTelemetry.Trace;
using SafetyMirror.Api.Service;
using SafetyMirror.Api.Tests.Access;
using SafetyMirror.Api.Tests.Features.Evaluations;

namespace SafetyMirror.Api.Tests.Service;

// The service's meter is process-wide: these tests run alone, so the evaluations they count are their own.
[CollectionDefinition(Name, DisableParallelization = true)]
public sealed class TelemetryCollection
{
    public const string Name = "telemetry";
}

[Collection(TelemetryCollection.Name)]
public sealed class TelemetryTests
{
    [Fact]
    public async Task Evaluation_ThroughThePipeline_RecordsOneEvaluationAndOneDuration()
    {
        var metrics = new List<MetricSnapshot>();
        var spans = new List<Activity>();
        using var api = new ConfiguredApi(ConfiguredApi.Development).WithWebHostBuilder(host => host.ConfigureTestServices(services => services
            .ConfigureOpenTelemetryMeterProvider(meters => meters.AddInMemoryExporter(metrics))
            .ConfigureOpenTelemetryTracerProvider(tracing => tracing.AddInMemoryExporter(spans))));

        using var response = await api.PostEvaluationAsync(DemoCorners.Local());
        response.EnsureSuccessStatusCode();
        api.Services.GetRequiredService<MeterProvider>().ForceFlush();

        Assert.Equal(1, Sum(metrics, "safetymirror.evaluations"));
        var durations = metrics.Where(m => m.Name == "safetymirror.compute.duration").SelectMany(m => m.MetricPoints).ToList();
        var evaluation = Assert.Single(durations, p => Tag(p, "kind") == "evaluation");
        Assert.Equal(1, evaluation.GetHistogramCount());
        Assert.Contains(spans, s => s.Source.Name == ServiceTelemetry.Name && s.DisplayName == "compute evaluation");
    }

    [Fact]
    public void Services_WithoutOtlpEndpoint_RegisterNoOtlpExporter()
    {
        using var api = new ConfiguredApi(ConfiguredApi.Development);

        Assert.DoesNotContain(RegisteredTypes(api), IsOtlpExporterType);
    }

    [Fact]
    public void Services_WithOtlpEndpoint_RegisterTheOtlpExporter()
    {
        using var api = new ConfiguredApi(ConfiguredApi.Development, (ServiceTelemetry.OtlpEndpointKey, "http://127.0.0.1:4317"));

        Assert.Contains(RegisteredTypes(api), IsOtlpExporterType);
    }

    private static long Sum(IEnumerable<MetricSnapshot> metrics, string name) =>
        metrics.Where(m => m.Name == name).SelectMany(m => m.MetricPoints).Sum(p => p.GetSumLong());

    private static string? Tag(MetricPoint point, string key)
    {
        foreach (var tag in point.Tags)
        {
            if (tag.Key == key)
            {
                return tag.Value as string;
            }
        }

        return null;
    }

    // The OTLP exporter's registrations name its own types (its options, their factory) as service or generic argument.
    private static bool IsOtlpExporterType(Type type) => type.Assembly == typeof(OtlpExporterOptions).Assembly;

    private static List<Type> RegisteredTypes(WebApplicationFactory<Program> factory)
    {
        var types = new List<Type>();
        using var api = factory.WithWebHostBuilder(host => host.ConfigureTestServices(services => types.AddRange(services
            .SelectMany(d => new[] { d.ServiceType, d.ImplementationType }.OfType<Type>())
            .SelectMany(t => t.IsGenericType ? t.GetGenericArguments().Prepend(t) : [t]))));
        _ = api.Services;
        return types;
    }
}
