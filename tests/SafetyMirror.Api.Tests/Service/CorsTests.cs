using System.Net;
using SafetyMirror.Api.Tests.Access;

namespace SafetyMirror.Api.Tests.Service;

// A CORS preflight is OPTIONS with Origin and Access-Control-Request-Method; the browser lets the page call only when
// the answer echoes its origin in Access-Control-Allow-Origin (Fetch Standard, 3.2 CORS protocol).
public sealed class CorsTests
{
    private const string MapPortal = "https://maps.elmbridge.example";

    [Fact]
    public async Task Preflight_ByDefault_IsAnsweredWithoutAllowingTheOrigin()
    {
        using var api = new ConfiguredApi(ConfiguredApi.Production);

        using var response = await Preflight(api);

        Assert.Equal(HttpStatusCode.NoContent, response.StatusCode);
        Assert.False(response.Headers.Contains("Access-Control-Allow-Origin"));
    }

    [Fact]
    public async Task Preflight_FromAConfiguredOrigin_AllowsItAndTheKeyHeader()
    {
        using var api = new ConfiguredApi(ConfiguredApi.Production, ("Posture:CorsOrigins:0", MapPortal));

        using var response = await Preflight(api);

        Assert.Equal(HttpStatusCode.NoContent, response.StatusCode);
        Assert.Equal(MapPortal, response.Headers.GetValues("Access-Control-Allow-Origin").Single());
        Assert.Contains("X-Api-Key", string.Join(",", response.Headers.GetValues("Access-Control-Allow-Headers")), StringComparison.OrdinalIgnoreCase);
    }

    private static Task<HttpResponseMessage> Preflight(ConfiguredApi api) => api.SendAsync(
        HttpMethod.Options,
        "/v1/recommendations",
        headers: [("Origin", MapPortal), ("Access-Control-Request-Method", "POST"), ("Access-Control-Request-Headers", "content-type,x-api-key")]);
}
