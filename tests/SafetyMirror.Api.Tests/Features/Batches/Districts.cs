using System.Net;
using System.Text;
using System.Text.Json;
using System.Text.Json.Nodes;
using SafetyMirror.Api.Tests.Access;

namespace SafetyMirror.Api.Tests.Features.Batches;

/// <summary>Small districts made of the invented demo corner, and the calls that post and follow them.</summary>
internal static class Districts
{
    public const string Route = "/v1/batches";

    // A guard against a hang, not a speed target.
    private static readonly TimeSpan FinishTimeout = TimeSpan.FromMinutes(3);

    /// <summary>A FeatureCollection of corners: each the demo corner, with its mirror as a 'mirror' feature when asked.</summary>
    public static JsonObject Collection(params (string Corner, bool WithMirror)[] corners)
    {
        var demo = DemoCorners.Local();
        var features = new JsonArray();
        foreach (var (corner, withMirror) in corners)
        {
            foreach (var feature in demo["plan"]!["features"]!.AsArray())
            {
                var copy = feature!.DeepClone().AsObject();
                copy["properties"]!["corner"] = corner;
                features.Add(copy);
            }

            if (withMirror)
            {
                features.Add(MirrorFeature(corner, demo["mirror"]!.AsObject()));
            }
        }

        return new JsonObject
        {
            ["type"] = "FeatureCollection",
            ["name"] = "Eastbrook test district",
            ["frame"] = demo["plan"]!["frame"]!.DeepClone(),
            ["features"] = features,
        };
    }

    /// <summary>The demo mirror as a batch's 'mirror' feature of a corner.</summary>
    public static JsonObject MirrorFeature(string corner, JsonObject mirror)
    {
        var properties = new JsonObject { ["corner"] = corner, ["role"] = "mirror" };
        foreach (var (key, value) in mirror.Where(m => m.Key != "location"))
        {
            properties[key] = value!.DeepClone();
        }

        return new JsonObject { ["type"] = "Feature", ["properties"] = properties, ["geometry"] = mirror["location"]!.DeepClone() };
    }

    /// <summary>The index in the collection of a corner's feature that has the given role.</summary>
    public static int IndexOf(JsonObject collection, string corner, string role) =>
        collection["features"]!.AsArray().Select((f, i) => (f, i))
            .First(x => (string?)x.f!["properties"]!["corner"] == corner && (string?)x.f!["properties"]!["role"] == role).i;

    /// <summary>Posts a batch body with a content type; the raw response.</summary>
    public static async Task<HttpResponseMessage> PostAsync(HttpClient client, string body, string contentType = "application/geo+json")
    {
        using var content = new StringContent(body, Encoding.UTF8);
        content.Headers.ContentType = new System.Net.Http.Headers.MediaTypeHeaderValue(contentType);
        return await client.PostAsync(new Uri(Route, UriKind.Relative), content);
    }

    /// <summary>Posts a batch that must be accepted, and returns its id.</summary>
    public static async Task<string> SubmitAsync(HttpClient client, string body, string contentType = "application/geo+json")
    {
        using var response = await PostAsync(client, body, contentType);
        var text = await response.Content.ReadAsStringAsync();
        Assert.True(response.StatusCode == HttpStatusCode.Accepted, $"Expected 202, got {(int)response.StatusCode}: {text}");
        using var batch = JsonDocument.Parse(text);
        var id = batch.RootElement.GetProperty("id").GetString()!;
        Assert.Equal($"{Route}/{id}", response.Headers.Location?.OriginalString);
        return id;
    }

    /// <summary>The batch as GET answers it.</summary>
    public static async Task<JsonElement> GetAsync(HttpClient client, string id, string query = "")
    {
        using var response = await client.GetAsync(new Uri($"{Route}/{id}{query}", UriKind.Relative));
        var text = await response.Content.ReadAsStringAsync();
        Assert.True(response.StatusCode == HttpStatusCode.OK, $"Expected 200, got {(int)response.StatusCode}: {text}");
        using var batch = JsonDocument.Parse(text);
        return batch.RootElement.Clone();
    }

    /// <summary>Polls the batch until no corner is left unrecorded, and returns it.</summary>
    public static async Task<JsonElement> WaitUntilFinishedAsync(HttpClient client, string id, string query = "")
    {
        var deadline = DateTime.UtcNow + FinishTimeout;
        while (true)
        {
            var batch = await GetAsync(client, id, query);
            if (batch.GetProperty("state").GetString() == "finished")
            {
                return batch;
            }

            Assert.True(DateTime.UtcNow < deadline, $"The batch did not finish within {FinishTimeout}: {batch.GetProperty("counts")}");
            await Task.Delay(200);
        }
    }

    /// <summary>A client of a configured host.</summary>
    public static HttpClient Client(ConfiguredApi api) => api.CreateClient();
}
