using SafetyMirror.Reports.Fonts;
using SafetyMirror.Reports.Graphics;

namespace SafetyMirror.Reports.Plans;

// Label placement: candidate places round an anchor, each label at the first free one.
public sealed partial class PlanDrawingBuilder
{
    /// <summary>Places the labels, most important first, each at its first free candidate inside the map.</summary>
    private static (List<PlacedLabel> Placed, List<string> LeftOut) PlaceLabels(Canvas canvas, Frame map)
    {
        var inside = new PlanBox("map", map.X + 0.5, map.Y + 0.5, map.X + map.Width - 0.5, map.Y + map.Height - 0.5);
        var placed = new List<PlacedLabel>();
        var leftOut = new List<string>();
        foreach (var request in canvas.Labels.OrderBy(l => l.Priority))
        {
            var free = request.Candidates
                .Select(at => new Text(at, request.Value, TextMm) { Anchor = TextAnchor.Middle, Weight = request.Weight, Colour = request.Colour })
                .Select(text => new PlacedLabel(text, BoxOf(text)))
                .FirstOrDefault(l => l.Box.IsInside(inside)
                    && !canvas.Symbols.Any(l.Box.Overlaps)
                    && !placed.Any(p => p.Box.Overlaps(l.Box))
                    && !(request.AvoidLines && canvas.Lines.Any(l.Box.Overlaps)));
            if (free is null)
            {
                leftOut.Add(request.Value);
            }
            else
            {
                placed.Add(free);
            }
        }

        return (placed, leftOut);
    }

    /// <summary>The box of an upright text's backdrop.</summary>
    private static PlanBox BoxOf(Text text)
    {
        var shell = Graphics.Symbols.Backdrop(text, Colour.White).Shell;
        return new PlanBox(text.Value, shell.Min(p => p.X), shell.Min(p => p.Y), shell.Max(p => p.X), shell.Max(p => p.Y));
    }

    /// <summary>Where a text's baseline middle goes for it to sit just beyond <paramref name="point"/> in direction (nx, ny), clear of it by <paramref name="clearanceMm"/>.</summary>
    private static PointMm Beyond(PointMm point, double nx, double ny, double clearanceMm, string value, FontWeight weight)
    {
        // Half the label's extent along the direction, so its nearest edge sits at the clearance.
        var halfExtent = Math.Abs(nx) * TextLayout.Width(value, TextMm, weight) / 2 + Math.Abs(ny) * TextMm * 0.5;
        var distance = clearanceMm + halfExtent;
        return new(point.X + nx * distance, point.Y + ny * distance + TextMm * 0.26);
    }

    /// <summary>Places around a point in eight directions, starting with (nx, ny) and turning away from it both ways.</summary>
    private static IEnumerable<PointMm> Around(PointMm point, double nx, double ny, double clearanceMm, string value, FontWeight weight)
    {
        foreach (var turnDeg in new[] { 0, 45, -45, 90, -90, 135, -135, 180 })
        {
            var t = turnDeg * Math.PI / 180;
            yield return Beyond(point, nx * Math.Cos(t) - ny * Math.Sin(t), nx * Math.Sin(t) + ny * Math.Cos(t), clearanceMm, value, weight);
        }
    }

    private sealed record LabelRequest(string Value, FontWeight Weight, Colour Colour, IReadOnlyList<PointMm> Candidates, int Priority, bool AvoidLines = false);

    private sealed record PlacedLabel(Text Text, PlanBox Box);
}
