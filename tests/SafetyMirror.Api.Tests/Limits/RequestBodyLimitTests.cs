using System.Net;

namespace SafetyMirror.Api.Tests.Limits;

// The limit is checked before routing, so any path under /v1 shows it; 2 MiB is the service's own limit.
[Collection(ApiCollection.Name)]
public sealed class RequestBodyLimitTests(ApiFactory api)
{
    private const int LimitBytes = 2 * 1024 * 1024;

    [Fact]
    public async Task BodyOverTheLimit_Gets413ProblemDetails()
    {
        using var body = new ByteArrayContent(new byte[LimitBytes + 1]);

        var response = await api.PostAsync("/v1/evaluations", body);

        // 413 Content Too Large: RFC 9110, 15.5.14.
        var problem = await response.AssertProblemAsync(HttpStatusCode.RequestEntityTooLarge);
        Assert.Contains($"{LimitBytes} bytes", problem.GetProperty("detail").GetString(), StringComparison.Ordinal);
    }

    [Fact]
    public async Task BodyAtTheLimit_IsNotRejectedAsTooLarge()
    {
        using var body = new ByteArrayContent(new byte[LimitBytes]);

        var response = await api.PostAsync("/v1/evaluations", body);

        Assert.NotEqual(HttpStatusCode.RequestEntityTooLarge, response.StatusCode);
    }
}
