using System.Globalization;
using SafetyMirror.Core.Design;
using SafetyMirror.Core.View;
using SafetyMirror.Reports.Fonts;
using SkiaSharp;

namespace SafetyMirror.Reports.Views;

/// <summary>Encodes a picture of the driver's view as PNG, with a caption band stating its scale and the mirror's cautions.</summary>
/// <remarks>
/// SkiaSharp with its dependency-free native assets: no fontconfig, so the caption's typeface is the report's embedded DejaVu
/// Sans. The band lies over the top of the picture (sky, above the backing board when the view is framed by default, leaving the
/// pole in sight below it), so the PNG keeps the size asked for and every pixel below the band keeps the picture's angular scale.
/// The one encoder of these pictures: the API answers with it and the report embeds its output.
/// </remarks>
public static class ViewPng
{
    /// <summary>Narrower pictures get no caption: its text could not be read there; the response headers still state the scale.</summary>
    public const int MinCaptionWidthPx = 240;

    private static readonly Lazy<SKTypeface> Typeface = new(() =>
    {
        const string Resource = "SafetyMirror.Reports.Fonts.DejaVuSans.ttf";
        using var stream = typeof(ReportFonts).Assembly.GetManifestResourceStream(Resource)
            ?? throw new InvalidOperationException($"The caption's typeface {Resource} is not embedded in the report assembly.");
        return SKTypeface.FromStream(stream) ?? throw new InvalidOperationException($"SkiaSharp could not read the typeface {Resource}.");
    });

    /// <summary>The picture as PNG bytes, with the caption band unless <paramref name="withCaption"/> is false (for a page that
    /// prints the caption beside it).</summary>
    public static byte[] Encode(ViewPicture picture, bool withCaption = true)
    {
        ArgumentNullException.ThrowIfNull(picture);
        var info = new SKImageInfo(picture.WidthPx, picture.HeightPx, SKColorType.Rgba8888, SKAlphaType.Opaque);
        using var bitmap = new SKBitmap(info);
        var rgba = new byte[info.BytesSize];
        var rgb = picture.Rgb.Span;
        for (int from = 0, to = 0; from < rgb.Length; from += 3, to += 4)
        {
            (rgba[to], rgba[to + 1], rgba[to + 2], rgba[to + 3]) = (rgb[from], rgb[from + 1], rgb[from + 2], 255);
        }

        System.Runtime.InteropServices.Marshal.Copy(rgba, 0, bitmap.GetPixels(), rgba.Length);
        if (withCaption && picture.WidthPx >= MinCaptionWidthPx)
        {
            using var canvas = new SKCanvas(bitmap);
            DrawCaption(canvas, picture);
        }

        using var image = SKImage.FromBitmap(bitmap);
        using var png = image.Encode(SKEncodedImageFormat.Png, 100);
        return png.ToArray();
    }

    /// <summary>The caption's lines: what the picture is and its scale, then the cautions a mirror picture must never be without.</summary>
    public static IEnumerable<string> CaptionOf(ViewPicture picture)
    {
        ArgumentNullException.ThrowIfNull(picture);
        yield return $"The mirror as the waiting driver sees it: {Scale(picture)}. Red: the design road user at the required distance.";
        foreach (var caution in MirrorCautions)
        {
            yield return caution;
        }
    }

    /// <summary>The picture's angular scale in words: "12.3° across, 1.54′ a pixel".</summary>
    public static string Scale(ViewPicture picture)
    {
        ArgumentNullException.ThrowIfNull(picture);
        return string.Create(CultureInfo.InvariantCulture, $"{picture.FieldOfViewDeg:0.##}° across, {picture.ArcminPerPixel:0.###}′ a pixel");
    }

    /// <summary>The cautions no picture of a mirror goes without: vehicles look smaller, farther and slower; left and right are
    /// reversed; decision support, not approval.</summary>
    public static IReadOnlyList<string> MirrorCautions { get; } = CautionTexts("looks-smaller-farther-slower", "left-right-reversed", "not-an-approval");

    private static string[] CautionTexts(params string[] codes)
    {
        var cautions = Cautions.For(SitingRules.Default, []).ToDictionary(c => c.Code, c => c.Text);
        return [.. codes.Select(code => cautions[code])];
    }

    private static void DrawCaption(SKCanvas canvas, ViewPicture picture)
    {
        var width = picture.WidthPx;
        var size = Math.Clamp(width / 55f, 8f, 13f);
        using var font = new SKFont(Typeface.Value, size);
        var margin = size * 0.6f;
        var lines = CaptionOf(picture).SelectMany(text => Wrap(text, font, width - (2 * margin))).ToList();
        var lineHeight = size * 1.25f;
        using var band = new SKPaint { Color = new SKColor(255, 255, 255, 215) };
        canvas.DrawRect(0, 0, width, (lines.Count * lineHeight) + (2 * margin), band);
        using var ink = new SKPaint { Color = new SKColor(20, 20, 20), IsAntialias = true };
        for (var i = 0; i < lines.Count; i++)
        {
            canvas.DrawText(lines[i], margin, margin + ((i + 0.8f) * lineHeight), SKTextAlign.Left, font, ink);
        }
    }

    /// <summary>The text broken at spaces into lines no wider than the width.</summary>
    private static IEnumerable<string> Wrap(string text, SKFont font, float widthPx)
    {
        var line = string.Empty;
        foreach (var word in text.Split(' '))
        {
            var longer = line.Length == 0 ? word : $"{line} {word}";
            if (line.Length > 0 && font.MeasureText(longer) > widthPx)
            {
                yield return line;
                longer = word;
            }

            line = longer;
        }

        yield return line;
    }
}
