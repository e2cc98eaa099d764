using System.Net;
using SafetyMirror.Api.Access;
using SafetyMirror.Api.Tests.Access;

namespace SafetyMirror.Api.Tests.Features.Studies;

// Production: every study route needs a key, and a study is its creator's. 401 with WWW-Authenticate: RFC 9110, 15.5.2.
public sealed class StudyAccessTests : IDisposable
{
    private readonly ConfiguredApi api = new(ConfiguredApi.Production);

    public void Dispose() => api.Dispose();

    [Fact]
    public async Task Create_WithoutKeyInProduction_Gets401AndStoresNothing()
    {
        using var response = await api.SendAsync(HttpMethod.Post, Studies.Route, Studies.LocalDemo());

        await response.AssertProblemAsync(HttpStatusCode.Unauthorized);
        var key = await api.IssueKeyAsync("Elmbridge roads office");
        Assert.Equal(0, (await api.GetJsonAsync(Studies.Route, (ApiKeyAuthenticationHandler.Header, key))).GetProperty("total").GetInt32());
    }

    [Fact]
    public async Task Create_WithKey_RecordsTheKeysOwnerAsOwnerAndAuthor()
    {
        var key = await api.IssueKeyAsync("Elmbridge roads office");

        var study = await api.CreateAsync(Studies.LocalDemo(), (ApiKeyAuthenticationHandler.Header, key));

        Assert.Equal("Elmbridge roads office", study.GetProperty("owner").GetString());
        Assert.Equal("Elmbridge roads office", study.GetProperty("revisions")[0].GetProperty("author").GetString());
    }

    [Theory]
    [InlineData("GET", "")]
    [InlineData("GET", "/revisions/1")]
    [InlineData("POST", "/revisions/1/rerun")]
    [InlineData("POST", "/archive")]
    public async Task Study_OtherOwnersKey_Gets404Problem(string method, string path)
    {
        var owner = await api.IssueKeyAsync("Elmbridge roads office");
        var other = await api.IssueKeyAsync("Fenwick parish council");
        var study = await api.CreateAsync(Studies.LocalDemo(), (ApiKeyAuthenticationHandler.Header, owner));

        using var response = await api.SendAsync(new HttpMethod(method), $"{Studies.Route}/{study.Id()}{path}", headers: (ApiKeyAuthenticationHandler.Header, other));

        await response.AssertProblemAsync(HttpStatusCode.NotFound);
    }

    [Fact]
    public async Task Revise_OtherOwnersKey_Gets404AndStoresNothing()
    {
        var owner = await api.IssueKeyAsync("Elmbridge roads office");
        var other = await api.IssueKeyAsync("Fenwick parish council");
        var study = await api.CreateAsync(Studies.LocalDemo(), (ApiKeyAuthenticationHandler.Header, owner));

        using var response = await api.SendAsync(HttpMethod.Post, $"{Studies.Route}/{study.Id()}/revisions", Studies.Revision(), (ApiKeyAuthenticationHandler.Header, other));

        await response.AssertProblemAsync(HttpStatusCode.NotFound);
        var after = await api.GetJsonAsync($"{Studies.Route}/{study.Id()}", (ApiKeyAuthenticationHandler.Header, owner));
        Assert.Equal(1, after.GetProperty("latestRevision").GetInt32());
    }

    [Fact]
    public async Task List_OtherOwnersKey_ListsNoneOfTheOwnersStudies()
    {
        var owner = await api.IssueKeyAsync("Elmbridge roads office");
        var other = await api.IssueKeyAsync("Fenwick parish council");
        await api.CreateAsync(Studies.LocalDemo(), (ApiKeyAuthenticationHandler.Header, owner));

        var page = await api.GetJsonAsync(Studies.Route, (ApiKeyAuthenticationHandler.Header, other));

        Assert.Equal(0, page.GetProperty("total").GetInt32());
    }
}
