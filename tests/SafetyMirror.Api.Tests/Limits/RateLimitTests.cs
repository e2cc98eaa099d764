using System.Net;
using Microsoft.AspNetCore.Hosting;
using Microsoft.AspNetCore.Mvc.Testing;
using SafetyMirror.Api.Access;
using SafetyMirror.Api.Limits;
using SafetyMirror.Api.Tests.Access;
using SafetyMirror.Api.Tests.Features.Evaluations;
using SafetyMirror.Api.Tests.Features.Recommendations;

namespace SafetyMirror.Api.Tests.Limits;

// Hosts of their own, allowed one request per window, so the shared host's limiter is left alone.
// 429 Too Many Requests and its Retry-After: RFC 6585, 4; Retry-After in seconds: RFC 9110, 10.2.3.
[Collection(ApiCollection.Name)]
public sealed class RateLimitTests(ApiFactory api)
{
    private const string ProxiedClient = "203.0.113.7";      // RFC 5737 documentation addresses
    private const string OtherProxiedClient = "203.0.113.8";

    [Fact]
    public async Task SecondEvaluationOverThePermitLimit_Gets429Problem()
    {
        using var limited = api.WithWebHostBuilder(host => host.UseSetting($"{RequestLimits.Section}:{nameof(RequestLimits.PermitLimit)}", "1"));
        using var first = await limited.PostEvaluationAsync(DemoCorners.Local());
        Assert.Equal(HttpStatusCode.OK, first.StatusCode);

        using var second = await limited.PostEvaluationAsync(DemoCorners.Local());

        await second.AssertProblemAsync(HttpStatusCode.TooManyRequests);
    }

    [Fact]
    public async Task RequestOverThePermitLimit_SaysWhenToRetry()
    {
        using var limited = api.WithWebHostBuilder(host => host.UseSetting($"{RequestLimits.Section}:{nameof(RequestLimits.PermitLimit)}", "1"));
        using var first = await limited.PostEvaluationAsync(DemoCorners.Local());

        using var second = await limited.PostEvaluationAsync(DemoCorners.Local());

        var retryAfter = second.Headers.RetryAfter?.Delta;
        Assert.NotNull(retryAfter);
        Assert.InRange(retryAfter.Value.TotalSeconds, 1, 60);
    }

    [Fact]
    public async Task SecondRequestWithTheSameKey_Gets429WhileAnotherKeyIsServed()
    {
        using var limited = new ConfiguredApi(ConfiguredApi.Production, ("Limits:KeyPermitLimit", "1"));
        var first = await limited.IssueKeyAsync("Elmbridge roads office");
        var other = await limited.IssueKeyAsync("Fernhill parish council");
        using var spent = await limited.SendAsync(HttpMethod.Get, "/v1/caller", headers: (ApiKeyAuthenticationHandler.Header, first));
        Assert.Equal(HttpStatusCode.OK, spent.StatusCode);

        using var again = await limited.SendAsync(HttpMethod.Get, "/v1/caller", headers: (ApiKeyAuthenticationHandler.Header, first));
        using var otherKey = await limited.SendAsync(HttpMethod.Get, "/v1/caller", headers: (ApiKeyAuthenticationHandler.Header, other));

        await again.AssertProblemAsync(HttpStatusCode.TooManyRequests);
        Assert.NotNull(again.Headers.RetryAfter);
        Assert.Equal(HttpStatusCode.OK, otherKey.StatusCode);
    }

    [Fact]
    public async Task SecondCostlyRequestOverItsLimit_Gets429WhileEvaluationsGoOn()
    {
        using var limited = new ConfiguredApi(ConfiguredApi.Production, ("Limits:CostlyPermitLimit", "1"));
        var key = await limited.IssueKeyAsync("Elmbridge roads office");
        using var first = await limited.SendAsync(HttpMethod.Post, "/v1/recommendations", Recommendations.Demo(), (ApiKeyAuthenticationHandler.Header, key));
        Assert.Equal(HttpStatusCode.OK, first.StatusCode);

        using var second = await limited.SendAsync(HttpMethod.Post, "/v1/recommendations", Recommendations.Demo(), (ApiKeyAuthenticationHandler.Header, key));
        using var evaluation = await limited.SendAsync(HttpMethod.Post, "/v1/evaluations", DemoCorners.Local(), (ApiKeyAuthenticationHandler.Header, key));

        await second.AssertProblemAsync(HttpStatusCode.TooManyRequests);
        Assert.NotNull(second.Headers.RetryAfter);
        Assert.Equal(HttpStatusCode.OK, evaluation.StatusCode);
    }

    [Fact]
    public async Task ClientsBehindAConfiguredProxy_EachHaveTheirOwnLimit()
    {
        using var proxied = BehindLoopbackProxy(behindProxy: true);
        using var spent = await proxied.SendAsync(HttpMethod.Post, "/v1/evaluations", DemoCorners.Local(), ("X-Forwarded-For", ProxiedClient));
        Assert.Equal(HttpStatusCode.OK, spent.StatusCode);

        using var again = await proxied.SendAsync(HttpMethod.Post, "/v1/evaluations", DemoCorners.Local(), ("X-Forwarded-For", ProxiedClient));
        using var otherClient = await proxied.SendAsync(HttpMethod.Post, "/v1/evaluations", DemoCorners.Local(), ("X-Forwarded-For", OtherProxiedClient));

        await again.AssertProblemAsync(HttpStatusCode.TooManyRequests);
        Assert.Equal(HttpStatusCode.OK, otherClient.StatusCode);
    }

    [Fact]
    public async Task ForwardedFor_WithoutAConfiguredProxy_DoesNotOpenANewLimit()
    {
        using var direct = BehindLoopbackProxy(behindProxy: false);
        using var spent = await direct.SendAsync(HttpMethod.Post, "/v1/evaluations", DemoCorners.Local(), ("X-Forwarded-For", ProxiedClient));

        using var spoofed = await direct.SendAsync(HttpMethod.Post, "/v1/evaluations", DemoCorners.Local(), ("X-Forwarded-For", OtherProxiedClient));

        await spoofed.AssertProblemAsync(HttpStatusCode.TooManyRequests);
    }

    // A real socket, so the proxy (this test) has a loopback address the forwarded-headers middleware can trust.
    private static ConfiguredApi BehindLoopbackProxy(bool behindProxy)
    {
        var host = new ConfiguredApi(
            ConfiguredApi.Production,
            ("Limits:PermitLimit", "1"),
            ("Posture:BehindProxy", behindProxy ? "true" : "false"),
            ("Posture:KnownProxies:0", "127.0.0.1"),
            ("Posture:KnownProxies:1", "::1"));
        host.UseKestrel(0);
        host.StartServer();
        return host;
    }
}
