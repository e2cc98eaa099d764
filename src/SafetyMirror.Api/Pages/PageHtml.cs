using System.Net;
using System.Text;

namespace SafetyMirror.Api.Pages;

/// <summary>The frame every study page shares: the document head, the navigation, the stylesheet and the cautions.</summary>
internal static class PageHtml
{
    /// <summary>The media type of the pages.</summary>
    public const string MediaType = "text/html; charset=utf-8";

    /// <summary>Where the pages' stylesheet is served; the pages' policy allows styles from the service only.</summary>
    public const string StylesheetRoute = "/studies/pages.css";

    /// <summary>The cautions every result carries.</summary>
    public const string Cautions =
        "Decision support only. A convex mirror makes vehicles look farther away and slower than they are; it does not replace "
        + "removing the obstruction; it needs cleaning and upkeep and can be blinded by glare, dew or ice. Local rules and licensed "
        + "engineering judgement govern.";

    /// <summary>Text made safe for HTML content and attribute values.</summary>
    public static string E(string? text) => WebUtility.HtmlEncode(text ?? string.Empty);

    /// <summary>A whole page around the given main content.</summary>
    public static string Page(string title, string main)
    {
        var html = new StringBuilder();
        html.Append("<!DOCTYPE html>\n<html lang=\"en\">\n<head>\n<meta charset=\"utf-8\">\n")
            .Append("<meta name=\"viewport\" content=\"width=device-width, initial-scale=1\">\n")
            .Append("<title>").Append(E(title)).Append(" · SafetyMirror</title>\n")
            .Append("<link rel=\"stylesheet\" href=\"").Append(StylesheetRoute).Append("\">\n</head>\n<body>\n")
            .Append("<header><nav aria-label=\"Pages\"><a href=\"/studies\">Studies</a> <a href=\"/studies/new\">New study</a></nav></header>\n")
            .Append("<main>\n").Append(main).Append("</main>\n")
            .Append("<footer><p>").Append(E(Cautions)).Append("</p></footer>\n</body>\n</html>\n");
        return html.ToString();
    }

    /// <summary>The pages' stylesheet: readable on a laptop, plain on paper.</summary>
    public const string Stylesheet = """
        body { font-family: system-ui, sans-serif; max-width: 60rem; margin: 0 auto; padding: 0 1rem 2rem; line-height: 1.5; color: #1b1b1b; background: #fff; }
        nav { padding: 0.75rem 0; border-bottom: 1px solid #ccc; }
        nav a { margin-right: 1rem; }
        a { color: #0b4f8a; }
        a:focus, input:focus, select:focus, button:focus, textarea:focus { outline: 3px solid #e08a00; outline-offset: 2px; }
        table { border-collapse: collapse; width: 100%; margin: 0.5rem 0 1rem; }
        th, td { text-align: left; padding: 0.3rem 0.5rem; border-bottom: 1px solid #ddd; vertical-align: top; }
        td.number, th.number { text-align: right; }
        fieldset { border: 1px solid #bbb; margin: 0 0 1rem; padding: 0.5rem 1rem 1rem; }
        label { display: block; font-weight: 600; margin-top: 0.5rem; }
        input[type=text], input[type=number], select, textarea { font: inherit; padding: 0.25rem; width: 100%; max-width: 30rem; box-sizing: border-box; }
        button { font: inherit; padding: 0.4rem 1rem; margin-top: 1rem; }
        .grid { display: grid; grid-template-columns: repeat(auto-fill, minmax(12rem, 1fr)); gap: 0 1rem; }
        .hint { color: #555; font-size: 0.9rem; margin: 0.1rem 0; }
        .errors, .field-errors { color: #a00000; }
        .field-errors { margin: 0.25rem 0; padding-left: 1.2rem; }
        .summary { border: 2px solid #a00000; padding: 0.5rem 1rem; margin: 1rem 0; }
        .decision { font-size: 1.25rem; font-weight: 700; }
        figure { margin: 0 0 1rem; }
        figure svg, figure img { display: block; max-width: 100%; height: auto; }
        code { font-size: 0.9rem; }
        footer { border-top: 1px solid #ccc; margin-top: 2rem; font-size: 0.9rem; color: #333; }
        @media print {
            nav, form, .no-print { display: none; }
            body { max-width: none; padding: 0; font-size: 10pt; }
            a { color: inherit; text-decoration: none; }
            tr, figure { break-inside: avoid; }
        }
        """;
}
