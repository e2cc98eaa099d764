namespace SafetyMirror.Core.View;

/// <summary>What picture of the driver's view to render.</summary>
public sealed record ViewOptions
{
    /// <summary>Picture width in pixels.</summary>
    public int WidthPx { get; init; } = 600;

    /// <summary>Picture height in pixels.</summary>
    public int HeightPx { get; init; } = 600;

    /// <summary>Angle across the picture's width in degrees; null to frame the backing board with room round it
    /// (<see cref="DriverView.FramingFactor"/> times the board's angular width).</summary>
    public double? FieldOfViewDeg { get; init; }

    /// <summary>Road users to stand on the approaches besides the design road user at each required distance.</summary>
    public IReadOnlyList<RoadUserAtStation> ExtraRoadUsers { get; init; } = [];
}
