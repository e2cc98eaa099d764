using System.Collections.Concurrent;
using System.Diagnostics;
using System.Net;
using System.Net.Http.Headers;
using System.Text.Json;
using CsCheck;
using Microsoft.AspNetCore.Hosting;
using Microsoft.AspNetCore.Mvc.Testing;
using Xunit.Abstractions;

namespace SafetyMirror.Api.Tests.Requests;

/// <summary>Thousands of hostile and broken requests through the real pipeline: each gets a 2xx or a 4xx problem naming a field, never a 5xx or a hang.</summary>
[Collection(ApiCollection.Name)]
public sealed class HostileRequestTests(ApiFactory api, ITestOutputHelper output)
{
    // Fixed, so that every run sends the same requests and a failure names the one to replay.
    private const ulong Seed = 20_251_202;
    private const int Requests = 10_000;

    // A hang check, not a speed target: a request held this long has no bound on its work.
    private static readonly TimeSpan Bound = TimeSpan.FromSeconds(2);

    [Fact]
    public async Task Post_HostileRequests_AreAnswered2xxOr4xxProblemNamingAField()
    {
        var pcg = new PCG(1, Seed);
        var requests = Enumerable.Range(0, Requests).Select(i => HostileRequests.Any.Generate(pcg, null, out var size)).ToList();
        // The rate limit is the limiter's test, not this one's: every request here comes from one in-process client.
        using var host = api.WithWebHostBuilder(builder => builder.UseSetting("Limits:PermitLimit", $"{10 * Requests}").UseSetting("Limits:CostlyPermitLimit", $"{10 * Requests}"));
        using var client = host.CreateClient();
        var failures = new ConcurrentBag<string>();
        var statuses = new ConcurrentDictionary<int, int>();
        var slowest = new ConcurrentBag<(TimeSpan Elapsed, int Index)>();
        var clock = Stopwatch.StartNew();

        await Parallel.ForEachAsync(requests.Select((request, index) => (request, index)), new ParallelOptions { MaxDegreeOfParallelism = 2 }, async (item, cancel) =>
        {
            var (status, elapsed, failure) = await SendAsync(client, item.request, cancel);
            slowest.Add((elapsed, item.index));
            statuses.AddOrUpdate(status, 1, (_, n) => n + 1);
            if (failure is not null)
            {
                failures.Add($"#{item.index} {item.request}: {failure}");
            }
        });

        var (longest, index) = slowest.Max();
        output.WriteLine($"{Requests} requests in {clock.Elapsed.TotalSeconds:0.0} s; statuses: {string.Join(", ", statuses.OrderBy(s => s.Key).Select(s => $"{s.Key} × {s.Value}"))}; "
            + $"slowest {longest.TotalSeconds:0.00} s (#{index} {requests[index]})");
        Assert.True(failures.IsEmpty, $"{failures.Count} of {Requests} answers broke the rules:\n{string.Join('\n', failures.Take(20))}");
    }

    /// <summary>The status, the time taken, and what is wrong with the answer (null when it keeps the rules).</summary>
    private static async Task<(int Status, TimeSpan Elapsed, string? Failure)> SendAsync(HttpClient client, HostileRequest request, CancellationToken cancel)
    {
        using var message = new HttpRequestMessage(HttpMethod.Post, request.Route) { Content = new ByteArrayContent(request.Body) };
        message.Content.Headers.ContentType = new MediaTypeHeaderValue("application/json");
        message.Headers.Accept.ParseAdd(request.Accept);
        var clock = Stopwatch.StartNew();
        using var response = await client.SendAsync(message, cancel);
        var text = await response.Content.ReadAsStringAsync(cancel);
        var elapsed = clock.Elapsed;
        var status = (int)response.StatusCode;
        return (status, elapsed, Judge(response, status, text) ?? (elapsed > Bound ? $"took {elapsed.TotalSeconds:0.0} s" : null));
    }

    private static string? Judge(HttpResponseMessage response, int status, string text)
    {
        if (status is >= 200 and < 300)
        {
            return null;
        }

        if (status is < 400 or >= 500)
        {
            return $"status {status}: {Clip(text)}";
        }

        if (response.Content.Headers.ContentType?.MediaType != "application/problem+json")
        {
            return $"status {status} as {response.Content.Headers.ContentType}: {Clip(text)}";
        }

        if (text.Contains("System.", StringComparison.Ordinal) || text.Contains("SafetyMirror.", StringComparison.Ordinal))
        {
            return $"names a .NET type: {Clip(text)}";
        }

        // An answer must be readable text: a lone surrogate echoed back (as \ud800) fails here.
        try
        {
            return JudgeProblem(status, text);
        }
        catch (InvalidOperationException)
        {
            return $"problem holding text that is not valid Unicode: {Clip(text)}";
        }
    }

    private static string? JudgeProblem(int status, string text)
    {
        using var problem = JsonDocument.Parse(text);
        var root = problem.RootElement;
        if (!root.TryGetProperty("title", out var title) || string.IsNullOrWhiteSpace(title.GetString()))
        {
            return $"problem without a title: {Clip(text)}";
        }

        if (status != (int)HttpStatusCode.BadRequest)
        {
            return null;
        }

        // A 400 names the field: every key is a request path in the readers' style, never the serializer's "$…".
        if (!root.TryGetProperty("errors", out var errors) || !errors.EnumerateObject().Any())
        {
            return $"400 naming no field: {Clip(text)}";
        }

        var misnamed = errors.EnumerateObject().Select(e => e.Name).FirstOrDefault(name => name.Length == 0 || name.StartsWith('$'));
        return misnamed is null ? null : $"400 with a field path \"{misnamed}\" not in the readers' style: {Clip(text)}";
    }

    private static string Clip(string text) => text.Length <= 400 ? text : text[..400] + "…";
}
