using System.Text.Json.Nodes;

namespace SafetyMirror.District;

/// <summary>Draws one corner: a driveway, alley or minor road meeting a main street, in the corner's own metres.</summary>
/// <remarks>
/// The main street runs along x with its near kerb on y = 0 and its far side at y &gt; 0; the exit comes from y &lt; 0, the
/// driver's eye behind the back of the footway. Traffic keeps right: the lane from the west (x &lt; 0) is the near one.
/// Every random draw comes from the corner's own generator, in a fixed order, so a corner does not depend on the others.
/// </remarks>
internal sealed class CornerSketch
{
    private const double TargetHeightM = 1.0; // a point on an approaching car, for aiming a given mirror only
    private const double LowerEdgeAboveFootwayM = 2.3; // the lower-edge clearance an installer aims for (France IISR Art. 14, as the service's default)
    private const double DefaultKerbHeightM = 0.12; // the footways give no kerbHeightM: the service's default kerb

    private static readonly (double Weight, CornerSituation Situation)[] Situations =
    [
        (0.15, CornerSituation.OpenView), (0.58, CornerSituation.Blind), (0.13, CornerSituation.FastApproach), (0.14, CornerSituation.HiddenBend),
    ];

    private readonly Random random;
    private readonly CornerFrame frame;
    private readonly string id;
    private readonly string street;
    private readonly List<JsonObject> features = [];

    public CornerSketch(Random random, CornerFrame frame, string id, string street)
    {
        this.random = random;
        this.frame = frame;
        this.id = id;
        this.street = street;
    }

    private enum Exit { Driveway, Alley, MinorRoad }

    /// <summary>Draws the corner; a flawed corner is drawn blind, then broken as its flaw says.</summary>
    public DistrictCorner Draw(bool withMirror, CornerFlawKind? flaw)
    {
        var situation = flaw is null ? PickSituation() : CornerSituation.Blind;
        var exit = situation == CornerSituation.HiddenBend ? Pick(Exit.Driveway, Exit.Alley) : Pick(Exit.Driveway, Exit.Driveway, Exit.Alley, Exit.MinorRoad, Exit.MinorRoad);
        var twoWay = random.NextDouble() < 0.7;
        var fromWest = twoWay || situation == CornerSituation.HiddenBend || random.NextDouble() < 0.5;
        var fromEast = twoWay || !fromWest;
        var widthM = Round(twoWay ? Uniform(6.0, 7.0) : Uniform(3.5, 4.5), 1);
        var farFootwayM = Round(Uniform(2.0, 3.5), 1);
        var nearFootwayM = Round(Uniform(1.5, 2.5), 1);
        var gapM = Round(exit switch { Exit.Driveway => Uniform(3, 4), Exit.Alley => Uniform(3.5, 5), _ => Uniform(6, 7) }, 1);
        var house = random.Next(3, 140);

        // The eye: behind the back of the footway at a driveway or alley, behind the stop line on the right of a minor road.
        var propertyFrontY = exit == Exit.MinorRoad ? -Round(Uniform(1.5, 2.0), 1) : -nearFootwayM;
        var eyeX = exit == Exit.MinorRoad ? gapM / 4 : Round(Uniform(-0.3, 0.3), 2);
        var eyeY = Round(exit == Exit.MinorRoad ? -Uniform(2.6, 3.4) : propertyFrontY - Uniform(1.8, 2.6), 2);
        var eyeHeightM = Pick(1.08, 1.08, 1.08, 1.08, 1.08, 1.08, 1.3, 1.8);

        var speedKmh = situation switch
        {
            CornerSituation.FastApproach => Pick(60, 70),
            CornerSituation.HiddenBend => Pick(30, 40),
            _ => Pick(20, 30, 30, 30, 40, 50),
        };
        var intersection = exit == Exit.MinorRoad;
        var requiredM = intersection ? 0.278 * speedKmh * 6.5 : StoppingDistanceM(speedKmh);
        double ApproachLengthM() => Round(Math.Clamp((1.15 * requiredM) + Uniform(5, 25), 60, 150), 0);
        var westLengthM = ApproachLengthM();
        var eastLengthM = ApproachLengthM();
        var bendM = Round(Uniform(16, 24), 1);
        var carriagewayEndM = Math.Max(westLengthM, eastLengthM) + 5;

        var exitName = exit switch
        {
            Exit.Driveway => $"Driveway of No. {house} {street}",
            Exit.Alley => $"Alley beside No. {house} {street}",
            _ => TownNames.SideStreet(random, "Mews"),
        };
        var name = exit == Exit.MinorRoad ? $"{exitName} onto {street}" : exitName;

        Add("driver", "eye", $"Driver waiting to leave: {exitName}", Point(eyeX, eyeY), ("eyeHeightM", eyeHeightM));

        // Approaches: lanes drawn in the direction of travel up to the conflict point abeam the exit.
        var westLaneY = Round(twoWay ? widthM / 4 : widthM / 2, 2);
        var eastLaneY = Round(twoWay ? 3 * widthM / 4 : widthM / 2, 2);
        var westLane = situation == CornerSituation.HiddenBend
            ? new[] { (-bendM - 1.5, widthM + 72), (-bendM - 1.5, westLaneY), (0.0, westLaneY) }
            : StraightLane(-westLengthM, westLaneY);
        var eastLane = StraightLane(eastLengthM, eastLaneY);
        var grade = random.NextDouble() < 0.2 ? Round(Uniform(-6, 6), 0) : 0;
        if (fromWest)
        {
            Add("approach-west", "approach", $"{street} {frame.Bound(1, 0)}", Line(westLane), ("speedKmh", speedKmh), ("gradePercent", grade));
        }

        if (fromEast)
        {
            Add("approach-east", "approach", $"{street} {frame.Bound(-1, 0)}", Line(eastLane), ("speedKmh", speedKmh), ("gradePercent", -grade));
        }

        // The properties either side of the exit: the west one hides the near lane; the east one sometimes the far lane.
        var eyeDepthM = propertyFrontY - eyeY;
        var open = situation == CornerSituation.OpenView;
        var innerM = (gapM / 2) + (exit == Exit.MinorRoad ? Uniform(1.5, 2.0) : Uniform(0.2, 0.8));
        AddProperty("west", -1, innerM, propertyFrontY, open ? eyeDepthM + Uniform(2, 6) : -1, house + 2, eyeDepthM);
        var east = random.NextDouble();
        if (open || east < 0.35)
        {
            AddProperty("east", 1, innerM, propertyFrontY, open ? eyeDepthM + Uniform(2, 6) : -1, house - 2, eyeDepthM);
        }
        else if (east < 0.65)
        {
            Add("wall-east", "obstacle", $"Low front wall of No. {house - 2} {street}",
                Rectangle(innerM, propertyFrontY - 0.3, innerM + Uniform(8, 20), propertyFrontY), ("heightM", Round(Uniform(0.6, 0.9), 1)));
        }

        var westEndM = situation == CornerSituation.HiddenBend ? -bendM - 3 : -carriagewayEndM;
        var farFootwayStartM = situation == CornerSituation.HiddenBend ? -bendM + 3 : -carriagewayEndM;
        if (situation == CornerSituation.HiddenBend)
        {
            var lane = TownNames.SideStreet(random, "Lane");
            Add("landmark", "obstacle", $"{TownNames.Landmark(random)}, {lane}",
                Rectangle(-bendM + 4.5, widthM + farFootwayM + 0.5, -7.5, widthM + farFootwayM + Uniform(12, 20)), ("heightM", Round(Uniform(6, 10), 1)));
            Add("side-carriageway", "carriageway", lane, Rectangle(-bendM - 3, widthM, -bendM + 3, widthM + 75));
        }

        Add("carriageway", "carriageway", street, Rectangle(westEndM, 0, carriagewayEndM, widthM));
        if (exit == Exit.MinorRoad)
        {
            Add("side-carriageway", "carriageway", exitName, Rectangle(-gapM / 2, -35, gapM / 2, 0));
            Add("stop-line", "stop-line", $"Stop line of {exitName}", Line([(0.0, -0.5), (gapM / 2, -0.5)]));
        }
        else
        {
            Add("footway-near", "footway", $"{street}, footway on the exit side", Rectangle(-carriagewayEndM, -nearFootwayM, carriagewayEndM, 0));
        }

        Add("footway-far", "footway", $"{street}, footway opposite the exit", Rectangle(farFootwayStartM, widthM, carriagewayEndM, widthM + farFootwayM));
        Add("mounting-zone", "mounting-zone", "Footway edge opposite the exit",
            Line([(eyeX - 6, widthM + (farFootwayM / 2)), (eyeX + 6, widthM + (farFootwayM / 2))]));

        // A given mirror, drawn for every corner so the rest of the district does not depend on who carries one.
        var aimedLane = fromWest ? westLane : eastLane;
        var mirror = GivenMirror(eyeX, eyeY, eyeHeightM, widthM, farFootwayM, PointUpLane(aimedLane, requiredM));
        if (withMirror && flaw is null)
        {
            features.Add(mirror);
        }

        var options = intersection
            ? new JsonObject { ["sightDistance"] = new JsonObject { ["method"] = "intersection", ["maneuver"] = "right-turn-from-stop" } }
            : null;
        return new DistrictCorner(id, name, situation, features, options, flaw is { } kind ? Break(kind, mirror) : null);
    }

    /// <summary>AASHTO stopping sight distance on the level, 2.5 s and 3.4 m/s² (AASHTO Green Book 2011, Eq. 3-2).</summary>
    private static double StoppingDistanceM(double speedKmh) => (0.278 * speedKmh * 2.5) + (0.039 * speedKmh * speedKmh / 3.4);

    private CornerSituation PickSituation()
    {
        var draw = random.NextDouble();
        foreach (var (weight, situation) in Situations)
        {
            draw -= weight;
            if (draw < 0)
            {
                return situation;
            }
        }

        return CornerSituation.Blind;
    }

    // One property beside the exit: a wall, hedge or building; blind ones stand in front of the eye, open ones well behind it.
    private void AddProperty(string side, int sign, double innerM, double frontY, double setbackM, int number, double eyeDepthM)
    {
        number = Math.Max(1, number);
        var kind = Pick("wall", "hedge", "building", "building");
        var blindSetbackM = Math.Min(kind == "building" ? Uniform(0, 1.0) : Uniform(0, 0.3), eyeDepthM - 0.8);
        var front = frontY - (setbackM >= 0 ? setbackM : blindSetbackM);
        var (lengthM, depthM, heightM, label) = kind switch
        {
            "wall" => (Uniform(12, 35), 0.3, Uniform(1.4, 2.4), $"Garden wall of No. {number} {street}"),
            "hedge" => (Uniform(10, 30), Uniform(0.8, 1.4), Uniform(1.3, 2.2), $"Hedge of No. {number} {street}"),
            _ => (Uniform(9, 20), Uniform(8, 14), Math.Round(Uniform(3, 12) * 2) / 2, $"No. {number} {street}"),
        };
        var (near, far) = (sign * innerM, sign * (innerM + lengthM));
        Add($"{kind}-{side}", "obstacle", label, Rectangle(Math.Min(near, far), front - depthM, Math.Max(near, far), front), ("heightM", Round(heightM, 1)));
    }

    // A plausible given mirror: on the far footway opposite the exit, its axis on the bisector of the directions to the eye
    // and to a point up the lane at the required distance, give or take a few degrees as a hurried installer would leave it.
    private JsonObject GivenMirror(double eyeX, double eyeY, double eyeHeightM, double widthM, double farFootwayM, (double X, double Y) target)
    {
        var (diameterM, radiusM) = Pick((0.6, 2.0), (0.6, 3.0), (0.8, 3.0), (0.8, 3.0), (1.0, 3.0), (1.0, 4.0));
        // Hung for the usual 2.3 m clear above the footway and its kerb, a few centimetres short now and then.
        var centreHeightM = Round((diameterM / 2) + LowerEdgeAboveFootwayM + DefaultKerbHeightM + Uniform(-0.03, 0.25), 2);
        var x = Round(eyeX + Uniform(-1.5, 2.5), 2);
        var y = Round(widthM + Math.Clamp(farFootwayM / 2, 0.75 + (diameterM / 2), farFootwayM - 0.3), 2);
        var toEye = Unit(eyeX - x, eyeY - y, eyeHeightM - centreHeightM);
        var toLane = Unit(target.X - x, target.Y - y, TargetHeightM - centreHeightM);
        var axis = Unit(toEye.X + toLane.X, toEye.Y + toLane.Y, toEye.Z + toLane.Z);
        var azimuthDeg = (frame.BearingDeg(axis.X, axis.Y) + Uniform(-4, 4) + 360) % 360;
        var tiltDownDeg = (-Math.Asin(axis.Z) * 180 / Math.PI) + Uniform(-1.5, 1.5);
        return MirrorFeature(x, y, centreHeightM, Round(azimuthDeg, 1), Round(tiltDownDeg, 1), radiusM, diameterM);
    }

    private JsonObject MirrorFeature(double x, double y, double centreHeightM, double azimuthDeg, double tiltDownDeg, double radiusM, double diameterM) =>
        Feature("mirror", new JsonObject
        {
            ["role"] = DistrictGenerator.MirrorRole,
            ["centreHeightM"] = centreHeightM,
            ["azimuthDeg"] = azimuthDeg,
            ["tiltDownDeg"] = tiltDownDeg,
            ["radiusM"] = radiusM,
            ["diameterM"] = diameterM,
        }, Point(x, y));

    // Breaks the drawn corner in one way, and says which feature carries the flaw.
    private CornerFlaw Break(CornerFlawKind kind, JsonObject mirror)
    {
        JsonObject First(string role) => features.First(f => (string?)f["properties"]!["role"] == role);
        var obstacle = First("obstacle");
        switch (kind)
        {
            case CornerFlawKind.NegativeObstacleHeight:
                obstacle["properties"]!["heightM"] = -(double)obstacle["properties"]!["heightM"]!;
                return new(kind, FeatureId(obstacle));
            case CornerFlawKind.MissingEye:
                features.Remove(First("eye"));
                return new(kind, null);
            case CornerFlawKind.SingleVertexApproach:
                var approach = First("approach");
                var coordinates = approach["geometry"]!["coordinates"]!.AsArray();
                approach["geometry"]!["coordinates"] = new JsonArray(coordinates[^1]!.DeepClone());
                return new(kind, FeatureId(approach));
            case CornerFlawKind.SelfCrossingObstacle:
                var ring = obstacle["geometry"]!["coordinates"]![0]!.AsArray();
                var second = ring[1]!.DeepClone();
                ring[1] = ring[2]!.DeepClone();
                ring[2] = second; // the ring now runs corner, opposite corner, back: a bow tie
                return new(kind, FeatureId(obstacle));
            case CornerFlawKind.UnknownRole:
                var zone = First("mounting-zone");
                zone["properties"]!["role"] = "street-lamp";
                return new(kind, FeatureId(zone));
            default:
                mirror["properties"]!["radiusM"] = 0.2;
                features.Add(mirror);
                return new(kind, FeatureId(mirror));
        }
    }

    private static string FeatureId(JsonObject feature) => (string)feature["id"]!;

    private void Add(string suffix, string role, string name, JsonObject geometry, params (string Name, double Value)[] numbers)
    {
        var properties = new JsonObject { ["role"] = role, ["name"] = name };
        foreach (var (member, value) in numbers)
        {
            properties[member] = value;
        }

        features.Add(Feature(suffix, properties, geometry));
    }

    private JsonObject Feature(string suffix, JsonObject properties, JsonObject geometry) => new()
    {
        ["type"] = "Feature",
        ["id"] = $"{id}-{suffix}",
        ["properties"] = properties,
        ["geometry"] = geometry,
    };

    private (double X, double Y)[] StraightLane(double startX, double laneY) =>
        random.NextDouble() < 0.5 ? [(startX, laneY), (0, laneY)] : [(startX, laneY), (Round(startX * Uniform(0.3, 0.6), 1), laneY), (0, laneY)];

    // The point a distance up the lane from its conflict point (its last position), or the lane's start if it is shorter.
    private static (double X, double Y) PointUpLane((double X, double Y)[] lane, double distanceM)
    {
        for (var i = lane.Length - 1; i > 0; i--)
        {
            var (a, b) = (lane[i], lane[i - 1]);
            var pieceM = Math.Sqrt(((b.X - a.X) * (b.X - a.X)) + ((b.Y - a.Y) * (b.Y - a.Y)));
            if (distanceM <= pieceM)
            {
                var t = distanceM / pieceM;
                return (a.X + (t * (b.X - a.X)), a.Y + (t * (b.Y - a.Y)));
            }

            distanceM -= pieceM;
        }

        return lane[0];
    }

    private JsonObject Point(double x, double y) => new() { ["type"] = "Point", ["coordinates"] = Position(x, y) };

    private JsonObject Line((double X, double Y)[] points) =>
        new() { ["type"] = "LineString", ["coordinates"] = new JsonArray([.. points.Select(p => Position(p.X, p.Y))]) };

    // Counter-clockwise, as RFC 7946 §3.1.6 asks of an exterior ring; a quarter turn keeps it so.
    private JsonObject Rectangle(double x0, double y0, double x1, double y1) => new()
    {
        ["type"] = "Polygon",
        ["coordinates"] = new JsonArray(new JsonArray(Position(x0, y0), Position(x1, y0), Position(x1, y1), Position(x0, y1), Position(x0, y0))),
    };

    private JsonArray Position(double x, double y)
    {
        var (lon, lat) = frame.ToLonLat(x, y);
        return new JsonArray(lon, lat);
    }

    private static (double X, double Y, double Z) Unit(double x, double y, double z)
    {
        var length = Math.Sqrt((x * x) + (y * y) + (z * z));
        return (x / length, y / length, z / length);
    }

    private double Uniform(double low, double high) => low + (random.NextDouble() * (high - low));

    private T Pick<T>(params T[] choices) => choices[random.Next(choices.Length)];

    private static double Round(double value, int decimals) => Math.Round(value, decimals);
}
