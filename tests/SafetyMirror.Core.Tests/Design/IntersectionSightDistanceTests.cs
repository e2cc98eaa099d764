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

    [Theory]
    // AASHTO Green Book 2011, Table 9-6, case B1 (left turn from stop), passenger car, US customary design ISD [memory];
    // each value checked by hand against 1.47·V·7.5 rounded up to the next 5 ft (35 mph: 385.9 ft → 390 ft).
    [InlineData(15, 170)]
    [InlineData(20, 225)]
    [InlineData(25, 280)]
    [InlineData(30, 335)]
    [InlineData(35, 390)]
    [InlineData(40, 445)]
    [InlineData(45, 500)]
    [InlineData(50, 555)]
    [InlineData(55, 610)]
    [InlineData(60, 665)]
    [InlineData(65, 720)]
    [InlineData(70, 775)]
    [InlineData(75, 830)]
    [InlineData(80, 885)]
    public void RequiredAtMph_UsCustomaryLeftTurnCar_ReproducesDesignTable(double speedMph, double designFt) =>
        Assert.Equal(designFt, new IntersectionSightDistance(units: DesignUnits.UsCustomary).RequiredAtMph(speedMph).UsCustomary!.DesignFt);

    [Theory]
    // AASHTO Green Book 2011, Table 9-8, cases B2 and B3 (right turn from stop, crossing), passenger car, US customary
    // design ISD [memory]; each value checked by hand against 1.47·V·6.5 rounded up to the next 5 ft (45 mph: 429.975 ft → 430 ft).
    [InlineData(IntersectionManeuver.TurnIntoNearLane, 15, 145)]
    [InlineData(IntersectionManeuver.TurnIntoNearLane, 20, 195)]
    [InlineData(IntersectionManeuver.TurnIntoNearLane, 25, 240)]
    [InlineData(IntersectionManeuver.TurnIntoNearLane, 30, 290)]
    [InlineData(IntersectionManeuver.TurnIntoNearLane, 35, 335)]
    [InlineData(IntersectionManeuver.TurnIntoNearLane, 40, 385)]
    [InlineData(IntersectionManeuver.TurnIntoNearLane, 45, 430)]
    [InlineData(IntersectionManeuver.TurnIntoNearLane, 50, 480)]
    [InlineData(IntersectionManeuver.CrossingFromStop, 55, 530)]
    [InlineData(IntersectionManeuver.CrossingFromStop, 60, 575)]
    [InlineData(IntersectionManeuver.CrossingFromStop, 65, 625)]
    [InlineData(IntersectionManeuver.CrossingFromStop, 70, 670)]
    [InlineData(IntersectionManeuver.CrossingFromStop, 75, 720)]
    [InlineData(IntersectionManeuver.CrossingFromStop, 80, 765)]
    public void RequiredAtMph_UsCustomaryRightTurnOrCrossingCar_ReproducesDesignTable(IntersectionManeuver maneuver, double speedMph, double designFt) =>
        Assert.Equal(designFt, new IntersectionSightDistance(maneuver, units: DesignUnits.UsCustomary).RequiredAtMph(speedMph).UsCustomary!.DesignFt);

    [Fact]
    public void RequiredAtMph_UsCustomaryCombinationTruck_ComputesTheFormula()
    {
        // AASHTO Green Book 2011, Eq. 9-1, US customary [memory], by hand: 1.47·40·11.5 = 676.2 ft, designed for 680 ft.
        var required = new IntersectionSightDistance(vehicle: DepartingVehicle.CombinationTruck, units: DesignUnits.UsCustomary).RequiredAtMph(40);
        Assert.Equal(676.2, required.UsCustomary!.ComputedFt, 1e-9);
        Assert.Equal(680, required.UsCustomary.DesignFt);
    }

    [Fact]
    public void RequiredAtMph_UsCustomary_SaysWhichSystemFormulaAndTableGaveIt()
    {
        var required = new IntersectionSightDistance(units: DesignUnits.UsCustomary).RequiredAtMph(35);
        Assert.Equal((DesignUnits.UsCustomary, "1.47·V·t_g", "Table 9-6"), (required.Units, required.Formula, required.Table));
    }

    [Fact]
    public void Required_UsCustomary_UsesCustomaryEyeAndObjectHeights()
    {
        // AASHTO Green Book 2011, ch. 9, US customary: driver's eye and object both 3.5 ft [memory]; 1 ft = 0.3048 m.
        var required = new IntersectionSightDistance(units: DesignUnits.UsCustomary).RequiredAtMph(35);
        Assert.Equal(1.0668, required.EyeHeightM, 1e-12);
        Assert.Equal(1.0668, required.ObjectHeightM, 1e-12);
    }
}
