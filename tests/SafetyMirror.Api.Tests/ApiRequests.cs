using System.Net;
using System.Text;
using System.Text.Json;
using System.Text.Json.Nodes;
using Microsoft.AspNetCore.Mvc.Testing;

namespace SafetyMirror.Api.Tests;

/// <summary>Posts request bodies through the host's real HTTP pipeline: the one way every feature's tests send them.</summary>
internal static class ApiRequests
{
    /// <summary>Posts a JSON body given as text (valid or not) with an Accept header (none when null); chunked, it goes without a Content-Length.</summary>
    public static async Task<HttpResponseMessage> PostJsonAsync(
        this WebApplicationFactory<Program> api, string route, string body, string? accept = "application/json", bool chunked = false)
    {
        using var client = api.CreateClient();
        using var request = new HttpRequestMessage(HttpMethod.Post, new Uri(route, UriKind.Relative))
        {
            Content = new StringContent(body, Encoding.UTF8, "application/json"),
        };
        if (accept is not null)
        {
            request.Headers.Accept.ParseAdd(accept);
        }

        request.Headers.TransferEncodingChunked = chunked;
        return await client.SendAsync(request);
    }

    /// <summary>Posts a body that must be answered 200 with JSON, and returns the answer.</summary>
    public static async Task<JsonElement> PostForJsonAsync(this WebApplicationFactory<Program> api, string route, JsonNode body)
    {
        using var response = await api.PostJsonAsync(route, body.ToJsonString());
        var text = await response.Content.ReadAsStringAsync();
        Assert.True(response.StatusCode == HttpStatusCode.OK, $"Expected 200 from {route}, got {(int)response.StatusCode}: {text}");
        Assert.Equal("application/json", response.Content.Headers.ContentType?.MediaType);
        using var answer = JsonDocument.Parse(text);
        return answer.RootElement.Clone();
    }
}
