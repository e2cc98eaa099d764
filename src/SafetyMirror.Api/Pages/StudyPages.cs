using System.Globalization;
using System.Text;
using System.Text.Json;
using Microsoft.AspNetCore.Antiforgery;
using Microsoft.Extensions.Options;
using SafetyMirror.Api.Access;
using SafetyMirror.Api.Features.Reports;
using SafetyMirror.Api.Features.Evaluations;
using SafetyMirror.Api.Features.Studies;
using SafetyMirror.Api.Limits;
using SafetyMirror.Api.Requests;
using SafetyMirror.Reports.Documents;
using SafetyMirror.Reports.Justification;
using SafetyMirror.Reports.Views;
using SafetyMirror.Studies;
using static SafetyMirror.Api.Pages.PageHtml;
using JsonOptions = Microsoft.AspNetCore.Http.Json.JsonOptions;

namespace SafetyMirror.Api.Pages;

/// <summary>Server-rendered HTML pages over the studies: the list, a study's page, and the forms that start a study and add a revision.</summary>
/// <remarks>Plain HTML forms, no scripts; the POST forms carry ASP.NET Core antiforgery tokens. The pages need a key as the study routes do.</remarks>
public static class StudyPages
{
    /// <summary>Registers the antiforgery tokens the forms carry.</summary>
    public static IServiceCollection AddStudyPages(this IServiceCollection services) => services.AddAntiforgery();

    /// <summary>Maps the pages under <c>/studies</c>; they are not part of the API's description.</summary>
    public static RouteGroupBuilder MapStudyPages(this IEndpointRouteBuilder routes)
    {
        var group = routes.MapGroup("/studies").RequireApiKey().WithRequestLimits().ExcludeFromDescription();
        group.MapGet("/", List);
        group.MapGet("/new", New);
        group.MapPost("/", Create).WithWorkBudget();
        group.MapGet("/{id:guid}", Show).WithWorkBudget();
        group.MapPost("/{id:guid}/revisions", Revise).WithWorkBudget();
        group.MapGet("/pages.css", () => TypedResults.Text(Stylesheet, "text/css; charset=utf-8"));
        return group;
    }

    private static async Task<IResult> List(HttpContext http, IStudyStore store, string? text, string? bbox, int? offset, int? limit)
    {
        var errors = new RequestErrors();
        if (text is { Length: > Ranges.MaxReportTextLength })
        {
            errors.Add("text", $"At most {Ranges.MaxReportTextLength} characters; it had {text.Length}.");
        }

        var box = StudyEndpoints.ReadBox(string.IsNullOrWhiteSpace(bbox) ? null : bbox, errors);
        var skip = (int)errors.Within(offset, 0, int.MaxValue, "studies", "offset", 0);
        var take = (int)errors.Within(limit, 1, StudyQuery.MaxLimit, "studies", "limit", 20);
        var found = errors.IsEmpty
            ? await store.ListAsync(new StudyQuery(string.IsNullOrWhiteSpace(text) ? null : text, box, false, skip, take, StudyEndpoints.OwnerOf(http.User)), http.RequestAborted)
            : null;
        var problems = errors.ToDictionary();

        var html = new StringBuilder("<h1>Studies</h1>\n");
        html.Append("<form method=\"get\" action=\"/studies\" role=\"search\">\n<div class=\"grid\">\n")
            .Append(SearchField("text", "Title or site contains", text, problems))
            .Append(SearchField("bbox", "Inside the box (minLon,minLat,maxLon,maxLat)", bbox, problems))
            .Append(SearchField("limit", "Studies per page", limit?.ToString(CultureInfo.InvariantCulture), problems))
            .Append("</div>\n<button type=\"submit\">Search</button>\n</form>\n");
        html.Append("<p class=\"no-print\"><a href=\"/studies/new\">Start a new study</a></p>\n");
        if (found is null)
        {
            return Results.Content(Page("Studies", html.ToString()), MediaType, statusCode: StatusCodes.Status400BadRequest);
        }

        html.Append("<h2>").Append(found.Total).Append(found.Total == 1 ? " study" : " studies").Append("</h2>\n");
        if (found.Items.Count > 0)
        {
            html.Append("<table>\n<thead><tr><th scope=\"col\">Title</th><th scope=\"col\">Site</th><th scope=\"col\" class=\"number\">Revisions</th><th scope=\"col\">Last revised (UTC)</th></tr></thead>\n<tbody>\n");
            foreach (var study in found.Items)
            {
                html.Append("<tr><td><a href=\"/studies/").Append(study.Id).Append("\">").Append(E(study.Title)).Append("</a>")
                    .Append(study.IsArchived ? " (archived)" : string.Empty).Append("</td><td>").Append(E(study.SiteText))
                    .Append("</td><td class=\"number\">").Append(study.LatestRevision).Append("</td><td>").Append(When(study.UpdatedAt)).Append("</td></tr>\n");
            }

            html.Append("</tbody>\n</table>\n");
        }

        html.Append("<nav aria-label=\"Result pages\" class=\"no-print\">");
        if (skip > 0)
        {
            html.Append("<a href=\"").Append(E(ListLink(text, bbox, Math.Max(0, skip - take), take))).Append("\" rel=\"prev\">Previous page</a> ");
        }

        if (skip + take < found.Total)
        {
            html.Append("<a href=\"").Append(E(ListLink(text, bbox, skip + take, take))).Append("\" rel=\"next\">Next page</a>");
        }

        html.Append("</nav>\n");
        return Results.Content(Page("Studies", html.ToString()), MediaType);
    }

    private static IResult New(HttpContext http, IAntiforgery antiforgery) =>
        Results.Content(NewPage(StudyForm.Empty, antiforgery.GetAndStoreTokens(http), new Dictionary<string, string[]>()), MediaType);

    private static async Task<IResult> Create(HttpContext http, IStudyStore store, IAntiforgery antiforgery, TimeProvider clock, IOptions<JsonOptions> json)
    {
        if (await RefusedTokenAsync(http, antiforgery) is { } refused)
        {
            return refused;
        }

        var errors = new RequestErrors();
        var form = await StudyForm.ReadAsync(http.Request, errors);
        form.CheckLengths(errors);
        if (form["title"].Length == 0)
        {
            errors.Add("title", "A study needs a title: a short name such as the street corner.");
        }

        if (form.Plan is null && !errors.ToDictionary().ContainsKey("plan"))
        {
            errors.Add("plan", "Choose the plan's GeoJSON file.");
        }

        var input = new StudyInput(form.Plan ?? default, form.Mirror(errors), form.Options(errors));
        var run = form.Plan is null || !errors.IsEmpty ? null : StudyRuns.Run(input, GlareAnswer.CurrentYear(clock), json.Value.SerializerOptions, errors, http.RequestAborted);
        if (run is null || !errors.IsEmpty)
        {
            return Results.Content(NewPage(form, antiforgery.GetAndStoreTokens(http), errors.ToDictionary()), MediaType, statusCode: StatusCodes.Status400BadRequest);
        }

        var owner = StudyEndpoints.OwnerOf(http.User);
        var (point, extent) = StudyRuns.Place(run.Plan, input.Plan);
        var created = await store.CreateAsync(
            new NewStudy(form["title"], form["site"], point, extent, owner),
            StudyRuns.Content(input, run, owner, form["note"], json.Value.SerializerOptions),
            http.RequestAborted);
        return SeeOther($"/studies/{created.Study.Id}");
    }

    private static async Task<IResult> Show(Guid id, HttpContext http, IStudyStore store, IAntiforgery antiforgery, TimeProvider clock, IOptions<JsonOptions> json) =>
        await StudyPageAsync(id, http, store, antiforgery, clock, json.Value.SerializerOptions, form: null, new Dictionary<string, string[]>()) is { } page
            ? Results.Content(page, MediaType)
            : NotFound(id);

    private static async Task<IResult> Revise(Guid id, HttpContext http, IStudyStore store, IAntiforgery antiforgery, TimeProvider clock, IOptions<JsonOptions> json)
    {
        if (await RefusedTokenAsync(http, antiforgery) is { } refused)
        {
            return refused;
        }

        var owner = StudyEndpoints.OwnerOf(http.User);
        if (await store.GetStudyAsync(id, http.RequestAborted) is not { } found || found.Study.Owner != owner)
        {
            return NotFound(id);
        }

        var serializer = json.Value.SerializerOptions;
        var errors = new RequestErrors();
        var form = await StudyForm.ReadAsync(http.Request, errors);
        form.CheckLengths(errors);

        // Without a new file the newest revision's plan stands: a revision often changes only the mirror or the options.
        var plan = form.Plan;
        if (plan is null && errors.IsEmpty && await store.GetRevisionAsync(id, found.Study.LatestRevision, http.RequestAborted) is { } latest)
        {
            plan = StudyInput.From(latest.Content, serializer).Plan;
        }

        var input = new StudyInput(plan ?? default, form.Mirror(errors), form.Options(errors));
        var run = plan is null || !errors.IsEmpty ? null : StudyRuns.Run(input, GlareAnswer.CurrentYear(clock), serializer, errors, http.RequestAborted);
        if (run is null || !errors.IsEmpty)
        {
            var page = await StudyPageAsync(id, http, store, antiforgery, clock, serializer, form, errors.ToDictionary());
            return Results.Content(page, MediaType, statusCode: StatusCodes.Status400BadRequest);
        }

        var write = await store.AddRevisionAsync(id, StudyRuns.Content(input, run, owner, form["note"], serializer), cancellationToken: http.RequestAborted);
        if (write.Outcome != RevisionWriteOutcome.Added)
        {
            var problems = new Dictionary<string, string[]> { ["study"] = ["The study is archived and takes no more revisions."] };
            var page = await StudyPageAsync(id, http, store, antiforgery, clock, serializer, form, problems);
            return Results.Content(page, MediaType, statusCode: StatusCodes.Status409Conflict);
        }

        return SeeOther($"/studies/{id}");
    }

    // The study page, or null when the study is not the caller's.
    private static async Task<string?> StudyPageAsync(
        Guid id, HttpContext http, IStudyStore store, IAntiforgery antiforgery, TimeProvider clock, JsonSerializerOptions json,
        StudyForm? form, IReadOnlyDictionary<string, string[]> problems)
    {
        if (await store.GetStudyAsync(id, http.RequestAborted) is not { } found || found.Study.Owner != StudyEndpoints.OwnerOf(http.User))
        {
            return null;
        }

        var study = await StudyEndpoints.DescribeAsync(found, store, http.RequestAborted);
        var latest = await store.GetRevisionAsync(id, study.LatestRevision, http.RequestAborted);
        var html = new StringBuilder();
        html.Append("<h1>").Append(E(study.Title)).Append("</h1>\n<dl>\n<dt>Site</dt><dd>").Append(E(study.Site.Length > 0 ? study.Site : "(not given)"))
            .Append("</dd>\n<dt>Owner</dt><dd>").Append(E(study.Owner)).Append("</dd>\n<dt>Started (UTC)</dt><dd>").Append(When(study.CreatedAt)).Append("</dd>\n")
            .Append(study.Archived ? "<dt>State</dt><dd>Archived: it takes no more revisions.</dd>\n" : string.Empty).Append("</dl>\n");

        if (latest is not null)
        {
            html.Append(Decision(latest)).Append(PlanFigure(study, latest, http, clock, json)).Append(DriversView(study, latest, json));
        }

        html.Append(RevisionTable(study));
        if (!study.Archived)
        {
            html.Append("<h2 id=\"add-revision\">Add a revision</h2>\n")
                .Append((form ?? (latest is null ? StudyForm.Empty : StudyForm.From(StudyInput.From(latest.Content, json)))).ToHtml($"/studies/{id}/revisions", antiforgery.GetAndStoreTokens(http), problems, forStudy: false));
        }
        else if (problems.Count > 0)
        {
            html.Append("<p class=\"errors\" role=\"alert\">").Append(E(string.Join(" ", problems.SelectMany(p => p.Value)))).Append("</p>\n");
        }

        return Page(study.Title, html.ToString());
    }

    private static string Decision(Revision latest)
    {
        var side = StudyRuns.Side(latest.Content.ServiceVersion, latest.Content.EvaluationJson ?? latest.Content.RecommendationJson ?? "{}");
        var html = new StringBuilder();
        html.Append("<h2>Decision of revision ").Append(latest.Number).Append("</h2>\n<p class=\"decision\" id=\"decision\">").Append(E(side.Decision)).Append("</p>\n")
            .Append("<p>").Append(E(side.Summary)).Append("</p>\n");
        if (side.Approaches.Count > 0)
        {
            html.Append("<table>\n<caption>Per approach</caption>\n<thead><tr><th scope=\"col\">Approach</th><th scope=\"col\" class=\"number\">Required sight distance (m)</th>")
                .Append("<th scope=\"col\" class=\"number\">Provided sight distance (m)</th><th scope=\"col\" class=\"number\">Longest unseen stretch (m)</th></tr></thead>\n<tbody>\n");
            foreach (var approach in side.Approaches)
            {
                html.Append("<tr><th scope=\"row\">").Append(E(approach.Approach)).Append("</th><td class=\"number\">").Append(Metres(approach.RequiredSightDistanceM))
                    .Append("</td><td class=\"number\">").Append(Metres(approach.ProvidedSightDistanceM)).Append("</td><td class=\"number\">")
                    .Append(approach.LongestUnseenM is { } unseen ? Metres(unseen) : "none").Append("</td></tr>\n");
            }

            html.Append("</tbody>\n</table>\n");
        }

        return html.Append("<p><strong>").Append(E(Cautions)).Append("</strong></p>\n").ToString();
    }

    // The report's first figure, the whole plan with the mirror, its field of view and the shown and unseen stretches, as inline SVG.
    private static string PlanFigure(StudyResponse study, Revision latest, HttpContext http, TimeProvider clock, JsonSerializerOptions json)
    {
        var errors = new RequestErrors();
        var details = new ReportDetailsRequest { Title = study.Title, Site = study.Site };
        var (header, _, paper) = ReportRequestReader.Read(details, clock, errors);
        var stamped = header with { Stamp = new StudyStamp(study.Id, latest.Number, latest.ContentHash) };
        var report = errors.IsEmpty ? StudyRuns.Report(latest, json, stamped, errors, http.RequestAborted) : null;
        var html = new HtmlReportWriter(header.Title, paper.Paper);
        report?.WriteSitePlan(html, paper);
        var page = report is null ? string.Empty : html.ToHtml();
        var start = page.IndexOf("<figure", StringComparison.Ordinal);
        var end = start < 0 ? -1 : page.IndexOf("</figure>", start, StringComparison.Ordinal);
        var figure = end < 0
            ? "<p>This version of the service cannot draw the stored plan; the stored answer above stands.</p>\n"
            : page[start..(end + "</figure>".Length)] + "\n";
        return "<h2>Plan</h2>\n" + figure;
    }

    // The stored revision's mirror as the waiting driver sees it, fetched from the revision's view route; a recommendation has no mirror to show.
    private static string DriversView(StudyResponse study, Revision latest, JsonSerializerOptions json)
    {
        if (StudyInput.From(latest.Content, json).Mirror is null)
        {
            return string.Empty;
        }

        var caption = $"The mirror of revision {latest.Number} as the waiting driver sees it from the eye point, every pixel an eye ray reflected exactly on the curved face. "
            + "The band across its top states its angular scale (degrees across, arc minutes a pixel); red boxes stand for the design road user at the required sight distance. "
            + string.Join(" ", ViewPng.MirrorCautions);
        return "<h2>What the driver sees</h2>\n<figure class=\"view\">"
            + $"<img id=\"view\" src=\"/v1/studies/{study.Id}/revisions/{latest.Number}/view\" width=\"600\" height=\"600\" "
            + $"alt=\"{E($"The mirror of revision {latest.Number} on its pole as seen from the driver's eye point, with the road it shows and the design road user at the required sight distance.")}\">"
            + $"<figcaption>{E(caption)}</figcaption></figure>\n";
    }

    private static string RevisionTable(StudyResponse study)
    {
        var html = new StringBuilder();
        html.Append("<h2>Revisions</h2>\n<table id=\"revisions\">\n<thead><tr><th scope=\"col\" class=\"number\">No.</th><th scope=\"col\">By</th><th scope=\"col\">When (UTC)</th>")
            .Append("<th scope=\"col\">Note</th><th scope=\"col\">Request hash</th><th scope=\"col\">Decision</th><th scope=\"col\">Files</th></tr></thead>\n<tbody>\n");
        foreach (var revision in study.Revisions.Reverse())
        {
            var link = $"/v1/studies/{study.Id}/revisions/{revision.Number}?format=";
            html.Append("<tr><td class=\"number\">").Append(revision.Number).Append("</td><td>").Append(E(revision.Author)).Append("</td><td>").Append(When(revision.CreatedAt))
                .Append("</td><td>").Append(E(revision.Note)).Append("</td><td><code title=\"").Append(E(revision.Hash)).Append("\">").Append(E(revision.Hash[..Math.Min(12, revision.Hash.Length)]))
                .Append("</code></td><td>").Append(E(revision.Decision)).Append("</td><td>")
                .Append($"<a href=\"{link}pdf\" aria-label=\"Revision {revision.Number} report as PDF\">PDF</a> ")
                .Append($"<a href=\"{link}html\" aria-label=\"Revision {revision.Number} report as a web page\">Report</a> ")
                .Append($"<a href=\"{link}geojson\" aria-label=\"Revision {revision.Number} GIS layers\">GeoJSON</a> ")
                .Append($"<a href=\"{link}json\" aria-label=\"Revision {revision.Number} request and answer as JSON\">JSON</a>")
                .Append("</td></tr>\n");
        }

        return html.Append("</tbody>\n</table>\n").ToString();
    }

    private static string NewPage(StudyForm form, AntiforgeryTokenSet tokens, IReadOnlyDictionary<string, string[]> problems) =>
        Page("New study", "<h1>New study</h1>\n<p>Upload the corner's plan and, to judge a mirror, describe it; without one the service recommends one.</p>\n"
            + form.ToHtml("/studies", tokens, problems, forStudy: true));

    private static string SearchField(string name, string label, string? value, IReadOnlyDictionary<string, string[]> problems)
    {
        var html = new StringBuilder("<div>");
        html.Append("<label for=\"search-").Append(name).Append("\">").Append(E(label)).Append("</label>")
            .Append("<input type=\"text\" id=\"search-").Append(name).Append("\" name=\"").Append(name).Append("\" value=\"").Append(E(value)).Append("\" aria-describedby=\"search-").Append(name).Append("-errors\">")
            .Append("<ul class=\"field-errors\" id=\"search-").Append(name).Append("-errors\">");
        foreach (var message in problems.Where(p => p.Key == name || p.Key.EndsWith("." + name, StringComparison.Ordinal)).SelectMany(p => p.Value))
        {
            html.Append("<li>").Append(E(message)).Append("</li>");
        }

        return html.Append("</ul></div>\n").ToString();
    }

    private static string ListLink(string? text, string? bbox, int offset, int limit)
    {
        var query = new Dictionary<string, string?> { ["text"] = text, ["bbox"] = bbox, ["offset"] = offset.ToString(CultureInfo.InvariantCulture), ["limit"] = limit.ToString(CultureInfo.InvariantCulture) };
        return Microsoft.AspNetCore.WebUtilities.QueryHelpers.AddQueryString("/studies", query.Where(q => !string.IsNullOrEmpty(q.Value)));
    }

    // A form that is not the service's own (no or a stale antiforgery token) is turned away before anything is read.
    private static async Task<IResult?> RefusedTokenAsync(HttpContext http, IAntiforgery antiforgery) =>
        await antiforgery.IsRequestValidAsync(http)
            ? null
            : Results.Problem(
                statusCode: StatusCodes.Status400BadRequest,
                title: "The form's antiforgery token is missing or stale.",
                detail: "Open the form again from the service and send it from there; nothing was stored.");

    // After a POST the browser fetches the study page with GET, so reloading it does not post again.
    private static SeeOtherResult SeeOther(string location) => new(location);

    private static IResult NotFound(Guid id) => Results.Problem(
        statusCode: StatusCodes.Status404NotFound, title: "There is no such study.", detail: $"No study {id} belongs to this key's owner.");

    private static string When(DateTimeOffset time) => time.UtcDateTime.ToString("yyyy-MM-dd HH:mm", CultureInfo.InvariantCulture);

    private static string Metres(double value) => value.ToString("0.0", CultureInfo.InvariantCulture);

    private sealed class SeeOtherResult(string location) : IResult
    {
        public Task ExecuteAsync(HttpContext httpContext)
        {
            httpContext.Response.StatusCode = StatusCodes.Status303SeeOther;
            httpContext.Response.Headers.Location = location;
            return Task.CompletedTask;
        }
    }
}
