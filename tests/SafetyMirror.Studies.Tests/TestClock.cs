namespace SafetyMirror.Studies.Tests;

/// <summary>A clock that starts at a fixed instant and moves one second each time it is read, so orders are known.</summary>
sealed class TestClock : TimeProvider
{
    long seconds;

    public static DateTimeOffset Start { get; } = new(2026, 3, 14, 9, 0, 0, TimeSpan.Zero);

    public override DateTimeOffset GetUtcNow() => Start.AddSeconds(Interlocked.Increment(ref seconds) - 1);
}
