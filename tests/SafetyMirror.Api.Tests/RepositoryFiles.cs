namespace SafetyMirror.Api.Tests;

/// <summary>Files of the repository the tests were built from, found upwards from the test binaries.</summary>
internal static class RepositoryFiles
{
    /// <summary>The directory that holds SafetyMirror.sln.</summary>
    public static string Root { get; } = Locate();

    /// <summary>The full path of a file named relative to the repository root.</summary>
    public static string PathOf(params string[] parts) => Path.Combine([Root, .. parts]);

    private static string Locate()
    {
        for (var directory = new DirectoryInfo(AppContext.BaseDirectory); directory is not null; directory = directory.Parent)
        {
            if (File.Exists(Path.Combine(directory.FullName, "SafetyMirror.sln")))
            {
                return directory.FullName;
            }
        }

        throw new DirectoryNotFoundException($"No SafetyMirror.sln above {AppContext.BaseDirectory}.");
    }
}
