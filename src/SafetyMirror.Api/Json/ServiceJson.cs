using System.Text.Json;
using NetTopologySuite.IO.Converters;

namespace SafetyMirror.Api.Json;

/// <summary>The JSON the service speaks: camelCase names and RFC 7946 GeoJSON for NetTopologySuite types.</summary>
public static class ServiceJson
{
    /// <summary>Configures the minimal-API serializer options.</summary>
    public static IServiceCollection AddServiceJson(this IServiceCollection services) =>
        services.ConfigureHttpJsonOptions(options =>
        {
            options.SerializerOptions.PropertyNamingPolicy = JsonNamingPolicy.CamelCase;
            options.SerializerOptions.Converters.Add(new GeoJsonReadGuard(new GeoJsonConverterFactory()));
        });
}
