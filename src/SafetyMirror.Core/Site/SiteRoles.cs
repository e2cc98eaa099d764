using System.Collections.Frozen;
using System.Collections.Immutable;

namespace SafetyMirror.Core.Site;

/// <summary>A number a role reads from its feature's properties, with its range and default.</summary>
/// <remarks>
/// <see cref="Meaning"/> says what it is, for messages; <see cref="Default"/> is used when the property is absent or
/// null, and a null default makes the property required.
/// </remarks>
internal sealed record NumberRule(string Name, string Meaning, double Min, double Max, string Unit, double? Default = null);

/// <summary>Numbers of which a feature gives exactly one, such as a speed in km/h or in mph.</summary>
/// <remarks><see cref="Meaning"/> says what any of them is, for messages.</remarks>
internal sealed record NumberChoice(string Meaning, ImmutableArray<NumberRule> Options)
{
    /// <summary>The options' names in a sentence: "speedKmh or speedMph".</summary>
    public string NamesText => string.Join(" or ", Options.Select(o => o.Name));
}

/// <summary>What a feature of one role must look like.</summary>
/// <remarks>
/// <see cref="Name"/> is written in <c>properties.role</c>; <see cref="Noun"/> names it in a sentence. Each of
/// <see cref="Choices"/> is read as one more number, from whichever one of its options the feature gives.
/// </remarks>
internal sealed record RoleRule(string Name, string Noun, ImmutableArray<string> GeometryTypes, ImmutableArray<NumberRule> Numbers)
{
    /// <summary>Numbers of which the feature gives exactly one each.</summary>
    public ImmutableArray<NumberChoice> Choices { get; init; } = [];

    /// <summary>The role's noun starting a sentence: "An obstacle".</summary>
    public string Subject => string.Concat(Noun[..1].ToUpperInvariant(), Noun[1..]);

    /// <summary>The geometry types in a sentence: "Polygon or MultiPolygon".</summary>
    public string GeometryTypesText => GeometryTypes.Length == 1
        ? GeometryTypes[0]
        : $"{string.Join(", ", GeometryTypes[..^1])} or {GeometryTypes[^1]}";
}

/// <summary>The roles a feature can have in a corner plan.</summary>
internal static class SiteRoles
{
    public const string Eye = "eye";
    public const string Approach = "approach";
    public const string Obstacle = "obstacle";
    public const string MountingZone = "mounting-zone";
    public const string Carriageway = "carriageway";
    public const string Footway = "footway";
    public const string StopLine = "stop-line";

    /// <summary>An approach's speed in km/h.</summary>
    public const string SpeedKmh = "speedKmh";

    /// <summary>An approach's speed in mph, instead of km/h.</summary>
    public const string SpeedMph = "speedMph";

    private static readonly ImmutableArray<string> Areas = ["Polygon", "MultiPolygon"];

    /// <summary>Every role, in the order messages list them.</summary>
    public static ImmutableArray<RoleRule> All { get; } =
    [
        new(Eye, "an eye", ["Point"],
            [new("eyeHeightM", "the driver's eye height above the ground", SiteRanges.MinEyeHeightM, SiteRanges.MaxEyeHeightM, "m", SiteRanges.DefaultEyeHeightM)]),
        new(Approach, "an approach", ["LineString"],
            [new("gradePercent", "the grade in the direction of travel", SiteRanges.MinGradePercent, SiteRanges.MaxGradePercent, "%", SiteRanges.DefaultGradePercent)])
        {
            // A US engineer enters mph; the US customary formulas then take it as given, never a round trip through km/h.
            Choices =
            [
                new("the design speed (posted or 85th percentile)",
                [
                    new(SpeedKmh, "the design speed in km/h", SiteRanges.MinSpeedKmh, SiteRanges.MaxSpeedKmh, "km/h"),
                    new(SpeedMph, "the design speed in mph", SiteRanges.MinSpeedMph, SiteRanges.MaxSpeedMph, "mph"),
                ]),
            ],
        },
        new(Obstacle, "an obstacle", Areas,
            [new("heightM", "the height of its top above the ground", SiteRanges.MinObstacleHeightM, SiteRanges.MaxObstacleHeightM, "m")]),
        new(MountingZone, "a mounting zone", ["Point", "LineString", "Polygon"], []),
        new(Carriageway, "a carriageway", Areas, []),
        new(Footway, "a footway", Areas,
            [new("kerbHeightM", "the height of its surface above the carriageway", 0, SiteRanges.MaxKerbHeightM, "m", SiteRanges.DefaultKerbHeightM)]),
        new(StopLine, "a stop line", ["LineString"], []),
    ];

    /// <summary>The roles by name.</summary>
    public static FrozenDictionary<string, RoleRule> ByName { get; } = All.ToFrozenDictionary(rule => rule.Name, StringComparer.Ordinal);

    /// <summary>The role names in a sentence.</summary>
    public static string Names { get; } = string.Join(", ", All.Select(rule => rule.Name));
}
