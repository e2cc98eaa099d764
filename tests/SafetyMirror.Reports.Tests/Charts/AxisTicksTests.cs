using SafetyMirror.Reports.Charts;

namespace SafetyMirror.Reports.Tests.Charts;

public sealed class AxisTicksTests
{
    [Theory]
    // Round 1-2-5 steps as in Heckbert, "Nice numbers for graph labels", Graphics Gems (1990); values worked by hand.
    [InlineData(0, 87.3, 6, 20, 0, 100)]
    [InlineData(0, 60, 6, 10, 0, 60)]
    [InlineData(0, 1, 5, 0.2, 0, 1)]
    [InlineData(-3, 17, 5, 5, -5, 20)]
    [InlineData(0, 275, 10, 50, 0, 300)]
    [InlineData(0, 0.03, 3, 0.01, 0, 0.03)]
    public void For_Range_PicksTheRoundStepAndWidensToWholeSteps(double min, double max, int maxIntervals, double step, double first, double last)
    {
        var ticks = AxisTicks.For(min, max, maxIntervals);

        Assert.Equal(step, ticks.Step, 12);
        Assert.Equal(first, ticks.Min, 12);
        Assert.Equal(last, ticks.Max, 12);
    }

    [Fact]
    public void For_TenthsStep_GivesExactDecimals()
    {
        // 0.1 + 0.2 is 0.30000000000000004 in binary floating point; the ticks must print as 0.3.
        Assert.Equal([0, 0.1, 0.2, 0.3], AxisTicks.For(0, 0.3, 3).Values);
    }

    [Fact]
    public void For_ManyRanges_GivesRoundMultiplesWithinTheIntervalLimit()
    {
        foreach (var max in Enumerable.Range(1, 400).Select(i => i * 0.37))
        {
            foreach (var maxIntervals in new[] { 2, 5, 8 })
            {
                var ticks = AxisTicks.For(0, max, maxIntervals);

                var mantissa = ticks.Step / Math.Pow(10, Math.Floor(Math.Log10(ticks.Step)));
                Assert.Contains(Math.Round(mantissa, 9), new[] { 1.0, 2, 5 });
                Assert.True(ticks.Values.Count - 1 <= maxIntervals, $"{ticks.Values.Count - 1} intervals for max {max}");
                Assert.True(ticks.Max >= max, $"last tick {ticks.Max} below {max}");
                Assert.All(ticks.Values, v => Assert.Equal(Math.Round(v / ticks.Step), v / ticks.Step, 9));
            }
        }
    }

    [Fact]
    public void For_EmptyRange_IsWidenedAroundTheValue()
    {
        var ticks = AxisTicks.For(12, 12, 4);

        Assert.True(ticks.Min < 12 && ticks.Max > 12, $"{ticks.Min} to {ticks.Max}");
    }

    [Fact]
    public void For_ReversedRange_IsRefused()
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => AxisTicks.For(5, 1, 4));
    }
}
