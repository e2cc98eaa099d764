using System.Net;
using System.Text.Json;
using SafetyMirror.Api.Tests.Access;

namespace SafetyMirror.Api.Tests.OpenApi;

// Production serves neither the document nor Swagger UI unless configured to; the document names the key scheme.
[Collection(ApiCollection.Name)]
public sealed class OpenApiExposureTests(ApiFactory api)
{
    [Theory]
    [InlineData("/swagger")]
    [InlineData("/swagger/index.html")]
    [InlineData("/swagger/v1/swagger.json")]
    public async Task SwaggerInProduction_IsNotServed(string path)
    {
        using var production = new ConfiguredApi(ConfiguredApi.Production);

        using var response = await production.SendAsync(HttpMethod.Get, path);

        Assert.Equal(HttpStatusCode.NotFound, response.StatusCode);
    }

    [Fact]
    public async Task SwaggerInProduction_IsServedWhenConfigured()
    {
        using var production = new ConfiguredApi(ConfiguredApi.Production, ("Posture:ServeOpenApi", "true"));

        using var response = await production.SendAsync(HttpMethod.Get, "/swagger/v1/swagger.json");

        Assert.Equal(HttpStatusCode.OK, response.StatusCode);
    }

    [Fact]
    public async Task Document_DescribesTheApiKeyInItsHeader()
    {
        using var document = await Document();

        var scheme = document.RootElement.GetProperty("components").GetProperty("securitySchemes").GetProperty("ApiKey");
        Assert.Equal("apiKey", scheme.GetProperty("type").GetString());
        Assert.Equal("header", scheme.GetProperty("in").GetString());
        Assert.Equal("X-Api-Key", scheme.GetProperty("name").GetString());
    }

    [Theory]
    [InlineData("/v1/recommendations", true)]
    [InlineData("/v1/reports", true)]
    [InlineData("/v1/evaluations", false)]
    public async Task Operation_RequiresTheKeyWhereTheServiceDoes(string path, bool required)
    {
        using var document = await Document();

        var post = document.RootElement.GetProperty("paths").GetProperty(path).GetProperty("post");
        Assert.Equal(required, post.TryGetProperty("security", out _));
    }

    private async Task<JsonDocument> Document()
    {
        using var response = await api.GetAsync("/swagger/v1/swagger.json");
        return JsonDocument.Parse(await response.Content.ReadAsStringAsync());
    }
}
