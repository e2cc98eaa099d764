using PdfSharp.Fonts;

namespace SafetyMirror.Reports.Fonts;

/// <summary>Serves DejaVu Sans regular and bold from the assembly's resources for every family name asked for.</summary>
/// <remarks>
/// Every family maps to DejaVu Sans, so no request ever falls through to a machine font. Italic is slanted by
/// PDFsharp (the italic faces are not shipped).
/// </remarks>
internal sealed class EmbeddedFontResolver : IFontResolver
{
    private const string Regular = "DejaVuSans";
    private const string Bold = "DejaVuSans-Bold";

    private readonly Lazy<byte[]> regular = new(() => Load(Regular));
    private readonly Lazy<byte[]> bold = new(() => Load(Bold));

    public FontResolverInfo ResolveTypeface(string familyName, bool isBold, bool isItalic) =>
        new(isBold ? Bold : Regular, mustSimulateBold: false, mustSimulateItalic: isItalic);

    public byte[]? GetFont(string faceName) => faceName switch
    {
        Regular => regular.Value,
        Bold => bold.Value,
        _ => null,
    };

    private static byte[] Load(string face)
    {
        var name = $"SafetyMirror.Reports.Fonts.{face}.ttf";
        using var stream = typeof(EmbeddedFontResolver).Assembly.GetManifestResourceStream(name)
            ?? throw new InvalidOperationException($"The font resource {name} is missing from the assembly.");
        using var bytes = new MemoryStream();
        stream.CopyTo(bytes);
        return bytes.ToArray();
    }
}
