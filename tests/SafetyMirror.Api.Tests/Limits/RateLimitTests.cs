using System.Net;
using Microsoft.AspNetCore.Hosting;
using SafetyMirror.Api.Limits;
using SafetyMirror.Api.Tests.Features.Evaluations;

namespace SafetyMirror.Api.Tests.Limits;

// A host of its own, allowed one request per window, so the shared host's limiter is left alone.
[Collection(ApiCollection.Name)]
public sealed class RateLimitTests(ApiFactory api)
{
    [Fact]
    public async Task SecondEvaluationOverThePermitLimit_Gets429Problem()
    {
        using var limited = api.WithWebHostBuilder(host => host.UseSetting($"{RequestLimits.Section}:{nameof(RequestLimits.PermitLimit)}", "1"));
        using var first = await limited.PostEvaluationAsync(DemoCorners.Local());
        Assert.Equal(HttpStatusCode.OK, first.StatusCode);

        using var second = await limited.PostEvaluationAsync(DemoCorners.Local());

        // 429 Too Many Requests: RFC 6585, 4.
        await second.AssertProblemAsync(HttpStatusCode.TooManyRequests);
    }
}
