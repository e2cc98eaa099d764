using System.Text.Json;
using static System.FormattableString;

namespace SafetyMirror.Core.Site;

/// <summary>Checks the <c>coordinates</c> of a GeoJSON geometry position by position, naming each one that is wrong.</summary>
/// <remarks>
/// Runs before the GeoJSON reader so that every problem gets its exact path and the reader never sees malformed input.
/// Ranges follow the plan's coordinate system; without one (an unsupported crs) only the shape is checked.
/// </remarks>
internal sealed class CoordinateChecker(PlanCoordinateSystem? system, List<SitePlanProblem> problems)
{
    private const int MaxProblemsPerArray = 10;

    /// <summary>True when the coordinates fit the geometry type and every number is in range; else adds problems.</summary>
    public bool Check(JsonElement coordinates, string geometryType, string path)
    {
        var before = problems.Count;
        switch (geometryType)
        {
            case "Point":
                Position(coordinates, path);
                break;
            case "LineString":
                LineString(coordinates, path);
                break;
            case "Polygon":
                Polygon(coordinates, path);
                break;
            case "MultiPolygon":
                if (ArrayOf(coordinates, path, 1, "an array of polygons (RFC 7946 §3.1.7)"))
                {
                    Each(coordinates, path, Polygon);
                }

                break;
        }

        return problems.Count == before;
    }

    /// <summary>How many positions a geometry's coordinates hold, counted without checking them.</summary>
    public static int CountPositions(JsonElement coordinates) =>
        coordinates.ValueKind != JsonValueKind.Array ? 0
        : coordinates.GetArrayLength() > 0 && coordinates[0].ValueKind == JsonValueKind.Number ? 1
        : coordinates.EnumerateArray().Sum(CountPositions);

    private void LineString(JsonElement value, string path)
    {
        if (ArrayOf(value, path, 2, "a LineString: an array of at least 2 positions (RFC 7946 §3.1.4)"))
        {
            Each(value, path, Position);
        }
    }

    private void Polygon(JsonElement value, string path)
    {
        if (ArrayOf(value, path, 1, "a Polygon: an array of linear rings, the outer ring first (RFC 7946 §3.1.6)"))
        {
            Each(value, path, Ring);
        }
    }

    private void Ring(JsonElement value, string path)
    {
        const string ring = "a linear ring: an array of at least 4 positions whose last equals its first (RFC 7946 §3.1.6)";
        if (!ArrayOf(value, path, 4, ring))
        {
            return;
        }

        var before = problems.Count;
        Each(value, path, Position);
        if (problems.Count == before && !SamePosition(value[0], value[value.GetArrayLength() - 1]))
        {
            problems.Add(new(path, $"Expected {ring}; this one does not end where it starts."));
        }
    }

    private void Position(JsonElement value, string path)
    {
        if (value.ValueKind != JsonValueKind.Array || value.GetArrayLength() is < 2 or > 3)
        {
            problems.Add(new(path, $"Expected a position: [x, y] or [x, y, altitude] (RFC 7946 §3.1.1); it is {JsonText.Describe(value)}."));
            return;
        }

        for (var axis = 0; axis < value.GetArrayLength(); axis++)
        {
            var number = value[axis];
            var at = $"{path}[{axis}]";
            if (number.ValueKind != JsonValueKind.Number)
            {
                problems.Add(new(at, $"A coordinate must be a number; it is {JsonText.Describe(number)}."));
            }
            else if (!number.TryGetDouble(out var x) || !double.IsFinite(x))
            {
                problems.Add(new(at, $"{number.GetRawText()} is too large to be a coordinate."));
            }
            else if (RangeProblem(axis, x) is { } message)
            {
                problems.Add(new(at, message));
            }
        }
    }

    /// <summary>What is wrong with a coordinate for the plan's system, or null when it is in range.</summary>
    private string? RangeProblem(int axis, double value)
    {
        if (system is null || system.IsLocalMetres || axis == 2)
        {
            return null;
        }

        if (system.IsGeographic)
        {
            return axis == 0
                ? value is < -180 or > 180 ? Invariant($"Longitude {value} is outside -180 to 180 degrees.") : null
                : value is < -90 or > 90 ? Invariant($"Latitude {value} is outside -90 to 90 degrees; GeoJSON writes longitude first, then latitude.") : null;
        }

        return axis == 0
            ? value is < 0 or > 1_000_000 ? Invariant($"A UTM easting must be from 0 to 1000000 m; it is {value}.") : null
            : value is < 0 or > 10_000_000 ? Invariant($"A UTM northing must be from 0 to 10000000 m; it is {value}.") : null;
    }

    private bool ArrayOf(JsonElement value, string path, int minimumLength, string expected)
    {
        if (value.ValueKind == JsonValueKind.Array && value.GetArrayLength() >= minimumLength)
        {
            return true;
        }

        problems.Add(new(path, $"Expected {expected}; it is {JsonText.Describe(value)}."));
        return false;
    }

    // A few problems show what to fix; thousands (an array of numbers where positions belong) would only bloat the answer.
    private void Each(JsonElement array, string path, Action<JsonElement, string> check)
    {
        var before = problems.Count;
        var index = 0;
        foreach (var item in array.EnumerateArray())
        {
            if (problems.Count - before >= MaxProblemsPerArray)
            {
                problems.Add(new(path, $"More of its {array.GetArrayLength()} items are wrong; only the first {MaxProblemsPerArray} problems are listed."));
                return;
            }

            check(item, $"{path}[{index++}]");
        }
    }

    private static bool SamePosition(JsonElement a, JsonElement b) =>
        a.GetArrayLength() >= 2 && b.GetArrayLength() >= 2
        && a[0].GetDouble() == b[0].GetDouble() && a[1].GetDouble() == b[1].GetDouble();
}
