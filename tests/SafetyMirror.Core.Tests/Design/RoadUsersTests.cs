using SafetyMirror.Core.Design;

namespace SafetyMirror.Core.Tests.Design;

public class RoadUsersTests
{
    [Theory]
    // AASHTO Green Book 2011, metric design vehicles P, SU and CITY-BUS (domain notes §4).
    [InlineData("passenger-car", 1.3, 2.1, 5.8)]
    [InlineData("single-unit-truck", 3.4, 2.4, 9.2)]
    [InlineData("city-bus", 3.2, 2.6, 12.2)]
    // Width 0.61 m: MnDOT Bikeway Facility Design Manual, ch. 3; height and length [memory].
    [InlineData("bicycle", 1.7, 0.61, 1.8)]
    // [memory]
    [InlineData("motorcycle", 1.4, 0.8, 2.2)]
    // Common practice [memory].
    [InlineData("pedestrian", 1.7, 0.5, 0.45)]
    public void Find_DefaultId_ReturnsItsDimensions(string id, double heightM, double widthM, double lengthM)
    {
        var user = RoadUsers.Find(id);
        Assert.NotNull(user);
        Assert.Equal((heightM, widthM, lengthM), (user.HeightM, user.WidthM, user.LengthM));
    }

    [Theory]
    [InlineData("tractor")]
    [InlineData("Passenger-Car")]
    [InlineData("")]
    public void Find_UnknownId_ReturnsNull(string id) => Assert.Null(RoadUsers.Find(id));

    [Fact]
    public void Defaults_Ids_AreUnique() =>
        Assert.Equal(RoadUsers.Defaults.Count, RoadUsers.Defaults.Select(user => user.Id).Distinct().Count());

    [Theory]
    // Bicycle width 0.61 m (MnDOT Bikeway Facility Design Manual, ch. 3); car width 2.1 m is above its height 1.3 m (AASHTO P).
    [InlineData("bicycle", 0.61)]
    [InlineData("passenger-car", 1.3)]
    public void SmallestDimensionM_Default_IsTheSmallerOfHeightAndWidth(string id, double smallestM) =>
        Assert.Equal(smallestM, RoadUsers.Find(id)!.SmallestDimensionM);

    [Fact]
    public void Defaults_VulnerableUsers_AreThePedestrianAndRiders() =>
        Assert.Equal(["bicycle", "motorcycle", "pedestrian"], RoadUsers.Defaults.Where(user => user.IsVulnerable).Select(user => user.Id));

    [Fact]
    public void Constructor_ValidCustom_KeepsItsValues()
    {
        // Invented road user for a demo: a cargo tricycle.
        var trike = new RoadUser("cargo-tricycle", "Cargo tricycle", 1.6, 0.9, 2.4, isVulnerable: true, "measured on site");
        Assert.Equal((0.9, true), (trike.SmallestDimensionM, trike.IsVulnerable));
    }

    [Theory]
    [InlineData(0.09, 1, 1)]
    [InlineData(1, 30.01, 1)]
    [InlineData(1, 1, 1300)]
    public void Constructor_DimensionOutOfRange_ThrowsStatingTheRange(double heightM, double widthM, double lengthM)
    {
        var error = Assert.Throws<ArgumentOutOfRangeException>(() => new RoadUser("odd", "Odd", heightM, widthM, lengthM, false, "test"));
        Assert.Contains("from 0.1 to 30 m", error.Message, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData(0.1)]
    [InlineData(30)]
    public void Constructor_DimensionAtTheBounds_IsAccepted(double sizeM) =>
        Assert.Equal(sizeM, new RoadUser("edge", "Edge", sizeM, sizeM, sizeM, false, "test").HeightM);

    [Theory]
    [InlineData("Passenger car")]
    [InlineData("city_bus")]
    [InlineData("-bus")]
    [InlineData("city--bus")]
    public void Constructor_IdNotKebabCase_Throws(string id)
    {
        var error = Assert.Throws<ArgumentException>(() => new RoadUser(id, "Name", 1, 1, 1, false, "test"));
        Assert.Equal("id", error.ParamName);
    }
}
