using PdfSharp.Drawing;
using PdfSharp.Fonts;
using PdfSharp.Pdf;
using SafetyMirror.Reports.Graphics;

namespace SafetyMirror.Reports.Fonts;

/// <summary>The report's one typeface, DejaVu Sans, shipped inside this assembly and served to PDFsharp.</summary>
/// <remarks>
/// PDFsharp finds fonts through a process-wide resolver, so this is the one place that sets it. The licence of the
/// font files is Fonts/LICENSE-DejaVu.txt beside them in the source tree.
/// </remarks>
public static class ReportFonts
{
    /// <summary>The family name the report's text uses.</summary>
    public const string Family = "DejaVu Sans";

    private static readonly Lock Gate = new();

    /// <summary>Installs the embedded-font resolver as PDFsharp's font resolver; later calls do nothing.</summary>
    /// <remarks>Safe to call from several threads. Every PDF entry point of this library calls it first.</remarks>
    /// <exception cref="InvalidOperationException">Another font resolver was installed first.</exception>
    public static void Register()
    {
        lock (Gate)
        {
            switch (GlobalFontSettings.FontResolver)
            {
                case EmbeddedFontResolver:
                    return;
                case null:
                    GlobalFontSettings.FontResolver = new EmbeddedFontResolver();
                    return;
                case var other:
                    throw new InvalidOperationException(
                        $"PDFsharp already has the font resolver {other.GetType().FullName}; the report needs its own embedded DejaVu Sans resolver.");
            }
        }
    }

    /// <summary>The report face at an em size (in the caller's units), Unicode-encoded so every glyph can be copied out of the PDF.</summary>
    internal static XFont Font(double emSize, FontWeight weight)
    {
        Register();
        return new XFont(Family, emSize, weight == FontWeight.Bold ? XFontStyleEx.Bold : XFontStyleEx.Regular, new XPdfFontOptions(PdfFontEncoding.Unicode));
    }
}
