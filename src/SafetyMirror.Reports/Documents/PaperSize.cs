namespace SafetyMirror.Reports.Documents;

/// <summary>The sheet a report is printed on, named in portrait; <see cref="PageOrientation"/> turns it.</summary>
public enum PaperSize
{
    /// <summary>ISO 216 A4, 210 × 297 mm (595 × 842 pt).</summary>
    A4,

    /// <summary>US Letter, 8.5 × 11 in (612 × 792 pt).</summary>
    Letter,

    /// <summary>ISO 216 A3, 297 × 420 mm (842 × 1191 pt).</summary>
    A3,

    /// <summary>US Tabloid (ANSI B), 11 × 17 in (792 × 1224 pt); turned to landscape it is the sheet called Ledger.</summary>
    Tabloid,
}

/// <summary>Which way up a page is.</summary>
public enum PageOrientation
{
    /// <summary>Taller than wide.</summary>
    Portrait,

    /// <summary>Wider than tall.</summary>
    Landscape,
}

/// <summary>The paper a report is laid out on: the sheet, and whether the site plan's pages are turned to landscape.</summary>
/// <param name="Paper">The sheet.</param>
/// <param name="PlanPagesLandscape">Whether the site plan's pages are landscape, which gives the plan more width at the same round scale rules.</param>
public readonly record struct ReportLayout(PaperSize Paper, bool PlanPagesLandscape = false)
{
    /// <summary>The orientation of the site plan's pages.</summary>
    public PageOrientation PlanPages => PlanPagesLandscape ? PageOrientation.Landscape : PageOrientation.Portrait;
}

/// <summary>Sizes of the sheets and the margins every page of a report keeps.</summary>
public static class Sheets
{
    /// <summary>Left, right and top margin.</summary>
    public const double MarginMm = 20;

    /// <summary>Bottom margin, with the footer in it.</summary>
    public const double BottomMarginMm = 22;

    private const double MmPerPoint = 25.4 / 72;

    /// <summary>The sheet's size in points, whole points as PDF writers round the ISO sizes (1 pt = 1/72 in).</summary>
    public static (double WidthPt, double HeightPt) Points(PaperSize paper, PageOrientation orientation = PageOrientation.Portrait)
    {
        var (width, height) = paper switch
        {
            PaperSize.A4 => (595.0, 842.0),
            PaperSize.Letter => (612.0, 792.0),
            PaperSize.A3 => (842.0, 1191.0),
            PaperSize.Tabloid => (792.0, 1224.0),
            _ => throw new ArgumentOutOfRangeException(nameof(paper), paper, "Unknown paper size."),
        };
        return orientation == PageOrientation.Landscape ? (height, width) : (width, height);
    }

    /// <summary>The area inside the margins, in millimetres.</summary>
    public static (double WidthMm, double HeightMm) ContentMm(PaperSize paper, PageOrientation orientation)
    {
        var (width, height) = Points(paper, orientation);
        return (width * MmPerPoint - 2 * MarginMm, height * MmPerPoint - MarginMm - BottomMarginMm);
    }

    /// <summary>The sheet as a CSS <c>@page</c> size, turned as asked.</summary>
    public static string Css(PaperSize paper, PageOrientation orientation)
    {
        var name = paper switch
        {
            PaperSize.A4 => "A4",
            PaperSize.Letter => "letter",
            PaperSize.A3 => "A3",
            // CSS names 11 × 17 in "ledger"; the length pair says the same without the naming ambiguity.
            PaperSize.Tabloid => "11in 17in",
            _ => throw new ArgumentOutOfRangeException(nameof(paper), paper, "Unknown paper size."),
        };
        return orientation == PageOrientation.Landscape ? $"{name} landscape" : name;
    }
}
