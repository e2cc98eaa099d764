namespace SafetyMirror.Reports.Plans;

/// <summary>Which side of a line its labels go on, looking along the line from its start.</summary>
public enum LabelSide
{
    /// <summary>The left-hand side.</summary>
    Left,

    /// <summary>The right-hand side.</summary>
    Right,
}
