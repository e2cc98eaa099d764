using System.Text.Json;
using System.Text.RegularExpressions;
using Microsoft.AspNetCore.Hosting.Server;
using Microsoft.AspNetCore.Hosting.Server.Features;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Playwright;
using SafetyMirror.Api.Tests.Features.Reports;

namespace SafetyMirror.Api.Tests.Pages;

// A real headless Chromium (Debian's chromium, driven by Playwright) works the study pages served on a loopback Kestrel port,
// as an engineer would: upload the demo plan, read the decision, see the driver's view load, fetch the PDF, add a revision. A screenshot is kept.
public sealed partial class StudyPageBrowserTests
{
    [Fact]
    public async Task StudyPages_UploadDecidePdfAndRevise_ListTwoRevisions()
    {
        await using var api = new ApiFactory();
        api.UseKestrel(0);
        api.StartServer();
        var address = new Uri(api.Services.GetRequiredService<IServer>().Features.Get<IServerAddressesFeature>()!.Addresses.First());
        var profile = Directory.CreateTempSubdirectory("safetymirror-chromium-").FullName;
        var planFile = Path.Combine(profile, "..", $"demo-corner-{Guid.NewGuid():N}.geojson");
        var demo = DemoCorners.Local();
        await File.WriteAllTextAsync(planFile, demo["plan"]!.ToJsonString());
        using var playwright = await Playwright.CreateAsync();
        var context = await ReportBrowserTests.Browser.LaunchAsync(playwright, ReportBrowserTests.Browser.Chromium(), profile, new ViewportSize { Width = 1280, Height = 800 });
        try
        {
            var page = context.Pages.Count > 0 ? context.Pages[0] : await context.NewPageAsync();
            await page.GotoAsync(new Uri(address, "/studies/new").ToString());
            await page.GetByLabel("Title").FillAsync("Tansy Mews at Colliers Row");
            await page.GetByLabel("Site").FillAsync("Tansy Mews exit onto Colliers Row");
            await page.GetByLabel("Plan (GeoJSON file)").SetInputFilesAsync(planFile);
            await FillMirrorAsync(page, demo["mirror"]!);
            await page.GetByRole(AriaRole.Button, new() { Name = "Start the study" }).ClickAsync();
            await page.WaitForURLAsync(StudyPage());

            var decision = (await page.Locator("#decision").TextContentAsync())?.Trim();
            var revisionJson = await context.APIRequest.GetAsync(new Uri(address, await Link(page, "Revision 1 request and answer as JSON")).ToString());
            using var stored = JsonDocument.Parse(await revisionJson.TextAsync());
            Assert.Equal(stored.RootElement.GetProperty("evaluation").GetProperty("decision").GetString(), decision);
            // The driver's view comes from the revision's view route: the page's policy lets it load and Chromium decodes it.
            var view = page.Locator("#view");
            await view.ScrollIntoViewIfNeededAsync();
            await page.WaitForFunctionAsync("() => document.getElementById('view').complete");
            Assert.True(await view.EvaluateAsync<int>("img => img.naturalWidth") > 0, "The driver's view did not load in the study page.");

            var pdf = await context.APIRequest.GetAsync(new Uri(address, await Link(page, "Revision 1 report as PDF")).ToString());
            Assert.Equal(200, pdf.Status);
            Assert.StartsWith("application/pdf", pdf.Headers["content-type"], StringComparison.Ordinal);
            // A PDF file starts with "%PDF-" (ISO 32000-1:2008, 7.5.2).
            Assert.Equal("%PDF-"u8.ToArray(), (await pdf.BodyAsync())[..5]);

            await FillMirrorAsync(page, demo["mirror"]!);
            await page.GetByLabel("Note").FillAsync("Aim checked on site");
            await page.GetByRole(AriaRole.Button, new() { Name = "Add the revision" }).ClickAsync();
            await page.WaitForURLAsync(StudyPage());

            Assert.Equal(2, await page.Locator("#revisions tbody tr").CountAsync());
            Assert.Equal(1, await page.Locator("#revisions td", new() { HasTextString = "Aim checked on site" }).CountAsync());
            var screenshot = Path.Combine(AppContext.BaseDirectory, "artefacts", "study-page.png");
            Directory.CreateDirectory(Path.GetDirectoryName(screenshot)!);
            await page.ScreenshotAsync(new PageScreenshotOptions { Path = screenshot, FullPage = true });
        }
        finally
        {
            await context.DisposeAsync();
            Directory.Delete(profile, recursive: true);
            File.Delete(planFile);
        }
    }

    private static async Task FillMirrorAsync(IPage page, System.Text.Json.Nodes.JsonNode mirror)
    {
        var location = mirror["location"]!["coordinates"]!;
        await page.GetByLabel("Location x").FillAsync(location[0]!.ToJsonString());
        await page.GetByLabel("Location y").FillAsync(location[1]!.ToJsonString());
        await page.GetByLabel("Centre height").FillAsync(mirror["centreHeightM"]!.ToJsonString());
        await page.GetByLabel("Azimuth").FillAsync(mirror["azimuthDeg"]!.ToJsonString());
        await page.GetByLabel("Tilt down").FillAsync(mirror["tiltDownDeg"]!.ToJsonString());
        await page.GetByLabel("Radius of curvature").FillAsync(mirror["radiusM"]!.ToJsonString());
        await page.GetByLabel("Diameter").FillAsync(mirror["diameterM"]!.ToJsonString());
    }

    private static async Task<string> Link(IPage page, string label) =>
        await page.GetByLabel(label, new() { Exact = true }).GetAttributeAsync("href") ?? throw new InvalidOperationException($"No link \"{label}\".");

    [GeneratedRegex("/studies/[0-9a-f-]{36}$")]
    private static partial Regex StudyPage();
}
