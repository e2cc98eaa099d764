using System.Text.Json.Nodes;
using NetTopologySuite.Geometries;
using ProjNet.CoordinateSystems.Transformations;
using SafetyMirror.Core.Site;

namespace SafetyMirror.Core.Tests.Site;

public class SitePlanReaderTests
{
    [Fact]
    public void Read_DemoCorner_ReadsEveryRole()
    {
        var plan = ReadPlan(DemoCorner.Wgs84());

        Assert.Equal(
            (1, 2, 2, 1, 1, 1),
            (plan.Eyes.Length, plan.Approaches.Length, plan.Obstacles.Length, plan.MountingZones.Length, plan.Carriageways.Length, plan.Footways.Length));
    }

    [Fact]
    public void Read_EyeWithoutHeight_UsesTheAashtoPassengerCarEyeHeight()
    {
        var plan = ReadPlan(DemoCorner.Wgs84());

        Assert.Equal(1.08, plan.Eyes[0].HeightM); // AASHTO Green Book 2011: passenger-car driver eye height 1.08 m [memory]
    }

    [Fact]
    public void Read_EyeWithHeight_UsesIt()
    {
        var json = DemoCorner.Wgs84();
        json["features"]![0]!["properties"]!["eyeHeightM"] = 2.33;

        Assert.Equal(2.33, ReadPlan(json).Eyes[0].HeightM);
    }

    [Fact]
    public void Read_ApproachWithoutGrade_IsLevel()
    {
        var plan = ReadPlan(DemoCorner.Wgs84());

        Assert.Equal((0, -2.5), (plan.Approaches[0].GradePercent, plan.Approaches[1].GradePercent));
    }

    [Fact]
    public void Read_ApproachProperties_AreKept()
    {
        var approach = ReadPlan(DemoCorner.Wgs84()).Approaches[1];

        Assert.Equal((50.0, new FeatureReference(2, "12", "Harrow Fold Road westbound")), (approach.SpeedKmh, approach.Feature));
    }

    [Fact]
    public void Read_ApproachSpeedInMph_KeepsItAsGivenAndConvertsItExactly()
    {
        var json = DemoCorner.Wgs84();
        var properties = json["features"]![1]!["properties"]!.AsObject();
        properties.Remove("speedKmh");
        properties["speedMph"] = 35;

        var approach = ReadPlan(json).Approaches[0];

        // 1 mile = 1.609344 km exactly (international yard and pound agreement, 1959).
        Assert.Equal((35.0, 35 * 1.609344), (approach.SpeedMph, approach.SpeedKmh));
    }

    [Fact]
    public void Read_ApproachSpeedInKmh_HasNoMphValue() =>
        Assert.Null(ReadPlan(DemoCorner.Wgs84()).Approaches[0].SpeedMph);

    [Fact]
    public void Read_ObstacleProperties_AreKept()
    {
        var wall = ReadPlan(DemoCorner.Wgs84()).Obstacles[0];

        Assert.Equal((1.8, new FeatureReference(3, null, "Garden wall")), (wall.HeightM, wall.Feature));
    }

    [Fact]
    public void Read_StringFeatureId_IsKept()
    {
        Assert.Equal("eye-1", ReadPlan(DemoCorner.Wgs84()).Eyes[0].Feature.Id);
    }

    [Fact]
    public void Read_Wgs84Plan_IsCentredOnTheMeanOfItsPositions()
    {
        var plan = ReadPlan(DemoCorner.Wgs84());
        var everyPosition = DemoCorner.Wgs84()["features"]!.AsArray()
            .SelectMany(feature => Positions(feature!["geometry"]!["coordinates"]!))
            .ToList();

        var origin = plan.Frame.OriginLonLat!;

        Assert.Equal(everyPosition.Average(p => p.Lon), origin.X, 1e-12);
        Assert.Equal(everyPosition.Average(p => p.Lat), origin.Y, 1e-12);
    }

    [Fact]
    public void Read_Wgs84Plan_GivesLocalGeometryInMetres()
    {
        // The demo is laid out with the ellipsoid's radii at its origin, good to about 1e-5 over its 120 m.
        var plan = ReadPlan(DemoCorner.Wgs84());

        Assert.Equal(61.5, plan.Approaches[0].LengthM, 0.005);
    }

    [Fact]
    public void Read_LocalMetresPlan_UsesTheCoordinatesAsDrawn()
    {
        var plan = ReadPlan(DemoCorner.LocalMetres());

        Assert.Equal((1.5, -4.4, 1.08), (plan.Eyes[0].Position.X, plan.Eyes[0].Position.Y, plan.Eyes[0].Position.Z));
        Assert.Equal(61.5, plan.Approaches[0].LengthM, 12);
        Assert.Same(PlanFrame.LocalMetres, plan.Frame);
    }

    [Theory]
    [InlineData("urn:ogc:def:crs:EPSG::32632")]
    [InlineData("EPSG:32632")]
    public void Read_UtmNamedPlan_GivesTheSameLocalGeometryAsTheWgs84Plan(string crsName)
    {
        var fromWgs84 = ReadPlan(DemoCorner.Wgs84());
        var fromUtm = ReadPlan(InUtmZone32(DemoCorner.Wgs84(), crsName));

        var distances = LocalCoordinates(fromWgs84).Zip(LocalCoordinates(fromUtm), (a, b) => a.Distance(b)).ToList();

        Assert.Equal(LocalCoordinates(fromWgs84).Count(), distances.Count);
        Assert.True(distances.Max() < 0.01, $"largest difference {distances.Max()} m");
    }

    [Theory]
    [InlineData("urn:ogc:def:crs:OGC:1.3:CRS84")]
    [InlineData("EPSG:4326")]
    public void Read_PlanNamingWgs84_ReadsLongitudeThenLatitude(string crsName)
    {
        var json = DemoCorner.Wgs84();
        json["crs"] = new JsonObject { ["type"] = "name", ["properties"] = new JsonObject { ["name"] = crsName } };

        var origin = ReadPlan(json).Frame.OriginLonLat!;

        Assert.Equal((DemoCorner.OriginLonDeg, DemoCorner.OriginLatDeg), (Math.Round(origin.X, 3), Math.Round(origin.Y, 3)));
    }

    [Fact]
    public void Read_UtmNamedPlan_MapsLocalPointsBackToUtm()
    {
        var json = InUtmZone32(DemoCorner.Wgs84(), "EPSG:32632");
        var eyeInUtm = json["features"]![0]!["geometry"]!["coordinates"]!;
        var plan = ReadPlan(json);

        var back = plan.Frame.ToPlan(new Coordinate(plan.Eyes[0].Position.X, plan.Eyes[0].Position.Y));

        Assert.True(back.Distance(new Coordinate((double)eyeInUtm[0]!, (double)eyeInUtm[1]!)) < 1e-6, back.ToString());
    }

    [Fact]
    public void Read_PlanWithAltitudes_GivesTwoDimensionalLocalGeometry()
    {
        var json = DemoCorner.Wgs84();
        json["features"]![4]!["geometry"]!["coordinates"]![0]!.AsArray().ToList().ForEach(p => p!.AsArray().Add(212.5));

        var hedge = ReadPlan(json).Obstacles[1].Footprint;

        Assert.All(hedge.Coordinates, c => Assert.True(double.IsNaN(c.Z)));
    }

    [Fact]
    public void Read_GeometryMembersInAnyOrder_AreRead()
    {
        var json = DemoCorner.LocalMetres();
        json["features"]![0]!["geometry"] = new JsonObject { ["coordinates"] = new JsonArray(1.5, -4.4), ["type"] = "Point" };

        Assert.True(DemoCorner.Read(json).Succeeded);
    }

    [Fact]
    public void Read_MultiPolygonObstacle_IsRead()
    {
        var json = DemoCorner.LocalMetres();
        json["features"]![3]!["geometry"] = DemoCorner.Geometry("MultiPolygon", new JsonArray(
            DemoCorner.Rectangle((x, y) => [x, y], -30, -1, -20, -0.5),
            DemoCorner.Rectangle((x, y) => [x, y], -15, -1, -1, -0.5)));

        Assert.Equal(2, ReadPlan(json).Obstacles[0].Footprint.NumGeometries);
    }

    private static SitePlan ReadPlan(JsonNode json)
    {
        var result = DemoCorner.Read(json);
        Assert.True(result.Succeeded, string.Join("; ", result.Problems));
        return result.Plan;
    }

    /// <summary>The plan with every position in UTM zone 32N, from ProjNET's built-in UTM definition, and the crs named.</summary>
    private static JsonObject InUtmZone32(JsonObject plan, string crsName)
    {
        var toUtm = ReferenceUtm.FromWgs84(32, north: true);
        foreach (var feature in plan["features"]!.AsArray())
        {
            ToUtm(feature!["geometry"]!["coordinates"]!.AsArray(), toUtm);
        }

        plan["crs"] = new JsonObject { ["type"] = "name", ["properties"] = new JsonObject { ["name"] = crsName } };
        return plan;
    }

    private static void ToUtm(JsonArray coordinates, MathTransform toUtm)
    {
        if (coordinates[0] is JsonValue)
        {
            var (x, y) = toUtm.Transform((double)coordinates[0]!, (double)coordinates[1]!);
            (coordinates[0], coordinates[1]) = (x, y);
            return;
        }

        foreach (var inner in coordinates)
        {
            ToUtm(inner!.AsArray(), toUtm);
        }
    }

    private static IEnumerable<Coordinate> LocalCoordinates(SitePlan plan) =>
        plan.Eyes.Select(eye => new Coordinate(eye.Position.X, eye.Position.Y))
            .Concat(plan.Approaches.SelectMany(approach => approach.Line.Coordinates))
            .Concat(plan.Obstacles.SelectMany(obstacle => obstacle.Footprint.Coordinates))
            .Concat(plan.MountingZones.SelectMany(zone => zone.Zone.Coordinates))
            .Concat(plan.Carriageways.SelectMany(area => area.Area.Coordinates))
            .Concat(plan.Footways.SelectMany(area => area.Area.Coordinates));

    private static IEnumerable<(double Lon, double Lat)> Positions(JsonNode coordinates) =>
        coordinates.AsArray()[0] is JsonValue
            ? [((double)coordinates[0]!, (double)coordinates[1]!)]
            : coordinates.AsArray().SelectMany(inner => Positions(inner!));
}
