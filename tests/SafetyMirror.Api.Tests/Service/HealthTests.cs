using System.Net;
using SafetyMirror.Api.Service;

namespace SafetyMirror.Api.Tests.Service;

// "Healthy" and "Unhealthy" are the texts ASP.NET Core health checks write for HealthStatus (common practice).
[Collection(ApiCollection.Name)]
public sealed class HealthTests(ApiFactory api)
{
    [Fact]
    public async Task Healthz_WithNoFailingCheck_AnswersHealthy()
    {
        var response = await api.GetAsync(Health.Path);

        Assert.Equal(HttpStatusCode.OK, response.StatusCode);
        Assert.Equal("Healthy", await response.Content.ReadAsStringAsync());
    }

    [Fact]
    public async Task Live_ProcessUp_AnswersHealthy()
    {
        var response = await api.GetAsync(Health.LivePath);

        Assert.Equal(HttpStatusCode.OK, response.StatusCode);
        Assert.Equal("Healthy", await response.Content.ReadAsStringAsync());
    }

    [Fact]
    public async Task Ready_SqliteStorageAnswers_AnswersHealthy()
    {
        var response = await api.GetAsync(Health.ReadyPath);

        Assert.Equal(HttpStatusCode.OK, response.StatusCode);
        Assert.Equal("Healthy", await response.Content.ReadAsStringAsync());
    }
}
