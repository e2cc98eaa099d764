using Microsoft.AspNetCore.Hosting;
using Microsoft.AspNetCore.Mvc.Testing;
using Microsoft.Data.Sqlite;
using SafetyMirror.Api.Features.Studies;

namespace SafetyMirror.Api.Tests;

/// <summary>The one in-memory host that every API test talks to through the real HTTP pipeline.</summary>
public sealed class ApiFactory : WebApplicationFactory<Program>
{
    /// <summary>The study store's file, fresh for this host and deleted with it.</summary>
    public string StudyStorePath { get; } = Path.Combine(Path.GetTempPath(), $"safetymirror-studies-{Guid.NewGuid():N}.db");

    /// <summary>Sends GET for a path of the service.</summary>
    public async Task<HttpResponseMessage> GetAsync(string path)
    {
        using var client = CreateClient();
        return await client.GetAsync(new Uri(path, UriKind.Relative));
    }

    /// <summary>Sends POST with the given body to a path of the service.</summary>
    public async Task<HttpResponseMessage> PostAsync(string path, HttpContent body)
    {
        using var client = CreateClient();
        return await client.PostAsync(new Uri(path, UriKind.Relative), body);
    }

    // Every test shares this host and its one client address; the limit on costly requests is a production guard that the
    // rate-limit tests prove on hosts of their own, so here it is lifted.
    protected override void ConfigureWebHost(IWebHostBuilder builder) =>
        builder.UseSetting($"{StudiesOptions.Section}:{nameof(StudiesOptions.SqlitePath)}", StudyStorePath)
            .UseSetting("Limits:CostlyPermitLimit", "1000000")
            .UseSetting("Service:Role", "api"); // no batch worker here: the batch tests run their own hosts

    protected override void Dispose(bool disposing)
    {
        base.Dispose(disposing);
        SqliteConnection.ClearAllPools();
        StudyFiles.Delete(StudyStorePath);
    }
}

/// <summary>Removes a test's SQLite study file with its write-ahead log and shared-memory files.</summary>
internal static class StudyFiles
{
    /// <summary>Deletes the file and its -wal and -shm companions.</summary>
    public static void Delete(string path)
    {
        foreach (var file in new[] { path, path + "-wal", path + "-shm" })
        {
            File.Delete(file);
        }
    }
}

/// <summary>Shares one <see cref="ApiFactory"/> across the test classes that join the collection.</summary>
[CollectionDefinition(Name)]
public sealed class ApiCollection : ICollectionFixture<ApiFactory>
{
    /// <summary>The collection's name.</summary>
    public const string Name = "api";
}
