using System.Net.Http.Headers;
using System.Text;
using System.Text.Json.Nodes;
using Microsoft.AspNetCore.Hosting;
using Microsoft.AspNetCore.Mvc.Testing;
using Microsoft.Data.Sqlite;
using SafetyMirror.Api.Access;
using SafetyMirror.Api.Features.Studies;

namespace SafetyMirror.Api.Tests.Access;

/// <summary>A host of its own in a chosen environment with chosen settings, its API keys in a fresh SQLite file.</summary>
public sealed class ConfiguredApi(string environment, params (string Key, string Value)[] settings) : WebApplicationFactory<Program>
{
    /// <summary>The environment a production deployment runs in.</summary>
    public const string Production = "Production";

    /// <summary>The environment of <c>dotnet run</c> and of the shared test host.</summary>
    public const string Development = "Development";

    /// <summary>The key store's file, deleted with the host.</summary>
    public string KeyStorePath { get; } = Path.Combine(Path.GetTempPath(), $"safetymirror-keys-{Guid.NewGuid():N}.db");

    /// <summary>The study store's file, deleted with the host (unless the settings point the studies elsewhere).</summary>
    public string StudyStorePath { get; } = Path.Combine(Path.GetTempPath(), $"safetymirror-studies-{Guid.NewGuid():N}.db");

    /// <summary>Issues a key through the service's own create-key command and returns the key it prints.</summary>
    public async Task<string> IssueKeyAsync(string owner)
    {
        using var output = new StringWriter();
        var exitCode = await CreateKeyCommand.RunAsync([CreateKeyCommand.Name, "--owner", owner], Services, output, TextWriter.Null);
        Assert.Equal(0, exitCode);
        return output.ToString().Split('\n', StringSplitOptions.RemoveEmptyEntries | StringSplitOptions.TrimEntries)[^1];
    }

    /// <summary>Sends a request with an optional JSON body and extra headers, and returns the answer.</summary>
    public async Task<HttpResponseMessage> SendAsync(HttpMethod method, string path, JsonNode? body = null, params (string Name, string Value)[] headers)
    {
        using var client = CreateClient();
        using var request = new HttpRequestMessage(method, new Uri(path, UriKind.Relative));
        if (body is not null)
        {
            request.Content = new StringContent(body.ToJsonString(), Encoding.UTF8, "application/json");
        }

        request.Headers.Accept.Add(new MediaTypeWithQualityHeaderValue("application/json"));
        foreach (var (name, value) in headers)
        {
            request.Headers.Remove(name);
            request.Headers.TryAddWithoutValidation(name, value);
        }

        return await client.SendAsync(request);
    }

    protected override void ConfigureWebHost(IWebHostBuilder builder)
    {
        builder.UseEnvironment(environment);
        builder.UseSetting($"{AccessOptions.Section}:{nameof(AccessOptions.KeyStorePath)}", KeyStorePath);
        builder.UseSetting($"{StudiesOptions.Section}:{nameof(StudiesOptions.SqlitePath)}", StudyStorePath);

        // The guard on costly requests is lifted unless a test sets it: most hosts here make many on purpose.
        builder.UseSetting("Limits:CostlyPermitLimit", "1000000");

        // Only hosts that screen batches run a batch worker (a test says so): a worker per host would crowd the process.
        builder.UseSetting("Service:Role", "api");
        foreach (var (key, value) in settings)
        {
            builder.UseSetting(key, value);
        }
    }

    protected override void Dispose(bool disposing)
    {
        base.Dispose(disposing);
        SqliteConnection.ClearAllPools();
        File.Delete(KeyStorePath);
        StudyFiles.Delete(StudyStorePath);
    }
}
