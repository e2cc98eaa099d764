using System.Text.Json;
using Npgsql;
using SafetyMirror.Api.Tests.Features.Studies;
using SafetyMirror.Studies.Tests.Storage;

namespace SafetyMirror.Api.Tests.Features.Batches;

// Two real service processes share one PostgreSQL (studies and the job engine's queue); one is killed with SIGKILL
// mid-batch, and the other must finish every corner exactly once.
public sealed class BatchKillTests : IDisposable
{
    private const int Corners = 60;
    private const int RecordedBeforeKill = 12;

    private readonly string keyStorePath = Path.Combine(Path.GetTempPath(), $"safetymirror-keys-{Guid.NewGuid():N}.db");
    private readonly string studyStorePath = Path.Combine(Path.GetTempPath(), $"safetymirror-studies-{Guid.NewGuid():N}.db");

    public void Dispose()
    {
        Microsoft.Data.Sqlite.SqliteConnection.ClearAllPools();
        StudyFiles.Delete(keyStorePath);
        StudyFiles.Delete(studyStorePath);
    }

    [Fact]
    public async Task KillTheOnlyProcessMidBatch_OnRestartTheBatchFinishesEveryCornerExactlyOnce()
    {
        // The embedded default: studies in SQLite, the job queue in memory and refilled from the batch tables at start-up.
        var studies = ("SqlitePath", studyStorePath);
        (string, string)[] settings = [("Batches__CornersPerJob", "3"), ("Batches__Workers", "1"), ("Batches__PollSeconds", "0.2")];
        string id;
        using (var first = await ServiceProcess.StartAsync(keyStorePath, studies, settings))
        {
            id = await Districts.SubmitAsync(first.Client, Districts.Collection([.. Enumerable.Range(1, 30).Select(i => ($"EB-{i:D3}", true))]).ToJsonString());
            var deadline = DateTime.UtcNow + TimeSpan.FromMinutes(3);
            while ((await Districts.GetAsync(first.Client, id)).GetProperty("counts").GetProperty("done").GetInt32() < 6)
            {
                Assert.True(DateTime.UtcNow < deadline, "No corner was recorded in time.");
                await Task.Delay(100);
            }

            first.Kill();
        }

        using var second = await ServiceProcess.StartAsync(keyStorePath, studies, settings);
        var batch = await Districts.WaitUntilFinishedAsync(second.Client, id);

        Assert.Equal(30, batch.GetProperty("counts").GetProperty("done").GetInt32());
        using var list = await second.Client.GetAsync(new Uri("/v1/studies?limit=500", UriKind.Relative));
        using var listed = System.Text.Json.JsonDocument.Parse(await list.Content.ReadAsStringAsync());
        Assert.Equal(30, listed.RootElement.GetProperty("total").GetInt32()); // one study per corner, none twice
    }

    [Fact]
    public async Task KillOneOfTwoWorkersMidBatch_TheOtherFinishesEveryCornerExactlyOnce()
    {
        var postgres = await TestPostgres.CreateSchemaAsync();
        try
        {
            (string, string)[] settings =
            [
                ("Batches__CornersPerJob", "3"),
                ("Batches__Workers", "1"),
                ("Batches__PollSeconds", "0.2"),
                ("Batches__RedeliverAfterSeconds", "10"), // the killed worker's job is handed on after this
            ];
            // Started together, as replicas are: both install the job engine's schema at once, and neither may fail.
            var started = await Task.WhenAll(
                ServiceProcess.StartAsync(keyStorePath, ("PostgresConnectionString", postgres), settings),
                ServiceProcess.StartAsync(keyStorePath, ("PostgresConnectionString", postgres), settings));
            using var survivor = started[0];
            using var victim = started[1];
            var district = Districts.Collection([.. Enumerable.Range(1, Corners).Select(i => ($"EB-{i:D3}", true))]);
            var id = await Districts.SubmitAsync(victim.Client, district.ToJsonString());

            // Kill the victim once both workers have recorded corners, so that it dies holding a job.
            var deadline = DateTime.UtcNow + TimeSpan.FromMinutes(3);
            while (true)
            {
                var workers = await RecordedByWorkerAsync(postgres);
                if (workers.Count == 2 && workers.Values.Sum() >= RecordedBeforeKill)
                {
                    break;
                }

                Assert.True(DateTime.UtcNow < deadline, $"Both workers did not record corners in time: {string.Join(", ", workers)}");
                await Task.Delay(100);
            }

            victim.Kill();

            JsonElement batch;
            try
            {
                batch = await Districts.WaitUntilFinishedAsync(survivor.Client, id);
            }
            catch (Xunit.Sdk.XunitException stalled)
            {
                throw new InvalidOperationException($"{stalled.Message} {await WhereItStandsAsync(postgres)}", stalled);
            }

            Assert.Equal(Corners, batch.GetProperty("counts").GetProperty("done").GetInt32());
            await using var connection = new NpgsqlConnection(postgres);
            await connection.OpenAsync();
            await using var count = new NpgsqlCommand(
                "SELECT (SELECT count(*) FROM studies), (SELECT count(DISTINCT study_id) FROM batch_corners WHERE status = 'done')", connection);
            await using var reader = await count.ExecuteReaderAsync();
            await reader.ReadAsync();
            Assert.Equal((Corners, Corners), (reader.GetInt64(0), reader.GetInt64(1))); // one study per corner, none twice
            Assert.Equal(2, (await RecordedByWorkerAsync(postgres)).Count);
        }
        finally
        {
            await TestPostgres.DropSchemaAsync(postgres);
        }
    }

    /// <summary>The unrecorded corners and the job engine's jobs by state, to say why a batch stalled.</summary>
    private static async Task<string> WhereItStandsAsync(string postgres)
    {
        var jobs = SafetyMirror.Api.Features.Batches.BatchSetup.DefaultJobSchema(postgres);
        await using var connection = new NpgsqlConnection(postgres);
        await connection.OpenAsync();
        var lines = new List<string>();
        foreach (var sql in new[]
        {
            "SELECT position || ' ' || status || ' attempts ' || attempts || ' ' || coalesce(worker, '-') FROM batch_corners WHERE status <> 'done'",
            $"SELECT statename || ': ' || count(*) FROM {jobs}.job GROUP BY statename",
            $"SELECT 'queued ' || jobid || ' fetched ' || coalesce(fetchedat::text, '-') FROM {jobs}.jobqueue",
        })
        {
            await using var select = new NpgsqlCommand(sql, connection);
            await using var reader = await select.ExecuteReaderAsync();
            while (await reader.ReadAsync())
            {
                lines.Add(reader.GetString(0));
            }
        }

        return string.Join("; ", lines);
    }

    /// <summary>How many corners each worker has recorded so far.</summary>
    private static async Task<Dictionary<string, long>> RecordedByWorkerAsync(string postgres)
    {
        await using var connection = new NpgsqlConnection(postgres);
        await connection.OpenAsync();
        await using var select = new NpgsqlCommand(
            "SELECT worker, count(*) FROM batch_corners WHERE status = 'done' GROUP BY worker", connection);
        var recorded = new Dictionary<string, long>();
        try
        {
            await using var reader = await select.ExecuteReaderAsync();
            while (await reader.ReadAsync())
            {
                recorded[reader.GetString(0)] = reader.GetInt64(1);
            }
        }
        catch (PostgresException e) when (e.SqlState == PostgresErrorCodes.UndefinedTable)
        {
            // Not migrated yet.
        }

        return recorded;
    }
}
