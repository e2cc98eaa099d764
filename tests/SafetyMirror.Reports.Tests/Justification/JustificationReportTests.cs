using System.Text.RegularExpressions;
using SafetyMirror.Core.Design;
using SafetyMirror.Core.Design.Evaluation;
using SafetyMirror.Core.Design.Recommendation;
using SafetyMirror.Reports.Documents;
using SafetyMirror.Reports.Justification;

namespace SafetyMirror.Reports.Tests.Justification;

// Content of the justification report, read back from the PDF by poppler's pdftotext and from the HTML as text.
public sealed partial class JustificationReportTests(JustificationReportTests.Rendered rendered) : IClassFixture<JustificationReportTests.Rendered>
{
    /// <summary>The invented corner's reports, rendered once for the class.</summary>
    public sealed class Rendered : IDisposable
    {
        private readonly Poppler poppler = new();

        public Rendered()
        {
            EvaluationPdf = poppler.Write(JustificationReport.ForEvaluation(InventedCorner.Plan(), InventedCorner.Evaluation, InventedCorner.Header()).ToPdf(PaperSize.A4), "evaluation.pdf");
            RecommendationPdf = poppler.Write(
                JustificationReport.ForRecommendation(InventedCorner.Plan(), InventedCorner.Recommendation, new RecommendationOptions(), InventedCorner.Header()).ToPdf(PaperSize.A4),
                "recommendation.pdf");
            Evaluation = Poppler.Flow(EvaluationPdf);
            Recommendation = Poppler.Flow(RecommendationPdf);
        }

        public string EvaluationPdf { get; }

        public string RecommendationPdf { get; }

        /// <summary>The evaluation report's text, white space collapsed.</summary>
        public string Evaluation { get; }

        /// <summary>The recommendation report's text, white space collapsed.</summary>
        public string Recommendation { get; }

        /// <summary>Writes another PDF beside the first two and returns its path.</summary>
        public string Write(byte[] pdf, string name) => poppler.Write(pdf, name);

        public void Dispose() => poppler.Dispose();
    }

    private static JustificationReport EvaluationReport(string? title = null, UnitSystem units = UnitSystem.Metric) =>
        JustificationReport.ForEvaluation(InventedCorner.Plan(), InventedCorner.Evaluation, title is null ? InventedCorner.Header() : InventedCorner.Header(title), units);

    [Fact]
    public void ToPdf_Evaluation_HasTheSectionsInTheirOrder()
    {
        string[] sections =
        [
            "Summary", "Key figures", "Site plan", "Sight distance by approach", "Apparent size and apparent distance", "Installation and check sheet",
            "Siting checks", "Alternatives considered", "Method, sources and cautions", "Sources", "Assumptions and defaults used", "Cautions", "Sign-off",
        ];

        var positions = sections.Select(s => rendered.Evaluation.IndexOf(s, StringComparison.Ordinal)).ToList();

        Assert.DoesNotContain(-1, positions);
        Assert.Equal(positions.Order(), positions);
    }

    [Fact]
    public void ToPdf_Header_ShowsEveryFieldOfTheHeaderBlock()
    {
        Assert.All(
            new[] { "Invented Sorrel Mews exit: sight distance justification", "Sorrel Mews exit onto Tanner Row (invented)", "INV-2025-007", "R. Example (invented)", "2025-03-14" },
            field => Assert.Contains(field, rendered.Evaluation, StringComparison.Ordinal));
    }

    [Fact]
    public void ToPdf_Evaluation_StatesTheDecision()
    {
        Assert.Contains("Decision: the mirror meets the requirement.", rendered.Evaluation, StringComparison.Ordinal);
    }

    [Fact]
    public void ToPdf_RequiredDistance_IsTheAashtoTableValueWithItsMethod()
    {
        // AASHTO Green Book 2011, Table 3-1: 30 km/h needs 35 m of stopping sight distance (2.5 s, 3.4 m/s²).
        Assert.Contains("Required sight distance 35 m", rendered.Evaluation, StringComparison.Ordinal);
        Assert.Contains("reaction time 2.5 s, deceleration 3.4 m/s²", rendered.Evaluation, StringComparison.Ordinal);
    }

    [Fact]
    public void ToPdf_ApproachTable_ShowsTheEvaluationsFigures()
    {
        var east = InventedCorner.Evaluation.Approaches[0];

        Assert.Contains($"Direct sight distance {east.DirectSightDistanceM:0.#} m, ended by house (No. 2 Tanner Row (corner house))", rendered.Evaluation, StringComparison.Ordinal);
        Assert.Contains($"Shown in the mirror From {east.Summary.ShownFromM:0.#} m to {east.Summary.ShownToM:0.#} m", rendered.Evaluation, StringComparison.Ordinal);
        Assert.Contains($"Recognisable to {east.Summary.Reach[0].RecognisableToM:0.#} m", rendered.Evaluation, StringComparison.Ordinal);
    }

    [Fact]
    public void ToPdf_InstallationSheet_GivesPositionHeightsAndAimToATenthOfADegree()
    {
        var lowerEdge = InventedCorner.Evaluation.Mirror.LowerEdgeHeightM;

        Assert.Contains("x 6.00 m, y 7.50 m (plan coordinates, local metres)", rendered.Evaluation, StringComparison.Ordinal);
        Assert.Contains("Face centre above the ground 2.95 m", rendered.Evaluation, StringComparison.Ordinal);
        Assert.Contains($"Lower edge above the ground {lowerEdge:0.00} m", rendered.Evaluation, StringComparison.Ordinal);
        Assert.Contains("231.0° clockwise from plan north", rendered.Evaluation, StringComparison.Ordinal);
        Assert.Contains("5.0° below horizontal", rendered.Evaluation, StringComparison.Ordinal);
        Assert.Contains("800 mm round face", rendered.Evaluation, StringComparison.Ordinal);
        Assert.Contains("Catalogue entry Listed size: usual sizes", rendered.Evaluation, StringComparison.Ordinal);
    }

    [Fact]
    public void ToPdf_SitingChecks_ListValueLimitResultAndSource()
    {
        // France IISR Art. 14 (amended 1981): lower edge above 2.30 m, stop line to mirror under 15 m, 50 km/h at most.
        Assert.Contains("at least 2.30 m Pass France, IISR Art. 14", rendered.Evaluation, StringComparison.Ordinal);
        Assert.Contains("at most 50 km/h", rendered.Evaluation, StringComparison.Ordinal);
    }

    [Fact]
    public void ToPdf_Plan_LabelsObstacleHeightsAndTheRequiredDistance()
    {
        Assert.Contains("h 6.00 m", rendered.Evaluation, StringComparison.Ordinal);
        Assert.Contains("h 0.80 m", rendered.Evaluation, StringComparison.Ordinal);
        Assert.Contains("Required 35 m", rendered.Evaluation, StringComparison.Ordinal);
        Assert.Matches(ScaleRatio(), rendered.Evaluation);
    }

    [Fact]
    public void ToPdf_Charts_MarkTheThresholdsFromTheirSources()
    {
        // 10 arcmin: EU Directive 2006/126/EC Annex III (acuity 0.5); 3 arcmin: FMVSS 111 S9.4.
        Assert.Contains("Recognition 10 arcmin", rendered.Evaluation, StringComparison.Ordinal);
        Assert.Contains("Detection 3 arcmin", rendered.Evaluation, StringComparison.Ordinal);
        Assert.Contains("equivalent direct distance (how far away it looks)", rendered.Evaluation, StringComparison.Ordinal);
    }

    [Fact]
    public void ToPdf_Sources_NameThePublishedMethods()
    {
        Assert.All(
            new[] { "Green Book", "Table 3-1", "B1–B3", "Alhazen's problem", "arXiv:1706.06924", "2006/126/EC, Annex III", "FMVSS 111, S9.4", "IISR Art. 14" },
            source => Assert.Contains(source, rendered.Evaluation, StringComparison.Ordinal));
    }

    [Fact]
    public void ToPdf_Cautions_AreEveryCautionOfTheEvaluationAndDeferToLocalRules()
    {
        var text = Poppler.Flow(rendered.EvaluationPdf);

        // Every word of every caution is printed (the not-an-approval one only once, in the closing words: see the
        // NotAnApproval tests); only the provenance tags between the words are reworded for the reader.
        var words = InventedCorner.Evaluation.Cautions.Where(c => c.Code != "not-an-approval").SelectMany(c => ProvenanceTag().Split(c.Text));
        Assert.All(words, w => Assert.Contains(w, text, StringComparison.Ordinal));
        Assert.Contains("licensed engineer, govern", text, StringComparison.Ordinal);
    }

    [Fact]
    public void ToPdf_NotAnApproval_IsStatedExactlyOnceBeforeTheSignOff()
    {
        var statements = NotAnApprovalStatement().Matches(rendered.Evaluation);

        Assert.Single(statements);
        Assert.InRange(statements[0].Index, rendered.Evaluation.LastIndexOf("Cautions", StringComparison.Ordinal), rendered.Evaluation.LastIndexOf("Sign-off", StringComparison.Ordinal));
    }

    [Fact]
    public void ToPdf_RecommendationNotAnApproval_IsStatedExactlyOnce()
    {
        Assert.Single(NotAnApprovalStatement().Matches(rendered.Recommendation));
    }

    [Fact]
    public void ToHtml_NotAnApproval_IsStatedExactlyOnce()
    {
        var html = EvaluationReport().ToHtml(PaperSize.A4);

        Assert.Single(NotAnApprovalStatement().Matches(html));
    }

    [Fact]
    public void ToPdf_SignOff_HasPreparedCheckedAndApprovedLines()
    {
        var signOff = rendered.Evaluation[rendered.Evaluation.LastIndexOf("Sign-off", StringComparison.Ordinal)..];

        Assert.Contains("Prepared by R. Example (invented)", signOff, StringComparison.Ordinal);
        Assert.Contains("Signature", signOff, StringComparison.Ordinal);
        Assert.Contains("Checked by", signOff, StringComparison.Ordinal);
        Assert.Contains("Approved by", signOff, StringComparison.Ordinal);
    }

    [Fact]
    public void ToPdf_SignOff_HasARegistrationNumberColumn()
    {
        var signOff = rendered.Evaluation[rendered.Evaluation.LastIndexOf("Sign-off", StringComparison.Ordinal)..];

        Assert.Contains("Registration (licence) no.", signOff, StringComparison.Ordinal);
    }

    [Fact]
    public void ToPdf_SignOff_LeavesABoxForTheSealOrStamp()
    {
        var signOff = rendered.Evaluation[rendered.Evaluation.LastIndexOf("Sign-off", StringComparison.Ordinal)..];

        Assert.Contains("Seal or stamp", signOff, StringComparison.Ordinal);
    }

    [Fact]
    public void ToHtml_SignOff_HasTheRegistrationNumberAndTheSealBox()
    {
        var html = EvaluationReport().ToHtml(PaperSize.A4);
        var signOff = html[html.LastIndexOf("<h1>Sign-off</h1>", StringComparison.Ordinal)..];

        Assert.Contains("<th>Registration (licence) no.</th>", signOff, StringComparison.Ordinal);
        Assert.Contains("<title>Seal or stamp</title>", signOff, StringComparison.Ordinal);
        Assert.Contains(">Seal or stamp</text>", signOff, StringComparison.Ordinal);
    }

    [Theory]
    // A4 is 210 x 297 mm (ISO 216), 595 x 842 pt; Letter is 8.5 x 11 in (ANSI/ASME Y14.1), 612 x 792 pt.
    [InlineData(PaperSize.A4, "595 x 842 pts (A4)")]
    [InlineData(PaperSize.Letter, "612 x 792 pts (letter)")]
    public void ToPdf_Paper_GivesThePageSizeOnEveryPage(PaperSize paper, string expected)
    {
        var pdf = rendered.Write(EvaluationReport().ToPdf(paper), $"paper-{paper}.pdf");

        var info = Poppler.Info(pdf);
        Assert.Contains($"Page size:       {expected}", info, StringComparison.Ordinal);
        Assert.Contains("Title:           Invented Sorrel Mews exit", info, StringComparison.Ordinal);
    }

    [Fact]
    public void ToPdf_Imperial_ShowsFeetAndMph()
    {
        var text = Poppler.Flow(rendered.Write(EvaluationReport(units: UnitSystem.Imperial).ToPdf(PaperSize.Letter), "imperial.pdf"));

        // 1 ft = 0.3048 m and 1 mph = 1.609344 km/h exactly: 35 m is 114.8 ft, 30 km/h is 18.6 mph, 2.95 m is 9.7 ft.
        Assert.Contains("Required sight distance 115 ft", text, StringComparison.Ordinal);
        Assert.Contains("18.6 mph", text, StringComparison.Ordinal);
        Assert.Contains("Face centre above the ground 9.7 ft", text, StringComparison.Ordinal);
        Assert.Contains("Distance from conflict point (ft)", text, StringComparison.Ordinal);
        Assert.DoesNotContain("km/h,", text, StringComparison.Ordinal);
    }

    [Fact]
    public void ToHtml_ImperialWithUsCustomaryRequirement_PrintsTheCustomaryTableValue()
    {
        var customary = new EvaluationOptions { SightDistance = StoppingSightDistance.UsCustomary() };
        var evaluation = MirrorEvaluator.Evaluate(InventedCorner.Plan(), InventedCorner.Mirror, customary).Evaluation!;

        var html = System.Net.WebUtility.HtmlDecode(
            JustificationReport.ForEvaluation(InventedCorner.Plan(), evaluation, InventedCorner.Header(), UnitSystem.Imperial).ToHtml(PaperSize.Letter));

        // AASHTO Green Book 2011, Eq. 3-2, US customary [memory], by hand at 30 km/h = 18.641 mph:
        // 1.47·18.641·2.5 + 1.075·18.641²/11.2 = 68.51 + 33.35 = 101.9 ft, rounded up to the next 5 ft as Table 3-1 does: 105 ft.
        Assert.Contains("105 ft (AASHTO 2011, US customary, Table 3-1; computed 101.9 ft; 1.47·V·t + 1.075·V²/a)", html, StringComparison.Ordinal);
    }

    [Fact]
    public void ToHtml_TitleWithScript_IsEscapedEverywhere()
    {
        var html = EvaluationReport("Corner <script>alert(1)</script> & co").ToHtml(PaperSize.A4);

        Assert.DoesNotContain("<script", html, StringComparison.OrdinalIgnoreCase);
        Assert.Contains("Corner &lt;script&gt;alert(1)&lt;/script&gt; &amp; co", html, StringComparison.Ordinal);
    }

    [Fact]
    public void ToHtml_Evaluation_DrawsBothPlansAndChartsOnlyTheApproachTheMirrorServes()
    {
        var html = EvaluationReport().ToHtml(PaperSize.A4);

        // Whole plan and detail, then the two charts of eastbound, the lane the mirror serves. Westbound needs no mirror:
        // the face aimed south-west catches its near end, but charting that would suggest the mirror matters there.
        Assert.True(SvgElement().Matches(html).Count >= 4);
        Assert.Contains("Tanner Row westbound (B) is not charted: it needs no mirror", html, StringComparison.Ordinal);
    }

    [Fact]
    public void ToPdf_Recommendation_StatesTheDecisionAlternativesAndRobustness()
    {
        Assert.Equal(RecommendationOutcome.OneMirror, InventedCorner.Recommendation.Outcome);
        Assert.Contains("Decision: a mirror is recommended.", rendered.Recommendation, StringComparison.Ordinal);
        Assert.Contains("Measures to consider first", rendered.Recommendation, StringComparison.Ordinal);
        Assert.Contains("Alternatives considered", rendered.Recommendation, StringComparison.Ordinal);
        Assert.Contains("Robustness to aim error", rendered.Recommendation, StringComparison.Ordinal);
        // 800 mm wide, 600 mm high, R 3.0 m: usual sizes in a Japanese road-mirror industry size table [memory, common practice];
        // the id gives the sides the other way round, the report writes width × height.
        Assert.Contains("800 × 600 mm, R 3.0 m, at", rendered.Recommendation, StringComparison.Ordinal);
    }

    [Fact]
    public void ToPdf_Recommendation_GivesTheChosenAimToATenthOfADegree()
    {
        var placement = InventedCorner.Recommendation.Alternatives[0].Mirrors[0].Placement;

        Assert.Contains($"{placement.AzimuthDeg:0.0}° clockwise from plan north", rendered.Recommendation, StringComparison.Ordinal);
        Assert.Contains($"{placement.TiltDownDeg:0.0}° below horizontal", rendered.Recommendation, StringComparison.Ordinal);
    }

    [Fact]
    public void ToPdf_OpenCorner_SaysNoMirrorIsNeeded()
    {
        var plan = InventedCorner.Plan(withHouse: false);
        var options = new RecommendationOptions();
        var recommendation = MirrorRecommender.Recommend(plan, options).Recommendation!;

        var text = Poppler.Flow(rendered.Write(JustificationReport.ForRecommendation(plan, recommendation, options, InventedCorner.Header()).ToPdf(PaperSize.A4), "open.pdf"));

        Assert.Contains("Decision: no mirror is needed.", text, StringComparison.Ordinal);
        Assert.Contains("No mirror is proposed: there is nothing to install.", text, StringComparison.Ordinal);
        Assert.Contains(Cautions.For(SitingRules.Default, [RoadUsers.PassengerCar])[0].Text, text, StringComparison.Ordinal);
    }

    [Fact]
    public void ToPdf_UnreachableThreshold_SaysAMirrorCannotServe()
    {
        // A recognition threshold of a whole degree: no catalogue mirror shows a car that large 35 m away.
        var options = new RecommendationOptions
        {
            Evaluation = new EvaluationOptions { Vision = new VisionCriteria(new VisualThreshold(60, "invented for the test"), VisionCriteria.Default.Detection) },
        };
        var recommendation = MirrorRecommender.Recommend(InventedCorner.Plan(), options).Recommendation!;

        var text = Poppler.Flow(rendered.Write(JustificationReport.ForRecommendation(InventedCorner.Plan(), recommendation, options, InventedCorner.Header()).ToPdf(PaperSize.A4), "none.pdf"));

        Assert.Equal(RecommendationOutcome.NoMirrorServes, recommendation.Outcome);
        Assert.Contains("Decision: a mirror cannot serve this corner.", text, StringComparison.Ordinal);
        Assert.Contains("not for installation", text, StringComparison.Ordinal);
    }

    [Fact]
    public void ToPdf_BothDirectionsHidden_GivesAnInstallationSheetPerMirror()
    {
        var plan = InventedCorner.Plan(eastHouse: true);
        var options = new RecommendationOptions();
        var recommendation = MirrorRecommender.Recommend(plan, options).Recommendation!;

        var text = Poppler.Flow(rendered.Write(JustificationReport.ForRecommendation(plan, recommendation, options, InventedCorner.Header()).ToPdf(PaperSize.A4), "two.pdf"));

        Assert.Equal(RecommendationOutcome.TwoMirrors, recommendation.Outcome);
        Assert.Contains("Decision: two mirrors are recommended.", text, StringComparison.Ordinal);
        Assert.Contains("Mirror M1", text, StringComparison.Ordinal);
        Assert.Contains("Mirror M2", text, StringComparison.Ordinal);
        Assert.Contains("Siting checks, mirror M2", text, StringComparison.Ordinal);
    }

    [GeneratedRegex(@"at 1:\d+ \(true scale when printed at 100 %\)")]
    private static partial Regex ScaleRatio();

    [Fact]
    public void ToPdf_TableHeaders_NeverBreakAWordAcrossLines()
    {
        // A header word split over two lines ("Coverag" / "e") reads as a typo in a legal document (common practice).
        var lines = rendered.Recommendation.Split('\n').Select(l => l.Trim()).ToList();

        Assert.Contains("Coverage", rendered.Recommendation, StringComparison.Ordinal);
        Assert.DoesNotContain("Coverag", lines);
    }

    [GeneratedRegex("<svg ")]
    private static partial Regex SvgElement();

    // Both wordings the report and the Core have used for it.
    [GeneratedRegex("not (an )?approval", RegexOptions.IgnoreCase)]
    private static partial Regex NotAnApprovalStatement();

    [GeneratedRegex(@"\s*\[memory[^\]]*\]")]
    private static partial Regex ProvenanceTag();
}
