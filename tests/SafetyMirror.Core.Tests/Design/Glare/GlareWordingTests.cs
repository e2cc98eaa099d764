using SafetyMirror.Core.Design.Glare;
using static SafetyMirror.Core.Tests.Design.Glare.GlareCorner;

namespace SafetyMirror.Core.Tests.Design.Glare;

public class GlareWordingTests
{
    private static readonly TimeZoneInfo Berlin = TimeZoneInfo.FindSystemTimeZoneById("Europe/Berlin");

    [Fact]
    public void Sentences_MirrorAimedAtTheMarchAfternoonSun_NameTheWorstMonthAndTheLocalClock()
    {
        var scan = GlareScanner.Scan(Plan(Berlin), AimedAt(SunAt(Afternoon)), new GlareScanOptions(2026) { DayStride = 14 });

        var sentences = GlareWording.Sentences(scan);

        Assert.Contains("the sun shows in the mirror about", sentences[0]);
        Assert.Contains("worst in", sentences[0]);
        Assert.Contains("every 14th day of 2026", sentences[1]);
        Assert.Contains("the plan's local time (Europe/Berlin)", sentences[1]);
        Assert.Equal(GlareWording.Limits, sentences[^1]);
    }

    [Fact]
    public void Sentences_PlanInLocalMetres_GiveTheReasonAlone()
    {
        var scan = GlareScanner.Scan(Evaluation.Corners.Plan(Evaluation.Corners.FromWest()), AimedAt(SunAt(Afternoon)), new GlareScanOptions(2026));

        Assert.Equal([GlareScanner.LocalPlanReason], GlareWording.Sentences(scan));
    }

    [Fact]
    public void Sentences_NoGlareAtAll_SayAtNoSampledTime()
    {
        var mirror = SafetyMirror.Core.Optics.ConvexMirror.Aimed(Vertex, 200, 30, 3, new SafetyMirror.Core.Optics.RoundAperture(0.6));
        var scan = GlareScanner.Scan(Plan(), mirror, new GlareScanOptions(2026) { DayStride = 28 });

        Assert.Contains("the sun shows in the mirror at no sampled time", GlareWording.Sentences(scan)[0]);
    }
}
