using System.Text.Json;
using Microsoft.AspNetCore.Diagnostics;
using Microsoft.AspNetCore.Http.Metadata;
using Microsoft.AspNetCore.Mvc;
using Microsoft.Extensions.Options;

namespace SafetyMirror.Api.Errors;

/// <summary>Turns a request the framework could not read (bad JSON, no body, wrong media type) into problem details naming the field.</summary>
/// <remarks>Every other exception falls through to the default handler: a bare 500 problem without a stack trace.</remarks>
internal sealed class BadRequestExceptionHandler(IProblemDetailsService problems, IOptions<Microsoft.AspNetCore.Http.Json.JsonOptions> json) : IExceptionHandler
{
    public async ValueTask<bool> TryHandleAsync(HttpContext httpContext, Exception exception, CancellationToken cancellationToken)
    {
        if (exception is not BadHttpRequestException badRequest)
        {
            return false;
        }

        httpContext.Response.StatusCode = badRequest.StatusCode;
        var problem = badRequest switch
        {
            { InnerException: JsonException malformed } => Malformed(malformed, await KeptBodyAsync(httpContext.Request, cancellationToken), RequestType(httpContext)),
            { StatusCode: StatusCodes.Status415UnsupportedMediaType } => Problem(badRequest.StatusCode, "The request body must be JSON.",
                "Send the body with Content-Type: application/json."),
            { StatusCode: StatusCodes.Status400BadRequest } when IsMissingBody(badRequest) => Problem(badRequest.StatusCode, "The request body is missing.",
                "Send a JSON object in the body, as in the examples of the OpenAPI document.", "Required: a JSON object."),
            _ => Problem(badRequest.StatusCode, "The request could not be read.", badRequest.Message),
        };

        return await problems.TryWriteAsync(new ProblemDetailsContext { HttpContext = httpContext, ProblemDetails = problem, Exception = exception });
    }

    // The framework says so in words only: "… but no body was provided", "Required parameter … was not provided from body".
    private static bool IsMissingBody(BadHttpRequestException badRequest) =>
        badRequest.Message.Contains("no body was provided", StringComparison.Ordinal)
        || badRequest.Message.Contains("was not provided", StringComparison.Ordinal);

    private HttpValidationProblemDetails Malformed(JsonException malformed, byte[]? body, Type? requestType)
    {
        var (path, message) = JsonBodyErrors.Explain(malformed, body, requestType, json.Value.SerializerOptions);
        return new HttpValidationProblemDetails(new Dictionary<string, string[]> { [path] = [message] })
        {
            Status = StatusCodes.Status400BadRequest,
            Title = "The request body is not valid JSON for this operation.",
            Detail = "Each entry under 'errors' names the field of the request that holds a problem.",
        };
    }

    private static ProblemDetails Problem(int status, string title, string detail, string? bodyError = null) => bodyError is null
        ? new ProblemDetails { Status = status, Title = title, Detail = detail }
        : new HttpValidationProblemDetails(new Dictionary<string, string[]> { [JsonBodyErrors.Body] = [bodyError] }) { Status = status, Title = title, Detail = detail };

    // The exception handler has cleared the endpoint from the context; its feature keeps it.
    private static Type? RequestType(HttpContext httpContext) =>
        httpContext.Features.Get<IExceptionHandlerFeature>()?.Endpoint?.Metadata.GetMetadata<IAcceptsMetadata>()?.RequestType;

    /// <summary>The body as sent, when it was kept for this (see <see cref="ProblemResponses.UseProblemResponses"/>).</summary>
    private static async Task<byte[]?> KeptBodyAsync(HttpRequest request, CancellationToken cancellationToken)
    {
        if (!request.Body.CanSeek)
        {
            return null;
        }

        request.Body.Position = 0;
        using var copy = new MemoryStream();
        await request.Body.CopyToAsync(copy, cancellationToken);
        return copy.ToArray();
    }
}
