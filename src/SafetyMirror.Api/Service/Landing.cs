using Microsoft.AspNetCore.Http.HttpResults;

namespace SafetyMirror.Api.Service;

/// <summary>The landing page at <c>/</c>: what the service is for and where its API is described.</summary>
public static class Landing
{
    /// <summary>The OpenAPI tag of the service's own routes (landing page and health probe).</summary>
    public const string Tag = "Service";

    /// <summary>Maps the landing page.</summary>
    public static RouteHandlerBuilder MapLanding(this IEndpointRouteBuilder routes) =>
        routes.MapGet("/", Page)
            .WithName("GetLandingPage")
            .WithTags(Tag)
            .WithSummary("Describes the service in one page.")
            .WithDescription("A plain HTML page that says what the service is for and links the API documentation.")
            .Produces<string>(StatusCodes.Status200OK, "text/html");

    private static ContentHttpResult Page() => TypedResults.Content(Html, "text/html; charset=utf-8");

    // Self-contained on purpose: no scripts, fonts or styles fetched from anywhere.
    private const string Html = """
        <!DOCTYPE html>
        <html lang="en">
        <head>
        <meta charset="utf-8">
        <meta name="viewport" content="width=device-width, initial-scale=1">
        <title>SafetyMirror</title>
        <style>
        body { font-family: system-ui, sans-serif; max-width: 44rem; margin: 2rem auto; padding: 0 1rem; line-height: 1.5; color: #1b1b1b; }
        pre { background: #f3f3f3; padding: 0.75rem; overflow-x: auto; }
        </style>
        </head>
        <body>
        <h1>SafetyMirror</h1>
        <p>SafetyMirror is a web service for traffic engineers deciding whether a convex safety mirror can restore
        the sight distance that a wall, hedge or building cuts off at a blind corner, such as a driveway, alley or
        minor road meeting a street, and if so which mirror to use, where to mount it, how high and aimed where,
        with the figures a permit report needs. It is decision support only: a convex mirror makes vehicles look
        farther away and slower than they are, it does not replace removing the obstruction, it needs cleaning and
        upkeep and can be blinded by glare or ice, and local rules and licensed engineering judgement govern.</p>
        <ul>
        <li><a href="/swagger">Swagger UI</a>: the API, browsable and callable</li>
        <li><a href="/swagger/v1/swagger.json">OpenAPI document</a> (JSON)</li>
        <li><a href="/healthz">Health probe</a></li>
        </ul>
        <h2>Try it</h2>
        <p>Evaluate a 600 mm mirror on the invented demo corner (a driveway onto a 30 km/h street, a corner house
        hiding the traffic from the west), from a clone of the repository:</p>
        <pre><code>curl -s -X POST http://localhost:5180/v1/evaluations \
          -H 'Content-Type: application/json' \
          -d @openapi/examples/demo-corner-local.json</code></pre>
        <p>Add <code>-H 'Accept: application/geo+json'</code> for the same evaluation as GIS layers. The demo request
        itself is in the <a href="/swagger">Swagger UI</a> as an example, ready to send.</p>
        </body>
        </html>
        """;
}
