using System.Globalization;
using System.Net;
using System.Text.Json;
using NetTopologySuite.Features;
using NetTopologySuite.Geometries;
using NetTopologySuite.IO.Converters;
using SafetyMirror.Core.Design.Evaluation;
using SafetyMirror.Core.Optics;
using SafetyMirror.Core.Site;

namespace SafetyMirror.Api.Tests.Features.Evaluations;

// The answer with Accept: application/geo+json, read back by NetTopologySuite's own GeoJSON reader.
[Collection(ApiCollection.Name)]
public sealed class GeoJsonLayersTests(ApiFactory api)
{
    private static readonly JsonSerializerOptions Reader = new() { Converters = { new GeoJsonConverterFactory() } };

    [Fact]
    public async Task GeoJsonAccept_AnswersApplicationGeoJson()
    {
        using var response = await api.PostEvaluationAsync(DemoCorners.Local(), Evaluations.GeoJson);

        Assert.Equal(HttpStatusCode.OK, response.StatusCode);
        Assert.Equal(Evaluations.GeoJson, response.Content.Headers.ContentType?.MediaType);
    }

    [Fact]
    public async Task GeoJsonAnswer_HoldsEveryLayerWithItsGeometryType()
    {
        var layers = await LayersAsync();

        var types = layers.GroupBy(Layer).ToDictionary(g => g.Key, g => g.Select(f => f.Geometry.OgcGeometryType).Distinct().Single());
        Assert.Equal(OgcGeometryType.Point, types["mirror"]);
        Assert.Equal(OgcGeometryType.Polygon, types["field-of-view"]);
        Assert.Equal(OgcGeometryType.Polygon, types["field-of-view-traced"]);
        Assert.All(new[] { "shown-stretch", "near-blind-zone", "direct-view", "sightline" }, layer => Assert.Equal(OgcGeometryType.LineString, types[layer]));
    }

    [Fact]
    public async Task FieldOfViewLayer_IsAValidPolygon()
    {
        var layers = await LayersAsync();

        var field = Assert.Single(layers, f => Layer(f) == "field-of-view");
        Assert.True(field.Geometry.IsValid, field.Geometry.ToText());
        Assert.True(field.Geometry.Area > 0);
    }

    [Fact]
    public async Task FieldOfViewLayer_IsTheEvaluationsVisibleFieldOfView()
    {
        var layers = await LayersAsync();
        var body = DemoCorners.Local();

        // Core's answer for the same plan and mirror (the local demo's plan coordinates are its local metres); GeoJSON winds rings its own way.
        var plan = SitePlanReader.Read(JsonSerializer.SerializeToElement(body["plan"]), SitePlanLimits.Default).Plan!;
        var mirror = body["mirror"]!;
        var location = mirror["location"]!["coordinates"]!.AsArray();
        var placement = new MirrorPlacement(
            (double)location[0]!, (double)location[1]!, (double)mirror["centreHeightM"]!, (double)mirror["azimuthDeg"]!,
            (double)mirror["tiltDownDeg"]!, (double)mirror["radiusM"]!, new RoundAperture((double)mirror["diameterM"]!));
        var visible = MirrorEvaluator.Evaluate(plan, placement, new EvaluationOptions()).Evaluation!.Mirror.VisibleFieldOfView.Outline!;

        var field = Assert.Single(layers, f => Layer(f) == "field-of-view");
        Assert.True(field.Geometry.Normalized().EqualsExact(visible.Normalized(), 1e-9), field.Geometry.ToText());
    }

    [Fact]
    public async Task FieldOfViewLayer_DoesNotOverlapTheCornerHouse()
    {
        var layers = await LayersAsync();

        var field = Assert.Single(layers, f => Layer(f) == "field-of-view");
        Assert.True(field.Geometry.Intersection(CornerHouse()).Area < 1e-6, field.Geometry.ToText());
    }

    [Fact]
    public async Task TracedFieldOfViewLayer_RunsThroughTheCornerHouse()
    {
        var layers = await LayersAsync();

        // The trace ignores obstacles: on the demo corner it reaches over the house, which is what the visible layer takes off.
        var traced = Assert.Single(layers, f => Layer(f) == "field-of-view-traced");
        Assert.True(traced.Geometry.Intersection(CornerHouse()).Area > 1);
    }

    [Theory]
    [InlineData("mirror", "decision", "lowerEdgeHeightM", "distanceFromEyeM", "radiusM")]
    [InlineData("field-of-view", "areaM2", "tracedAreaM2", "viewpointHeightM", "targetHeightM", "raysTraced")]
    [InlineData("field-of-view-traced", "areaM2", "raysTraced")]
    [InlineData("shown-stretch", "shownFromM", "shownToM", "providedSightDistanceM", "requiredSightDistanceM")]
    [InlineData("near-blind-zone", "nearBlindZoneM", "requiredSightDistanceM")]
    [InlineData("direct-view", "directSightDistanceM", "requiredSightDistanceM")]
    [InlineData("sightline", "stationM", "roadUser", "pathLengthM", "incidenceDeg")]
    public async Task EachLayer_CarriesItsFigures(string layer, params string[] figures)
    {
        var layers = await LayersAsync();

        var features = layers.Where(f => Layer(f) == layer).ToList();
        Assert.NotEmpty(features);
        Assert.All(features, f => Assert.All(figures, name => Assert.NotNull(f.Attributes[name])));
    }

    [Fact]
    public async Task ShownStretch_IsAsLongAsItsStationsApart()
    {
        var layers = await LayersAsync();

        // The local demo is in metres and its eastbound approach is straight, so the line's length is the station span.
        var stretch = Assert.Single(layers, f => Layer(f) == "shown-stretch");
        var from = Number(stretch, "shownFromM");
        var to = Number(stretch, "shownToM");
        Assert.True(to > from);
        Assert.Equal(to - from, stretch.Geometry.Length, 0.01);
    }

    [Theory]
    [InlineData("direct-view", "directSightDistanceM")]
    [InlineData("near-blind-zone", "nearBlindZoneM")]
    [InlineData("shown-stretch", "shownFromM")]
    [InlineData("shown-stretch", "shownToM")]
    public async Task ApproachLayers_CarryTheJsonAnswersFigures(string layer, string figure)
    {
        var layers = await LayersAsync();
        var answer = await api.EvaluateAsync(DemoCorners.Local());

        var features = layers.Where(f => Layer(f) == layer).ToList();
        Assert.NotEmpty(features);
        foreach (var feature in features)
        {
            var index = (int)Number(feature, "approachIndex");
            var approach = answer.GetProperty("approaches").EnumerateArray().Single(a => a.GetProperty("approach").GetProperty("featureIndex").GetInt32() == index);
            Assert.Equal(approach.GetProperty("summary").GetProperty(figure).GetDouble(), Number(feature, figure), 1e-9);
        }
    }

    // Feature 3 of the demo corner, as the request draws it.
    private static Geometry CornerHouse()
    {
        var house = DemoCorners.Local().Feature(3);
        Assert.Equal("obstacle", (string?)house["properties"]!["role"]);
        return JsonSerializer.Deserialize<Geometry>(house["geometry"]!.ToJsonString(), Reader)!;
    }

    private static double Number(IFeature feature, string name) =>
        Convert.ToDouble(feature.Attributes[name], CultureInfo.InvariantCulture);

    private static string Layer(IFeature feature) => Assert.IsType<string>(feature.Attributes["layer"]);

    private async Task<FeatureCollection> LayersAsync()
    {
        using var response = await api.PostEvaluationAsync(DemoCorners.Local(), Evaluations.GeoJson);
        Assert.Equal(HttpStatusCode.OK, response.StatusCode);
        var layers = JsonSerializer.Deserialize<FeatureCollection>(await response.Content.ReadAsStringAsync(), Reader);
        Assert.NotNull(layers);
        return layers;
    }
}
