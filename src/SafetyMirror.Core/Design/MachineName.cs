using System.Runtime.CompilerServices;
using System.Text.RegularExpressions;

namespace SafetyMirror.Core.Design;

/// <summary>Checks for the stable kebab-case names that catalogue entries are looked up by.</summary>
internal static partial class MachineName
{
    /// <summary>Throws unless the id is lower-case letters and digits in words joined by single hyphens.</summary>
    public static string Require(string id, [CallerArgumentExpression(nameof(id))] string? name = null)
    {
        ArgumentNullException.ThrowIfNull(id, name);
        if (!KebabCase().IsMatch(id))
        {
            throw new ArgumentException($"{name} must be kebab-case (lower-case letters and digits joined by single hyphens, like \"city-bus\"); it was \"{id}\".", name);
        }

        return id;
    }

    [GeneratedRegex("^[a-z0-9]+(-[a-z0-9]+)*$")]
    private static partial Regex KebabCase();
}
