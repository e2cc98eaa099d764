using System.Text.Json.Nodes;
using Microsoft.OpenApi;
using NetTopologySuite.Features;
using NetTopologySuite.Geometries;
using Swashbuckle.AspNetCore.SwaggerGen;

namespace SafetyMirror.Api.OpenApi;

/// <summary>Describes NetTopologySuite geometries and features as the plain GeoJSON of RFC 7946.</summary>
/// <remarks>
/// Without this, the document would describe the library's C# internals (envelopes, factories, precision
/// models) instead of what goes over the wire. Only the schemas the document refers to are added.
/// </remarks>
public static class GeoJsonSchemas
{
    private const string Prefix = "GeoJson";

    private static readonly (Type Type, string Id)[] Mappings =
    [
        (typeof(Geometry), Prefix + "Geometry"),
        (typeof(Point), Prefix + "Point"),
        (typeof(LineString), Prefix + "LineString"),
        (typeof(LinearRing), Prefix + "LineString"),
        (typeof(Polygon), Prefix + "Polygon"),
        (typeof(MultiPoint), Prefix + "MultiPoint"),
        (typeof(MultiLineString), Prefix + "MultiLineString"),
        (typeof(MultiPolygon), Prefix + "MultiPolygon"),
        (typeof(GeometryCollection), Prefix + "GeometryCollection"),
        (typeof(IFeature), Prefix + "Feature"),
        (typeof(Feature), Prefix + "Feature"),
        (typeof(FeatureCollection), Prefix + "FeatureCollection"),
    ];

    /// <summary>Maps every NetTopologySuite geometry and feature type to a reference to its GeoJSON schema.</summary>
    public static SwaggerGenOptions MapGeoJsonTypes(this SwaggerGenOptions options)
    {
        foreach (var (type, id) in Mappings)
        {
            options.MapType(type, () => new OpenApiSchemaReference(id));
        }

        options.DocumentFilter<ComponentsFilter>();
        return options;
    }

    /// <summary>Adds the GeoJSON component schemas that the document refers to, and those they refer to in turn.</summary>
    internal sealed class ComponentsFilter : IDocumentFilter
    {
        public void Apply(OpenApiDocument swaggerDoc, DocumentFilterContext context)
        {
            var definitions = Definitions();
            while (ReferencedIds(swaggerDoc).Where(definitions.ContainsKey).Except(swaggerDoc.Components?.Schemas?.Keys ?? []).ToList() is { Count: > 0 } missing)
            {
                swaggerDoc.Components ??= new OpenApiComponents();
                var schemas = swaggerDoc.Components.Schemas ??= new SortedDictionary<string, IOpenApiSchema>(StringComparer.Ordinal);
                foreach (var id in missing.Order(StringComparer.Ordinal))
                {
                    schemas.Add(id, definitions[id]);
                }
            }
        }

        private static HashSet<string> ReferencedIds(OpenApiDocument document)
        {
            var collector = new ReferenceCollector();
            new OpenApiWalker(collector).Walk(document);
            return collector.Ids;
        }
    }

    private sealed class ReferenceCollector : OpenApiVisitorBase
    {
        public HashSet<string> Ids { get; } = [];

        public override void Visit(IOpenApiReferenceHolder referenceHolder)
        {
            if (referenceHolder is OpenApiSchemaReference { Reference.Id: { } id })
            {
                Ids.Add(id);
            }
        }
    }

    // RFC 7946, sections 3.1 to 3.3 and 5; built anew for each document because OpenApiSchema is mutable.
    private static Dictionary<string, IOpenApiSchema> Definitions()
    {
        var position = Ref("Position");
        var positions = ArrayOf(position, minItems: 0);
        var line = ArrayOf(position, minItems: 2);
        var ring = ArrayOf(position, minItems: 4, "A linear ring: closed (first and last positions equal), at least four positions; exterior rings counterclockwise, holes clockwise (RFC 7946, 3.1.6).");
        return new Dictionary<string, IOpenApiSchema>
        {
            [Prefix + "Position"] = new OpenApiSchema
            {
                Type = JsonSchemaType.Array,
                Description = "Longitude and latitude in decimal degrees (WGS 84), optionally followed by elevation in metres (RFC 7946, 3.1.1).",
                Items = new OpenApiSchema { Type = JsonSchemaType.Number, Format = "double" },
                MinItems = 2,
                MaxItems = 3,
            },
            [Prefix + "BoundingBox"] = new OpenApiSchema
            {
                Type = JsonSchemaType.Array,
                Description = "Lowest values of every axis, then highest (RFC 7946, 5).",
                Items = new OpenApiSchema { Type = JsonSchemaType.Number, Format = "double" },
                MinItems = 4,
            },
            [Prefix + "Point"] = Geometry("Point", position),
            [Prefix + "LineString"] = Geometry("LineString", line),
            [Prefix + "Polygon"] = Geometry("Polygon", ArrayOf(ring, minItems: 0, "The exterior ring, then any holes.")),
            [Prefix + "MultiPoint"] = Geometry("MultiPoint", positions),
            [Prefix + "MultiLineString"] = Geometry("MultiLineString", ArrayOf(line, minItems: 0)),
            [Prefix + "MultiPolygon"] = Geometry("MultiPolygon", ArrayOf(ArrayOf(ring, minItems: 0), minItems: 0)),
            [Prefix + "GeometryCollection"] = GeoJsonObject("GeometryCollection", ["geometries"], ("geometries", ArrayOf(Ref("Geometry"), minItems: 0))),
            [Prefix + "Geometry"] = new OpenApiSchema
            {
                Description = "Any GeoJSON geometry object (RFC 7946, 3.1).",
                OneOf =
                [
                    Ref("Point"), Ref("LineString"), Ref("Polygon"), Ref("MultiPoint"),
                    Ref("MultiLineString"), Ref("MultiPolygon"), Ref("GeometryCollection"),
                ],
            },
            [Prefix + "Feature"] = GeoJsonObject(
                "Feature",
                ["geometry", "properties"],
                ("id", new OpenApiSchema { Type = JsonSchemaType.String | JsonSchemaType.Number, Description = "An optional identifier of the feature." }),
                ("geometry", new OpenApiSchema { Description = "The feature's geometry, or null.", OneOf = [Ref("Geometry"), new OpenApiSchema { Type = JsonSchemaType.Null }] }),
                ("properties", new OpenApiSchema { Type = JsonSchemaType.Object | JsonSchemaType.Null, Description = "The feature's attributes, or null." })),
            [Prefix + "FeatureCollection"] = GeoJsonObject("FeatureCollection", ["features"], ("features", ArrayOf(Ref("Feature"), minItems: 0))),
        };
    }

    private static OpenApiSchema Geometry(string type, IOpenApiSchema coordinates) =>
        GeoJsonObject(type, ["coordinates"], ("coordinates", coordinates));

    // A GeoJSON object: its "type" name, the members that carry its content, and an optional "bbox".
    private static OpenApiSchema GeoJsonObject(string type, string[] required, params (string Name, IOpenApiSchema Schema)[] members)
    {
        var properties = new Dictionary<string, IOpenApiSchema>
        {
            ["type"] = new OpenApiSchema { Type = JsonSchemaType.String, Enum = [JsonValue.Create(type)] },
        };
        foreach (var (name, schema) in members)
        {
            properties.Add(name, schema);
        }

        properties.Add("bbox", Ref("BoundingBox"));
        return new OpenApiSchema
        {
            Type = JsonSchemaType.Object,
            Description = $"A GeoJSON {type} object (RFC 7946).",
            Required = new HashSet<string>(["type", .. required]),
            Properties = properties,
        };
    }

    private static OpenApiSchema ArrayOf(IOpenApiSchema items, int minItems, string? description = null) => new()
    {
        Type = JsonSchemaType.Array,
        Items = items,
        MinItems = minItems > 0 ? minItems : null,
        Description = description,
    };

    private static OpenApiSchemaReference Ref(string name) => new(Prefix + name);
}
