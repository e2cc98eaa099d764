using System.Text.Json;
using Microsoft.AspNetCore.Mvc;

namespace SafetyMirror.Api.Service;

/// <summary>Writes a problem-details answer from middleware, whatever the client says it accepts.</summary>
internal static class ProblemWriter
{
    /// <summary>Sets the status and writes the problem through the problem-details service, or as plain problem JSON.</summary>
    public static async Task WriteAsync(HttpContext context, ProblemDetails problem)
    {
        context.Response.StatusCode = problem.Status ?? StatusCodes.Status500InternalServerError;
        var problems = context.RequestServices.GetRequiredService<IProblemDetailsService>();
        if (await problems.TryWriteAsync(new ProblemDetailsContext { HttpContext = context, ProblemDetails = problem }))
        {
            return;
        }

        // A client that accepts only another type (a report as PDF, say) must still learn why it was refused.
        await context.Response.WriteAsJsonAsync(problem, problem.GetType(), (JsonSerializerOptions?)null, "application/problem+json");
    }
}
