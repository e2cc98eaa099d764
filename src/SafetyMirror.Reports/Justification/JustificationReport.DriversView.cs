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

    /// <summary>Where the design road user stands in the strip of frames of an approach, metres from its conflict point, farthest first.</summary>
    private static readonly double[] StripStationsM = [80, 60, 40, 20];

    /// <summary>Pixels across each frame of the strip, a quarter of a picture's pixels.</summary>
    private const int StripWidthPx = 240;

    /// <summary>Printed width of each frame, millimetres: four frames fit the content width of A4 and Letter.</summary>
    private const double StripWidthMm = 40;

    /// <summary>The strip's frames look this much closer than the default framing, so that the face fills their height: the small car matters there, not the board.</summary>
    private const double StripZoom = 1.4;

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

        if (mirror.Serves.Count > 0)
        {
            WriteApproachStrip(writer, mirror, report.Approaches[mirror.Serves[0]], mirror.Serves[0]);
        }
    }

    /// <summary>Frames of the design road user coming along the first approach the mirror serves, at the design aim.</summary>
    private void WriteApproachStrip(IReportWriter writer, ReportedMirror mirror, ReportedApproach approach, int approachIndex)
    {
        var design = report.Options.DesignRoadUser;
        var stations = StripStationsM.Where(s => s <= approach.Approach.LengthM).ToList();
        var frames = new List<(byte[] Png, string AltText)>();
        ViewPicture? first = null;
        var fieldOfViewDeg = DriverView.FramingOf(mirror.Placement.ToMirror(), report.Plan.Eyes[report.Options.EyeIndex].Position) / StripZoom;
        foreach (var stationM in stations)
        {
            var view = new ViewOptions
            {
                WidthPx = StripWidthPx,
                HeightPx = StripWidthPx * ViewHeightPx / ViewWidthPx,
                FieldOfViewDeg = fieldOfViewDeg,
                ExtraRoadUsers = [new RoadUserAtStation(approachIndex, stationM, design)],
            };
            if (DriverView.Render(report.Plan, mirror.Placement, report.Options, view) is not { IsSuccess: true } rendered)
            {
                return;
            }

            first ??= rendered.Picture;
            frames.Add((ViewPng.Encode(rendered.Picture, withCaption: false), $"Mirror {mirror.Label} with the {design.Name.ToLowerInvariant()} {units.Distance(stationM)} up {approach.Title}."));
        }

        if (first is null)
        {
            return;
        }

        var heightMm = StripWidthMm * first.HeightPx / first.WidthPx;
        writer.PictureRow(frames, StripWidthMm, heightMm,
            $"Mirror {mirror.Label} at the design aim as a {design.Name.ToLowerInvariant()} comes along {approach.Title}: blue, the {design.Name.ToLowerInvariant()} at "
            + string.Join(", ", stations.Select(units.Distance)) + $" from the conflict point, left to right; red, at the required sight distance, {units.Distance(approach.Required.DesignM)}. "
            + $"Each {ViewPng.Scale(first)} " + Invariant($"({first.WidthPx} × {first.HeightPx} px printed {StripWidthMm:0} × {heightMm:0} mm). ")
            + string.Join(" ", ViewPng.MirrorCautions.Take(2)));
    }

    /// <summary>"with the aim 2° clockwise in azimuth (233.0° from plan north and tilted 5.0° down): requirement still met, provided 1.31 × required".</summary>
    private string OffAim(MirrorPlacement placement, AimCase off, double toleranceDeg)
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
