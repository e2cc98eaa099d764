using System.Net;
using SafetyMirror.Api.Features.Studies;
using SafetyMirror.Api.Tests.Access;
using SafetyMirror.Studies.Tests.Storage;

namespace SafetyMirror.Api.Tests.Features.Studies;

// The same routes with the studies on PostgreSQL with PostGIS (SAFETYMIRROR_TEST_POSTGRES, set by .ci/run), each test in a schema of its own.
public sealed class StudyPostgresTests : IAsyncLifetime
{
    private string connectionString = string.Empty;
    private ConfiguredApi api = null!;

    public async Task InitializeAsync()
    {
        connectionString = await TestPostgres.CreateSchemaAsync();
        api = new ConfiguredApi(ConfiguredApi.Development, ($"{StudiesOptions.Section}:{nameof(StudiesOptions.PostgresConnectionString)}", connectionString));
    }

    public async Task DisposeAsync()
    {
        api?.Dispose();
        if (connectionString.Length > 0)
        {
            await TestPostgres.DropSchemaAsync(connectionString);
        }
    }

    [Fact]
    public async Task Revise_OnPostgres_StoresTwoRevisions()
    {
        var created = await api.CreateAsync(Studies.LocalDemo());

        using var response = await api.SendAsync(HttpMethod.Post, $"{Studies.Route}/{created.Id()}/revisions", Studies.Revision());

        Assert.Equal(HttpStatusCode.Created, response.StatusCode);
        var study = await api.GetJsonAsync($"{Studies.Route}/{created.Id()}");
        Assert.Equal(2, study.GetProperty("revisions").GetArrayLength());
    }

    [Fact]
    public async Task List_BboxOnPostgres_FindsTheWgs84Study()
    {
        await api.CreateAsync(Studies.LocalDemo());
        var placed = await api.CreateAsync(Studies.Wgs84Demo());

        // The demo plan lies near 9.93° E, 49.78° N (openapi/examples/demo-corner-wgs84.json).
        var around = await api.GetJsonAsync($"{Studies.Route}?bbox=9.92,49.77,9.94,49.79");

        Assert.Equal([placed.Id()], around.GetProperty("items").EnumerateArray().Select(s => s.Id()));
    }

    [Fact]
    public async Task Revise_TenInParallelOnPostgres_GetDistinctNumbers()
    {
        var created = await api.CreateAsync(Studies.LocalDemo());

        var numbers = await Task.WhenAll(Enumerable.Range(0, 10).Select(async i =>
        {
            using var response = await api.SendAsync(HttpMethod.Post, $"{Studies.Route}/{created.Id()}/revisions", Studies.Revision($"Parallel change {i}"));
            return (await Studies.ExpectAsync(response, HttpStatusCode.Created)).GetProperty("number").GetInt32();
        }));

        Assert.Equal(Enumerable.Range(2, 10), numbers.Order());
    }
}
