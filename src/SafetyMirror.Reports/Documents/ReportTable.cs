namespace SafetyMirror.Reports.Documents;

/// <summary>A table of text cells with a header row and relative column widths; cells wrap within their column.</summary>
/// <remarks>Line breaks in a cell are kept, so empty lines make a row taller (room for a signature).</remarks>
public sealed record ReportTable
{
    /// <summary>Creates a table; every row must have as many cells as there are headers.</summary>
    /// <param name="headers">The column headings.</param>
    /// <param name="rows">The body rows.</param>
    /// <param name="columnWeights">Positive relative widths, one per column, or null for equal columns.</param>
    public ReportTable(IReadOnlyList<string> headers, IReadOnlyList<IReadOnlyList<string>> rows, IReadOnlyList<double>? columnWeights = null)
    {
        ArgumentNullException.ThrowIfNull(headers);
        ArgumentNullException.ThrowIfNull(rows);
        if (headers.Count == 0)
        {
            throw new ArgumentException("A table needs at least one column.", nameof(headers));
        }

        for (var i = 0; i < rows.Count; i++)
        {
            if (rows[i] is null || rows[i].Count != headers.Count)
            {
                throw new ArgumentException($"Every row must have {headers.Count} cells, one per header; row {i} does not.", nameof(rows));
            }
        }

        var weights = columnWeights ?? Enumerable.Repeat(1.0, headers.Count).ToList();
        if (weights.Count != headers.Count || !weights.All(w => double.IsFinite(w) && w > 0))
        {
            throw new ArgumentException($"columnWeights must hold {headers.Count} finite numbers greater than 0.", nameof(columnWeights));
        }

        Headers = headers;
        Rows = rows;
        ColumnWeights = weights;
    }

    /// <summary>The column headings.</summary>
    public IReadOnlyList<string> Headers { get; }

    /// <summary>The body rows, each with one cell per column.</summary>
    public IReadOnlyList<IReadOnlyList<string>> Rows { get; }

    /// <summary>The relative column widths.</summary>
    public IReadOnlyList<double> ColumnWeights { get; }

    /// <summary>Each column's share of the table width, summing to 1.</summary>
    internal IEnumerable<double> ColumnFractions => ColumnWeights.Select(w => w / ColumnWeights.Sum());
}
