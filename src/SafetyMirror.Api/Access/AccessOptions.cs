namespace SafetyMirror.Api.Access;

/// <summary>Who may call what, bound from the "Access" configuration section.</summary>
public sealed class AccessOptions
{
    /// <summary>The configuration section these options are read from.</summary>
    public const string Section = "Access";

    /// <summary>The SQLite file that keeps the API keys' hashes; relative paths start at the content root.</summary>
    public string KeyStorePath { get; init; } = "data/api-keys.db";

    /// <summary>Whether callers on this machine (loopback, or an in-process host) may call without a key, as the local owner.</summary>
    /// <remarks>For development only: behind a proxy on the same machine without forwarded headers every caller looks local.</remarks>
    public bool AllowLoopbackWithoutKey { get; init; }

    /// <summary>Whether POST /v1/evaluations answers without a key (it stays rate-limited).</summary>
    public bool OpenEvaluations { get; init; } = true;
}
