using System.Diagnostics;
using Hangfire;
using Microsoft.Extensions.Options;
using SafetyMirror.Api.Limits;
using SafetyMirror.Api.Requests;
using SafetyMirror.Api.Service;
using SafetyMirror.Studies;

namespace SafetyMirror.Api.Features.Batches;

/// <summary>
/// The job engine's unit of work: screens a run of consecutive corners of a batch. Hangfire hands each job to one worker
/// and gives it to another when that worker's process dies; a corner is recorded once whichever worker gets there first.
/// </summary>
public sealed class BatchJob(IBatchStore store, BatchOptions options, RequestLimits limits, IOptions<Microsoft.AspNetCore.Http.Json.JsonOptions> json, ILogger<BatchJob> log)
{
    /// <summary>Corners this instance screened, tagged outcome=done|failed: the batch progress an operator watches.</summary>
    private static readonly System.Diagnostics.Metrics.Counter<long> BatchCorners =
        ServiceTelemetry.Meter.CreateCounter<long>("safetymirror.batch.corners", "{corner}", "District corners screened by this instance's batch workers.");

    /// <summary>This process's name among the workers, recorded beside each corner it screens.</summary>
    public static string Worker { get; } = $"{Environment.MachineName}:{Environment.ProcessId}";

    /// <summary>Screens the batch's corners at positions <paramref name="first"/> to <paramref name="last"/> that are not recorded yet.</summary>
    /// <remarks>Stops between corners when the batch is cancelled (the unscreened ones go back to pending) or the worker shuts down.</remarks>
    [AutomaticRetry(Attempts = 3)]
    public async Task RunAsync(Guid batchId, int first, int last, CancellationToken cancellationToken)
    {
        // A job for a batch this store does not hold means two deployments share one queue: fail loudly, lose nothing.
        var batch = await store.GetBatchAsync(batchId, cancellationToken)
            ?? throw new InvalidOperationException($"Batch {batchId} is not in this instance's store; instances sharing a job queue must share the study database.");

        var claimed = await store.ClaimCornersAsync(batchId, first, last, Worker, cancellationToken);
        var results = new List<CornerResult>();
        var sinceFlush = Stopwatch.StartNew();
        var sinceStateRead = Stopwatch.StartNew();
        for (var i = 0; i < claimed.Count; i++)
        {
            // A cancel is seen within a corner or so; what was screened is kept, the rest waits for a resume.
            if (sinceStateRead.Elapsed >= options.CancelCheckEvery && await store.GetBatchStateAsync(batchId, cancellationToken) != BatchState.Active)
            {
                await store.RecordCornersAsync(batchId, results, cancellationToken);
                await store.ReleaseCornersAsync(batchId, [.. claimed.Skip(i).Select(c => c.Position)], cancellationToken);
                return;
            }

            sinceStateRead.Restart();
            results.Add(Screen(claimed[i], batch, cancellationToken));
            BatchCorners.Add(1, new KeyValuePair<string, object?>("outcome", results[^1].OutcomeJson is null ? "failed" : "done"));
            if (sinceFlush.Elapsed >= options.RecordEvery)
            {
                await store.RecordCornersAsync(batchId, results, cancellationToken);
                results.Clear();
                sinceFlush.Restart();
            }
        }

        await store.RecordCornersAsync(batchId, results, cancellationToken);
    }

    /// <summary>One corner under the service's work deadline; a corner that overruns it fails, and the batch goes on.</summary>
    private CornerResult Screen(ClaimedCorner corner, BatchRecord batch, CancellationToken stopping)
    {
        using var deadline = CancellationTokenSource.CreateLinkedTokenSource(stopping);
        deadline.CancelAfter(limits.Work.Deadline);
        try
        {
            return CornerScreening.Screen(corner, batch, Worker, json.Value.SerializerOptions, deadline.Token);
        }
        catch (OperationCanceledException) when (!stopping.IsCancellationRequested)
        {
            var errors = new RequestErrors();
            errors.Add("", $"Screening this corner took longer than {limits.Work.DeadlineSeconds} s, the service's limit for one corner; simplify its plan or study it alone.");
            return CornerResult.Failed(corner.Position, Worker, CornerFailure.Write(corner.Corner, errors));
        }
#pragma warning disable CA1031 // One corner's unforeseen failure must not stop the district; it is logged and recorded.
        catch (Exception e) when (e is not OperationCanceledException)
#pragma warning restore CA1031
        {
            log.LogError(e, "Corner {Corner} of batch {Batch} failed unexpectedly", corner.Corner, batch.Id);
            var errors = new RequestErrors();
            errors.Add("", "The service could not screen this corner; it is logged. Study it alone, or tell the service's operators.");
            return CornerResult.Failed(corner.Position, Worker, CornerFailure.Write(corner.Corner, errors));
        }
    }
}
