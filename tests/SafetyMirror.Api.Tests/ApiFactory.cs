using Microsoft.AspNetCore.Mvc.Testing;

namespace SafetyMirror.Api.Tests;

/// <summary>The one in-memory host that every API test talks to through the real HTTP pipeline.</summary>
public sealed class ApiFactory : WebApplicationFactory<Program>
{
    /// <summary>Sends GET for a path of the service.</summary>
    public async Task<HttpResponseMessage> GetAsync(string path)
    {
        using var client = CreateClient();
        return await client.GetAsync(new Uri(path, UriKind.Relative));
    }

    /// <summary>Sends POST with the given body to a path of the service.</summary>
    public async Task<HttpResponseMessage> PostAsync(string path, HttpContent body)
    {
        using var client = CreateClient();
        return await client.PostAsync(new Uri(path, UriKind.Relative), body);
    }
}

/// <summary>Shares one <see cref="ApiFactory"/> across the test classes that join the collection.</summary>
[CollectionDefinition(Name)]
public sealed class ApiCollection : ICollectionFixture<ApiFactory>
{
    /// <summary>The collection's name.</summary>
    public const string Name = "api";
}
