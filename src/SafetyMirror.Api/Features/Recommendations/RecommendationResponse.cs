using NetTopologySuite.Geometries;
using SafetyMirror.Api.Features.Evaluations;

namespace SafetyMirror.Api.Features.Recommendations;

/// <summary>A catalogue entry as the search used it.</summary>
/// <param name="Id">Stable kebab-case id.</param>
/// <param name="Face">The face as an engineer says it, a rectangle width × height: "600 mm round mirror (R 2.2 m)", "600 × 450 mm mirror (R 2.2 m)".</param>
/// <param name="DiameterM">Round face diameter, or null.</param>
/// <param name="WidthM">Rectangular face width (horizontal), or null.</param>
/// <param name="HeightM">Rectangular face height, or null.</param>
/// <param name="RadiusM">Radius of curvature.</param>
/// <param name="FaceAreaM2">Face area.</param>
/// <param name="Source">Where size and radius come from.</param>
public sealed record CatalogueEntryResponse(
    string Id, string Face, double? DiameterM, double? WidthM, double? HeightM, double RadiusM, double FaceAreaM2, string Source);

/// <summary>One mirror of a design.</summary>
/// <param name="CatalogueId">The catalogue entry it is.</param>
/// <param name="ServedApproaches">The approaches this mirror is for.</param>
/// <param name="Evaluation">Its full evaluation on the corner, in the shape <c>POST /v1/evaluations</c> answers.</param>
public sealed record DesignMirrorResponse(string CatalogueId, IReadOnlyList<FeatureRefResponse> ServedApproaches, EvaluationResponse Evaluation);

/// <summary>The terms a design is ranked by, in ranking order, all from its full evaluations.</summary>
/// <param name="Standing">0: meets the verdict (the requirement at every aim within the tolerance, nothing unseen, every siting check);
/// 1: what it shows would do but a siting check fails; 2: what it shows falls short.</param>
/// <param name="Coverage">Smallest over the served approaches and decisive road users of the fraction of the required distance provided at the aim as set (1 = met).</param>
/// <param name="FaceAreaM2">Total face area: smaller ranks higher among designs of equal standing.</param>
/// <param name="Margin">Smallest recognition distance ÷ required distance over the aims within the tolerance (above 2 it no longer counts).</param>
/// <param name="UnseenM">Longest unseen stretch over the aims within the tolerance.</param>
/// <param name="NearBlindZoneM">Longest near blind zone over the served approaches.</param>
/// <param name="Robustness">Worst coverage over the aims within the tolerance.</param>
public sealed record ScoreResponse(int Standing, double Coverage, double FaceAreaM2, double Margin, double UnseenM, double NearBlindZoneM, double Robustness);

/// <summary>How a design holds up when the aim is off.</summary>
/// <param name="ToleranceDeg">Aim error tried, in azimuth and in tilt.</param>
/// <param name="Holds">The requirement holds at every aim tried.</param>
/// <param name="WorstMargin">Smallest recognition distance ÷ required distance over the aims tried (capped at 2).</param>
/// <param name="WorstCoverage">The same, capped at 1.</param>
/// <param name="LongestUnseenM">Longest unseen stretch over the aims tried, metres.</param>
public sealed record DesignRobustnessResponse(double ToleranceDeg, bool Holds, double WorstMargin, double WorstCoverage, double LongestUnseenM);

/// <summary>One ranked design: one mirror, or two.</summary>
/// <param name="Rank">1 for the best.</param>
/// <param name="MeetsRequirement">Every served approach is covered out to its required distance.</param>
/// <param name="Mirrors">Its mirrors.</param>
/// <param name="Score">The objective terms.</param>
/// <param name="Robustness">How it holds up under aim error.</param>
/// <param name="Rationale">Why it ranks where it does.</param>
public sealed record AlternativeResponse(
    int Rank, bool MeetsRequirement, IReadOnlyList<DesignMirrorResponse> Mirrors, ScoreResponse Score, DesignRobustnessResponse Robustness, string Rationale);

/// <summary>One mirror as the installer sets it.</summary>
/// <param name="CatalogueId">The catalogue entry to order.</param>
/// <param name="Face">The face as an engineer says it, a rectangle width × height.</param>
/// <param name="Pole">Where the pole stands (the point under the face's centre), plan coordinates.</param>
/// <param name="CentreHeightM">Height of the face's centre above the ground.</param>
/// <param name="LowerEdgeHeightM">Height of the face's lowest point.</param>
/// <param name="AzimuthDeg">Direction the face looks, clockwise from north, to 0.1°.</param>
/// <param name="TiltDownDeg">Downward tilt of the axis, to 0.1°.</param>
/// <param name="DiameterM">Round face diameter, or null.</param>
/// <param name="WidthM">Rectangular face width (horizontal), or null.</param>
/// <param name="HeightM">Rectangular face height, or null.</param>
/// <param name="RadiusM">Radius of curvature.</param>
/// <param name="ServedApproaches">The approaches it is aimed for.</param>
/// <param name="Cautions">The cautions that go with it.</param>
public sealed record InstalledMirrorResponse(
    string CatalogueId,
    string Face,
    Point Pole,
    double CentreHeightM,
    double LowerEdgeHeightM,
    double AzimuthDeg,
    double TiltDownDeg,
    double? DiameterM,
    double? WidthM,
    double? HeightM,
    double RadiusM,
    IReadOnlyList<FeatureRefResponse> ServedApproaches,
    IReadOnlyList<CautionResponse> Cautions);

/// <summary>The installation sheet of the first alternative.</summary>
/// <param name="Mirrors">Each mirror to install.</param>
public sealed record InstallationSheetResponse(IReadOnlyList<InstalledMirrorResponse> Mirrors);

/// <summary>A pole position the search tried.</summary>
/// <param name="Position">The position, plan coordinates.</param>
/// <param name="Coverage">The best coverage found there.</param>
/// <param name="Stage">"coarse" (largest mirror at a few aims) or "fine" (each mirror, aim optimised).</param>
public sealed record CandidateResponse(Point Position, double Coverage, string Stage);

/// <summary>The options the recommendation used, defaults included.</summary>
/// <param name="Evaluation">How each candidate was judged.</param>
/// <param name="ServedApproaches">The approaches asked for, or null when left to the search.</param>
/// <param name="Catalogue">The mirrors that could be ordered.</param>
/// <param name="MinCentreHeightM">Lowest centre height allowed.</param>
/// <param name="MaxCentreHeightM">Highest centre height allowed.</param>
/// <param name="AimToleranceDeg">Aim error the robustness figures are tested against.</param>
/// <param name="Alternatives">How many alternatives were asked for.</param>
/// <param name="CandidateSpacingM">Spacing of the pole positions of the coarse pass.</param>
public sealed record RecommendationOptionsResponse(
    OptionsResponse Evaluation,
    IReadOnlyList<FeatureRefResponse>? ServedApproaches,
    IReadOnlyList<CatalogueEntryResponse> Catalogue,
    double MinCentreHeightM,
    double MaxCentreHeightM,
    double AimToleranceDeg,
    int Alternatives,
    double CandidateSpacingM);

/// <summary>The recommended mirror design for one corner.</summary>
/// <param name="Outcome">"no-mirror-needed", "one-mirror", "two-mirrors" or "no-mirror-serves".</param>
/// <param name="Summary">The outcome in a plain sentence.</param>
/// <param name="ServedApproaches">The approaches the design had to serve.</param>
/// <param name="Alternatives">Ranked designs, best first; empty when no mirror is needed; when no mirror serves, the best achieved.</param>
/// <param name="Installation">The installation sheet of the first alternative; null unless it meets the requirement.</param>
/// <param name="MeasuresToConsider">What to do first or instead.</param>
/// <param name="Cautions">The cautions for this case.</param>
/// <param name="Candidates">Every pole position tried.</param>
/// <param name="Evaluations">How many candidate evaluations the search made.</param>
/// <param name="Options">The options used.</param>
public sealed record RecommendationResponse(
    string Outcome,
    string Summary,
    IReadOnlyList<FeatureRefResponse> ServedApproaches,
    IReadOnlyList<AlternativeResponse> Alternatives,
    InstallationSheetResponse? Installation,
    IReadOnlyList<string> MeasuresToConsider,
    IReadOnlyList<CautionResponse> Cautions,
    IReadOnlyList<CandidateResponse> Candidates,
    int Evaluations,
    RecommendationOptionsResponse Options);
