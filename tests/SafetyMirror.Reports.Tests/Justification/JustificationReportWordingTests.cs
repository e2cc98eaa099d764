using SafetyMirror.Core.Design.Evaluation;
using SafetyMirror.Core.Design.Recommendation;
using SafetyMirror.Core.Site;
using SafetyMirror.Reports.Documents;
using SafetyMirror.Reports.Justification;

namespace SafetyMirror.Reports.Tests.Justification;

// The report is a legal document for a road authority: it names features, sources and mirrors in a reader's words,
// never by JSON path, provenance tag or catalogue id. Read back from the PDF by poppler's pdftotext and from the HTML as text.
public sealed class JustificationReportWordingTests : IDisposable
{
    private readonly Poppler poppler = new();

    public void Dispose() => poppler.Dispose();

    public static TheoryData<string> Reports => ["evaluation", "recommendation"];

    [Theory]
    [MemberData(nameof(Reports))]
    public void ToPdf_Report_HasNoJsonPathProvenanceTagOrCatalogueId(string kind)
    {
        var text = Poppler.Flow(poppler.Write(Report(kind).ToPdf(PaperSize.A4)));

        ReaderWords.AssertPlain(text);
    }

    [Theory]
    [MemberData(nameof(Reports))]
    public void ToHtml_Report_HasNoJsonPathProvenanceTagOrCatalogueId(string kind)
    {
        var text = ReaderWords.HtmlText(Report(kind).ToHtml(PaperSize.A4));

        ReaderWords.AssertPlain(text);
    }

    [Fact]
    public void ToPdf_SitingValueRecalledFromAnEdition_AsksForTheCurrentEdition()
    {
        var text = Poppler.Flow(poppler.Write(Report("evaluation").ToPdf(PaperSize.A4)));

        // US MUTCD 2009 §2A.19, the default kerb offset, is recalled [memory]: the reader is told to check the current edition.
        Assert.Contains("urban areas (value recalled from the 2009 edition; check against the current edition)", text, StringComparison.Ordinal);
    }

    [Fact]
    public void ToPdf_CatalogueEntry_TellsTheReaderToCheckTheSupplierDataSheet()
    {
        var text = Poppler.Flow(poppler.Write(Report("evaluation").ToPdf(PaperSize.A4)));

        Assert.Contains("Catalogue entry Listed size: usual sizes in a Japanese road-mirror industry size table; paired radius (usual trade practice, not a published standard); check size and radius against the supplier's data sheet", text, StringComparison.Ordinal);
    }

    [Fact]
    public void ToPdf_ObstacleWithoutIdOrName_IsNamedByItsPlaceInThePlan()
    {
        var plan = InventedCorner.Plan();
        var hedge = plan.Obstacles[1];
        var unnamed = new SitePlan(plan.Frame, plan.Eyes, plan.Approaches, [plan.Obstacles[0], hedge with { Feature = new FeatureReference(hedge.Feature.Index) }],
            plan.MountingZones, plan.Carriageways, plan.Footways);
        var evaluation = MirrorEvaluator.Evaluate(unnamed, InventedCorner.Mirror, new EvaluationOptions()).Evaluation!;

        var text = Poppler.Flow(poppler.Write(JustificationReport.ForEvaluation(unnamed, evaluation, InventedCorner.Header()).ToPdf(PaperSize.A4)));

        Assert.Contains($"unnamed obstacle, feature {hedge.Feature.Index + 1} of the plan", text, StringComparison.Ordinal);
    }

    [Fact]
    public void ToPdf_MeasureNamingAnUnnamedBlocker_NamesItByItsPlaceInThePlan()
    {
        var plan = InventedCorner.Plan();
        var house = plan.Obstacles[0];
        var unnamed = new SitePlan(plan.Frame, plan.Eyes, plan.Approaches, [house with { Feature = new FeatureReference(house.Feature.Index) }, plan.Obstacles[1]],
            plan.MountingZones, plan.Carriageways, plan.Footways);
        var options = new RecommendationOptions();
        var recommendation = MirrorRecommender.Recommend(unnamed, options).Recommendation!;

        var text = Poppler.Flow(poppler.Write(JustificationReport.ForRecommendation(unnamed, recommendation, options, InventedCorner.Header()).ToPdf(PaperSize.A4)));

        Assert.Contains($"feature {house.Feature.Index + 1} of the plan cuts the direct view", text, StringComparison.Ordinal);
    }

    private static JustificationReport Report(string kind) => kind == "evaluation"
        ? JustificationReport.ForEvaluation(InventedCorner.Plan(), InventedCorner.Evaluation, InventedCorner.Header())
        : JustificationReport.ForRecommendation(InventedCorner.Plan(), InventedCorner.Recommendation, new RecommendationOptions(), InventedCorner.Header());
}
