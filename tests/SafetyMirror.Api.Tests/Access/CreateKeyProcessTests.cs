using System.Diagnostics;
using System.Net;
using SafetyMirror.Api.Access;

namespace SafetyMirror.Api.Tests.Access;

// The service's own executable, started as an operator would start it, issues the key that the service then accepts.
public sealed class CreateKeyProcessTests
{
    [Fact]
    public async Task CreateKeyCommandLine_PrintsAKeyTheServiceAccepts()
    {
        using var api = new ConfiguredApi(ConfiguredApi.Production);

        var key = await RunCreateKeyAsync(api.KeyStorePath, "Elmbridge roads office");
        using var response = await api.SendAsync(HttpMethod.Get, "/v1/caller", headers: (ApiKeyAuthenticationHandler.Header, key));

        Assert.Equal(HttpStatusCode.OK, response.StatusCode);
    }

    private static async Task<string> RunCreateKeyAsync(string keyStorePath, string owner)
    {
        var service = typeof(Program).Assembly.Location;
        var start = new ProcessStartInfo("dotnet")
        {
            ArgumentList = { service, CreateKeyCommand.Name, "--owner", owner },
            RedirectStandardOutput = true,
            RedirectStandardError = true,
            WorkingDirectory = Path.GetDirectoryName(service)!,
            Environment = { ["ASPNETCORE_ENVIRONMENT"] = ConfiguredApi.Production, ["Access__KeyStorePath"] = keyStorePath },
        };
        using var process = Process.Start(start) ?? throw new InvalidOperationException("dotnet did not start: install the .NET SDK.");
        var output = await process.StandardOutput.ReadToEndAsync();
        var errors = await process.StandardError.ReadToEndAsync();
        await process.WaitForExitAsync();
        Assert.True(process.ExitCode == 0, $"create-key exited with {process.ExitCode}: {errors}");
        return output.Split('\n', StringSplitOptions.RemoveEmptyEntries | StringSplitOptions.TrimEntries)[^1];
    }
}
