using SafetyMirror.Reports.Documents;

namespace SafetyMirror.Reports.Tests.Documents;

public sealed class HtmlTextTests
{
    [Theory]
    // The five characters to escape in content and quoted attributes: OWASP XSS Prevention Cheat Sheet, rule 1.
    [InlineData("<script>alert(1)</script>", "&lt;script&gt;alert(1)&lt;/script&gt;")]
    [InlineData("Elm & Quince", "Elm &amp; Quince")]
    [InlineData("\"quoted\"", "&quot;quoted&quot;")]
    [InlineData("it's", "it&#39;s")]
    [InlineData("12′ at 35 m", "12′ at 35 m")]
    public void Escape_Text_EscapesMarkupCharacters(string text, string expected)
    {
        Assert.Equal(expected, HtmlText.Escape(text));
    }

    [Fact]
    public void Escape_Null_IsEmpty()
    {
        Assert.Equal("", HtmlText.Escape(null));
    }

    [Fact]
    public void Escape_ControlCharacter_IsDropped()
    {
        Assert.Equal("ab", HtmlText.Escape("a\u0007b"));
    }
}
