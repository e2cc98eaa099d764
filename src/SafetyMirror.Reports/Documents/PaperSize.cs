namespace SafetyMirror.Reports.Documents;

/// <summary>The sheet a report is printed on.</summary>
public enum PaperSize
{
    /// <summary>ISO 216 A4, 210 × 297 mm (595 × 842 pt).</summary>
    A4,

    /// <summary>US Letter, 8.5 × 11 in (612 × 792 pt).</summary>
    Letter,
}
