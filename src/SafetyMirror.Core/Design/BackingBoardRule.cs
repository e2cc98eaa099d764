namespace SafetyMirror.Core.Design;

/// <summary>A backing board a rule set asks behind the mirror's face: its size against the face, its pattern, and where the rule comes from.</summary>
/// <param name="SideOverDiameter">Side of the square board over the face's diameter.</param>
/// <param name="Pattern">The board's face, in words.</param>
/// <param name="Source">Where the rule comes from.</param>
public sealed record BackingBoardRule(double SideOverDiameter, string Pattern, string Source)
{
    /// <summary>France, IISR Art. 14: a square board 1.5 × the diameter with 5 cm black and white stripes (domain brief §6).</summary>
    public static BackingBoardRule FranceIisr { get; } = new(1.5, "5 cm black and white stripes", "France, IISR Art. 14 (amended 1981)");
}
