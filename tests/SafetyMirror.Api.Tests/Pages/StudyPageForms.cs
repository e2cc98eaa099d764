using System.Globalization;
using System.Net;
using System.Text;
using System.Text.Json.Nodes;
using System.Text.RegularExpressions;

namespace SafetyMirror.Api.Tests.Pages;

/// <summary>Fills and sends the study pages' forms as a browser does: the antiforgery token from the page, the cookie kept by the client.</summary>
internal static partial class StudyPageForms
{
    /// <summary>The demo mirror's fields as the form names them (demo-corner-local.json's mirror).</summary>
    public static IReadOnlyDictionary<string, string> DemoMirror(JsonObject demo)
    {
        var mirror = demo["mirror"]!;
        var location = mirror["location"]!["coordinates"]!;
        return new Dictionary<string, string>
        {
            ["mirror.location.x"] = Text(location[0]),
            ["mirror.location.y"] = Text(location[1]),
            ["mirror.centreHeightM"] = Text(mirror["centreHeightM"]),
            ["mirror.azimuthDeg"] = Text(mirror["azimuthDeg"]),
            ["mirror.tiltDownDeg"] = Text(mirror["tiltDownDeg"]),
            ["mirror.radiusM"] = Text(mirror["radiusM"]),
            ["mirror.diameterM"] = Text(mirror["diameterM"]),
        };
    }

    /// <summary>Opens the page holding a form, then posts the form to the action with the fields and the plan file.</summary>
    public static async Task<HttpResponseMessage> PostAsync(HttpClient client, string formPage, string action, IReadOnlyDictionary<string, string> fields, JsonNode? plan)
    {
        var page = await client.GetStringAsync(new Uri(formPage, UriKind.Relative));
        var token = TokenField().Match(page);
        Assert.True(token.Success, "The form carries no antiforgery token.");

        using var form = new MultipartFormDataContent();
        form.Add(new StringContent(WebUtility.HtmlDecode(token.Groups["value"].Value)), WebUtility.HtmlDecode(token.Groups["name"].Value));
        foreach (var (name, value) in fields)
        {
            form.Add(new StringContent(value), name);
        }

        if (plan is not null)
        {
            var file = new ByteArrayContent(Encoding.UTF8.GetBytes(plan.ToJsonString()));
            file.Headers.ContentType = new("application/geo+json");
            form.Add(file, "plan", "corner.geojson");
        }

        return await client.PostAsync(new Uri(action, UriKind.Relative), form);
    }

    private static string Text(JsonNode? value) => value!.GetValue<double>().ToString(CultureInfo.InvariantCulture);

    [GeneratedRegex("<input type=\"hidden\" name=\"(?<name>[^\"]+)\" value=\"(?<value>[^\"]+)\">")]
    private static partial Regex TokenField();
}
