using System.Text.Json;
using System.Text.Json.Nodes;
using NetTopologySuite.Features;
using SafetyMirror.Api.Features.Evaluations;
using SafetyMirror.Api.Features.Recommendations;
using SafetyMirror.Api.Features.Reports;
using SafetyMirror.Api.Requests;
using SafetyMirror.Core.Design.Evaluation;
using SafetyMirror.Core.Design.Recommendation;
using SafetyMirror.Core.Site;
using SafetyMirror.Reports.Justification;
using SafetyMirror.Studies;
using SafetyMirror.Api.Service;

namespace SafetyMirror.Api.Features.Studies;

/// <summary>A corner request as a study keeps it: the plan as posted, the mirror and options as read.</summary>
public sealed record StudyInput(JsonElement Plan, MirrorRequest? Mirror, RecommendationOptionsRequest? Options)
{
    /// <summary>The request a stored revision holds.</summary>
    public static StudyInput From(RevisionContent content, JsonSerializerOptions json)
    {
        ArgumentNullException.ThrowIfNull(content);
        using var plan = JsonDocument.Parse(content.PlanJson);
        return new StudyInput(
            plan.RootElement.Clone(),
            content.MirrorJson is null ? null : JsonSerializer.Deserialize<MirrorRequest>(content.MirrorJson, json),
            JsonSerializer.Deserialize<RecommendationOptionsRequest>(content.OptionsJson, json));
    }
}

/// <summary>One answer to a study's request: the plan read, the answer's JSON and its options echo, and its layers on demand.</summary>
/// <param name="Plan">The plan as the Core reads it.</param>
/// <param name="EvaluationJson">The evaluation answer, when a mirror was given.</param>
/// <param name="RecommendationJson">The recommendation answer, when none was.</param>
/// <param name="RuleSetJson">The options in force, defaults included.</param>
/// <param name="Layers">The GIS layers of the answer.</param>
public sealed record StudyRun(SitePlan Plan, string? EvaluationJson, string? RecommendationJson, string RuleSetJson, Func<FeatureCollection> Layers)
{
    /// <summary>The answer's JSON, whichever it is.</summary>
    public string AnswerJson => EvaluationJson ?? RecommendationJson!;
}

/// <summary>Runs a study's request through the Core exactly as the evaluation and recommendation routes do, and describes stored answers.</summary>
public static class StudyRuns
{
    /// <summary>The version of the service that answers: the API assembly's informational version.</summary>
    public static string ServiceVersion => ServiceTelemetry.Version;

    /// <summary>The glare year a stored revision was answered for when its options name none: the year it was stored, so its
    /// answer does not drift when it is run again in a later year.</summary>
    public static int GlareYearOf(Revision revision) => (revision ?? throw new ArgumentNullException(nameof(revision))).CreatedAt.UtcDateTime.Year;

    /// <summary>Evaluates the mirror, or recommends one when there is none; null with every problem recorded under its path.</summary>
    /// <remarks><paramref name="defaultGlareYear"/> is the year of the sun glare scan when the options name none.</remarks>
    public static StudyRun? Run(StudyInput input, int defaultGlareYear, JsonSerializerOptions json, RequestErrors errors, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(input);
        var plan = CornerRequestReader.ReadPlan(input.Plan, SitePlanLimits.Default, errors);
        if (input.Mirror is null)
        {
            var options = RecommendationRequestReader.ReadOptions(input.Options, plan, errors);
            var recommendedGlare = GlareAnswer.Read(input.Options, defaultGlareYear, errors);
            var result = plan is not null && errors.IsEmpty ? ServiceTelemetry.Measure(ComputeKind.Recommendation, () => MirrorRecommender.Recommend(plan, options.WithGlareTieBreak(recommendedGlare), cancellationToken)) : null;
            if (result is not null)
            {
                CornerRequestReader.AddProblems(result.Problems, errors);
            }

            if (plan is null || !errors.IsEmpty || result?.Recommendation is not { } recommendation)
            {
                return null;
            }

            var response = recommendation.ToResponse(plan, options, recommendedGlare, cancellationToken);
            return new StudyRun(plan, null, JsonSerializer.Serialize(response, json), JsonSerializer.Serialize(response.Options, json), () => recommendation.ToLayers(plan));
        }

        var evaluationOptions = ReportEndpoints.ReadEvaluationOptions(input.Options, errors);
        var glare = GlareAnswer.Read(input.Options, defaultGlareYear, errors);
        var placement = CornerRequestReader.ReadMirror(input.Mirror, plan?.Frame, errors);
        var evaluated = plan is not null && placement is not null && errors.IsEmpty ? ServiceTelemetry.Measure(ComputeKind.Evaluation, () => MirrorEvaluator.Evaluate(plan, placement, evaluationOptions, cancellationToken)) : null;
        if (evaluated is not null)
        {
            CornerRequestReader.AddProblems(evaluated.Problems, errors);
        }

        if (plan is null || !errors.IsEmpty || evaluated?.Evaluation is not { } checkedEvaluation)
        {
            return null;
        }

        var (evaluation, scan) = GlareAnswer.Apply(plan, checkedEvaluation, glare, cancellationToken);
        var answer = evaluation.ToResponse(plan, GlareAnswer.ToResponse(scan, glare));
        return new StudyRun(plan, JsonSerializer.Serialize(answer, json), null, JsonSerializer.Serialize(answer.Options, json), () => evaluation.ToLayers(plan));
    }

    /// <summary>The revision to store for a request and its answer.</summary>
    public static RevisionContent Content(StudyInput input, StudyRun run, string author, string? note, JsonSerializerOptions json)
    {
        ArgumentNullException.ThrowIfNull(input);
        ArgumentNullException.ThrowIfNull(run);
        return new RevisionContent(
            input.Plan.GetRawText(),
            JsonSerializer.Serialize(input.Options ?? new RecommendationOptionsRequest(), json),
            input.Mirror is null ? null : JsonSerializer.Serialize(input.Mirror, json),
            ServiceVersion,
            run.RuleSetJson,
            run.EvaluationJson,
            run.RecommendationJson,
            author,
            note ?? string.Empty);
    }

    /// <summary>The justification report on a stored revision, with the given header (whose stamp names the revision).</summary>
    public static JustificationReport? Report(Revision revision, JsonSerializerOptions json, ReportHeader header, RequestErrors errors, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(revision);
        var input = StudyInput.From(revision.Content, json);
        var plan = CornerRequestReader.ReadPlan(input.Plan, SitePlanLimits.Default, errors);
        return ReportEndpoints.Write(plan, input.Mirror, input.Options, header, UnitSystem.Metric, GlareYearOf(revision), errors, cancellationToken);
    }

    /// <summary>The plan's extent and centre, for a plan in WGS84; nulls for other plans.</summary>
    public static (GeoPoint? Point, GeoBox? Extent) Place(SitePlan plan, JsonElement planJson)
    {
        ArgumentNullException.ThrowIfNull(plan);
        if (!plan.Frame.CoordinateSystem.IsGeographic || plan.Frame.OriginLonLat is not { } origin)
        {
            return (null, null);
        }

        var (west, south, east, north) = (double.MaxValue, double.MaxValue, double.MinValue, double.MinValue);
        foreach (var (lon, lat) in Positions(planJson))
        {
            (west, south, east, north) = (Math.Min(west, lon), Math.Min(south, lat), Math.Max(east, lon), Math.Max(north, lat));
        }

        return (new GeoPoint(origin.X, origin.Y), west <= east ? new GeoBox(west, south, east, north) : null);
    }

    /// <summary>The deciding side of an answer: its decision, summary and per-approach figures.</summary>
    public static RunSideResponse Side(string serviceVersion, string answerJson)
    {
        var answer = JsonNode.Parse(answerJson)!.AsObject();
        var decision = (string?)answer["decision"] ?? (string?)answer["outcome"] ?? string.Empty;
        var figures = Evaluations(answer)
            .SelectMany(e => e["approaches"]!.AsArray().OfType<JsonNode>())
            .Select(a => new ApproachFiguresResponse(
                (string?)a["approach"]?["id"] ?? $"#{(int?)a["approach"]?["featureIndex"]}",
                (double)a["summary"]!["requiredSightDistanceM"]!,
                (double)a["summary"]!["providedSightDistanceM"]!,
                (double?)a["summary"]!["longestUnseen"]?["lengthM"]))
            .ToList();
        return new RunSideResponse(serviceVersion, decision, (string?)answer["summary"] ?? string.Empty, figures);
    }

    /// <summary>The evaluations an answer states: itself for an evaluation, the first alternative's mirrors' for a recommendation.</summary>
    public static IReadOnlyList<JsonNode> Evaluations(JsonNode answer)
    {
        ArgumentNullException.ThrowIfNull(answer);
        return answer["approaches"] is not null
            ? [answer]
            : answer["alternatives"]?.AsArray().FirstOrDefault()?["mirrors"]?.AsArray().Select(m => m?["evaluation"]).OfType<JsonNode>().ToList() ?? [];
    }

    /// <summary>The decision of a stored revision's answer.</summary>
    public static string Decision(Revision revision)
    {
        ArgumentNullException.ThrowIfNull(revision);
        var answer = JsonNode.Parse(revision.Content.EvaluationJson ?? revision.Content.RecommendationJson ?? "{}")!;
        return (string?)answer["decision"] ?? (string?)answer["outcome"] ?? string.Empty;
    }

    // Every position under a "coordinates" member: a GeoJSON position is an array that starts with two numbers.
    private static IEnumerable<(double Lon, double Lat)> Positions(JsonElement element, bool underCoordinates = false)
    {
        if (element.ValueKind == JsonValueKind.Object)
        {
            foreach (var member in element.EnumerateObject().Where(m => m.Name is "coordinates" or "geometry" or "geometries" or "features"))
            {
                foreach (var position in Positions(member.Value, member.Name == "coordinates"))
                {
                    yield return position;
                }
            }
        }
        else if (element.ValueKind == JsonValueKind.Array)
        {
            if (underCoordinates && element.GetArrayLength() >= 2 && element[0].ValueKind == JsonValueKind.Number && element[1].ValueKind == JsonValueKind.Number)
            {
                yield return (element[0].GetDouble(), element[1].GetDouble());
                yield break;
            }

            foreach (var item in element.EnumerateArray())
            {
                foreach (var position in Positions(item, underCoordinates))
                {
                    yield return position;
                }
            }
        }
    }
}
