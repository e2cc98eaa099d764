using SafetyMirror.Core.Design;
using SafetyMirror.Core.Design.Evaluation;
using SafetyMirror.Core.Design.Recommendation;
using SafetyMirror.Reports.Documents;
using static System.FormattableString;

namespace SafetyMirror.Reports.Justification;

/// <summary>The tabular sections: per approach, installation, checks and alternatives, method and sign-off.</summary>
public sealed partial class JustificationReport
{
    /// <summary>The code of the caution that says a result is not an approval; the report says so in its own closing words instead.</summary>
    private const string NotAnApproval = "not-an-approval";

    private static readonly double[] ItemValue = [2, 5];

    private void WriteApproachTables(IReportWriter writer)
    {
        writer.Heading("Sight distance by approach", 1);
        foreach (var approach in report.Approaches)
        {
            writer.Heading(approach.Title, 2);
            writer.Table(new ReportTable(["Item", "Value"], ApproachRows(approach), ItemValue));
        }
    }

    private List<IReadOnlyList<string>> ApproachRows(ReportedApproach approach)
    {
        var required = approach.Required;
        var method = required.Method;
        var rows = new List<IReadOnlyList<string>>
        {
            new[] { "Approach speed and grade", Invariant($"{units.Speed(approach.Approach.SpeedKmh)}, grade {approach.Approach.GradePercent:0.#} %") },
            new[] { "Required sight distance", units.Requirement(required) },
            new[]
            {
                "Method",
                $"{Wording.Method(method, units)}; driver's eye {units.Height(required.EyeHeightM)}, object {units.Height(required.ObjectHeightM)} above the road. Source: {Provenance.Plain(method.Source)}",
            },
            new[]
            {
                "Direct sight distance",
                approach.DirectBlockedBy is { } blocker
                    ? $"{units.Distance(approach.DirectM)}, ended by {Wording.Feature(blocker)}"
                    : $"{units.Distance(approach.DirectM)}, clear as far as the approach is drawn",
            },
        };
        if (approach.DirectMeets && approach.Mirror is { Summary: var seen })
        {
            // The stretch is the design road user's, as everywhere in the report; a smaller user may still show near the face.
            var design = report.Options.DesignRoadUser.Name.ToLowerInvariant();
            rows.Add(["Mirror", seen.ShownFromM is { } a && seen.ShownToM is { } b
                ? $"Not needed here (it shows a {design} on this approach from {units.Distance(a)} to {units.Distance(b)})"
                : $"Not needed here (it shows no {design} on this approach)"]);
        }
        else if (approach.Mirror is { Summary: var s })
        {
            var mirror = report.Mirrors.Count > 1 ? $" ({approach.MirrorLabel})" : "";
            rows.Add([$"Shown in the mirror{mirror}", s.ShownFromM is { } from && s.ShownToM is { } to
                ? $"From {units.Distance(from)} to {units.Distance(to)} from the conflict point ({report.Options.DesignRoadUser.Name.ToLowerInvariant()})"
                : "Not shown"]);
            rows.Add(["Sight distance the mirror provides", units.Distance(s.ProvidedSightDistanceM)]);
            rows.Add(["Near blind zone", BlindZone(approach, s)]);
            rows.AddRange(s.Reach.Select(r => (IReadOnlyList<string>)[$"Recognition distance, {r.RoadUser.Name.ToLowerInvariant()}", ReachText(r, approach.Required.DesignM)]));
        }

        rows.Add(["Requirement", Verdict(approach)]);
        return rows;
    }

    private string BlindZone(ReportedApproach approach, ApproachSummary s)
    {
        if (s.ShownFromM is not { } from)
        {
            return "The whole approach (the mirror shows none of it)";
        }

        var zone = units.Distance(s.NearBlindZoneM);
        return from <= approach.DirectM
            ? $"{zone} from the conflict point; the direct view covers it (to {units.Distance(approach.DirectM)})"
            : $"{zone} from the conflict point; between {units.Distance(approach.DirectM)} (end of the direct view) and {units.Distance(from)} neither the mirror nor the direct view shows the lane";
    }

    private string ReachText(RoadUserReach reach, double requiredM)
    {
        var recognised = reach.RecognisableToM is { } r ? $"Recognisable to {units.Distance(r)}" : "Recognisable nowhere";
        var detected = reach.DetectableToM is { } d ? $"detectable to {units.Distance(d)}" : "detectable nowhere";
        var shortfall = (reach.RecognisableToM ?? 0) < requiredM ? $" (short of the {units.Distance(requiredM)} required)" : "";
        return $"{recognised}, {detected}{shortfall}";
    }

    private string Verdict(ReportedApproach approach)
    {
        var required = units.Distance(approach.Required.DesignM);
        if (approach.DirectMeets)
        {
            return $"Met by the direct view ({units.Distance(approach.DirectM)} against {required})";
        }

        if (approach.Mirror is not { Summary: var s })
        {
            return $"Not met: the direct view gives {units.Distance(approach.DirectM)} against {required} and no mirror serves it";
        }

        var recognised = s.Reach[0].RecognisableToM is { } r ? units.Distance(r) : "nowhere";
        var figures = $"shown to {units.Distance(s.ProvidedSightDistanceM)}, {report.Options.DesignRoadUser.Name.ToLowerInvariant()} recognisable to {recognised}, against {required}";
        var gap = s.ShownFromM is { } from && from > approach.DirectM
            ? $"; mind the stretch from {units.Distance(approach.DirectM)} to {units.Distance(from)} that neither the direct view nor the mirror shows"
            : "";
        return (s.MeetsRequirement ? $"Met through the mirror: {figures}" : $"Not met: {figures}") + gap;
    }

    private void WriteInstallation(IReportWriter writer)
    {
        writer.Heading("Installation and check sheet", 1);
        if (report.Mirrors.Count == 0)
        {
            writer.Paragraph("No mirror is proposed: there is nothing to install.");
            return;
        }

        if (report.Recommendation is { Outcome: RecommendationOutcome.NoMirrorServes })
        {
            writer.Paragraph("No mirror is proposed for installation: the figures below are those of the best design found, for information.");
        }

        var frame = report.Plan.Frame;
        var eye = report.Plan.Eyes[report.Options.EyeIndex];
        foreach (var mirror in report.Mirrors)
        {
            var p = mirror.Placement;
            var facts = mirror.Evaluation.Mirror;
            writer.Heading($"Mirror {mirror.Label}", 2);
            writer.Table(new ReportTable(["Item", "Value"],
            [
                ["Serves", mirror.Serves.Count == 0 ? "—" : string.Join("; ", mirror.Serves.Select(i => report.Approaches[i].Title))],
                ["Catalogue entry", mirror.Type is { } type ? $"Listed size: {Provenance.Catalogue(type.Source)}" : "None: face and radius as given in the request"],
                ["Face", Wording.Face(p.Aperture)],
                ["Radius of curvature", $"{units.Height(p.RadiusM)} (convex; focal length {units.Height(p.RadiusM / 2)})"],
                ["Position of the pole (under the face centre)", Wording.Position(frame, p.XM, p.YM)],
                .. TieRows(mirror),
                ["Face centre above the ground", units.Height(p.CentreHeightM)],
                ["Lower edge above the ground", units.Height(facts.LowerEdgeHeightM)],
                ["Azimuth (direction the face looks)", Invariant($"{p.AzimuthDeg:0.0}° clockwise from {(report.Plan.Frame.CoordinateSystem.IsLocalMetres ? "plan north" : "true north")}")],
                ["Tilt of the face axis", p.TiltDownDeg >= 0 ? Invariant($"{p.TiltDownDeg:0.0}° below horizontal") : Invariant($"{-p.TiltDownDeg:0.0}° above horizontal")],
                ["Distance from the driver's eye", units.Height(facts.DistanceFromEyeM)],
                ["Driver sees the face", facts.EyeSeesMirror ? "Yes" : facts.EyeLineBlockedBy is { } blocker ? $"No: hidden by {Wording.Feature(blocker)}" : "No: the eye is behind the face"],
                ["Driver's eye point", $"{Wording.Position(frame, eye.Position.X, eye.Position.Y)}, {units.Height(eye.HeightM)} above the ground"],
                ["Backing board", BackingBoard(p.Aperture)],
            ],
            ItemValue));
            WriteAimCheck(writer, mirror);
            WriteDriversView(writer, mirror);
        }

        writer.Paragraph((frame.CoordinateSystem.IsLocalMetres
                ? "Azimuths are clockwise from the plan's north (its y axis); relate it to true north on site. "
                : "Azimuths are clockwise from true north; correct a compass for the local magnetic declination. ")
            + "After mounting, check the aim from the driver's eye point: the lane out to the required distance should appear in the face.");
        WriteInspectionRecord(writer);
    }

    private void WriteChecks(IReportWriter writer)
    {
        writer.Heading("Siting checks", 1);
        if (report.Mirrors.Count == 0)
        {
            writer.Paragraph("No mirror is proposed, so no siting check applies.");
        }

        var subheadings = report.Mirrors.Count > 1;
        foreach (var mirror in report.Mirrors)
        {
            if (subheadings)
            {
                writer.Heading($"Siting checks, mirror {mirror.Label}", 2);
            }

            writer.Table(new ReportTable(
                ["Check", "Value", "Limit", "Result", "Source"],
                [.. mirror.Evaluation.Checks.Select((c, i) => CheckRow(c, i > 0 && mirror.Evaluation.Checks[i - 1].Source == c.Source))],
                [3.2, 1.1, 1.3, 0.9, 4]));
        }
    }

    private IReadOnlyList<string> CheckRow(RuleCheck check, bool sameSourceAsAbove)
    {
        var yesNo = check.Unit.Length == 0 && check.Limit == 1;
        var value = yesNo ? Wording.YesNo(check.Value >= 1) : units.Quantity(check.Value, check.Unit);
        var limit = yesNo ? "yes" : $"{(check.Comparison == "at-most" ? "at most" : "at least")} {units.Quantity(check.Limit, check.Unit)}";
        // A yes-or-no check is shown as yes or no, so its description need not explain the number.
        var description = Wording.ForReader(yesNo ? check.Description.Replace(" (1 = yes)", "", StringComparison.Ordinal) : check.Description);
        return [description, value, limit, check.Passes ? "Pass" : "Fail", sameSourceAsAbove ? "As above" : Provenance.Plain(check.Source)];
    }

    private void WriteAlternatives(IReportWriter writer)
    {
        writer.Heading("Alternatives considered", 1);
        WriteNoMirrorOptions(writer);
        writer.Heading("Mirror designs", 2);
        if (report.Recommendation is not { Alternatives.Count: > 0 } recommendation)
        {
            writer.Paragraph(report.Recommendation is null
                ? "This report is on the mirror given in the request; no other design was searched. "
                    + Wording.ForReader(string.Join(" ", report.Mirrors.Select(m => EvaluationWording.RobustnessSentence(m.Evaluation.Robustness))))
                : "The search found no mirror design to compare.");
            return;
        }

        var tolerance = recommendation.Alternatives[0].Robustness.ToleranceDeg;
        writer.Table(new ReportTable(
            ["#", "Design", "Coverage", "Face area", Invariant($"Margin, aim off {tolerance:0.#}°"), "Unseen, worst aim", "Near blind zone", Invariant($"Meets at every aim within {tolerance:0.#}°")],
            [.. recommendation.Alternatives.Select((a, i) => (IReadOnlyList<string>)
            [
                $"{i + 1}",
                string.Join("; ", a.Mirrors.Select(m => $"{Wording.MirrorShort(m.Type.Aperture, m.Type.RadiusM)}, at {Wording.Position(report.Plan.Frame, m.Placement.XM, m.Placement.YM, withSystem: false)}, centre {units.Height(m.Placement.CentreHeightM)}")),
                Wording.Percent(a.Score.Coverage),
                Invariant($"{a.Score.FaceAreaM2:0.00} m²"),
                Invariant($"{Math.Min(a.Robustness.WorstMargin, DesignScore.MarginCap):0.00}"),
                units.Distance(a.Robustness.LongestUnseenM),
                units.Distance(a.Score.NearBlindZoneM),
                a.Robustness.Holds ? "yes" : "no",
            ])],
            [0.5, 3.6, 1.1, 1.0, 1.1, 1.1, 1.1, 1.2]));
        writer.Paragraph("Designs that meet the verdict (the requirement at every aim within the tolerance, nothing left unseen, every siting check) rank first; "
            + "among them the smaller face, then the margin at the worst aim (recognition distance over required distance, counted up to 2), then the shorter "
            + "unseen stretch and near blind zone.");
        writer.BulletList([.. recommendation.Alternatives.Select((a, i) => $"Alternative {i + 1}: {Wording.ForReader(a.Rationale)}")]);
        writer.Paragraph(Invariant($"The search tried {recommendation.Candidates.Count} pole positions and made {recommendation.Evaluations} evaluations."));

        writer.Heading("Robustness to aim error", 3);
        var first = recommendation.Alternatives[0];
        writer.Paragraph(Wording.ForReader(string.Join(" ", first.Mirrors.Select(m => EvaluationWording.RobustnessSentence(m.Evaluation.Robustness))))
            + (first.Robustness.Holds
                ? " The recommended design keeps the requirement within this tolerance; check its aim from the driver's eye point after installation, storms and impacts."
                : " The recommended design is sensitive to its aim: it does not meet the requirement at every aim within the tolerance."));
    }

    private void WriteMethod(IReportWriter writer)
    {
        writer.Heading("Method, sources and cautions", 1);
        var options = report.Options;
        writer.Heading("Method", 2);
        writer.Paragraph(
            "The plan is read in local metres (x east, y north) with each obstacle raised to its height (2.5-D). The direct sight distance is the stretch of each approach, "
            + "from the conflict point outward, over which the sightline from the driver's eye to the object height stays clear of every obstacle. For the mirror, the exact "
            + "reflection point on the spherical face is found for every road user at every station (Alhazen's problem, solved by a one-dimensional root search), so no "
            + "small-angle approximation enters: a road user is shown when its reflection lies on the face and neither leg of the light path is blocked. Its apparent height "
            + "and width are the angles at the eye between the reflections of its edges; the equivalent direct distance is the distance at which its height, seen directly, "
            + Invariant($"would look the same. The ends of every stretch are refined by bisection to {MirrorEvaluator.BoundaryToleranceM} m between samples that include where sightlines graze obstacle corners, so a thin obstacle between two stations is not missed; the field of view on the road is traced with about {options.FieldOfViewRays} rays. ")
            + Invariant($"The verdict is met only when, out to the required distance, every point of each approach is seen directly or shown and recognisable in the mirror (a stretch seen neither way is reported as unseen; up to {options.MaxUnseenStretchM} m is allowed, and gaps up to {MirrorEvaluator.NegligibleGapM} m count as none), ")
            + Invariant($"when this holds with the aim off by {options.AimToleranceDeg}° either way in azimuth and in tilt, and when every siting check passes."));
        if (units.ConversionNote is { } note)
        {
            writer.Paragraph(note);
        }

        writer.Heading("Sources", 2);
        var catalogue = report.Mirrors.Select(m => m.Type?.Source).OfType<string>().Distinct();
        writer.BulletList(
        [
            "AASHTO, A Policy on Geometric Design of Highways and Streets (the Green Book), 2011: stopping sight distance (Table 3-1) and intersection sight distance for departures from a stop (cases B1–B3).",
            $"Required sight distance used here: {Provenance.Plain(options.SightDistance.Source)}.",
            "The law of reflection and the reflection point on a sphere (Alhazen's problem): Fujimura, Hariri, Mocanu and Vuorinen, \"The Ptolemy–Alhazen problem and spherical mirror reflection\", arXiv:1706.06924.",
            Invariant($"Recognition threshold, {options.Vision.Recognition.AngleArcmin:0.##} arcmin: {Provenance.Plain(options.Vision.Recognition.Source)}."),
            Invariant($"Detection threshold, {options.Vision.Detection.AngleArcmin:0.##} arcmin: {Provenance.Plain(options.Vision.Detection.Source)}."),
            $"Siting values: {Provenance.Plain(options.Rules.Source)}.",
            .. options.RoadUsers.Select(u => $"{u.Name} dimensions: {Provenance.Plain(u.Source)}."),
            .. catalogue.Select(source => $"Mirror size and radius: {Provenance.Catalogue(source)}."),
        ]);

        writer.Heading("Assumptions and defaults used", 2);
        writer.Table(new ReportTable(["Item", "Value"], AssumptionRows(), ItemValue));

        writer.Heading("Cautions", 2);
        // The statement that this is not an approval is made once, in the closing words below, not again as a caution.
        writer.BulletList([.. report.Cautions.Where(c => c.Code != NotAnApproval).Select(c => Wording.ForReader(c.Text))]);
        writer.Paragraph("Local road authority rules and permits, and the judgement of a licensed engineer, govern. This report is decision support, not an approval.");

        // A page of its own, so that the signatures and the seal box are never split from each other.
        writer.Heading("Sign-off", 1);
        const string blank = "\n\n\n";
        writer.Table(new ReportTable(
            ["Role", "Name", "Registration (licence) no.", "Signature", "Date"],
            [["Prepared by", header.PreparedBy ?? "", "", blank, ""], ["Checked by", "", "", blank, ""], ["Approved by", "", "", blank, ""]],
            [1.3, 2.2, 1.8, 2.4, 1.2]));
        writer.Figure(SealBox(), "Space for the seal or stamp of the licensed engineer who takes responsibility for this report.");
    }

    /// <summary>An empty bordered box, 60 mm square, labelled at its top, for the engineer's seal or stamp.</summary>
    private static Graphics.Drawing SealBox()
    {
        const double sideMm = 60;
        const double insetMm = 1;
        Graphics.PointMm[] border = [new(insetMm, insetMm), new(sideMm - insetMm, insetMm), new(sideMm - insetMm, sideMm - insetMm), new(insetMm, sideMm - insetMm)];
        return new Graphics.Drawing(sideMm, sideMm,
        [
            new Graphics.Polygon(border, new Graphics.Style { StrokeWidthMm = 0.35 }),
            new Graphics.Text(new(sideMm / 2, 6), "Seal or stamp", 3.2) { Anchor = Graphics.TextAnchor.Middle, Colour = Graphics.Colour.DarkGrey },
        ])
        { Title = "Seal or stamp" };
    }

    private List<IReadOnlyList<string>> AssumptionRows()
    {
        var options = report.Options;
        var eye = report.Plan.Eyes[options.EyeIndex];
        var users = options.RoadUsers.Select((u, i) =>
            $"{u.Name}{(i == 0 ? " (design road user)" : "")}: {units.Height(u.HeightM)} high, {units.Height(u.WidthM)} wide, {units.Height(u.LengthM)} long");
        var stations = options.StationsM is { } listed
            ? "As listed in the request: " + string.Join(", ", listed.Select(units.Distance))
            : $"Every {units.Distance(options.StationSpacingM)} from the conflict point";
        return
        [
            ["Required sight distance", Wording.Method(options.SightDistance, units)],
            ["Driver's eye", $"{Wording.Feature(eye.Feature)}, {units.Height(eye.HeightM)} above the ground"],
            ["Road users checked", string.Join("; ", users)],
            ["Vision", Invariant($"Recognised at {options.Vision.Recognition.AngleArcmin:0.##} arcmin, detected at {options.Vision.Detection.AngleArcmin:0.##} arcmin, on the smaller apparent dimension")],
            ["Siting values", $"Lower edge at least {units.Height(options.Rules.MinimumLowerEdgeClearanceM)} above footway or carriageway; mirror within {units.Distance(options.Rules.MaximumEyeToMirrorDistanceM)} of the driver's eye; approach speed at most {units.Speed(options.Rules.CautionAboveSpeedKmh)}"],
            ["Stations", stations],
            ["Ground", "Level plane at the height of the road; obstacles are flat-topped at their stated height"],
            .. RecommendationAssumptions(),
        ];
    }

    private IEnumerable<IReadOnlyList<string>> RecommendationAssumptions()
    {
        if (report.RecommendationOptions is not { } options)
        {
            yield break;
        }

        yield return ["Mirrors searched", string.Join("; ", options.Catalogue.Select(t => Wording.MirrorShort(t.Aperture, t.RadiusM)))];
        yield return ["Pole heights searched", $"Face centre from {units.Height(options.MinCentreHeightM)} to {units.Height(options.MaxCentreHeightM)}"];
        yield return ["Candidate spacing", units.Distance(options.CandidateSpacingM)];
        yield return ["Aim tolerance tested", Invariant($"±{options.AimToleranceDeg:0.#}° in azimuth and tilt")];
    }
}
