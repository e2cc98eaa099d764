using SafetyMirror.Core.Site;

namespace SafetyMirror.Api.Requests;

/// <summary>Finds a plan's approach by its feature id, the way requests name approaches.</summary>
public static class ApproachIds
{
    /// <summary>The index of the one approach with this id; null with a problem recorded under <paramref name="path"/> when no
    /// approach or several have it.</summary>
    public static int? Find(SitePlan plan, string? id, string path, RequestErrors errors)
    {
        ArgumentNullException.ThrowIfNull(plan);
        ArgumentNullException.ThrowIfNull(errors);

        // A plan's ids are at most this long: a longer one cannot match, and is not echoed back.
        if (id?.Length > SitePlanLimits.Default.MaxTextLength)
        {
            errors.Add(path, $"At most {SitePlanLimits.Default.MaxTextLength} characters, as a feature id; it has {id.Length}.");
            return null;
        }

        var matches = plan.Approaches.Select((approach, index) => (approach.Feature.Id, Index: index))
            .Where(a => a.Id is not null && a.Id == (id ?? string.Empty))
            .Select(a => a.Index)
            .ToList();
        if (matches.Count == 1)
        {
            return matches[0];
        }

        var known = plan.Approaches.Select(a => a.Feature.Id).OfType<string>().Distinct().Select(i => $"\"{i}\"").ToList();
        errors.Add(path, matches.Count == 0
            ? $"No approach feature has the id \"{id}\"; the plan's approach ids are: {(known.Count == 0 ? "none (give the approach features an \"id\")" : string.Join(", ", known))}."
            : $"{matches.Count} approach features have the id \"{id}\"; give each approach its own id.");
        return null;
    }
}
