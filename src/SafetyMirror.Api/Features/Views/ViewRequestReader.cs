using SafetyMirror.Api.Requests;
using SafetyMirror.Core.Design;
using SafetyMirror.Core.Design.Evaluation;
using SafetyMirror.Core.Site;
using SafetyMirror.Core.View;

namespace SafetyMirror.Api.Features.Views;

/// <summary>Turns the picture's options into the Core's, recording every problem under <c>view…</c>.</summary>
internal static class ViewRequestReader
{
    /// <summary>Reads the picture's size, field of view and extra road users; the plan, when read, names the approaches.</summary>
    public static ViewOptions Read(ViewOptionsRequest? request, SitePlan? plan, EvaluationOptions options, RequestErrors errors)
    {
        var defaults = new ViewOptions();
        if (request is null)
        {
            return defaults;
        }

        return defaults with
        {
            WidthPx = (int)errors.Within(request.WidthPx, Ranges.MinViewSidePx, Ranges.MaxViewSidePx, "pixels", "view.widthPx", defaults.WidthPx),
            HeightPx = (int)errors.Within(request.HeightPx, Ranges.MinViewSidePx, Ranges.MaxViewSidePx, "pixels", "view.heightPx", defaults.HeightPx),
            FieldOfViewDeg = request.FieldOfViewDeg is null
                ? null
                : errors.Within(request.FieldOfViewDeg, Ranges.MinFieldOfViewDeg, Ranges.MaxFieldOfViewDeg, "degrees", "view.fieldOfViewDeg", Ranges.MinFieldOfViewDeg),
            ExtraRoadUsers = ReadRoadUsers(request.RoadUsers, plan, options, errors),
        };
    }

    private static List<RoadUserAtStation> ReadRoadUsers(IReadOnlyList<ViewRoadUserRequest>? requests, SitePlan? plan, EvaluationOptions options, RequestErrors errors)
    {
        var placed = new List<RoadUserAtStation>();
        for (var i = 0; i < (requests?.Count ?? 0); i++)
        {
            var at = $"view.roadUsers[{i}]";
            if (requests![i] is not { } request)
            {
                errors.Add(at, "Required: an object with approach, stationM and, optionally, roadUser.");
                continue;
            }

            var stationM = errors.Required(request.StationM, 0, Ranges.MaxDistanceM, "m", $"{at}.stationM");
            var user = request.RoadUser is null
                ? options.DesignRoadUser
                : options.RoadUsers.FirstOrDefault(u => u.Id == request.RoadUser) ?? RoadUsers.Find(request.RoadUser);
            if (user is null)
            {
                errors.Add($"{at}.roadUser", $"No road user has the id \"{request.RoadUser}\"; list it in options.roadUsers or name a design road user ({string.Join(", ", RoadUsers.Defaults.Select(u => $"\"{u.Id}\""))}).");
            }

            int? approach = null;
            if (request.Approach is null)
            {
                errors.Add($"{at}.approach", "Required: the id of the approach feature the road user stands on.");
            }
            else if (plan is not null)
            {
                approach = ApproachIds.Find(plan, request.Approach, $"{at}.approach", errors);
            }

            if (approach is { } index && user is not null)
            {
                placed.Add(new RoadUserAtStation(index, stationM, user));
            }
        }

        return placed;
    }
}
