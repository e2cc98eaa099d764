using NetTopologySuite.Geometries;
using SafetyMirror.Core.Design;
using SafetyMirror.Core.Site;

namespace SafetyMirror.Core.Tests.Design;

public class SightDistanceMethodTests
{
    private static readonly LineString Lane = new GeometryFactory().CreateLineString([new Coordinate(-200, 1.5), new Coordinate(0, 1.5)]);

    [Fact]
    public void Required_ApproachGivenInMph_PutsTheMphIntoTheCustomaryFormulaUnchanged()
    {
        var approach = Approach.WithSpeedMph(Lane, 35, 0, new FeatureReference(1));

        var required = StoppingSightDistance.UsCustomary().Required(approach);

        Assert.Equal((35.0, 250.0), (required.UsCustomary!.SpeedMph, required.UsCustomary.DesignFt)); // AASHTO Green Book 2011, Table 3-1, US customary [memory]
    }

    [Fact]
    public void Required_ApproachGivenInMph_GivesTheMetricMethodItsExactConversion()
    {
        // 35 mph = 56.32704 km/h (1 mile = 1.609344 km exactly).
        var approach = Approach.WithSpeedMph(Lane, 35, 0, new FeatureReference(1));

        Assert.Equal(new StoppingSightDistance().Required(56.32704).DesignM, new StoppingSightDistance().Required(approach).DesignM);
    }

    [Fact]
    public void Required_ApproachGivenInKmh_IsTheMethodAtThatSpeedAndGrade()
    {
        var approach = new Approach(Lane, 50, -3, new FeatureReference(1));

        Assert.Equal(new StoppingSightDistance().Required(50, -3), new StoppingSightDistance().Required(approach));
    }
}
