using Microsoft.Extensions.DependencyInjection;
using Microsoft.OpenApi;
using NetTopologySuite.Features;
using NetTopologySuite.Geometries;
using SafetyMirror.Api.OpenApi;
using Swashbuckle.AspNetCore.SwaggerGen;

namespace SafetyMirror.Api.Tests.OpenApi;

[Collection(ApiCollection.Name)]
public sealed class GeoJsonSchemasTests(ApiFactory api)
{
    // The GeoJSON object types of RFC 7946, section 1.4.
    [Theory]
    [InlineData(typeof(Geometry), "GeoJsonGeometry")]
    [InlineData(typeof(Point), "GeoJsonPoint")]
    [InlineData(typeof(LineString), "GeoJsonLineString")]
    [InlineData(typeof(LinearRing), "GeoJsonLineString")]
    [InlineData(typeof(Polygon), "GeoJsonPolygon")]
    [InlineData(typeof(MultiPoint), "GeoJsonMultiPoint")]
    [InlineData(typeof(MultiLineString), "GeoJsonMultiLineString")]
    [InlineData(typeof(MultiPolygon), "GeoJsonMultiPolygon")]
    [InlineData(typeof(GeometryCollection), "GeoJsonGeometryCollection")]
    [InlineData(typeof(IFeature), "GeoJsonFeature")]
    [InlineData(typeof(Feature), "GeoJsonFeature")]
    [InlineData(typeof(FeatureCollection), "GeoJsonFeatureCollection")]
    public void SchemaGenerator_NetTopologySuiteType_IsAReferenceToItsGeoJsonSchema(Type type, string schemaId)
    {
        var repository = new SchemaRepository();

        var schema = api.Services.GetRequiredService<ISchemaGenerator>().GenerateSchema(type, repository);

        Assert.Equal(schemaId, Assert.IsType<OpenApiSchemaReference>(schema).Reference.Id);
        Assert.Empty(repository.Schemas);
    }

    [Fact]
    public void ComponentsFilter_FeatureCollectionReference_AddsEverySchemaItDependsOn()
    {
        var document = Referring("GeoJsonFeatureCollection");

        new GeoJsonSchemas.ComponentsFilter().Apply(document, null!);

        // A feature collection holds features, a feature any of the seven geometry types (RFC 7946, 1.4).
        Assert.Equal(
            [
                "GeoJsonBoundingBox", "GeoJsonFeature", "GeoJsonFeatureCollection", "GeoJsonGeometry",
                "GeoJsonGeometryCollection", "GeoJsonLineString", "GeoJsonMultiLineString", "GeoJsonMultiPoint",
                "GeoJsonMultiPolygon", "GeoJsonPoint", "GeoJsonPolygon", "GeoJsonPosition",
            ],
            document.Components!.Schemas!.Keys.Order(StringComparer.Ordinal));
    }

    [Fact]
    public void ComponentsFilter_PointReference_AddsOnlyThePointAndItsParts()
    {
        var document = Referring("GeoJsonPoint");

        new GeoJsonSchemas.ComponentsFilter().Apply(document, null!);

        Assert.Equal(["GeoJsonBoundingBox", "GeoJsonPoint", "GeoJsonPosition"], document.Components!.Schemas!.Keys.Order(StringComparer.Ordinal));
    }

    [Fact]
    public void ComponentsFilter_NoGeoJsonReference_AddsNothing()
    {
        var document = Referring("SomethingElse");

        new GeoJsonSchemas.ComponentsFilter().Apply(document, null!);

        Assert.Null(document.Components);
    }

    // A document whose one response refers to the named component schema.
    private static OpenApiDocument Referring(string schemaId) => new()
    {
        Paths = new OpenApiPaths
        {
            ["/site"] = new OpenApiPathItem
            {
                Operations = new()
                {
                    [HttpMethod.Get] = new OpenApiOperation
                    {
                        Responses = new OpenApiResponses
                        {
                            ["200"] = new OpenApiResponse
                            {
                                Description = "OK",
                                Content = new Dictionary<string, IOpenApiMediaType>
                                {
                                    ["application/geo+json"] = new OpenApiMediaType { Schema = new OpenApiSchemaReference(schemaId) },
                                },
                            },
                        },
                    },
                },
            },
        },
    };
}
