using System.Globalization;
using System.Text;
using System.Text.Json.Nodes;
using System.Text.Json;
using System.Text.RegularExpressions;
using NetTopologySuite.Geometries;
using SafetyMirror.Core.Site;
using SafetyMirror.District;

namespace SafetyMirror.Api.Tests.District;

// The generated district itself: deterministic bytes, its share of flawed corners, its two written forms, the committed demo.
public sealed partial class DistrictGeneratorTests
{
    private static readonly DistrictOptions TwoHundredWithMirrors = new() { Corners = 200, Seed = 7, MirrorShare = 1 };

    [Fact]
    public void ToCollection_SameSeed_SameBytes()
    {
        var first = Encoding.UTF8.GetBytes(DistrictWriter.ToCollection(DistrictGenerator.Generate(TwoHundredWithMirrors)));
        var second = Encoding.UTF8.GetBytes(DistrictWriter.ToCollection(DistrictGenerator.Generate(TwoHundredWithMirrors)));

        Assert.Equal(first, second);
    }

    [Fact]
    public void ToSequence_SameSeed_SameBytes()
    {
        var first = Encoding.UTF8.GetBytes(DistrictWriter.ToSequence(DistrictGenerator.Generate(TwoHundredWithMirrors)));
        var second = Encoding.UTF8.GetBytes(DistrictWriter.ToSequence(DistrictGenerator.Generate(TwoHundredWithMirrors)));

        Assert.Equal(first, second);
    }

    [Fact]
    public void ToCollection_OtherSeed_OtherDistrict()
    {
        var seven = DistrictWriter.ToCollection(DistrictGenerator.Generate(TwoHundredWithMirrors));
        var eight = DistrictWriter.ToCollection(DistrictGenerator.Generate(TwoHundredWithMirrors with { Seed = 8 }));

        Assert.NotEqual(seven, eight);
    }

    [Fact]
    public void Generate_DefaultShareOf200Corners_MalformsSix()
    {
        var district = DistrictGenerator.Generate(TwoHundredWithMirrors);

        // The default share, 3 %, of 200 corners.
        Assert.Equal(6, district.Corners.Count(corner => corner.Flaw is not null));
    }

    [Fact]
    public void Generate_AsManyFlawedCornersAsKinds_ShowsEveryKindOnce()
    {
        var district = DistrictGenerator.Generate(TwoHundredWithMirrors);

        Assert.Equal(Enum.GetValues<CornerFlawKind>().Order(), district.Corners.Where(c => c.Flaw is not null).Select(c => c.Flaw!.Kind).Order());
    }

    [Fact]
    public void Generate_AnyCorner_HoldsAtMostTwelveFeatures()
    {
        var district = DistrictGenerator.Generate(TwoHundredWithMirrors);

        Assert.All(district.Corners, corner => Assert.InRange(corner.Features.Count, 6, 12));
    }

    [Fact]
    public void Generate_WithMirrors_GivesEveryWellFormedCornerAMirror()
    {
        var district = DistrictGenerator.Generate(TwoHundredWithMirrors);

        Assert.All(district.Corners.Where(c => c.Flaw is null), corner => Assert.NotNull(corner.Mirror));
    }

    [Fact]
    public void Generate_WithoutMirrors_LeavesOnlyTheFlawedMirrors()
    {
        var district = DistrictGenerator.Generate(TwoHundredWithMirrors with { MirrorShare = 0 });

        Assert.All(district.Corners.Where(c => c.Mirror is not null), corner => Assert.Equal(CornerFlawKind.MirrorRadiusOutOfRange, corner.Flaw?.Kind));
    }

    [Fact]
    public void Generate_EveryCorner_HasItsOwnFeatureIds()
    {
        var district = DistrictGenerator.Generate(TwoHundredWithMirrors);
        var ids = district.Corners.SelectMany(c => c.Features).Select(f => (string)f["id"]!).ToList();

        Assert.Equal(ids.Count, ids.Distinct(StringComparer.Ordinal).Count());
    }

    [Fact]
    public void Generate_EveryWellFormedCorner_HasApproachesOf60To150Metres()
    {
        var district = DistrictGenerator.Generate(TwoHundredWithMirrors);

        // Read in local metres by the service's own plan reader: a corner's worth of street, as a site survey would draw it.
        var lengths = district.Corners.Where(c => c.Flaw is null).SelectMany(c => ReadPlan(c).Approaches).Select(a => a.LengthM).ToList();
        Assert.InRange(lengths.Min(), 59.95, 150.05);
        Assert.InRange(lengths.Max(), 59.95, 150.05);
    }

    [Fact]
    public void Generate_AnyTwoCorners_StandApartOnTheMap()
    {
        var district = DistrictGenerator.Generate(TwoHundredWithMirrors);

        var extents = district.Corners.Select(Extent).ToList();
        var overlapping = extents.SelectMany((e, i) => extents.Skip(i + 1).Where(e.Intersects).Select(_ => i)).ToList();
        Assert.Empty(overlapping);
    }

    [Fact]
    public void Generate_WithMirrors_HangsMirrorsOfTheUsualSizes()
    {
        var district = DistrictGenerator.Generate(TwoHundredWithMirrors);

        // Common practice: round traffic mirrors of 600 to 1000 mm, radius 2 to 4 m, centre about 2.9 m up.
        Assert.All(district.Corners.Where(c => c.Flaw is null).Select(c => c.Mirror!["properties"]!), mirror =>
        {
            Assert.InRange((double)mirror["diameterM"]!, 0.6, 1.0);
            Assert.InRange((double)mirror["radiusM"]!, 2, 4);
            Assert.InRange((double)mirror["centreHeightM"]!, 2.6, 3.2);
        });
    }

    [Fact]
    public void ToCollection_EveryFeature_NamesACornerOfTheBatch()
    {
        var batch = JsonNode.Parse(DistrictWriter.ToCollection(DistrictGenerator.Generate(TwoHundredWithMirrors)))!;
        var corners = batch["corners"]!.AsObject();

        Assert.Equal("FeatureCollection", (string?)batch["type"]);
        Assert.All(batch["features"]!.AsArray(), feature => Assert.True(corners.ContainsKey((string)feature!["properties"]!["corner"]!)));
    }

    [Fact]
    public void ToSequence_EachRecord_IsOneCornersFeatureCollection()
    {
        var district = DistrictGenerator.Generate(new DistrictOptions { Corners = 30, Seed = 7 });
        var text = DistrictWriter.ToSequence(district);

        // RFC 8142 §2: each GeoJSON text is preceded by the record separator (0x1E) and followed by a line feed.
        var records = text.Split(DistrictWriter.RecordSeparator)[1..];
        Assert.StartsWith(DistrictWriter.RecordSeparator.ToString(), text, StringComparison.Ordinal);
        Assert.Equal(district.Corners.Select(c => c.Id), records.Select(record => (string)JsonNode.Parse(record)!["corner"]!));
        Assert.All(records, record => Assert.EndsWith("}\n", record, StringComparison.Ordinal));
    }

    [Fact]
    public void ToSequence_CornerWithItsOwnOptions_CarriesThemOverTheSharedOnes()
    {
        var district = DistrictGenerator.Generate(new DistrictOptions { Corners = 30, Seed = 7 });
        var own = district.Corners.First(c => c.Options is not null);

        var record = DistrictWriter.ToSequence(district).Split(DistrictWriter.RecordSeparator)
            .Select(r => r.Length == 0 ? null : JsonNode.Parse(r)).Single(r => (string?)r?["corner"] == own.Id)!;

        Assert.Equal("intersection", (string?)record["options"]!["sightDistance"]!["method"]);
        Assert.Equal(2, record["options"]!["roadUsers"]!.AsArray().Count);
    }

    [Fact]
    public void DemoDistrict_EqualsTheGeneratorsOutputForItsOptions()
    {
        var committed = File.ReadAllText(RepositoryFiles.PathOf("openapi", "examples", "demo-district.geojson"));

        var generated = DistrictWriter.ToCollection(DistrictGenerator.Generate(DistrictOptions.Demo));

        Assert.True(committed == generated,
            "openapi/examples/demo-district.geojson is not the generator's output; rewrite it with "
            + "`dotnet run --project tools/SafetyMirror.District -c Release -- --demo --out openapi/examples/demo-district.geojson` and review the diff.");
    }

    [Fact]
    public void DemoDistrict_AsksBothForEvaluationsAndForRecommendations()
    {
        var demo = DistrictGenerator.Generate(DistrictOptions.Demo);

        Assert.Contains(demo.Corners, corner => corner.Flaw is null && corner.Mirror is not null);
        Assert.Contains(demo.Corners, corner => corner.Flaw is null && corner.Mirror is null);
        Assert.Contains(demo.Corners, corner => corner.Flaw is not null);
    }

    [Fact]
    public async Task DemoDistrict_ReadByOgrInfo_HoldsEveryFeatureWithItsCorner()
    {
        var demo = DistrictGenerator.Generate(DistrictOptions.Demo);

        // GDAL's GeoJSON driver as an outside reader: one layer of every feature, the corner id a string field.
        var summary = await OgrInfo.RunAsync("-ro", "-al", "-so", RepositoryFiles.PathOf("openapi", "examples", "demo-district.geojson"));

        var count = FeatureCount().Match(summary);
        Assert.True(count.Success, summary);
        Assert.Equal(demo.Corners.Sum(c => c.Features.Count), int.Parse(count.Groups[1].Value, CultureInfo.InvariantCulture));
        Assert.Matches(CornerField(), summary);
    }

    private static SitePlan ReadPlan(DistrictCorner corner)
    {
        var plan = new JsonObject { ["type"] = "FeatureCollection", ["features"] = new JsonArray([.. corner.Features.Where(f => f != corner.Mirror).Select(f => f.DeepClone())]) };
        using var document = JsonDocument.Parse(plan.ToJsonString());
        var read = SitePlanReader.Read(document.RootElement);
        Assert.True(read.Succeeded, $"{corner.Id}: {string.Join("; ", read.Problems.Select(p => $"{p.Path} {p.Message}"))}");
        return read.Plan!;
    }

    // The corner's extent in longitude and latitude, over every position of every feature.
    private static Envelope Extent(DistrictCorner corner)
    {
        var extent = new Envelope();
        foreach (var position in corner.Features.SelectMany(f => Positions(f["geometry"]!["coordinates"]!)))
        {
            extent.ExpandToInclude(position);
        }

        return extent;
    }

    private static IEnumerable<Coordinate> Positions(JsonNode coordinates) =>
        coordinates.AsArray()[0] is JsonValue
            ? [new Coordinate((double)coordinates[0]!, (double)coordinates[1]!)]
            : coordinates.AsArray().SelectMany(inner => Positions(inner!));

    [GeneratedRegex(@"^Feature Count: (\d+)$", RegexOptions.Multiline)]
    private static partial Regex FeatureCount();

    [GeneratedRegex(@"^corner: String", RegexOptions.Multiline)]
    private static partial Regex CornerField();
}
