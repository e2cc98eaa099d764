using System.Globalization;
using System.Net;
using System.Text.Json;
using System.Text.RegularExpressions;

namespace SafetyMirror.Api.Tests.Features.Evaluations;

// GDAL's ogrinfo (Debian gdal-bin) as an independent GeoJSON reader of the saved geo+json answer.
[Collection(ApiCollection.Name)]
public sealed partial class OgrInfoTests(ApiFactory api)
{
    [Fact]
    public async Task OgrInfoSummary_CountsTheAnswersFeaturesAndListsTheLayerField()
    {
        var (file, featureCount) = await SaveLayersAsync();
        try
        {
            var summary = await OgrInfo.RunAsync("-ro", "-al", "-so", file);

            var count = FeatureCount().Match(summary);
            Assert.True(count.Success, summary);
            Assert.Equal(featureCount, int.Parse(count.Groups[1].Value, CultureInfo.InvariantCulture));
            Assert.Matches(LayerField(), summary);
        }
        finally
        {
            File.Delete(file);
        }
    }

    [Fact]
    public async Task OgrInfoListing_ShowsEveryFeatureWithItsLayer()
    {
        var (file, featureCount) = await SaveLayersAsync();
        try
        {
            var listing = await OgrInfo.RunAsync("-ro", "-al", file);

            Assert.Equal(featureCount, FeatureHeader().Matches(listing).Count);
            Assert.Equal(featureCount, LayerValue().Matches(listing).Count);
        }
        finally
        {
            File.Delete(file);
        }
    }

    /// <summary>The WGS84 demo's layers saved to a temporary .geojson file, and how many features they hold.</summary>
    private async Task<(string File, int FeatureCount)> SaveLayersAsync()
    {
        using var response = await api.PostEvaluationAsync(DemoCorners.Wgs84(), Evaluations.GeoJson);
        Assert.Equal(HttpStatusCode.OK, response.StatusCode);
        var text = await response.Content.ReadAsStringAsync();
        using var layers = JsonDocument.Parse(text);
        var count = layers.RootElement.GetProperty("features").GetArrayLength();
        Assert.True(count > 0);
        var file = Path.Combine(Path.GetTempPath(), $"safetymirror-{Guid.NewGuid():N}.geojson");
        await File.WriteAllTextAsync(file, text);
        return (file, count);
    }

    [GeneratedRegex(@"^Feature Count: (\d+)$", RegexOptions.Multiline)]
    private static partial Regex FeatureCount();

    [GeneratedRegex(@"^layer: String", RegexOptions.Multiline)]
    private static partial Regex LayerField();

    [GeneratedRegex(@"^OGRFeature\(", RegexOptions.Multiline)]
    private static partial Regex FeatureHeader();

    [GeneratedRegex(@"^\s+layer \(String\) = \S", RegexOptions.Multiline)]
    private static partial Regex LayerValue();
}
