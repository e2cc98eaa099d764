using System.Text.RegularExpressions;

namespace SafetyMirror.Core.Site;

/// <summary>What a plan's own x and y mean: WGS84 longitude/latitude, a UTM zone on WGS84, or local metres.</summary>
public sealed partial record PlanCoordinateSystem
{
    private PlanCoordinateSystem(int? epsgCode) => EpsgCode = epsgCode;

    /// <summary>Longitude and latitude in degrees on WGS84 (RFC 7946's only coordinate system).</summary>
    public static PlanCoordinateSystem Wgs84 { get; } = new(4326);

    /// <summary>x east and y north already in metres, as drawn in CAD.</summary>
    public static PlanCoordinateSystem LocalMetres { get; } = new((int?)null);

    /// <summary>A UTM zone on WGS84: EPSG 326zz in the north, 327zz in the south.</summary>
    public static PlanCoordinateSystem Utm(int zone, bool north)
    {
        ArgumentOutOfRangeException.ThrowIfLessThan(zone, 1);
        ArgumentOutOfRangeException.ThrowIfGreaterThan(zone, 60);
        return new((north ? 32600 : 32700) + zone);
    }

    /// <summary>The EPSG code (4326 or a UTM zone); null for local metres.</summary>
    public int? EpsgCode { get; }

    /// <summary>True for x and y already in metres.</summary>
    public bool IsLocalMetres => EpsgCode is null;

    /// <summary>True for WGS84 longitude/latitude.</summary>
    public bool IsGeographic => EpsgCode == 4326;

    /// <summary>The UTM zone, 1 to 60, or null when this is not UTM.</summary>
    public int? UtmZone => EpsgCode switch
    {
        > 32600 and <= 32660 => EpsgCode - 32600,
        > 32700 and <= 32760 => EpsgCode - 32700,
        _ => null,
    };

    /// <summary>True for a UTM zone of the northern hemisphere.</summary>
    public bool IsUtmNorth => EpsgCode is > 32600 and <= 32660;

    /// <summary>The OGC URN naming this system, as GIS exports write it; null for local metres.</summary>
    public string? Urn => EpsgCode is { } code ? $"urn:ogc:def:crs:EPSG::{code}" : null;

    /// <summary>What is supported, for messages.</summary>
    internal const string Supported =
        "WGS84 longitude/latitude (EPSG:4326, CRS84), the UTM zones on WGS84 (EPSG:32601 to 32660 north, " +
        "32701 to 32760 south), or \"frame\": \"local-metres\" for a plan already in metres";

    /// <summary>The system a GeoJSON <c>crs</c> name denotes, or null when it is not one of those supported.</summary>
    /// <remarks>
    /// Accepts <c>urn:ogc:def:crs:EPSG::32633</c> (with or without a version), <c>EPSG:32633</c>,
    /// <c>http://www.opengis.net/def/crs/EPSG/0/32633</c> and the OGC CRS84 names. EPSG:4326 is read as
    /// longitude then latitude, as GIS exports write GeoJSON whatever the EPSG axis order.
    /// </remarks>
    public static PlanCoordinateSystem? FromCrsName(string name)
    {
        if (Crs84Name().IsMatch(name))
        {
            return Wgs84;
        }

        var match = EpsgName().Match(name);
        if (!match.Success || !int.TryParse(match.Groups["code"].ValueSpan, out var code))
        {
            return null;
        }

        return code switch
        {
            4326 => Wgs84,
            > 32600 and <= 32660 => Utm(code - 32600, north: true),
            > 32700 and <= 32760 => Utm(code - 32700, north: false),
            _ => null,
        };
    }

    [GeneratedRegex(@"^(urn:ogc:def:crs:OGC:[0-9.]*:)?CRS84$", RegexOptions.IgnoreCase | RegexOptions.CultureInvariant)]
    private static partial Regex Crs84Name();

    [GeneratedRegex(@"^(urn:ogc:def:crs:EPSG:[0-9.]*:|EPSG:|https?://www\.opengis\.net/def/crs/EPSG/0/)(?<code>[0-9]{1,9})$", RegexOptions.IgnoreCase | RegexOptions.CultureInvariant)]
    private static partial Regex EpsgName();
}
