using System.Net;
using System.Security.Claims;
using System.Text.Encodings.Web;
using Microsoft.AspNetCore.Authentication;
using Microsoft.AspNetCore.Mvc;
using Microsoft.Extensions.Options;
using Microsoft.Net.Http.Headers;
using SafetyMirror.Api.Service;

namespace SafetyMirror.Api.Access;

/// <summary>Authenticates a caller by the API key in <c>X-Api-Key</c> or <c>Authorization: ApiKey …</c>, and answers 401 and 403 as problem details.</summary>
internal sealed class ApiKeyAuthenticationHandler(
    IOptionsMonitor<AuthenticationSchemeOptions> options,
    ILoggerFactory logger,
    UrlEncoder encoder,
    IApiKeyStore keys,
    AccessOptions access)
    : AuthenticationHandler<AuthenticationSchemeOptions>(options, logger, encoder)
{
    /// <summary>The scheme's name, also the word before the key in an Authorization header.</summary>
    public const string SchemeName = "ApiKey";

    /// <summary>The header that carries the key on its own.</summary>
    public const string Header = "X-Api-Key";

    protected override async Task<AuthenticateResult> HandleAuthenticateAsync()
    {
        if (PresentedKey() is not { } key)
        {
            return access.AllowLoopbackWithoutKey && IsLocal(Context.Connection)
                ? Success(AccessClaims.LocalOwner, keyId: null)
                : AuthenticateResult.NoResult();
        }

        if (!ApiKeys.TryReadId(key, out var id) || await keys.FindAsync(id, Context.RequestAborted) is not { } stored || !ApiKeys.Matches(key, stored))
        {
            return AuthenticateResult.Fail("The API key is not one this service issued.");
        }

        return Success(stored.Owner, stored.Id);
    }

    protected override async Task HandleChallengeAsync(AuthenticationProperties properties)
    {
        var presented = (await HandleAuthenticateOnceSafeAsync()).Failure is not null;
        Response.Headers.WWWAuthenticate = SchemeName;
        await ProblemWriter.WriteAsync(Context, new ProblemDetails
        {
            Status = StatusCodes.Status401Unauthorized,
            Title = presented ? "The API key is not valid." : "This operation needs an API key.",
            Detail = presented
                ? "The key sent is not one this service issued (or it was mistyped). Send the whole key exactly as it was given."
                : $"Send the key in the {Header} header, or as 'Authorization: {SchemeName} <key>'. The service's operator issues keys.",
        });
    }

    protected override Task HandleForbiddenAsync(AuthenticationProperties properties) =>
        ProblemWriter.WriteAsync(Context, new ProblemDetails
        {
            Status = StatusCodes.Status403Forbidden,
            Title = "This key may not do that.",
            Detail = "The API key is valid, but its owner may not use this operation or this resource.",
        });

    private string? PresentedKey()
    {
        if (Request.Headers[Header] is [{ Length: > 0 } key])
        {
            return key.Trim();
        }

        var authorization = Request.Headers[HeaderNames.Authorization].ToString();
        return authorization.StartsWith(SchemeName + " ", StringComparison.OrdinalIgnoreCase) ? authorization[(SchemeName.Length + 1)..].Trim() : null;
    }

    // An in-process host or a Unix socket has no remote address: it is on this machine too.
    private static bool IsLocal(ConnectionInfo connection) =>
        connection.RemoteIpAddress is not { } address || IPAddress.IsLoopback(address);

    private AuthenticateResult Success(string owner, string? keyId)
    {
        var claims = new List<Claim> { new(AccessClaims.Owner, owner), new(ClaimTypes.Name, owner) };
        if (keyId is not null)
        {
            claims.Add(new Claim(AccessClaims.KeyId, keyId));
        }

        var principal = new ClaimsPrincipal(new ClaimsIdentity(claims, SchemeName, ClaimTypes.Name, ClaimTypes.Role));
        return AuthenticateResult.Success(new AuthenticationTicket(principal, SchemeName));
    }
}
