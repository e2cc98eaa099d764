using System.Diagnostics.CodeAnalysis;
using System.Text.Json;
using NetTopologySuite.Geometries;
using NetTopologySuite.IO.Converters;
using static System.FormattableString;

namespace SafetyMirror.Core.Site;

/// <summary>One feature as read from the plan, still in the plan's own coordinates.</summary>
/// <remarks>
/// <see cref="PlanGeometry"/> is null when the geometry had problems; <see cref="Numbers"/> (the role's numeric
/// properties by name, defaults filled in) is null when any of them had problems.
/// </remarks>
internal sealed record FeatureDraft(RoleRule Role, FeatureReference Feature, Geometry? PlanGeometry, IReadOnlyDictionary<string, double>? Numbers)
{
    /// <summary>True when the feature was read without problems.</summary>
    [MemberNotNullWhen(true, nameof(PlanGeometry), nameof(Numbers))]
    public bool IsComplete => PlanGeometry is not null && Numbers is not null;
}

/// <summary>Reads the features of a plan one by one, adding a problem for everything wrong with each.</summary>
internal sealed class FeatureReader(PlanCoordinateSystem? system, List<SitePlanProblem> problems)
{
    private static readonly JsonSerializerOptions GeoJson = new() { Converters = { new GeoJsonConverterFactory(SiteGeometry.Factory) } };

    /// <summary>The feature, or null when it is not a feature object or its role is missing or unknown.</summary>
    public FeatureDraft? Read(JsonElement feature, int index)
    {
        var path = $"features[{index}]";
        if (feature.ValueKind != JsonValueKind.Object)
        {
            problems.Add(new(path, $"Each feature must be a GeoJSON Feature object (RFC 7946 §3.2); it is {JsonText.Describe(feature)}."));
            return null;
        }

        var type = JsonText.Member(feature, "type");
        if (JsonText.AsString(type) != "Feature")
        {
            problems.Add(new($"{path}.type", $"A feature's type must be \"Feature\" (RFC 7946 §3.2); it is {JsonText.Describe(type)}."));
        }

        var properties = JsonText.Member(feature, "properties");
        if (!JsonText.IsAbsent(properties) && properties.ValueKind != JsonValueKind.Object)
        {
            problems.Add(new($"{path}.properties", $"properties must be an object holding the feature's role; it is {JsonText.Describe(properties)}."));
            return null;
        }

        var reference = new FeatureReference(index, ReadId(feature, path), ReadName(properties, path));
        if (ReadRole(properties, path) is not { } role)
        {
            return null;
        }

        var numbers = ReadNumbers(role, properties, path, reference);
        var geometry = ReadGeometry(role, JsonText.Member(feature, "geometry"), $"{path}.geometry");
        return new FeatureDraft(role, reference, geometry, numbers);
    }

    private string? ReadId(JsonElement feature, string path)
    {
        var id = JsonText.Member(feature, "id");
        switch (id.ValueKind)
        {
            case JsonValueKind.String:
                return JsonText.AsString(id);
            case JsonValueKind.Number:
                return id.GetRawText();
            case JsonValueKind.Undefined or JsonValueKind.Null:
                return null;
            default:
                problems.Add(new($"{path}.id", $"A feature id must be a string or a number (RFC 7946 §3.2); it is {JsonText.Describe(id)}."));
                return null;
        }
    }

    private string? ReadName(JsonElement properties, string path)
    {
        var name = JsonText.Member(properties, "name");
        if (JsonText.IsAbsent(name) || name.ValueKind == JsonValueKind.String)
        {
            return JsonText.AsString(name);
        }

        problems.Add(new($"{path}.properties.name", $"name must be a string; it is {JsonText.Describe(name)}."));
        return null;
    }

    private RoleRule? ReadRole(JsonElement properties, string path)
    {
        var role = JsonText.Member(properties, "role");
        var at = $"{path}.properties.role";
        if (JsonText.IsAbsent(role))
        {
            problems.Add(new(at, $"Missing role: say what the feature is in properties.role, one of {SiteRoles.Names}."));
            return null;
        }

        if (JsonText.AsString(role) is { } name)
        {
            if (SiteRoles.ByName.TryGetValue(name, out var rule))
            {
                return rule;
            }

            problems.Add(new(at, $"Unknown role \"{name}\"; the known roles are {SiteRoles.Names}."));
            return null;
        }

        problems.Add(new(at, $"The role must be a string, one of {SiteRoles.Names}; it is {JsonText.Describe(role)}."));
        return null;
    }

    private Dictionary<string, double>? ReadNumbers(RoleRule role, JsonElement properties, string path, FeatureReference feature)
    {
        var numbers = new Dictionary<string, double>(StringComparer.Ordinal);
        foreach (var rule in role.Numbers)
        {
            if (ReadNumber(role, rule, JsonText.Member(properties, rule.Name), $"{path}.properties.{rule.Name}") is { } value)
            {
                numbers[rule.Name] = value;
            }
        }

        foreach (var choice in role.Choices)
        {
            if (ReadChoice(role, choice, properties, path, feature) is { } chosen)
            {
                numbers[chosen.Name] = chosen.Value;
            }
        }

        return numbers.Count == role.Numbers.Length + role.Choices.Length ? numbers : null;
    }

    // Exactly one option: with none the feature says nothing, with two it might say two different things.
    private (string Name, double Value)? ReadChoice(RoleRule role, NumberChoice choice, JsonElement properties, string path, FeatureReference feature)
    {
        var given = choice.Options.Where(option => !JsonText.IsAbsent(JsonText.Member(properties, option.Name))).ToList();
        if (given is [var rule])
        {
            return ReadNumber(role, rule, JsonText.Member(properties, rule.Name), $"{path}.properties.{rule.Name}") is { } value ? (rule.Name, value) : null;
        }

        var ranges = string.Join(" or ", choice.Options.Select(o => Invariant($"from {o.Min} to {o.Max} {o.Unit}")));
        problems.Add(given.Count == 0
            ? new($"{path}.properties.{choice.Options[0].Name}", $"{role.Subject} needs {choice.NamesText}: {choice.Meaning}, {ranges}; {feature} gives neither.")
            : new($"{path}.properties.{given[^1].Name}", $"{role.Subject} takes {choice.NamesText}, not both; {feature} gives both."));
        return null;
    }

    private double? ReadNumber(RoleRule role, NumberRule rule, JsonElement value, string path)
    {
        var range = Invariant($"from {rule.Min} to {rule.Max} {rule.Unit}");
        string problem;
        if (JsonText.IsAbsent(value))
        {
            if (rule.Default is { } fallback)
            {
                return fallback;
            }

            problem = $"{role.Subject} needs {rule.Name}: {rule.Meaning}, {range}.";
        }
        else if (value.ValueKind != JsonValueKind.Number)
        {
            problem = $"{rule.Name} must be a number {range}; it is {JsonText.Describe(value)}.";
        }
        else if (!value.TryGetDouble(out var number) || !double.IsFinite(number))
        {
            problem = $"{rule.Name} must be a number {range}; {value.GetRawText()} is too large.";
        }
        else if (number < rule.Min || number > rule.Max)
        {
            problem = Invariant($"{rule.Name} must be {range}; it is {number}.");
        }
        else
        {
            return number;
        }

        problems.Add(new(path, problem));
        return null;
    }

    private Geometry? ReadGeometry(RoleRule role, JsonElement geometry, string path)
    {
        if (geometry.ValueKind != JsonValueKind.Object)
        {
            problems.Add(new(path, $"{role.Subject} needs a geometry, a {role.GeometryTypesText}; it is {JsonText.Describe(geometry)}."));
            return null;
        }

        var type = JsonText.Member(geometry, "type");
        if (JsonText.AsString(type) is not { } typeName || !role.GeometryTypes.Contains(typeName))
        {
            problems.Add(new($"{path}.type", $"{role.Subject} must be a {role.GeometryTypesText}; this one is {(JsonText.AsString(type) is { } other ? $"a {other}" : JsonText.Describe(type))}."));
            return null;
        }

        if (!new CoordinateChecker(system, problems).Check(JsonText.Member(geometry, "coordinates"), typeName, $"{path}.coordinates"))
        {
            return null;
        }

        try
        {
            return geometry.Deserialize<Geometry>(GeoJson);
        }
        catch (JsonException e)
        {
            // The coordinates were checked; this is some other member of the geometry the GeoJSON reader refused.
            problems.Add(new(path, $"The geometry could not be read as GeoJSON: {e.Message}"));
            return null;
        }
    }
}
