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
    /// <remarks>A word wider than a line is broken between characters. Runs of spaces collapse to one.</remarks>
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

                    line = word;
                    while (line.Length > 1 && measure(line) > maxWidth)
                    {
                        var fit = FittingPrefix(line, maxWidth, measure);
                        lines.Add(line[..fit]);
                        line = line[fit..];
                    }
                }

                lines.Add(line);
            }

            return (IReadOnlyList<string>)lines;
        });

    private static int FittingPrefix(string word, double maxWidth, Func<string, double> measure)
    {
        var fit = 1;
        while (fit < word.Length && measure(word[..(fit + 1)]) <= maxWidth)
        {
            fit++;
        }

        return fit;
    }

    private static T Measure<T>(double emSize, FontWeight weight, Func<Func<string, double>, T> use)
    {
        var font = ReportFonts.Font(emSize, weight);
        using var context = XGraphics.CreateMeasureContext(new XSize(1000, 1000), XGraphicsUnit.Point, XPageDirection.Downwards);
        return use(text => text.Length == 0 ? 0 : context.MeasureString(text, font).Width);
    }
}
