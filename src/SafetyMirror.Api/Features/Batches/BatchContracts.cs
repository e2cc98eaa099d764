using System.Text.Json;
using SafetyMirror.Api.Features.Evaluations;

namespace SafetyMirror.Api.Features.Batches;

/// <summary>A batch's progress and a page of its corners' outcomes.</summary>
/// <param name="Id">The batch's id.</param>
/// <param name="Name">Its name.</param>
/// <param name="State">"queued", "running", "finished" or "cancelled".</param>
/// <param name="Counts">How many corners stand where.</param>
/// <param name="CornersPerSecond">Corners recorded per second since the first was claimed, or null before any.</param>
/// <param name="EstimatedSecondsLeft">At that rate, seconds until every corner is recorded; null when unknown or finished.</param>
/// <param name="CreatedAt">When it was posted.</param>
/// <param name="StartedAt">When a worker first claimed a corner.</param>
/// <param name="LastFinishedAt">When the latest corner was recorded.</param>
/// <param name="Links">Where its parts are.</param>
/// <param name="Corners">A page of the corners, in batch order.</param>
/// <param name="Offset">The page's first corner.</param>
/// <param name="Limit">The page's size.</param>
/// <param name="Cautions">The cautions that go with any screening.</param>
public sealed record BatchResponse(
    Guid Id,
    string Name,
    string State,
    BatchCountsResponse Counts,
    double? CornersPerSecond,
    double? EstimatedSecondsLeft,
    DateTimeOffset CreatedAt,
    DateTimeOffset? StartedAt,
    DateTimeOffset? LastFinishedAt,
    BatchLinksResponse Links,
    IReadOnlyList<BatchCornerResponse> Corners,
    int Offset,
    int Limit,
    IReadOnlyList<CautionResponse> Cautions);

/// <summary>How many corners stand where.</summary>
/// <param name="Total">Corners in the batch.</param>
/// <param name="Pending">Waiting for a worker (held back while the batch is cancelled).</param>
/// <param name="Running">Claimed by a worker.</param>
/// <param name="Done">Screened, each kept as a study.</param>
/// <param name="Failed">Could not be screened; each with its problem details.</param>
public sealed record BatchCountsResponse(int Total, int Pending, int Running, int Done, int Failed);

/// <summary>Where a batch's parts are.</summary>
/// <param name="Self">The batch.</param>
/// <param name="Layer">Its results as one GeoJSON layer.</param>
/// <param name="GeoPackage">The same layer as an OGC GeoPackage.</param>
/// <param name="Cancel">POST here to cancel.</param>
/// <param name="Resume">POST here to resume.</param>
public sealed record BatchLinksResponse(string Self, string Layer, string GeoPackage, string Cancel, string Resume);

/// <summary>One corner's place in the batch and, once recorded, its outcome or its problem.</summary>
/// <param name="Position">Its place in the batch, from 0.</param>
/// <param name="Corner">Its id in the posted layer.</param>
/// <param name="Name">Its name.</param>
/// <param name="Status">"pending", "running", "done" or "failed".</param>
/// <param name="Attempts">How many times a worker claimed it (more than one after a worker stopped).</param>
/// <param name="Worker">The worker that recorded it, or holds it.</param>
/// <param name="FinishedAt">When it was recorded.</param>
/// <param name="Outcome">What it came to, when done.</param>
/// <param name="Problem">RFC 9457 problem details naming the offending fields of the posted batch, when failed.</param>
/// <param name="Study">The study that keeps it, when done: open it, revise it, report on it.</param>
public sealed record BatchCornerResponse(
    int Position, string Corner, string Name, string Status, int Attempts, string? Worker, DateTimeOffset? FinishedAt,
    CornerOutcome? Outcome, JsonElement? Problem, string? Study);
