using System.Text.Json;
using Microsoft.AspNetCore.Http.Json;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Options;
using SafetyMirror.Api.Requests;
using SafetyMirror.Api.Features.Recommendations;
using SafetyMirror.Api.Features.Reports;
using SafetyMirror.Api.Json;
using SafetyMirror.Core.Site;

namespace SafetyMirror.Fuzz;

/// <summary>What the fuzzer feeds bytes to: the readers that turn a client's JSON into the Core's inputs.</summary>
/// <remarks>
/// A reader must answer bad input with problems. Malformed JSON is the one exception allowed out: the service
/// answers its <see cref="JsonException"/> with a 400 before any reader runs. Anything else escaping is a crash.
/// </remarks>
public static class FuzzTargets
{
    /// <summary>The targets by the name run.sh passes on the command line.</summary>
    public static IReadOnlyDictionary<string, Action<byte[]>> ByName { get; } = new Dictionary<string, Action<byte[]>>
    {
        ["plan"] = ReadPlan,
        ["request"] = ReadRequest,
    };

    /// <summary>A GeoJSON FeatureCollection, straight into the Core's plan reader.</summary>
    public static void ReadPlan(byte[] input)
    {
        JsonDocument document;
        try
        {
            document = JsonDocument.Parse(input);
        }
        catch (JsonException)
        {
            return;
        }

        using (document)
        {
            SitePlanReader.Read(document.RootElement);
        }
    }

    /// <summary>A request body as the report endpoint takes it (plan, mirror, options and report: every member the three POST endpoints read).</summary>
    public static void ReadRequest(byte[] input)
    {
        ReportRequest? request;
        try
        {
            request = JsonSerializer.Deserialize<ReportRequest>(input, Service.Options);
        }
        catch (JsonException)
        {
            return;
        }

        if (request is null)
        {
            return;
        }

        var errors = new RequestErrors();
        var plan = CornerRequestReader.ReadPlan(request.Plan, SitePlanLimits.Default, errors);
        CornerRequestReader.ReadMirror(request.Mirror, plan?.Frame, errors);
        CornerRequestReader.ReadOptions(request.Options, errors);
        RecommendationRequestReader.ReadOptions(request.Options, plan, errors);
        ReportRequestReader.Read(request.Report, TimeProvider.System, errors);
        errors.ToDictionary();
    }

    // Built on first use, not when the class loads: instrumented code must not run before SharpFuzz has attached
    // afl's coverage map, or it writes to memory that is not there yet.
    private static class Service
    {
        // The service's own serializer options, as its minimal API binds request bodies with them.
        public static readonly JsonSerializerOptions Options = new ServiceCollection()
            .AddServiceJson()
            .BuildServiceProvider()
            .GetRequiredService<IOptions<JsonOptions>>().Value.SerializerOptions;
    }
}
