using System.Diagnostics;
using System.Globalization;
using System.Net;
using System.Net.Sockets;
using System.Text;
using System.Text.Json;
using Npgsql;

namespace SafetyMirror.Benchmarks.Service;

/// <summary>
/// A district through the real service processes and job engine: posts a batch file, follows it to the end and prints the
/// rate. One process keeps studies and jobs in SQLite (the embedded default); several share a fresh PostgreSQL schema.
/// </summary>
/// <remarks>Start-up is not timed: the clock runs from the post to the last corner recorded.</remarks>
public static class BatchThroughput
{
    /// <summary>Runs one batch and prints what it measured.</summary>
    /// <param name="districtFile">A district: a FeatureCollection grouped by corner, or a GeoJSON text sequence (.geojsons).</param>
    /// <param name="processes">Service processes; the first answers requests and works, the others only work.</param>
    /// <param name="workersPerProcess">Batch workers per process.</param>
    /// <param name="postgres">A PostgreSQL connection string, required for more than one process.</param>
    public static async Task RunAsync(string districtFile, int processes, int workersPerProcess, string? postgres)
    {
        if (processes > 1 && string.IsNullOrWhiteSpace(postgres))
        {
            throw new ArgumentException("Several processes share a PostgreSQL: give its connection string (eval \"$(deploy/dev-postgres.sh start)\").");
        }

        var folder = Directory.CreateTempSubdirectory("safetymirror-batch-bench-");
        var schema = processes > 1 ? await CreateSchemaAsync(postgres!) : null;
        var running = new List<Process>();
        try
        {
            var studies = schema is null
                ? ("Studies__SqlitePath", Path.Combine(folder.FullName, "studies.db"))
                : ("Studies__PostgresConnectionString", new NpgsqlConnectionStringBuilder(postgres) { SearchPath = $"{schema},public" }.ToString());
            var addresses = new List<Uri>();
            for (var p = 0; p < processes; p++)
            {
                var address = new Uri($"http://127.0.0.1:{FreePort()}");
                running.Add(Start(address, folder.FullName, studies, p == 0 ? "all" : "worker", workersPerProcess));
                addresses.Add(address);
            }

            using var client = new HttpClient { BaseAddress = addresses[0], Timeout = TimeSpan.FromMinutes(10) };
            foreach (var address in addresses)
            {
                await WaitHealthyAsync(address);
            }

            var body = await File.ReadAllTextAsync(districtFile);
            var mediaType = body.TrimStart().StartsWith('\u001e') ? "application/geo+json-seq" : "application/geo+json";
            var clock = Stopwatch.StartNew();
            using var content = new StringContent(body, Encoding.UTF8);
            content.Headers.ContentType = new System.Net.Http.Headers.MediaTypeHeaderValue(mediaType);
            using var posted = await client.PostAsync(new Uri("/v1/batches", UriKind.Relative), content);
            var accepted = await posted.Content.ReadAsStringAsync();
            if (posted.StatusCode != HttpStatusCode.Accepted)
            {
                throw new InvalidOperationException($"The batch was refused ({(int)posted.StatusCode}): {accepted}");
            }

            var postedAfter = clock.Elapsed;
            var id = JsonDocument.Parse(accepted).RootElement.GetProperty("id").GetString();
            JsonElement batch;
            while (true)
            {
                await Task.Delay(500);
                batch = JsonDocument.Parse(await client.GetStringAsync(new Uri($"/v1/batches/{id}?limit=1", UriKind.Relative))).RootElement;
                if (batch.GetProperty("state").GetString() == "finished")
                {
                    break;
                }
            }

            var counts = batch.GetProperty("counts");
            var total = counts.GetProperty("total").GetInt32();
            var seconds = clock.Elapsed.TotalSeconds;
            Console.WriteLine(string.Create(CultureInfo.InvariantCulture,
                $"{processes} process(es) x {workersPerProcess} worker(s): {total} corners ({counts.GetProperty("done").GetInt32()} done, "
                + $"{counts.GetProperty("failed").GetInt32()} failed) in {seconds:F1} s from the post (post answered in {postedAfter.TotalSeconds:F1} s): "
                + $"{total / seconds:F1} corners/s; the batch's own rate {batch.GetProperty("cornersPerSecond")} corners/s"));
        }
        finally
        {
            foreach (var process in running)
            {
                process.Kill(entireProcessTree: true);
                await process.WaitForExitAsync();
                process.Dispose();
            }

            if (schema is not null)
            {
                await using var connection = new NpgsqlConnection(postgres);
                await connection.OpenAsync();
                await using var drop = new NpgsqlCommand($"DROP SCHEMA {schema} CASCADE; DROP SCHEMA IF EXISTS {schema}_jobs CASCADE", connection);
                await drop.ExecuteNonQueryAsync();
            }

            folder.Delete(recursive: true);
        }
    }

    private static Process Start(Uri address, string folder, (string Name, string Value) studies, string role, int workers)
    {
        var service = typeof(SafetyMirror.Api.Features.Batches.BatchJob).Assembly.Location;
        var start = new ProcessStartInfo(Environment.GetEnvironmentVariable("DOTNET_HOST_PATH") ?? "dotnet")
        {
            ArgumentList = { service, "--urls", address.ToString() },
            UseShellExecute = false,
            RedirectStandardOutput = true,
            WorkingDirectory = Path.GetDirectoryName(service)!,
            Environment =
            {
                ["ASPNETCORE_ENVIRONMENT"] = "Development",
                ["Access__AllowLoopbackWithoutKey"] = "true",
                ["Access__KeyStorePath"] = Path.Combine(folder, "keys.db"),
                [studies.Name] = studies.Value,
                ["Posture__HttpsRedirection"] = "false",
                ["Service__Role"] = role,
                ["Batches__Workers"] = workers.ToString(CultureInfo.InvariantCulture),
                ["Logging__LogLevel__Default"] = "Warning",
            },
        };
        var process = Process.Start(start) ?? throw new InvalidOperationException("dotnet did not start.");
        process.OutputDataReceived += (_, _) => { };
        process.BeginOutputReadLine();
        return process;
    }

    private static async Task WaitHealthyAsync(Uri address)
    {
        using var client = new HttpClient { BaseAddress = address };
        for (var tries = 0; tries < 600; tries++)
        {
            try
            {
                using var response = await client.GetAsync(new Uri("/healthz", UriKind.Relative));
                if (response.IsSuccessStatusCode)
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

        throw new TimeoutException($"The service at {address} did not start.");
    }

    private static async Task<string> CreateSchemaAsync(string postgres)
    {
        var schema = $"bench_{Guid.NewGuid():N}";
        await using var connection = new NpgsqlConnection(postgres);
        await connection.OpenAsync();
        await using var create = new NpgsqlCommand($"CREATE SCHEMA {schema}", connection);
        await create.ExecuteNonQueryAsync();
        return schema;
    }

    private static int FreePort()
    {
        using var listener = new TcpListener(IPAddress.Loopback, 0);
        listener.Start();
        return ((IPEndPoint)listener.LocalEndpoint).Port;
    }
}
