using System.Net;

namespace SafetyMirror.Api.Tests.Service;

[Collection(ApiCollection.Name)]
public sealed class HealthTests(ApiFactory api)
{
    [Fact]
    public async Task Healthz_WithNoFailingCheck_AnswersHealthy()
    {
        var response = await api.GetAsync("/healthz");

        // "Healthy" is the text ASP.NET Core health checks write for HealthStatus.Healthy (common practice).
        Assert.Equal(HttpStatusCode.OK, response.StatusCode);
        Assert.Equal("Healthy", await response.Content.ReadAsStringAsync());
    }
}
