using System.Globalization;
using System.Text;
using System.Text.Json;
using Microsoft.AspNetCore.Http.HttpResults;
using Microsoft.AspNetCore.Http.Metadata;
using Microsoft.Extensions.Options;
using SafetyMirror.Api.Access;
using SafetyMirror.Api.Features.Evaluations;
using SafetyMirror.Api.Features.Studies;
using SafetyMirror.Api.Json;
using SafetyMirror.Api.Requests;
using SafetyMirror.Core.Design;
using SafetyMirror.Studies;

namespace SafetyMirror.Api.Features.Batches;

/// <summary>Routes that screen a whole district in one batch: post it, follow it, take its layer, cancel and resume it.</summary>
/// <remarks>Every route needs a key; a batch is its poster's (the key's owner): another owner's batch answers 404.</remarks>
public static class BatchEndpoints
{
    /// <summary>The GeoPackage media type (OGC GeoPackage, IANA registration).</summary>
    public const string GeoPackage = "application/geopackage+sqlite3";

    /// <summary>Maps the <c>/batches</c> routes on the given route builder; each one requires a key.</summary>
    public static RouteGroupBuilder MapBatches(this IEndpointRouteBuilder routes)
    {
        var group = routes.MapGroup("/batches").WithTags("Batches").RequireApiKey();
        group.MapPost("/", Post)
            .WithName("PostBatch")
            .WithMetadata(new BatchBodyLimit(routes.ServiceProvider.GetRequiredService<BatchOptions>().MaxBodyBytes))
            // One Accepts: routing takes the last one as the only media types the route matches.
            .Accepts<BatchDocumentation.District>(PlanLayers.MediaType, "application/json", BatchReader.SequenceMediaType)
            .Produces<BatchResponse>(StatusCodes.Status202Accepted)
            .ProducesValidationProblem()
            .ProducesProblem(StatusCodes.Status503ServiceUnavailable)
            .WithSummary("Screen a district: many corners in one batch")
            .WithDescription(BatchDocumentation.PostDescription);
        group.MapGet("/{id:guid}", Get)
            .WithName("GetBatch")
            .ProducesProblem(StatusCodes.Status404NotFound)
            .WithSummary("A batch's progress and its corners' outcomes")
            .WithDescription(
                "Counts (total, pending, running, done, failed), the rate in corners per second and the estimated time left, and a page "
                + "of the corners in batch order ('offset', 'limit' 1 to 1000, default 100): each done corner's outcome (decision, "
                + "required and provided sight distance per approach, longest unseen stretch, the mirror face) with a link to the study "
                + "that keeps it, each failed corner's problem details naming the offending fields of the posted batch.");
        group.MapGet("/{id:guid}/layer", Layer)
            .WithName("GetBatchLayer")
            .Produces<string>(StatusCodes.Status200OK, PlanLayers.MediaType, GeoPackage)
            .ProducesProblem(StatusCodes.Status404NotFound)
            .WithSummary("The batch's results as one GIS layer: GeoJSON or GeoPackage")
            .WithDescription(
                "A point per corner at its driver's eye, with its status, decision, the deciding approach's required and provided "
                + "sight distance, the longest unseen stretch, the mirror face (pole, size, radius, height, aim), the study's id and, "
                + "for a failed corner, its problem. GeoJSON by default; Accept: application/geopackage+sqlite3 (or format=gpkg) gives "
                + "an OGC GeoPackage that a GIS opens in one click. Corners not yet recorded are in it as pending.");
        group.MapPost("/{id:guid}/cancel", Cancel)
            .WithName("CancelBatch")
            .ProducesProblem(StatusCodes.Status404NotFound)
            .WithSummary("Cancel a batch")
            .WithDescription("Workers stop within a corner; corners already recorded stay, the rest stay pending until the batch is resumed.");
        group.MapPost("/{id:guid}/resume", Resume)
            .WithName("ResumeBatch")
            .Produces<BatchResponse>(StatusCodes.Status202Accepted)
            .ProducesProblem(StatusCodes.Status404NotFound)
            .WithSummary("Resume a batch")
            .WithDescription("Queues the corners not yet recorded again, whether the batch was cancelled or its jobs were lost; recorded corners are never screened again.");
        return group;
    }

    private static async Task<Results<Accepted<BatchResponse>, ValidationProblem, ProblemHttpResult>> Post(
        HttpContext http, IBatchStore store, BatchQueue queue, BatchOptions options, JobSchema jobs, IOptions<Microsoft.AspNetCore.Http.Json.JsonOptions> json)
    {
        if (!jobs.IsReady)
        {
            // The queue's tables are not there yet (the database is late): store nothing that no job would pick up.
            http.Response.Headers.RetryAfter = "10";
            return TypedResults.Problem(
                statusCode: StatusCodes.Status503ServiceUnavailable,
                title: "The batch queue is not ready yet.",
                detail: "The service cannot reach its job storage just now; nothing was stored. Try again in 10 s.");
        }

        string body;
        using (var reader = new StreamReader(http.Request.Body, Encoding.UTF8))
        {
            body = await reader.ReadToEndAsync(http.RequestAborted);
        }

        var errors = new RequestErrors();
        var split = BatchReader.Read(body, http.Request.ContentType, options.MaxCorners, json.Value.SerializerOptions, errors);
        if (split is null || !errors.IsEmpty)
        {
            return errors.ToValidationProblem("The batch cannot be taken as sent; nothing was stored.");
        }

        var batch = await store.CreateBatchAsync(
            new NewBatch(split.Name, StudyEndpoints.OwnerOf(http.User), Math.Max(1, options.CornersPerJob)), split.Corners, http.RequestAborted);
        queue.Enqueue(batch, await store.UnfinishedPositionsAsync(batch.Id, http.RequestAborted));
        return TypedResults.Accepted($"/v1/batches/{batch.Id}", await DescribeAsync(batch, store, 0, 100, json.Value.SerializerOptions, http.RequestAborted));
    }

    private static async Task<Results<Ok<BatchResponse>, ProblemHttpResult>> Get(
        Guid id, HttpContext http, IBatchStore store, int? offset, int? limit, IOptions<Microsoft.AspNetCore.Http.Json.JsonOptions> json)
    {
        if (await OwnedAsync(id, http, store) is not { } batch)
        {
            return NotFound();
        }

        var (from, count) = (Math.Max(0, offset ?? 0), Math.Clamp(limit ?? 100, 1, 1000));
        return TypedResults.Ok(await DescribeAsync(batch, store, from, count, json.Value.SerializerOptions, http.RequestAborted));
    }

    private static async Task<IResult> Layer(Guid id, HttpContext http, IBatchStore store, string? format, IOptions<Microsoft.AspNetCore.Http.Json.JsonOptions> json)
    {
        if (await OwnedAsync(id, http, store) is not { } batch)
        {
            return NotFound();
        }

        var corners = await AllCornersAsync(batch, store, http.RequestAborted);
        var wantsPackage = format is not null
            ? format.Equals("gpkg", StringComparison.OrdinalIgnoreCase)
            : http.Request.Headers.Accept.ToString().Contains(GeoPackage, StringComparison.OrdinalIgnoreCase);
        if (format is not null && !wantsPackage && !format.Equals("geojson", StringComparison.OrdinalIgnoreCase))
        {
            var errors = new RequestErrors();
            errors.Add("format", "geojson or gpkg.");
            return errors.ToValidationProblem("There is no such layer format.");
        }

        var serializer = json.Value.SerializerOptions;
        var layer = BatchLayer.Features(batch, corners, serializer);
        return wantsPackage
            ? TypedResults.File(BatchLayer.ToGeoPackage(batch, layer, BatchLayer.AllGeographic(corners, serializer)), GeoPackage, $"batch-{batch.Id}.gpkg")
            : TypedResults.Text(BatchLayer.ToGeoJson(batch, layer, serializer), PlanLayers.MediaType, Encoding.UTF8);
    }

    private static async Task<Results<Ok<BatchResponse>, ProblemHttpResult>> Cancel(
        Guid id, HttpContext http, IBatchStore store, IOptions<Microsoft.AspNetCore.Http.Json.JsonOptions> json)
    {
        if (await OwnedAsync(id, http, store) is not { } batch)
        {
            return NotFound();
        }

        await store.SetBatchStateAsync(id, BatchState.Cancelled, http.RequestAborted);
        return TypedResults.Ok(await DescribeAsync(batch with { State = BatchState.Cancelled }, store, 0, 100, json.Value.SerializerOptions, http.RequestAborted));
    }

    private static async Task<Results<Accepted<BatchResponse>, ProblemHttpResult>> Resume(
        Guid id, HttpContext http, IBatchStore store, BatchQueue queue, IOptions<Microsoft.AspNetCore.Http.Json.JsonOptions> json)
    {
        if (await OwnedAsync(id, http, store) is not { } batch)
        {
            return NotFound();
        }

        await store.SetBatchStateAsync(id, BatchState.Active, http.RequestAborted);
        queue.Enqueue(batch, await store.UnfinishedPositionsAsync(id, http.RequestAborted));
        return TypedResults.Accepted($"/v1/batches/{id}", await DescribeAsync(batch with { State = BatchState.Active }, store, 0, 100, json.Value.SerializerOptions, http.RequestAborted));
    }

    private static async Task<BatchRecord?> OwnedAsync(Guid id, HttpContext http, IBatchStore store) =>
        await store.GetBatchAsync(id, http.RequestAborted) is { } batch && batch.Owner == StudyEndpoints.OwnerOf(http.User) ? batch : null;

    /// <summary>Every corner of a batch, read a page at a time.</summary>
    private static async Task<List<BatchCorner>> AllCornersAsync(BatchRecord batch, IBatchStore store, CancellationToken cancellationToken)
    {
        const int Page = 2000;
        var corners = new List<BatchCorner>(batch.Counts.Total);
        for (var offset = 0; offset < batch.Counts.Total; offset += Page)
        {
            corners.AddRange(await store.ListCornersAsync(batch.Id, offset, Page, cancellationToken));
        }

        return corners;
    }

    /// <summary>The batch as just read (its counts and state) with a page of its corners; the caller's read is not repeated.</summary>
    private static async Task<BatchResponse> DescribeAsync(
        BatchRecord fresh, IBatchStore store, int offset, int limit, JsonSerializerOptions json, CancellationToken cancellationToken)
    {
        var corners = await store.ListCornersAsync(fresh.Id, offset, limit, cancellationToken);
        var counts = fresh.Counts;
        var unrecorded = counts.Pending + counts.Running;
        var state = unrecorded == 0 ? "finished" : fresh.State == BatchState.Cancelled ? "cancelled" : fresh.StartedAt is null ? "queued" : "running";
        double? rate = null;
        if (fresh.StartedAt is { } started && fresh.LastFinishedAt is { } last && last > started && counts.Finished > 0)
        {
            rate = Math.Round(counts.Finished / (last - started).TotalSeconds, 2);
        }

        var self = $"/v1/batches/{fresh.Id}";
        return new BatchResponse(
            fresh.Id, fresh.Name, state,
            new BatchCountsResponse(counts.Total, counts.Pending, counts.Running, counts.Done, counts.Failed),
            rate,
            rate is > 0 && unrecorded > 0 && state == "running" ? Math.Round(unrecorded / rate.Value, 1) : null,
            fresh.CreatedAt, fresh.StartedAt, fresh.LastFinishedAt,
            new BatchLinksResponse(self, $"{self}/layer", $"{self}/layer?format=gpkg", $"{self}/cancel", $"{self}/resume"),
            [.. corners.Select(corner => Describe(corner, json))],
            offset, limit,
            BatchLayer.Cautions);
    }

    private static BatchCornerResponse Describe(BatchCorner corner, JsonSerializerOptions json)
    {
        using var problem = corner.ProblemJson is null ? null : JsonDocument.Parse(corner.ProblemJson);
        return new BatchCornerResponse(
            corner.Position, corner.Corner, corner.Name, corner.Status.ToString().ToLowerInvariant(), corner.Attempts, corner.Worker, corner.FinishedAt,
            corner.OutcomeJson is null ? null : JsonSerializer.Deserialize<CornerOutcome>(corner.OutcomeJson, json),
            problem?.RootElement.Clone(),
            corner.StudyId is { } study ? $"/v1/studies/{study}" : null);
    }

    private static ProblemHttpResult NotFound() => TypedResults.Problem(
        statusCode: StatusCodes.Status404NotFound,
        title: "There is no such batch.",
        detail: "No batch of the caller's has this id.");

    /// <summary>The larger body a district batch may have.</summary>
    private sealed record BatchBodyLimit(long? MaxRequestBodySize) : IRequestSizeLimitMetadata;
}
