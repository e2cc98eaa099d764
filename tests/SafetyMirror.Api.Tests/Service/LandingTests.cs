using System.Net;

namespace SafetyMirror.Api.Tests.Service;

[Collection(ApiCollection.Name)]
public sealed class LandingTests(ApiFactory api)
{
    [Fact]
    public async Task Root_IsAnHtmlPage()
    {
        var response = await api.GetAsync("/");

        Assert.Equal(HttpStatusCode.OK, response.StatusCode);
        Assert.Equal("text/html", response.Content.Headers.ContentType?.MediaType);
        Assert.StartsWith("<!DOCTYPE html>", await response.Content.ReadAsStringAsync(), StringComparison.Ordinal);
    }

    [Fact]
    public async Task Root_LinksSwaggerUiAndTheOpenApiDocument()
    {
        var html = await Page();

        Assert.Contains("href=\"/swagger\"", html, StringComparison.Ordinal);
        Assert.Contains("href=\"/swagger/v1/swagger.json\"", html, StringComparison.Ordinal);
    }

    [Fact]
    public async Task Root_FetchesNothingFromElsewhere()
    {
        Assert.DoesNotMatch("(src|href)=\"(https?:)?//", await Page());
    }

    [Fact]
    public async Task Root_SaysItIsDecisionSupportUnderLocalRules()
    {
        var html = await Page();

        Assert.Contains("decision support only", html, StringComparison.Ordinal);
        Assert.Contains("local rules", html, StringComparison.Ordinal);
    }

    private async Task<string> Page() => await (await api.GetAsync("/")).Content.ReadAsStringAsync();
}
