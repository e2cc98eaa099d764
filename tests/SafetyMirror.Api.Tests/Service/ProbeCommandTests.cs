using System.Diagnostics;
using SafetyMirror.Api.Features.Studies;
using SafetyMirror.Api.Service;
using SafetyMirror.Api.Tests.Access;

namespace SafetyMirror.Api.Tests.Service;

// The service's own executable, started as the container's health check starts it, against a real socket.
// Exit codes as Docker's HEALTHCHECK reads them: 0 healthy, 1 unhealthy (Docker reference, HEALTHCHECK).
public sealed class ProbeCommandTests
{
    [Fact]
    public async Task Probe_LiveServiceAnswers_ExitsZero()
    {
        using var api = StartOnSocket(new ConfiguredApi(ConfiguredApi.Development), out var address);

        var exitCode = await RunProbeAsync(new Uri(address, Health.LivePath).ToString());

        Assert.Equal(0, exitCode);
    }

    [Fact]
    public async Task Probe_NothingListens_ExitsOne()
    {
        var exitCode = await RunProbeAsync($"http://127.0.0.1:{Unreachable.ClosedPort()}{Health.LivePath}");

        Assert.Equal(1, exitCode);
    }

    [Fact]
    public async Task Probe_ReadyAnswers503_ExitsOne()
    {
        var unready = new ConfiguredApi(ConfiguredApi.Development,
            ($"{StudiesOptions.Section}:{nameof(StudiesOptions.PostgresConnectionString)}", Unreachable.PostgresConnectionString()));
        using var api = StartOnSocket(unready, out var address);

        var exitCode = await RunProbeAsync(new Uri(address, Health.ReadyPath).ToString());

        Assert.Equal(1, exitCode);
    }

    [Fact]
    public async Task Probe_SettingsTheWebHostWouldRefuse_StillRuns()
    {
        using var api = StartOnSocket(new ConfiguredApi(ConfiguredApi.Development), out var address);

        // Building the web host parses the proxy addresses and throws on this one: the probe must not get that far.
        var exitCode = await RunProbeAsync(new Uri(address, Health.LivePath).ToString(), ("Posture__KnownProxies__0", "not-an-address"));

        Assert.Equal(0, exitCode);
    }

    [Fact]
    public async Task Probe_NotAUrl_ExitsOne()
    {
        var exitCode = await RunProbeAsync("not a url");

        Assert.Equal(1, exitCode);
    }

    private static ConfiguredApi StartOnSocket(ConfiguredApi api, out Uri address)
    {
        api.UseKestrel(0);
        api.StartServer();
        using var client = api.CreateClient();
        address = client.BaseAddress!;
        return api;
    }

    private static async Task<int> RunProbeAsync(string url, params (string Name, string Value)[] environment)
    {
        var service = typeof(Program).Assembly.Location;
        var start = new ProcessStartInfo(Environment.GetEnvironmentVariable("DOTNET_HOST_PATH") ?? "dotnet")
        {
            ArgumentList = { service, ProbeCommand.Name, url },
            RedirectStandardOutput = true,
            RedirectStandardError = true,
            WorkingDirectory = Path.GetDirectoryName(service)!,
        };
        foreach (var (name, value) in environment)
        {
            start.Environment[name] = value;
        }

        using var process = Process.Start(start) ?? throw new InvalidOperationException("dotnet did not start: install the .NET SDK.");
        var output = process.StandardOutput.ReadToEndAsync();
        var errors = process.StandardError.ReadToEndAsync();
        await process.WaitForExitAsync();
        Assert.False(string.IsNullOrWhiteSpace(await output + await errors), "The probe says nothing about what it found.");
        return process.ExitCode;
    }
}
