using SafetyMirror.Core.Design.Evaluation;
using SafetyMirror.Core.Design.Glare;
using SafetyMirror.Core.Design.Recommendation;
using SafetyMirror.Core.Site;
using SafetyMirror.Reports.Documents;
using static System.FormattableString;

namespace SafetyMirror.Reports.Justification;

/// <summary>The justification report for a permit file: decision, plan, figures per approach, installation, checks, method and sign-off.</summary>
/// <remarks>
/// The content is written once through <see cref="IReportWriter"/>, so the HTML page and the PDF say the same. Every
/// text from the request (header, feature names) is passed to the writers as plain text and escaped by them.
/// Sections in order: summary with the decision; site plan; sight distance per approach; charts per approach;
/// installation and check sheet; siting checks; alternatives considered (without a mirror, then the mirror designs); method,
/// sources, assumptions, cautions and sign-off.
/// </remarks>
public sealed partial class JustificationReport
{
    /// <summary>Height over width of a plan on a portrait page: 170 by 125 mm on A4, the same proportion on the other sheets.</summary>
    private const double PortraitPlanAspect = 125.0 / 170;

    /// <summary>What a landscape plan page keeps free of the plan: the section heading and a caption of several lines.</summary>
    private const double LandscapeHeadingAndCaptionMm = 45;

    private readonly ReportCase report;
    private readonly ReportHeader header;
    private readonly DisplayUnits units;

    private JustificationReport(ReportCase report, ReportHeader header, UnitSystem units)
    {
        this.report = report;
        this.header = header ?? throw new ArgumentNullException(nameof(header));
        this.units = new DisplayUnits(units);
    }

    /// <summary>The report on one mirror evaluated on a corner: does it meet the requirement, and with what figures.</summary>
    /// <remarks>With <paramref name="glare"/> (the mirror's year scan) the report has a sun glare section.</remarks>
    public static JustificationReport ForEvaluation(SitePlan plan, MirrorEvaluation evaluation, ReportHeader header, UnitSystem units = UnitSystem.Metric, GlareScan? glare = null)
    {
        ArgumentNullException.ThrowIfNull(plan);
        ArgumentNullException.ThrowIfNull(evaluation);
        return new JustificationReport(ReportCase.Of(plan, evaluation, glare), header, units);
    }

    /// <summary>The report on a recommendation: the design to install, or why none is needed or none can serve.</summary>
    /// <param name="plan">The corner the recommendation was made for.</param>
    /// <param name="recommendation">The recommendation.</param>
    /// <param name="options">The options it was made with.</param>
    /// <param name="header">The header block.</param>
    /// <param name="units">The units to show.</param>
    /// <param name="glare">With it, the recommended design's mirrors are scanned for the year's sun glare and the report has a section on it.</param>
    /// <param name="cancellationToken">Stops the glare scan.</param>
    public static JustificationReport ForRecommendation(
        SitePlan plan, Recommendation recommendation, RecommendationOptions options, ReportHeader header, UnitSystem units = UnitSystem.Metric,
        GlareScanOptions? glare = null, CancellationToken cancellationToken = default)
    {
        ArgumentNullException.ThrowIfNull(plan);
        ArgumentNullException.ThrowIfNull(recommendation);
        ArgumentNullException.ThrowIfNull(options);
        return new JustificationReport(ReportCase.Of(plan, recommendation, options, glare, cancellationToken), header, units);
    }

    /// <summary>The decision in a few words, as the summary states it.</summary>
    public string Decision => report.Recommendation?.Outcome switch
    {
        RecommendationOutcome.NoMirrorNeeded => "No mirror is needed",
        RecommendationOutcome.OneMirror => "A mirror is recommended",
        RecommendationOutcome.TwoMirrors => "Two mirrors are recommended",
        RecommendationOutcome.NoMirrorServes => "A mirror cannot serve this corner",
        RecommendationOutcome.OutsideSitingRules => "No mirror can be installed within the siting rules",
        _ => report.Mirrors[0].Evaluation.Verdict.Decision switch
        {
            Core.Design.Evaluation.Decision.MeetsRequirement => "The mirror meets the requirement",
            Core.Design.Evaluation.Decision.OutsideSitingRules => "The mirror is outside the siting rules",
            Core.Design.Evaluation.Decision.DirectViewSuffices => "No mirror is needed",
            _ => "The mirror does not meet the requirement",
        },
    };

    /// <summary>Writes the whole report, its plans sized for the layout's sheet.</summary>
    public void WriteTo(IReportWriter writer, ReportLayout layout)
    {
        ArgumentNullException.ThrowIfNull(writer);
        WriteSummary(writer);
        WritePlan(writer, layout);
        WriteApproachTables(writer);
        WriteCharts(writer);
        WriteInstallation(writer);
        WriteChecks(writer);
        WriteGlare(writer);
        WriteAlternatives(writer);
        WriteMethod(writer);
    }

    /// <summary>Writes the site plan section only, for a page that shows the plan beside its own content.</summary>
    public void WriteSitePlan(IReportWriter writer, ReportLayout layout)
    {
        ArgumentNullException.ThrowIfNull(writer);
        WritePlan(writer, layout);
    }

    /// <summary>The report as one self-contained HTML page, every page portrait.</summary>
    public string ToHtml(PaperSize paper) => ToHtml(new ReportLayout(paper));

    /// <summary>The report as one self-contained HTML page laid out as given.</summary>
    public string ToHtml(ReportLayout layout)
    {
        var html = new HtmlReportWriter(Footer, layout.Paper);
        WriteTo(html, layout);
        return html.ToHtml();
    }

    /// <summary>The report as a PDF with embedded fonts and vector figures, every page portrait.</summary>
    public byte[] ToPdf(PaperSize paper) => ToPdf(new ReportLayout(paper));

    /// <summary>The report as a PDF with embedded fonts and vector figures, laid out as given.</summary>
    public byte[] ToPdf(ReportLayout layout)
    {
        using var pdf = new PdfReportWriter(Footer, layout.Paper);
        WriteTo(pdf, layout);
        return pdf.ToBytes();
    }

    private PageFooter Footer => new(header.Title, header.Reference, header.Stamp?.ToString(), header.Date);

    private void WriteSummary(IReportWriter writer)
    {
        writer.Heading(header.Title, 1);
        string Given(string? text) => string.IsNullOrWhiteSpace(text) ? "—" : text;
        writer.Table(new ReportTable(
            ["Site", "Reference", "Requested by", "Prepared by", "Date"],
            [[Given(header.Site), Given(header.Reference), Given(header.RequestedBy), Given(header.PreparedBy), header.Date.ToString("yyyy-MM-dd", System.Globalization.CultureInfo.InvariantCulture)]],
            [3, 2, 2, 2, 1.5]));
        if (header.Stamp is { } stamp)
        {
            // The full hash here, so that a reviewer can check the stored request; the page footers carry a prefix.
            writer.Paragraph($"Rendered from stored study {stamp.StudyId}, revision {stamp.Revision}, request hash (SHA-256) {stamp.Hash}.");
        }

        writer.Heading("Summary", 2);
        writer.Heading($"Decision: {Decision.ToLowerInvariant()}.", 3);
        writer.Paragraph(Summary());
        writer.Heading("Key figures", 2);
        writer.Table(new ReportTable(
            ["Approach", "Speed", "Required", "Direct view", "Shown in mirror", "Recognised to", "Near blind zone", "Result"],
            [.. report.Approaches.Select(KeyFigures)],
            [2.2, 1.15, 1.35, 1.15, 1.7, 1.85, 1.2, 1.3]));
        writer.Paragraph($"Distances are from each approach's conflict point. Recognised to: how far out the {report.Options.DesignRoadUser.Name.ToLowerInvariant()} "
            + "(the design road user) stays large enough in the mirror to be recognised.");
        if (report.Recommendation is { } recommendation)
        {
            writer.Heading("Measures to consider first", 2);
            writer.BulletList([.. recommendation.MeasuresToConsider.Select(Wording.ForReader)]);
        }
    }

    private string Summary()
    {
        // The decision is stated in the Core's own words, the same the API answers with, so the two cannot drift.
        var wording = new WordingUnits(units.Distance, units.Speed, units.Height);
        var sentences = new List<string>
        {
            report.Recommendation is { } recommended
                ? RecommendationWording.Summary(recommended, report.RecommendationOptions!, wording)
                : EvaluationWording.Sentence(report.Mirrors[0].Evaluation, wording),
        };
        if (report.Recommendation is { Outcome: RecommendationOutcome.NoMirrorServes or RecommendationOutcome.OutsideSitingRules })
        {
            sentences.Add("The best design the search found is reported below for information, not for installation.");
        }

        sentences.AddRange(report.Mirrors.Select(MirrorSentence));
        sentences.Add(report.Recommendation?.Outcome switch
        {
            RecommendationOutcome.NoMirrorNeeded => "Keep the sight triangle clear.",
            RecommendationOutcome.NoMirrorServes => "Clear the view or lower the speed instead.",
            _ => "A mirror is a last resort: remove or lower the obstruction first where that can be done.",
        });
        return Wording.ForReader(string.Join(" ", sentences));
    }

    private IReadOnlyList<string> KeyFigures(ReportedApproach approach)
    {
        var s = approach.DirectMeets ? null : approach.Mirror?.Summary;
        var shown = s is { ShownFromM: { } from, ShownToM: { } to } ? units.Range(from, to) : s is null ? "—" : "none";
        var recognised = s is null ? "—" : s.Reach[0].RecognisableToM is { } r ? units.Distance(r) : "nowhere";
        var verdict = approach.DirectMeets ? "met directly" : s is { MeetsRequirement: true } ? "met" : "not met";
        return [approach.Title, units.Speed(approach.Approach.SpeedKmh), units.Distance(approach.Required.DesignM), units.Distance(approach.DirectM), shown, recognised,
            s is null ? "—" : units.Distance(s.NearBlindZoneM), verdict];
    }

    private string MirrorSentence(ReportedMirror mirror)
    {
        var p = mirror.Placement;
        var served = mirror.Serves.Count == 0 ? "" : " It serves " + string.Join(" and ", mirror.Serves.Select(i => report.Approaches[i].Title)) + ".";
        var prefix = report.Mirrors.Count > 1 ? $"{mirror.Label}: a" : "A";
        return $"{prefix} {Wording.Mirror(p.Aperture, p.RadiusM)} on a pole at {Wording.Position(report.Plan.Frame, p.XM, p.YM)}, face centre {units.Height(p.CentreHeightM)} "
            + $"above the ground (lower edge {units.Height(mirror.Evaluation.Mirror.LowerEdgeHeightM)}), aimed at {Aim(p)}.{served}";
    }

    private string ApproachSentence(ReportedApproach approach)
    {
        var required = units.Distance(approach.Required.DesignM);
        var direct = units.Distance(approach.DirectM);
        if (approach.DirectMeets)
        {
            return $"{approach.Title} needs no mirror: the direct view reaches {direct} against {required} required.";
        }

        if (approach.Mirror is not { } evaluated)
        {
            return $"{approach.Title}: the direct view reaches {direct} of the {required} required, and no mirror serves it.";
        }

        var s = evaluated.Summary;
        if (s.ShownFromM is not { } from || s.ShownToM is not { } to)
        {
            return $"{approach.Title}: the direct view reaches {direct} of the {required} required, and the mirror shows none of it.";
        }

        var gap = from > approach.DirectM
            ? $" Between {direct} and {units.Distance(from)} from the conflict point neither the direct view nor the mirror shows the lane."
            : "";
        return $"{approach.Title}: the direct view reaches {direct} of the {required} required; the mirror shows the lane from {units.Distance(from)} to {units.Distance(to)} "
            + $"and {Reach(s.Reach[0])} ({(s.MeetsRequirement ? "requirement met" : "requirement not met")}).{gap}";
    }

    private string Reach(RoadUserReach reach) => reach.RecognisableToM is { } to
        ? $"a {reach.RoadUser.Name.ToLowerInvariant()} stays recognisable to {units.Distance(to)}"
        : $"a {reach.RoadUser.Name.ToLowerInvariant()} is recognisable nowhere in the mirror";

    /// <summary>The aim in words; a local plan's north is the plan's y axis, not true north, and the words say which.</summary>
    private string Aim(MirrorPlacement placement) => placement.TiltDownDeg >= 0
        ? Invariant($"{placement.AzimuthDeg:0.0}° from {North} and tilted {placement.TiltDownDeg:0.0}° down")
        : Invariant($"{placement.AzimuthDeg:0.0}° from {North} and tilted {-placement.TiltDownDeg:0.0}° up");

    private string North => report.Plan.Frame.CoordinateSystem.IsLocalMetres ? "plan north" : "true north";

    /// <summary>The room a plan may take on the plan pages: the full content width, and a height that leaves the heading and caption on the page.</summary>
    private static (double WidthMm, double HeightMm) PlanArea(ReportLayout layout)
    {
        var (width, height) = Sheets.ContentMm(layout.Paper, layout.PlanPages);
        return (width, layout.PlanPagesLandscape ? height - LandscapeHeadingAndCaptionMm : width * PortraitPlanAspect);
    }

    private void WritePlan(IReportWriter writer, ReportLayout layout)
    {
        writer.Section("Site plan", layout.PlanPages);
        // The figures pick their own round scale for this area (PlanScale), so a bigger sheet gives a larger true scale, never an odd one.
        var (widthMm, heightMm) = PlanArea(layout);
        var whole = SitePlanFigure.Whole(report, units, widthMm, heightMm, labelHeights: false);
        var detail = SitePlanFigure.Detail(report, units, whole, widthMm, heightMm);
        if (detail is null)
        {
            whole = SitePlanFigure.Whole(report, units, widthMm, heightMm);
        }

        writer.Figure(whole.Drawing, SitePlanFigure.Caption(whole, report, "Plan of the corner out to the required sight distances")
            + (detail is null ? " Obstacle heights are marked h." : " Obstacle heights are marked h on the detail below and listed in the table."));
        if (detail is not null)
        {
            writer.Figure(detail.Drawing, SitePlanFigure.Caption(detail, report, "Detail of the driver's position, the mirror and the conflict points") + " Obstacle heights are marked h.");
        }

        if (report.Plan.Obstacles.Length > 0)
        {
            writer.Table(new ReportTable(
                ["Obstacle to sight", "Id in the plan", "Height"],
                [.. report.Plan.Obstacles.Select(o => (IReadOnlyList<string>)[Wording.FeatureName(o.Feature, "obstacle"), o.Feature.Id ?? "—", units.Height(o.HeightM)])],
                [4.5, 2, 1.5]));
        }
    }

    private void WriteCharts(IReportWriter writer)
    {
        writer.Heading("Apparent size and apparent distance", 1);
        // An approach the direct view already serves is not charted, even where the face happens to catch its near end: its figures would suggest the mirror matters there.
        var charted = report.Approaches.Select(a => a.DirectMeets
            ? (Approach: a, Size: null, Distance: null)
            : (Approach: a, Size: ApproachCharts.ApparentSize(a, report.Options, units), Distance: ApproachCharts.EquivalentDistance(a, report.Options, units))).ToList();
        var uncharted = charted.Where(c => c.Size is null && c.Distance is null).Select(c => NotCharted(c.Approach)).ToList();
        writer.Paragraph("What the waiting driver sees of each approach in the mirror: first how large each road user looks, against the thresholds for recognising "
            + "and for detecting it; then how far away the design road user seems, against its true distance. A convex mirror shows vehicles smaller, so they look "
            + "farther away and slower than they are." + (uncharted.Count > 0 ? " " + string.Join(" ", uncharted) : ""));
        foreach (var (approach, size, distance) in charted.Where(c => c.Size is not null || c.Distance is not null))
        {
            writer.Heading(approach.Title, 2);
            foreach (var (chart, caption) in new[] { size, distance }.OfType<(Graphics.Drawing, string)>())
            {
                writer.Figure(chart, caption);
            }
        }
    }

    private string NotCharted(ReportedApproach approach) =>
        approach.DirectMeets ? $"{approach.Title} is not charted: it needs no mirror, the direct view reaching {units.Distance(approach.DirectM)} against {units.Distance(approach.Required.DesignM)} required."
        : approach.Mirror is null ? $"{approach.Title} is not charted: no mirror serves it."
        : $"{approach.Title} is not charted: the mirror shows no part of it.";
}
