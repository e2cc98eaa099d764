using NetTopologySuite.Features;
using NetTopologySuite.Geometries;
using NetTopologySuite.LinearReferencing;
using SafetyMirror.Core.Design;
using SafetyMirror.Core.Design.Evaluation;
using SafetyMirror.Core.Optics;
using SafetyMirror.Core.Site;

namespace SafetyMirror.Api.Features.Evaluations;

/// <summary>An evaluation as GIS layers: one FeatureCollection, each feature's <c>layer</c> property naming its layer.</summary>
/// <remarks>Layers: eye, mirror (Point), field-of-view (the road seen in the mirror: the traced field of view less what obstacles
/// hide from the face's centre; Polygon or MultiPolygon, absent when nothing is seen), field-of-view-traced (the traced field of
/// view as if nothing stood in the way; Polygon), and per approach direct-view, near-blind-zone, shown-stretch, unseen-stretch
/// and sightline (LineString), each with its figures as properties, in the plan's coordinates.</remarks>
public static class EvaluationLayers
{
    private static readonly GeometryFactory Factory = new();

    /// <summary>The layers of an evaluation.</summary>
    public static FeatureCollection ToLayers(this MirrorEvaluation evaluation, SitePlan plan)
    {
        var frame = plan.Frame;
        var (decision, summary) = EvaluationMapping.Decide(evaluation);
        var placement = evaluation.Placement;
        var facts = evaluation.Mirror;
        var layers = new FeatureCollection
        {
            Layer(frame, Point(evaluation.Eye.Position), "eye", new()
            {
                ["eyeHeightM"] = evaluation.Eye.HeightM,
                ["featureIndex"] = evaluation.Eye.Feature.Index,
            }),
            Layer(frame, Point(facts.Mirror.Vertex), "mirror", new()
            {
                ["decision"] = decision,
                ["summary"] = summary,
                ["face"] = MirrorType.Describe(placement.Aperture, placement.RadiusM),
                ["centreHeightM"] = placement.CentreHeightM,
                ["lowerEdgeHeightM"] = Math.Round(facts.LowerEdgeHeightM, 3),
                ["azimuthDeg"] = placement.AzimuthDeg,
                ["tiltDownDeg"] = placement.TiltDownDeg,
                ["radiusM"] = placement.RadiusM,
                ["distanceFromEyeM"] = Math.Round(facts.DistanceFromEyeM, 3),
                ["eyeSeesMirror"] = facts.EyeSeesMirror,
                ["checksFailed"] = string.Join(", ", evaluation.Checks.Where(c => !c.Passes).Select(c => c.Code)),
                ["cautions"] = string.Join(" ", evaluation.Cautions.Select(c => c.Text)),
            }),
        };
        AddFieldOfView(layers, frame, facts);

        foreach (var approach in evaluation.Approaches)
        {
            AddApproach(layers, frame, evaluation, approach);
        }

        return layers;
    }

    /// <summary>The road seen in the mirror (the traced field of view less what obstacles hide from the mirror), and the traced
    /// field of view itself, as if nothing stood in the way.</summary>
    private static void AddFieldOfView(FeatureCollection layers, PlanFrame frame, MirrorFacts facts)
    {
        var (field, visible) = (facts.FieldOfView, facts.VisibleFieldOfView);
        if (field.Outline is not { } traced)
        {
            return;
        }

        if (visible.Outline is { } seen)
        {
            layers.Add(Layer(frame, seen, "field-of-view", new()
            {
                ["areaM2"] = Math.Round(visible.AreaM2, 1),
                ["tracedAreaM2"] = Math.Round(traced.Area, 1),
                ["viewpointHeightM"] = Math.Round(visible.ViewpointHeightM, 3),
                ["targetHeightM"] = Math.Round(visible.TargetHeightM, 3),
                ["raysTraced"] = field.RaysTraced,
                ["raysAboveHorizon"] = field.RaysUpward,
            }));
        }

        layers.Add(Layer(frame, traced, "field-of-view-traced", new()
        {
            ["areaM2"] = Math.Round(traced.Area, 1),
            ["raysTraced"] = field.RaysTraced,
            ["raysAboveHorizon"] = field.RaysUpward,
        }));
    }

    private static void AddApproach(FeatureCollection layers, PlanFrame frame, MirrorEvaluation evaluation, ApproachEvaluation approach)
    {
        var s = approach.Summary;
        var common = new Dictionary<string, object?>
        {
            ["approachIndex"] = approach.Approach.Feature.Index,
            ["approachId"] = approach.Approach.Feature.Id,
            ["approachName"] = approach.Approach.Feature.Name,
            ["requiredSightDistanceM"] = approach.Required.DesignM,
        };

        AddStretch(layers, frame, approach.Approach, 0, approach.DirectSightDistanceM, "direct-view", common, new()
        {
            ["directSightDistanceM"] = Math.Round(approach.DirectSightDistanceM, 3),
            ["meetsRequirement"] = s.DirectMeetsRequirement,
        });
        AddStretch(layers, frame, approach.Approach, 0, s.NearBlindZoneM, "near-blind-zone", common, new()
        {
            ["nearBlindZoneM"] = Math.Round(s.NearBlindZoneM, 3),
        });
        if (s.ShownFromM is { } from && s.ShownToM is { } to)
        {
            AddStretch(layers, frame, approach.Approach, from, to, "shown-stretch", common, new()
            {
                ["shownFromM"] = Math.Round(from, 3),
                ["shownToM"] = Math.Round(to, 3),
                ["providedSightDistanceM"] = Math.Round(s.ProvidedSightDistanceM, 3),
                ["recognisableToM"] = s.Reach[0].RecognisableToM is { } r ? Math.Round(r, 3) : null,
                ["meetsRequirement"] = s.MeetsRequirement,
            });
        }

        foreach (var coverage in s.Coverage)
        {
            foreach (var gap in coverage.Unseen)
            {
                AddStretch(layers, frame, approach.Approach, gap.FromM, gap.ToM, "unseen-stretch", common, new()
                {
                    ["roadUser"] = coverage.RoadUser.Id,
                    ["fromM"] = Math.Round(gap.FromM, 3),
                    ["toM"] = Math.Round(gap.ToM, 3),
                    ["seconds"] = Math.Round(gap.Seconds, 2),
                });
            }
        }

        // A few sightlines: the design road user where the shown stretch starts, at the required distance, and where it ends.
        var design = evaluation.Options.DesignRoadUser;
        var stations = new[] { s.ShownFromM, Math.Min(approach.Required.DesignM, approach.Approach.LengthM), s.ShownToM };
        foreach (var station in stations.OfType<double>().Distinct())
        {
            var target = approach.Approach.PointAtStation(station).Position with { Z = design.HeightM / 2 };
            var reflection = evaluation.Mirror.Mirror.Reflect(evaluation.Eye.Position, target);
            if (!reflection.IsFound)
            {
                continue;
            }

            var line = Factory.CreateLineString([Xy(evaluation.Eye.Position), Xy(reflection.Point), Xy(target)]);
            var view = approach.Stations.FirstOrDefault(v => v.RoadUser == design && Math.Abs(v.StationM - station) < 1e-9);
            layers.Add(Layer(frame, line, "sightline", new(common)
            {
                ["stationM"] = Math.Round(station, 3),
                ["roadUser"] = design.Id,
                ["pathLengthM"] = Math.Round(reflection.PathLengthM, 3),
                ["incidenceDeg"] = Math.Round(reflection.IncidenceDeg, 3),
                ["onFace"] = reflection.InsideAperture,
                ["apparentHeightArcmin"] = view?.ApparentHeightArcmin is { } h ? Math.Round(h, 3) : null,
            }));
        }
    }

    private static void AddStretch(
        FeatureCollection layers, PlanFrame frame, Approach approach, double fromM, double toM, string layer,
        Dictionary<string, object?> common, Dictionary<string, object?> figures)
    {
        if (toM - fromM < 1e-6)
        {
            return;
        }

        // Stations run upstream from the line's end; the line's own length index runs from its start.
        var indexed = new LengthIndexedLine(approach.Line);
        var piece = indexed.ExtractLine(approach.LengthM - toM, approach.LengthM - fromM);
        foreach (var (key, value) in common)
        {
            figures[key] = value;
        }

        layers.Add(Layer(frame, piece, layer, figures));
    }

    private static Feature Layer(PlanFrame frame, Geometry localGeometry, string layer, Dictionary<string, object?> properties)
    {
        var attributes = new AttributesTable { { "layer", layer } };
        foreach (var (key, value) in properties)
        {
            attributes.Add(key, value);
        }

        return new Feature(frame.ToPlan(localGeometry), attributes);
    }

    private static Point Point(Vec3 local) => Factory.CreatePoint(Xy(local));

    private static Coordinate Xy(Vec3 local) => new(local.X, local.Y);
}
