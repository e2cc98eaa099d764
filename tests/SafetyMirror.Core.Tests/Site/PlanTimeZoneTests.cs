using SafetyMirror.Core.Site;

namespace SafetyMirror.Core.Tests.Site;

public class PlanTimeZoneTests
{
    [Fact]
    public void Read_IanaName_FollowsThatZonesDaylightSaving()
    {
        var plan = DemoCorner.Wgs84();
        plan["timeZone"] = "Europe/Berlin";

        var zone = DemoCorner.Read(plan).Plan!.TimeZone!;

        // Central European Time is UTC+1, summer time UTC+2 (EU Directive 2000/84/EC; IANA tz database).
        Assert.Equal(TimeSpan.FromHours(1), zone.GetUtcOffset(new DateTime(2026, 1, 15, 12, 0, 0, DateTimeKind.Utc)));
        Assert.Equal(TimeSpan.FromHours(2), zone.GetUtcOffset(new DateTime(2026, 7, 15, 12, 0, 0, DateTimeKind.Utc)));
    }

    [Theory]
    [InlineData("+05:30", 5.5)]
    [InlineData("UTC-03:00", -3)]
    public void Read_FixedOffset_IsThatOffsetAllYear(string text, double hours)
    {
        var plan = DemoCorner.Wgs84();
        plan["timeZone"] = text;

        var zone = DemoCorner.Read(plan).Plan!.TimeZone!;

        Assert.Equal(TimeSpan.FromHours(hours), zone.GetUtcOffset(new DateTime(2026, 7, 15, 12, 0, 0, DateTimeKind.Utc)));
        Assert.Equal(TimeSpan.FromHours(hours), zone.GetUtcOffset(new DateTime(2026, 1, 15, 12, 0, 0, DateTimeKind.Utc)));
    }

    [Fact]
    public void Read_NoTimeZone_LeavesItNull()
    {
        Assert.Null(DemoCorner.Read(DemoCorner.Wgs84()).Plan!.TimeZone);
    }

    [Theory]
    [InlineData("Middle/Nowhere")]
    [InlineData("+15:00")]
    [InlineData("+01:75")]
    [InlineData("")]
    public void Read_UnknownZone_IsAProblemNamingTheMember(string text)
    {
        var plan = DemoCorner.Wgs84();
        plan["timeZone"] = text;

        var problem = Assert.Single(DemoCorner.Read(plan).Problems);

        Assert.Equal("timeZone", problem.Path);
    }

    [Fact]
    public void Read_TimeZoneNotAString_IsAProblemNamingTheMember()
    {
        var plan = DemoCorner.Wgs84();
        plan["timeZone"] = 1;

        Assert.Equal("timeZone", Assert.Single(DemoCorner.Read(plan).Problems).Path);
    }
}
