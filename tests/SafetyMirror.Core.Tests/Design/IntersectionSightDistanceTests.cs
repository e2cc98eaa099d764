using SafetyMirror.Core.Design;

namespace SafetyMirror.Core.Tests.Design;

public class IntersectionSightDistanceTests
{
    [Theory]
    // AASHTO Green Book 2011, ISD time gaps for cases B1 and B2/B3, as quoted in TxDOT Roadway Design Manual §13.5.2.
    [InlineData(IntersectionManeuver.TurnAcrossTraffic, DepartingVehicle.PassengerCar, 7.5)]
    [InlineData(IntersectionManeuver.TurnAcrossTraffic, DepartingVehicle.SingleUnitTruck, 9.5)]
    [InlineData(IntersectionManeuver.TurnAcrossTraffic, DepartingVehicle.CombinationTruck, 11.5)]
    [InlineData(IntersectionManeuver.TurnIntoNearLane, DepartingVehicle.PassengerCar, 6.5)]
    [InlineData(IntersectionManeuver.TurnIntoNearLane, DepartingVehicle.SingleUnitTruck, 8.5)]
    [InlineData(IntersectionManeuver.TurnIntoNearLane, DepartingVehicle.CombinationTruck, 10.5)]
    [InlineData(IntersectionManeuver.CrossingFromStop, DepartingVehicle.PassengerCar, 6.5)]
    [InlineData(IntersectionManeuver.CrossingFromStop, DepartingVehicle.SingleUnitTruck, 8.5)]
    [InlineData(IntersectionManeuver.CrossingFromStop, DepartingVehicle.CombinationTruck, 10.5)]
    public void TimeGapS_NoExtraLanes_IsThePublishedGap(IntersectionManeuver maneuver, DepartingVehicle vehicle, double gapS) =>
        Assert.Equal(gapS, new IntersectionSightDistance(maneuver, vehicle).TimeGapS);

    [Fact]
    public void Required_LeftTurnCarAt50_Is104Point25Metres()
    {
        // AASHTO Green Book 2011, Eq. 9-1 [memory], by hand: 0.278·50·7.5 = 104.25 m; Table 9-6 design value 105 m [memory].
        var required = new IntersectionSightDistance().Required(50);
        Assert.Equal(104.25, required.ComputedM, 1e-9);
        Assert.Equal(105, required.DesignM);
    }

    [Theory]
    // AASHTO Green Book 2011, Table 9-6, B1 passenger car design ISD [memory]: 0.278·V·7.5 rounded up to 5 m.
    [InlineData(20, 45)]
    [InlineData(60, 130)]
    [InlineData(100, 210)]
    public void Required_LeftTurnCar_ReproducesDesignTable(double speedKmh, double designM) =>
        Assert.Equal(designM, new IntersectionSightDistance().Required(speedKmh).DesignM);

    [Theory]
    // AASHTO Green Book 2011, Table 9-8, B2/B3 passenger car design ISD [memory]: 0.278·V·6.5 rounded up to 5 m.
    [InlineData(30, 55)]
    [InlineData(50, 95)]
    [InlineData(60, 110)]
    public void Required_CrossingCar_ReproducesDesignTable(double speedKmh, double designM) =>
        Assert.Equal(designM, new IntersectionSightDistance(IntersectionManeuver.CrossingFromStop).Required(speedKmh).DesignM);

    [Fact]
    public void TimeGapS_ExtraLanesForCar_AddsHalfSecondEach()
    {
        // AASHTO Green Book 2011: +0.5 s per extra lane for passenger cars, via TxDOT RDM §13.5.2.
        var isd = new IntersectionSightDistance(IntersectionManeuver.TurnAcrossTraffic, DepartingVehicle.PassengerCar, 2);
        Assert.Equal(8.5, isd.TimeGapS, 1e-12);
        Assert.Equal(0.278 * 50 * 8.5, isd.Required(50).ComputedM, 1e-9);
    }

    [Fact]
    public void TimeGapS_ExtraLaneForTruck_AddsPointSevenSecondsEach()
    {
        // AASHTO Green Book 2011: +0.7 s per extra lane for trucks, via TxDOT RDM §13.5.2.
        var isd = new IntersectionSightDistance(IntersectionManeuver.CrossingFromStop, DepartingVehicle.CombinationTruck, 3);
        Assert.Equal(12.6, isd.TimeGapS, 1e-12);
    }

    [Fact]
    public void Required_Any_UsesIsdObjectHeight()
    {
        // AASHTO Green Book 2011, ch. 9: eye and object both 1.08 m for intersection sight distance [memory].
        var required = new IntersectionSightDistance().Required(60);
        Assert.Equal((1.08, 1.08), (required.EyeHeightM, required.ObjectHeightM));
    }

    [Fact]
    public void Required_Grade_DoesNotChangeTheDistance() =>
        Assert.Equal(new IntersectionSightDistance().Required(60).ComputedM, new IntersectionSightDistance().Required(60, -8).ComputedM);

    [Theory]
    [InlineData(-1)]
    [InlineData(11)]
    public void Constructor_ExtraLanesOutOfRange_ThrowsStatingTheRange(int lanes)
    {
        var error = Assert.Throws<ArgumentOutOfRangeException>(
            () => new IntersectionSightDistance(IntersectionManeuver.CrossingFromStop, DepartingVehicle.PassengerCar, lanes));
        Assert.Contains("from 0 to 10 lanes", error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Constructor_TurnIntoNearLaneWithExtraLanes_Throws()
    {
        var error = Assert.Throws<ArgumentOutOfRangeException>(
            () => new IntersectionSightDistance(IntersectionManeuver.TurnIntoNearLane, DepartingVehicle.PassengerCar, 1));
        Assert.Equal("extraLanesCrossed", error.ParamName);
    }

    [Fact]
    public void Constructor_UndefinedVehicle_ThrowsListingTheChoices()
    {
        var error = Assert.Throws<ArgumentOutOfRangeException>(() => new IntersectionSightDistance(vehicle: (DepartingVehicle)7));
        Assert.Contains("PassengerCar, SingleUnitTruck, CombinationTruck", error.Message, StringComparison.Ordinal);
    }

    // AASHTO Green Book 2011, Table 9-6 (case B1, left turn from stop, passenger car 7.5 s) and Table 9-8 (case B2, right
    // turn from stop, passenger car 6.5 s) [memory for the table numbers]; the cases are defined by the manoeuvre, so
    // where traffic keeps left the left turn is the turn into the near lane.
    [Theory]
    [InlineData(true, DrivingSide.Right, 7.5)]
    [InlineData(false, DrivingSide.Right, 6.5)]
    [InlineData(true, DrivingSide.Left, 6.5)]
    [InlineData(false, DrivingSide.Left, 7.5)]
    public void Turn_OnEitherDrivingSide_TakesTheTimeGapOfItsManoeuvre(bool leftTurn, DrivingSide side, double timeGapS)
    {
        var isd = new IntersectionSightDistance(IntersectionManeuvers.Turn(leftTurn, side));
        Assert.Equal(timeGapS, isd.TimeGapS, 9);
    }
}
