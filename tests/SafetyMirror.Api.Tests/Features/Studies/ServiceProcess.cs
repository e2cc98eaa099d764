using System.Diagnostics;
using System.Net;
using System.Net.Sockets;

namespace SafetyMirror.Api.Tests.Features.Studies;

/// <summary>The service's own executable as a real process on a free loopback port, its studies in a given SQLite file.</summary>
internal sealed class ServiceProcess : IDisposable
{
    // A guard against a hang, not a speed target.
    private static readonly TimeSpan StartTimeout = TimeSpan.FromSeconds(60);

    private readonly Process process;

    private ServiceProcess(Process process, Uri address)
    {
        this.process = process;
        Client = new HttpClient { BaseAddress = address };
    }

    /// <summary>A client for the service's address.</summary>
    public HttpClient Client { get; }

    /// <summary>Starts the service in Development (loopback callers need no key) and waits until it answers /healthz.</summary>
    /// <param name="keyStorePath">The API key store's file.</param>
    /// <param name="studies">Where the studies live: ("SqlitePath", file) or ("PostgresConnectionString", connection string).</param>
    /// <param name="settings">More configuration, as environment variables (e.g. "Batches__Workers").</param>
    public static async Task<ServiceProcess> StartAsync(string keyStorePath, (string Key, string Value) studies, params (string Name, string Value)[] settings)
    {
        var service = typeof(Program).Assembly.Location;
        var address = new Uri($"http://127.0.0.1:{FreePort()}");
        var start = new ProcessStartInfo(Environment.GetEnvironmentVariable("DOTNET_HOST_PATH") ?? "dotnet")
        {
            ArgumentList = { service, "--urls", address.ToString() },
            RedirectStandardOutput = true,
            RedirectStandardError = true,
            UseShellExecute = false,
            WorkingDirectory = Path.GetDirectoryName(service)!,
            Environment =
            {
                ["ASPNETCORE_ENVIRONMENT"] = "Development",
                ["Access__AllowLoopbackWithoutKey"] = "true",
                ["Access__KeyStorePath"] = keyStorePath,
                [$"Studies__{studies.Key}"] = studies.Value,
                ["Posture__HttpsRedirection"] = "false",

                // A burst of writes is the point of the test, not the production guard on costly requests.
                ["Limits__CostlyPermitLimit"] = "1000000",
            },
        };
        foreach (var (name, value) in settings)
        {
            start.Environment[name] = value;
        }

        var running = new ServiceProcess(Process.Start(start) ?? throw new InvalidOperationException("dotnet did not start: install the .NET SDK."), address);
        running.process.OutputDataReceived += (_, _) => { };
        running.process.BeginOutputReadLine();
        await running.WaitUntilHealthyAsync();
        return running;
    }

    /// <summary>Kills the process at once (SIGKILL on Linux), as a crash or kill -9 would.</summary>
    public void Kill()
    {
        process.Kill(entireProcessTree: true);
        process.WaitForExit();
    }

    public void Dispose()
    {
        if (!process.HasExited)
        {
            Kill();
        }

        Client.Dispose();
        process.Dispose();
    }

    private async Task WaitUntilHealthyAsync()
    {
        var deadline = DateTime.UtcNow + StartTimeout;
        while (DateTime.UtcNow < deadline)
        {
            if (process.HasExited)
            {
                throw new InvalidOperationException($"The service exited with {process.ExitCode}: {await process.StandardError.ReadToEndAsync()}");
            }

            try
            {
                using var response = await Client.GetAsync(new Uri("/healthz", UriKind.Relative));
                if (response.StatusCode == HttpStatusCode.OK)
                {
                    return;
                }
            }
            catch (HttpRequestException)
            {
                // Not listening yet.
            }

            await Task.Delay(100);
        }

        Kill();
        throw new TimeoutException($"The service did not answer /healthz within {StartTimeout.TotalSeconds} s: {await process.StandardError.ReadToEndAsync()}");
    }

    private static int FreePort()
    {
        using var listener = new TcpListener(IPAddress.Loopback, 0);
        listener.Start();
        return ((IPEndPoint)listener.LocalEndpoint).Port;
    }
}
