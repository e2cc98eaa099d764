namespace SafetyMirror.Core.Design;

/// <summary>A design road user: the outline that must be seen, and where its dimensions come from.</summary>
public sealed record RoadUser
{
    /// <summary>Smallest dimension accepted, in metres.</summary>
    public const double MinimumDimensionM = 0.1;

    /// <summary>Largest dimension accepted, in metres; the bounds catch millimetres or centimetres given as metres.</summary>
    public const double MaximumDimensionM = 30;

    /// <summary>Creates a road user; the id is kebab-case and each dimension from 0.1 to 30 m.</summary>
    /// <param name="id">Stable machine name, kebab-case.</param>
    /// <param name="name">Name for people to read.</param>
    /// <param name="heightM">Overall height, rider included.</param>
    /// <param name="widthM">Overall width.</param>
    /// <param name="lengthM">Overall length along its direction of travel.</param>
    /// <param name="isVulnerable">Whether it is a pedestrian, cyclist or motorcyclist, unprotected by a body.</param>
    /// <param name="source">Where the dimensions come from.</param>
    public RoadUser(string id, string name, double heightM, double widthM, double lengthM, bool isVulnerable, string source)
    {
        Id = MachineName.Require(id);
        ArgumentException.ThrowIfNullOrWhiteSpace(name);
        ArgumentException.ThrowIfNullOrWhiteSpace(source);
        Name = name;
        HeightM = Preconditions.InRange(heightM, MinimumDimensionM, MaximumDimensionM, "m");
        WidthM = Preconditions.InRange(widthM, MinimumDimensionM, MaximumDimensionM, "m");
        LengthM = Preconditions.InRange(lengthM, MinimumDimensionM, MaximumDimensionM, "m");
        IsVulnerable = isVulnerable;
        Source = source;
    }

    /// <summary>Stable machine name, kebab-case, like "passenger-car".</summary>
    public string Id { get; }

    /// <summary>Name for people to read.</summary>
    public string Name { get; }

    /// <summary>Overall height in metres, rider included.</summary>
    public double HeightM { get; }

    /// <summary>Overall width in metres.</summary>
    public double WidthM { get; }

    /// <summary>Overall length in metres.</summary>
    public double LengthM { get; }

    /// <summary>Whether it is a pedestrian, cyclist or motorcyclist.</summary>
    public bool IsVulnerable { get; }

    /// <summary>Where the dimensions come from.</summary>
    public string Source { get; }

    /// <summary>The smaller of height and width, in metres: the dimension the vision criteria apply to.</summary>
    /// <remarks>
    /// A road user approaching along its lane shows the mirror its front, height by width; its length only
    /// shows at close range, where it is large anyway.
    /// </remarks>
    public double SmallestDimensionM => Math.Min(HeightM, WidthM);
}
