using NetTopologySuite.Features;
using SafetyMirror.Api.Features.Evaluations;
using SafetyMirror.Core.Design.Recommendation;
using SafetyMirror.Core.Site;

namespace SafetyMirror.Api.Features.Recommendations;

/// <summary>A recommendation as GIS layers: one FeatureCollection, each feature's <c>layer</c> property naming its layer.</summary>
/// <remarks>The evaluation layers of each mirror of the first alternative (with <c>mirrorIndex</c> and <c>catalogueId</c>
/// added), then a <c>candidate</c> Point for every pole position tried, in the plan's coordinates. When no mirror is
/// needed the collection holds no features.</remarks>
public static class RecommendationLayers
{
    /// <summary>The layers of a recommendation.</summary>
    public static FeatureCollection ToLayers(this Recommendation recommendation, SitePlan plan)
    {
        var layers = new FeatureCollection();
        var mirrors = recommendation.Alternatives.FirstOrDefault()?.Mirrors ?? [];
        for (var i = 0; i < mirrors.Count; i++)
        {
            foreach (var feature in mirrors[i].Evaluation.ToLayers(plan))
            {
                feature.Attributes.Add("mirrorIndex", i);
                feature.Attributes.Add("catalogueId", mirrors[i].Type.Id);
                layers.Add(feature);
            }
        }

        foreach (var candidate in recommendation.Candidates)
        {
            layers.Add(new Feature(RecommendationMapping.PlanPoint(plan, candidate.XM, candidate.YM), new AttributesTable
            {
                { "layer", "candidate" },
                { "coverage", Math.Round(candidate.Score.Coverage, 4) },
                { "stage", candidate.Stage },
            }));
        }

        return layers;
    }
}
