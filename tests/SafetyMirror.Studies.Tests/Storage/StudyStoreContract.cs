using System.Data.Common;
using System.Diagnostics;
using SafetyMirror.Studies.Storage;

namespace SafetyMirror.Studies.Tests.Storage;

/// <summary>What every study store must do; each back-end runs this same suite against a real database.</summary>
public abstract partial class StudyStoreContract : IAsyncLifetime
{
    // Invented corners in WGS84 (demo data).
    static readonly GeoBox AshfordLane = new(4.3500, 50.8500, 4.3510, 50.8506);
    static readonly GeoBox MillbrookCorner = new(4.4000, 50.9000, 4.4008, 50.9005);

    readonly List<SqlStudyStore> stores = [];
    string location = "";

    /// <summary>The store under test, on an empty, migrated database of its own.</summary>
    protected SqlStudyStore Store { get; private set; } = null!;

    /// <summary>The writer process's name for this back-end.</summary>
    protected abstract string BackendName { get; }

    /// <summary>A new empty database: an SQLite file path or a PostgreSQL connection string.</summary>
    protected abstract Task<string> CreateLocationAsync();

    /// <summary>Deletes what <see cref="CreateLocationAsync"/> made.</summary>
    protected abstract Task DeleteLocationAsync(string location);

    /// <summary>A store on a location, not yet migrated.</summary>
    protected abstract SqlStudyStore OpenStore(string location, TimeProvider time);

    /// <summary>A raw connection to a location, to do what the store never does.</summary>
    protected abstract Task<DbConnection> OpenRawAsync(string location);

    /// <summary>Inserts, into a version-1 schema, study @id titled 'Old corner' with the extent of Ashford Lane and one revision
    /// made at 2025-06-01 08:00 UTC.</summary>
    protected abstract string SeedVersionOneSql { get; }

    readonly List<string> locations = [];

    public async Task InitializeAsync()
    {
        location = await NewLocationAsync();
        Store = Open(location, new TestClock());
        await Store.MigrateAsync();
    }

    public async Task DisposeAsync()
    {
        foreach (var store in stores) await store.DisposeAsync();
        foreach (var made in locations) await DeleteLocationAsync(made);
    }

    async Task<string> NewLocationAsync()
    {
        var made = await CreateLocationAsync();
        locations.Add(made);
        return made;
    }

    SqlStudyStore Open(string at, TimeProvider time)
    {
        var store = OpenStore(at, time);
        stores.Add(store);
        return store;
    }

    static RevisionContent Content(int version, string note = "") => new(
        PlanJson: $$"""{"type":"FeatureCollection","features":[],"version":{{version}}}""",
        OptionsJson: """{"approachSpeedKmh":30,"roadUsers":["passenger-car","cyclist"]}""",
        MirrorJson: """{"shape":"round","diameterMm":600,"radiusM":2.2}""",
        ServiceVersion: "1.0.0",
        RuleSetJson: """{"maxAimErrorDeg":2}""",
        EvaluationJson: """{"decision":"meets-requirement"}""",
        RecommendationJson: null,
        Author: "A. Planner",
        Note: note);

    static NewStudy Corner(string title = "Driveway onto Ashford Lane", string site = "Ashford Lane 12, Eastwick", GeoBox? extent = null) =>
        new(title, site, extent is { } box ? new GeoPoint((box.WestDeg + box.EastDeg) / 2, (box.SouthDeg + box.NorthDeg) / 2) : null, extent, "eastwick-roads");

    [Fact]
    public async Task CreateAsync_NewStudy_ReadsBackWithRevisionOne()
    {
        var created = await Store.CreateAsync(Corner(extent: AshfordLane), Content(1, "first drawing"));

        var read = await Store.GetStudyAsync(created.Study.Id);

        Assert.NotNull(read);
        Assert.Equal(created.Study, read.Study);
        Assert.Equal(created.Revisions, read.Revisions);
        Assert.Equal(AshfordLane, read.Study.Extent);
        Assert.Equal(1, Assert.Single(read.Revisions).Number);
    }

    [Fact]
    public async Task CreateAsync_StudyWithoutExtent_ReadsBackWithoutPointOrBox()
    {
        var created = await Store.CreateAsync(Corner(), Content(1));

        var read = await Store.GetStudyAsync(created.Study.Id);

        Assert.Null(read!.Study.SitePoint);
        Assert.Null(read.Study.Extent);
    }

    [Fact]
    public async Task CreateAsync_Times_ComeFromTheInjectedClock()
    {
        var store = Open(location, new TestClock());
        var created = await store.CreateAsync(Corner(), Content(1));

        var read = await store.GetStudyAsync(created.Study.Id);

        Assert.Equal(TestClock.Start, read!.Study.CreatedAt);
        Assert.Equal(TestClock.Start, read.Revisions[0].CreatedAt);
    }

    [Fact]
    public async Task GetRevisionAsync_StoredRevision_ReturnsItsContentByteForByte()
    {
        // Whitespace and member order as posted must survive: the text is kept, not re-serialised.
        var content = Content(1) with { PlanJson = "{ \"features\" : [],\n  \"type\":\"FeatureCollection\" }", Note = "Überprüfung nach Ortstermin" };
        var created = await Store.CreateAsync(Corner(), content);

        var revision = await Store.GetRevisionAsync(created.Study.Id, 1);

        Assert.NotNull(revision);
        Assert.Equal(content, revision.Content);
        Assert.Equal(created.Revisions[0].ContentHash, revision.ContentHash);
    }

    [Fact]
    public async Task GetRevisionAsync_StoredRevision_HashEqualsTheHashOfItsRequest()
    {
        var created = await Store.CreateAsync(Corner(), Content(1));

        var revision = await Store.GetRevisionAsync(created.Study.Id, 1);

        Assert.Equal(RequestHash.Of(revision!.Content.PlanJson, revision.Content.OptionsJson, revision.Content.MirrorJson), revision.ContentHash);
    }

    [Fact]
    public async Task AddRevisionAsync_LiveStudy_AddsTheNextNumberAndKeepsTheEarlierOne()
    {
        var created = await Store.CreateAsync(Corner(), Content(1, "first"));

        var added = await Store.AddRevisionAsync(created.Study.Id, Content(2, "after the site visit"));

        Assert.Equal(RevisionWriteOutcome.Added, added.Outcome);
        Assert.Equal(2, added.Revision!.Number);
        Assert.Equal(Content(1, "first"), (await Store.GetRevisionAsync(created.Study.Id, 1))!.Content);
        Assert.Equal(Content(2, "after the site visit"), (await Store.GetRevisionAsync(created.Study.Id, 2))!.Content);
        var study = await Store.GetStudyAsync(created.Study.Id);
        Assert.Equal([1, 2], study!.Revisions.Select(r => r.Number));
        Assert.Equal(2, study.Study.LatestRevision);
        Assert.Equal(added.Revision.CreatedAt, study.Study.UpdatedAt);
    }

    [Fact]
    public async Task AddRevisionAsync_TwentyConcurrentAdds_NumberThemTwoToTwentyOneWithoutGapsOrRepeats()
    {
        var created = await Store.CreateAsync(Corner(), Content(1));

        var writes = await Task.WhenAll(Enumerable.Range(2, 20).Select(version =>
            Task.Run(() => Store.AddRevisionAsync(created.Study.Id, Content(version, $"write {version}")))));

        Assert.All(writes, w => Assert.Equal(RevisionWriteOutcome.Added, w.Outcome));
        Assert.Equal(Enumerable.Range(2, 20), writes.Select(w => w.Revision!.Number).Order());
        var study = await Store.GetStudyAsync(created.Study.Id);
        Assert.Equal(Enumerable.Range(1, 21), study!.Revisions.Select(r => r.Number));
        // Each number holds the write that was told it got that number: no update was lost.
        foreach (var write in writes)
            Assert.Equal(write.Revision!.Content, (await Store.GetRevisionAsync(created.Study.Id, write.Revision.Number))!.Content);
    }

    [Fact]
    public async Task AddRevisionAsync_ConcurrentAddsFromTheSameBase_OneWinsTheOthersConflict()
    {
        var created = await Store.CreateAsync(Corner(), Content(1));

        var writes = await Task.WhenAll(Enumerable.Range(2, 10).Select(version =>
            Task.Run(() => Store.AddRevisionAsync(created.Study.Id, Content(version), expectedLatest: 1))));

        Assert.Single(writes, w => w.Outcome == RevisionWriteOutcome.Added);
        Assert.All(writes.Where(w => w.Outcome != RevisionWriteOutcome.Added), w =>
        {
            Assert.Equal(RevisionWriteOutcome.Conflict, w.Outcome);
            Assert.Equal(2, w.CurrentNumber);
        });
        Assert.Equal(2, (await Store.GetStudyAsync(created.Study.Id))!.Revisions.Count);
    }

    [Fact]
    public async Task AddRevisionAsync_StaleExpectedRevision_ConflictsWithTheCurrentNumberAndWritesNothing()
    {
        var created = await Store.CreateAsync(Corner(), Content(1));
        await Store.AddRevisionAsync(created.Study.Id, Content(2));
        var before = await Store.GetStudyAsync(created.Study.Id);

        var refused = await Store.AddRevisionAsync(created.Study.Id, Content(3), expectedLatest: 1);

        Assert.Equal(new RevisionWrite(RevisionWriteOutcome.Conflict, null, 2), refused);
        Assert.Equivalent(before, await Store.GetStudyAsync(created.Study.Id), strict: true);
    }

    [Fact]
    public async Task AddRevisionAsync_CurrentExpectedRevision_Adds()
    {
        var created = await Store.CreateAsync(Corner(), Content(1));

        var added = await Store.AddRevisionAsync(created.Study.Id, Content(2), expectedLatest: 1);

        Assert.Equal(RevisionWriteOutcome.Added, added.Outcome);
        Assert.Equal(2, added.CurrentNumber);
    }

    [Fact]
    public async Task AddRevisionAsync_ArchivedStudy_IsRefusedAndWritesNothing()
    {
        var created = await Store.CreateAsync(Corner(), Content(1));
        await Store.ArchiveAsync(created.Study.Id);
        var before = await Store.GetStudyAsync(created.Study.Id);

        var refused = await Store.AddRevisionAsync(created.Study.Id, Content(2));

        Assert.Equal(new RevisionWrite(RevisionWriteOutcome.Archived, null, 1), refused);
        Assert.Equivalent(before, await Store.GetStudyAsync(created.Study.Id), strict: true);
        Assert.Null(await Store.GetRevisionAsync(created.Study.Id, 2));
    }

    [Fact]
    public async Task AddRevisionAsync_ContentThatIsNotJson_IsRefusedAndWritesNothing()
    {
        var created = await Store.CreateAsync(Corner(), Content(1));
        var before = await Store.GetStudyAsync(created.Study.Id);

        await Assert.ThrowsAnyAsync<System.Text.Json.JsonException>(() =>
            Store.AddRevisionAsync(created.Study.Id, Content(2) with { PlanJson = "{\"type\":" }));

        Assert.Equivalent(before, await Store.GetStudyAsync(created.Study.Id), strict: true);
    }

    [Fact]
    public async Task AddRevisionAsync_UnknownStudy_IsNotFound()
    {
        var refused = await Store.AddRevisionAsync(Guid.NewGuid(), Content(1));

        Assert.Equal(new RevisionWrite(RevisionWriteOutcome.StudyNotFound, null, 0), refused);
    }

    [Fact]
    public async Task GetStudyAsync_UnknownId_ReturnsNull()
    {
        await Store.CreateAsync(Corner(), Content(1));

        Assert.Null(await Store.GetStudyAsync(Guid.NewGuid()));
    }

    [Fact]
    public async Task GetRevisionAsync_UnknownNumber_ReturnsNull()
    {
        var created = await Store.CreateAsync(Corner(), Content(1));

        Assert.Null(await Store.GetRevisionAsync(created.Study.Id, 2));
        Assert.Null(await Store.GetRevisionAsync(Guid.NewGuid(), 1));
    }

    [Fact]
    public async Task ArchiveAsync_UnknownId_ReturnsFalse()
    {
        Assert.False(await Store.ArchiveAsync(Guid.NewGuid()));
    }

    [Fact]
    public async Task ArchiveAsync_Study_KeepsItReadableAndMarked()
    {
        var created = await Store.CreateAsync(Corner(), Content(1));

        Assert.True(await Store.ArchiveAsync(created.Study.Id));

        var read = await Store.GetStudyAsync(created.Study.Id);
        Assert.True(read!.Study.IsArchived);
        Assert.NotNull(await Store.GetRevisionAsync(created.Study.Id, 1));
    }

    [Fact]
    public async Task Schema_ChangeOrDeletionOfARevision_IsRefused()
    {
        var created = await Store.CreateAsync(Corner(), Content(1, "as made"));
        await using var raw = await OpenRawAsync(location);

        foreach (var sql in new[] { "UPDATE revisions SET note = 'rewritten'", "DELETE FROM revisions" })
        {
            await using var command = raw.CreateCommand();
            command.CommandText = sql;
            await Assert.ThrowsAnyAsync<DbException>(() => command.ExecuteNonQueryAsync());
        }
        Assert.Equal("as made", (await Store.GetRevisionAsync(created.Study.Id, 1))!.Content.Note);
    }

    [Fact]
    public async Task ListAsync_Text_MatchesTitleOrSiteIgnoringCase()
    {
        var byTitle = await Store.CreateAsync(Corner(title: "Exit of the MILLBROOK depot", site: "Depot Road"), Content(1));
        var bySite = await Store.CreateAsync(Corner(title: "School exit", site: "Millbrook Corner 3"), Content(1));
        await Store.CreateAsync(Corner(title: "Farm track", site: "Old Quarry Lane"), Content(1));

        var page = await Store.ListAsync(new StudyQuery(Text: "millbrook"));

        Assert.Equal(2, page.Total);
        Assert.Equal([bySite.Study.Id, byTitle.Study.Id], page.Items.Select(s => s.Id));
    }

    [Fact]
    public async Task ListAsync_Box_ReturnsOnlyStudiesWhoseExtentMeetsIt()
    {
        var ashford = await Store.CreateAsync(Corner(title: "Ashford", extent: AshfordLane), Content(1));
        await Store.CreateAsync(Corner(title: "Millbrook", extent: MillbrookCorner), Content(1));
        await Store.CreateAsync(Corner(title: "Local plan, no extent"), Content(1));

        // A box that overlaps only the north-east corner of Ashford Lane's extent.
        var page = await Store.ListAsync(new StudyQuery(Intersecting: new GeoBox(4.3505, 50.8503, 4.3600, 50.8600)));

        Assert.Equal(ashford.Study.Id, Assert.Single(page.Items).Id);
    }

    [Fact]
    public async Task ListAsync_BoxAndText_MustBothMatch()
    {
        await Store.CreateAsync(Corner(title: "Ashford", extent: AshfordLane), Content(1));
        var millbrook = await Store.CreateAsync(Corner(title: "Millbrook", extent: MillbrookCorner), Content(1));

        var page = await Store.ListAsync(new StudyQuery(Text: "mill", Intersecting: new GeoBox(4.0, 50.0, 5.0, 51.0)));

        Assert.Equal(millbrook.Study.Id, Assert.Single(page.Items).Id);
    }

    [Fact]
    public async Task ListAsync_Paging_GivesPagesMostRecentlyRevisedFirstWithTheTotal()
    {
        var ids = new List<Guid>();
        for (var i = 0; i < 5; i++) ids.Add((await Store.CreateAsync(Corner(title: $"Corner {i}"), Content(1))).Study.Id);
        await Store.AddRevisionAsync(ids[0], Content(2));
        Guid[] expected = [ids[0], ids[4], ids[3], ids[2], ids[1]];

        var first = await Store.ListAsync(new StudyQuery(Offset: 0, Limit: 2));
        var second = await Store.ListAsync(new StudyQuery(Offset: 2, Limit: 2));
        var last = await Store.ListAsync(new StudyQuery(Offset: 4, Limit: 2));

        Assert.All([first, second, last], page => Assert.Equal(5, page.Total));
        Assert.Equal(expected, first.Items.Concat(second.Items).Concat(last.Items).Select(s => s.Id));
    }

    [Fact]
    public async Task ListAsync_ArchivedStudies_AreLeftOutUnlessAskedFor()
    {
        var archived = await Store.CreateAsync(Corner(title: "Closed"), Content(1));
        var live = await Store.CreateAsync(Corner(title: "Open"), Content(1));
        await Store.ArchiveAsync(archived.Study.Id);

        Assert.Equal([live.Study.Id], (await Store.ListAsync(new StudyQuery())).Items.Select(s => s.Id));
        Assert.Equal(2, (await Store.ListAsync(new StudyQuery(IncludeArchived: true))).Total);
    }

    [Theory]
    [InlineData(0, 0)]
    [InlineData(StudyQuery.MaxLimit + 1, 0)]
    [InlineData(10, -1)]
    public async Task ListAsync_LimitOrOffsetOutOfRange_Throws(int limit, int offset)
    {
        await Assert.ThrowsAsync<ArgumentOutOfRangeException>(() => Store.ListAsync(new StudyQuery(Limit: limit, Offset: offset)));
    }

    [Fact]
    public async Task MigrateAsync_FreshDatabase_ReachesTheLatestVersion()
    {
        var store = Open(await NewLocationAsync(), new TestClock());

        Assert.Equal(store.LatestSchemaVersion, await store.MigrateAsync());
        Assert.Equal(store.LatestSchemaVersion, await store.MigrateAsync());
    }

    [Fact]
    public async Task MigrateAsync_VersionOneWithData_KeepsTheDataAndFillsTheNewColumn()
    {
        var at = await NewLocationAsync();
        var store = Open(at, new TestClock());
        Assert.Equal(1, await store.MigrateAsync(toVersion: 1));
        var id = Guid.CreateVersion7();
        await using (var raw = await OpenRawAsync(at))
        await using (var seed = raw.CreateCommand())
        {
            seed.CommandText = SeedVersionOneSql;
            var parameter = seed.CreateParameter();
            parameter.ParameterName = "id";
            parameter.Value = id;
            seed.Parameters.Add(parameter);
            await seed.ExecuteNonQueryAsync();
        }

        await store.MigrateAsync();

        var read = await store.GetStudyAsync(id);
        Assert.NotNull(read);
        Assert.Equal("Old corner", read.Study.Title);
        Assert.Equal(AshfordLane, read.Study.Extent);
        Assert.Equal(new DateTimeOffset(2025, 6, 1, 8, 0, 0, TimeSpan.Zero), read.Study.UpdatedAt);
        Assert.Equal(id, Assert.Single((await store.ListAsync(new StudyQuery(Intersecting: AshfordLane))).Items).Id);
        var revision = await store.GetRevisionAsync(id, 1);
        Assert.Equal(RequestHash.Of(revision!.Content.PlanJson, revision.Content.OptionsJson, revision.Content.MirrorJson), revision.ContentHash);
        Assert.Equal(2, (await store.AddRevisionAsync(id, Content(2))).Revision!.Number);
    }

    [Fact]
    public async Task MigrateAsync_SeveralMigratorsAtOnce_AllReachTheLatestVersion()
    {
        var at = await NewLocationAsync();
        var migrators = Enumerable.Range(0, 4).Select(_ => Open(at, new TestClock())).ToList();

        var versions = await Task.WhenAll(migrators.Select(m => Task.Run(() => m.MigrateAsync())));

        Assert.All(versions, v => Assert.Equal(migrators[0].LatestSchemaVersion, v));
    }

    [Fact]
    public async Task Writer_KilledMidBurst_KeepsEveryAcknowledgedRevisionWholeAndNoHalfWrittenOne()
    {
        var at = await NewLocationAsync();
        var acknowledged = new Dictionary<int, int>(); // revision number -> write number
        Guid studyId;
        using (var writer = WriterProcess.Start(BackendName, at))
        {
            studyId = Guid.Parse((await writer.ReadLineAsync())!.Split(' ')[1]);
            while (acknowledged.Count < 60) Acknowledge(acknowledged, await writer.ReadLineAsync());
            writer.Kill();
            // Lines already printed were printed after their commit: they count as acknowledged too.
            while (await writer.ReadLineAsync() is { } line) Acknowledge(acknowledged, line);
        }

        var store = Open(at, new TestClock());
        await store.MigrateAsync();
        var study = await store.GetStudyAsync(studyId);
        Assert.NotNull(study);
        Assert.Equal(Enumerable.Range(1, study.Study.LatestRevision), study.Revisions.Select(r => r.Number));
        foreach (var (number, write) in acknowledged)
            Assert.Equal($"write {write}", (await store.GetRevisionAsync(studyId, number))!.Content.Note);
        foreach (var summary in study.Revisions)
        {
            var revision = (await store.GetRevisionAsync(studyId, summary.Number))!;
            Assert.Equal(RequestHash.Of(revision.Content.PlanJson, revision.Content.OptionsJson, revision.Content.MirrorJson), revision.ContentHash);
        }
    }

    static void Acknowledge(Dictionary<int, int> acknowledged, string? line)
    {
        Assert.NotNull(line);
        var parts = line.Split(' ');
        Assert.Equal("ack", parts[0]);
        acknowledged.Add(int.Parse(parts[1], System.Globalization.CultureInfo.InvariantCulture), int.Parse(parts[2], System.Globalization.CultureInfo.InvariantCulture));
    }
}
