namespace SafetyMirror.Api.Tests.OpenApi;

/// <summary>Where the committed OpenAPI document lives, and how two versions of it are compared.</summary>
internal static class CommittedDocument
{
    /// <summary>openapi/openapi.json beside SafetyMirror.sln, found upwards from the test binaries.</summary>
    public static string Path { get; } = RepositoryFiles.PathOf("openapi", "openapi.json");

    /// <summary>Unix line ends and one final newline, as .editorconfig asks of every file.</summary>
    public static string Normalise(string text) => text.ReplaceLineEndings("\n").TrimEnd('\n') + "\n";

    /// <summary>Says on which line two texts first differ, for the failure message.</summary>
    public static string FirstDifference(string expected, string actual)
    {
        var expectedLines = expected.Split('\n');
        var actualLines = actual.Split('\n');
        for (var i = 0; i < Math.Max(expectedLines.Length, actualLines.Length); i++)
        {
            var committedLine = i < expectedLines.Length ? expectedLines[i].Trim() : "(end of file)";
            var servedLine = i < actualLines.Length ? actualLines[i].Trim() : "(end of document)";
            if (committedLine != servedLine)
            {
                return $"from line {i + 1} (committed: {committedLine} | served: {servedLine})";
            }
        }

        return "in white space only";
    }
}
