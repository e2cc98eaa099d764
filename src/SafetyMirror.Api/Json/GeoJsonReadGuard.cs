using System.Text.Json;
using System.Text.Json.Serialization;
using NetTopologySuite.Geometries;
using NetTopologySuite.IO.Converters;

namespace SafetyMirror.Api.Json;

/// <summary>Wraps <see cref="GeoJsonConverterFactory"/> so that GeoJSON which cannot be read is a JSON error.</summary>
/// <remarks>
/// NetTopologySuite rejects a malformed geometry (an unclosed ring, a one-point line, an unknown type name) with
/// <see cref="ArgumentException"/>, and a geometry of another type than the one declared fails a cast outside
/// the converter. Both would surface as 500; as <see cref="JsonException"/> they become a 400 that names the path.
/// </remarks>
internal sealed class GeoJsonReadGuard(GeoJsonConverterFactory inner) : JsonConverterFactory
{
    public override bool CanConvert(Type typeToConvert) => inner.CanConvert(typeToConvert);

    public override JsonConverter CreateConverter(Type typeToConvert, JsonSerializerOptions options)
    {
        var converter = inner.CreateConverter(typeToConvert, options)
            ?? throw new NotSupportedException($"No GeoJSON converter for {typeToConvert}.");
        var guarded = typeof(Guarded<,>).MakeGenericType(typeToConvert, converter.Type!);
        return (JsonConverter)Activator.CreateInstance(guarded, converter)!;
    }

    private sealed class Guarded<TValue, TRead>(JsonConverter<TRead> converter) : JsonConverter<TValue>
    {
        public override bool HandleNull => converter.HandleNull;

        public override TValue? Read(ref Utf8JsonReader reader, Type typeToConvert, JsonSerializerOptions options)
        {
            TRead? value;
            try
            {
                value = converter.Read(ref reader, typeof(TRead), options);
            }
            catch (ArgumentException e)
            {
                throw new JsonException($"Not valid GeoJSON: {e.Message}", e);
            }

            return value switch
            {
                null => default,
                TValue wanted => wanted,
                _ => throw new JsonException($"A GeoJSON {typeof(TValue).Name} is expected here, not {Describe(value)}."),
            };
        }

        public override void Write(Utf8JsonWriter writer, TValue value, JsonSerializerOptions options) =>
            converter.Write(writer, (TRead)(object)value!, options);

        private static string Describe(TRead value) => value is Geometry geometry ? $"a {geometry.GeometryType}" : "another GeoJSON object";
    }
}
