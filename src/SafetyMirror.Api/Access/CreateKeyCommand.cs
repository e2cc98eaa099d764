namespace SafetyMirror.Api.Access;

/// <summary>The command line that issues an API key: <c>create-key --owner "Name"</c> prints the key once and keeps only its hash.</summary>
public static class CreateKeyCommand
{
    /// <summary>The command's name, the first argument.</summary>
    public const string Name = "create-key";

    /// <summary>The longest owner name accepted.</summary>
    public const int MaxOwnerLength = 200;

    /// <summary>Whether the arguments ask for this command rather than the web service.</summary>
    public static bool IsRequested(string[] args) => args.Length > 0 && args[0] == Name;

    /// <summary>Issues a key for the owner given with --owner, stores its hash and prints it; returns the process exit code.</summary>
    public static async Task<int> RunAsync(string[] args, IServiceProvider services, TextWriter output, TextWriter errors)
    {
        var at = Array.IndexOf(args, "--owner");
        var owner = at >= 0 && at + 1 < args.Length ? args[at + 1].Trim() : string.Empty;
        if (owner.Length is 0 or > MaxOwnerLength || owner.Any(char.IsControl))
        {
            await errors.WriteLineAsync($"Usage: {Name} --owner \"Name of the person or office\" (1 to {MaxOwnerLength} printable characters).");
            return 2;
        }

        var (key, stored) = ApiKeys.Issue(owner, services.GetRequiredService<TimeProvider>().GetUtcNow());
        await services.GetRequiredService<IApiKeyStore>().AddAsync(stored, CancellationToken.None);
        await output.WriteLineAsync($"API key {stored.Id} issued to \"{owner}\". It is shown only now; the service keeps only its hash:");
        await output.WriteLineAsync(key);
        return 0;
    }
}
