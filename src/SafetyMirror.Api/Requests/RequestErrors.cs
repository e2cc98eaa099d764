using Microsoft.AspNetCore.Http.HttpResults;

namespace SafetyMirror.Api.Requests;

/// <summary>Collects what is wrong with a request, each problem under the path of the field that holds it.</summary>
/// <remarks>Paths name the JSON the client sent: <c>mirror.radiusM</c>, <c>plan.features[3].properties.heightM</c>.</remarks>
public sealed class RequestErrors
{
    private readonly Dictionary<string, List<string>> errors = [];

    /// <summary>True when nothing is wrong.</summary>
    public bool IsEmpty => errors.Count == 0;

    /// <summary>Records a problem at a path.</summary>
    public void Add(string path, string message)
    {
        if (!errors.TryGetValue(path, out var messages))
        {
            errors[path] = messages = [];
        }

        messages.Add(message);
    }

    /// <summary>The value if given and within [min, max]; the default if absent; otherwise records a problem and returns the default.</summary>
    public double Within(double? value, double min, double max, string unit, string path, double fallback)
    {
        if (value is null)
        {
            return fallback;
        }

        if (!double.IsFinite(value.Value) || value < min || value > max)
        {
            Add(path, $"Must be from {min} to {max} {unit}; it was {value}.");
            return fallback;
        }

        return value.Value;
    }

    /// <summary>The value if given and within [min, max]; records a problem when absent or out of range.</summary>
    public double Required(double? value, double min, double max, string unit, string path)
    {
        if (value is null)
        {
            Add(path, $"Required: a number from {min} to {max} {unit}.");
            return min;
        }

        return Within(value, min, max, unit, path, min);
    }

    /// <summary>A list of 1 to <paramref name="max"/> items, each read under its own path; null when absent or when any item is wrong.</summary>
    public List<T>? List<TRequest, T>(IReadOnlyList<TRequest>? items, int max, string path, string noun, Func<TRequest, string, T?> read)
        where T : class
    {
        if (items is null)
        {
            return null;
        }

        if (items.Count == 0 || items.Count > max)
        {
            Add(path, $"List 1 to {max} {noun}; {items.Count} were given.");
            return null;
        }

        var results = items.Select((item, i) => read(item, $"{path}[{i}]")).ToList();
        return results.All(item => item is not null) ? [.. results.OfType<T>()] : null;
    }

    /// <summary>The 400 answer listing every problem, under a title that says what could not be done.</summary>
    public ValidationProblem ToValidationProblem(string title) => TypedResults.ValidationProblem(
        ToDictionary(),
        title: title,
        detail: "Each entry under 'errors' names the field of the request that holds a problem.");

    /// <summary>The problems as the dictionary RFC 9457 validation problems carry.</summary>
    public Dictionary<string, string[]> ToDictionary() => errors.ToDictionary(e => e.Key, e => e.Value.ToArray());
}
