using System.ComponentModel;
using System.Reflection;
using System.Text.Json;
using System.Text.Json.Nodes;
using Microsoft.OpenApi;
using SafetyMirror.Api.Json;
using SafetyMirror.Core.Site;
using Swashbuckle.AspNetCore.SwaggerGen;

namespace SafetyMirror.Api.OpenApi;

/// <summary>Endpoint metadata: the 200 answer also comes as GIS layers (application/geo+json).</summary>
public sealed record GeoJsonAlternative;

/// <summary>Endpoint metadata: demo requests, by the file names of the committed examples in openapi/examples.</summary>
/// <param name="FileNames">Example file names, e.g. demo-corner-local.json.</param>
public sealed record RequestExamples(params string[] FileNames);

/// <summary>What the generated document cannot see by itself about corner requests: GeoJSON, PDF and PNG answers, demo corners, the plan's schema and limits.</summary>
public static class CornerDocumentation
{
    /// <summary>Adds the operation and schema filters.</summary>
    public static SwaggerGenOptions DocumentCorners(this SwaggerGenOptions options)
    {
        options.OperationFilter<OperationFilter>();
        options.SchemaFilter<DescriptionSchemaFilter>();
        options.SchemaFilter<PlanSchemaFilter>();
        return options;
    }

    /// <summary>Reads a committed example request embedded in this assembly.</summary>
    public static string Example(string fileName)
    {
        using var stream = Assembly.GetExecutingAssembly().GetManifestResourceStream("examples." + fileName)
            ?? throw new InvalidOperationException($"The example {fileName} is not embedded.");
        using var reader = new StreamReader(stream);
        return reader.ReadToEnd();
    }

    internal sealed class OperationFilter : IOperationFilter
    {
        public void Apply(OpenApiOperation operation, OperationFilterContext context)
        {
            var metadata = context.ApiDescription.ActionDescriptor.EndpointMetadata;
            if (metadata.OfType<GeoJsonAlternative>().Any() && operation.Responses?.TryGetValue("200", out var ok) == true && ok.Content is { } content)
            {
                content["application/geo+json"] = new OpenApiMediaType
                {
                    Schema = new OpenApiSchemaReference("GeoJsonFeatureCollection"),
                };
            }

            // A PDF or PNG answer is bytes, not text.
            foreach (var binary in new[] { "application/pdf", "image/png" })
            {
                if (operation.Responses?.TryGetValue("200", out var fileOk) == true && fileOk.Content?.TryGetValue(binary, out var file) == true && file is OpenApiMediaType fileMedia)
                {
                    fileMedia.Schema = new OpenApiSchema { Type = JsonSchemaType.String, Format = "binary" };
                }
            }

            if (metadata.OfType<RequestExamples>().FirstOrDefault() is { } examples
                && operation.RequestBody?.Content?.TryGetValue("application/json", out var body) == true
                && body is OpenApiMediaType media)
            {
                media.Examples = examples.FileNames.ToDictionary(
                    name => Path.GetFileNameWithoutExtension(name),
                    name => (IOpenApiExample)new OpenApiExample
                    {
                        Summary = $"Invented demo corner ({name})",
                        Value = JsonNode.Parse(Example(name)),
                    });
            }
        }
    }

    /// <summary>A contract member's <c>[Description]</c> is what the document shows: it states ranges, defaults and sources that the one-line XML summary leaves out.</summary>
    /// <remarks>Registered after the XML comments, whose summaries would otherwise stand, and before the plan's filter, which adds the limits.</remarks>
    internal sealed class DescriptionSchemaFilter : ISchemaFilter
    {
        public void Apply(IOpenApiSchema schema, SchemaFilterContext context)
        {
            if (schema is not OpenApiSchema { Properties: { } properties })
            {
                return;
            }

            foreach (var member in context.Type.GetProperties())
            {
                if (member.GetCustomAttribute<DescriptionAttribute>() is not { } description
                    || !properties.TryGetValue(JsonNamingPolicy.CamelCase.ConvertName(member.Name), out var property))
                {
                    continue;
                }

                switch (property)
                {
                    case OpenApiSchema inline:
                        inline.Description = description.Description;
                        break;
                    case OpenApiSchemaReference reference:
                        reference.Description = description.Description;
                        break;
                }
            }
        }
    }

    /// <summary>The request's <c>plan</c> (read as raw JSON) is described as the GeoJSON FeatureCollection it is, with its limits.</summary>
    internal sealed class PlanSchemaFilter : ISchemaFilter
    {
        public void Apply(IOpenApiSchema schema, SchemaFilterContext context)
        {
            if (schema is not OpenApiSchema { Properties: { } properties } || !properties.TryGetValue("plan", out var plan)
                || context.Type.GetProperty("Plan")?.PropertyType != typeof(JsonElement))
            {
                return;
            }

            var limits = SitePlanLimits.Default;
            properties["plan"] = new OpenApiSchema
            {
                AllOf = [new OpenApiSchemaReference("GeoJsonFeatureCollection")],
                Description = plan.Description
                    + $" Limits: at most {limits.MaxFeatures} features, {limits.MaxVerticesPerGeometry} vertices in one geometry and {limits.MaxVertices} in all,"
                    + $" fitting in a {limits.MaxExtentM} m × {limits.MaxExtentM} m box; approaches at most {limits.MaxApproachLengthM} m long,"
                    + $" mounting-zone polygons at most {limits.MaxMountingZoneAreaM2} m² and lines at most {limits.MaxMountingZoneLengthM} m, feature ids distinct, and every string at most {limits.MaxTextLength} characters of valid Unicode."
                    + $" Nesting is limited to {ServiceJson.MaxDepth} levels in the whole request.",
            };
        }
    }
}
