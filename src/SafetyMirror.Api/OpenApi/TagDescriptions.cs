using Microsoft.OpenApi;
using Swashbuckle.AspNetCore.SwaggerGen;

namespace SafetyMirror.Api.OpenApi;

/// <summary>Gives each tag of the document a sentence that says what its operations are for.</summary>
internal sealed class TagDescriptions : IDocumentFilter
{
    private static readonly Dictionary<string, string> Descriptions = new()
    {
        ["Access"] = "API keys: which owner the key a request carries acts for.",
        ["Batches"] = "Screen a whole district at once: many corners in one batch, worked through by background workers, each kept as a study, with the results as one GIS layer.",
        ["Evaluations"] = "Judge one mirror at a corner: what it shows, how large and how far away road users look, and the sight distance it restores against the distance required.",
        ["Recommendations"] = "Search the corner for where to put which mirror, how high and aimed where, ranked, with an installation sheet.",
        ["Reports"] = "The justification report for a permit file, as PDF or one HTML page.",
        ["Service"] = "Where the service starts and whether it is up.",
        ["Studies"] = "Corners kept over time: each change is a new revision with its request, answer, author and hash, and any revision can be fetched, reported or re-run.",
        ["Views"] = "What the waiting driver sees: the mirror face rendered from the eye, every pixel reflected exactly, in its surroundings, as a PNG.",
    };

    /// <summary>Sets the description of every tag that has one here; a tag without one is left for the linter to name.</summary>
    public void Apply(OpenApiDocument swaggerDoc, DocumentFilterContext context)
    {
        foreach (var tag in swaggerDoc.Tags ?? new HashSet<OpenApiTag>())
        {
            if (tag.Name is { } name && Descriptions.TryGetValue(name, out var description))
            {
                tag.Description = description;
            }
        }
    }
}
