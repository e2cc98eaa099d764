using System.Net;
using System.Net.Sockets;
using SafetyMirror.Api.Features.Studies;
using SafetyMirror.Api.Service;
using SafetyMirror.Api.Tests.Access;
using StudyRequests = SafetyMirror.Api.Tests.Features.Studies.Studies;
using SafetyMirror.Studies.Tests.Storage;

namespace SafetyMirror.Api.Tests.Service;

// Readiness against real storage: a real PostgreSQL that answers, and a PostgreSQL address where nothing listens.
public sealed class ReadinessTests
{
    private const string PostgresKey = $"{StudiesOptions.Section}:{nameof(StudiesOptions.PostgresConnectionString)}";

    [Fact]
    public async Task Ready_PostgresAnswers_AnswersHealthy()
    {
        var connectionString = await TestPostgres.CreateSchemaAsync();
        try
        {
            using var api = new ConfiguredApi(ConfiguredApi.Development, (PostgresKey, connectionString));

            using var response = await api.SendAsync(HttpMethod.Get, Health.ReadyPath);

            Assert.Equal(HttpStatusCode.OK, response.StatusCode);
        }
        finally
        {
            await TestPostgres.DropSchemaAsync(connectionString);
        }
    }

    [Fact]
    public async Task Ready_PostgresPortClosed_Answers503Unhealthy()
    {
        using var api = new ConfiguredApi(ConfiguredApi.Development, (PostgresKey, Unreachable.PostgresConnectionString()));

        using var response = await api.SendAsync(HttpMethod.Get, Health.ReadyPath);

        Assert.Equal(HttpStatusCode.ServiceUnavailable, response.StatusCode);
        Assert.Equal("Unhealthy", await response.Content.ReadAsStringAsync());
    }

    [Fact]
    public async Task Live_PostgresPortClosed_AnswersHealthy()
    {
        using var api = new ConfiguredApi(ConfiguredApi.Development, (PostgresKey, Unreachable.PostgresConnectionString()));

        using var response = await api.SendAsync(HttpMethod.Get, Health.LivePath);

        Assert.Equal(HttpStatusCode.OK, response.StatusCode);
    }

    [Fact]
    public async Task CreateStudy_PostgresPortClosed_Gets503ProblemWithRetryAfter()
    {
        using var api = new ConfiguredApi(ConfiguredApi.Development, (PostgresKey, Unreachable.PostgresConnectionString()));

        using var response = await api.SendAsync(HttpMethod.Post, StudyRequests.Route, StudyRequests.LocalDemo());

        await response.AssertProblemAsync(HttpStatusCode.ServiceUnavailable);
        Assert.NotNull(response.Headers.RetryAfter);
    }
}

/// <summary>Addresses on the loopback where nothing listens.</summary>
internal static class Unreachable
{
    /// <summary>A loopback port that was free a moment ago: connecting to it is refused at once.</summary>
    public static int ClosedPort()
    {
        using var listener = new TcpListener(System.Net.IPAddress.Loopback, 0);
        listener.Start();
        return ((IPEndPoint)listener.LocalEndpoint).Port;
    }

    /// <summary>A well-formed PostgreSQL connection string to a closed port.</summary>
    public static string PostgresConnectionString() =>
        $"Host=127.0.0.1;Port={ClosedPort()};Database=safetymirror;Username=safetymirror;Password=unused;Timeout=2";
}
