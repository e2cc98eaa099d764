using SafetyMirror.Core.Optics;
using SafetyMirror.Core.Site;

namespace SafetyMirror.Core.Design.Evaluation;

/// <summary>One road user along one approach in one mirror, each station worked out once however often it is asked about.</summary>
/// <remarks>
/// Locating the shown, recognisable and detectable stretches and reporting the stations ask about the same stations again
/// and again; every answer is the viewer's own, kept, so nothing is approximated. Not for use by two threads at once.
/// </remarks>
internal sealed class StationLooks(MirrorViewer viewer, ApproachJudge judge, RoadUser user)
{
    private readonly Dictionary<double, CentrePath> paths = [];
    private readonly Dictionary<double, ApparentAngle> heights = [];
    private readonly Dictionary<double, ApparentAngle> widths = [];

    public MirrorViewer Viewer => viewer;

    public RoadUser User => user;

    /// <summary>Whether the road user at the station is shown: its centre reflects on the face and neither leg is blocked.</summary>
    /// <remarks>Most stations of a long approach reflect off the face; a cheap test rules those out before the exact solve.</remarks>
    public bool Shows(double stationM) => !viewer.SurelyNotShown(judge.PointAt(stationM), user) && PathAt(stationM).Shown;

    /// <summary>Whether the road user at the station looks at least this large in the mirror's sphere, shown or not.</summary>
    /// <remarks>Both angles must reach it, so the one across the road user's smaller side is looked at first and the other
    /// only when that one does.</remarks>
    public bool LargeEnough(double stationM, double angleRad)
    {
        return user.WidthM < user.HeightM
            ? WidthAt(stationM).Reaches(angleRad) && HeightAt(stationM).Reaches(angleRad)
            : HeightAt(stationM).Reaches(angleRad) && WidthAt(stationM).Reaches(angleRad);
    }

    /// <summary>How the road user at the station looks in the mirror, or why it is not shown.</summary>
    public StationView See(double stationM)
    {
        var path = PathAt(stationM);
        return viewer.See(judge.PointAt(stationM), user, path, path.Shown ? SizesAt(stationM) : default);
    }

    private CentrePath PathAt(double stationM)
    {
        if (!paths.TryGetValue(stationM, out var path))
        {
            path = viewer.PathOf(judge.PointAt(stationM), user);
            paths[stationM] = path;
        }

        return path;
    }

    private ApparentSizes SizesAt(double stationM) => new(HeightAt(stationM), WidthAt(stationM));

    private ApparentAngle HeightAt(double stationM) => ViewAt(heights, stationM, viewer.HeightOf);

    private ApparentAngle WidthAt(double stationM) => ViewAt(widths, stationM, viewer.WidthOf);

    private ApparentAngle ViewAt(Dictionary<double, ApparentAngle> views, double stationM, Func<StationPoint, RoadUser, ApparentAngle> look)
    {
        if (!views.TryGetValue(stationM, out var view))
        {
            view = look(judge.PointAt(stationM), user);
            views[stationM] = view;
        }

        return view;
    }
}
