using System.Text.Json;
using System.Text.Json.Nodes;
using Microsoft.AspNetCore.Mvc.Testing;

namespace SafetyMirror.Api.Tests.Features.Evaluations;

/// <summary>Sends requests to <c>POST /v1/evaluations</c> through the host's real HTTP pipeline.</summary>
internal static class Evaluations
{
    /// <summary>The route under test.</summary>
    public const string Route = "/v1/evaluations";

    /// <summary>The media type of the GIS layers answer (RFC 7946, 12).</summary>
    public const string GeoJson = "application/geo+json";

    /// <summary>Posts a request body, asking for the given media type.</summary>
    public static Task<HttpResponseMessage> PostEvaluationAsync(this WebApplicationFactory<Program> api, JsonNode body, string accept = "application/json") =>
        api.PostEvaluationTextAsync(body.ToJsonString(), accept);

    /// <summary>Posts a body given as text, valid JSON or not; chunked, it goes without a Content-Length.</summary>
    public static Task<HttpResponseMessage> PostEvaluationTextAsync(
        this WebApplicationFactory<Program> api, string body, string accept = "application/json", bool chunked = false) =>
        api.PostJsonAsync(Route, body, accept, chunked);

    /// <summary>Posts a request body that must be evaluated, and returns the JSON answer.</summary>
    public static Task<JsonElement> EvaluateAsync(this WebApplicationFactory<Program> api, JsonNode body) => api.PostForJsonAsync(Route, body);
}
