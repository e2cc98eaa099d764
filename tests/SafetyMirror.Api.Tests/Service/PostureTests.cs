using System.Net;
using Microsoft.AspNetCore.Mvc.Testing;
using SafetyMirror.Api.Service;
using SafetyMirror.Api.Tests.Access;
using SafetyMirror.Api.Tests.Features.Reports;

namespace SafetyMirror.Api.Tests.Service;

// Headers from the OWASP Secure Headers Project (common practice): nosniff (Fetch Standard, X-Content-Type-Options),
// X-Frame-Options DENY (RFC 7034), Referrer-Policy no-referrer (W3C Referrer Policy), CSP frame-ancestors (W3C CSP Level 3).
[Collection(ApiCollection.Name)]
public sealed class PostureTests(ApiFactory api)
{
    [Theory]
    [InlineData("/")]
    [InlineData("/v1/caller")]
    [InlineData("/healthz")]
    [InlineData("/no-such-page")]
    public async Task Answer_CarriesTheSecurityHeaders(string path)
    {
        using var response = await api.GetAsync(path);

        Assert.Equal("nosniff", Header(response, "X-Content-Type-Options"));
        Assert.Equal("DENY", Header(response, "X-Frame-Options"));
        Assert.Equal("no-referrer", Header(response, "Referrer-Policy"));
        Assert.Contains("frame-ancestors 'none'", Header(response, "Content-Security-Policy"), StringComparison.Ordinal);
    }

    [Fact]
    public async Task LandingPage_CarriesThePagePolicy()
    {
        using var response = await api.GetAsync("/");

        Assert.Equal(Posture.HtmlPolicy, Header(response, "Content-Security-Policy"));
    }

    [Fact]
    public async Task ReportPage_CarriesThePagePolicy()
    {
        using var response = await api.PostReportAsync(DemoCorners.Report(), "text/html");

        Assert.Equal(HttpStatusCode.OK, response.StatusCode);
        Assert.Equal(Posture.HtmlPolicy, Header(response, "Content-Security-Policy"));
    }

    [Fact]
    public async Task JsonAnswer_CarriesTheDataPolicy()
    {
        using var response = await api.GetAsync("/v1/caller");

        Assert.Equal(Posture.DataPolicy, Header(response, "Content-Security-Policy"));
    }

    [Fact]
    public async Task Answer_OnARealSocket_HasNoServerHeader()
    {
        using var kestrel = new ConfiguredApi(ConfiguredApi.Development);
        kestrel.UseKestrel(0);
        kestrel.StartServer();

        using var response = await kestrel.SendAsync(HttpMethod.Get, "/healthz");

        Assert.Equal(HttpStatusCode.OK, response.StatusCode);
        Assert.Empty(response.Headers.Server);
    }

    [Fact]
    public async Task HttpsAnswerInProduction_CarriesHsts()
    {
        using var production = new ConfiguredApi(ConfiguredApi.Production);
        using var client = production.CreateClient(new WebApplicationFactoryClientOptions { BaseAddress = new Uri("https://mirrors.elmbridge.example") });

        using var response = await client.GetAsync(new Uri("/healthz", UriKind.Relative));

        // Strict-Transport-Security: RFC 6797, 6.1.
        Assert.Contains("max-age=", Header(response, "Strict-Transport-Security"), StringComparison.Ordinal);
    }

    [Fact]
    public async Task HttpRequestInProduction_IsRedirectedToHttps()
    {
        using var production = new ConfiguredApi(ConfiguredApi.Production, ("https_port", "443"));
        using var client = production.CreateClient(new WebApplicationFactoryClientOptions { AllowAutoRedirect = false });

        using var response = await client.GetAsync(new Uri("/healthz", UriKind.Relative));

        Assert.Equal(HttpStatusCode.TemporaryRedirect, response.StatusCode);
        Assert.Equal(Uri.UriSchemeHttps, response.Headers.Location?.Scheme);
    }

    [Fact]
    public async Task HttpRequestBehindAProxy_IsNotRedirected()
    {
        using var proxied = new ConfiguredApi(ConfiguredApi.Production, ("https_port", "443"), ("Posture:BehindProxy", "true"));
        using var client = proxied.CreateClient(new WebApplicationFactoryClientOptions { AllowAutoRedirect = false });

        using var response = await client.GetAsync(new Uri("/healthz", UriKind.Relative));

        Assert.Equal(HttpStatusCode.OK, response.StatusCode);
    }

    private static string Header(HttpResponseMessage response, string name) =>
        response.Headers.TryGetValues(name, out var values) || response.Content.Headers.TryGetValues(name, out values)
            ? string.Join(", ", values)
            : string.Empty;
}
