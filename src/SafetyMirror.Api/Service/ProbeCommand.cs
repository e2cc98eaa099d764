namespace SafetyMirror.Api.Service;

/// <summary>
/// The command line that asks a running service whether it is healthy: <c>probe [url]</c> exits 0 on a 2xx answer, else 1.
/// It is the container's health check, since the runtime image has no curl or wget.
/// </summary>
public static class ProbeCommand
{
    /// <summary>The command's name, the first argument.</summary>
    public const string Name = "probe";

    /// <summary>What is asked when no URL is given: the liveness probe on the container's port.</summary>
    public static readonly Uri DefaultUrl = new("http://127.0.0.1:5180" + Health.LivePath);

    /// <summary>How long the answer may take; the container's own health-check timeout should be longer.</summary>
    public static readonly TimeSpan Timeout = TimeSpan.FromSeconds(3);

    /// <summary>Whether the arguments ask for this command rather than the web service.</summary>
    public static bool IsRequested(string[] args) => args.Length > 0 && args[0] == Name;

    /// <summary>Sends GET to the URL given as the second argument (or <see cref="DefaultUrl"/>); returns the process exit code (never 2, which Docker reserves).</summary>
    public static async Task<int> RunAsync(string[] args, TextWriter output, TextWriter errors)
    {
        ArgumentNullException.ThrowIfNull(args);
        var url = DefaultUrl;
        if (args.Length > 1 && !Uri.TryCreate(args[1], UriKind.Absolute, out url))
        {
            await errors.WriteLineAsync($"Usage: {Name} [http://host:port/path] (default {DefaultUrl}).");
            return 1;
        }

        using var client = new HttpClient { Timeout = Timeout };
        try
        {
            using var response = await client.GetAsync(url);
            await output.WriteLineAsync($"{url} answered {(int)response.StatusCode}.");
            return response.IsSuccessStatusCode ? 0 : 1;
        }
        catch (Exception e) when (e is HttpRequestException or TaskCanceledException)
        {
            await errors.WriteLineAsync($"{url} did not answer: {e.Message}");
            return 1;
        }
    }
}
