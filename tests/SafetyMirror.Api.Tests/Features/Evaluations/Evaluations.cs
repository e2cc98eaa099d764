using System.Net;
using System.Net.Http.Headers;
using System.Text;
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
    public static async Task<HttpResponseMessage> PostEvaluationTextAsync(
        this WebApplicationFactory<Program> api, string body, string accept = "application/json", bool chunked = false)
    {
        using var client = api.CreateClient();
        using var request = new HttpRequestMessage(HttpMethod.Post, new Uri(Route, UriKind.Relative))
        {
            Content = new StringContent(body, Encoding.UTF8, "application/json"),
        };
        request.Headers.Accept.Add(new MediaTypeWithQualityHeaderValue(accept));
        request.Headers.TransferEncodingChunked = chunked;
        return await client.SendAsync(request);
    }

    /// <summary>Posts a request body that must be evaluated, and returns the JSON answer.</summary>
    public static async Task<JsonElement> EvaluateAsync(this WebApplicationFactory<Program> api, JsonNode body)
    {
        using var response = await api.PostEvaluationAsync(body);
        var text = await response.Content.ReadAsStringAsync();
        Assert.True(response.StatusCode == HttpStatusCode.OK, $"Expected 200, got {(int)response.StatusCode}: {text}");
        Assert.Equal("application/json", response.Content.Headers.ContentType?.MediaType);
        using var answer = JsonDocument.Parse(text);
        return answer.RootElement.Clone();
    }
}
