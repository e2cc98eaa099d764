using System.Collections;
using System.ComponentModel.DataAnnotations;
using System.Globalization;
using System.Reflection;
using System.Text;
using System.Text.Json;
using System.Text.Json.Serialization.Metadata;
using NetTopologySuite.Geometries;
using SafetyMirror.Api.Json;

namespace SafetyMirror.Api.Errors;

/// <summary>Says what is wrong with a request body that could not be read, at the path of the member that holds it.</summary>
/// <remarks>
/// Paths are the readers' style (<c>mirror.radiusM</c>, <c>plan.features[3].properties.heightM</c>, <c>body</c> for the
/// whole), not the serializer's <c>$.…</c>; messages name JSON kinds and the contract's ranges, never .NET types.
/// </remarks>
internal static class JsonBodyErrors
{
    /// <summary>The path of the body as a whole.</summary>
    public const string Body = "body";

    /// <summary>The field and message for a body the serializer refused.</summary>
    /// <param name="json">What the serializer threw.</param>
    /// <param name="body">The body's bytes when they were kept, to find where malformed JSON breaks inside a raw member such as the plan.</param>
    /// <param name="requestType">The contract the body was read into, to say what was expected.</param>
    /// <param name="options">The serializer options, for member names.</param>
    public static (string Path, string Message) Explain(JsonException json, byte[]? body, Type? requestType, JsonSerializerOptions options)
    {
        if (body is not null && SyntaxError(body) is { } syntax)
        {
            return syntax;
        }

        var segments = Segments(json.Path).Select(s => s is string name ? Decodable(name) : s).ToList();
        var path = ToRequestPath(segments);
        if (requestType is null)
        {
            return (path, "Not valid here: the value is not of the kind this member takes.");
        }

        var (parent, member, type) = Resolve(requestType, segments, options);
        if (parent is not null && member is null && segments[^1] is string unknown)
        {
            var known = options.GetTypeInfo(parent).Properties.Select(p => p.Name);
            return (path, $"Unknown member \"{unknown}\"; the members here are: {string.Join(", ", known)}.");
        }

        return type is null
            ? (path, "Not valid here: the value is not of the kind this member takes.")
            : (path, $"Must be {Kind(type, segments.Count > 0 && segments[^1] is string ? member : null)}.");
    }

    // A member name may hold a lone surrogate; the answer names it with U+FFFD in its place, so that it can be read.
    private static string Decodable(string text) => Encoding.UTF8.GetString(Encoding.UTF8.GetBytes(text));

    /// <summary>The serializer's <c>$.a.b[2]['c d']</c> as a request path, <c>a.b[2].c d</c>; <c>body</c> for <c>$</c>.</summary>
    public static string ToRequestPath(string? jsonPath) => ToRequestPath(Segments(jsonPath));

    private static string ToRequestPath(List<object> segments)
    {
        var path = new StringBuilder();
        foreach (var segment in segments)
        {
            if (segment is int index)
            {
                path.Append(CultureInfo.InvariantCulture, $"[{index}]");
            }
            else
            {
                path.Append(path.Length == 0 ? "" : ".").Append((string)segment);
            }
        }

        return path.Length == 0 ? Body : path.ToString();
    }

    // Names are strings, indices ints.
    private static List<object> Segments(string? jsonPath)
    {
        var segments = new List<object>();
        var text = jsonPath ?? "$";
        var i = text.StartsWith('$') ? 1 : 0;
        while (i < text.Length)
        {
            if (text[i] == '.')
            {
                var end = text.IndexOfAny(['.', '['], i + 1);
                end = end < 0 ? text.Length : end;
                segments.Add(text[(i + 1)..end]);
                i = end;
            }
            else if (text.AsSpan(i).StartsWith("['"))
            {
                var end = text.IndexOf("']", i + 2, StringComparison.Ordinal);
                end = end < 0 ? text.Length : end;
                segments.Add(text[(i + 2)..end]);
                i = Math.Min(text.Length, end + 2);
            }
            else if (text[i] == '[')
            {
                var end = text.IndexOf(']', i);
                end = end < 0 ? text.Length : end;
                segments.Add(int.TryParse(text.AsSpan(i + 1, end - i - 1), CultureInfo.InvariantCulture, out var index) ? index : text[(i + 1)..end]);
                i = end + 1;
            }
            else
            {
                i++;
            }
        }

        return segments;
    }

    /// <summary>The type expected at the path, the last member named on it and the type that holds that member; a null member under a type means no such member.</summary>
    private static (Type? Parent, JsonPropertyInfo? Member, Type? Type) Resolve(Type type, List<object> segments, JsonSerializerOptions options)
    {
        Type? current = type;
        Type? parent = null;
        JsonPropertyInfo? member = null;
        foreach (var segment in segments)
        {
            if (current is null)
            {
                return (null, null, null);
            }

            if (segment is int)
            {
                current = ElementType(current);
                continue;
            }

            var info = options.GetTypeInfo(current);
            if (info.Kind != JsonTypeInfoKind.Object)
            {
                return (null, null, null);
            }

            parent = current;
            member = info.Properties.FirstOrDefault(p => p.Name == (string)segment);
            if (member is null)
            {
                return (parent, null, null);
            }

            current = member.PropertyType;
        }

        return (parent, member, current);
    }

    private static Type? ElementType(Type type) =>
        type == typeof(string) ? null
        : type.IsArray ? type.GetElementType()
        : type.GetInterfaces().Append(type).FirstOrDefault(i => i.IsGenericType && i.GetGenericTypeDefinition() == typeof(IEnumerable<>))?.GetGenericArguments()[0];

    // The member, when the path ends on it, gives the range its contract states.
    private static string Kind(Type expected, JsonPropertyInfo? member)
    {
        var type = Nullable.GetUnderlyingType(expected) ?? expected;
        var range = member?.AttributeProvider?.GetCustomAttributes(typeof(RangeAttribute), false).OfType<RangeAttribute>().FirstOrDefault();
        var within = range is null ? "" : string.Create(CultureInfo.InvariantCulture, $" from {range.Minimum} to {range.Maximum}");
        return type switch
        {
            _ when type == typeof(double) || type == typeof(float) || type == typeof(decimal) => $"a finite JSON number{within}",
            _ when type == typeof(int) || type == typeof(long) => $"a whole JSON number{within}",
            _ when type == typeof(bool) => "true or false",
            _ when type == typeof(string) => "a JSON string of valid Unicode text (UTF-8, no lone surrogates)",
            _ when type == typeof(JsonElement) => "a JSON object",
            _ when typeof(Geometry).IsAssignableFrom(type) => $"a GeoJSON {type.Name} object",
            _ when typeof(IEnumerable).IsAssignableFrom(type) => $"a JSON array of {Plural(ElementType(type))}",
            _ => "a JSON object",
        };
    }

    private static string Plural(Type? element) =>
        element is null ? "values"
        : (Nullable.GetUnderlyingType(element) ?? element) == typeof(double) ? "numbers"
        : element == typeof(string) ? "strings"
        : "objects";

    /// <summary>Where the body stops being JSON, with the reader's reason; null when it is well-formed.</summary>
    private static (string Path, string Message)? SyntaxError(byte[] body)
    {
        var reader = new Utf8JsonReader(body, new JsonReaderOptions { MaxDepth = ServiceJson.MaxDepth });
        var frames = new List<Frame>();
        try
        {
            while (reader.Read())
            {
                switch (reader.TokenType)
                {
                    case JsonTokenType.PropertyName:
                        frames[^1] = frames[^1] with { Name = reader.GetString(), ValueDone = false };
                        break;
                    case JsonTokenType.StartObject or JsonTokenType.StartArray:
                        StartValue(frames);
                        frames.Add(new Frame(reader.TokenType == JsonTokenType.StartArray, 0, null, false));
                        break;
                    case JsonTokenType.EndObject or JsonTokenType.EndArray:
                        frames.RemoveAt(frames.Count - 1);
                        EndValue(frames);
                        break;
                    default:
                        StartValue(frames);
                        EndValue(frames);
                        break;
                }
            }

            return null;
        }
        catch (Exception e) when (e is JsonException or InvalidOperationException)
        {
            var path = new StringBuilder();
            for (var f = 0; f < frames.Count; f++)
            {
                var frame = frames[f];
                if (frame.IsArray)
                {
                    // The innermost array broke before its next value was counted; an outer one holds its last value begun.
                    path.Append(CultureInfo.InvariantCulture, $"[{(f == frames.Count - 1 ? frame.Count : frame.Count - 1)}]");
                }
                else if (frame.Name is not null && (f < frames.Count - 1 || !frame.ValueDone))
                {
                    path.Append(path.Length == 0 ? "" : ".").Append(frame.Name);
                }
            }

            var at = e is JsonException syntax
                ? $"line {syntax.LineNumber + 1}, byte {syntax.BytePositionInLine + 1}"
                : $"line {LineOf(body, reader.BytesConsumed)}";
            var reason = e is JsonException ? Reason(e.Message) : "A member name is not valid Unicode text (invalid UTF-8 or a lone surrogate).";
            return (path.Length == 0 ? Body : path.ToString(), $"Not valid JSON here ({at}): {reason}");
        }
    }

    // An array counts the values begun in it.
    private static void StartValue(List<Frame> frames)
    {
        if (frames.Count > 0 && frames[^1].IsArray)
        {
            frames[^1] = frames[^1] with { Count = frames[^1].Count + 1 };
        }
    }

    // An object's member holds its value once the value has been read.
    private static void EndValue(List<Frame> frames)
    {
        if (frames.Count > 0 && !frames[^1].IsArray)
        {
            frames[^1] = frames[^1] with { ValueDone = true };
        }
    }

    private static long LineOf(byte[] body, long offset) => 1 + body.AsSpan(0, (int)Math.Min(offset, body.Length)).Count((byte)'\n');

    /// <summary>The reader's message without the "Path: … | LineNumber: …" it appends.</summary>
    public static string Reason(string message)
    {
        var cut = message.IndexOf(" Path:", StringComparison.Ordinal);
        var reason = cut < 0 ? message : message[..cut];
        cut = reason.IndexOf(" LineNumber:", StringComparison.Ordinal);
        return cut < 0 ? reason : reason[..cut];
    }

    private sealed record Frame(bool IsArray, int Count, string? Name, bool ValueDone);
}
