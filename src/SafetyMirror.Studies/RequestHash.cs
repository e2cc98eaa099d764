using System.Security.Cryptography;
using System.Text.Json;

namespace SafetyMirror.Studies;

/// <summary>The content hash of a revision: SHA-256 of its canonical request.</summary>
/// <remarks>
/// The request is the object <c>{"mirror": …, "options": …, "plan": …}</c> (mirror null when absent) in
/// <see cref="CanonicalJson"/> form, so anyone can recompute the hash from the stored documents and check that a
/// re-run saw the same request.
/// </remarks>
public static class RequestHash
{
    /// <summary>Lower-case hex SHA-256 of the canonical request; throws <see cref="JsonException"/> on a text that is not JSON.</summary>
    public static string Of(string planJson, string optionsJson, string? mirrorJson)
    {
        using var plan = JsonDocument.Parse(planJson);
        using var options = JsonDocument.Parse(optionsJson);
        using var mirror = mirrorJson is null ? null : JsonDocument.Parse(mirrorJson);

        using var buffer = new MemoryStream();
        using (var writer = CanonicalJson.CreateWriter(buffer))
        {
            // Members in ordinal order, as CanonicalJson writes every object.
            writer.WriteStartObject();
            writer.WritePropertyName("mirror");
            if (mirror is null) writer.WriteNullValue();
            else CanonicalJson.Write(mirror.RootElement, writer);
            writer.WritePropertyName("options");
            CanonicalJson.Write(options.RootElement, writer);
            writer.WritePropertyName("plan");
            CanonicalJson.Write(plan.RootElement, writer);
            writer.WriteEndObject();
        }
        return Convert.ToHexStringLower(SHA256.HashData(buffer.ToArray()));
    }
}
