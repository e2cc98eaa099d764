using System.Net;

namespace SafetyMirror.Api.Tests.Errors;

[Collection(ApiCollection.Name)]
public sealed class ProblemResponsesTests(ApiFactory api)
{
    [Fact]
    public async Task UnknownPath_Gets404ProblemDetails()
    {
        var response = await api.GetAsync("/no-such-page");

        // 404 Not Found: RFC 9110, 15.5.5.
        await response.AssertProblemAsync(HttpStatusCode.NotFound);
    }
}
