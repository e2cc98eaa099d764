using SafetyMirror.Core.Design.Evaluation;
using SafetyMirror.Core.Optics;
using SafetyMirror.Core.Site;
using SafetyMirror.Core.Tests.Design.Evaluation;
using SafetyMirror.Core.View;

namespace SafetyMirror.Core.Tests.View;

/// <summary>The invented corners of <see cref="Corners"/> with their street drawn (carriageway and north footway), and the
/// mirror of the service's demo corner (openapi/examples/demo-corner-local.json): 800 mm, R 3.0 m, on the north footway.</summary>
internal static class ViewCorners
{
    /// <summary>The demo corner's mirror: centre (6, 7.5) at 2.95 m, looking 231°, tilted 5° down.</summary>
    public static readonly MirrorPlacement DemoMirror = new(6, 7.5, 2.95, 231, 5, 3.0, new RoundAperture(0.8));

    /// <summary>The demo corner: both lanes, the corner house, the carriageway and the north footway, plus any extra obstacles.</summary>
    public static SitePlan Demo(params Obstacle[] extra) => Street([Corners.FromWest(), Corners.FromEast()], [Corners.WestBuilding(), .. extra]);

    /// <summary>A street with the given lanes and obstacles.</summary>
    public static SitePlan Street(Approach[] approaches, Obstacle[] obstacles) =>
        new(PlanFrame.LocalMetres,
            [new Eye(Corners.Eye, new FeatureReference(0, "driver"))],
            approaches,
            obstacles,
            carriageways: [new Carriageway(Corners.Box(-120, 0, 120, 6), new FeatureReference(5, "carriageway"))],
            footways: [new Footway(Corners.Box(-120, 6, 120, 9), 0.12, new FeatureReference(6, "north-footway"))]);

    /// <summary>A post 0.3 m square and 2 m high centred on a plan point.</summary>
    public static Obstacle Post(double x, double y, int index) =>
        new(Corners.Box(x - 0.15, y - 0.15, x + 0.15, y + 0.15), 2, new FeatureReference(index, $"post-{index}"));

    /// <summary>Renders the view, which must succeed.</summary>
    public static ViewPicture Render(SitePlan plan, ViewOptions view, EvaluationOptions? options = null)
    {
        var result = DriverView.Render(plan, DemoMirror, options ?? new EvaluationOptions(), view);
        Assert.True(result.IsSuccess, string.Join("; ", result.Problems.Select(p => $"{p.Path}: {p.Message}")));
        return result.Picture;
    }

    /// <summary>The pixels showing one kind of thing, with their positions.</summary>
    public static List<(int X, int Y)> PixelsOf(ViewPicture picture, Func<SeenThing, bool> showing)
    {
        var pixels = new List<(int, int)>();
        for (var y = 0; y < picture.HeightPx; y++)
        {
            for (var x = 0; x < picture.WidthPx; x++)
            {
                if (showing(picture.At(x, y)))
                {
                    pixels.Add((x, y));
                }
            }
        }

        return pixels;
    }
}
