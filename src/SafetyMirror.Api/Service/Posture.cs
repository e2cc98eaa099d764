using System.Net;
using Microsoft.AspNetCore.HttpOverrides;
using Microsoft.Net.Http.Headers;
using SafetyMirror.Api.Access;

namespace SafetyMirror.Api.Service;

/// <summary>How the service faces the network, bound from the "Posture" configuration section.</summary>
public sealed class PostureOptions
{
    /// <summary>The configuration section these options are read from.</summary>
    public const string Section = "Posture";

    /// <summary>Whether a reverse proxy forwards the requests: then the client's address and scheme come from X-Forwarded-For/-Proto.</summary>
    public bool BehindProxy { get; init; }

    /// <summary>Addresses of the proxies whose forwarded headers are believed (loopback when none are given).</summary>
    public string[] KnownProxies { get; init; } = [];

    /// <summary>Networks (CIDR, such as 10.0.0.0/8) of the proxies whose forwarded headers are believed.</summary>
    public string[] KnownNetworks { get; init; } = [];

    /// <summary>Whether plain-HTTP requests are redirected to HTTPS and HTTPS answers carry HSTS; never behind a proxy, which terminates TLS.</summary>
    public bool HttpsRedirection { get; init; } = true;

    /// <summary>Origins whose browser pages may call the API (CORS); none by default.</summary>
    public string[] CorsOrigins { get; init; } = [];

    /// <summary>Whether the OpenAPI document and Swagger UI are served.</summary>
    public bool ServeOpenApi { get; init; }
}

/// <summary>Forwarded headers, HTTPS, CORS and the security headers on every answer.</summary>
public static class Posture
{
    /// <summary>The policy of HTML pages: everything inline, nothing fetched, never framed.</summary>
    public const string HtmlPolicy = "default-src 'none'; style-src 'unsafe-inline'; img-src data:; font-src data:; frame-ancestors 'none'; base-uri 'none'; form-action 'none'";

    /// <summary>The policy of the study pages: their stylesheet and the driver's view picture from the service, inline SVG, forms posted back to
    /// the service, never framed.</summary>
    public const string PagePolicy = "default-src 'none'; style-src 'self'; img-src 'self' data:; frame-ancestors 'none'; base-uri 'none'; form-action 'self'";

    /// <summary>The policy of Swagger UI, whose scripts and styles come from the service itself.</summary>
    public const string SwaggerPolicy = "default-src 'self'; img-src 'self' data:; style-src 'self' 'unsafe-inline'; script-src 'self'; frame-ancestors 'none'; base-uri 'none'; form-action 'none'";

    /// <summary>The policy of every other answer (JSON, PDF, GeoJSON): nothing may load or frame it.</summary>
    public const string DataPolicy = "default-src 'none'; frame-ancestors 'none'";

    /// <summary>Binds <see cref="PostureOptions"/> and registers forwarded headers, HSTS, CORS and Kestrel without its Server header.</summary>
    public static WebApplicationBuilder AddPosture(this WebApplicationBuilder builder)
    {
        var posture = builder.Configuration.GetSection(PostureOptions.Section).Get<PostureOptions>() ?? new PostureOptions();
        builder.Services.AddSingleton(posture);
        builder.WebHost.ConfigureKestrel(kestrel => kestrel.AddServerHeader = false);

        builder.Services.Configure<ForwardedHeadersOptions>(options =>
        {
            options.ForwardedHeaders = ForwardedHeaders.XForwardedFor | ForwardedHeaders.XForwardedProto;
            foreach (var proxy in posture.KnownProxies)
            {
                options.KnownProxies.Add(IPAddress.Parse(proxy));
            }

            foreach (var network in posture.KnownNetworks)
            {
                options.KnownIPNetworks.Add(System.Net.IPNetwork.Parse(network));
            }
        });
        builder.Services.AddHsts(options => options.MaxAge = TimeSpan.FromDays(365));
        builder.Services.AddCors(options => options.AddDefaultPolicy(policy => policy
            .WithOrigins(posture.CorsOrigins)
            .WithMethods(HttpMethods.Get, HttpMethods.Post)
            .WithHeaders(HeaderNames.ContentType, HeaderNames.Accept, HeaderNames.Authorization, ApiKeyAuthenticationHandler.Header)
            .WithExposedHeaders(HeaderNames.RetryAfter, HeaderNames.ContentDisposition)
            .SetPreflightMaxAge(TimeSpan.FromMinutes(10))));
        return builder;
    }

    /// <summary>First in the pipeline: the client's real address and scheme, the security headers, then HTTPS.</summary>
    public static IApplicationBuilder UsePosture(this IApplicationBuilder app)
    {
        var posture = app.ApplicationServices.GetRequiredService<PostureOptions>();
        if (posture.BehindProxy)
        {
            app.UseForwardedHeaders();
        }

        app.Use((context, next) =>
        {
            context.Response.OnStarting(() =>
            {
                AddSecurityHeaders(context);
                return Task.CompletedTask;
            });
            return next(context);
        });

        if (posture.HttpsRedirection && !posture.BehindProxy)
        {
            app.UseHsts();
            app.UseHttpsRedirection();
        }

        return app;
    }

    private static void AddSecurityHeaders(HttpContext context)
    {
        var headers = context.Response.Headers;
        headers.XContentTypeOptions = "nosniff";
        headers.XFrameOptions = "DENY";
        headers["Referrer-Policy"] = "no-referrer";
        var html = context.Response.ContentType?.StartsWith("text/html", StringComparison.OrdinalIgnoreCase) == true;
        headers.ContentSecurityPolicy = !html ? DataPolicy
            : context.Request.Path.StartsWithSegments("/swagger", StringComparison.OrdinalIgnoreCase) ? SwaggerPolicy
            : context.Request.Path.StartsWithSegments("/studies", StringComparison.OrdinalIgnoreCase) ? PagePolicy
            : HtmlPolicy;
    }
}
