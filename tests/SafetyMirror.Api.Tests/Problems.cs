using System.Net;
using System.Text.Json;

namespace SafetyMirror.Api.Tests;

/// <summary>Checks that a response is an RFC 9457 problem details answer.</summary>
internal static class Problems
{
    /// <summary>Asserts the status code and the problem media type, and returns the problem object.</summary>
    public static async Task<JsonElement> AssertProblemAsync(this HttpResponseMessage response, HttpStatusCode expected)
    {
        // application/problem+json and its "status" member: RFC 9457, 3 and 3.1.2.
        Assert.Equal(expected, response.StatusCode);
        Assert.Equal("application/problem+json", response.Content.Headers.ContentType?.MediaType);
        using var problem = JsonDocument.Parse(await response.Content.ReadAsStringAsync());
        Assert.Equal((int)expected, problem.RootElement.GetProperty("status").GetInt32());
        return problem.RootElement.Clone();
    }
}
