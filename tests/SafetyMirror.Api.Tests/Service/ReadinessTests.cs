using System.Net;
using System.Net.Sockets;
using Npgsql;
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
    public async Task Ready_PostgresStartsListeningAfterTheService_BecomesHealthy()
    {
        var connectionString = await TestPostgres.CreateSchemaAsync();
        try
        {
            var port = Unreachable.ClosedPort();
            var late = new NpgsqlConnectionStringBuilder(connectionString) { Host = "127.0.0.1", Port = port }.ToString();
            using var api = new ConfiguredApi(ConfiguredApi.Development, (PostgresKey, late));
            using (var before = await api.SendAsync(HttpMethod.Get, Health.ReadyPath))
            {
                Assert.Equal(HttpStatusCode.ServiceUnavailable, before.StatusCode);
            }

            // The database appears at the address the service was given, as a server that finishes booting would.
            await using var relay = TcpRelay.Start(port, new NpgsqlConnectionStringBuilder(connectionString));

            Assert.Equal(HttpStatusCode.OK, await ReadyStatusWithinAsync(api, TimeSpan.FromSeconds(60)));
        }
        finally
        {
            await TestPostgres.DropSchemaAsync(connectionString);
        }
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

    // A guard against a hang, not a speed target: the service retries after 1 s, 2 s, 4 s ... up to 30 s.
    private static async Task<HttpStatusCode> ReadyStatusWithinAsync(ConfiguredApi api, TimeSpan limit)
    {
        var deadline = DateTime.UtcNow + limit;
        while (true)
        {
            using var response = await api.SendAsync(HttpMethod.Get, Health.ReadyPath);
            if (response.StatusCode == HttpStatusCode.OK || DateTime.UtcNow > deadline)
            {
                return response.StatusCode;
            }

            await Task.Delay(250);
        }
    }
}

/// <summary>Forwards every connection made to a loopback port to the real PostgreSQL, byte for byte.</summary>
internal sealed class TcpRelay : IAsyncDisposable
{
    private readonly TcpListener listener;
    private readonly CancellationTokenSource stopping = new();
    private readonly Task accepting;

    private TcpRelay(int port, string host, int targetPort)
    {
        listener = new TcpListener(IPAddress.Loopback, port);
        listener.Start();
        accepting = AcceptAsync(host, targetPort);
    }

    /// <summary>Listens on the port and relays to the server the connection string names.</summary>
    public static TcpRelay Start(int port, NpgsqlConnectionStringBuilder target) => new(port, target.Host!, target.Port);

    public async ValueTask DisposeAsync()
    {
        await stopping.CancelAsync();
        listener.Stop();
        await accepting;
        stopping.Dispose();
    }

    private async Task AcceptAsync(string host, int port)
    {
        try
        {
            while (true)
            {
                var client = await listener.AcceptTcpClientAsync(stopping.Token);
                _ = RelayAsync(client, host, port);
            }
        }
        catch (Exception e) when (e is OperationCanceledException or SocketException or ObjectDisposedException)
        {
            // Stopped.
        }
    }

    private async Task RelayAsync(TcpClient client, string host, int port)
    {
        using (client)
        using (var server = new TcpClient())
        {
            try
            {
                await server.ConnectAsync(host, port, stopping.Token);
                var down = client.GetStream().CopyToAsync(server.GetStream(), stopping.Token);
                var up = server.GetStream().CopyToAsync(client.GetStream(), stopping.Token);
                await Task.WhenAny(down, up);
            }
            catch (Exception e) when (e is OperationCanceledException or IOException or SocketException)
            {
                // Either side went away.
            }
        }
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
