using System.Globalization;
using System.Text;
using SafetyMirror.District;

// dotnet run --project tools/SafetyMirror.District -c Release -- --corners 200 --seed 7 [--mirrors] [--form collection|sequence] --out district.geojson
const string Usage = """
    Writes an invented district of blind corners as a batch for SafetyMirror.
      --corners N            how many corners, 1 to 10000 (default 200)
      --seed N               the seed; the same arguments give the same bytes (default 7)
      --mirrors              give every well-formed corner a mirror to evaluate (default: none, each asks for a recommendation)
      --mirror-share X       give this share of the well-formed corners a mirror, 0 to 1
      --malformed-share X    share of corners malformed on purpose, 0 to 1 (default 0.03)
      --demo                 the committed demo, openapi/examples/demo-district.geojson (24 corners, mirrors on about half)
      --form collection|sequence   one FeatureCollection (application/geo+json, default) or a GeoJSON text sequence (application/geo+json-seq)
      --out PATH             the file to write (default: standard output)
    """;

var options = new DistrictOptions();
var form = "collection";
string? output = null;
try
{
    for (var i = 0; i < args.Length; i++)
    {
        string Value() => i + 1 < args.Length ? args[++i] : throw new FormatException($"{args[i]} needs a value.");
        switch (args[i])
        {
            case "--corners": options = options with { Corners = int.Parse(Value(), CultureInfo.InvariantCulture) }; break;
            case "--seed": options = options with { Seed = int.Parse(Value(), CultureInfo.InvariantCulture) }; break;
            case "--mirrors": options = options with { MirrorShare = 1 }; break;
            case "--mirror-share": options = options with { MirrorShare = double.Parse(Value(), CultureInfo.InvariantCulture) }; break;
            case "--malformed-share": options = options with { MalformedShare = double.Parse(Value(), CultureInfo.InvariantCulture) }; break;
            case "--demo": options = DistrictOptions.Demo; break;
            case "--form": form = Value(); break;
            case "--out": output = Value(); break;
            case "--help" or "-h": Console.WriteLine(Usage); return 0;
            default: throw new FormatException($"Unknown argument {args[i]}.");
        }
    }

    if (form is not ("collection" or "sequence"))
    {
        throw new FormatException($"--form is collection or sequence, not {form}.");
    }

    var district = DistrictGenerator.Generate(options);
    var text = form == "collection" ? DistrictWriter.ToCollection(district) : DistrictWriter.ToSequence(district);
    if (output is null)
    {
        Console.Out.Write(text);
        return 0;
    }

    File.WriteAllText(output, text, new UTF8Encoding(encoderShouldEmitUTF8Identifier: false));
    Console.Error.WriteLine($"Wrote {district.Corners.Count} corners ({district.Corners.Count(c => c.Flaw is not null)} malformed, "
        + $"{district.Corners.Count(c => c.Flaw is null && c.Mirror is not null)} with a mirror) to {output}.");
    return 0;
}
catch (Exception error) when (error is FormatException or OverflowException or ArgumentException)
{
    Console.Error.WriteLine(error.Message);
    Console.Error.WriteLine(Usage);
    return 2;
}
