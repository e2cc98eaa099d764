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

    [Fact]
    public async Task WrongMethod_Gets405ProblemDetailsNamingTheAllowedOne()
    {
        var response = await api.GetAsync("/v1/evaluations");

        // 405 Method Not Allowed with an Allow header: RFC 9110, 15.5.6.
        await response.AssertProblemAsync(HttpStatusCode.MethodNotAllowed);
        Assert.Equal(["POST"], response.Content.Headers.Allow);
    }

    [Fact]
    public async Task WrongMethod_AnswerNamesNoInternals()
    {
        var response = await api.GetAsync("/v1/recommendations");

        var body = await response.Content.ReadAsStringAsync();
        Assert.DoesNotContain("Exception", body, StringComparison.Ordinal);
        Assert.DoesNotContain("SafetyMirror.", body, StringComparison.Ordinal);
        Assert.DoesNotContain("/src/", body, StringComparison.Ordinal);
    }
}
