using System.Globalization;
using System.Text.Json;
using System.Text.RegularExpressions;

namespace SafetyMirror.Core.Site;

/// <summary>Reads a plan's optional top-level <c>timeZone</c>: an IANA time zone name or a fixed offset from UTC.</summary>
/// <remarks>
/// <c>"Europe/Berlin"</c> follows that zone's daylight saving rules (from the machine's time zone database);
/// <c>"+01:00"</c> or <c>"UTC-05:30"</c> is a fixed offset all year, from −14:00 to +14:00. Results that give clock times
/// (the sun's glare) state them in this zone.
/// </remarks>
public static partial class PlanTimeZone
{
    /// <summary>The plan member's name.</summary>
    public const string MemberName = "timeZone";

    private static readonly TimeSpan LargestOffset = TimeSpan.FromHours(14);

    /// <summary>The time zone a text names, or null when it names none.</summary>
    public static TimeZoneInfo? Parse(string text)
    {
        var offset = FixedOffset().Match(text);
        if (offset.Success)
        {
            var (hours, minutes) = (int.Parse(offset.Groups["h"].ValueSpan, CultureInfo.InvariantCulture), int.Parse(offset.Groups["m"].ValueSpan, CultureInfo.InvariantCulture));
            var span = new TimeSpan(hours, minutes, 0);
            var signed = offset.Groups["sign"].Value == "-" ? -span : span;
            return minutes < 60 && span <= LargestOffset
                ? TimeZoneInfo.CreateCustomTimeZone(text, signed, text, text)
                : null;
        }

        try
        {
            return TimeZoneInfo.FindSystemTimeZoneById(text);
        }
        catch (Exception e) when (e is TimeZoneNotFoundException or InvalidTimeZoneException)
        {
            return null;
        }
    }

    /// <summary>The plan's time zone, null when it gives none; a problem naming the member when it cannot be read.</summary>
    internal static TimeZoneInfo? Read(JsonElement featureCollection, List<SitePlanProblem> problems)
    {
        var member = JsonText.Member(featureCollection, MemberName);
        if (JsonText.IsAbsent(member))
        {
            return null;
        }

        var text = JsonText.AsString(member);
        var zone = string.IsNullOrWhiteSpace(text) ? null : Parse(text);
        if (zone is null)
        {
            problems.Add(new(MemberName,
                $"The time zone must be an IANA time zone name such as \"Europe/Berlin\" or a fixed offset from UTC such as \"+01:00\" (−14:00 to +14:00); it is {JsonText.Describe(member)}."));
        }

        return zone;
    }

    [GeneratedRegex(@"^(UTC)?(?<sign>[+-])(?<h>[0-9]{2}):(?<m>[0-9]{2})$", RegexOptions.CultureInvariant)]
    private static partial Regex FixedOffset();
}
