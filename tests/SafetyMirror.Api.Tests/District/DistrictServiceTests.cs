using System.Collections.Concurrent;
using System.Net;
using System.Text.Json;
using SafetyMirror.District;

namespace SafetyMirror.Api.Tests.District;

// Every corner of a generated district, posted alone to the real service, is read as the generator meant: a well-formed corner
// is answered, a flawed one refused naming the feature that carries the flaw. Samples keep the run short: a recommendation
// costs a few hundred milliseconds.
[Collection(ApiCollection.Name)]
public sealed class DistrictServiceTests(ApiFactory api)
{
    // Forty corners with mirrors, six of them flawed (one of each kind); twenty without, six flawed.
    private static readonly DistrictOptions WithMirrors = new() { Corners = 40, Seed = 7, MirrorShare = 1, MalformedShare = 0.15 };
    private static readonly DistrictOptions WithoutMirrors = new() { Corners = 20, Seed = 7, MirrorShare = 0, MalformedShare = 0.3 };

    private static readonly ConcurrentDictionary<DistrictOptions, Lazy<Task<List<CornerAnswer>>>> Answers = new();

    [Fact]
    public async Task Evaluations_WellFormedCorners_Answer200()
    {
        var answers = await AnswersAsync(WithMirrors);

        Assert.All(answers.Where(a => a.Corner.Flaw is null), a => Assert.True(a.Status == HttpStatusCode.OK, $"{a.Corner.Id}: {a.Text}"));
    }

    [Fact]
    public async Task Evaluations_FlawedCorners_Answer400NamingTheFlawedFeature()
    {
        var answers = await AnswersAsync(WithMirrors);

        AssertFlawsNamed(answers);
    }

    [Fact]
    public async Task Evaluations_FortyCorners_ReachThreeDecisionsOrMore()
    {
        var answers = await AnswersAsync(WithMirrors);

        var decisions = answers.Where(a => a.Status == HttpStatusCode.OK).Select(a => a.Answer.GetProperty("decision").GetString()).Distinct();
        Assert.True(decisions.Count() >= 3, string.Join(", ", decisions));
    }

    [Fact]
    public async Task Recommendations_WellFormedCorners_Answer200()
    {
        var answers = await AnswersAsync(WithoutMirrors);

        Assert.All(answers.Where(a => a.Corner.Flaw is null), a => Assert.True(a.Status == HttpStatusCode.OK, $"{a.Corner.Id}: {a.Text}"));
        Assert.All(answers.Where(a => a.Corner.Flaw is null), a => Assert.Equal("/v1/recommendations", a.Route));
    }

    [Fact]
    public async Task Recommendations_FlawedCorners_Answer400NamingTheFlawedFeature()
    {
        var answers = await AnswersAsync(WithoutMirrors);

        AssertFlawsNamed(answers);
    }

    [Fact]
    public async Task Recommendations_TwentyCorners_ReachThreeOutcomesOrMore()
    {
        var answers = await AnswersAsync(WithoutMirrors);

        var outcomes = answers.Where(a => a.Status == HttpStatusCode.OK).Select(a => a.Answer.GetProperty("outcome").GetString()).Distinct();
        Assert.True(outcomes.Count() >= 3, string.Join(", ", outcomes));
    }

    // The flaw's feature by its position in the corner's plan, as the service names it; a missing eye is the plan's features.
    private static void AssertFlawsNamed(List<CornerAnswer> answers)
    {
        var flawed = answers.Where(a => a.Corner.Flaw is not null).ToList();
        Assert.Equal(Enum.GetValues<CornerFlawKind>().Length, flawed.Count);
        foreach (var (corner, route, body, status, text, answer) in flawed)
        {
            Assert.True(status == HttpStatusCode.BadRequest, $"{corner.Id} ({corner.Flaw}): {(int)status} {text}");
            var named = answer.GetProperty("errors").EnumerateObject().Select(e => e.Name).ToList();
            var features = body["plan"]!["features"]!.AsArray().Select(f => (string?)f!["id"]).ToList();
            var expected = corner.Flaw! switch
            {
                { Kind: CornerFlawKind.MirrorRadiusOutOfRange } => "mirror.radiusM",
                { FeatureId: null } => "plan.features",
                { FeatureId: var id } => $"plan.features[{features.IndexOf(id)}]",
            };
            Assert.True(named.Any(path => path.StartsWith(expected, StringComparison.Ordinal)), $"{corner.Id} ({corner.Flaw}) expected {expected}, named {string.Join(", ", named)}");
        }
    }

    // Each district is posted once, corner by corner, and its answers shared by the tests that read them.
    private Task<List<CornerAnswer>> AnswersAsync(DistrictOptions options) =>
        Answers.GetOrAdd(options, o => new Lazy<Task<List<CornerAnswer>>>(() => PostEveryCornerAsync(o))).Value;

    private async Task<List<CornerAnswer>> PostEveryCornerAsync(DistrictOptions options)
    {
        var district = DistrictGenerator.Generate(options);
        var answers = new List<CornerAnswer>();
        foreach (var request in DistrictRequests.FromCollection(DistrictWriter.ToCollection(district)))
        {
            using var response = await api.PostJsonAsync(request.Route, request.Body.ToJsonString());
            var text = await response.Content.ReadAsStringAsync();
            using var answer = JsonDocument.Parse(text);
            answers.Add(new(district.Corners.Single(c => c.Id == request.CornerId), request.Route, request.Body, response.StatusCode, text, answer.RootElement.Clone()));
        }

        return answers;
    }

    private sealed record CornerAnswer(DistrictCorner Corner, string Route, System.Text.Json.Nodes.JsonObject Body, HttpStatusCode Status, string Text, JsonElement Answer);
}
