using SafetyMirror.Core.Site;

namespace SafetyMirror.Core.Tests.Site;

public class PlanCoordinateSystemTests
{
    // Names as GIS exports write them (OGC URN of the old GeoJSON crs member; short EPSG form; OGC http form).
    [Theory]
    [InlineData("urn:ogc:def:crs:EPSG::32633", 32633)]
    [InlineData("urn:ogc:def:crs:EPSG:6.6:32633", 32633)]
    [InlineData("EPSG:32633", 32633)]
    [InlineData("epsg:32756", 32756)]
    [InlineData("http://www.opengis.net/def/crs/EPSG/0/32601", 32601)]
    [InlineData("urn:ogc:def:crs:EPSG::4326", 4326)]
    [InlineData("EPSG:4326", 4326)]
    [InlineData("urn:ogc:def:crs:OGC:1.3:CRS84", 4326)]
    [InlineData("urn:ogc:def:crs:OGC::CRS84", 4326)]
    public void FromCrsName_SupportedName_GivesItsEpsgCode(string name, int epsgCode)
    {
        Assert.Equal(epsgCode, PlanCoordinateSystem.FromCrsName(name)?.EpsgCode);
    }

    [Theory]
    [InlineData("EPSG:3857")]
    [InlineData("EPSG:32600")]
    [InlineData("EPSG:32661")]
    [InlineData("EPSG:32700")]
    [InlineData("urn:ogc:def:crs:EPSG::27700")]
    [InlineData("WGS 84")]
    [InlineData("")]
    public void FromCrsName_OtherName_IsNotSupported(string name)
    {
        Assert.Null(PlanCoordinateSystem.FromCrsName(name));
    }

    [Fact]
    public void Utm_SouthernZone_KnowsItsZoneAndHemisphere()
    {
        var system = PlanCoordinateSystem.Utm(56, north: false);

        Assert.Equal((32756, 56, false, "urn:ogc:def:crs:EPSG::32756"), (system.EpsgCode, system.UtmZone, system.IsUtmNorth, system.Urn));
    }

    [Fact]
    public void Utm_ZoneOutOfRange_Throws()
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => PlanCoordinateSystem.Utm(61, north: true));
    }
}
