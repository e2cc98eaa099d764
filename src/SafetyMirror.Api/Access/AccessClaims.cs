using System.Security.Claims;

namespace SafetyMirror.Api.Access;

/// <summary>The claims the service puts on an authenticated caller.</summary>
public static class AccessClaims
{
    /// <summary>Who the caller acts for: the key's owner, recorded on what the caller creates.</summary>
    public const string Owner = "owner";

    /// <summary>The id of the key the caller presented; absent for a local caller without a key.</summary>
    public const string KeyId = "key_id";

    /// <summary>The owner of a local caller without a key (Development only).</summary>
    public const string LocalOwner = "local";

    /// <summary>The caller's owner, or null for an anonymous caller.</summary>
    public static string? OwnerOf(ClaimsPrincipal user) => user.FindFirstValue(Owner);

    /// <summary>The id of the caller's key, or null when the caller presented none.</summary>
    public static string? KeyIdOf(ClaimsPrincipal user) => user.FindFirstValue(KeyId);
}
