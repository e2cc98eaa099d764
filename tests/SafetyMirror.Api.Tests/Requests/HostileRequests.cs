using System.Globalization;
using System.Text;
using System.Text.Json.Nodes;
using CsCheck;

namespace SafetyMirror.Api.Tests.Requests;

/// <summary>One generated request: where it goes, what it accepts, its body as bytes and how it was made.</summary>
internal sealed record HostileRequest(string Route, string Accept, byte[] Body, string Description)
{
    public override string ToString() => $"{Route} ({Accept}): {Description}";
}

/// <summary>Hostile and broken requests made by mutating the committed valid examples of openapi/examples.</summary>
/// <remarks>
/// Structural mutations work on the JSON tree; a value may be replaced by a raw token that no JSON tree holds (NaN,
/// 1e400, an escaped lone surrogate, invalid UTF-8 bytes, deep nesting), spliced into the text after serializing.
/// Byte mutations then cut or spoil the encoded body. Evaluations get most requests; recommendations and reports are
/// costly when a mutation leaves them valid, so they get few.
/// </remarks>
internal static class HostileRequests
{
    // A control character that no serialized example holds: marks raw tokens and, as a byte, invalid UTF-8.
    private const char Raw = '\u0001';
    private const byte InvalidUtf8 = 0xFF; // never valid in UTF-8: RFC 3629, 1

    private static readonly Example[] Examples =
    [
        new("/v1/evaluations", "application/json", "demo-corner-local.json", 45),
        new("/v1/evaluations", "application/json", "demo-corner-wgs84.json", 45),
        new("/v1/evaluations", "application/geo+json", "demo-corner-local.json", 4),
        new("/v1/recommendations", "application/json", "demo-recommendation-local.json", 3),
        new("/v1/reports", "text/html", "demo-report-local.json", 2),
        new("/v1/reports", "application/pdf", "demo-report-local.json", 1),
    ];

    /// <summary>The generator of hostile requests.</summary>
    public static Gen<HostileRequest> Any =>
        Gen.Frequency(Examples.Select(e => Weighted(e.Weight, Mutated(e))).ToArray());

    /// <summary>Raw JSON tokens to put where a value was: wrong kinds, non-numbers, huge and undecodable values.</summary>
    private static readonly Gen<(string Token, string Name)> HostileValue = Gen.Frequency(
        Weighted(6, Gen.OneOf(
            ("\"\"", "empty string"), ("\"x\"", "string"), ("0", "zero"), ("-1", "minus one"), ("true", "true"), ("null", "null"),
            ("[]", "empty array"), ("{}", "empty object"), ("[1,2]", "array of numbers"), ("{\"type\":\"Point\"}", "object"),
            ("\"NaN\"", "string NaN"), ("\"Infinity\"", "string Infinity"), ("123456789012345678901234567890", "huge integer"),
            ("-0", "minus zero"), ("1e-400", "underflow"), ("0.1e1", "exponent"))),
        Weighted(3, Gen.OneOf(("NaN", "raw NaN"), ("Infinity", "raw Infinity"), ("-Infinity", "raw -Infinity"), ("1e400", "1e400"), ("-1e400", "-1e400"), ("01", "leading zero"))),
        Weighted(3, Gen.OneOf(("\"\\ud800\"", "lone high surrogate"), ("\"a\\udfffb\"", "lone low surrogate"), ($"\"{Raw}\"", "invalid UTF-8 byte"), ($"\"ok{Raw}{Raw}\"", "invalid UTF-8 bytes"))),
        Weighted(1, Gen.Int[1_000, 300_000].Select(n => ($"\"{new string('w', n)}\"", $"string of {n} characters"))),
        Weighted(1, Gen.Int[1_000, 100_000].Select(n => ($"[{string.Join(',', Enumerable.Repeat('0', n))}]", $"array of {n} zeros"))),
        Weighted(1, Gen.Int[20, 5_000].Select(n => (new string('[', n) + new string(']', n), $"arrays nested {n} deep"))),
        Weighted(1, Gen.Int[20, 2_000].Select(n => (string.Concat(Enumerable.Repeat("{\"a\":", n)) + "1" + new string('}', n), $"objects nested {n} deep"))));

    private static Gen<HostileRequest> Mutated(Example example) => Gen.Frequency(
        Weighted(8, Gen.Select(Gen.Int[0, example.Values.Count - 1], HostileValue).Select((at, value) =>
            Request(example, $"{example.Values[at]} := {value.Name}", body => Replace(body, example.Values[at], value.Token)))),
        Weighted(3, Gen.Int[0, example.Members.Count - 1].Select(at =>
            Request(example, $"remove {example.Members[at]}", body => { Remove(body, example.Members[at]); return body.ToJsonString(); }))),
        Weighted(3, Gen.Select(Gen.Int[0, example.Objects.Count - 1], Gen.OneOf("extra", "\\ud800", $"bad{Raw}", new string('m', 5_000)), HostileValue).Select((at, name, value) =>
            Request(example, $"add member to {example.Objects[at]}", body => AddMember(body, example.Objects[at], name, value.Token)))),
        Weighted(2, Gen.Int[0, FeatureCount(example) - 1].Select(index =>
            Request(example, $"duplicate plan.features[{index}]", body => { Features(body).Add(Features(body)[index]!.DeepClone()); return body.ToJsonString(); }))),
        Weighted(1, Gen.Const(Request(example, "road user listed twice", body =>
        {
            var options = (body["options"] ??= new JsonObject()).AsObject();
            options["roadUsers"] = new JsonArray(new JsonObject { ["id"] = "bicycle" }, new JsonObject { ["id"] = "bicycle" });
            return body.ToJsonString();
        }))),
        Weighted(3, Gen.Select(Gen.Int[0, FeatureCount(example) - 1], Geometries).Select((index, geometry) =>
            Request(example, $"plan.features[{index}].geometry := {geometry.Name}", body =>
            {
                Features(body)[index]!["geometry"] = JsonNode.Parse(geometry.Json);
                return body.ToJsonString();
            }))),
        Weighted(2, Gen.OneOf("EPSG:4326", "urn:ogc:def:crs:EPSG::32633", "urn:ogc:def:crs:EPSG::99999", "urn:ogc:def:crs:OGC:1.3:CRS84", "", "local").Select(crs =>
            Request(example, $"crs {crs}", body =>
            {
                var plan = body["plan"]!.AsObject();
                plan.Remove("frame");
                plan["crs"] = new JsonObject { ["type"] = "name", ["properties"] = new JsonObject { ["name"] = crs } };
                return body.ToJsonString();
            }))),
        Weighted(2, Gen.Double[0, 1].Select(cut => Request(example, $"cut at {cut:0.###}", body =>
        {
            var text = body.ToJsonString();
            return text[..(int)(text.Length * cut)];
        }))),
        Weighted(2, Gen.Select(Gen.Double[0, 1], Gen.OneOf(Raw, '"', '{', ']', ',', ':', '\\', '0', 'e', '-')).Select((at, character) =>
            Request(example, $"insert {(int)character:x2} at {at:0.###}", body =>
            {
                var text = body.ToJsonString();
                return text.Insert((int)(text.Length * at), character.ToString());
            }))));

    // Self-intersecting, degenerate, unclosed, far-off and folded geometries, and one of the wrong kind.
    private static readonly Gen<(string Json, string Name)> Geometries = Gen.OneOf(
        ("""{"type":"Polygon","coordinates":[[[0,0],[10,10],[10,0],[0,10],[0,0]]]}""", "bow tie"),
        ("""{"type":"Polygon","coordinates":[[[5,5],[5,5],[5,5],[5,5]]]}""", "polygon of one point"),
        ("""{"type":"Polygon","coordinates":[[[0,0],[10,0],[10,10],[0,10]]]}""", "unclosed ring"),
        ("""{"type":"LineString","coordinates":[[1,1],[1,1]]}""", "line of one point"),
        ("""{"type":"LineString","coordinates":[[-100,20],[100,20],[-100,20],[100,20]]}""", "line back over itself"),
        ("""{"type":"LineString","coordinates":[[1e300,1e300],[-1e300,0]]}""", "line across the world"),
        ("""{"type":"Point","coordinates":[1e308,-1e308]}""", "far point"),
        ("""{"type":"Point","coordinates":[]}""", "empty point"),
        ("""{"type":"MultiPolygon","coordinates":[[[[0,0],[1,0],[0,1],[0,0]]],[[[0,0],[1,0],[0,1],[0,0]]]]}""", "overlapping multipolygon"),
        ("""{"type":"GeometryCollection","geometries":[]}""", "geometry collection"),
        ("""{"type":"Circle","coordinates":[0,0]}""", "unknown type"),
        (Serpentine(), "lane folded 98 km long"));

    private static string Serpentine()
    {
        // 245 strips of 400 m, 2 m apart: about 98 km of lane inside a 400 m × 490 m box.
        var points = Enumerable.Range(0, 245).SelectMany(i => i % 2 == 0
            ? new[] { $"[-200,{20 + (2 * i)}]", $"[200,{20 + (2 * i)}]" }
            : [$"[200,{20 + (2 * i)}]", $"[-200,{20 + (2 * i)}]"]);
        return $$"""{"type":"LineString","coordinates":[{{string.Join(',', points)}}]}""";
    }

    private static (int, IGen<T>) Weighted<T>(int weight, Gen<T> gen) => (weight, gen);

    private static HostileRequest Request(Example example, string description, Func<JsonObject, string> mutate)
    {
        var text = mutate(example.Fresh());
        var bytes = Encoding.UTF8.GetBytes(text);
        for (var i = 0; i < bytes.Length; i++)
        {
            bytes[i] = bytes[i] == (byte)Raw ? InvalidUtf8 : bytes[i];
        }

        return new HostileRequest(example.Route, example.Accept, bytes, $"{example.File}: {description}");
    }

    // The value at the path becomes a placeholder, which the raw token then replaces in the text.
    private static string Replace(JsonObject body, string path, string token)
    {
        const string Placeholder = "@@hostile@@";
        var (parent, key) = Locate(body, path);
        if (parent is JsonArray array)
        {
            array[(int)key] = Placeholder;
        }
        else
        {
            parent.AsObject()[(string)key] = Placeholder;
        }

        return body.ToJsonString().Replace($"\"{Placeholder}\"", token, StringComparison.Ordinal);
    }

    private static void Remove(JsonObject body, string path)
    {
        var (parent, key) = Locate(body, path);
        parent.AsObject().Remove((string)key);
    }

    private static string AddMember(JsonObject body, string path, string name, string token)
    {
        const string Placeholder = "@@extra@@";
        var target = path.Length == 0 ? body : Navigate(body, path).AsObject();
        target[Placeholder] = 0;
        return body.ToJsonString().Replace($"\"{Placeholder}\":0", $"\"{name}\":{token}", StringComparison.Ordinal);
    }

    private static JsonArray Features(JsonObject body) => body["plan"]!["features"]!.AsArray();

    private static int FeatureCount(Example example) => Features(example.Fresh()).Count;

    private static (JsonNode Parent, object Key) Locate(JsonObject body, string path)
    {
        var cut = Math.Max(path.LastIndexOf('.'), path.LastIndexOf('['));
        if (cut < 0)
        {
            return (body, path);
        }

        var parent = Navigate(body, path[..cut]);
        return path[cut] == '['
            ? (parent, int.Parse(path[(cut + 1)..^1], CultureInfo.InvariantCulture))
            : (parent, path[(cut + 1)..]);
    }

    private static JsonNode Navigate(JsonNode node, string path)
    {
        foreach (var part in path.Replace("[", ".[", StringComparison.Ordinal).Split('.', StringSplitOptions.RemoveEmptyEntries))
        {
            node = part.StartsWith('[') ? node[int.Parse(part[1..^1], CultureInfo.InvariantCulture)]! : node[part]!;
        }

        return node;
    }

    /// <summary>A committed example and every path in it: of values, of object members and of objects.</summary>
    private sealed class Example
    {
        private readonly string text;

        public Example(string route, string accept, string file, int weight)
        {
            (Route, Accept, File, Weight) = (route, accept, file, weight);
            text = System.IO.File.ReadAllText(RepositoryFiles.PathOf("openapi", "examples", file));
            Walk(JsonNode.Parse(text)!, "");
        }

        public string Route { get; }

        public string Accept { get; }

        public string File { get; }

        public int Weight { get; }

        public List<string> Values { get; } = [];

        public List<string> Members { get; } = [];

        public List<string> Objects { get; } = [""];

        public JsonObject Fresh() => JsonNode.Parse(text)!.AsObject();

        private void Walk(JsonNode node, string path)
        {
            switch (node)
            {
                case JsonObject members:
                    foreach (var (name, value) in members)
                    {
                        var at = path.Length == 0 ? name : $"{path}.{name}";
                        Values.Add(at);
                        Members.Add(at);
                        if (value is JsonObject)
                        {
                            Objects.Add(at);
                        }

                        if (value is not null)
                        {
                            Walk(value, at);
                        }
                    }

                    break;
                case JsonArray items:
                    for (var i = 0; i < items.Count; i++)
                    {
                        Values.Add($"{path}[{i}]");
                        if (items[i] is JsonObject)
                        {
                            Objects.Add($"{path}[{i}]");
                        }

                        if (items[i] is { } item)
                        {
                            Walk(item, $"{path}[{i}]");
                        }
                    }

                    break;
            }
        }
    }
}
