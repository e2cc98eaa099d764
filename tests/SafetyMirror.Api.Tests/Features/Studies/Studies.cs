using System.Net;
using System.Text.Json;
using System.Text.Json.Nodes;
using SafetyMirror.Api.Tests.Access;

namespace SafetyMirror.Api.Tests.Features.Studies;

/// <summary>Creates and fetches studies through the host's real HTTP pipeline.</summary>
internal static class Studies
{
    /// <summary>The collection route.</summary>
    public const string Route = "/v1/studies";

    /// <summary>A study request: the demo corner drawn in local metres, with its mirror, an invented title and site.</summary>
    public static JsonObject LocalDemo(string title = "Birchwell Lane at Quarry Row")
    {
        var body = DemoCorners.Local();
        body["title"] = title;
        body["site"] = "Birchwell Lane / Quarry Row, north-east corner";
        body["note"] = "Drawn from the site sketch";
        return body;
    }

    /// <summary>The same corner in WGS84, with an invented title and site.</summary>
    public static JsonObject Wgs84Demo()
    {
        var body = DemoCorners.Wgs84();
        body["title"] = "Hollin Street at Tanner's Yard";
        body["site"] = "Hollin Street / Tanner's Yard";
        return body;
    }

    /// <summary>A revision request: the study's plan and options with the mirror turned by a degree.</summary>
    public static JsonObject Revision(string note = "Aim corrected after the site visit", int? basedOn = null)
    {
        var body = DemoCorners.Local();
        body["mirror"]!["azimuthDeg"] = 232;
        body["note"] = note;
        if (basedOn is { } number)
        {
            body["basedOn"] = number;
        }

        return body;
    }

    /// <summary>Creates a study that must be answered 201, and returns the answer.</summary>
    public static async Task<JsonElement> CreateAsync(this ConfiguredApi api, JsonObject body, params (string Name, string Value)[] headers)
    {
        using var response = await api.SendAsync(HttpMethod.Post, Route, body, headers);
        return await ExpectAsync(response, HttpStatusCode.Created);
    }

    /// <summary>A GET that must be answered 200 with JSON.</summary>
    public static async Task<JsonElement> GetJsonAsync(this ConfiguredApi api, string path, params (string Name, string Value)[] headers)
    {
        using var response = await api.SendAsync(HttpMethod.Get, path, headers: headers);
        return await ExpectAsync(response, HttpStatusCode.OK);
    }

    /// <summary>Asserts the status code and returns the JSON body.</summary>
    public static async Task<JsonElement> ExpectAsync(HttpResponseMessage response, HttpStatusCode expected)
    {
        var text = await response.Content.ReadAsStringAsync();
        Assert.True(response.StatusCode == expected, $"Expected {(int)expected}, got {(int)response.StatusCode}: {text}");
        using var document = JsonDocument.Parse(text);
        return document.RootElement.Clone();
    }

    /// <summary>The id of a study answer.</summary>
    public static string Id(this JsonElement study) => study.GetProperty("id").GetString()!;
}
