using CsCheck;
using SafetyMirror.Core.Design.Recommendation;

namespace SafetyMirror.Core.Tests.Design.Recommendation;

public class DesignScoreTests
{
    // Scores crowded near one another and near the quantisation steps, where a tolerance-based tie is not transitive.
    private static readonly Gen<DesignScore> Scores =
        from standing in Gen.Int[0, 2]
        from coverage in Gen.OneOf(Gen.Const(1.0), Gen.Double[0.99995, 1.0], Gen.Double[0, 1])
        from face in Gen.OneOf(Gen.Const(0.2827), Gen.Const(0.27), Gen.Const(0.48), Gen.Const(0.5027), Gen.Const(0.7854)).SelectMany(a => Gen.Double[-2e-6, 2e-6].Select(d => a + d))
        from margin in Gen.OneOf(Gen.Double[0.999, 1.001], Gen.Double[0, 3], Gen.Const(double.NaN), Gen.Const(double.PositiveInfinity))
        from unseen in Gen.OneOf(Gen.Const(0.0), Gen.Double[0, 0.02], Gen.Double[0, 10])
        from blind in Gen.Double[0, 20]
        from robustness in Gen.OneOf(Gen.Const(double.NaN), Gen.Double[0, 1])
        select new DesignScore(standing, coverage, face, margin, unseen, blind, robustness);

    [Fact]
    public void CompareTo_AnyThreeScores_IsATotalOrder()
    {
        Gen.Select(Scores, Scores, Scores).Sample((a, b, c) =>
        {
            // Antisymmetric, and transitive in both the strict and the tied case.
            var ab = Math.Sign(a.CompareTo(b));
            var bc = Math.Sign(b.CompareTo(c));
            var ac = Math.Sign(a.CompareTo(c));
            return ab == -Math.Sign(b.CompareTo(a))
                && (ab != bc || ab == ac)
                && (ab != 0 || bc != 0 || ac == 0);
        }, iter: 20_000, seed: "0N0XIzNsQ0O2");
    }

    [Fact]
    public void Sort_ManyCrowdedScores_NeverThrows()
    {
        // The sort that once threw "IComparer.Compare() method returns inconsistent results" on a valid corner.
        Scores.Array[200, 400].Sample(scores =>
        {
            var sorted = scores.OrderByDescending(s => s).ToList();
            Array.Sort(scores);
            return sorted.Zip(sorted.Skip(1)).All(p => p.First.CompareTo(p.Second) >= 0);
        }, iter: 200, seed: "0N0XIzNsQ0O2");
    }

    [Fact]
    public void CompareTo_MeetingTheVerdict_OutranksAnySmallerFaceThatDoesNot()
    {
        var meets = new DesignScore(0, 1, 0.7854, 1.0, 0, 3, 1);
        var smaller = new DesignScore(2, 0.99, 0.2827, 2, 0, 0, 1);
        Assert.True(meets > smaller);
    }

    [Fact]
    public void CompareTo_BothMeeting_SmallerFaceFirstThenWorstCaseMargin()
    {
        var small = new DesignScore(0, 1, 0.48, 1.02, 0, 0, 1);
        var large = new DesignScore(0, 1, 0.5027, 1.3, 0, 0, 1);
        var smallWider = small with { Margin = 1.2 };
        Assert.True(small > large);
        Assert.True(smallWider > small);
    }
}
