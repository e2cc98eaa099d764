using System.Diagnostics;
using System.Diagnostics.Metrics;
using System.Reflection;
using OpenTelemetry;
using OpenTelemetry.Metrics;
using OpenTelemetry.Resources;
using OpenTelemetry.Trace;

namespace SafetyMirror.Api.Service;

/// <summary>What the service computes, as the <c>kind</c> tag of <c>safetymirror.compute.duration</c>.</summary>
public enum ComputeKind
{
    /// <summary>One mirror judged on a corner.</summary>
    Evaluation,

    /// <summary>A search for the mirror to install.</summary>
    Recommendation,

    /// <summary>A justification report, its evaluation or recommendation included.</summary>
    Report,

    /// <summary>A picture of what the waiting driver sees in the mirror.</summary>
    View,
}

/// <summary>The service's own traces and metrics: one <see cref="ActivitySource"/> and one <see cref="Meter"/>, both named "SafetyMirror".</summary>
/// <remarks>
/// Instruments that watch the service from outside the request path (batch progress, queue depth) belong on the same
/// <see cref="Meter"/>, so every exporter that listens to it sees them too.
/// </remarks>
public static class ServiceTelemetry
{
    /// <summary>The name of the activity source and of the meter.</summary>
    public const string Name = "SafetyMirror";

    /// <summary>The service name exported with every trace, metric and log.</summary>
    public const string ServiceName = "safetymirror";

    /// <summary>The configuration key of the OTLP endpoint; the standard OTEL_EXPORTER_OTLP_ENDPOINT variable works too.</summary>
    public const string OtlpEndpointKey = "Telemetry:OtlpEndpoint";

    /// <summary>The standard variable of the OTLP endpoint, read by the exporter itself.</summary>
    public const string StandardOtlpEndpointKey = "OTEL_EXPORTER_OTLP_ENDPOINT";

    /// <summary>The version of the service: the API assembly's informational version.</summary>
    public static string Version { get; } =
        typeof(ServiceTelemetry).Assembly.GetCustomAttribute<AssemblyInformationalVersionAttribute>()?.InformationalVersion ?? "unknown";

    /// <summary>The source of the service's own spans (one per computation).</summary>
    public static ActivitySource ActivitySource { get; } = new(Name, Version);

    /// <summary>The meter of the service's own instruments.</summary>
    public static Meter Meter { get; } = new(Name, Version);

    /// <summary>Evaluations computed, wherever they were asked for (an evaluation, a report, a study).</summary>
    public static Counter<long> Evaluations { get; } =
        Meter.CreateCounter<long>("safetymirror.evaluations", "{evaluation}", "Mirror evaluations computed.");

    /// <summary>Recommendations computed, wherever they were asked for.</summary>
    public static Counter<long> Recommendations { get; } =
        Meter.CreateCounter<long>("safetymirror.recommendations", "{recommendation}", "Mirror recommendations computed.");

    /// <summary>How long each computation took, tagged with its <see cref="ComputeKind"/>.</summary>
    public static Histogram<double> ComputeDuration { get; } =
        Meter.CreateHistogram<double>("safetymirror.compute.duration", "s", "Time spent computing an evaluation, a recommendation or a report.");

    /// <summary>Starts timing a computation: a span now, and its duration and count when the result is disposed.</summary>
    public static IDisposable Measure(ComputeKind kind) => new Measurement(kind);

    /// <summary>Runs a computation under <see cref="Measure(ComputeKind)"/> and returns its result.</summary>
    public static T Measure<T>(ComputeKind kind, Func<T> compute)
    {
        ArgumentNullException.ThrowIfNull(compute);
        using var measuring = Measure(kind);
        return compute();
    }

    /// <summary>Registers traces and metrics (the service's own, ASP.NET Core, outgoing HTTP and the runtime); export over OTLP only when an endpoint is configured.</summary>
    public static WebApplicationBuilder AddServiceTelemetry(this WebApplicationBuilder builder)
    {
        var telemetry = builder.Services.AddOpenTelemetry()
            .ConfigureResource(resource => resource.AddService(ServiceName, serviceVersion: Version))
            .WithTracing(tracing => tracing.AddSource(Name).AddAspNetCoreInstrumentation().AddHttpClientInstrumentation())
            .WithMetrics(metrics => metrics.AddMeter(Name).AddAspNetCoreInstrumentation().AddHttpClientInstrumentation().AddRuntimeInstrumentation());

        if (builder.Configuration[OtlpEndpointKey] is { Length: > 0 } endpoint)
        {
            // The exporter reads the standard key (with its protocol and headers); the service's own key only names it.
            builder.Configuration[StandardOtlpEndpointKey] = endpoint;
        }

        if (!string.IsNullOrWhiteSpace(builder.Configuration[StandardOtlpEndpointKey]))
        {
            // Logs, metrics and traces alike; without an endpoint nothing leaves the process.
            telemetry.UseOtlpExporter();
        }

        return builder;
    }

    private static string TagValue(ComputeKind kind) => kind switch
    {
        ComputeKind.Evaluation => "evaluation",
        ComputeKind.Recommendation => "recommendation",
        ComputeKind.View => "view",
        _ => "report",
    };

    private sealed class Measurement : IDisposable
    {
        private readonly ComputeKind kind;
        private readonly long started = Stopwatch.GetTimestamp();
        private readonly Activity? activity;

        public Measurement(ComputeKind kind)
        {
            this.kind = kind;
            activity = ActivitySource.StartActivity($"compute {TagValue(kind)}");
            activity?.SetTag("safetymirror.compute.kind", TagValue(kind));
        }

        public void Dispose()
        {
            ComputeDuration.Record(Stopwatch.GetElapsedTime(started).TotalSeconds, new KeyValuePair<string, object?>("kind", TagValue(kind)));
            switch (kind)
            {
                case ComputeKind.Evaluation:
                    Evaluations.Add(1);
                    break;
                case ComputeKind.Recommendation:
                    Recommendations.Add(1);
                    break;
            }

            activity?.Dispose();
        }
    }
}
