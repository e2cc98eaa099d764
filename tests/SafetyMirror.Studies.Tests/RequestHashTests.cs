using System.Text;
using System.Text.Json;

namespace SafetyMirror.Studies.Tests;

public class RequestHashTests
{
    const string Plan = """{"b":1,"a":[true,null,"x"]}""";

    [Fact]
    public void Of_KnownRequest_EqualsSha256OfItsCanonicalText()
    {
        // sha256sum (GNU coreutils) of {"mirror":null,"options":{},"plan":{"a":[true,null,"x"],"b":1}}
        Assert.Equal("bab311943499a27ea3c195c0d0859e5fcb1e753da441b01ed96b904bfa535dc3", RequestHash.Of(Plan, "{}", null));
    }

    [Fact]
    public void Of_KnownRequestWithMirror_EqualsSha256OfItsCanonicalText()
    {
        // sha256sum (GNU coreutils) of
        // {"mirror":{"diameterMm":600},"options":{"speedKmh":30},"plan":{"a":[true,null,"x"],"b":1.5}}
        Assert.Equal("88a81df64573e7c400a240bf8144ee531dd60af3fbd73678c80422c303702312",
            RequestHash.Of("""{"a":[true,null,"x"],"b":1.5}""", """{"speedKmh":30}""", """{"diameterMm":600}"""));
    }

    [Fact]
    public void Of_MemberOrderAndWhitespace_DoNotChangeTheHash()
    {
        const string reordered = """
            {
              "a" : [ true, null, "x" ],
              "b" : 1
            }
            """;
        Assert.Equal(RequestHash.Of(Plan, "{}", null), RequestHash.Of(reordered, " { } ", null));
    }

    [Fact]
    public void Of_NumberSpellingsOfOneValue_DoNotChangeTheHash()
    {
        Assert.Equal(RequestHash.Of(Plan, "{}", null), RequestHash.Of("""{"a":[true,null,"x"],"b":1.0e0}""", "{}", null));
    }

    [Fact]
    public void Of_EscapedAndPlainSpellingsOfOneString_DoNotChangeTheHash()
    {
        Assert.Equal(RequestHash.Of(Plan, "{}", null), RequestHash.Of("""{"a":[true,null,"\u0078"],"b":1}""", "{}", null));
    }

    [Theory]
    [InlineData("""{"b":2,"a":[true,null,"x"]}""", "{}", null)]
    [InlineData("""{"b":1.0000001,"a":[true,null,"x"]}""", "{}", null)]
    [InlineData("""{"b":1,"a":[true,null,"X"]}""", "{}", null)]
    [InlineData("""{"b":1,"a":[null,true,"x"]}""", "{}", null)]
    [InlineData("""{"b":1,"a":[true,null,"x"],"c":null}""", "{}", null)]
    [InlineData("""{"b":"1","a":[true,null,"x"]}""", "{}", null)]
    [InlineData(Plan, """{"speedKmh":30}""", null)]
    [InlineData(Plan, "{}", "{}")]
    public void Of_AnyValueChange_ChangesTheHash(string plan, string options, string? mirror)
    {
        Assert.NotEqual(RequestHash.Of(Plan, "{}", null), RequestHash.Of(plan, options, mirror));
    }

    [Fact]
    public void Of_PlanAndOptionsSwapped_ChangesTheHash()
    {
        Assert.NotEqual(RequestHash.Of(Plan, "{}", null), RequestHash.Of("{}", Plan, null));
    }

    [Fact]
    public void ToUtf8_DuplicateMember_IsRefused()
    {
        Assert.ThrowsAny<JsonException>(() => CanonicalJson.ToUtf8("""{"a":1,"a":2}"""));
    }

    [Fact]
    public void ToUtf8_NestedObjects_SortsEveryLevelAndDropsWhitespace()
    {
        var canonical = Encoding.UTF8.GetString(CanonicalJson.ToUtf8("""{ "z": { "y": 1, "x": [ { "b": 2, "a": 1 } ] }, "é": "ü" }"""));
        Assert.Equal("""{"z":{"x":[{"a":1,"b":2}],"y":1},"é":"ü"}""", canonical);
    }
}
