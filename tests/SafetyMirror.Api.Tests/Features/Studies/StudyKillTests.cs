using System.Collections.Concurrent;
using System.Net;
using System.Text;
using System.Text.Json;
using System.Text.Json.Nodes;
using Microsoft.Data.Sqlite;
using SafetyMirror.Studies;
using SafetyMirror.Studies.Tests.Storage;

namespace SafetyMirror.Api.Tests.Features.Studies;

// The real service process is killed (SIGKILL) in a burst of revisions and started again on the same store, on both back-ends.
public sealed class StudyKillTests : IDisposable
{
    /// <summary>The embedded back-end.</summary>
    public const string Sqlite = "sqlite";

    /// <summary>The shared-server back-end.</summary>
    public const string Postgres = "postgres";

    private const int Writers = 4;
    private const int AcknowledgedBeforeKill = 12;

    private readonly string studyStorePath = Path.Combine(Path.GetTempPath(), $"safetymirror-studies-{Guid.NewGuid():N}.db");
    private readonly string keyStorePath = Path.Combine(Path.GetTempPath(), $"safetymirror-keys-{Guid.NewGuid():N}.db");

    public void Dispose()
    {
        SqliteConnection.ClearAllPools();
        StudyFiles.Delete(studyStorePath);
        StudyFiles.Delete(keyStorePath);
    }

    [Theory]
    [InlineData(Sqlite)]
    [InlineData(Postgres)]
    public async Task KillDuringRevisionBurst_EveryAcknowledgedRevisionSurvivesIntact(string backend)
    {
        var postgres = backend == Postgres ? await TestPostgres.CreateSchemaAsync() : null;
        try
        {
            await KillDuringBurstAsync(postgres is null ? ("SqlitePath", studyStorePath) : ("PostgresConnectionString", postgres));
        }
        finally
        {
            if (postgres is not null)
            {
                await TestPostgres.DropSchemaAsync(postgres);
            }
        }
    }

    private async Task KillDuringBurstAsync((string Key, string Value) studies)
    {
        var acknowledged = new ConcurrentDictionary<int, string>();
        string id;
        using (var service = await ServiceProcess.StartAsync(keyStorePath, studies))
        {
            using var create = await PostAsync(service.Client, Studies.Route, Studies.LocalDemo());
            id = (await Studies.ExpectAsync(create, HttpStatusCode.Created)).Id();
            using var enough = new CancellationTokenSource();
            var writers = Enumerable.Range(0, Writers).Select(w => Task.Run(async () =>
            {
                for (var i = 0; !enough.IsCancellationRequested; i++)
                {
                    var note = $"writer {w} change {i}";
                    try
                    {
                        using var response = await PostAsync(service.Client, $"{Studies.Route}/{id}/revisions", Studies.Revision(note));
                        if (response.StatusCode == HttpStatusCode.Created)
                        {
                            using var added = JsonDocument.Parse(await response.Content.ReadAsStringAsync());
                            acknowledged[added.RootElement.GetProperty("number").GetInt32()] = note;
                        }
                    }
                    catch (HttpRequestException)
                    {
                        return; // the service is gone: this write was never acknowledged
                    }
                }
            })).ToList();

            while (acknowledged.Count < AcknowledgedBeforeKill && writers.All(w => !w.IsCompleted))
            {
                await Task.Delay(10);
            }

            // Killed while the writers are still sending: some writes are in flight.
            service.Kill();
            await enough.CancelAsync();
            await Task.WhenAll(writers);
        }

        Assert.True(acknowledged.Count >= AcknowledgedBeforeKill, $"Only {acknowledged.Count} revisions were acknowledged before the writers stopped.");
        using var restarted = await ServiceProcess.StartAsync(keyStorePath, studies);
        using var got = await restarted.Client.GetAsync(new Uri($"{Studies.Route}/{id}", UriKind.Relative));
        var study = await Studies.ExpectAsync(got, HttpStatusCode.OK);
        var stored = study.GetProperty("revisions").EnumerateArray().ToDictionary(r => r.GetProperty("number").GetInt32(), r => r.GetProperty("note").GetString());
        Assert.Equal(Enumerable.Range(1, stored.Count), stored.Keys.Order()); // numbered without gaps: no half-written revision
        foreach (var (number, note) in acknowledged)
        {
            Assert.Equal(note, stored[number]);
            using var fetched = await restarted.Client.GetAsync(new Uri($"{Studies.Route}/{id}/revisions/{number}", UriKind.Relative));
            var revision = await Studies.ExpectAsync(fetched, HttpStatusCode.OK);
            var request = revision.GetProperty("request");
            Assert.Equal(
                RequestHash.Of(request.GetProperty("plan").GetRawText(), request.GetProperty("options").GetRawText(), request.GetProperty("mirror").GetRawText()),
                revision.GetProperty("hash").GetString());
            Assert.True(revision.GetProperty("evaluation").TryGetProperty("decision", out _));
        }
    }

    private static Task<HttpResponseMessage> PostAsync(HttpClient client, string path, JsonNode body) =>
        client.PostAsync(new Uri(path, UriKind.Relative), new StringContent(body.ToJsonString(), Encoding.UTF8, "application/json"));
}
