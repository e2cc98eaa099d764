// A process that writes revisions as fast as it can until it is killed, for the durability test.
// Usage: SafetyMirror.Studies.Writer sqlite <file> | postgres <connection string>
// Prints "study <id>", then "ack <revision number> <write number>" for each revision, only after its commit.
using SafetyMirror.Studies;
using SafetyMirror.Studies.Storage;

if (args is not [("sqlite" or "postgres") and var backend, var location])
{
    Console.Error.WriteLine("usage: SafetyMirror.Studies.Writer sqlite <file> | postgres <connection string>");
    return 2;
}

var options = backend == "sqlite" ? new StudyStorageOptions(SqlitePath: location) : new StudyStorageOptions(PostgresConnectionString: location);
await using var store = await StudyStorage.OpenAsync(options, TimeProvider.System);

var created = await store.CreateAsync(new NewStudy("Burst", "Invented corner", null, null, "writer"), BurstContent.For(0));
var studyId = created.Study.Id;
Console.WriteLine($"study {studyId}");
Console.WriteLine($"ack 1 0");

var writes = 0;
// A few writers at once, so the kill can land while several transactions are open.
await Task.WhenAll(Enumerable.Range(0, 4).Select(_ => Task.Run(async () =>
{
    while (true)
    {
        var write = Interlocked.Increment(ref writes);
        var result = await store.AddRevisionAsync(studyId, BurstContent.For(write));
        Console.WriteLine($"ack {result.Revision!.Number} {write}");
    }
})));
return 0;

/// <summary>The content of the n-th write, so the test can tell which write a stored revision came from.</summary>
public static class BurstContent
{
    /// <summary>A small revision whose plan and note carry the write number.</summary>
    public static RevisionContent For(int write) => new(
        PlanJson: $$"""{"type":"FeatureCollection","features":[],"write":{{write}}}""",
        OptionsJson: """{"approachSpeedKmh":30}""",
        MirrorJson: null,
        ServiceVersion: "burst",
        RuleSetJson: "{}",
        EvaluationJson: null,
        RecommendationJson: null,
        Author: "writer",
        Note: $"write {write}");
}
