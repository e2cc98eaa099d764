namespace SafetyMirror.Core.View;

/// <summary>What a pixel of the driver's view shows.</summary>
public enum SeenKind : byte
{
    /// <summary>Sky above the horizon.</summary>
    Sky,

    /// <summary>Ground that is neither carriageway nor footway.</summary>
    Ground,

    /// <summary>A carriageway of the plan.</summary>
    Carriageway,

    /// <summary>A footway of the plan.</summary>
    Footway,

    /// <summary>An approach's line (the lane's centre line the road users drive on).</summary>
    ApproachLine,

    /// <summary>An obstacle of the plan, raised to its height.</summary>
    Obstacle,

    /// <summary>The front face of a road user: the face whose height and width the evaluation's apparent sizes measure.</summary>
    RoadUserFront,

    /// <summary>Any other face of a road user.</summary>
    RoadUserBody,

    /// <summary>The pole the mirror hangs on.</summary>
    Pole,

    /// <summary>The rim of the mirror's face.</summary>
    MirrorRim,

    /// <summary>The backing board round the face.</summary>
    BackingBoard,
}

/// <summary>What one pixel shows: the kind, which one of its kind (the plan's obstacle or the placed road user, by index; else
/// 0), and whether it is seen in the mirror rather than directly.</summary>
public readonly record struct SeenThing(SeenKind Kind, short Index, bool InMirror);
