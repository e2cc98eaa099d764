namespace SafetyMirror.Core.Design;

/// <summary>How large a road user's image must be at the eye to be recognised, and to be detected at all.</summary>
/// <remarks>Both thresholds apply to <see cref="RoadUser.SmallestDimensionM"/> as seen in the mirror.</remarks>
public sealed record VisionCriteria
{
    /// <summary>Creates criteria; detection may not exceed recognition.</summary>
    public VisionCriteria(VisualThreshold recognition, VisualThreshold detection)
    {
        ArgumentNullException.ThrowIfNull(recognition);
        ArgumentNullException.ThrowIfNull(detection);
        if (detection.AngleArcmin > recognition.AngleArcmin)
        {
            throw new ArgumentOutOfRangeException(
                nameof(detection),
                detection.AngleArcmin,
                $"{nameof(detection)} must be from {VisualThreshold.MinimumArcmin} to {recognition.AngleArcmin} arcmin, no more than recognition; it was {detection.AngleArcmin}.");
        }

        Recognition = recognition;
        Detection = detection;
    }

    /// <summary>The service's default: recognise at 10 arcmin, detect at 3 arcmin.</summary>
    public static VisionCriteria Default { get; } = new(
        new VisualThreshold(10, "EU Directive 2006/126/EC, Annex III: minimum acuity 0.5 decimal (6/12), at which a recognisable letter subtends 10 arcmin"),
        new VisualThreshold(3, "FMVSS 111, S9.4: the image must subtend at least 3 arcmin across the test object's shortest dimension"));

    /// <summary>The angle at which the road user is recognised for what it is.</summary>
    public VisualThreshold Recognition { get; }

    /// <summary>The angle below which the road user is not seen at all.</summary>
    public VisualThreshold Detection { get; }
}

/// <summary>A smallest angle at the eye for a visual task, with its source.</summary>
public sealed record VisualThreshold
{
    /// <summary>Smallest threshold accepted, in arcmin.</summary>
    public const double MinimumArcmin = 0.1;

    /// <summary>Largest threshold accepted, in arcmin.</summary>
    public const double MaximumArcmin = 60;

    /// <summary>Creates a threshold from 0.1 to 60 arcmin.</summary>
    public VisualThreshold(double angleArcmin, string source)
    {
        AngleArcmin = Preconditions.InRange(angleArcmin, MinimumArcmin, MaximumArcmin, "arcmin");
        ArgumentException.ThrowIfNullOrWhiteSpace(source);
        Source = source;
    }

    /// <summary>The threshold in minutes of arc.</summary>
    public double AngleArcmin { get; }

    /// <summary>The threshold in radians, for comparison with apparent sizes inside the core.</summary>
    public double AngleRad => AngleArcmin / 60 * Math.PI / 180;

    /// <summary>Where the threshold comes from.</summary>
    public string Source { get; }
}
