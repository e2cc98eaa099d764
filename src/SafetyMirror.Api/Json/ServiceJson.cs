using System.Text.Json;
using System.Text.Json.Serialization;
using NetTopologySuite.IO.Converters;

namespace SafetyMirror.Api.Json;

/// <summary>The JSON the service speaks: camelCase names, numbers only as JSON numbers, and RFC 7946 GeoJSON for NetTopologySuite types.</summary>
public static class ServiceJson
{
    /// <summary>Deepest nesting a request may have: a MultiPolygon's position in a plan in a request is 8 levels deep.</summary>
    /// <remarks>Stated, not left to the serializer's default of 64, so that deep nesting fails fast and the limit is documented.</remarks>
    public const int MaxDepth = 32;

    /// <summary>Configures the minimal-API serializer options.</summary>
    public static IServiceCollection AddServiceJson(this IServiceCollection services) =>
        services.ConfigureHttpJsonOptions(options =>
        {
            options.SerializerOptions.PropertyNamingPolicy = JsonNamingPolicy.CamelCase;
            options.SerializerOptions.MaxDepth = MaxDepth;

            // The web defaults also read numbers written as strings ("2.2"); the contract documents plain numbers, so a string is refused.
            options.SerializerOptions.NumberHandling = JsonNumberHandling.Strict;
            options.SerializerOptions.Converters.Add(new GeoJsonReadGuard(new GeoJsonConverterFactory()));
        });
}
