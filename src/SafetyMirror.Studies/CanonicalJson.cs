using System.Text.Encodings.Web;
using System.Text.Json;

namespace SafetyMirror.Studies;

/// <summary>One text for each JSON value, so equal documents hash equally however they were written.</summary>
/// <remarks>
/// The canonical form: no insignificant whitespace; object members sorted by name (ordinal, UTF-16 code units);
/// array order kept; numbers written as the shortest text that reads back to the same IEEE double (so 1, 1.0
/// and 1e0 are one number); strings unescaped, then escaped by one fixed rule. Two members with one name are
/// refused. In the spirit of RFC 8785, not byte-identical with it.
/// </remarks>
public static class CanonicalJson
{
    static readonly JsonWriterOptions WriterOptions = new() { Encoder = JavaScriptEncoder.UnsafeRelaxedJsonEscaping };

    /// <summary>The canonical UTF-8 bytes of a JSON text; throws <see cref="JsonException"/> when it is not JSON.</summary>
    public static byte[] ToUtf8(string json)
    {
        using var document = JsonDocument.Parse(json);
        using var buffer = new MemoryStream();
        using (var writer = CreateWriter(buffer))
            Write(document.RootElement, writer);
        return buffer.ToArray();
    }

    /// <summary>A writer whose string escaping is the canonical one.</summary>
    public static Utf8JsonWriter CreateWriter(Stream output) => new(output, WriterOptions);

    /// <summary>Writes an element in canonical form to a writer from <see cref="CreateWriter"/>.</summary>
    public static void Write(JsonElement element, Utf8JsonWriter writer)
    {
        switch (element.ValueKind)
        {
            case JsonValueKind.Object:
                writer.WriteStartObject();
                string? previous = null;
                foreach (var member in element.EnumerateObject().OrderBy(m => m.Name, StringComparer.Ordinal))
                {
                    if (member.Name == previous)
                        throw new JsonException($"The member '{member.Name}' appears twice in one object.");
                    previous = member.Name;
                    writer.WritePropertyName(member.Name);
                    Write(member.Value, writer);
                }
                writer.WriteEndObject();
                break;
            case JsonValueKind.Array:
                writer.WriteStartArray();
                foreach (var item in element.EnumerateArray())
                    Write(item, writer);
                writer.WriteEndArray();
                break;
            case JsonValueKind.Number:
                writer.WriteNumberValue(element.GetDouble());
                break;
            default:
                element.WriteTo(writer);
                break;
        }
    }
}
