using SafetyMirror.Core.Design;
using SafetyMirror.Core.Design.Evaluation;
using SafetyMirror.Core.Design.Glare;
using SafetyMirror.Core.Design.Recommendation;
using SafetyMirror.Core.Optics;
using SafetyMirror.Core.Site;

namespace SafetyMirror.Core.Tests.Design.Glare;

public sealed class GlareTieBreakTests
{
    private static readonly SitePlan Plan = GlareCorner.Plan();

    // Equal on every ranking term by construction, so only glare can order them.
    private static readonly DesignScore Tied = new(0, 1, 0.126, 1.5, 0, 0, 1);

    /// <summary>A design whose face's eye ray at the vertex is reflected toward <paramref name="direction"/> (law of reflection, by construction).</summary>
    private static Alternative Design(Vec3 direction, DesignScore score)
    {
        var face = GlareCorner.AimedAt(direction);
        var placement = new MirrorPlacement(face.Vertex.X, face.Vertex.Y, face.Vertex.Z, face.AzimuthDeg, face.TiltDownDeg, face.RadiusM, face.Aperture);
        var evaluation = MirrorEvaluator.Evaluate(Plan, placement, new EvaluationOptions()).Evaluation!;
        return new Alternative([new MirrorDesign(new MirrorType("test-400", face.Aperture, face.RadiusM, "invented for the test"), placement, [0], evaluation)],
            score, new Robustness(2, true, 1.5, 1, 0), "invented for the test");
    }

    // Toward the low March afternoon sun: that design glares; aimed at the ground just in front of the pole, it cannot.
    private static Alternative Glaring(DesignScore score) => Design(GlareCorner.SunAt(GlareCorner.Afternoon), score);

    private static Alternative Quiet(DesignScore score) => Design(new Vec3(0, -0.2, -1).Normalized(), score);

    private static RecommendationOptions WithScan => new() { GlareTieBreak = new GlareScanOptions(2026) };

    [Fact]
    public void BreakTiesByGlare_TwoTiedDesigns_PutsTheOneWithFewerGlareHoursFirst()
    {
        var (glaring, quiet) = (Glaring(Tied), Quiet(Tied));
        Assert.True(GlareScanner.Scan(Plan, glaring.Mirrors[0].Placement.ToMirror(), new GlareScanOptions(2026)).Eyes[0].HoursPerYear > 0);

        var ordered = MirrorRecommender.BreakTiesByGlare(Plan, WithScan, [glaring, quiet], default);

        Assert.Equal([quiet, glaring], ordered);
    }

    [Fact]
    public void BreakTiesByGlare_BetterRankedDesignGlares_KeepsItFirst()
    {
        var better = Glaring(Tied with { Margin = 1.8 });
        var quiet = Quiet(Tied);

        Assert.Equal([better, quiet], MirrorRecommender.BreakTiesByGlare(Plan, WithScan, [better, quiet], default));
    }

    [Fact]
    public void BreakTiesByGlare_WithoutAScan_KeepsTheSearchOrder()
    {
        var (glaring, quiet) = (Glaring(Tied), Quiet(Tied));

        Assert.Equal([glaring, quiet], MirrorRecommender.BreakTiesByGlare(Plan, new RecommendationOptions(), [glaring, quiet], default));
    }
}
