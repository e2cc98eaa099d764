using System.Net;
using Microsoft.AspNetCore.Mvc.Testing;

namespace SafetyMirror.Api.Tests.Access;

// Development (what `dotnet run` starts): callers on the machine itself need no key, so README's two commands do the whole job.
public sealed class LocalCallerTests
{
    [Fact]
    public async Task Caller_OnLoopbackInDevelopmentWithoutKey_IsTheLocalOwner()
    {
        using var api = new ConfiguredApi(ConfiguredApi.Development);
        api.UseKestrel(0);
        api.StartServer();

        using var response = await api.SendAsync(HttpMethod.Get, "/v1/caller");

        Assert.Equal(HttpStatusCode.OK, response.StatusCode);
        Assert.Contains("\"owner\":\"local\"", await response.Content.ReadAsStringAsync(), StringComparison.Ordinal);
    }

    [Fact]
    public async Task Caller_OnLoopbackInProductionWithoutKey_Gets401Problem()
    {
        using var api = new ConfiguredApi(ConfiguredApi.Production);
        api.UseKestrel(0);
        api.StartServer();

        using var response = await api.SendAsync(HttpMethod.Get, "/v1/caller");

        await response.AssertProblemAsync(HttpStatusCode.Unauthorized);
    }
}
