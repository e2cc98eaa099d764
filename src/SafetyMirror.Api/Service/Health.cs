using System.Text.Json.Nodes;
using Microsoft.OpenApi;
using Swashbuckle.AspNetCore.SwaggerGen;

namespace SafetyMirror.Api.Service;

/// <summary>The liveness probe at <c>/healthz</c>, answered by ASP.NET Core health checks.</summary>
public static class Health
{
    /// <summary>The probe's path.</summary>
    public const string Path = "/healthz";

    /// <summary>Maps the health-check endpoint.</summary>
    public static IEndpointConventionBuilder MapHealth(this IEndpointRouteBuilder routes) =>
        routes.MapHealthChecks(Path);

    /// <summary>Describes the probe in the OpenAPI document, which sees only route handlers by itself.</summary>
    internal sealed class DocumentFilter : IDocumentFilter
    {
        public void Apply(OpenApiDocument swaggerDoc, DocumentFilterContext context)
        {
            var operation = new OpenApiOperation
            {
                OperationId = "GetHealth",
                Summary = "Reports whether the service is up.",
                Description = "Answers Healthy (200) or Unhealthy (503) as plain text, for load balancers and orchestrators.",
                Tags = new HashSet<OpenApiTagReference> { new(Landing.Tag, swaggerDoc) },
                Responses = new OpenApiResponses
                {
                    ["200"] = PlainText("The service is healthy.", "Healthy"),
                    ["503"] = PlainText("The service is unhealthy.", "Unhealthy"),
                },
            };
            swaggerDoc.Paths.Add(Path, new OpenApiPathItem { Operations = new() { [HttpMethod.Get] = operation } });
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
