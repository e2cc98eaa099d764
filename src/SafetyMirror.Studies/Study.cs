namespace SafetyMirror.Studies;

/// <summary>A corner under study: its title, its site and who owns it. Its revisions hold the plans and answers.</summary>
/// <param name="Id">Time-ordered id (UUID version 7).</param>
/// <param name="Title">A short name for the study.</param>
/// <param name="SiteText">Free text that locates the site (street names, a reference).</param>
/// <param name="SitePoint">The site's point, for plans in WGS84; null for plans in local metres.</param>
/// <param name="Extent">The plan's bounding box, for plans in WGS84; null for plans in local metres.</param>
/// <param name="Owner">Name of the API key that created the study.</param>
/// <param name="IsArchived">Archived studies stay readable and take no more revisions.</param>
/// <param name="CreatedAt">When the study was created, from the store's clock.</param>
/// <param name="LatestRevision">Number of the newest revision (1 for a new study).</param>
/// <param name="UpdatedAt">When the newest revision was made.</param>
public sealed record Study(
    Guid Id,
    string Title,
    string SiteText,
    GeoPoint? SitePoint,
    GeoBox? Extent,
    string Owner,
    bool IsArchived,
    DateTimeOffset CreatedAt,
    int LatestRevision,
    DateTimeOffset UpdatedAt);

/// <summary>What a caller gives to create a study; the store adds the id, the times and the revision number.</summary>
public sealed record NewStudy(string Title, string SiteText, GeoPoint? SitePoint, GeoBox? Extent, string Owner);

/// <summary>A WGS84 point.</summary>
public readonly record struct GeoPoint(double LongitudeDeg, double LatitudeDeg);

/// <summary>A WGS84 bounding box, west ≤ east and south ≤ north.</summary>
/// <remarks>A box across the antimeridian is not representable; plans of one corner never need it.</remarks>
public readonly record struct GeoBox
{
    /// <summary>Makes a box; throws when a side is outside WGS84 or the sides are crossed.</summary>
    public GeoBox(double westDeg, double southDeg, double eastDeg, double northDeg)
    {
        if (!(westDeg >= -180 && eastDeg <= 180 && westDeg <= eastDeg))
            throw new ArgumentOutOfRangeException(nameof(westDeg), "West and east must lie in -180..180° with west ≤ east.");
        if (!(southDeg >= -90 && northDeg <= 90 && southDeg <= northDeg))
            throw new ArgumentOutOfRangeException(nameof(southDeg), "South and north must lie in -90..90° with south ≤ north.");
        (WestDeg, SouthDeg, EastDeg, NorthDeg) = (westDeg, southDeg, eastDeg, northDeg);
    }

    /// <summary>Smallest longitude.</summary>
    public double WestDeg { get; }

    /// <summary>Smallest latitude.</summary>
    public double SouthDeg { get; }

    /// <summary>Largest longitude.</summary>
    public double EastDeg { get; }

    /// <summary>Largest latitude.</summary>
    public double NorthDeg { get; }
}
