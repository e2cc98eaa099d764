using System.Net;
using System.Text.RegularExpressions;
using SafetyMirror.Core.Design;

namespace SafetyMirror.Reports.Tests;

/// <summary>What a report's reader must never meet: the service's JSON paths, provenance tags and catalogue ids.</summary>
internal static partial class ReaderWords
{
    /// <summary>Fails when the text holds a JSON path of the plan, a provenance tag or a default catalogue id.</summary>
    public static void AssertPlain(string text)
    {
        Assert.DoesNotContain("features[", text, StringComparison.Ordinal);
        Assert.DoesNotContain("[memory", text, StringComparison.Ordinal);
        Assert.DoesNotContain("common practice", text, StringComparison.OrdinalIgnoreCase);
        Assert.All(MirrorTypes.Defaults, type => Assert.DoesNotContain(type.Id, text, StringComparison.Ordinal));
    }

    /// <summary>The text of an HTML page: tags removed, entities decoded.</summary>
    public static string HtmlText(string html) => WebUtility.HtmlDecode(Tag().Replace(html, " "));

    [GeneratedRegex("<[^>]*>")]
    private static partial Regex Tag();
}
