using System.Text.Json;
using BenchmarkDotNet.Attributes;
using Npgsql;
using SafetyMirror.Studies;
using SafetyMirror.Studies.Storage;

namespace SafetyMirror.Benchmarks.Studies;

/// <summary>
/// The study store on each back-end: store and fetch one revision of the demo corner, and list by bounding box among
/// 10,000 studies. PostgreSQL comes from SAFETYMIRROR_TEST_POSTGRES (start one with deploy/dev-postgres.sh start).
/// </summary>
[MemoryDiagnoser]
public class StudyStoreBenchmarks
{
    const int StudyCount = 10_000;

    // Invented district the studies are spread over (demo data), about 35 km by 55 km.
    const double WestDeg = 4.2, SouthDeg = 50.7, SpanDeg = 0.5;

    /// <summary>Which back-end.</summary>
    [Params("sqlite", "postgres")]
    public string Backend { get; set; } = "sqlite";

    SqlStudyStore store = null!;
    string location = "";
    Guid demoStudy;
    RevisionContent demoRevision = null!;

    // About a hundredth of the district: some 100 studies meet it.
    static readonly GeoBox Query = new(WestDeg + 0.2, SouthDeg + 0.2, WestDeg + 0.25, SouthDeg + 0.25);

    /// <summary>Target: a revision is committed (synced to disk) in under 20 ms.</summary>
    [Benchmark]
    public async Task<RevisionWrite> StoreDemoRevision() => await store.AddRevisionAsync(demoStudy, demoRevision);

    /// <summary>Target: a revision is read back in under 5 ms.</summary>
    [Benchmark]
    public async Task<Revision?> FetchDemoRevision() => await store.GetRevisionAsync(demoStudy, 1);

    /// <summary>Target: the first page of a bounding-box search among 10,000 studies in under 20 ms.</summary>
    [Benchmark]
    public async Task<StudyPage> ListByBoxAmong10000() => await store.ListAsync(new StudyQuery(Intersecting: Query));

    /// <summary>Seeds the back-end once: the demo corner and 10,000 small studies spread over the district.</summary>
    [GlobalSetup]
    public async Task SetUp()
    {
        location = Backend == "sqlite" ? Path.Combine(Directory.CreateTempSubdirectory("safetymirror-bench-").FullName, "studies.db") : await CreateSchemaAsync();
        store = Backend == "sqlite" ? new SqliteStudyStore(location, TimeProvider.System) : new PostgresStudyStore(location, TimeProvider.System);
        await store.MigrateAsync();

        demoRevision = DemoCorner();
        demoStudy = (await store.CreateAsync(new NewStudy("Demo corner", "Invented street", null, null, "bench"), demoRevision)).Study.Id;

        var random = new Random(20260314);
        var small = demoRevision with { PlanJson = """{"type":"FeatureCollection","features":[]}""", EvaluationJson = null };
        await Parallel.ForAsync(0, StudyCount, new ParallelOptions { MaxDegreeOfParallelism = 4 }, async (i, cancellationToken) =>
        {
            double west, south;
            lock (random) (west, south) = (WestDeg + random.NextDouble() * SpanDeg, SouthDeg + random.NextDouble() * SpanDeg);
            var extent = new GeoBox(west, south, west + 0.002, south + 0.0015);
            await store.CreateAsync(new NewStudy($"Corner {i}", $"Street {i}", new GeoPoint(west, south), extent, "bench"), small, cancellationToken);
        });
    }

    /// <summary>Removes what the setup made.</summary>
    [GlobalCleanup]
    public async Task CleanUp()
    {
        await store.DisposeAsync();
        if (Backend == "sqlite")
        {
            Directory.Delete(Path.GetDirectoryName(location)!, recursive: true);
            return;
        }
        var schema = new NpgsqlConnectionStringBuilder(location).SearchPath!.Split(',')[0];
        await using var connection = new NpgsqlConnection(BaseConnectionString());
        await connection.OpenAsync();
        await using var drop = new NpgsqlCommand($"DROP SCHEMA {schema} CASCADE", connection);
        await drop.ExecuteNonQueryAsync();
    }

    /// <summary>The demo corner in WGS84 with its mirror and options, and a stand-in evaluation answer of similar size.</summary>
    static RevisionContent DemoCorner()
    {
        using var demo = JsonDocument.Parse(File.ReadAllText(Path.Combine(RepositoryRoot(), "openapi", "examples", "demo-corner-wgs84.json")));
        var root = demo.RootElement;
        return new RevisionContent(root.GetProperty("plan").GetRawText(), root.GetProperty("options").GetRawText(),
            root.GetProperty("mirror").GetRawText(), "bench", "{}", EvaluationJson: root.GetRawText(), RecommendationJson: null,
            Author: "bench", Note: "demo corner");
    }

    static string RepositoryRoot()
    {
        for (var folder = new DirectoryInfo(AppContext.BaseDirectory); folder is not null; folder = folder.Parent)
            if (File.Exists(Path.Combine(folder.FullName, "SafetyMirror.sln"))) return folder.FullName;
        throw new InvalidOperationException("SafetyMirror.sln not found above " + AppContext.BaseDirectory);
    }

    static string BaseConnectionString() => Environment.GetEnvironmentVariable("SAFETYMIRROR_TEST_POSTGRES") is { Length: > 0 } connection
        ? connection
        : throw new InvalidOperationException("SAFETYMIRROR_TEST_POSTGRES is not set: eval \"$(deploy/dev-postgres.sh start)\" first.");

    static async Task<string> CreateSchemaAsync()
    {
        var schema = $"bench_{Guid.NewGuid():N}";
        await using var connection = new NpgsqlConnection(BaseConnectionString());
        await connection.OpenAsync();
        await using var create = new NpgsqlCommand($"CREATE SCHEMA {schema}", connection);
        await create.ExecuteNonQueryAsync();
        return new NpgsqlConnectionStringBuilder(BaseConnectionString()) { SearchPath = $"{schema},public" }.ToString();
    }
}
