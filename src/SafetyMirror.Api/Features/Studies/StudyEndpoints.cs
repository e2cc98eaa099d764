using System.Globalization;
using System.Security.Claims;
using System.Text;
using System.Text.Json;
using System.Text.Json.Nodes;
using Microsoft.AspNetCore.Http.HttpResults;
using Microsoft.AspNetCore.Mvc;
using Microsoft.Extensions.Options;
using SafetyMirror.Api.Access;
using SafetyMirror.Api.Features.Reports;
using SafetyMirror.Api.Json;
using SafetyMirror.Api.Limits;
using SafetyMirror.Api.OpenApi;
using SafetyMirror.Api.Features.Evaluations;
using SafetyMirror.Api.Requests;
using SafetyMirror.Reports.Justification;
using SafetyMirror.Studies;
using SafetyMirror.Api.Service;

namespace SafetyMirror.Api.Features.Studies;

/// <summary>Routes that keep a corner's studies: created, revised, fetched, reported, re-run, listed and archived.</summary>
/// <remarks>Every route needs a key; a study is its creator's (the key's owner): another owner's study answers 404, as if it did not exist.</remarks>
public static class StudyEndpoints
{
    private const string NotFoundTitle = "There is no such study.";

    /// <summary>Maps the <c>/studies</c> routes on the given route builder; each one requires a key.</summary>
    public static RouteGroupBuilder MapStudies(this IEndpointRouteBuilder routes)
    {
        var group = routes.MapGroup("/studies").WithTags("Studies").RequireApiKey();
        group.MapPost("/", Create)
            .WithName("CreateStudy")
            .WithRequestChecks()
            .WithWorkBudget()
            .WithSummary("Start a study of a corner")
            .WithDescription(
                "Takes a title, the site in words, the corner plan, options and optionally a mirror (with a note), evaluates the mirror "
                + "(or recommends one when none is given) as POST /v1/evaluations and POST /v1/recommendations do, and stores revision 1: "
                + "the request, the answer, the service version, the options in force, the author (the key's owner) and the SHA-256 of "
                + "the canonical request. A refused request stores nothing.")
            .WithMetadata(new RequestExamples("demo-corner-local.json", "demo-corner-wgs84.json"));
        group.MapGet("/", List)
            .WithName("ListStudies")
            .WithSummary("List the caller's studies")
            .WithDescription(
                "The caller's studies, most recently revised first: 'text' finds a part of the title or the site (case-insensitive), "
                + "'bbox' (minLon,minLat,maxLon,maxLat, WGS84) keeps the studies whose plan extent meets the box (only WGS84 plans have "
                + "one), 'archived=true' lists archived studies too; 'offset' and 'limit' (1 to 500, default 50) page.");
        group.MapGet("/{id:guid}", Get)
            .WithName("GetStudy")
            .ProducesProblem(StatusCodes.Status404NotFound)
            .WithSummary("A study and its revision list")
            .WithDescription("The study (title, site, owner, place) and each revision's number, author, time, note, hash and decision.");
        group.MapPost("/{id:guid}/revisions", Revise)
            .WithName("ReviseStudy")
            .WithRequestChecks()
            .WithWorkBudget()
            .ProducesProblem(StatusCodes.Status404NotFound)
            .ProducesProblem(StatusCodes.Status409Conflict)
            .WithSummary("Add a revision to a study")
            .WithDescription(
                "Takes the changed plan, options and mirror with a note, answers it as the first revision was answered and stores it "
                + "as the next revision; nothing already stored changes. With 'basedOn' and a newer revision already stored, nothing "
                + "is stored and the answer is 409 with the current number; an archived study answers 409 too.");
        group.MapGet("/{id:guid}/revisions/{number:int}", GetRevision)
            .WithName("GetStudyRevision")
            .WithWorkBudget()
            .WithSummary("One revision: its request and answer, its GIS layers, or its report")
            .WithDescription(
                "JSON (the default): the stored request, the stored answer, the service version, the options in force and the hash. "
                + "Accept: application/geo+json: the answer's GIS layers, recomputed from the stored request. Accept: text/html or "
                + "application/pdf: the justification report on the stored request, titled with the study; its header block and "
                + "the footer of every page name the study, the revision and the request's hash, and the PDF is the same byte for byte on every call on the same day. "
                + "A browser link can ask with 'format' instead (json, geojson, html or pdf), which takes the place of the Accept header.")
            .Produces<string>(StatusCodes.Status200OK, ReportEndpoints.Html, ReportEndpoints.Pdf, PlanLayers.MediaType)
            .ProducesProblem(StatusCodes.Status400BadRequest)
            .ProducesProblem(StatusCodes.Status404NotFound)
            .ProducesProblem(StatusCodes.Status422UnprocessableEntity);
        group.MapPost("/{id:guid}/revisions/{number:int}/rerun", Rerun)
            .WithName("RerunStudyRevision")
            .WithWorkBudget()
            .WithSummary("Re-run a revision on this version and compare")
            .WithDescription(
                "Answers the revision's stored request again on this version of the service and sets the stored answer beside the "
                + "new one: decision, summary, per approach the required and provided sight distance and the longest unseen stretch, "
                + "and whether the answer's JSON is byte for byte the same. Nothing is stored.")
            .ProducesProblem(StatusCodes.Status404NotFound)
            .ProducesProblem(StatusCodes.Status422UnprocessableEntity);
        group.MapPost("/{id:guid}/archive", Archive)
            .WithName("ArchiveStudy")
            .ProducesProblem(StatusCodes.Status404NotFound)
            .WithSummary("Archive a study")
            .WithDescription("The study stays readable and listed with archived=true, and takes no more revisions. Archiving twice is harmless.");
        return group;
    }

    private static async Task<Results<Created<StudyResponse>, ValidationProblem>> Create(
        StudyRequest request, HttpContext http, IStudyStore store, TimeProvider clock, IOptions<Microsoft.AspNetCore.Http.Json.JsonOptions> json)
    {
        var errors = new RequestErrors();
        if (string.IsNullOrWhiteSpace(request.Title))
        {
            errors.Add("title", "A study needs a title: a short name such as the street corner.");
        }

        var input = new StudyInput(request.Plan, request.Mirror, request.Options);
        var run = StudyRuns.Run(input, GlareAnswer.CurrentYear(clock), json.Value.SerializerOptions, errors, http.RequestAborted);
        if (run is null || !errors.IsEmpty)
        {
            return errors.ToValidationProblem("The study cannot be started as sent; nothing was stored.");
        }

        var owner = OwnerOf(http.User);
        var (point, extent) = StudyRuns.Place(run.Plan, request.Plan);
        var created = await store.CreateAsync(
            new NewStudy(request.Title!.Trim(), request.Site?.Trim() ?? string.Empty, point, extent, owner),
            StudyRuns.Content(input, run, owner, request.Note, json.Value.SerializerOptions),
            http.RequestAborted);
        var body = await DescribeAsync(created, store, http.RequestAborted);
        return TypedResults.Created($"/v1/studies/{created.Study.Id}", body);
    }

    private static async Task<Results<Created<RevisionLineResponse>, ValidationProblem, ProblemHttpResult>> Revise(
        Guid id, RevisionRequest request, HttpContext http, IStudyStore store, TimeProvider clock, IOptions<Microsoft.AspNetCore.Http.Json.JsonOptions> json)
    {
        var owner = OwnerOf(http.User);
        if (await store.GetStudyAsync(id, http.RequestAborted) is not { } found || found.Study.Owner != owner)
        {
            return NotFound(id);
        }

        var errors = new RequestErrors();
        if (request.BasedOn is < 1)
        {
            errors.Add("basedOn", $"A revision number, 1 or more; it was {request.BasedOn}.");
        }

        var input = new StudyInput(request.Plan, request.Mirror, request.Options);
        var run = StudyRuns.Run(input, GlareAnswer.CurrentYear(clock), json.Value.SerializerOptions, errors, http.RequestAborted);
        if (run is null || !errors.IsEmpty)
        {
            return errors.ToValidationProblem("The revision cannot be made as sent; nothing was stored.");
        }

        var write = await store.AddRevisionAsync(id, StudyRuns.Content(input, run, owner, request.Note, json.Value.SerializerOptions), request.BasedOn, http.RequestAborted);
        return write.Outcome switch
        {
            RevisionWriteOutcome.Added when write.Revision is { } added => TypedResults.Created(
                $"/v1/studies/{id}/revisions/{added.Number}",
                new RevisionLineResponse(added.Number, added.Content.Author, added.CreatedAt, added.Content.Note, added.ContentHash, StudyRuns.Decision(added))),
            RevisionWriteOutcome.Conflict => Conflict(
                $"Revision {request.BasedOn} is no longer the newest: the study is at revision {write.CurrentNumber}. Fetch it, apply the change to it and send basedOn {write.CurrentNumber}.",
                write.CurrentNumber),
            RevisionWriteOutcome.Archived => Conflict("The study is archived and takes no more revisions.", write.CurrentNumber),
            _ => NotFound(id),
        };
    }

    private static async Task<Results<Ok<StudyResponse>, ProblemHttpResult>> Get(Guid id, HttpContext http, IStudyStore store)
    {
        if (await store.GetStudyAsync(id, http.RequestAborted) is not { } found || found.Study.Owner != OwnerOf(http.User))
        {
            return NotFound(id);
        }

        return TypedResults.Ok(await DescribeAsync(found, store, http.RequestAborted));
    }

    private static async Task<Results<Ok<RevisionResponse>, JsonHttpResult<JsonObject>, FileContentHttpResult, ContentHttpResult, ProblemHttpResult>> GetRevision(
        Guid id, int number, [FromQuery(Name = "format")] string? linkFormat, HttpContext http, IStudyStore store, TimeProvider clock, IOptions<Microsoft.AspNetCore.Http.Json.JsonOptions> json)
    {
        if (linkFormat is not null)
        {
            if (FormatMediaType(linkFormat) is not { } mediaType)
            {
                var wrong = new RequestErrors();
                wrong.Add("format", $"One of json, geojson, html or pdf; it was \"{(linkFormat.Length > 20 ? linkFormat[..20] + "…" : linkFormat)}\".");
                return TypedResults.Problem(statusCode: StatusCodes.Status400BadRequest, title: "The revision cannot be given in that format.", extensions: new Dictionary<string, object?> { ["errors"] = wrong.ToDictionary() });
            }

            // A link cannot set the Accept header, so the query's format stands in for it.
            http.Request.Headers.Accept = mediaType;
        }

        if (await FindRevisionAsync(id, number, http, store) is not ({ } study, { } revision))
        {
            return NotFound(id, number);
        }

        var serializer = json.Value.SerializerOptions;
        if (PlanLayers.AreWanted(http.Request))
        {
            var errors = new RequestErrors();
            return StudyRuns.Run(StudyInput.From(revision.Content, serializer), StudyRuns.GlareYearOf(revision), serializer, errors, http.RequestAborted) is { } run
                ? PlanLayers.Answer(run.Layers(), run.Plan.Frame, serializer)
                : Refused(errors);
        }

        if (ReportEndpoints.Negotiate(http.Request) is { } format)
        {
            var errors = new RequestErrors();
            using var measuring = ServiceTelemetry.Measure(ComputeKind.Report);
            var details = new ReportDetailsRequest { Title = study.Title, Site = study.SiteText };
            var (header, _, paper) = ReportRequestReader.Read(details, clock, errors);
            var report = StudyRuns.Report(revision, serializer, header with { Stamp = new StudyStamp(id, number, revision.ContentHash) }, errors, http.RequestAborted);
            if (report is null)
            {
                return Refused(errors);
            }

            return format == ReportEndpoints.Pdf
                ? TypedResults.File(report.ToPdf(paper), ReportEndpoints.Pdf)
                : TypedResults.Content(report.ToHtml(paper), ReportEndpoints.Html, Encoding.UTF8);
        }

        var content = revision.Content;
        return TypedResults.Ok(new RevisionResponse(
            id, number, content.Author, revision.CreatedAt, content.Note, revision.ContentHash, content.ServiceVersion,
            new StoredRequestResponse(Parse(content.PlanJson), Parse(content.OptionsJson), content.MirrorJson is null ? null : Parse(content.MirrorJson)),
            Parse(content.RuleSetJson),
            content.EvaluationJson is null ? null : Parse(content.EvaluationJson),
            content.RecommendationJson is null ? null : Parse(content.RecommendationJson)));
    }

    private static async Task<Results<Ok<RerunResponse>, ProblemHttpResult>> Rerun(
        Guid id, int number, HttpContext http, IStudyStore store, IOptions<Microsoft.AspNetCore.Http.Json.JsonOptions> json)
    {
        if (await FindRevisionAsync(id, number, http, store) is not (_, { } revision))
        {
            return NotFound(id, number);
        }

        var errors = new RequestErrors();
        var serializer = json.Value.SerializerOptions;
        if (StudyRuns.Run(StudyInput.From(revision.Content, serializer), StudyRuns.GlareYearOf(revision), serializer, errors, http.RequestAborted) is not { } run)
        {
            return Refused(errors);
        }

        var storedAnswer = revision.Content.EvaluationJson ?? revision.Content.RecommendationJson ?? string.Empty;
        var stored = StudyRuns.Side(revision.Content.ServiceVersion, storedAnswer);
        var current = StudyRuns.Side(StudyRuns.ServiceVersion, run.AnswerJson);
        return TypedResults.Ok(new RerunResponse(
            id, number, revision.ContentHash, stored, current, stored.Decision == current.Decision, string.Equals(storedAnswer, run.AnswerJson, StringComparison.Ordinal)));
    }

    private static async Task<Results<Ok<StudyResponse>, ProblemHttpResult>> Archive(Guid id, HttpContext http, IStudyStore store)
    {
        if (await store.GetStudyAsync(id, http.RequestAborted) is not { } found || found.Study.Owner != OwnerOf(http.User))
        {
            return NotFound(id);
        }

        await store.ArchiveAsync(id, http.RequestAborted);
        var archived = await store.GetStudyAsync(id, http.RequestAborted) ?? found;
        return TypedResults.Ok(await DescribeAsync(archived, store, http.RequestAborted));
    }

    /// <summary>List the caller's studies</summary>
    /// <param name="http">The request.</param>
    /// <param name="store">The study store.</param>
    /// <param name="text">Part of the title or the site, case-insensitive, at most 300 characters.</param>
    /// <param name="bbox">minLon,minLat,maxLon,maxLat in WGS84 degrees: only studies whose plan extent meets the box.</param>
    /// <param name="archived">Whether archived studies are listed too (default false).</param>
    /// <param name="offset">How many matching studies to skip (default 0).</param>
    /// <param name="limit">At most this many studies, 1 to 500 (default 50).</param>
    private static async Task<Results<Ok<StudyListResponse>, ValidationProblem>> List(
        HttpContext http, IStudyStore store, string? text, string? bbox, bool? archived, int? offset, int? limit)
    {
        var errors = new RequestErrors();
        if (text is { Length: > Ranges.MaxReportTextLength })
        {
            errors.Add("text", $"At most {Ranges.MaxReportTextLength} characters; it had {text.Length}.");
        }

        var box = ReadBox(bbox, errors);
        var skip = (int)errors.Within(offset, 0, int.MaxValue, "studies", "offset", 0);
        var take = (int)errors.Within(limit, 1, StudyQuery.MaxLimit, "studies", "limit", 50);
        if (!errors.IsEmpty)
        {
            return errors.ToValidationProblem("The studies cannot be listed as asked.");
        }

        var page = await store.ListAsync(new StudyQuery(text, box, archived ?? false, skip, take, OwnerOf(http.User)), http.RequestAborted);
        var items = page.Items.Select(s => new StudyLineResponse(s.Id, s.Title, s.SiteText, Box(s.Extent), s.IsArchived, s.LatestRevision, s.UpdatedAt)).ToList();
        return TypedResults.Ok(new StudyListResponse(items, page.Total, skip, take));
    }

    // The media type each 'format' of a revision link stands for.
    private static string? FormatMediaType(string format) => format.ToLowerInvariant() switch
    {
        "json" => "application/json",
        "geojson" => PlanLayers.MediaType,
        "html" => ReportEndpoints.Html,
        "pdf" => ReportEndpoints.Pdf,
        _ => null,
    };

    /// <summary>Reads a "minLon,minLat,maxLon,maxLat" box, recording a problem under "bbox" when it is not one.</summary>
    internal static GeoBox? ReadBox(string? bbox, RequestErrors errors)
    {
        if (bbox is null)
        {
            return null;
        }

        var parts = bbox.Split(',');
        var sides = parts.Select(p => double.TryParse(p, NumberStyles.Float, CultureInfo.InvariantCulture, out var v) && double.IsFinite(v) ? v : (double?)null).ToList();
        if (parts.Length != 4 || sides.Any(s => s is null))
        {
            errors.Add("bbox", $"Four numbers, minLon,minLat,maxLon,maxLat in WGS84 degrees (for example 11.50,48.10,11.60,48.20); it was \"{(bbox.Length > 100 ? bbox[..100] + "…" : bbox)}\".");
            return null;
        }

        try
        {
            return new GeoBox(sides[0]!.Value, sides[1]!.Value, sides[2]!.Value, sides[3]!.Value);
        }
        catch (ArgumentOutOfRangeException)
        {
            errors.Add("bbox", "Longitudes must lie in -180..180 and latitudes in -90..90, with minLon ≤ maxLon and minLat ≤ maxLat.");
            return null;
        }
    }

    /// <summary>The revision, when its study exists and belongs to the caller; null otherwise.</summary>
    internal static async Task<(Study Study, Revision Revision)?> FindRevisionAsync(Guid id, int number, HttpContext http, IStudyStore store)
    {
        if (await store.GetStudyAsync(id, http.RequestAborted) is not { } found || found.Study.Owner != OwnerOf(http.User))
        {
            return null;
        }

        return await store.GetRevisionAsync(id, number, http.RequestAborted) is { } revision ? (found.Study, revision) : null;
    }

    /// <summary>A study with its revision list, each line with its decision.</summary>
    internal static async Task<StudyResponse> DescribeAsync(StudyRecord record, IStudyStore store, CancellationToken cancellationToken)
    {
        var lines = new List<RevisionLineResponse>();
        foreach (var summary in record.Revisions)
        {
            // The decision lives in the stored answer; a study has few revisions.
            var revision = await store.GetRevisionAsync(record.Study.Id, summary.Number, cancellationToken);
            lines.Add(new RevisionLineResponse(summary.Number, summary.Author, summary.CreatedAt, summary.Note, summary.ContentHash, revision is null ? string.Empty : StudyRuns.Decision(revision)));
        }

        var study = record.Study;
        var point = study.SitePoint is { } p ? new PointResponse(p.LongitudeDeg, p.LatitudeDeg) : null;
        return new StudyResponse(study.Id, study.Title, study.SiteText, point, Box(study.Extent), study.Owner, study.IsArchived, study.CreatedAt, study.UpdatedAt, study.LatestRevision, lines);
    }

    private static BoxResponse? Box(GeoBox? box) => box is { } b ? new BoxResponse(b.WestDeg, b.SouthDeg, b.EastDeg, b.NorthDeg) : null;

    private static JsonElement Parse(string json)
    {
        using var document = JsonDocument.Parse(json);
        return document.RootElement.Clone();
    }

    /// <summary>The key's owner; the routes require a key, so there always is one.</summary>
    internal static string OwnerOf(ClaimsPrincipal user) =>
        AccessClaims.OwnerOf(user) ?? throw new InvalidOperationException("Study routes require an API key.");

    /// <summary>The 404 answer for a study or revision the caller cannot see.</summary>
    internal static ProblemHttpResult NotFound(Guid id, int? number = null) => TypedResults.Problem(
        statusCode: StatusCodes.Status404NotFound,
        title: number is null ? NotFoundTitle : "There is no such revision.",
        detail: number is null
            ? $"No study {id} belongs to this key's owner."
            : $"No revision {number} of a study {id} that belongs to this key's owner.");

    private static ProblemHttpResult Conflict(string detail, int currentNumber) => TypedResults.Problem(
        statusCode: StatusCodes.Status409Conflict,
        title: "The revision was not stored.",
        detail: detail,
        extensions: new Dictionary<string, object?> { ["currentRevision"] = currentNumber });

    /// <summary>The answer for a stored request this version cannot run, naming each problem.</summary>
    /// <remarks>A stored request that this version refuses (its rules changed) cannot be answered again; the stored answer still stands.</remarks>
    internal static ProblemHttpResult Refused(RequestErrors errors) => TypedResults.Problem(
        statusCode: StatusCodes.Status422UnprocessableEntity,
        title: "This version of the service refuses the stored request.",
        detail: "The revision's stored answer stands; fetch it as JSON. Each entry under 'errors' names the field of the stored request that holds a problem.",
        extensions: new Dictionary<string, object?> { ["errors"] = errors.ToDictionary() });
}
