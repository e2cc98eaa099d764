using System.Text.Json;

namespace SafetyMirror.Core.Site;

/// <summary>Small helpers for reading a JSON document and naming what was found in messages.</summary>
internal static class JsonText
{
    /// <summary>A JSON value as a message names it: <c>the string "NaN"</c>, <c>an array of 3</c>, <c>250</c>.</summary>
    public static string Describe(JsonElement value) => value.ValueKind switch
    {
        JsonValueKind.String => $"the string \"{AsString(value)}\"",
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

    /// <summary>The string value, or null when the element is not a string or is not valid Unicode text.</summary>
    /// <remarks>The plan reader refuses undecodable text first (<see cref="FindBadText"/>); this keeps every later read safe.</remarks>
    public static string? AsString(JsonElement value) =>
        value.ValueKind == JsonValueKind.String && TryDecode(value, out var text) ? text : null;

    /// <summary>Adds a problem for each string or member name under <paramref name="value"/> that is not valid Unicode or is too long.</summary>
    /// <remarks>
    /// JSON text may hold invalid UTF-8 bytes or an escaped lone surrogate ("\ud800"); decoding either throws, so it
    /// is found here, once, with its path. Stops after <paramref name="maxProblems"/>: one or two show what to fix.
    /// </remarks>
    public static void FindBadText(JsonElement value, string path, int maxLength, List<SitePlanProblem> problems, int maxProblems = 10)
    {
        if (problems.Count >= maxProblems)
        {
            return;
        }

        switch (value.ValueKind)
        {
            case JsonValueKind.String:
                CheckText(TryDecode(value, out var text), text, path, maxLength, problems);
                break;
            case JsonValueKind.Array:
                var index = 0;
                foreach (var item in value.EnumerateArray())
                {
                    FindBadText(item, $"{path}[{index++}]", maxLength, problems, maxProblems);
                }

                break;
            case JsonValueKind.Object:
                foreach (var member in value.EnumerateObject())
                {
                    var (decoded, name) = TryName(member);
                    CheckText(decoded, name, path, maxLength, problems);
                    if (decoded && name!.Length <= maxLength)
                    {
                        FindBadText(member.Value, path.Length == 0 ? name : $"{path}.{name}", maxLength, problems, maxProblems);
                    }
                }

                break;
        }
    }

    private static void CheckText(bool decoded, string? text, string path, int maxLength, List<SitePlanProblem> problems)
    {
        if (!decoded)
        {
            problems.Add(new(path, "Holds text that is not valid Unicode (invalid UTF-8 bytes, or an escaped lone surrogate such as \\ud800); send UTF-8 text."));
        }
        else if (text!.Length > maxLength)
        {
            problems.Add(new(path, $"Holds a text of {text.Length} characters; at most {maxLength} are accepted."));
        }
    }

    private static bool TryDecode(JsonElement value, out string? text)
    {
        try
        {
            text = value.GetString();
            return true;
        }
        catch (InvalidOperationException)
        {
            text = null;
            return false;
        }
    }

    private static (bool Decoded, string? Name) TryName(JsonProperty member)
    {
        try
        {
            return (true, member.Name);
        }
        catch (InvalidOperationException)
        {
            return (false, null);
        }
    }
}
