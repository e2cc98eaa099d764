using System.Text.Json;
using Microsoft.AspNetCore.Diagnostics;
using Microsoft.AspNetCore.Mvc;

namespace SafetyMirror.Api.Errors;

/// <summary>Turns a request the framework could not read (bad JSON, body too large, wrong media type) into problem details.</summary>
/// <remarks>Every other exception falls through to the default handler: a bare 500 problem without a stack trace.</remarks>
internal sealed class BadRequestExceptionHandler(IProblemDetailsService problems) : IExceptionHandler
{
    public async ValueTask<bool> TryHandleAsync(HttpContext httpContext, Exception exception, CancellationToken cancellationToken)
    {
        if (exception is not BadHttpRequestException badRequest)
        {
            return false;
        }

        httpContext.Response.StatusCode = badRequest.StatusCode;
        var problem = badRequest.InnerException is JsonException json
            ? MalformedJson(json)
            : new ProblemDetails { Status = badRequest.StatusCode, Detail = badRequest.Message };

        if (await problems.TryWriteAsync(new ProblemDetailsContext { HttpContext = httpContext, ProblemDetails = problem, Exception = exception }))
        {
            return true;
        }

        // A client that accepts only another type (a report as PDF, say) still learns what is wrong, as typed results tell it.
        await httpContext.Response.WriteAsJsonAsync(problem, problem.GetType(), (JsonSerializerOptions?)null, "application/problem+json", cancellationToken);
        return true;
    }

    // System.Text.Json counts lines and bytes from 0; people count from 1.
    private static HttpValidationProblemDetails MalformedJson(JsonException json)
    {
        var path = json.Path ?? "$";
        var line = json.LineNumber + 1;
        var position = json.BytePositionInLine + 1;
        return new HttpValidationProblemDetails(new Dictionary<string, string[]>
        {
            [path] = [$"Not valid here (line {line}, byte {position}): {Reason(json)}"],
        })
        {
            Status = StatusCodes.Status400BadRequest,
            Title = "The request body is not valid JSON for this operation.",
            Detail = $"The JSON is malformed or of the wrong shape at {path}, line {line}, byte {position}.",
        };
    }

    // The reader appends "Path: … | LineNumber: … | BytePositionInLine: …" to its message; those are reported apart.
    private static string Reason(JsonException json)
    {
        var message = json.Message;
        var cut = message.IndexOf(" Path:", StringComparison.Ordinal);
        return cut < 0 ? message : message[..cut];
    }
}
