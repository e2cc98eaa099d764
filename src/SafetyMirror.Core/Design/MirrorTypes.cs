using SafetyMirror.Core.Optics;

namespace SafetyMirror.Core.Design;

/// <summary>The default catalogue of road mirror sizes, smallest face first; a request may bring its own.</summary>
public static class MirrorTypes
{
    private const string Sizes = "usual sizes in a Japanese road-mirror industry size table";
    private const string PairedRadius = "paired radius [memory, common practice]";

    // Rectangles take the radius of the round face as wide as their long side: our pairing, from the same
    // practice [memory]. They hang landscape, long side horizontal, to show more of the lane.
    private const string RectangleRadius = "radius of the round face as wide as its long side (our pairing) [memory, common practice]; long side horizontal";

    /// <summary>The default catalogue, ordered by face area.</summary>
    public static IReadOnlyList<MirrorType> Defaults { get; } =
    [
        new("rectangular-450x600", new RectangularAperture(0.600, 0.450), 2.2, $"{Sizes}; {RectangleRadius}"),
        new("round-600", new RoundAperture(0.600), 2.2, $"{Sizes}; {PairedRadius}"),
        new("rectangular-600x800", new RectangularAperture(0.800, 0.600), 3.0, $"{Sizes}; {RectangleRadius}"),
        new("round-800", new RoundAperture(0.800), 3.0, $"{Sizes}; {PairedRadius}"),
        new("round-1000", new RoundAperture(1.000), 3.6, $"{Sizes}; {PairedRadius}"),
    ];

    /// <summary>The default mirror type with this id, or null when there is none.</summary>
    public static MirrorType? Find(string id) => Defaults.FirstOrDefault(type => type.Id == id);
}
