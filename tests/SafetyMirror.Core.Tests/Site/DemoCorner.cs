using System.Text.Json;
using System.Text.Json.Nodes;
using SafetyMirror.Core.Site;

namespace SafetyMirror.Core.Tests.Site;

/// <summary>An invented corner: the exit of Quillby Yard onto Harrow Fold Road, drawn as a GIS would export it.</summary>
/// <remarks>
/// Laid out in metres from the conflict area: the road runs east-west (carriageway y 0 to 7), the exit comes in from
/// the south at x = 1.5, a garden wall stands west of the exit and a hedge east of it.
/// Features: 0 eye, 1 eastbound approach, 2 westbound approach, 3 wall, 4 hedge, 5 mounting zone, 6 carriageway,
/// 7 footway.
/// </remarks>
internal static class DemoCorner
{
    public const double OriginLonDeg = 9.87;
    public const double OriginLatDeg = 50.31;

    // Metres per degree at the origin, from the ellipsoid's radii of curvature there: good to about 1e-5 across the demo.
    private static readonly double MetresPerDegreeLat = Wgs84Ellipsoid.MeridianRadiusM(OriginLatDeg) * Math.PI / 180;
    private static readonly double MetresPerDegreeLon = Wgs84Ellipsoid.ParallelRadiusM(OriginLatDeg) * Math.PI / 180;

    /// <summary>The corner in WGS84 longitude/latitude, with no crs member (RFC 7946).</summary>
    public static JsonObject Wgs84() => Build(LonLat);

    /// <summary>The corner drawn in local metres, with <c>"frame": "local-metres"</c>.</summary>
    public static JsonObject LocalMetres()
    {
        var plan = Build((x, y) => [x, y]);
        plan["frame"] = "local-metres";
        return plan;
    }

    /// <summary>A WGS84 position (longitude, latitude) for a point so many metres east and north of the origin.</summary>
    public static JsonArray LonLat(double eastM, double northM) =>
        [OriginLonDeg + (eastM / MetresPerDegreeLon), OriginLatDeg + (northM / MetresPerDegreeLat)];

    /// <summary>The JSON element Core is given.</summary>
    public static JsonElement Element(JsonNode node) => JsonSerializer.SerializeToElement(node);

    /// <summary>Reads the plan with the default limits.</summary>
    public static SitePlanReadResult Read(JsonNode node, SitePlanLimits? limits = null) => SitePlanReader.Read(Element(node), limits);

    /// <summary>A feature with the given role, properties and geometry.</summary>
    public static JsonObject Feature(string role, JsonObject geometry, JsonObject? properties = null, JsonNode? id = null)
    {
        properties ??= new JsonObject();
        properties["role"] = role;
        var feature = new JsonObject { ["type"] = "Feature" };
        if (id is not null)
        {
            feature["id"] = id;
        }

        feature["properties"] = properties;
        feature["geometry"] = geometry;
        return feature;
    }

    public static JsonObject Geometry(string type, JsonNode coordinates) => new() { ["type"] = type, ["coordinates"] = coordinates };

    public static JsonArray Rectangle(Func<double, double, JsonArray> position, double west, double south, double east, double north) =>
    [
        new JsonArray(position(west, south), position(east, south), position(east, north), position(west, north), position(west, south)),
    ];

    private static JsonObject Build(Func<double, double, JsonArray> at) => new()
    {
        ["type"] = "FeatureCollection",
        ["features"] = new JsonArray(
            Feature("eye", Geometry("Point", at(1.5, -4.4)), new() { ["name"] = "Quillby Yard exit" }, id: "eye-1"),
            Feature("approach", Geometry("LineString", new JsonArray(at(-60, 1.75), at(-20, 1.75), at(1.5, 1.75))),
                new() { ["name"] = "Harrow Fold Road eastbound", ["speedKmh"] = 50 }, id: 11),
            Feature("approach", Geometry("LineString", new JsonArray(at(60, 5.25), at(1.5, 5.25))),
                new() { ["name"] = "Harrow Fold Road westbound", ["speedKmh"] = 50, ["gradePercent"] = -2.5 }, id: 12),
            Feature("obstacle", Geometry("Polygon", Rectangle(at, -30, -1, -1, -0.5)), new() { ["name"] = "Garden wall", ["heightM"] = 1.8 }),
            Feature("obstacle", Geometry("Polygon", Rectangle(at, 4, -1.2, 30, -0.4)), new() { ["name"] = "Beech hedge", ["heightM"] = 1.5 }),
            Feature("mounting-zone", Geometry("LineString", new JsonArray(at(-5, 8.5), at(8, 8.5))), new() { ["name"] = "North footway verge" }),
            Feature("carriageway", Geometry("Polygon", Rectangle(at, -60, 0, 60, 7))),
            Feature("footway", Geometry("Polygon", Rectangle(at, -60, 7, 60, 9.5)))),
    };
}
