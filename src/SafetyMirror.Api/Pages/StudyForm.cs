using System.Globalization;
using System.Text;
using System.Text.Json;
using Microsoft.AspNetCore.Antiforgery;
using NetTopologySuite.Geometries;
using SafetyMirror.Api.Features.Recommendations;
using SafetyMirror.Api.Features.Studies;
using SafetyMirror.Api.Requests;
using static SafetyMirror.Api.Pages.PageHtml;

namespace SafetyMirror.Api.Pages;

/// <summary>What a study or revision form holds, as typed: kept to show the form again beside its problems.</summary>
/// <param name="Fields">Each text field by its name (the request path it fills, such as "mirror.azimuthDeg").</param>
/// <param name="Plan">The uploaded plan, when a file was sent and read as JSON.</param>
internal sealed record StudyForm(IReadOnlyDictionary<string, string> Fields, JsonElement? Plan)
{
    /// <summary>The mirror's fields: form name, label, hint.</summary>
    private static readonly (string Name, string Label, string Hint)[] MirrorFields =
    [
        ("mirror.location.x", "Location x (m or °)", "In the plan's coordinates."),
        ("mirror.location.y", "Location y (m or °)", "In the plan's coordinates."),
        ("mirror.centreHeightM", "Centre height (m)", "Above the road."),
        ("mirror.azimuthDeg", "Azimuth (°)", "Where the mirror faces, clockwise from north."),
        ("mirror.tiltDownDeg", "Tilt down (°)", string.Empty),
        ("mirror.radiusM", "Radius of curvature (m)", string.Empty),
        ("mirror.diameterM", "Diameter (m)", "Of a round mirror."),
    ];

    /// <summary>The sight-distance methods the form offers, with their labels.</summary>
    private static readonly (string Value, string Label)[] Methods =
    [
        ("stopping", "Stopping sight distance"),
        ("intersection", "Intersection sight distance"),
    ];

    private static readonly string[] TextFields = ["title", "site", "note", "options.sightDistance.method"];

    /// <summary>An empty form.</summary>
    public static StudyForm Empty { get; } = new(new Dictionary<string, string>(), null);

    /// <summary>A revision form filled with a stored request's mirror and method, so a change starts from what is stored.</summary>
    public static StudyForm From(StudyInput stored)
    {
        ArgumentNullException.ThrowIfNull(stored);
        var fields = new Dictionary<string, string> { ["options.sightDistance.method"] = stored.Options?.SightDistance?.Method ?? string.Empty };
        if (stored.Mirror is { } mirror)
        {
            fields["mirror.location.x"] = Text(mirror.Location?.X);
            fields["mirror.location.y"] = Text(mirror.Location?.Y);
            fields["mirror.centreHeightM"] = Text(mirror.CentreHeightM);
            fields["mirror.azimuthDeg"] = Text(mirror.AzimuthDeg);
            fields["mirror.tiltDownDeg"] = Text(mirror.TiltDownDeg);
            fields["mirror.radiusM"] = Text(mirror.RadiusM);
            fields["mirror.diameterM"] = Text(mirror.DiameterM);
        }

        return new StudyForm(fields, null);
    }

    /// <summary>Reads a posted form: the text fields as typed and the uploaded plan, recording a problem when the file is not JSON.</summary>
    public static async Task<StudyForm> ReadAsync(HttpRequest request, RequestErrors errors)
    {
        var form = await request.ReadFormAsync(request.HttpContext.RequestAborted);
        var fields = TextFields.Concat(MirrorFields.Select(f => f.Name))
            .ToDictionary(name => name, name => form[name].ToString().Trim());
        JsonElement? plan = null;
        if (form.Files.GetFile("plan") is { Length: > 0 } file)
        {
            try
            {
                await using var stream = file.OpenReadStream();
                using var document = await JsonDocument.ParseAsync(stream, cancellationToken: request.HttpContext.RequestAborted);
                plan = document.RootElement.Clone();
            }
            catch (JsonException e)
            {
                errors.Add("plan", $"The file {file.FileName} is not JSON ({e.Message}). Upload a GeoJSON FeatureCollection.");
            }
        }

        return new StudyForm(fields, plan);
    }

    /// <summary>The value typed in a field, or an empty string.</summary>
    public string this[string name] => Fields.TryGetValue(name, out var value) ? value : string.Empty;

    /// <summary>The mirror the form describes, or null when every mirror field is empty (then the service recommends one).</summary>
    public MirrorRequest? Mirror(RequestErrors errors)
    {
        if (MirrorFields.All(f => this[f.Name].Length == 0))
        {
            return null;
        }

        var x = Number("mirror.location.x", errors);
        var y = Number("mirror.location.y", errors);
        return new MirrorRequest
        {
            Location = x is { } east && y is { } north ? new Point(east, north) : null,
            CentreHeightM = Number("mirror.centreHeightM", errors),
            AzimuthDeg = Number("mirror.azimuthDeg", errors),
            TiltDownDeg = Number("mirror.tiltDownDeg", errors),
            RadiusM = Number("mirror.radiusM", errors),
            DiameterM = Number("mirror.diameterM", errors),
        };
    }

    /// <summary>The options the form sets; the rest keep their defaults.</summary>
    public RecommendationOptionsRequest Options(RequestErrors errors)
    {
        var method = this["options.sightDistance.method"];
        if (method.Length > 0 && !Methods.Any(m => m.Value == method))
        {
            errors.Add("options.sightDistance.method", $"One of {string.Join(", ", Methods.Select(m => m.Value))}; it was \"{method}\".");
        }

        return new RecommendationOptionsRequest { SightDistance = new SightDistanceRequest { Method = method.Length > 0 ? method : null } };
    }

    /// <summary>Records a problem for each text field longer than a report line takes.</summary>
    public void CheckLengths(RequestErrors errors)
    {
        foreach (var name in new[] { "title", "site", "note" }.Where(n => this[n].Length > Ranges.MaxReportTextLength))
        {
            errors.Add(name, $"At most {Ranges.MaxReportTextLength} characters; it had {this[name].Length}.");
        }
    }

    private static string Text(double? value) => value?.ToString("R", CultureInfo.InvariantCulture) ?? string.Empty;

    private double? Number(string name, RequestErrors errors)
    {
        var text = this[name];
        if (text.Length == 0)
        {
            return null;
        }

        if (double.TryParse(text, NumberStyles.Float, CultureInfo.InvariantCulture, out var value) && double.IsFinite(value))
        {
            return value;
        }

        errors.Add(name, $"A number with a point for decimals, such as 2.95; it was \"{(text.Length > 30 ? text[..30] + "…" : text)}\".");
        return null;
    }

    /// <summary>The form as HTML: a multipart POST to the action, with the antiforgery token, the typed values and each problem beside its field.</summary>
    /// <param name="action">Where the form posts.</param>
    /// <param name="tokens">The antiforgery tokens of this answer.</param>
    /// <param name="errors">The problems by request path; shown beside the field whose path they start with, the rest above the form.</param>
    /// <param name="forStudy">A new study (title and site) rather than a revision.</param>
    public string ToHtml(string action, AntiforgeryTokenSet tokens, IReadOnlyDictionary<string, string[]> errors, bool forStudy)
    {
        var shown = new HashSet<string>();
        var html = new StringBuilder();
        if (errors.Count > 0)
        {
            // The new-study page's form sits under its h1, the revision form under an h2: the summary's heading follows.
            var heading = forStudy ? "h2" : "h3";
            html.Append("<div class=\"summary\" role=\"alert\"><").Append(heading).Append('>').Append(forStudy ? "The study was not started" : "The revision was not added")
                .Append("; nothing was stored.</").Append(heading).Append("><ul class=\"errors\">");
            foreach (var (path, messages) in errors)
            {
                foreach (var message in messages)
                {
                    html.Append("<li><code>").Append(E(path)).Append("</code>: ").Append(E(message)).Append("</li>");
                }
            }

            html.Append("</ul></div>\n");
        }

        html.Append("<form method=\"post\" action=\"").Append(E(action)).Append("\" enctype=\"multipart/form-data\">\n")
            .Append("<input type=\"hidden\" name=\"").Append(E(tokens.FormFieldName)).Append("\" value=\"").Append(E(tokens.RequestToken)).Append("\">\n");
        if (forStudy)
        {
            html.Append(TextInput("title", "Title", "A short name, such as the street corner.", errors, shown, required: true));
            html.Append(TextInput("site", "Site", "The site in words: streets, a file reference.", errors, shown));
        }

        html.Append("<label for=\"plan\">Plan (GeoJSON file)</label>\n")
            .Append("<p class=\"hint\" id=\"plan-hint\">A FeatureCollection as for POST /v1/evaluations.")
            .Append(forStudy ? string.Empty : " Leave it empty to keep the newest revision's plan.").Append("</p>\n")
            .Append("<input type=\"file\" id=\"plan\" name=\"plan\" accept=\".geojson,.json,application/geo+json,application/json\" aria-describedby=\"plan-hint plan-errors\"")
            .Append(forStudy ? " required" : string.Empty).Append(">\n")
            .Append(FieldErrors("plan", "plan", errors, shown));
        html.Append(TextInput("note", "Note", "Why this revision was made.", errors, shown));

        html.Append("<fieldset><legend>Options</legend>\n<label for=\"options-method\">Sight-distance method</label>\n")
            .Append("<p class=\"hint\" id=\"options-method-hint\">The speed comes from the plan's approaches.</p>\n")
            .Append("<select id=\"options-method\" name=\"options.sightDistance.method\" aria-describedby=\"options-method-hint options-method-errors\">");
        foreach (var (value, label) in Methods)
        {
            html.Append("<option value=\"").Append(value).Append('"').Append(this["options.sightDistance.method"] == value ? " selected" : string.Empty)
                .Append('>').Append(E(label)).Append("</option>");
        }

        html.Append("</select>\n").Append(FieldErrors("options.sightDistance", "options-method", errors, shown)).Append("</fieldset>\n");

        html.Append("<fieldset><legend>Mirror (leave empty to have one recommended)</legend>\n<div class=\"grid\">\n");
        foreach (var (name, label, hint) in MirrorFields)
        {
            // Location problems are reported on the point as a whole; they are shown beside its x.
            var errorPath = name.StartsWith("mirror.location", StringComparison.Ordinal) ? (name.EndsWith(".x", StringComparison.Ordinal) ? "mirror.location" : "mirror.location.y") : name;
            html.Append("<div>").Append(TextInput(name, label, hint, errors, shown, errorPath: errorPath, inputMode: "decimal")).Append("</div>\n");
        }

        html.Append("</div>\n").Append(FieldErrors("mirror", "mirror", errors, shown)).Append("</fieldset>\n")
            .Append("<button type=\"submit\">").Append(forStudy ? "Start the study" : "Add the revision").Append("</button>\n</form>\n");
        return html.ToString();
    }

    private string TextInput(
        string name, string label, string hint, IReadOnlyDictionary<string, string[]> errors, HashSet<string> shown,
        bool required = false, string? errorPath = null, string? inputMode = null)
    {
        var id = name.Replace('.', '-');
        var html = new StringBuilder();
        html.Append("<label for=\"").Append(id).Append("\">").Append(E(label)).Append("</label>\n");
        if (hint.Length > 0)
        {
            html.Append("<p class=\"hint\" id=\"").Append(id).Append("-hint\">").Append(E(hint)).Append("</p>\n");
        }

        html.Append("<input type=\"text\" id=\"").Append(id).Append("\" name=\"").Append(E(name)).Append("\" value=\"").Append(E(this[name])).Append('"')
            .Append(" aria-describedby=\"").Append(hint.Length > 0 ? id + "-hint " : string.Empty).Append(id).Append("-errors\"")
            .Append(inputMode is null ? string.Empty : $" inputmode=\"{inputMode}\"")
            .Append(required ? " required" : string.Empty).Append(">\n")
            .Append(FieldErrors(errorPath ?? name, id, errors, shown));
        return html.ToString();
    }

    // The problems whose path is the field's path or lies under it (plan.features[3].properties.heightM lies under plan), not shown already.
    private static string FieldErrors(string path, string id, IReadOnlyDictionary<string, string[]> errors, HashSet<string> shown)
    {
        var mine = errors
            .Where(e => !shown.Contains(e.Key) && (e.Key == path || e.Key.StartsWith(path + ".", StringComparison.Ordinal) || e.Key.StartsWith(path + "[", StringComparison.Ordinal)))
            .ToList();
        var html = new StringBuilder();
        html.Append("<ul class=\"field-errors\" id=\"").Append(id).Append("-errors\">");
        foreach (var (key, messages) in mine)
        {
            shown.Add(key);
            foreach (var message in messages)
            {
                html.Append("<li><code>").Append(E(key)).Append("</code>: ").Append(E(message)).Append("</li>");
            }
        }

        return html.Append("</ul>\n").ToString();
    }
}
