namespace SafetyMirror.District;

/// <summary>The invented town's names: streets, lanes and buildings. None is meant to be a real place.</summary>
internal static class TownNames
{
    /// <summary>The invented town.</summary>
    public const string Town = "Quillhythe";

    private static readonly string[] Stems =
    [
        "Tansy", "Sorrel", "Pewter", "Thimble", "Gannet", "Osier", "Marram", "Cobble", "Wicket", "Brindle", "Lantern", "Sable",
        "Rushlight", "Juniper", "Quarrel", "Fennel", "Tallow", "Cresset", "Larkspur", "Kestrel", "Saltire", "Bramling", "Copperwell", "Mallowby",
    ];

    private static readonly string[] Landmarks = ["Old tannery", "Chapel hall", "Tram depot", "Cooperage", "Seed warehouse", "Rope works"];

    /// <summary>The street running east–west along a row of the grid.</summary>
    public static string EastWestStreet(int row) => $"{Stems[row % Stems.Length]} {(row / Stems.Length % 2 == 0 ? "Street" : "Row")}";

    /// <summary>The street running north–south along a column of the grid.</summary>
    public static string NorthSouthStreet(int column) => $"{Stems[(column + 11) % Stems.Length]} {(column / Stems.Length % 2 == 0 ? "Road" : "Walk")}";

    /// <summary>A short side street: a mews or a lane.</summary>
    public static string SideStreet(Random random, string kind) => $"{Stems[random.Next(Stems.Length)]} {kind}";

    /// <summary>A building that stands inside a bend.</summary>
    public static string Landmark(Random random) => Landmarks[random.Next(Landmarks.Length)];
}
