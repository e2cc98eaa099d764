namespace SafetyMirror.Studies;

/// <summary>One immutable state of a study: the request that was evaluated, the answers, and who made it when.</summary>
/// <param name="StudyId">The study it belongs to.</param>
/// <param name="Number">1 for the first revision, then 2, 3, … without gaps.</param>
/// <param name="Content">The request, the answers, the author and the note.</param>
/// <param name="CreatedAt">When it was stored, from the store's clock.</param>
/// <param name="ContentHash">SHA-256 (lower-case hex) of the canonical request; see <see cref="RequestHash"/>.</param>
public sealed record Revision(
    Guid StudyId,
    int Number,
    RevisionContent Content,
    DateTimeOffset CreatedAt,
    string ContentHash);

/// <summary>What a caller gives for a new revision. JSON documents are kept as text, byte for byte.</summary>
/// <param name="PlanJson">The plan (GeoJSON) as posted.</param>
/// <param name="OptionsJson">The request options as posted.</param>
/// <param name="MirrorJson">The mirror as posted; null when the service recommended one.</param>
/// <param name="ServiceVersion">Version of the service that computed the answers.</param>
/// <param name="RuleSetJson">The rule-set values in force (limits, factors), so a re-run can show what changed.</param>
/// <param name="EvaluationJson">The evaluation answer, if one was made.</param>
/// <param name="RecommendationJson">The recommendation answer, if one was made.</param>
/// <param name="Author">Who made the revision (a person's name or the API key's owner).</param>
/// <param name="Note">Why the revision was made; may be empty.</param>
public sealed record RevisionContent(
    string PlanJson,
    string OptionsJson,
    string? MirrorJson,
    string ServiceVersion,
    string RuleSetJson,
    string? EvaluationJson,
    string? RecommendationJson,
    string Author,
    string Note)
{
    /// <summary>The hash this content's request has; see <see cref="RequestHash"/>.</summary>
    public string RequestHashHex() => RequestHash.Of(PlanJson, OptionsJson, MirrorJson);
}

/// <summary>A line of a study's revision list.</summary>
public sealed record RevisionSummary(int Number, string Author, DateTimeOffset CreatedAt, string Note, string ContentHash);
