using System.Text.RegularExpressions;

namespace SafetyMirror.Reports.Justification;

/// <summary>
/// Rewrites the service's internal provenance tags ("[memory]", "[memory, common practice]", "common practice") as plain words
/// for the report's reader, who must know which values to check and against what; the API answers keep the tags.
/// </summary>
internal static partial class Provenance
{
    private const string TradePractice = "usual trade practice, not a published standard";

    /// <summary>The source text with every provenance tag worded for a reader.</summary>
    public static string Plain(string source) => string.Join("; ", source.Split("; ").Select(PlainPart));

    /// <summary>The source of a catalogued mirror's size and radius, with the check the reader must make.</summary>
    public static string Catalogue(string source) => $"{Plain(source)}; check size and radius against the supplier's data sheet";

    private static string PlainPart(string part)
    {
        if (TradeMemoryTag().IsMatch(part))
        {
            return Join(TradeMemoryTag().Replace(part, ""), TradePractice);
        }

        if (MemoryTag().IsMatch(part))
        {
            var bare = MemoryTag().Replace(part, "");
            var recalled = Edition().Match(bare) is { Success: true } year
                ? $"value recalled from the {year.Value} edition; check against the current edition"
                : "value recalled, not read from a published copy; check against a current source";
            return Join(bare, recalled);
        }

        return TradeTag().IsMatch(part) ? TradeTag().Replace(part, $"{TradePractice}; confirm against local rules") : part;
    }

    // "adult height 1.7 m: " + "usual trade practice ..." reads as one sentence; "paired radius" + " (…)" as a remark on it.
    private static string Join(string text, string remark)
    {
        var trimmed = text.Trim().TrimEnd(':', ',').Replace(" (our pairing)", ", as this service pairs them", StringComparison.Ordinal);
        return trimmed.Length == 0 ? remark : $"{trimmed} ({remark})";
    }

    [GeneratedRegex(@":?\s*(\[memory, common practice\]|common practice \[memory\])")]
    private static partial Regex TradeMemoryTag();

    [GeneratedRegex(@"\s*\[memory\]")]
    private static partial Regex MemoryTag();

    [GeneratedRegex(@"\(?\bcommon practice\b\)?", RegexOptions.IgnoreCase)]
    private static partial Regex TradeTag();

    [GeneratedRegex(@"\b(19|20)\d{2}\b")]
    private static partial Regex Edition();
}
