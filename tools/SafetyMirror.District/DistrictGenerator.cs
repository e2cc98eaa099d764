using System.Text.Json.Nodes;

namespace SafetyMirror.District;

/// <summary>Generates a district of blind corners in the invented town of Quillhythe, laid out on a street grid in WGS84.</summary>
/// <remarks>
/// Deterministic: the same options give the same district, byte for byte once written. Each corner is drawn from its
/// own seeded generator, so a change to how one kind of corner is drawn leaves the others as they were. The town lies in
/// open sea in the North Atlantic, far from any real place, so a GIS shows it on an empty map.
/// </remarks>
public static class DistrictGenerator
{
    /// <summary>The role of the feature that carries a corner's given mirror in a batch.</summary>
    public const string MirrorRole = "mirror";

    /// <summary>Most corners one district may have.</summary>
    public const int MaxCorners = 10_000;

    /// <summary>Longitude of the town's north-west corner, degrees (open sea).</summary>
    public const double TownLonDeg = -31.62;

    /// <summary>Latitude of the town's north-west corner, degrees (open sea).</summary>
    public const double TownLatDeg = 46.37;

    /// <summary>Side of the grid cell each corner stands in, metres: room for approaches of up to 150 m each way.</summary>
    public const double CellM = 340;

    /// <summary>The district the options describe.</summary>
    public static GeneratedDistrict Generate(DistrictOptions options)
    {
        ArgumentNullException.ThrowIfNull(options);
        ArgumentOutOfRangeException.ThrowIfLessThan(options.Corners, 1);
        ArgumentOutOfRangeException.ThrowIfGreaterThan(options.Corners, MaxCorners);
        if (options.MirrorShare is < 0 or > 1 || options.MalformedShare is < 0 or > 1)
        {
            throw new ArgumentOutOfRangeException(nameof(options), "The mirror and malformed shares must be from 0 to 1.");
        }

        var flaws = Flaws(options);
        var columns = (int)Math.Ceiling(Math.Sqrt(options.Corners));
        var corners = Enumerable.Range(0, options.Corners)
            .Select(index => Corner(options, index, columns, flaws.TryGetValue(index, out var flaw) ? flaw : null))
            .ToList();
        return new GeneratedDistrict($"{TownNames.Town} blind corners ({options.Corners} corners, seed {options.Seed})", SharedOptions(), corners);
    }

    /// <summary>The number of malformed corners the options ask for: the share of the corners, rounded.</summary>
    public static int MalformedCount(DistrictOptions options)
    {
        ArgumentNullException.ThrowIfNull(options);
        return (int)Math.Round(options.Corners * options.MalformedShare, MidpointRounding.AwayFromZero);
    }

    // The options every corner shares: the stopping sight distance for a car, a cyclist also checked.
    private static JsonObject SharedOptions() => new()
    {
        ["sightDistance"] = new JsonObject { ["method"] = "stopping" },
        ["roadUsers"] = new JsonArray(new JsonObject { ["id"] = "passenger-car" }, new JsonObject { ["id"] = "bicycle" }),
        ["stationSpacingM"] = 5,
    };

    // Which corners are malformed, and how: chosen from the seed, the kinds taken in turn so that every kind shows.
    private static Dictionary<int, CornerFlawKind> Flaws(DistrictOptions options)
    {
        var indices = Enumerable.Range(0, options.Corners).ToArray();
        new Random(options.Seed).Shuffle(indices);
        var kinds = Enum.GetValues<CornerFlawKind>();
        return indices.Take(MalformedCount(options)).Select((index, turn) => (index, kind: kinds[turn % kinds.Length]))
            .ToDictionary(pair => pair.index, pair => pair.kind);
    }

    private static DistrictCorner Corner(DistrictOptions options, int index, int columns, CornerFlawKind? flaw)
    {
        var random = new Random(unchecked((options.Seed * 1_000_003) + (index * 7_919) + 17));
        var (column, row) = (index % columns, index / columns);
        var quarterTurns = random.Next(4);
        var originLatDeg = TownLatDeg - ((row + 0.5) * CellM / CornerFrame.MetresPerDegreeLat(TownLatDeg));
        var originLonDeg = TownLonDeg + ((column + 0.5) * CellM / CornerFrame.MetresPerDegreeLon(TownLatDeg));
        var street = quarterTurns % 2 == 0 ? TownNames.EastWestStreet(row) : TownNames.NorthSouthStreet(column);
        var withMirror = random.NextDouble() < options.MirrorShare;
        var sketch = new CornerSketch(random, new CornerFrame(originLonDeg, originLatDeg, quarterTurns), $"QH-{index + 1:D4}", street);
        return sketch.Draw(withMirror, flaw);
    }
}
