using System.Text.Json;
using NetTopologySuite.Geometries;
using SafetyMirror.Api.Requests;
using SafetyMirror.Core.Design;
using SafetyMirror.Core.Design.Evaluation;
using SafetyMirror.Core.Optics;
using SafetyMirror.Core.Site;

namespace SafetyMirror.Api.Requests;

/// <summary>Turns request contracts into the Core's plan, mirror and options, recording every problem under its path.</summary>
public static class CornerRequestReader
{
    /// <summary>The manoeuvres by their contract names.</summary>
    internal static readonly Dictionary<string, IntersectionManeuver> Maneuvers = new()
    {
        ["turn-across-traffic"] = IntersectionManeuver.TurnAcrossTraffic,
        ["turn-into-near-lane"] = IntersectionManeuver.TurnIntoNearLane,
        ["crossing-from-stop"] = IntersectionManeuver.CrossingFromStop,
    };

    /// <summary>Turns named by their direction: true for a left turn.</summary>
    private static readonly Dictionary<string, bool> Turns = new()
    {
        ["left-turn-from-stop"] = true,
        ["right-turn-from-stop"] = false,
    };

    private static readonly Dictionary<string, DrivingSide> DrivingSides = new()
    {
        ["right"] = DrivingSide.Right,
        ["left"] = DrivingSide.Left,
    };

    internal static readonly Dictionary<string, DepartingVehicle> Vehicles = new()
    {
        ["passenger-car"] = DepartingVehicle.PassengerCar,
        ["single-unit-truck"] = DepartingVehicle.SingleUnitTruck,
        ["combination-truck"] = DepartingVehicle.CombinationTruck,
    };

    /// <summary>Reads the plan; problems are recorded under <c>plan…</c>.</summary>
    public static SitePlan? ReadPlan(JsonElement plan, SitePlanLimits limits, RequestErrors errors)
    {
        var read = SitePlanReader.Read(plan, limits);
        foreach (var problem in read.Problems)
        {
            errors.Add(PlanPath(problem.Path), problem.Message);
        }

        return read.Plan;
    }

    /// <summary>Records the Core's problems under request paths: those inside the plan (<c>features…</c>) go under <c>plan</c>, the rest as they are.</summary>
    public static void AddProblems(IEnumerable<SitePlanProblem> problems, RequestErrors errors)
    {
        ArgumentNullException.ThrowIfNull(problems);
        ArgumentNullException.ThrowIfNull(errors);
        foreach (var problem in problems)
        {
            errors.Add(problem.Path.StartsWith("features", StringComparison.Ordinal) ? PlanPath(problem.Path) : problem.Path, problem.Message);
        }
    }

    /// <summary>The request path of a path inside the plan.</summary>
    public static string PlanPath(string pathInPlan) => pathInPlan.Length == 0 ? "plan" : $"plan.{pathInPlan}";

    /// <summary>The design units by their contract names.</summary>
    internal static readonly Dictionary<string, DesignUnits> Units = new()
    {
        ["metric"] = DesignUnits.Metric,
        ["us-customary"] = DesignUnits.UsCustomary,
    };

    /// <summary>Reads the options, defaults filled in; problems are recorded under <c>options…</c>.</summary>
    /// <remarks><paramref name="defaultUnits"/> are the sight distance's units when the request names none (an imperial
    /// report's are US customary).</remarks>
    public static EvaluationOptions ReadOptions(CornerOptionsRequest? request, RequestErrors errors, DesignUnits defaultUnits = DesignUnits.Metric)
    {
        var defaults = new EvaluationOptions
        {
            SightDistance = defaultUnits == DesignUnits.UsCustomary ? StoppingSightDistance.UsCustomary() : new StoppingSightDistance(),
        };
        if (request is null)
        {
            return defaults;
        }

        var recognition = errors.Within(request.RecognitionArcmin, Ranges.MinThresholdArcmin, Ranges.MaxThresholdArcmin, "arcmin",
            "options.recognitionArcmin", defaults.Vision.Recognition.AngleArcmin);
        var detection = errors.Within(request.DetectionArcmin, Ranges.MinThresholdArcmin, Ranges.MaxThresholdArcmin, "arcmin",
            "options.detectionArcmin", defaults.Vision.Detection.AngleArcmin);
        var vision = defaults.Vision;
        if (detection > recognition)
        {
            errors.Add("options.detectionArcmin", $"Must not be above the recognition threshold ({recognition} arcmin); it was {detection}.");
        }
        else if (request.RecognitionArcmin is not null || request.DetectionArcmin is not null)
        {
            vision = new VisionCriteria(
                request.RecognitionArcmin is null ? defaults.Vision.Recognition : new VisualThreshold(recognition, "set in the request"),
                request.DetectionArcmin is null ? defaults.Vision.Detection : new VisualThreshold(detection, "set in the request"));
        }

        if (request.StationsM is { Count: > Ranges.MaxStations })
        {
            errors.Add("options.stationsM", $"At most {Ranges.MaxStations} stations; {request.StationsM.Count} were given.");
        }

        var stations = request.StationsM?
            .Select((s, i) => errors.Within(s, 0, Ranges.MaxDistanceM, "m", $"options.stationsM[{i}]", 0))
            .ToList();
        if (request.EyeIndex is < 0 or > Ranges.MaxEyeIndex)
        {
            errors.Add("options.eyeIndex", $"Must be from 0 to {Ranges.MaxEyeIndex}; it was {request.EyeIndex}.");
        }

        var side = Lookup(DrivingSides, request.DrivingSide, DrivingSide.Right, "options.drivingSide", errors);
        var roadUsers = ReadRoadUsers(request.RoadUsers, errors) ?? defaults.RoadUsers;
        return defaults with
        {
            SightDistance = ReadSightDistance(request.SightDistance, side, defaultUnits, errors) ?? defaults.SightDistance,
            RoadUsers = roadUsers,
            DecisiveRoadUsers = ReadDecisive(request.DecisiveRoadUsers, roadUsers, errors),
            MaxUnseenStretchM = errors.Within(request.MaxUnseenStretchM, 0, Ranges.MaxUnseenStretchM, "m", "options.maxUnseenStretchM", defaults.MaxUnseenStretchM),
            AimToleranceDeg = errors.Within(request.AimToleranceDeg, 0, Ranges.MaxAimToleranceDeg, "degrees", "options.aimToleranceDeg", defaults.AimToleranceDeg),
            MinMargin = errors.Within(request.MinMargin, Ranges.MinMargin, Ranges.MaxMargin, "", "options.minMargin", defaults.MinMargin),
            DrivingSide = side,
            Vision = vision,
            StationsM = stations,
            StationSpacingM = errors.Within(request.StationSpacingM, Ranges.MinStationSpacingM, Ranges.MaxStationSpacingM, "m", "options.stationSpacingM", defaults.StationSpacingM),
            Rules = ReadRules(request.Rules, errors) ?? defaults.Rules,
            EyeIndex = Math.Max(0, request.EyeIndex ?? 0),
        };
    }

    /// <summary>Reads the mirror and moves it into local metres; problems are recorded under <c>mirror…</c>.</summary>
    public static MirrorPlacement? ReadMirror(MirrorRequest? request, PlanFrame? frame, RequestErrors errors)
    {
        if (request is null)
        {
            errors.Add("mirror", "Required: the mirror to evaluate (location, centreHeightM, azimuthDeg, tiltDownDeg, radiusM, and diameterM or widthM and heightM).");
            return null;
        }

        if (request.Location is null || request.Location.IsEmpty)
        {
            errors.Add("mirror.location", "Required: a GeoJSON Point under the face's centre, in the plan's coordinates.");
        }

        var centre = errors.Required(request.CentreHeightM, Ranges.MinCentreHeightM, Ranges.MaxCentreHeightM, "m", "mirror.centreHeightM");
        var azimuth = errors.Required(request.AzimuthDeg, Ranges.MinAzimuthDeg, Ranges.MaxAzimuthDeg, "degrees", "mirror.azimuthDeg");
        var tilt = errors.Within(request.TiltDownDeg, Ranges.MinTiltDownDeg, Ranges.MaxTiltDownDeg, "degrees", "mirror.tiltDownDeg", 0);
        var radius = errors.Required(request.RadiusM, Ranges.MinRadiusM, Ranges.MaxRadiusM, "m", "mirror.radiusM");
        var aperture = ReadAperture(request, errors);
        // Only a radius that was sent and in range is compared with the face: a rejected one stands in as the minimum.
        if (aperture is not null && request.RadiusM == radius && !aperture.FitsOnSphereOf(radius))
        {
            errors.Add("mirror.radiusM", $"The face must fit on the sphere: the radius of curvature ({radius} m) must exceed half the face's largest extent ({aperture.CircumradiusM:0.###} m).");
        }

        if (frame is null || aperture is null || request.Location is null || request.Location.IsEmpty || !errors.IsEmpty)
        {
            return null;
        }

        var local = ToLocal(frame, request.Location.Coordinate, errors);
        return local is null ? null : new MirrorPlacement(local.X, local.Y, centre, azimuth, tilt, radius, aperture);
    }

    private static Coordinate? ToLocal(PlanFrame frame, Coordinate location, RequestErrors errors)
    {
        if (!double.IsFinite(location.X) || !double.IsFinite(location.Y))
        {
            errors.Add("mirror.location", "The coordinates must be finite numbers.");
            return null;
        }

        var local = frame.ToLocal(location);
        if (!double.IsFinite(local.X) || !double.IsFinite(local.Y) || Math.Abs(local.X) > Ranges.MaxMirrorOffsetM || Math.Abs(local.Y) > Ranges.MaxMirrorOffsetM)
        {
            errors.Add("mirror.location", "The mirror must stand on the plan: its location is far outside the plan's extent (check the coordinate order and system).");
            return null;
        }

        return local;
    }

    private static Aperture? ReadAperture(MirrorRequest request, RequestErrors errors) =>
        ReadFace(request.DiameterM, request.WidthM, request.HeightM, "mirror", errors);

    /// <summary>Reads a face given as a diameter (round) or a width and height (rectangular); problems are recorded under <c>{at}.…</c>.</summary>
    public static Aperture? ReadFace(double? diameterM, double? widthM, double? heightM, string at, RequestErrors errors)
    {
        var rectangular = widthM is not null || heightM is not null;
        if (diameterM is not null && rectangular)
        {
            errors.Add($"{at}.diameterM", "Give either diameterM (round face) or widthM and heightM (rectangular face), not both.");
            return null;
        }

        if (diameterM is not null)
        {
            return new RoundAperture(errors.Required(diameterM, Ranges.MinFaceM, Ranges.MaxFaceM, "m", $"{at}.diameterM"));
        }

        if (!rectangular)
        {
            errors.Add($"{at}.diameterM", "Required: diameterM for a round face, or widthM and heightM for a rectangular one.");
            return null;
        }

        return new RectangularAperture(
            errors.Required(widthM, Ranges.MinFaceM, Ranges.MaxFaceM, "m", $"{at}.widthM"),
            errors.Required(heightM, Ranges.MinFaceM, Ranges.MaxFaceM, "m", $"{at}.heightM"));
    }

    /// <summary>The decisive road users named by id among those checked; null for the default (the design road user).</summary>
    private static List<RoadUser>? ReadDecisive(IReadOnlyList<string>? ids, IReadOnlyList<RoadUser> checkedUsers, RequestErrors errors)
    {
        const string At = "options.decisiveRoadUsers";
        if (ids is null)
        {
            return null;
        }

        if (ids.Count is 0 or > Ranges.MaxRoadUsers)
        {
            errors.Add(At, $"List 1 to {Ranges.MaxRoadUsers} road user ids; {ids.Count} were given.");
            return null;
        }

        var decisive = new List<RoadUser>();
        for (var i = 0; i < ids.Count; i++)
        {
            if (checkedUsers.FirstOrDefault(u => u.Id == ids[i]) is { } user)
            {
                if (decisive.Contains(user))
                {
                    errors.Add($"{At}[{i}]", $"\"{ids[i]}\" is listed twice.");
                }

                decisive.Add(user);
            }
            else
            {
                errors.Add($"{At}[{i}]", $"\"{ids[i]}\" is not among the road users checked ({string.Join(", ", checkedUsers.Select(u => u.Id))}); list it in options.roadUsers too.");
            }
        }

        return decisive;
    }

    private static SightDistanceMethod? ReadSightDistance(SightDistanceRequest? request, DrivingSide side, DesignUnits defaultUnits, RequestErrors errors)
    {
        const string At = "options.sightDistance";
        var method = request?.Method ?? "stopping";
        var units = Lookup(Units, request?.Units, method == "fixed" ? DesignUnits.Metric : defaultUnits, $"{At}.units", errors);
        switch (method)
        {
            case "stopping":
                var reaction = errors.Within(request?.ReactionTimeS, Ranges.MinReactionTimeS, Ranges.MaxReactionTimeS, "s", $"{At}.reactionTimeS", 2.5);
                if (units == DesignUnits.Metric)
                {
                    RefuseOtherUnits(request?.DecelerationFtps2, "decelerationFtps2", "decelerationMps2", request?.Units is null, errors);
                    return new StoppingSightDistance(
                        reaction, errors.Within(request?.DecelerationMps2, Ranges.MinDecelerationMps2, Ranges.MaxDecelerationMps2, "m/s²", $"{At}.decelerationMps2", 3.4));
                }

                RefuseOtherUnits(request?.DecelerationMps2, "decelerationMps2", "decelerationFtps2", request?.Units is null, errors);
                return StoppingSightDistance.UsCustomary(
                    reaction, errors.Within(request?.DecelerationFtps2, Ranges.MinDecelerationFtps2, Ranges.MaxDecelerationFtps2, "ft/s²", $"{At}.decelerationFtps2", 11.2));
            case "intersection":
                var maneuver = request!.Maneuver is { } named && Turns.TryGetValue(named, out var left)
                    ? IntersectionManeuvers.Turn(left, side)
                    : Lookup(Maneuvers, request.Maneuver, IntersectionManeuver.TurnAcrossTraffic, $"{At}.maneuver", errors);
                var vehicle = Lookup(Vehicles, request.DepartingVehicle, DepartingVehicle.PassengerCar, $"{At}.departingVehicle", errors);
                var lanes = (int)errors.Within(request.ExtraLanesCrossed, 0, Ranges.MaxExtraLanesCrossed, "lanes", $"{At}.extraLanesCrossed", 0);
                if (maneuver == IntersectionManeuver.TurnIntoNearLane && lanes != 0)
                {
                    errors.Add($"{At}.extraLanesCrossed", "Must be 0 for a turn into the near lane, which crosses no lane.");
                    return null;
                }

                return new IntersectionSightDistance(maneuver, vehicle, lanes, units);
            case "fixed":
                if (units != DesignUnits.Metric)
                {
                    errors.Add($"{At}.units", "A fixed distance is given in metres (distanceM): leave units out, or set it to \"metric\".");
                }

                var distance = errors.Required(request!.DistanceM, Ranges.MinFixedDistanceM, Ranges.MaxDistanceM, "m", $"{At}.distanceM");
                if (string.IsNullOrWhiteSpace(request.Reference))
                {
                    errors.Add($"{At}.reference", "Required with a fixed distance: the local code or document it comes from.");
                    return null;
                }

                return request.DistanceM is >= Ranges.MinFixedDistanceM and <= Ranges.MaxDistanceM ? new FixedSightDistance(distance, request.Reference) : null;
            default:
                errors.Add($"{At}.method", $"Unknown method \"{request!.Method}\"; use \"stopping\", \"intersection\" or \"fixed\".");
                return null;
        }
    }

    // A deceleration in the other system's unit would be silently converted, or silently ignored: refuse it, saying which units are in force and why.
    private static void RefuseOtherUnits(double? given, string name, string wanted, bool unitsByDefault, RequestErrors errors)
    {
        if (given is null)
        {
            return;
        }

        var inForce = wanted == "decelerationMps2" ? "metric" : "us-customary";
        var why = unitsByDefault ? $"the units are \"{inForce}\" by default{(inForce == "us-customary" ? " (the report is in imperial units)" : "")}" : $"the units are \"{inForce}\"";
        errors.Add($"options.sightDistance.{name}", $"Not read here: {why}, whose deceleration is {wanted}. Give {wanted}, or set options.sightDistance.units to the system {name} belongs to.");
    }

    /// <summary>The value a name stands for; the fallback when absent; records a problem listing the known names when unknown.</summary>
    internal static T Lookup<T>(Dictionary<string, T> known, string? name, T fallback, string path, RequestErrors errors)
    {
        if (name is null)
        {
            return fallback;
        }

        if (known.TryGetValue(name, out var value))
        {
            return value;
        }

        errors.Add(path, $"Unknown value \"{name}\"; use one of: {string.Join(", ", known.Keys)}.");
        return fallback;
    }

    // Each road user is reported under its id: the same one twice would be judged twice and confused in the answer.
    private static List<RoadUser>? ReadRoadUsers(IReadOnlyList<RoadUserRequest>? request, RequestErrors errors)
    {
        var users = errors.List(request, Ranges.MaxRoadUsers, "options.roadUsers", "road users", (user, at) => ReadRoadUser(user, at, errors));
        var repeated = users?.Select((user, i) => (user, i)).Where(x => users.Take(x.i).Any(u => u.Id == x.user.Id)).ToList() ?? [];
        foreach (var (user, i) in repeated)
        {
            errors.Add($"options.roadUsers[{i}]", $"The road user \"{user.Id}\" is listed twice; list each one once.");
        }

        return repeated.Count == 0 ? users : null;
    }

    private static RoadUser? ReadRoadUser(RoadUserRequest? request, string at, RequestErrors errors)
    {
        if (request is null)
        {
            errors.Add(at, "A road user: {\"id\": \"bicycle\"} or a custom {\"name\", \"heightM\", \"widthM\"}.");
            return null;
        }

        if (request.HeightM is null && request.WidthM is null && request.Name is null)
        {
            if (request.Id is not null && RoadUsers.Find(request.Id) is { } known)
            {
                return known;
            }

            errors.Add($"{at}.id", $"Unknown road user \"{request.Id}\"; use one of: {string.Join(", ", RoadUsers.Defaults.Select(u => u.Id))}, or give a custom name, heightM and widthM.");
            return null;
        }

        if (string.IsNullOrWhiteSpace(request.Name))
        {
            errors.Add($"{at}.name", "Required for a custom road user.");
        }

        var height = errors.Required(request.HeightM, Ranges.MinRoadUserDimensionM, Ranges.MaxRoadUserDimensionM, "m", $"{at}.heightM");
        var width = errors.Required(request.WidthM, Ranges.MinRoadUserDimensionM, Ranges.MaxRoadUserDimensionM, "m", $"{at}.widthM");
        var length = errors.Within(request.LengthM, Ranges.MinRoadUserDimensionM, Ranges.MaxRoadUserDimensionM, "m", $"{at}.lengthM", width);
        if (!errors.IsEmpty)
        {
            return null;
        }

        var id = request.Id ?? "custom-" + string.Concat(request.Name!.ToLowerInvariant().Select(c => char.IsAsciiLetterOrDigit(c) ? c : '-')).Trim('-');
        if (!IsKebab(id))
        {
            errors.Add($"{at}.id", "A custom road user's id must be lower-case letters, digits and single hyphens.");
            return null;
        }

        return new RoadUser(id, request.Name!, height, width, length, request.Vulnerable ?? false, "set in the request");
    }

    /// <summary>True for a stable kebab-case id: lower-case letters and digits joined by single hyphens, at most 64 characters.</summary>
    internal static bool IsKebab(string id) =>
        id.Length is > 0 and <= Ranges.MaxIdLength && id.All(c => char.IsAsciiLetterLower(c) || char.IsAsciiDigit(c) || c == '-')
        && !id.StartsWith('-') && !id.EndsWith('-') && !id.Contains("--", StringComparison.Ordinal);

    private static SitingRules? ReadRules(SitingRulesRequest? request, RequestErrors errors)
    {
        if (request is null)
        {
            return null;
        }

        var defaults = SitingRules.Default;
        var clearance = errors.Within(request.MinimumLowerEdgeClearanceM, Ranges.MinClearanceM, Ranges.MaxClearanceM, "m", "options.rules.minimumLowerEdgeClearanceM", defaults.MinimumLowerEdgeClearanceM);
        var distance = errors.Within(request.MaximumEyeToMirrorDistanceM, Ranges.MinEyeToMirrorM, Ranges.MaxEyeToMirrorM, "m", "options.rules.maximumEyeToMirrorDistanceM", defaults.MaximumEyeToMirrorDistanceM);
        var speed = errors.Within(request.CautionAboveSpeedKmh, Ranges.MinSpeedKmh, Ranges.MaxSpeedKmh, "km/h", "options.rules.cautionAboveSpeedKmh", defaults.CautionAboveSpeedKmh);
        var carriageway = errors.Within(request.CarriagewayClearanceM, Ranges.MinClearanceM, Ranges.MaxClearanceM, "m", "options.rules.carriagewayClearanceM", defaults.CarriagewayClearanceM);
        var kerb = errors.Within(request.KerbOffsetM, 0, Ranges.MaxKerbOffsetM, "m", "options.rules.kerbOffsetM", defaults.KerbOffsetM);
        var changed = request.MinimumLowerEdgeClearanceM is not null || request.MaximumEyeToMirrorDistanceM is not null || request.CautionAboveSpeedKmh is not null
            || request.CarriagewayClearanceM is not null || request.KerbOffsetM is not null;
        if (changed && string.IsNullOrWhiteSpace(request.Source))
        {
            errors.Add("options.rules.source", "Required when a siting value is changed: the local rule the values come from.");
            return null;
        }

        return changed
            ? new SitingRules(clearance, distance, speed, request.Source!, carriageway, kerb,
                request.CarriagewayClearanceM is null ? null : request.Source, request.KerbOffsetM is null ? null : request.Source)
            : null;
    }
}
