using System.Text.Json;
using NetTopologySuite.Geometries;
using NetTopologySuite.Operation.Valid;
using SafetyMirror.Core.Optics;
using static System.FormattableString;

namespace SafetyMirror.Core.Site;

/// <summary>Reads a corner plan from an RFC 7946 GeoJSON FeatureCollection, as a GIS exports it.</summary>
/// <remarks>
/// Each feature says what it is in <c>properties.role</c>: eye, approach, obstacle, mounting-zone, carriageway,
/// footway or stop-line. Coordinates are WGS84 longitude/latitude unless the top-level <c>crs</c> names a UTM zone, or the
/// top-level member <c>"frame": "local-metres"</c> says they are metres already; an optional top-level <c>timeZone</c> names
/// the local clock (<see cref="PlanTimeZone"/>). Bad input gives problems, never
/// exceptions, and every problem found is reported, not just the first.
/// </remarks>
public static class SitePlanReader
{
    /// <summary>The plan in local metres, or every problem found in the FeatureCollection.</summary>
    public static SitePlanReadResult Read(JsonElement featureCollection, SitePlanLimits? limits = null)
    {
        limits ??= SitePlanLimits.Default;
        var problems = new List<SitePlanProblem>();
        if (featureCollection.ValueKind != JsonValueKind.Object)
        {
            return SitePlanReadResult.Failure([new("", $"The plan must be a GeoJSON FeatureCollection object (RFC 7946 §3.3); it is {JsonText.Describe(featureCollection)}.")]);
        }

        // Text that cannot be decoded fails every later read of it, even a member lookup: refuse it first, naming where it is.
        JsonText.FindBadText(featureCollection, "", limits.MaxTextLength, problems);
        if (problems.Count > 0)
        {
            return SitePlanReadResult.Failure(problems);
        }

        var type = JsonText.Member(featureCollection, "type");
        if (JsonText.AsString(type) != "FeatureCollection")
        {
            problems.Add(new("type", $"The plan must be a GeoJSON FeatureCollection (RFC 7946 §3.3); its type is {JsonText.Describe(type)}."));
        }

        var features = JsonText.Member(featureCollection, "features");
        if (features.ValueKind != JsonValueKind.Array)
        {
            problems.Add(new("features", $"A FeatureCollection needs a features array; it is {JsonText.Describe(features)}."));
            return SitePlanReadResult.Failure(problems);
        }

        if (OverLimit(features, limits) is { } overLimit)
        {
            // Stop here: the point of the limits is not to do the work.
            return SitePlanReadResult.Failure([.. problems, overLimit]);
        }


        var system = ReadCoordinateSystem(featureCollection, problems);
        var timeZone = PlanTimeZone.Read(featureCollection, problems);
        var reader = new FeatureReader(system, problems);
        var drafts = features.EnumerateArray().Select(reader.Read).OfType<FeatureDraft>().ToList();
        RequireDistinctIds(drafts, problems);
        RequireRole(SiteRoles.Eye, "the waiting driver's eye point", drafts, problems);
        RequireRole(SiteRoles.Approach, "a lane of traffic the driver must see", drafts, problems);
        var complete = drafts.Where(draft => draft.IsComplete).ToList();
        if (system is null || complete.Count == 0)
        {
            return SitePlanReadResult.Failure(problems);
        }

        var frame = PlanFrame.CentredOn(system, Centre(complete));
        var local = complete.Select(draft => frame.ToLocal(draft.PlanGeometry!)).ToList();
        if (!FitsExtent(local, limits, problems))
        {
            return SitePlanReadResult.Failure(problems);
        }

        var built = complete.Zip(local, (draft, geometry) => Build(draft, geometry, frame, limits, problems)).OfType<SiteFeature>().ToList();
        var plan = new SitePlan(
            frame,
            built.OfType<Eye>(),
            built.OfType<Approach>(),
            built.OfType<Obstacle>(),
            built.OfType<MountingZone>(),
            built.OfType<Carriageway>(),
            built.OfType<Footway>(),
            built.OfType<StopLine>())
        {
            TimeZone = timeZone,
        };
        if (plan.Approaches.Length > limits.MaxApproaches)
        {
            problems.Add(new("features", Invariant(
                $"The plan has {plan.Approaches.Length} approaches; at most {limits.MaxApproaches} are accepted: draw the traffic streams of one corner, and split a wider area into several corners.")));
        }

        RequireEyesOutsideObstacles(plan, problems);
        RequireApproachesClearOfObstacles(plan, problems);
        return problems.Count == 0 ? SitePlanReadResult.Success(plan) : SitePlanReadResult.Failure(problems);
    }

    private static SitePlanProblem? OverLimit(JsonElement features, SitePlanLimits limits)
    {
        var featureCount = features.GetArrayLength();
        if (featureCount > limits.MaxFeatures)
        {
            return new("features", $"The plan has {featureCount} features; at most {limits.MaxFeatures} are accepted.");
        }

        var positions = 0;
        var index = 0;
        foreach (var feature in features.EnumerateArray())
        {
            var count = CoordinateChecker.CountPositions(JsonText.Member(JsonText.Member(feature, "geometry"), "coordinates"));
            if (count > limits.MaxVerticesPerGeometry)
            {
                return new($"features[{index}].geometry.coordinates",
                    $"The geometry has {count} positions (vertices); at most {limits.MaxVerticesPerGeometry} are accepted in one feature.");
            }

            positions += count;
            index++;
        }

        return positions > limits.MaxVertices
            ? new("features", $"The plan has {positions} positions (vertices); at most {limits.MaxVertices} are accepted.")
            : null;
    }

    // Answers, layers and served approaches name features by id: two features with one id would be confused.
    private static void RequireDistinctIds(List<FeatureDraft> drafts, List<SitePlanProblem> problems)
    {
        var firstById = new Dictionary<string, FeatureReference>(StringComparer.Ordinal);
        foreach (var feature in drafts.Select(draft => draft.Feature).Where(feature => feature.Id is not null))
        {
            if (!firstById.TryAdd(feature.Id!, feature))
            {
                problems.Add(new($"{feature.Path}.id", $"The id \"{feature.Id}\" is already the id of {firstById[feature.Id!].Path}; give each feature its own id."));
            }
        }
    }

    private static PlanCoordinateSystem? ReadCoordinateSystem(JsonElement featureCollection, List<SitePlanProblem> problems)
    {
        var frame = JsonText.Member(featureCollection, "frame");
        var crs = JsonText.Member(featureCollection, "crs");
        if (!JsonText.IsAbsent(frame))
        {
            if (JsonText.AsString(frame) != "local-metres")
            {
                problems.Add(new("frame", $"The only frame is \"local-metres\" (x east and y north already in metres); it is {JsonText.Describe(frame)}."));
                return null;
            }

            if (!JsonText.IsAbsent(crs))
            {
                problems.Add(new("frame", "Give either \"frame\": \"local-metres\" or a crs, not both."));
                return null;
            }

            return PlanCoordinateSystem.LocalMetres;
        }

        if (JsonText.IsAbsent(crs))
        {
            return PlanCoordinateSystem.Wgs84;
        }

        if (JsonText.AsString(JsonText.Member(crs, "type")) != "name")
        {
            problems.Add(new(crs.ValueKind == JsonValueKind.Object ? "crs.type" : "crs",
                "Only a named crs is read, as GIS exports write it: {\"type\": \"name\", \"properties\": {\"name\": \"urn:ogc:def:crs:EPSG::32633\"}}."));
            return null;
        }

        var name = JsonText.AsString(JsonText.Member(JsonText.Member(crs, "properties"), "name"));
        var system = name is null ? null : PlanCoordinateSystem.FromCrsName(name);
        if (system is null)
        {
            var given = name is null ? "The crs has no name" : $"\"{name}\" is not supported";
            problems.Add(new("crs.properties.name", $"{given}; supported are {PlanCoordinateSystem.Supported}."));
        }

        return system;
    }

    private static void RequireRole(string role, string meaning, List<FeatureDraft> drafts, List<SitePlanProblem> problems)
    {
        if (!drafts.Any(draft => draft.Role.Name == role))
        {
            problems.Add(new("features", $"The plan needs at least one feature with role \"{role}\": {meaning}."));
        }
    }

    /// <summary>The mean of every position, in the plan's own coordinates: the site centre.</summary>
    private static Coordinate Centre(List<FeatureDraft> drafts)
    {
        var positions = drafts.SelectMany(draft => draft.PlanGeometry!.Coordinates).ToList();
        return new Coordinate(positions.Average(p => p.X), positions.Average(p => p.Y));
    }

    private static bool FitsExtent(List<Geometry> local, SitePlanLimits limits, List<SitePlanProblem> problems)
    {
        var extent = new Envelope();
        foreach (var position in local.SelectMany(geometry => geometry.Coordinates))
        {
            if (!double.IsFinite(position.X) || !double.IsFinite(position.Y))
            {
                // The projection gave up: the plan reaches far beyond any corner.
                problems.Add(new("features", Invariant($"The plan reaches much farther than a corner; all of it must fit in {limits.MaxExtentM} m × {limits.MaxExtentM} m.")));
                return false;
            }

            extent.ExpandToInclude(position);
        }

        if (extent.Width > limits.MaxExtentM || extent.Height > limits.MaxExtentM)
        {
            problems.Add(new("features", Invariant(
                $"The plan spans {extent.Width:0} m east-west and {extent.Height:0} m north-south; all of it must fit in {limits.MaxExtentM} m × {limits.MaxExtentM} m.")));
        }

        return true;
    }

    /// <summary>The feature in local metres, or null after adding the problems found in its local geometry.</summary>
    private static SiteFeature? Build(FeatureDraft draft, Geometry local, PlanFrame frame, SitePlanLimits limits, List<SitePlanProblem> problems)
    {
        var at = $"{draft.Feature.Path}.geometry.coordinates";
        if (local is IPolygonal && new IsValidOp(local).ValidationError is { } error)
        {
            var where = frame.ToPlan(error.Coordinate);
            problems.Add(new(at, Invariant($"The polygon is not valid: {error.Message} at or near ({where.X}, {where.Y}).")));
            return null;
        }

        var numbers = draft.Numbers!;
        return draft.Role.Name switch
        {
            SiteRoles.Eye => new Eye(new Vec3(local.Coordinate.X, local.Coordinate.Y, numbers["eyeHeightM"]), draft.Feature),
            SiteRoles.Approach => BuildApproach(draft, (LineString)local, at, limits, problems),
            SiteRoles.Obstacle => new Obstacle(local, numbers["heightM"], draft.Feature),
            SiteRoles.MountingZone => BuildMountingZone(draft, local, at, limits, problems),
            SiteRoles.Carriageway => new Carriageway(local, draft.Feature),
            SiteRoles.StopLine => new StopLine((LineString)local, draft.Feature),
            _ => new Footway(local, numbers["kerbHeightM"], draft.Feature),
        };
    }

    // Pole positions are tried all over a zone: a zone the size of a district would only cost time.
    private static MountingZone? BuildMountingZone(FeatureDraft draft, Geometry local, string at, SitePlanLimits limits, List<SitePlanProblem> problems)
    {
        if (local is LineString && local.Length > limits.MaxMountingZoneLengthM)
        {
            problems.Add(new(at, Invariant(
                $"The mounting zone is {local.Length:0} m long; at most {limits.MaxMountingZoneLengthM} m are accepted: draw the stretch of footway edge where a pole may stand.")));
            return null;
        }

        if (local.Area > limits.MaxMountingZoneAreaM2)
        {
            problems.Add(new(at, Invariant(
                $"The mounting zone covers {local.Area:0} m²; at most {limits.MaxMountingZoneAreaM2} m² are accepted: draw the strip of footway where a pole may stand.")));
            return null;
        }

        return new MountingZone(local, draft.Feature);
    }

    private static Approach? BuildApproach(FeatureDraft draft, LineString line, string at, SitePlanLimits limits, List<SitePlanProblem> problems)
    {
        var before = problems.Count;
        if (Approach.IndexOfRepeatedPoint(line) is var repeated and >= 0)
        {
            problems.Add(new($"{at}[{repeated}]", $"Position {repeated} repeats position {repeated - 1}; an approach needs distinct consecutive points."));
        }

        if (!line.IsSimple || TurnsBack(line))
        {
            problems.Add(new(at, "The approach crosses or runs back over itself; draw the lane once, in the direction of travel up to the conflict point."));
        }

        if (line.Length < SiteRanges.MinApproachLengthM)
        {
            problems.Add(new(at, Invariant(
                $"The approach is {line.Length:0.##} m long; draw at least {SiteRanges.MinApproachLengthM} m of it, in the direction of travel up to the conflict point.")));
        }

        if (line.Length > limits.MaxApproachLengthM)
        {
            problems.Add(new(at, Invariant(
                $"The approach is {line.Length:0} m long; at most {limits.MaxApproachLengthM} m are accepted: draw the lane from the conflict point back as far as the required sight distance.")));
        }

        if (problems.Count > before)
        {
            return null;
        }

        var numbers = draft.Numbers!;
        return numbers.TryGetValue(SiteRoles.SpeedMph, out var mph)
            ? Approach.WithSpeedMph(line, mph, numbers["gradePercent"], draft.Feature)
            : new Approach(line, numbers[SiteRoles.SpeedKmh], numbers["gradePercent"], draft.Feature);
    }

    // A lane does not reverse: a turn of more than about 155° between consecutive pieces means it was drawn back over itself.
    private static bool TurnsBack(LineString line)
    {
        for (var i = 2; i < line.NumPoints; i++)
        {
            Coordinate a = line.GetCoordinateN(i - 2), b = line.GetCoordinateN(i - 1), c = line.GetCoordinateN(i);
            double ux = b.X - a.X, uy = b.Y - a.Y, vx = c.X - b.X, vy = c.Y - b.Y;
            var cosine = ((ux * vx) + (uy * vy)) / (Math.Sqrt((ux * ux) + (uy * uy)) * Math.Sqrt((vx * vx) + (vy * vy)));
            if (cosine < -0.9)
            {
                return true;
            }
        }

        return false;
    }

    private static void RequireEyesOutsideObstacles(SitePlan plan, List<SitePlanProblem> problems)
    {
        foreach (var eye in plan.Eyes)
        {
            if (plan.ObstacleContaining(eye.Position.X, eye.Position.Y) is { } obstacle)
            {
                problems.Add(new($"{eye.Feature.Path}.geometry.coordinates",
                    $"The eye is inside obstacle {obstacle.Feature}; put it where the waiting driver's eyes are, outside every obstacle."));
            }
        }
    }

    // A lane drawn through a wall or building is a drawing error: traffic cannot pass there, and the figures would be wrong.
    private static void RequireApproachesClearOfObstacles(SitePlan plan, List<SitePlanProblem> problems)
    {
        foreach (var approach in plan.Approaches)
        {
            foreach (var obstacle in plan.Obstacles.Where(o => o.Footprint.EnvelopeInternal.Intersects(approach.Line.EnvelopeInternal)))
            {
                if (obstacle.Footprint.Intersection(approach.Line).Length > 1e-6)
                {
                    problems.Add(new($"{approach.Feature.Path}.geometry.coordinates",
                        $"The approach runs through obstacle {obstacle.Feature}; traffic cannot pass there: redraw the lane or the obstacle."));
                }
            }
        }
    }
}
