namespace SafetyMirror.Api.Service;

/// <summary>What one instance of the service does: the same program answers requests, works through batches, or both.</summary>
/// <remarks>Set by <c>Service:Role</c> (environment variable <c>Service__Role</c>): <c>all</c> (the default), <c>api</c> or <c>worker</c>.</remarks>
public enum ServiceRole
{
    /// <summary>Answers requests and works through batches: the single-machine default.</summary>
    All,

    /// <summary>Answers requests only; batches are left to worker instances.</summary>
    Api,

    /// <summary>Works through batches; answers only the health probes.</summary>
    Worker,
}

/// <summary>Reads the instance's role from configuration.</summary>
public static class ServiceRoles
{
    /// <summary>The configuration key.</summary>
    public const string Key = "Service:Role";

    /// <summary>The configured role; a value that is not a role stops the service at start-up rather than run in a role nobody chose.</summary>
    public static ServiceRole Of(IConfiguration configuration)
    {
        ArgumentNullException.ThrowIfNull(configuration);
        var value = configuration[Key];
        return string.IsNullOrWhiteSpace(value) ? ServiceRole.All
            : Enum.TryParse<ServiceRole>(value, ignoreCase: true, out var role) && Enum.IsDefined(role) && !int.TryParse(value, out _) ? role
            : throw new InvalidOperationException($"{Key} is '{value}'; it must be all, api or worker.");
    }

    /// <summary>Whether this instance answers the API's requests.</summary>
    public static bool AnswersRequests(this ServiceRole role) => role != ServiceRole.Worker;

    /// <summary>Whether this instance works through batches.</summary>
    public static bool WorksBatches(this ServiceRole role) => role != ServiceRole.Api;
}
