using Microsoft.OpenApi;

namespace SafetyMirror.Api.Tests.OpenApi;

[Collection(ApiCollection.Name)]
public sealed class OpenApiDocumentTests(ApiFactory api)
{
    private const string DocumentUrl = "/swagger/v1/swagger.json";

    [Fact]
    public async Task SwaggerJson_IsAValidOpenApi31Document()
    {
        var json = await Served();

        var (document, diagnostic) = OpenApiDocument.Parse(json, "json");

        Assert.NotNull(document);
        Assert.Empty(diagnostic!.Errors);
        Assert.Equal(OpenApiSpecVersion.OpenApi3_1, diagnostic.SpecificationVersion);
    }

    [Fact]
    public async Task SwaggerJson_EqualsTheCommittedDocument()
    {
        var served = await Served();
        var committedPath = CommittedDocument.Path;
        if (Environment.GetEnvironmentVariable("UPDATE_OPENAPI") == "1")
        {
            Directory.CreateDirectory(System.IO.Path.GetDirectoryName(committedPath)!);
            await File.WriteAllTextAsync(committedPath, served);
        }

        var committed = File.Exists(committedPath) ? CommittedDocument.Normalise(await File.ReadAllTextAsync(committedPath)) : null;

        var mismatch = committed is null
            ? $"{committedPath} is missing."
            : $"openapi/openapi.json differs from the served {DocumentUrl} {CommittedDocument.FirstDifference(committed, served)}.";
        Assert.True(
            committed == served,
            mismatch + " If the change to the API is intended, regenerate the file with "
            + "`UPDATE_OPENAPI=1 dotnet test tests/SafetyMirror.Api.Tests --filter SwaggerJson_EqualsTheCommittedDocument`, "
            + "then review and commit the diff.");
    }

    [Fact]
    public async Task SwaggerJson_InfoCarriesTheCautions()
    {
        var (document, _) = OpenApiDocument.Parse(await Served(), "json");

        var description = document!.Info.Description ?? string.Empty;

        Assert.Contains("farther away and slower", description, StringComparison.Ordinal);
        Assert.Contains("local rules", description, StringComparison.Ordinal);
    }

    private async Task<string> Served()
    {
        var response = await api.GetAsync(DocumentUrl);
        return CommittedDocument.Normalise(await response.EnsureSuccessStatusCode().Content.ReadAsStringAsync());
    }
}
