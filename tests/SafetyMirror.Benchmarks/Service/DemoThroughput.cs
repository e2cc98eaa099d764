using System.Diagnostics;
using System.Text.Json;
using Microsoft.AspNetCore.Http.Json;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Options;
using SafetyMirror.Api.Requests;
using SafetyMirror.Api.Features.Evaluations;
using SafetyMirror.Api.Json;
using SafetyMirror.Core.Design.Evaluation;
using SafetyMirror.Core.Site;

namespace SafetyMirror.Benchmarks.Service;

/// <summary>
/// Evaluations of the demo corner per second in process, on every core, stage by stage: the figure the HTTP
/// throughput of <c>deploy/load-mix.sh</c> is compared with, and where an HTTP evaluation's time goes.
/// </summary>
/// <remarks>
/// A throughput on all cores, not a BenchmarkDotNet run: it is set beside wrk's requests per second measured on the
/// same cores in the same script. The stages do what <c>POST /v1/evaluations</c> does, with the service's JSON options.
/// </remarks>
public static class DemoThroughput
{
    /// <summary>Measures each stage for <paramref name="seconds"/> and prints one line per stage.</summary>
    public static void Run(string requestFile, double seconds)
    {
        var json = new ServiceCollection().AddServiceJson().BuildServiceProvider()
            .GetRequiredService<IOptions<JsonOptions>>().Value.SerializerOptions;
        var body = File.ReadAllBytes(requestFile);
        var (plan, mirror, options) = Read(body, json);
        var evaluation = MirrorEvaluator.Evaluate(plan, mirror, options).Evaluation!;
        var answer = JsonSerializer.SerializeToUtf8Bytes(evaluation.ToResponse(plan), json);
        var duration = TimeSpan.FromSeconds(seconds);

        Console.WriteLine($"request {body.Length} bytes, answer {answer.Length} bytes, {Environment.ProcessorCount} cores");

        // Warm up every stage at once, so that no stage is measured while its code still runs unoptimised (tier 0).
        Measure(() => Whole(body, json), duration);
        var request = JsonSerializer.Deserialize<EvaluationRequest>(body, json)!;
        Report("deserialize the request (System.Text.Json)", Rate(() => JsonSerializer.Deserialize<EvaluationRequest>(body, json), duration));
        Report("read its plan, options and mirror", Rate(() => Read(request), duration));
        Report("evaluate", Rate(() => MirrorEvaluator.Evaluate(plan, mirror, options), duration));
        Report("map the answer", Rate(() => evaluation.ToResponse(plan), duration));
        Report("serialize the mapped answer", Rate(() => JsonSerializer.SerializeToUtf8Bytes(evaluation.ToResponse(plan), json), duration));
        Report("whole request in process", Rate(() => Whole(body, json), duration));
    }

    private static (SitePlan Plan, MirrorPlacement Mirror, EvaluationOptions Options) Read(byte[] body, JsonSerializerOptions json) =>
        Read(JsonSerializer.Deserialize<EvaluationRequest>(body, json)!);

    private static (SitePlan Plan, MirrorPlacement Mirror, EvaluationOptions Options) Read(EvaluationRequest request)
    {
        var errors = new RequestErrors();
        var plan = CornerRequestReader.ReadPlan(request.Plan, SitePlanLimits.Default, errors);
        var options = CornerRequestReader.ReadOptions(request.Options, errors);
        var mirror = CornerRequestReader.ReadMirror(request.Mirror, plan?.Frame, errors);
        return errors.IsEmpty && plan is not null && mirror is not null
            ? (plan, mirror, options)
            : throw new InvalidOperationException($"The request is not valid: {string.Join("; ", errors.ToDictionary().Keys)}");
    }

    // What the endpoint does for a valid request: read, evaluate (checks included), map and write the answer.
    private static byte[] Whole(byte[] body, JsonSerializerOptions json)
    {
        var (plan, mirror, options) = Read(body, json);
        return JsonSerializer.SerializeToUtf8Bytes(MirrorEvaluator.Evaluate(plan, mirror, options).Evaluation!.ToResponse(plan), json);
    }

    // Operations per second with one worker per core.
    private static double Rate(Action operation, TimeSpan duration) => Measure(operation, duration);

    private static double Measure(Action operation, TimeSpan duration)
    {
        long count = 0;
        var clock = Stopwatch.StartNew();
        Parallel.For(0, Environment.ProcessorCount, new ParallelOptions { MaxDegreeOfParallelism = Environment.ProcessorCount }, _ =>
        {
            long done = 0;
            while (clock.Elapsed < duration)
            {
                operation();
                done++;
            }

            Interlocked.Add(ref count, done);
        });
        return count / clock.Elapsed.TotalSeconds;
    }

    private static void Report(string stage, double perSecond) => Console.WriteLine($"{stage,-48} {perSecond,10:0} per second");
}
