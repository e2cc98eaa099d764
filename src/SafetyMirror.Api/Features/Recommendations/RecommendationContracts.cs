using System.ComponentModel;
using System.ComponentModel.DataAnnotations;
using System.Text.Json;
using System.Text.Json.Serialization;
using SafetyMirror.Api.Requests;

namespace SafetyMirror.Api.Features.Recommendations;

/// <summary>A mirror that can be ordered: a default catalogue entry by id, or a custom one with its face and radius.</summary>
[JsonUnmappedMemberHandling(JsonUnmappedMemberHandling.Disallow)]
public sealed record CatalogueEntryRequest
{
    /// <summary>A default entry's id, or a custom entry's own id.</summary>
    [Description("Kebab-case id. Alone, it names a default entry: \"rectangular-450x600\", \"round-600\", \"rectangular-600x800\", \"round-800\" or \"round-1000\"; with a face and radiusM it names a custom entry. A rectangular id gives the sides short first; faces are always written width × height: \"rectangular-450x600\" is a 600 × 450 mm face, 600 mm wide and 450 mm high.")]
    [MaxLength(Ranges.MaxIdLength)]
    public string? Id { get; init; }

    /// <summary>Custom: round face diameter, m.</summary>
    [Description("Custom entry: diameter of a round face, metres, 0.1 to 3. Give this, or widthM and heightM.")]
    [Range(Ranges.MinFaceM, Ranges.MaxFaceM)]
    public double? DiameterM { get; init; }

    /// <summary>Custom: rectangular face width, m.</summary>
    [Description("Custom entry: width of a rectangular face, metres, 0.1 to 3 (it hangs with this side horizontal).")]
    [Range(Ranges.MinFaceM, Ranges.MaxFaceM)]
    public double? WidthM { get; init; }

    /// <summary>Custom: rectangular face height, m.</summary>
    [Description("Custom entry: height of a rectangular face, metres, 0.1 to 3.")]
    [Range(Ranges.MinFaceM, Ranges.MaxFaceM)]
    public double? HeightM { get; init; }

    /// <summary>Custom: radius of curvature, m.</summary>
    [Description("Custom entry: radius of curvature, metres, 0.3 to 50; it must exceed half the face's largest extent.")]
    [Range(Ranges.MinRadiusM, Ranges.MaxRadiusM)]
    public double? RadiusM { get; init; }

    /// <summary>Custom: where size and radius come from.</summary>
    [Description("Custom entry: where the size and radius come from, such as the maker's data sheet, at most 200 characters (default \"set in the request\").")]
    [MaxLength(Ranges.MaxNameLength)]
    public string? Source { get; init; }
}

/// <summary>How a corner is judged and what the recommendation searches over.</summary>
/// <remarks>Every member of the evaluation's options, plus the search's own.</remarks>
[JsonUnmappedMemberHandling(JsonUnmappedMemberHandling.Disallow)]
public sealed record RecommendationOptionsRequest : CornerOptionsRequest
{
    /// <summary>Ids of the approach features the mirror must serve.</summary>
    [Description("Ids of the plan's approach features the design must serve (a numeric GeoJSON id as its decimal string, such as \"11\"), at least one. Default: every approach whose direct view falls short of its required sight distance.")]
    [MinLength(1), MaxLength(Ranges.MaxServedApproaches)]
    public IReadOnlyList<string>? ServedApproaches { get; init; }

    /// <summary>The mirrors that can be ordered.</summary>
    [Description("The mirrors that can be ordered, 1 to 20 entries; the search tries the smallest face first. Default: the five default entries.")]
    [MinLength(1), MaxLength(Ranges.MaxCatalogueEntries)]
    public IReadOnlyList<CatalogueEntryRequest>? Catalogue { get; init; }

    /// <summary>Lowest centre height, m.</summary>
    [Description("Lowest centre height the pole allows, metres, 0.5 to 10 (default 2.5). The search hangs each face as low as this and the lower-edge clearance allow.")]
    [Range(Ranges.MinCentreHeightM, Ranges.MaxCentreHeightM)]
    public double? MinCentreHeightM { get; init; }

    /// <summary>Highest centre height, m.</summary>
    [Description("Highest centre height the pole allows, metres, 0.5 to 10 and not below minCentreHeightM (default 4); every catalogue face must hang within it above the lower-edge clearance.")]
    [Range(Ranges.MinCentreHeightM, Ranges.MaxCentreHeightM)]
    public double? MaxCentreHeightM { get; init; }

    /// <summary>How many ranked alternatives to return.</summary>
    [Description("How many ranked alternatives to return, 1 to 5 (default 3).")]
    [Range(1, Ranges.MaxAlternatives)]
    public int? Alternatives { get; init; }
}

/// <summary>A corner to find a mirror for.</summary>
[JsonUnmappedMemberHandling(JsonUnmappedMemberHandling.Disallow)]
public sealed record RecommendationRequest
{
    /// <summary>The corner plan: an RFC 7946 FeatureCollection.</summary>
    [Description("The corner plan: an RFC 7946 GeoJSON FeatureCollection whose features carry properties.role (eye, approach, obstacle, mounting-zone, carriageway, footway). Pole positions are proposed in the mounting zones, or else along the carriageway's far edge: the plan needs one or the other. WGS84 by default; a projected plan names its CRS in a top-level \"crs\" member (UTM EPSG codes); \"frame\": \"local-metres\" takes x/y in metres.")]
    public JsonElement Plan { get; init; }

    /// <summary>The options; every one has a default that the answer echoes.</summary>
    public RecommendationOptionsRequest? Options { get; init; }
}
