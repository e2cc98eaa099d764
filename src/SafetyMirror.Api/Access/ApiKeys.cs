using System.Diagnostics.CodeAnalysis;
using System.Security.Cryptography;
using System.Text;

namespace SafetyMirror.Api.Access;

/// <summary>An API key as the store keeps it: its public id, its owner and the SHA-256 of the whole key, never the key.</summary>
/// <param name="Id">The key's public id, also the key's first part; names the key in logs and in the owner claim set.</param>
/// <param name="Owner">Who the key was issued to; recorded on what the key creates.</param>
/// <param name="Sha256">SHA-256 of the whole key text (UTF-8).</param>
/// <param name="CreatedAt">When the key was issued.</param>
public sealed record StoredApiKey(string Id, string Owner, byte[] Sha256, DateTimeOffset CreatedAt);

/// <summary>Issues API keys and checks presented ones against their stored hash.</summary>
/// <remarks>
/// A key reads <c>smk_&lt;12 hex id&gt;_&lt;64 hex secret&gt;</c>: the id finds the stored record without searching by
/// secret, and the 256-bit secret makes a plain SHA-256 hash enough (no password stretching is needed for random keys).
/// </remarks>
public static class ApiKeys
{
    private const string Prefix = "smk_";
    private const int IdBytes = 6;
    private const int SecretBytes = 32;
    private static readonly int IdLength = IdBytes * 2;
    private static readonly int KeyLength = Prefix.Length + IdLength + 1 + SecretBytes * 2;

    /// <summary>A new random key for an owner: the text to hand over once, and the record to store.</summary>
    public static (string Key, StoredApiKey Stored) Issue(string owner, DateTimeOffset now)
    {
        var id = Convert.ToHexStringLower(RandomNumberGenerator.GetBytes(IdBytes));
        var key = $"{Prefix}{id}_{Convert.ToHexStringLower(RandomNumberGenerator.GetBytes(SecretBytes))}";
        return (key, new StoredApiKey(id, owner, Hash(key), now));
    }

    /// <summary>The id part of a well-formed key; false for text that cannot be a key of this service.</summary>
    public static bool TryReadId(string key, [NotNullWhen(true)] out string? id)
    {
        id = null;
        if (key.Length != KeyLength || !key.StartsWith(Prefix, StringComparison.Ordinal) || key[Prefix.Length + IdLength] != '_')
        {
            return false;
        }

        id = key.Substring(Prefix.Length, IdLength);
        return true;
    }

    /// <summary>Whether the presented key hashes to the stored hash, compared in constant time.</summary>
    public static bool Matches(string key, StoredApiKey stored) =>
        CryptographicOperations.FixedTimeEquals(Hash(key), stored.Sha256);

    private static byte[] Hash(string key) => SHA256.HashData(Encoding.UTF8.GetBytes(key));
}
