using PdfSharp.Drawing;
using SafetyMirror.Reports.Graphics;

namespace SafetyMirror.Reports.Fonts;

/// <summary>Measures and wraps text in the report typeface; lengths come out in the unit the em size goes in.</summary>
internal static class TextLayout
{
    /// <summary>The advance width of <paramref name="text"/> at the given em size.</summary>
    public static double Width(string text, double emSize, FontWeight weight) =>
        Measure(emSize, weight, measure => measure(text));

    /// <summary>Greedy word wrap into lines no wider than <paramref name="maxWidth"/>; hard line breaks are kept.</summary>
    /// <remarks>
    /// A word wider than a line is broken between characters, measured one character at a time so that a very long
    /// word costs time in proportion to its length. Runs of spaces collapse to one.
    /// </remarks>
    public static IReadOnlyList<string> Wrap(string text, double emSize, FontWeight weight, double maxWidth) =>
        Measure(emSize, weight, measure =>
        {
            var lines = new List<string>();
            foreach (var paragraph in text.ReplaceLineEndings("\n").Split('\n'))
            {
                var line = "";
                foreach (var word in paragraph.Split(' ', StringSplitOptions.RemoveEmptyEntries))
                {
                    var candidate = line.Length == 0 ? word : line + " " + word;
                    if (measure(candidate) <= maxWidth)
                    {
                        line = candidate;
                        continue;
                    }

                    if (line.Length > 0)
                    {
                        lines.Add(line);
                    }

                    var pieces = measure(word) <= maxWidth ? [word] : Break(word, maxWidth, measure);
                    lines.AddRange(pieces.Take(pieces.Count - 1));
                    line = pieces[^1];
                }

                lines.Add(line);
            }

            return (IReadOnlyList<string>)lines;
        });

    // Each piece holds at least one character (a surrogate pair stays whole) and, beyond that, what fits the width.
    private static List<string> Break(string word, double maxWidth, Func<string, double> measure)
    {
        var widths = new Dictionary<string, double>(StringComparer.Ordinal);
        var pieces = new List<string>();
        var (start, width) = (0, 0.0);
        for (var i = 0; i < word.Length; i++)
        {
            var length = char.IsHighSurrogate(word[i]) && i + 1 < word.Length ? 2 : 1;
            var character = word.Substring(i, length);
            if (!widths.TryGetValue(character, out var advance))
            {
                widths[character] = advance = measure(character);
            }

            if (i > start && width + advance > maxWidth)
            {
                pieces.Add(word[start..i]);
                (start, width) = (i, 0.0);
            }

            width += advance;
            i += length - 1;
        }

        pieces.Add(word[start..]);
        return pieces;
    }

    private static T Measure<T>(double emSize, FontWeight weight, Func<Func<string, double>, T> use)
    {
        var font = ReportFonts.Font(emSize, weight);
        using var context = XGraphics.CreateMeasureContext(new XSize(1000, 1000), XGraphicsUnit.Point, XPageDirection.Downwards);
        return use(text => text.Length == 0 ? 0 : context.MeasureString(text, font).Width);
    }
}
