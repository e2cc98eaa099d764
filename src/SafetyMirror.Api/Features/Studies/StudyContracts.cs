using System.ComponentModel;
using System.ComponentModel.DataAnnotations;
using System.Text.Json;
using System.Text.Json.Serialization;
using SafetyMirror.Api.Features.Recommendations;
using SafetyMirror.Api.Requests;

namespace SafetyMirror.Api.Features.Studies;

/// <summary>A new study: its title and site, and the corner request of its first revision.</summary>
[JsonUnmappedMemberHandling(JsonUnmappedMemberHandling.Disallow)]
public sealed record StudyRequest
{
    /// <summary>A short name for the study.</summary>
    [Description("A short name for the study (required), at most 300 characters; it also titles the study's reports.")]
    [MaxLength(Ranges.MaxReportTextLength)]
    public string? Title { get; init; }

    /// <summary>The site in words.</summary>
    [Description("The site in words (streets, a file reference), at most 300 characters; searched by the study list.")]
    [MaxLength(Ranges.MaxReportTextLength)]
    public string? Site { get; init; }

    /// <summary>The corner plan: an RFC 7946 FeatureCollection.</summary>
    [Description("The corner plan, as for POST /v1/evaluations. A WGS84 plan also places the study on the map for the list's bbox filter.")]
    public JsonElement Plan { get; init; }

    /// <summary>The mirror to judge; absent for a recommendation.</summary>
    [Description("The mirror to judge, as for POST /v1/evaluations; leave it out to have the service recommend one.")]
    public MirrorRequest? Mirror { get; init; }

    /// <summary>The options; every one has a default.</summary>
    public RecommendationOptionsRequest? Options { get; init; }

    /// <summary>Why the revision was made.</summary>
    [Description("Why this revision was made, at most 300 characters.")]
    [MaxLength(Ranges.MaxReportTextLength)]
    public string? Note { get; init; }
}

/// <summary>A changed corner request for a study's next revision.</summary>
[JsonUnmappedMemberHandling(JsonUnmappedMemberHandling.Disallow)]
public sealed record RevisionRequest
{
    /// <summary>The corner plan: an RFC 7946 FeatureCollection.</summary>
    [Description("The corner plan, as for POST /v1/evaluations.")]
    public JsonElement Plan { get; init; }

    /// <summary>The mirror to judge; absent for a recommendation.</summary>
    [Description("The mirror to judge, as for POST /v1/evaluations; leave it out to have the service recommend one.")]
    public MirrorRequest? Mirror { get; init; }

    /// <summary>The options; every one has a default.</summary>
    public RecommendationOptionsRequest? Options { get; init; }

    /// <summary>Why the revision was made.</summary>
    [Description("Why this revision was made (the site visit, a reviewer's question), at most 300 characters.")]
    [MaxLength(Ranges.MaxReportTextLength)]
    public string? Note { get; init; }

    /// <summary>The revision the change was based on.</summary>
    [Description("The revision number the change was based on, 1 or more. When given and no longer the newest, nothing is stored and the answer is 409 with the current number; leave it out to append after whatever is newest.")]
    public int? BasedOn { get; init; }
}

/// <summary>A WGS84 box.</summary>
/// <param name="WestDeg">Smallest longitude.</param>
/// <param name="SouthDeg">Smallest latitude.</param>
/// <param name="EastDeg">Largest longitude.</param>
/// <param name="NorthDeg">Largest latitude.</param>
public sealed record BoxResponse(double WestDeg, double SouthDeg, double EastDeg, double NorthDeg);

/// <summary>A WGS84 point.</summary>
/// <param name="LongitudeDeg">Longitude.</param>
/// <param name="LatitudeDeg">Latitude.</param>
public sealed record PointResponse(double LongitudeDeg, double LatitudeDeg);

/// <summary>A line of a study's revision list.</summary>
/// <param name="Number">1, 2, 3, … in order.</param>
/// <param name="Author">Who made it (the key's owner).</param>
/// <param name="CreatedAt">When it was stored.</param>
/// <param name="Note">Why it was made.</param>
/// <param name="Hash">SHA-256 (hex) of the canonical request: plan, options and mirror.</param>
/// <param name="Decision">The evaluation's decision or the recommendation's outcome.</param>
public sealed record RevisionLineResponse(int Number, string Author, DateTimeOffset CreatedAt, string Note, string Hash, string Decision);

/// <summary>A study and its revisions.</summary>
/// <param name="Id">The study's id.</param>
/// <param name="Title">Its title.</param>
/// <param name="Site">The site in words.</param>
/// <param name="SitePoint">The site's point, for WGS84 plans.</param>
/// <param name="Extent">The plan's extent, for WGS84 plans.</param>
/// <param name="Owner">The owner of the key that created it.</param>
/// <param name="Archived">Archived studies stay readable and take no more revisions.</param>
/// <param name="CreatedAt">When it was created.</param>
/// <param name="UpdatedAt">When its newest revision was made.</param>
/// <param name="LatestRevision">The newest revision's number.</param>
/// <param name="Revisions">Every revision, oldest first.</param>
public sealed record StudyResponse(
    Guid Id, string Title, string Site, PointResponse? SitePoint, BoxResponse? Extent, string Owner, bool Archived,
    DateTimeOffset CreatedAt, DateTimeOffset UpdatedAt, int LatestRevision, IReadOnlyList<RevisionLineResponse> Revisions);

/// <summary>A line of the study list.</summary>
/// <param name="Id">The study's id.</param>
/// <param name="Title">Its title.</param>
/// <param name="Site">The site in words.</param>
/// <param name="Extent">The plan's extent, for WGS84 plans.</param>
/// <param name="Archived">Whether it is archived.</param>
/// <param name="LatestRevision">The newest revision's number.</param>
/// <param name="UpdatedAt">When the newest revision was made.</param>
public sealed record StudyLineResponse(Guid Id, string Title, string Site, BoxResponse? Extent, bool Archived, int LatestRevision, DateTimeOffset UpdatedAt);

/// <summary>A page of the caller's studies.</summary>
/// <param name="Items">The studies on this page, most recently revised first.</param>
/// <param name="Total">How many match in all.</param>
/// <param name="Offset">How many were skipped.</param>
/// <param name="Limit">The page size asked for.</param>
public sealed record StudyListResponse(IReadOnlyList<StudyLineResponse> Items, int Total, int Offset, int Limit);

/// <summary>The corner request a revision stored, as it can be sent again.</summary>
/// <param name="Plan">The plan as posted.</param>
/// <param name="Options">The options as read.</param>
/// <param name="Mirror">The mirror, or null for a recommendation.</param>
public sealed record StoredRequestResponse(JsonElement Plan, JsonElement Options, JsonElement? Mirror);

/// <summary>One stored revision: what was asked, what was answered, by which version.</summary>
/// <param name="StudyId">The study.</param>
/// <param name="Number">The revision's number.</param>
/// <param name="Author">Who made it.</param>
/// <param name="CreatedAt">When it was stored.</param>
/// <param name="Note">Why it was made.</param>
/// <param name="Hash">SHA-256 (hex) of the canonical request.</param>
/// <param name="ServiceVersion">The version of the service that answered.</param>
/// <param name="Request">The stored request.</param>
/// <param name="RuleSet">The options in force, defaults included (the answer's options echo).</param>
/// <param name="Evaluation">The evaluation answer, as POST /v1/evaluations gives it, when a mirror was given.</param>
/// <param name="Recommendation">The recommendation answer, as POST /v1/recommendations gives it, when none was.</param>
public sealed record RevisionResponse(
    Guid StudyId, int Number, string Author, DateTimeOffset CreatedAt, string Note, string Hash, string ServiceVersion,
    StoredRequestResponse Request, JsonElement RuleSet, JsonElement? Evaluation, JsonElement? Recommendation);

/// <summary>The figures that decide, for one approach.</summary>
/// <param name="Approach">The approach feature's id (or its index when it has none).</param>
/// <param name="RequiredSightDistanceM">The distance required.</param>
/// <param name="ProvidedSightDistanceM">The distance the mirror provides.</param>
/// <param name="LongestUnseenM">The longest stretch seen neither directly nor in the mirror; null when none.</param>
public sealed record ApproachFiguresResponse(string Approach, double RequiredSightDistanceM, double ProvidedSightDistanceM, double? LongestUnseenM);

/// <summary>One side of a re-run: the answer's decision and figures.</summary>
/// <param name="ServiceVersion">The version that answered.</param>
/// <param name="Decision">The evaluation's decision or the recommendation's outcome.</param>
/// <param name="Summary">The decision in sentences.</param>
/// <param name="Approaches">Per approach (of the first alternative's mirrors, for a recommendation), the deciding figures.</param>
public sealed record RunSideResponse(string ServiceVersion, string Decision, string Summary, IReadOnlyList<ApproachFiguresResponse> Approaches);

/// <summary>A stored revision's answer beside the answer this version gives to the same request.</summary>
/// <param name="StudyId">The study.</param>
/// <param name="Number">The revision re-run.</param>
/// <param name="Hash">The request's hash (the same request on both sides).</param>
/// <param name="Stored">What the revision stored.</param>
/// <param name="Current">What this version answers now.</param>
/// <param name="SameDecision">The decisions agree.</param>
/// <param name="IdenticalAnswer">The answers' JSON is byte for byte the same.</param>
public sealed record RerunResponse(Guid StudyId, int Number, string Hash, RunSideResponse Stored, RunSideResponse Current, bool SameDecision, bool IdenticalAnswer);
