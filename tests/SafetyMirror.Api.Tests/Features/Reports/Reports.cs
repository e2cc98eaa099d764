using System.Net;
using System.Net.Http.Headers;
using System.Text;
using System.Text.Json.Nodes;
using Microsoft.AspNetCore.Mvc.Testing;

namespace SafetyMirror.Api.Tests.Features.Reports;

/// <summary>Sends requests to <c>POST /v1/reports</c> through the host's real HTTP pipeline.</summary>
internal static class Reports
{
    /// <summary>The route under test.</summary>
    public const string Route = "/v1/reports";

    /// <summary>The media type of the page.</summary>
    public const string Html = "text/html";

    /// <summary>The media type of the PDF.</summary>
    public const string Pdf = "application/pdf";

    /// <summary>Posts a request body with the given Accept header (none when null).</summary>
    public static Task<HttpResponseMessage> PostReportAsync(this WebApplicationFactory<Program> api, JsonNode body, string? accept) =>
        api.PostJsonAsync(Route, body.ToJsonString(), accept);

    /// <summary>A report request to send to <paramref name="route"/>.</summary>
    public static HttpRequestMessage Request(Uri route, JsonNode body, string? accept)
    {
        var request = new HttpRequestMessage(HttpMethod.Post, route) { Content = new StringContent(body.ToJsonString(), Encoding.UTF8, "application/json") };
        if (accept is not null)
        {
            request.Headers.Accept.ParseAdd(accept);
        }

        return request;
    }

    /// <summary>Posts a body that must give a report of the given media type, and returns its bytes.</summary>
    public static async Task<byte[]> ReportAsync(this WebApplicationFactory<Program> api, JsonNode body, string accept)
    {
        using var response = await api.PostReportAsync(body, accept);
        var bytes = await response.Content.ReadAsByteArrayAsync();
        Assert.True(response.StatusCode == HttpStatusCode.OK, $"Expected 200, got {(int)response.StatusCode}: {Encoding.UTF8.GetString(bytes)}");
        Assert.Equal(accept, response.Content.Headers.ContentType?.MediaType);
        return bytes;
    }
}
