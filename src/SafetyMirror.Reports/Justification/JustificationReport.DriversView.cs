using SafetyMirror.Core.Design.Evaluation;
using SafetyMirror.Core.View;
using SafetyMirror.Reports.Documents;
using SafetyMirror.Reports.Views;
using static System.FormattableString;

namespace SafetyMirror.Reports.Justification;

/// <summary>The installation sheet's pictures: what the waiting driver will see in each mirror once it is mounted, at the design aim
/// and at the two worst aims of the tolerance the verdict was tested at.</summary>
public sealed partial class JustificationReport
{
    /// <summary>Pixels across each picture: enough for the face to read at the printed size, few enough to keep a report quick.</summary>
    private const int ViewWidthPx = 480;

    /// <summary>Pixels down each picture (4:3, the board and the road round it).</summary>
    private const int ViewHeightPx = 360;

    /// <summary>Printed width of each picture, millimetres: two pictures and their captions fit one A4 or Letter page.</summary>
    private const double ViewWidthMm = 100;

    /// <summary>How many of the aims off by the tolerance are shown beside the design aim: the worst by margin (the wording says "two").</summary>
    private const int WorstAimsShown = 2;

    private void WriteDriversView(IReportWriter writer, ReportedMirror mirror)
    {
        writer.Heading($"What the driver will see once mirror {mirror.Label} is mounted", 3);
        var robustness = mirror.Evaluation.Robustness;
        var worst = robustness.ToleranceDeg > 0
            ? robustness.Cases.Where(c => c.AzimuthOffsetDeg != 0 || c.TiltOffsetDeg != 0)
                .OrderBy(c => c.Meets).ThenBy(c => c.Margin).ThenByDescending(c => c.LongestUnseen?.LengthM ?? 0).Take(WorstAimsShown).ToList()
            : [];
        writer.Paragraph("The view from the driver's eye point toward the face, every pixel an eye ray reflected exactly on the curved face and carried into "
            + $"the corner built in 3-D from the plan; red boxes stand for the {report.Options.DesignRoadUser.Name.ToLowerInvariant()} at the required sight distance "
            + "on each approach. "
            + (worst.Count > 0
                ? Invariant($"First at the design aim, then at the {(worst.Count == 1 ? "aim" : "two aims")} of the ±{robustness.ToleranceDeg:0.#}° tolerance with the least margin: ")
                    + "if the face looks like one of these after mounting, it is at the edge of what the verdict allows. "
                : "At the design aim. ")
            + "Compare the view on site from the eye point after mounting.");
        var viewed = new List<(MirrorPlacement Placement, string Aim)> { (mirror.Placement, $"at the design aim, {Aim(mirror.Placement)}") };
        viewed.AddRange(worst.Select(c => (mirror.Placement.AimedOffBy(c.AzimuthOffsetDeg, c.TiltOffsetDeg), OffAim(mirror.Placement, c, robustness.ToleranceDeg))));
        var view = new ViewOptions { WidthPx = ViewWidthPx, HeightPx = ViewHeightPx };
        foreach (var (placement, aim) in viewed)
        {
            var rendered = DriverView.Render(report.Plan, placement, report.Options, view);
            if (!rendered.IsSuccess)
            {
                writer.Paragraph($"Mirror {mirror.Label} {aim}: the view cannot be drawn. " + string.Join(" ", rendered.Problems.Select(p => p.Message)));
                continue;
            }

            var picture = rendered.Picture;
            var heightMm = ViewWidthMm * picture.HeightPx / picture.WidthPx;
            writer.Picture(ViewPng.Encode(picture, withCaption: false), ViewWidthMm, heightMm,
                $"Mirror {mirror.Label} {aim}, as the waiting driver sees it from the eye point.",
                $"Mirror {mirror.Label} {aim}, seen from the driver's eye point: {ViewPng.Scale(picture)} "
                + Invariant($"({picture.WidthPx} × {picture.HeightPx} px printed {ViewWidthMm:0} × {heightMm:0} mm). ")
                + string.Join(" ", ViewPng.MirrorCautions.Take(2)));
        }
    }

    /// <summary>"with the aim 2° clockwise in azimuth (233.0° from north and tilted 5.0° down): requirement still met, provided 1.31 × required".</summary>
    private static string OffAim(MirrorPlacement placement, AimCase off, double toleranceDeg)
    {
        var error = off.AzimuthOffsetDeg switch
        {
            > 0 => Invariant($"{toleranceDeg:0.#}° clockwise in azimuth"),
            < 0 => Invariant($"{toleranceDeg:0.#}° anticlockwise in azimuth"),
            _ => off.TiltOffsetDeg > 0 ? Invariant($"{toleranceDeg:0.#}° further down in tilt") : Invariant($"{toleranceDeg:0.#}° further up in tilt"),
        };
        var margin = double.IsPositiveInfinity(off.Margin) ? "no approach needs the mirror"
            : off.Meets ? Invariant($"the requirement still met, the mirror providing {off.Margin:0.00} × the required distance")
            : Invariant($"the requirement not met, the mirror providing {off.Margin:0.00} × the required distance");
        return $"with the aim off by {error} ({Aim(placement.AimedOffBy(off.AzimuthOffsetDeg, off.TiltOffsetDeg))}; {margin})";
    }
}
