using Microsoft.OpenApi;
using SafetyMirror.Api.Limits;
using SafetyMirror.Api.Service;
using Swashbuckle.AspNetCore.SwaggerGen;

namespace SafetyMirror.Api.OpenApi;

/// <summary>The OpenAPI 3.1 document at <c>/swagger/v1/swagger.json</c> and the Swagger UI at <c>/swagger</c>.</summary>
public static class OpenApiDocumentSetup
{
    /// <summary>The name of the one document, also its path segment.</summary>
    public const string DocumentName = "v1";

    /// <summary>Adds the document generator with its info block, the GeoJSON schemas and the health probe.</summary>
    public static IServiceCollection AddServiceOpenApi(this IServiceCollection services)
    {
        services.AddEndpointsApiExplorer();
        services.AddSwaggerGen(options =>
        {
            options.MapGeoJsonTypes();
            options.IncludeXmlComments(typeof(OpenApiDocumentSetup).Assembly);
            options.DocumentCorners();
            options.SupportNonNullableReferenceTypes();
            options.DocumentFilter<Health.DocumentFilter>();
            options.DocumentFilter<TagDescriptions>();

            // Relative: a client generated from the document calls whichever host served it.
            options.AddServer(new OpenApiServer { Url = "/", Description = "This service, where the document was fetched from" });
        });
        services.AddOptions<SwaggerGenOptions>()
            .Configure<RequestLimits>((options, limits) => options.SwaggerDoc(DocumentName, Info(limits)));
        return services;
    }

    /// <summary>Serves the document and the Swagger UI.</summary>
    public static IApplicationBuilder UseServiceOpenApi(this IApplicationBuilder app) =>
        app.UseSwagger(options => options.OpenApiVersion = OpenApiSpecVersion.OpenApi3_1)
            .UseSwaggerUI(options => options.DocumentTitle = "SafetyMirror API");

    private static OpenApiInfo Info(RequestLimits limits) => new()
    {
        Title = "SafetyMirror API",
        Version = DocumentName,
        Description =
            "Decision support for traffic engineers deciding whether a convex safety mirror can restore sight distance "
            + "at a blind corner, and which mirror to mount where, how high and aimed where. "
            + $"Request bodies are limited to {limits.MaxRequestBodyBytes} bytes (413 beyond) and each client to "
            + $"{limits.PermitLimit} requests per {limits.WindowSeconds} s on /v1 (429 beyond); errors are RFC 9457 problem details. "
            + "Caution: a convex mirror makes vehicles look farther away and slower than they are, does not replace removing "
            + "the obstruction, needs upkeep against dirt, glare and ice, and local rules and licensed engineering judgement govern every result.",
    };
}
