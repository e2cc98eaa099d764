using System.Diagnostics;
using System.Globalization;
using System.Text.RegularExpressions;
using System.Xml.Linq;

namespace SafetyMirror.Reports.Tests;

/// <summary>Runs poppler's command-line tools on a PDF written to a private temporary folder: an independent reader of our output.</summary>
internal sealed partial class Poppler : IDisposable
{
    private readonly string folder = Directory.CreateTempSubdirectory("safetymirror-reports-").FullName;

    /// <summary>Writes the bytes to a file and returns its path.</summary>
    public string Write(byte[] pdf, string name = "report.pdf")
    {
        var path = Path.Combine(folder, name);
        File.WriteAllBytes(path, pdf);
        return path;
    }

    /// <summary>The output of pdfinfo.</summary>
    public static string Info(string pdf) => Run("pdfinfo", pdf);

    /// <summary>Every page's size in points, in page order, from pdfinfo -f 1 -l (page count).</summary>
    public static IReadOnlyList<(double WidthPt, double HeightPt)> PageSizes(string pdf)
    {
        var pages = int.Parse(PagesLine().Match(Info(pdf)).Groups[1].Value, CultureInfo.InvariantCulture);
        return PageSizeLine().Matches(Run("pdfinfo", "-f", "1", "-l", $"{pages}", pdf))
            .Select(m => (double.Parse(m.Groups[1].Value, CultureInfo.InvariantCulture), double.Parse(m.Groups[2].Value, CultureInfo.InvariantCulture)))
            .ToList();
    }

    /// <summary>The output of pdffonts.</summary>
    public static string Fonts(string pdf) => Run("pdffonts", pdf);

    /// <summary>The text of the whole document, or of one page (1-based).</summary>
    public static string Text(string pdf, int? page = null) =>
        page is { } p ? Run("pdftotext", "-f", $"{p}", "-l", $"{p}", "-layout", pdf, "-") : Run("pdftotext", "-layout", pdf, "-");

    /// <summary>The text in reading order with every run of white space (line breaks included) made one space, to find phrases that wrap.</summary>
    public static string Flow(string pdf) => string.Join(' ', Run("pdftotext", pdf, "-").Split((char[])[' ', '\n', '\r', '\t', '\f'], StringSplitOptions.RemoveEmptyEntries));

    /// <summary>Every word with its bounding box in points (origin top-left), from pdftotext -bbox.</summary>
    public static IReadOnlyList<Word> Words(string pdf, int page = 1)
    {
        var xhtml = XDocument.Parse(Run("pdftotext", "-f", $"{page}", "-l", $"{page}", "-bbox", pdf, "-"));
        return xhtml.Descendants().Where(e => e.Name.LocalName == "word")
            .Select(e => new Word(
                e.Value,
                Number(e, "xMin"), Number(e, "yMin"), Number(e, "xMax"), Number(e, "yMax")))
            .ToList();
    }

    /// <summary>The names of the image objects on the pages (pdfimages -list, header lines removed).</summary>
    public static IReadOnlyList<string> Images(string pdf) =>
        Run("pdfimages", "-list", pdf).Split('\n', StringSplitOptions.RemoveEmptyEntries).Skip(2).ToList();

    public void Dispose() => Directory.Delete(folder, recursive: true);

    [GeneratedRegex(@"^Pages:\s+(\d+)", RegexOptions.Multiline)]
    private static partial Regex PagesLine();

    [GeneratedRegex(@"^Page\s+\d+ size:\s+([\d.]+) x ([\d.]+) pts", RegexOptions.Multiline)]
    private static partial Regex PageSizeLine();

    private static double Number(XElement e, string name) => double.Parse(e.Attribute(name)!.Value, CultureInfo.InvariantCulture);

    private static string Run(string tool, params string[] arguments)
    {
        var start = new ProcessStartInfo(tool) { RedirectStandardOutput = true, RedirectStandardError = true };
        foreach (var argument in arguments)
        {
            start.ArgumentList.Add(argument);
        }

        Process process;
        try
        {
            process = Process.Start(start)!;
        }
        catch (System.ComponentModel.Win32Exception e)
        {
            throw new InvalidOperationException($"{tool} is missing: install poppler-utils (apt-get install -y poppler-utils).", e);
        }

        using (process)
        {
            var output = process.StandardOutput.ReadToEndAsync();
            var error = process.StandardError.ReadToEnd();
            process.WaitForExit();
            Assert.True(process.ExitCode == 0, $"{tool} failed ({process.ExitCode}): {error}");
            return output.Result;
        }
    }
}

/// <summary>A word found by pdftotext and its box in points, y down from the top of the page.</summary>
internal sealed record Word(string Text, double XMin, double YMin, double XMax, double YMax);
