using System.Text.Json;

namespace SafetyMirror.Core.Site;

/// <summary>Small helpers for reading a JSON document and naming what was found in messages.</summary>
internal static class JsonText
{
    /// <summary>A JSON value as a message names it: <c>the string "NaN"</c>, <c>an array of 3</c>, <c>250</c>.</summary>
    public static string Describe(JsonElement value) => value.ValueKind switch
    {
        JsonValueKind.String => $"the string \"{value.GetString()}\"",
        JsonValueKind.Object => "an object",
        JsonValueKind.Array => $"an array of {value.GetArrayLength()}",
        JsonValueKind.Undefined => "missing",
        _ => value.GetRawText(),
    };

    /// <summary>The member of an object, or an undefined element when it is absent or the value is not an object.</summary>
    public static JsonElement Member(JsonElement value, string name) =>
        value.ValueKind == JsonValueKind.Object && value.TryGetProperty(name, out var member) ? member : default;

    /// <summary>True when the member is absent or JSON null.</summary>
    public static bool IsAbsent(JsonElement value) => value.ValueKind is JsonValueKind.Undefined or JsonValueKind.Null;

    /// <summary>The string value, or null when the element is not a string.</summary>
    public static string? AsString(JsonElement value) => value.ValueKind == JsonValueKind.String ? value.GetString() : null;
}
