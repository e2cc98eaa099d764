namespace SafetyMirror.Core.Design;

/// <summary>A mirror face material and the share of light it reflects.</summary>
public sealed record FaceMaterial
{
    /// <summary>Creates a material; reflectance is a fraction from 0 to 1.</summary>
    public FaceMaterial(string id, string name, double reflectance, string source)
    {
        Id = MachineName.Require(id);
        ArgumentException.ThrowIfNullOrWhiteSpace(name);
        ArgumentException.ThrowIfNullOrWhiteSpace(source);
        Name = name;
        Reflectance = Preconditions.InRange(reflectance, 0, 1, "(fraction of the incident light)");
        Source = source;
    }

    /// <summary>Stable machine name, kebab-case.</summary>
    public string Id { get; }

    /// <summary>Name for people to read.</summary>
    public string Name { get; }

    /// <summary>Fraction of the incident light the face reflects, from 0 to 1.</summary>
    public double Reflectance { get; }

    /// <summary>Where the reflectance comes from.</summary>
    public string Source { get; }
}

/// <summary>The default face materials with their approximate reflectance.</summary>
public static class FaceMaterials
{
    private const string Table = "Japanese road-mirror industry association material table (approximate)";

    /// <summary>The default materials, most reflective first.</summary>
    public static IReadOnlyList<FaceMaterial> Defaults { get; } =
    [
        new("acrylic", "Acrylic", 0.85, Table),
        new("polycarbonate", "Polycarbonate", 0.80, Table),
        new("strengthened-glass", "Strengthened glass", 0.80, Table),
        new("stainless-steel", "Stainless steel", 0.60, Table),
    ];

    /// <summary>The default material with this id, or null when there is none.</summary>
    public static FaceMaterial? Find(string id) => Defaults.FirstOrDefault(material => material.Id == id);
}
