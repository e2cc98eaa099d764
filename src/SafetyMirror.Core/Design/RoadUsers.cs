namespace SafetyMirror.Core.Design;

/// <summary>The default design road users, and lookup by id.</summary>
public static class RoadUsers
{
    private const string AashtoDesignVehicle = "AASHTO Green Book 2011, metric design vehicle";

    /// <summary>Passenger car, AASHTO design vehicle P: 1.3 m high, 2.1 m wide, 5.8 m long.</summary>
    public static RoadUser PassengerCar { get; } =
        new("passenger-car", "Passenger car", 1.3, 2.1, 5.8, isVulnerable: false, $"{AashtoDesignVehicle} P");

    /// <summary>Single-unit truck, AASHTO design vehicle SU: 3.4 m high, 2.4 m wide, 9.2 m long.</summary>
    public static RoadUser SingleUnitTruck { get; } =
        new("single-unit-truck", "Single-unit truck", 3.4, 2.4, 9.2, isVulnerable: false, $"{AashtoDesignVehicle} SU (height 3.4–4.1 m; the lowest is taken)");

    /// <summary>City bus, AASHTO design vehicle CITY-BUS: 3.2 m high, 2.6 m wide, 12.2 m long.</summary>
    public static RoadUser CityBus { get; } =
        new("city-bus", "City bus", 3.2, 2.6, 12.2, isVulnerable: false, $"{AashtoDesignVehicle} CITY-BUS");

    /// <summary>Bicycle with rider: 1.7 m high, 0.61 m wide, 1.8 m long.</summary>
    public static RoadUser Bicycle { get; } =
        new("bicycle", "Bicycle with rider", 1.7, 0.61, 1.8, isVulnerable: true,
            "width 0.61 m: MnDOT Bikeway Facility Design Manual, ch. 3; rider height 1.7 m and length 1.8 m [memory]");

    /// <summary>Motorcycle with rider: 1.4 m high, 0.8 m wide, 2.2 m long.</summary>
    public static RoadUser Motorcycle { get; } =
        new("motorcycle", "Motorcycle with rider", 1.4, 0.8, 2.2, isVulnerable: true,
            "width 0.8 m, height with rider 1.4 m, length 2.2 m [memory]");

    /// <summary>Pedestrian: 1.7 m high, 0.5 m wide, 0.45 m deep.</summary>
    public static RoadUser Pedestrian { get; } =
        new("pedestrian", "Pedestrian", 1.7, 0.5, 0.45, isVulnerable: true,
            "adult height 1.7 m, shoulder width 0.5 m, body depth 0.45 m: common practice [memory]");

    /// <summary>The default road users, motor vehicles first.</summary>
    public static IReadOnlyList<RoadUser> Defaults { get; } = [PassengerCar, SingleUnitTruck, CityBus, Bicycle, Motorcycle, Pedestrian];

    /// <summary>The default road user with this id, or null when there is none.</summary>
    /// <remarks>Ids match exactly (ordinal, case-sensitive).</remarks>
    public static RoadUser? Find(string id) => Defaults.FirstOrDefault(user => user.Id == id);
}
