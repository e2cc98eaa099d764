using System.ComponentModel;
using System.ComponentModel.DataAnnotations;
using System.Text.Json;
using System.Text.Json.Serialization;
using SafetyMirror.Api.Requests;

namespace SafetyMirror.Api.Features.Views;

/// <summary>A road user to stand in the picture: on which approach, how far up it, and who.</summary>
[JsonUnmappedMemberHandling(JsonUnmappedMemberHandling.Disallow)]
public sealed record ViewRoadUserRequest
{
    /// <summary>The approach feature's id.</summary>
    [Description("Id of the plan's approach feature it stands on (a numeric GeoJSON id as its decimal string, such as \"11\").")]
    [MaxLength(Ranges.MaxIdLength)]
    public string? Approach { get; init; }

    /// <summary>Station, m.</summary>
    [Description("Metres upstream from the approach's conflict point, 0 to 2000 and not beyond the approach's end; the middle of its front stands there, facing the direction of travel.")]
    [Range(0, Ranges.MaxDistanceM)]
    public double? StationM { get; init; }

    /// <summary>Which road user.</summary>
    [Description("Id of a road user among options.roadUsers or of a design road user (\"passenger-car\", \"single-unit-truck\", \"city-bus\", \"bicycle\", \"motorcycle\", \"pedestrian\"); default: the design road user.")]
    [MaxLength(Ranges.MaxIdLength)]
    public string? RoadUser { get; init; }
}

/// <summary>What picture to render.</summary>
[JsonUnmappedMemberHandling(JsonUnmappedMemberHandling.Disallow)]
public sealed record ViewOptionsRequest
{
    /// <summary>Width, px.</summary>
    [Description("Picture width in pixels, 16 to 1200 (default 600).")]
    [Range(Ranges.MinViewSidePx, Ranges.MaxViewSidePx)]
    public int? WidthPx { get; init; }

    /// <summary>Height, px.</summary>
    [Description("Picture height in pixels, 16 to 1200 (default 600).")]
    [Range(Ranges.MinViewSidePx, Ranges.MaxViewSidePx)]
    public int? HeightPx { get; init; }

    /// <summary>Field of view, degrees across.</summary>
    [Description("Angle across the picture's width, degrees, 0.5 to 120 (default: 1.6 times the backing board's angular width, so the mirror sits in its surroundings).")]
    [Range(Ranges.MinFieldOfViewDeg, Ranges.MaxFieldOfViewDeg)]
    public double? FieldOfViewDeg { get; init; }

    /// <summary>Extra road users.</summary>
    [Description("Road users to stand on the approaches besides the design road user at each approach's required sight distance, at most 20 (drawn blue; those at the required distance red).")]
    [MaxLength(Ranges.MaxViewRoadUsers)]
    public IReadOnlyList<ViewRoadUserRequest>? RoadUsers { get; init; }
}

/// <summary>A corner, one mirror on it and the picture to render of what the waiting driver sees.</summary>
[JsonUnmappedMemberHandling(JsonUnmappedMemberHandling.Disallow)]
public sealed record ViewRequest
{
    /// <summary>The corner plan: an RFC 7946 FeatureCollection.</summary>
    [Description("The corner plan, as for POST /v1/evaluations: an RFC 7946 GeoJSON FeatureCollection whose features carry properties.role.")]
    public JsonElement Plan { get; init; }

    /// <summary>The mirror.</summary>
    public MirrorRequest? Mirror { get; init; }

    /// <summary>The options, as for an evaluation: they fix the eye, the design road user and the required distances.</summary>
    public CornerOptionsRequest? Options { get; init; }

    /// <summary>The picture.</summary>
    public ViewOptionsRequest? View { get; init; }
}
