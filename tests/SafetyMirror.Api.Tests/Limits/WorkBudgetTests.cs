using System.Net;
using SafetyMirror.Api.Tests.Access;
using SafetyMirror.Api.Tests.Features.Recommendations;

namespace SafetyMirror.Api.Tests.Limits;

// A tiny configured budget stands in for a heavy corner: the answer, not the time, is under test.
// 503 Service Unavailable with Retry-After: RFC 9110, 15.6.4.
public sealed class WorkBudgetTests
{
    [Fact]
    public async Task Recommendation_OverItsDeadline_Gets503NamingWhatMadeItHeavy()
    {
        using var api = new ConfiguredApi(ConfiguredApi.Development, ("Limits:Work:DeadlineSeconds", "0.001"));

        using var response = await api.SendAsync(HttpMethod.Post, Recommendations.Route, Recommendations.Demo());

        var problem = await response.AssertProblemAsync(HttpStatusCode.ServiceUnavailable);
        var detail = problem.GetProperty("detail").GetString();
        Assert.Contains("mounting-zone", detail, StringComparison.Ordinal);
        Assert.Contains("options.servedApproaches", detail, StringComparison.Ordinal);
    }

    [Fact]
    public async Task Recommendation_WhenEverySlotAndQueuePlaceIsTaken_Gets503WithRetryAfter()
    {
        using var api = new ConfiguredApi(ConfiguredApi.Development, ("Limits:Work:MaxConcurrent", "1"), ("Limits:Work:QueueLimit", "0"));

        var answers = await Task.WhenAll(Enumerable.Range(0, 3).Select(_ => api.SendAsync(HttpMethod.Post, Recommendations.Route, Recommendations.Demo())));

        var busy = answers.Where(a => a.StatusCode == HttpStatusCode.ServiceUnavailable).ToList();
        Assert.NotEmpty(busy);
        Assert.Contains(answers, a => a.StatusCode == HttpStatusCode.OK);
        Assert.All(busy, b => Assert.NotNull(b.Headers.RetryAfter));
        foreach (var answer in answers)
        {
            answer.Dispose();
        }
    }
}
