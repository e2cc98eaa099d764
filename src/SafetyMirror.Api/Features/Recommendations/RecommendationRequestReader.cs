using SafetyMirror.Api.Requests;
using SafetyMirror.Core.Design;
using SafetyMirror.Core.Design.Recommendation;
using SafetyMirror.Core.Optics;
using SafetyMirror.Core.Site;
using static System.FormattableString;

namespace SafetyMirror.Api.Features.Recommendations;

/// <summary>Turns the recommendation's options into the Core's, recording every problem under its path.</summary>
public static class RecommendationRequestReader
{
    /// <summary>The source a custom catalogue entry carries when it names none.</summary>
    public const string SetInTheRequest = "set in the request";

    /// <summary>Reads the options, defaults filled in; served approach ids are looked up in the plan when there is one.</summary>
    /// <remarks><paramref name="defaultUnits"/> are the sight distance's units when the request names none.</remarks>
    public static RecommendationOptions ReadOptions(
        RecommendationOptionsRequest? request, SitePlan? plan, RequestErrors errors, DesignUnits defaultUnits = DesignUnits.Metric)
    {
        var options = new RecommendationOptions { Evaluation = CornerRequestReader.ReadOptions(request, errors, defaultUnits) };
        if (request is null)
        {
            return options;
        }

        if (request.GlareHoursPerYearAllowed is not null)
        {
            // The search does not weigh glare: a limit it ignored would be a silently wrong recommendation.
            errors.Add("options.glareHoursPerYearAllowed", "Only checked when a mirror is given; the recommendation reports its design's glare without a limit. Leave it out, or give the mirror.");
        }

        var min = errors.Within(request.MinCentreHeightM, Ranges.MinCentreHeightM, Ranges.MaxCentreHeightM, "m", "options.minCentreHeightM", options.MinCentreHeightM);
        var max = errors.Within(request.MaxCentreHeightM, Ranges.MinCentreHeightM, Ranges.MaxCentreHeightM, "m", "options.maxCentreHeightM", options.MaxCentreHeightM);
        if (max < min)
        {
            // Name the member that was sent: a default is not the client's mistake.
            var path = request.MaxCentreHeightM is null ? "options.minCentreHeightM" : "options.maxCentreHeightM";
            errors.Add(path, $"The highest centre height ({max} m) must not be below the lowest ({min} m).");
        }

        var catalogue = ReadCatalogue(request.Catalogue, errors) ?? options.Catalogue;
        if (errors.IsEmpty)
        {
            CheckEveryFaceHangs(catalogue, options.Evaluation.Rules.MinimumLowerEdgeClearanceM, max, request, errors);
        }

        return options with
        {
            ServedApproaches = ReadServedApproaches(request.ServedApproaches, plan, errors),
            Catalogue = catalogue,
            MinCentreHeightM = min,
            MaxCentreHeightM = max,
            Alternatives = (int)errors.Within(request.Alternatives, 1, Ranges.MaxAlternatives, "alternatives", "options.alternatives", options.Alternatives),
        };
    }

    // A catalogue entry that cannot hang below the pole's highest centre height cannot be recommended.
    private static void CheckEveryFaceHangs(IReadOnlyList<MirrorType> catalogue, double clearanceM, double maxCentreHeightM,
        RecommendationOptionsRequest request, RequestErrors errors)
    {
        for (var i = 0; i < catalogue.Count; i++)
        {
            var type = catalogue[i];
            var lowestM = MirrorRecommender.LowestCentreHeightM(type, clearanceM);
            if (lowestM > maxCentreHeightM)
            {
                var path = request.Catalogue is not null && request.MaxCentreHeightM is null ? $"options.catalogue[{i}]" : "options.maxCentreHeightM";
                errors.Add(path, Invariant(
                    $"The catalogue entry \"{type.Id}\" cannot hang here: to keep its lower edge {clearanceM} m up, its centre must be at least {lowestM:0.00} m up, above the highest centre height of {maxCentreHeightM} m. Raise maxCentreHeightM or leave the entry out of the catalogue."));
            }
        }
    }

    private static List<int>? ReadServedApproaches(IReadOnlyList<string>? ids, SitePlan? plan, RequestErrors errors)
    {
        const string At = "options.servedApproaches";
        if (ids is null)
        {
            return null;
        }

        if (ids.Count == 0)
        {
            errors.Add(At, "List at least one approach id, or leave servedApproaches out to serve every approach whose direct view falls short.");
            return null;
        }

        if (plan is null)
        {
            return null;
        }

        var served = new List<int>();
        for (var i = 0; i < ids.Count; i++)
        {
            if (ApproachIds.Find(plan, ids[i], $"{At}[{i}]", errors) is { } index)
            {
                served.Add(index);
            }
        }

        return served.Count == ids.Count ? served : null;
    }

    private static List<MirrorType>? ReadCatalogue(IReadOnlyList<CatalogueEntryRequest>? request, RequestErrors errors)
    {
        var types = errors.List(request, Ranges.MaxCatalogueEntries, "options.catalogue", "mirrors", (entry, at) => ReadEntry(entry, at, errors));
        var repeated = types?.Select((type, i) => (type, i)).Where(x => types.Take(x.i).Any(t => t.Id == x.type.Id)).ToList() ?? [];
        foreach (var (type, i) in repeated)
        {
            errors.Add($"options.catalogue[{i}].id", $"The id \"{type.Id}\" is listed twice; each entry needs its own id.");
        }

        return repeated.Count == 0 ? types : null;
    }

    private static MirrorType? ReadEntry(CatalogueEntryRequest? request, string at, RequestErrors errors)
    {
        if (request is null)
        {
            errors.Add(at, "A mirror: {\"id\": \"round-800\"}, or a custom {\"id\", \"diameterM\" (or \"widthM\" and \"heightM\"), \"radiusM\"}.");
            return null;
        }

        var custom = request.DiameterM is not null || request.WidthM is not null || request.HeightM is not null || request.RadiusM is not null || request.Source is not null;
        if (!custom)
        {
            if (request.Id is not null && MirrorTypes.Find(request.Id) is { } known)
            {
                return known;
            }

            errors.Add($"{at}.id", $"Unknown catalogue entry \"{request.Id}\"; use one of: {string.Join(", ", MirrorTypes.Defaults.Select(t => t.Id))}, or give a custom entry's face and radiusM.");
            return null;
        }

        if (request.Id is null || !CornerRequestReader.IsKebab(request.Id))
        {
            errors.Add($"{at}.id", "Required for a custom entry: lower-case letters and digits joined by single hyphens, such as \"round-700\".");
        }

        var face = CornerRequestReader.ReadFace(request.DiameterM, request.WidthM, request.HeightM, at, errors);
        var radius = errors.Required(request.RadiusM, Ranges.MinRadiusM, Ranges.MaxRadiusM, "m", $"{at}.radiusM");

        // Only a radius that was sent and in range is compared with the face: a rejected one stands in as the minimum.
        if (face is not null && request.RadiusM == radius && !face.FitsOnSphereOf(radius))
        {
            errors.Add($"{at}.radiusM", $"The face must fit on the sphere: the radius of curvature ({radius} m) must exceed half the face's largest extent ({face.CircumradiusM:0.###} m).");
        }

        if (face is null || !errors.IsEmpty)
        {
            return null;
        }

        return new MirrorType(request.Id!, face, radius, string.IsNullOrWhiteSpace(request.Source) ? SetInTheRequest : request.Source);
    }
}
