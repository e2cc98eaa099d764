using System.Net;
using System.Text;
using SafetyMirror.Api.Access;
using SafetyMirror.Api.Tests.Features.Recommendations;

namespace SafetyMirror.Api.Tests.Access;

// Production: every write and costly request needs a key. 401 Unauthorized with WWW-Authenticate: RFC 9110, 15.5.2 and 11.6.1.
public sealed class ApiKeyTests : IDisposable
{
    private readonly ConfiguredApi api = new(ConfiguredApi.Production);

    public void Dispose() => api.Dispose();

    [Fact]
    public async Task Recommendation_WithoutKeyInProduction_Gets401Problem()
    {
        using var response = await api.SendAsync(HttpMethod.Post, Recommendations.Route, Recommendations.Demo());

        var problem = await response.AssertProblemAsync(HttpStatusCode.Unauthorized);
        Assert.Contains("X-Api-Key", problem.GetProperty("detail").GetString(), StringComparison.Ordinal);
        Assert.Equal("ApiKey", response.Headers.WwwAuthenticate.Single().Scheme);
    }

    [Fact]
    public async Task Report_WithoutKeyInProductionAskingForPdf_Gets401Problem()
    {
        using var response = await api.SendAsync(HttpMethod.Post, "/v1/reports", DemoCorners.Report(), ("Accept", "application/pdf"));

        await response.AssertProblemAsync(HttpStatusCode.Unauthorized);
    }

    [Fact]
    public async Task Recommendation_WithWrongKey_Gets401Problem()
    {
        var issued = await api.IssueKeyAsync("Elmbridge roads office");
        var wrong = issued[..^4] + (issued.EndsWith("0000", StringComparison.Ordinal) ? "1111" : "0000");

        using var response = await api.SendAsync(HttpMethod.Post, Recommendations.Route, Recommendations.Demo(), (ApiKeyAuthenticationHandler.Header, wrong));

        var problem = await response.AssertProblemAsync(HttpStatusCode.Unauthorized);
        Assert.Equal("The API key is not valid.", problem.GetProperty("title").GetString());
    }

    [Fact]
    public async Task Recommendation_WithIssuedKey_Answers200()
    {
        var key = await api.IssueKeyAsync("Elmbridge roads office");

        using var response = await api.SendAsync(HttpMethod.Post, Recommendations.Route, Recommendations.Demo(), (ApiKeyAuthenticationHandler.Header, key));

        Assert.Equal(HttpStatusCode.OK, response.StatusCode);
    }

    [Fact]
    public async Task Caller_WithKeyInAuthorizationHeader_NamesTheKeysOwner()
    {
        var key = await api.IssueKeyAsync("Elmbridge roads office");

        using var response = await api.SendAsync(HttpMethod.Get, "/v1/caller", headers: ("Authorization", $"ApiKey {key}"));

        Assert.Equal(HttpStatusCode.OK, response.StatusCode);
        Assert.Contains("\"owner\":\"Elmbridge roads office\"", await response.Content.ReadAsStringAsync(), StringComparison.Ordinal);
    }

    [Fact]
    public async Task Caller_WithAnotherOwnersKey_NamesThatOwner()
    {
        await api.IssueKeyAsync("Elmbridge roads office");
        var other = await api.IssueKeyAsync("Fernhill parish council");

        using var response = await api.SendAsync(HttpMethod.Get, "/v1/caller", headers: (ApiKeyAuthenticationHandler.Header, other));

        Assert.Contains("\"owner\":\"Fernhill parish council\"", await response.Content.ReadAsStringAsync(), StringComparison.Ordinal);
    }

    [Fact]
    public async Task Evaluation_WithoutKeyInProduction_AnswersWhenEvaluationsAreOpen()
    {
        using var response = await api.SendAsync(HttpMethod.Post, "/v1/evaluations", DemoCorners.Local());

        Assert.Equal(HttpStatusCode.OK, response.StatusCode);
    }

    [Fact]
    public async Task Evaluation_WithoutKeyWhenEvaluationsAreClosed_Gets401Problem()
    {
        using var closed = new ConfiguredApi(ConfiguredApi.Production, ("Access:OpenEvaluations", "false"));

        using var response = await closed.SendAsync(HttpMethod.Post, "/v1/evaluations", DemoCorners.Local());

        await response.AssertProblemAsync(HttpStatusCode.Unauthorized);
    }

    [Fact]
    public async Task KeyStore_KeepsNeitherTheKeyNorItsSecret()
    {
        var key = await api.IssueKeyAsync("Elmbridge roads office");
        Microsoft.Data.Sqlite.SqliteConnection.ClearAllPools();

        var stored = Encoding.ASCII.GetString(await File.ReadAllBytesAsync(api.KeyStorePath));

        var secret = key[(key.LastIndexOf('_') + 1)..];
        Assert.DoesNotContain(secret, stored, StringComparison.OrdinalIgnoreCase);
        Assert.DoesNotContain(secret[..16], stored, StringComparison.OrdinalIgnoreCase);
        Assert.Contains("Elmbridge roads office", stored, StringComparison.Ordinal);
    }

    [Fact]
    public async Task CreateKey_WithoutOwner_ExitsWithUsage()
    {
        using var errors = new StringWriter();

        var exitCode = await CreateKeyCommand.RunAsync([CreateKeyCommand.Name], api.Services, TextWriter.Null, errors);

        Assert.Equal(2, exitCode);
        Assert.Contains("--owner", errors.ToString(), StringComparison.Ordinal);
    }
}
