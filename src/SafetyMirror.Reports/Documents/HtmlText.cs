using System.Net;
using SafetyMirror.Reports.Graphics;

namespace SafetyMirror.Reports.Documents;

/// <summary>Escaping of caller text for HTML.</summary>
public static class HtmlText
{
    /// <summary>The text with &amp;, &lt;, &gt;, " and ' escaped, safe both as element content and inside a quoted attribute.</summary>
    /// <remarks>Characters that XML cannot carry (most C0 controls) are dropped, so the page also parses as XHTML.</remarks>
    public static string Escape(string? text) => WebUtility.HtmlEncode(Invariant.XmlSafe(text ?? ""));
}
