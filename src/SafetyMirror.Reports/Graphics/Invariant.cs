using System.Globalization;
using System.Text;
using System.Xml;

namespace SafetyMirror.Reports.Graphics;

/// <summary>Culture-free number formatting and text clean-up shared by the SVG and HTML writers.</summary>
internal static class Invariant
{
    /// <summary>A number with at most three decimals, a point as separator and no grouping.</summary>
    public static string Number(double value) => value.ToString("0.###", CultureInfo.InvariantCulture);

    /// <summary>The text without the characters XML cannot carry (most C0 controls, lone surrogates, U+FFFE/U+FFFF).</summary>
    /// <remarks>Such characters are invisible in print, and dropping them keeps the SVG and the page well-formed.</remarks>
    public static string XmlSafe(string text)
    {
        if (text.All(XmlConvert.IsXmlChar))
        {
            return text;
        }

        var clean = new StringBuilder(text.Length);
        for (var i = 0; i < text.Length; i++)
        {
            if (XmlConvert.IsXmlChar(text[i]))
            {
                clean.Append(text[i]);
            }
            else if (i + 1 < text.Length && XmlConvert.IsXmlSurrogatePair(text[i + 1], text[i]))
            {
                clean.Append(text[i]).Append(text[i + 1]);
                i++;
            }
        }

        return clean.ToString();
    }
}
