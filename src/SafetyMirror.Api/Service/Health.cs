using System.Text.Json.Nodes;
using Microsoft.AspNetCore.Diagnostics.HealthChecks;
using Microsoft.OpenApi;
using Swashbuckle.AspNetCore.SwaggerGen;

namespace SafetyMirror.Api.Service;

/// <summary>The health probes, answered by ASP.NET Core health checks: liveness at <c>/healthz</c> and <c>/health/live</c>, readiness at <c>/health/ready</c>.</summary>
public static class Health
{
    /// <summary>The original liveness probe's path, kept for the load balancers that already call it.</summary>
    public const string Path = "/healthz";

    /// <summary>The liveness probe: the process answers; no dependency is checked, so an outage elsewhere never restarts it.</summary>
    public const string LivePath = "/health/live";

    /// <summary>The readiness probe: every check tagged <see cref="ReadyTag"/> passes, so the instance may take work.</summary>
    public const string ReadyPath = "/health/ready";

    /// <summary>The tag of the checks that readiness runs (study storage, batch job storage).</summary>
    public const string ReadyTag = "ready";

    /// <summary>Maps the three probes.</summary>
    public static IEndpointRouteBuilder MapHealth(this IEndpointRouteBuilder routes)
    {
        var live = new HealthCheckOptions { Predicate = _ => false };
        routes.MapHealthChecks(Path, live);
        routes.MapHealthChecks(LivePath, live);
        routes.MapHealthChecks(ReadyPath, new HealthCheckOptions { Predicate = check => check.Tags.Contains(ReadyTag) });
        return routes;
    }

    /// <summary>Describes the probes in the OpenAPI document, which sees only route handlers by itself.</summary>
    internal sealed class DocumentFilter : IDocumentFilter
    {
        public void Apply(OpenApiDocument swaggerDoc, DocumentFilterContext context)
        {
            Add(swaggerDoc, Path, "GetHealth", "Reports whether the service is up.",
                "Answers Healthy (200) or Unhealthy (503) as plain text, for load balancers and orchestrators. The same as /health/live.");
            Add(swaggerDoc, LivePath, "GetLiveness", "Reports whether the process is up (liveness).",
                "Checks no dependency, so an outage of the database never gets the instance restarted. Answers Healthy (200) as plain text.");
            Add(swaggerDoc, ReadyPath, "GetReadiness", "Reports whether the instance can take work (readiness).",
                "Checks that the study storage and the batch job storage answer a query. Answers Healthy (200), "
                + "or Unhealthy (503) while a dependency does not answer, as plain text.");
        }

        private static void Add(OpenApiDocument document, string path, string operationId, string summary, string description)
        {
            var operation = new OpenApiOperation
            {
                OperationId = operationId,
                Summary = summary,
                Description = description,
                Tags = new HashSet<OpenApiTagReference> { new(Landing.Tag, document) },
                Responses = new OpenApiResponses
                {
                    ["200"] = PlainText("The service is healthy.", "Healthy"),
                    ["503"] = PlainText("The service is unhealthy.", "Unhealthy"),
                },
            };
            document.Paths.Add(path, new OpenApiPathItem { Operations = new() { [HttpMethod.Get] = operation } });
        }

        private static OpenApiResponse PlainText(string description, string example) => new()
        {
            Description = description,
            Content = new Dictionary<string, IOpenApiMediaType>
            {
                ["text/plain"] = new OpenApiMediaType
                {
                    Schema = new OpenApiSchema { Type = JsonSchemaType.String },
                    Example = JsonValue.Create(example),
                },
            },
        };
    }
}
