using SafetyMirror.Studies.Storage;

namespace SafetyMirror.Studies.Tests.Storage;

// The batch half of the store, on both back-ends: corners claimed, recorded once with their study, cancelled and resumed.
public abstract partial class StudyStoreContract
{
    static CornerInput Input(int n) => new($$"""{"type":"FeatureCollection","features":[],"n":{{n}}}""", null, "{}", "{}");

    static NewBatchCorner[] Corners(int count) =>
        [.. Enumerable.Range(0, count).Select(n => new NewBatchCorner($"EW-{n}", $"Corner {n}", Input(n)))];

    static CornerResult Screened(int position, string worker = "w1") => CornerResult.Screened(
        position, worker, """{"decision":"meets-requirement"}""", Corner($"Corner {position}"), Content(1, "screened"));

    [Fact]
    public async Task CreateBatch_WithAFailedSplit_CountsTheRestPending()
    {
        var batch = await Store.CreateBatchAsync(new NewBatch("Eastwick district", "eastwick-roads", 2),
            [.. Corners(3), new NewBatchCorner("EW-bad", "EW-bad", Input(9), """{"status":400}""")]);

        var read = await Store.GetBatchAsync(batch.Id);

        Assert.Equal(new BatchCounts(4, 3, 0, 0, 1), read!.Counts);
        Assert.Equal([0, 1, 2], await Store.UnfinishedPositionsAsync(batch.Id));
    }

    [Fact]
    public async Task RecordCorners_SameCornerTwice_RecordsItOnceWithOneStudy()
    {
        var batch = await Store.CreateBatchAsync(new NewBatch("Eastwick district", "eastwick-roads", 2), Corners(2));
        await Store.ClaimCornersAsync(batch.Id, 0, 1, "w1");

        var first = await Store.RecordCornersAsync(batch.Id, [Screened(0, "w1")]);
        var again = await Store.RecordCornersAsync(batch.Id, [Screened(0, "w2"), Screened(1, "w2")]);

        Assert.Equal((1, 1), (first, again));
        var corners = await Store.ListCornersAsync(batch.Id, 0, 10);
        Assert.Equal(["w1", "w2"], corners.Select(c => c.Worker));
        Assert.All(corners, c => Assert.Equal(CornerStatus.Done, c.Status));
        Assert.Equal(2, (await Store.ListAsync(new StudyQuery(Owner: "eastwick-roads"))).Total);
        var study = await Store.GetStudyAsync(corners[0].StudyId!.Value);
        Assert.Equal("Corner 0", study!.Study.Title);
    }

    [Fact]
    public async Task ClaimCorners_CancelledBatch_ClaimsNothingUntilResumed()
    {
        var batch = await Store.CreateBatchAsync(new NewBatch("Eastwick district", "eastwick-roads", 2), Corners(4));
        var claimed = await Store.ClaimCornersAsync(batch.Id, 0, 1, "w1");
        await Store.SetBatchStateAsync(batch.Id, BatchState.Cancelled);
        await Store.ReleaseCornersAsync(batch.Id, [.. claimed.Select(c => c.Position)]);

        var whileCancelled = await Store.ClaimCornersAsync(batch.Id, 2, 3, "w1");
        await Store.SetBatchStateAsync(batch.Id, BatchState.Active);
        var afterResume = await Store.ClaimCornersAsync(batch.Id, 0, 3, "w2");

        Assert.Equal([0, 1], claimed.Select(c => c.Position));
        Assert.Empty(whileCancelled);
        Assert.Equal([0, 1, 2, 3], afterResume.Select(c => c.Position));
        Assert.Equal(BatchState.Active, await Store.GetBatchStateAsync(batch.Id));
        Assert.All(await Store.ListCornersAsync(batch.Id, 0, 10), c => Assert.Equal(c.Position < 2 ? 2 : 1, c.Attempts));
    }

    [Fact]
    public async Task ClaimCorners_LeftRunningByAStoppedWorker_AreClaimedAgain()
    {
        var batch = await Store.CreateBatchAsync(new NewBatch("Eastwick district", "eastwick-roads", 2), Corners(2));
        await Store.ClaimCornersAsync(batch.Id, 0, 1, "w1");
        await Store.RecordCornersAsync(batch.Id, [Screened(0, "w1")]);

        var reclaimed = await Store.ClaimCornersAsync(batch.Id, 0, 1, "w2");

        Assert.Equal([1], reclaimed.Select(c => c.Position));
        Assert.Equal(new BatchCounts(2, 0, 1, 1, 0), (await Store.GetBatchAsync(batch.Id))!.Counts);
    }

    [Fact]
    public async Task GetBatch_NoSuchBatch_IsNull()
    {
        Assert.Null(await Store.GetBatchAsync(Guid.NewGuid()));
        Assert.Null(await Store.GetBatchStateAsync(Guid.NewGuid()));
    }
}
