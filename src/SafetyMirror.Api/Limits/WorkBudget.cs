using System.Globalization;
using System.Threading.RateLimiting;
using Microsoft.AspNetCore.Mvc;
using SafetyMirror.Api.Service;

namespace SafetyMirror.Api.Limits;

/// <summary>How much work one costly request may take, bound from "Limits:Work".</summary>
public sealed class WorkLimits
{
    /// <summary>Seconds a costly request may run before it is answered 503; its work is then cancelled.</summary>
    public double DeadlineSeconds { get; init; } = 10;

    /// <summary>Costly requests computed at once; the rest wait in the queue.</summary>
    public int MaxConcurrent { get; init; } = Math.Max(1, Environment.ProcessorCount);

    /// <summary>Costly requests that may wait for a slot; more are answered 503 at once.</summary>
    public int QueueLimit { get; init; } = 32;

    /// <summary>The deadline as a time span.</summary>
    public TimeSpan Deadline => TimeSpan.FromSeconds(DeadlineSeconds);
}

/// <summary>
/// The work budget of costly requests (recommendations, reports): a deadline linked with the client's own abort,
/// and a bounded number of computations at once, so that one client's heavy corner cannot starve the others.
/// </summary>
public sealed class WorkBudget(RequestLimits limits)
{
    private readonly ConcurrencyLimiter slots = new(new ConcurrencyLimiterOptions
    {
        PermitLimit = limits.Work.MaxConcurrent,
        QueueLimit = limits.Work.QueueLimit,
        QueueProcessingOrder = QueueProcessingOrder.OldestFirst,
    });

    /// <summary>The limits the budget enforces.</summary>
    public WorkLimits Limits => limits.Work;

    /// <summary>Waits for a computing slot; the lease is not acquired when the queue is full.</summary>
    internal ValueTask<RateLimitLease> AcquireAsync(CancellationToken cancellationToken) => slots.AcquireAsync(1, cancellationToken);
}

/// <summary>Puts the work budget on routes and runs it.</summary>
public static class WorkBudgetExtensions
{
    /// <summary>Whether the request's route carries the work budget: a costly one.</summary>
    public static bool IsBudgeted(HttpContext context) => context.GetEndpoint()?.Metadata.GetMetadata<Budgeted>() is not null;

    /// <summary>Gives a route or group the work budget, and documents its 503.</summary>
    public static TBuilder WithWorkBudget<TBuilder>(this TBuilder builder)
        where TBuilder : IEndpointConventionBuilder =>
        builder.WithMetadata(Budgeted.Instance)
            .AddEndpointFilter<TBuilder, WorkBudgetFilter>()
            .ProducesProblem(StatusCodes.Status503ServiceUnavailable);

    /// <summary>
    /// On budgeted routes, replaces <see cref="HttpContext.RequestAborted"/> by a token that also fires at the deadline, before
    /// the body is read, so that everything the request does (reading, computing) stops there; a deadline reached outside the
    /// computation is answered 503 too.
    /// </summary>
    public static IApplicationBuilder UseWorkBudget(this IApplicationBuilder app)
    {
        var work = app.ApplicationServices.GetRequiredService<WorkBudget>().Limits;
        return app.Use(async (context, next) =>
        {
            if (context.GetEndpoint()?.Metadata.GetMetadata<Budgeted>() is null)
            {
                await next(context);
                return;
            }

            var clientGone = context.RequestAborted;
            using var deadline = CancellationTokenSource.CreateLinkedTokenSource(clientGone);
            deadline.CancelAfter(work.Deadline);
            context.RequestAborted = deadline.Token;
            try
            {
                await next(context);
            }
            catch (OperationCanceledException) when (deadline.IsCancellationRequested && !clientGone.IsCancellationRequested && !context.Response.HasStarted)
            {
                await ProblemWriter.WriteAsync(context, HeavyInput.OverDeadline(work, "The request", []));
            }
            finally
            {
                context.RequestAborted = clientGone;
            }
        });
    }

    /// <summary>Marks the routes that carry the budget.</summary>
    private sealed class Budgeted
    {
        public static readonly Budgeted Instance = new();
    }
}

/// <summary>Runs a budgeted route's handler in a computing slot and answers 503 when it outruns the deadline.</summary>
internal sealed class WorkBudgetFilter(WorkBudget budget) : IEndpointFilter
{
    public async ValueTask<object?> InvokeAsync(EndpointFilterInvocationContext context, EndpointFilterDelegate next)
    {
        // The deadline token UseWorkBudget put in place: handlers pass HttpContext.RequestAborted to the Core's evaluation and
        // recommendation, which stop at the next approach, aim or position once it fires.
        var deadline = context.HttpContext.RequestAborted;
        try
        {
            var lease = await budget.AcquireAsync(deadline);
            if (!lease.IsAcquired)
            {
                lease.Dispose();
                return Busy(context.HttpContext, budget.Limits);
            }

            // The slot is released when the computation really ends, not when the answer leaves: abandoned work still counts.
            var work = Task.Run(async () =>
            {
                using (lease)
                {
                    return await next(context);
                }
            }, CancellationToken.None);
            return await work.WaitAsync(deadline);
        }
        catch (OperationCanceledException) when (deadline.IsCancellationRequested)
        {
            return TypedResults.Problem(HeavyInput.OverDeadline(budget.Limits, HeavyInput.OperationOf(context), context.Arguments));
        }
    }

    private static IResult Busy(HttpContext http, WorkLimits limits)
    {
        http.Response.Headers.RetryAfter = Math.Max(1, (int)Math.Ceiling(limits.DeadlineSeconds)).ToString(CultureInfo.InvariantCulture);
        return TypedResults.Problem(new ProblemDetails
        {
            Status = StatusCodes.Status503ServiceUnavailable,
            Title = "The service is busy with other costly requests.",
            Detail = $"{limits.MaxConcurrent} recommendations or reports are being computed and {limits.QueueLimit} more are waiting. "
                + "Try again after the Retry-After delay.",
        });
    }
}
