using System.Text.Json;
using System.Text.Json.Nodes;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Options;
using NetTopologySuite.Geometries;
using HttpJsonOptions = Microsoft.AspNetCore.Http.Json.JsonOptions;

namespace SafetyMirror.Api.Tests.Json;

// The serializer options the running host binds request bodies with.
[Collection(ApiCollection.Name)]
public sealed class ServiceJsonTests(ApiFactory api)
{
    // RFC 7946, Appendix A.3 (Polygon without holes).
    private const string Rfc7946Polygon = """{"type":"Polygon","coordinates":[[[100.0,0.0],[101.0,0.0],[101.0,1.0],[100.0,1.0],[100.0,0.0]]]}""";

    private JsonSerializerOptions Options => api.Services.GetRequiredService<IOptions<HttpJsonOptions>>().Value.SerializerOptions;

    [Fact]
    public void Read_Rfc7946Polygon_IsTheUnitSquareItDescribes()
    {
        var polygon = JsonSerializer.Deserialize<Polygon>(Rfc7946Polygon, Options);

        // Its ring spans one degree of longitude by one of latitude (RFC 7946, Appendix A.3).
        Assert.NotNull(polygon);
        Assert.Equal(1.0, polygon.Area, 12);
        Assert.Equal(5, polygon.ExteriorRing.NumPoints);
    }

    [Fact]
    public void Write_Point_IsRfc7946Point()
    {
        var json = JsonSerializer.Serialize(new Point(100.0, 0.0), Options);

        // RFC 7946, Appendix A.1.
        Assert.True(JsonNode.DeepEquals(JsonNode.Parse("""{"type":"Point","coordinates":[100.0,0.0]}"""), JsonNode.Parse(json)), json);
    }

    [Theory]
    // A linear ring must end where it starts: RFC 7946, 3.1.6.
    [InlineData("""{"site":{"type":"Polygon","coordinates":[[[100.0,0.0],[101.0,0.0],[101.0,1.0],[100.0,1.0]]]}}""", typeof(Polygon))]
    // A Polygon (RFC 7946, Appendix A.3) where a Point is declared.
    [InlineData("""{"site":""" + Rfc7946Polygon + "}", typeof(Point))]
    // RFC 7946, 1.4 names seven geometry types; "Circle" is not one of them.
    [InlineData("""{"site":{"type":"Circle","coordinates":[100.0,0.0]}}""", typeof(Geometry))]
    // A LineString needs two or more positions: RFC 7946, 3.1.4.
    [InlineData("""{"site":{"type":"LineString","coordinates":[[100.0,0.0]]}}""", typeof(LineString))]
    public void Read_InvalidGeoJson_IsAJsonErrorAtItsPath(string body, Type declared)
    {
        var dictionary = typeof(Dictionary<,>).MakeGenericType(typeof(string), declared);

        var error = Assert.Throws<JsonException>(() => JsonSerializer.Deserialize(body, dictionary, Options));

        Assert.Equal("$.site", error.Path);
    }

    [Fact]
    public void Write_PropertyNames_AreCamelCase()
    {
        var json = JsonSerializer.Serialize(new { MountingHeightM = 2.5 }, Options);

        Assert.Equal("""{"mountingHeightM":2.5}""", json);
    }
}
