namespace SafetyMirror.Api.Access;

/// <summary>Where issued API keys are kept, by hash only.</summary>
/// <remarks>Small on purpose, so that the studies database can hold the keys later without the callers changing.</remarks>
public interface IApiKeyStore
{
    /// <summary>Keeps a newly issued key.</summary>
    Task AddAsync(StoredApiKey key, CancellationToken cancellationToken);

    /// <summary>The key with this id, or null when there is none.</summary>
    Task<StoredApiKey?> FindAsync(string id, CancellationToken cancellationToken);
}
