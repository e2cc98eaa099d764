using System.Globalization;
using System.Text.Json;
using Microsoft.AspNetCore.Mvc;
using SafetyMirror.Api.Requests;
using SafetyMirror.Api.Features.Recommendations;
using SafetyMirror.Api.Features.Reports;

namespace SafetyMirror.Api.Limits;

/// <summary>Says which inputs made a request heavier than its work budget, and how to lighten it.</summary>
internal static class HeavyInput
{
    /// <summary>Text longer than this is named as a cost: wrapping an unbroken word grows with its square.</summary>
    private const int LongTextCharacters = 1_000;

    /// <summary>What the operation is called in the answer, from the request it was given.</summary>
    public static string OperationOf(EndpointFilterInvocationContext context) =>
        context.Arguments.OfType<ReportRequest>().Any() ? "The report" : context.Arguments.OfType<RecommendationRequest>().Any() ? "The recommendation" : "The request";

    /// <summary>The 503 problem of a request over its deadline, naming the inputs its work grows with.</summary>
    public static ProblemDetails OverDeadline(WorkLimits limits, string operation, IEnumerable<object?> arguments)
    {
        var causes = arguments.SelectMany(Causes).ToList();
        var seconds = limits.DeadlineSeconds.ToString("0.###", CultureInfo.InvariantCulture);
        return new ProblemDetails
        {
            Status = StatusCodes.Status503ServiceUnavailable,
            Title = "The request needs more work than one request may take.",
            Detail = $"{operation} did not finish within its {seconds} s budget. "
                + (causes.Count == 0 ? "Send a smaller plan." : string.Join(" ", causes)),
            Extensions = { ["deadlineSeconds"] = limits.DeadlineSeconds },
        };
    }

    private static IEnumerable<string> Causes(object? argument) => argument switch
    {
        RecommendationRequest request => SearchCauses(PlanCensus.Of(request.Plan), request.Options),
        ReportRequest { Mirror: null } request => SearchCauses(PlanCensus.Of(request.Plan), request.Options).Concat(TextCauses(request)),
        ReportRequest request => EvaluationCauses(PlanCensus.Of(request.Plan), request.Options).Concat(TextCauses(request)),
        _ => [],
    };

    private static IEnumerable<string> SearchCauses(PlanCensus plan, RecommendationOptionsRequest? options)
    {
        var served = options?.ServedApproaches?.Count;
        yield return $"The search tries pole positions every few metres along the mounting zones ({plan.MountingZones} mounting-zone features, "
            + $"{plan.MountingZoneVertices} vertices) or else the carriageway's far edge, for each approach served "
            + $"({served?.ToString(CultureInfo.InvariantCulture) ?? "every short one"} of {plan.Approaches} approach features), "
            + $"each catalogue mirror ({options?.Catalogue?.Count.ToString(CultureInfo.InvariantCulture) ?? "5 default"} entries) "
            + $"and each alternative ({options?.Alternatives?.ToString(CultureInfo.InvariantCulture) ?? "3 by default"}).";
        yield return "To lighten it: draw the mounting-zone features only where a pole may really stand, name fewer approaches in "
            + "options.servedApproaches, send a shorter options.catalogue or fewer options.alternatives.";
    }

    private static IEnumerable<string> EvaluationCauses(PlanCensus plan, CornerOptionsRequest? options)
    {
        yield return $"The evaluation grows with the approaches ({plan.Approaches} approach features), their stations "
            + $"({(options?.StationsM is { } stations ? $"{stations.Count} in options.stationsM" : "options.stationSpacingM apart")}), "
            + $"the road users ({options?.RoadUsers?.Count.ToString(CultureInfo.InvariantCulture) ?? "default"}) and the obstacles ({plan.Obstacles}).";
        yield return "To lighten it: send fewer approach features, fewer options.stationsM or a wider options.stationSpacingM, fewer options.roadUsers.";
    }

    private static IEnumerable<string> TextCauses(ReportRequest request)
    {
        var fields = new (string Name, string? Text)[]
        {
            ("report.title", request.Report?.Title), ("report.site", request.Report?.Site), ("report.reference", request.Report?.Reference),
            ("report.requestedBy", request.Report?.RequestedBy), ("report.preparedBy", request.Report?.PreparedBy),
        };
        foreach (var (name, text) in fields.Where(f => f.Text?.Length > LongTextCharacters))
        {
            yield return $"{name} is {text!.Length} characters long; a report lays it out line by line, so shorten it.";
        }

        if (PlanCensus.Of(request.Plan).LongestNameCharacters is > LongTextCharacters and var longest)
        {
            yield return $"A feature's properties.name is {longest} characters long; the report writes names as captions, so shorten it.";
        }
    }

    /// <summary>What a plan holds, counted from its JSON without trusting its shape (roles as the plan's properties.role spells them).</summary>
    private sealed record PlanCensus(int Approaches, int Obstacles, int MountingZones, int MountingZoneVertices, int LongestNameCharacters)
    {
        public static PlanCensus Of(JsonElement plan)
        {
            int approaches = 0, obstacles = 0, zones = 0, zoneVertices = 0, longestName = 0;
            if (plan.ValueKind == JsonValueKind.Object && plan.TryGetProperty("features", out var features) && features.ValueKind == JsonValueKind.Array)
            {
                foreach (var feature in features.EnumerateArray().Where(f => f.ValueKind == JsonValueKind.Object))
                {
                    var properties = feature.TryGetProperty("properties", out var p) && p.ValueKind == JsonValueKind.Object ? p : default;
                    if (properties.ValueKind == JsonValueKind.Object && properties.TryGetProperty("name", out var name) && name.ValueKind == JsonValueKind.String)
                    {
                        // The raw text, quotes off: GetString would throw on a lone surrogate, and escapes only overcount.
                        longestName = Math.Max(longestName, name.GetRawText().Length - 2);
                    }

                    var role = properties.ValueKind == JsonValueKind.Object && properties.TryGetProperty("role", out var r) && r.ValueKind == JsonValueKind.String ? r : default;
                    if (role.ValueKind != JsonValueKind.String)
                    {
                        continue;
                    }

                    if (role.ValueEquals("approach"))
                    {
                        approaches++;
                    }
                    else if (role.ValueEquals("obstacle"))
                    {
                        obstacles++;
                    }
                    else if (role.ValueEquals("mounting-zone"))
                    {
                        zones++;
                        zoneVertices += feature.TryGetProperty("geometry", out var geometry) ? Vertices(geometry) : 0;
                    }
                }
            }

            return new PlanCensus(approaches, obstacles, zones, zoneVertices, longestName);
        }

        // A vertex is an array whose first member is a number; nesting is bounded by the framework's JSON depth limit.
        private static int Vertices(JsonElement element) => element.ValueKind switch
        {
            JsonValueKind.Object => element.TryGetProperty("coordinates", out var c) ? Vertices(c) : 0,
            JsonValueKind.Array when element.GetArrayLength() > 0 && element[0].ValueKind == JsonValueKind.Number => 1,
            JsonValueKind.Array => element.EnumerateArray().Sum(Vertices),
            _ => 0,
        };
    }
}
