using System.Diagnostics;

namespace SafetyMirror.Studies.Tests.Storage;

/// <summary>The writer program (tests/SafetyMirror.Studies.Writer) as a real process whose output the test reads.</summary>
sealed class WriterProcess : IDisposable
{
    // A guard against a hang, not a speed target.
    static readonly TimeSpan LineTimeout = TimeSpan.FromSeconds(60);

    readonly Process process;

    WriterProcess(Process process) => this.process = process;

    public static WriterProcess Start(string backend, string location)
    {
        var start = new ProcessStartInfo(Environment.GetEnvironmentVariable("DOTNET_HOST_PATH") ?? "dotnet")
        {
            RedirectStandardOutput = true,
            RedirectStandardError = true,
            UseShellExecute = false,
        };
        start.ArgumentList.Add(Path.Combine(AppContext.BaseDirectory, "SafetyMirror.Studies.Writer.dll"));
        start.ArgumentList.Add(backend);
        start.ArgumentList.Add(location);
        return new WriterProcess(Process.Start(start) ?? throw new InvalidOperationException("The writer did not start."));
    }

    /// <summary>The next line of output; null once the process has ended and its output is read.</summary>
    public async Task<string?> ReadLineAsync()
    {
        using var timeout = new CancellationTokenSource(LineTimeout);
        try
        {
            return await process.StandardOutput.ReadLineAsync(timeout.Token);
        }
        catch (OperationCanceledException)
        {
            throw new TimeoutException($"The writer printed nothing for {LineTimeout.TotalSeconds} s. Its errors: {await ErrorsAsync()}");
        }
    }

    /// <summary>Kills the process at once (SIGKILL on Linux), as a crash or kill -9 would.</summary>
    public void Kill()
    {
        process.Kill();
        process.WaitForExit();
    }

    async Task<string> ErrorsAsync()
    {
        if (!process.HasExited) Kill();
        return await process.StandardError.ReadToEndAsync();
    }

    public void Dispose()
    {
        if (!process.HasExited) Kill();
        process.Dispose();
    }
}
