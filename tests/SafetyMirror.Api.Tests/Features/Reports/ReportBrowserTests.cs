using System.Globalization;
using System.Text;
using System.Text.Json;
using System.Text.RegularExpressions;
using Microsoft.AspNetCore.Hosting.Server;
using Microsoft.AspNetCore.Hosting.Server.Features;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Playwright;
using SafetyMirror.Reports.Tests;

namespace SafetyMirror.Api.Tests.Features.Reports;

// A real headless Chromium (Debian's chromium, driven by Playwright) opens the HTML report served by the API on a
// loopback Kestrel port: the figures render, nothing is wider than an A4 page, and a screenshot is kept.
public sealed class ReportBrowserTests(ReportBrowserTests.Browser browser) : IClassFixture<ReportBrowserTests.Browser>
{
    // 96 CSS px per inch (CSS Values and Units Level 3, 5.2): A4's 210 mm is 793.7 px, and its 170 mm between the
    // report's 20 mm margins is 642.5 px.
    private const int A4WidthPx = 794;
    private const double A4ContentWidthPx = 170 / 25.4 * 96;

    /// <summary>The API on a real socket and one Chromium page holding the demo corner's report.</summary>
    public sealed class Browser : IAsyncLifetime
    {
        private readonly ApiFactory api = new();
        private readonly string profile = Directory.CreateTempSubdirectory("safetymirror-chromium-").FullName;
        private IPlaywright? playwright;
        private IBrowserContext? context;

        public IPage Page { get; private set; } = null!;

        public async Task InitializeAsync()
        {
            var chromium = Chromium();
            api.UseKestrel(0);
            api.StartServer();
            var address = api.Services.GetRequiredService<IServer>().Features.Get<IServerAddressesFeature>()!.Addresses.First();
            playwright = await Playwright.CreateAsync();
            context = await LaunchAsync(playwright, chromium, profile, new ViewportSize { Width = A4WidthPx, Height = 1123 });
            Page = context.Pages.Count > 0 ? context.Pages[0] : await context.NewPageAsync();

            // The browser navigates to the report route; the navigation goes out as the POST a client would send.
            var url = new Uri(new Uri(address), Reports.Route).ToString();
            var body = Encoding.UTF8.GetBytes(DemoCorners.Report().ToJsonString());
            await Page.RouteAsync(url, route => route.ContinueAsync(new RouteContinueOptions
            {
                Method = "POST",
                PostData = body,
                Headers = new Dictionary<string, string>(route.Request.Headers) { ["content-type"] = "application/json", ["accept"] = Reports.Html },
            }));
            var response = await Page.GotoAsync(url);
            Assert.True(response?.Ok, $"The report page did not load: {response?.Status} {response?.StatusText}");
        }

        public async Task DisposeAsync()
        {
            if (context is not null)
            {
                await context.DisposeAsync();
            }

            playwright?.Dispose();
            await api.DisposeAsync();
            Directory.Delete(profile, recursive: true);
        }

        /// <summary>Headless Chromium with its own profile: no GPU, no network of its own, no first-run pages.</summary>
        internal static Task<IBrowserContext> LaunchAsync(IPlaywright playwright, string chromium, string profile, ViewportSize viewport) =>
            playwright.Chromium.LaunchPersistentContextAsync(profile, new BrowserTypeLaunchPersistentContextOptions
            {
                ExecutablePath = chromium,
                Headless = true,
                Args = ["--headless", "--no-sandbox", "--disable-gpu", "--disable-quic", "--no-first-run", "--disable-background-networking", "--disable-component-update", "--disable-sync"],
                ViewportSize = viewport,
            });

        /// <summary>Debian's chromium on the PATH; the test fails, not skips, without it.</summary>
        internal static string Chromium() =>
            (Environment.GetEnvironmentVariable("PATH") ?? "").Split(Path.PathSeparator)
                .Select(folder => Path.Combine(folder, "chromium"))
                .FirstOrDefault(File.Exists)
            ?? throw new InvalidOperationException("Debian's chromium is missing, and the browser test needs it: install it with `apt-get install -y chromium`, as .ci/run does.");
    }

    [Fact]
    public async Task Figures_RenderAsSvgWithSizeAndContent()
    {
        var figures = await browser.Page.EvaluateAsync<JsonElement>("""
            () => [...document.querySelectorAll('figure svg:not([aria-label="Seal or stamp"])')].map(svg => {
                const box = svg.getBoundingClientRect();
                return { width: box.width, height: box.height, shapes: svg.querySelectorAll('path, polyline, circle, text').length };
            })
            """);

        // The demo corner's report: the whole plan, its detail, and two charts for the eastbound lane the mirror serves
        // (the sign-off's seal box, empty on purpose, is left out above).
        Assert.True(figures.GetArrayLength() >= 4, "the plans and charts are all there");
        Assert.All(figures.EnumerateArray(), f =>
        {
            Assert.True(f.GetProperty("width").GetDouble() > 0, "a figure has no width");
            Assert.True(f.GetProperty("height").GetDouble() > 0, "a figure has no height");
            Assert.True(f.GetProperty("shapes").GetInt32() > 10, "a figure is drawn nearly empty");
        });
    }

    [Fact]
    public async Task PrintToPdf_EveryPage_HasTheFooterWithPageNOfN()
    {
        // Chromium prints the CSS Paged Media margin boxes (@bottom-left, @bottom-right) with counter(pages).
        using var poppler = new Poppler();
        var pdf = poppler.Write(await browser.Page.PdfAsync(new PagePdfOptions { PreferCSSPageSize = true }), "printed.pdf");
        var pages = int.Parse(Regex.Match(Poppler.Info(pdf), @"Pages:\s+(\d+)").Groups[1].Value, CultureInfo.InvariantCulture);
        var title = DemoCorners.Report()["report"]!["title"]!.GetValue<string>();

        Assert.True(pages > 1, $"{pages} page(s)");
        Assert.All(Enumerable.Range(1, pages), page =>
        {
            var text = Poppler.Text(pdf, page);
            Assert.Contains($"Page {page} of {pages}", text, StringComparison.Ordinal);
            Assert.Contains(title[..Math.Min(30, title.Length)], text, StringComparison.Ordinal);
        });
    }

    [Fact]
    public async Task PrintToPdf_EveryPlansScaleBar_MeasuresItsStatedLengthInMillimetres()
    {
        using var poppler = new Poppler();
        var pdf = poppler.Write(await browser.Page.PdfAsync(new PagePdfOptions { PreferCSSPageSize = true }), "printed-scale.pdf");
        var pages = int.Parse(Regex.Match(Poppler.Info(pdf), @"Pages:\s+(\d+)").Groups[1].Value, CultureInfo.InvariantCulture);
        const double MmPerPt = 25.4 / 72;
        var bars = new List<string>();

        foreach (var page in Enumerable.Range(1, pages))
        {
            var words = Poppler.Words(pdf, page).ToList();
            for (var i = 0; i + 1 < words.Count; i++)
            {
                if (words[i].Text != "Scale" || !words[i + 1].Text.StartsWith("1:", StringComparison.Ordinal))
                {
                    continue;
                }

                // Under the ratio: "0" at the bar's start and "N m" centred on its end, on one baseline.
                var scale = int.Parse(words[i + 1].Text[2..], CultureInfo.InvariantCulture);
                var zero = words.Where(w => w.Text == "0" && w.YMin > words[i].YMax && w.YMin < words[i].YMax + 30 && Math.Abs(w.XMin - words[i].XMin) < 30)
                    .MinBy(w => w.YMin)!;
                var unit = words.Where(w => w.Text == "m" && Math.Abs(w.YMin - zero.YMin) < 1 && w.XMin > zero.XMax).MinBy(w => w.XMin)!;
                var number = words[words.IndexOf(unit) - 1];
                var stated = double.Parse(number.Text, CultureInfo.InvariantCulture);
                var measuredMm = ((number.XMin + unit.XMax) / 2 - (zero.XMin + zero.XMax) / 2) * MmPerPt;

                // At 1:scale, a stated length in metres is that many thousandths of the scale in millimetres on paper.
                var expectedMm = stated * 1000 / scale;
                Assert.True(Math.Abs(measuredMm - expectedMm) < 0.5, $"page {page}: the {stated} m bar at 1:{scale} measures {measuredMm:0.00} mm, not {expectedMm:0.00} mm");
                bars.Add($"{stated} m at 1:{scale}");
            }
        }

        // The whole plan and its detail.
        Assert.True(bars.Count >= 2, $"scale bars found: {string.Join(", ", bars)}");
    }

    [Fact]
    public async Task PrintLayout_AtTheA4ContentWidth_HasNothingWider()
    {
        var page = browser.Page;
        await page.EmulateMediaAsync(new PageEmulateMediaOptions { Media = Media.Print });
        await page.SetViewportSizeAsync((int)Math.Ceiling(A4ContentWidthPx), 1000);
        try
        {
            var layout = await page.EvaluateAsync<JsonElement>("""
                () => {
                    const width = document.documentElement.clientWidth;
                    const wider = [...document.body.querySelectorAll('*')]
                        .filter(e => e.getBoundingClientRect().right > width + 0.5)
                        .map(e => e.tagName + ': ' + (e.textContent || '').trim().slice(0, 60));
                    return { width, scrollWidth: document.documentElement.scrollWidth, wider };
                }
                """);

            Assert.Empty(layout.GetProperty("wider").EnumerateArray().Select(e => e.GetString()));
            Assert.True(layout.GetProperty("scrollWidth").GetInt32() <= layout.GetProperty("width").GetInt32(), layout.ToString());
        }
        finally
        {
            await page.EmulateMediaAsync(new PageEmulateMediaOptions { Media = Media.Screen });
            await page.SetViewportSizeAsync(A4WidthPx, 1123);
        }
    }

    [Fact]
    public async Task ScreenLayout_AtA4Width_HasNothingWiderAndIsKeptAsAScreenshot()
    {
        var page = browser.Page;
        var scroll = await page.EvaluateAsync<int>("() => document.documentElement.scrollWidth");
        var screenshot = Path.Combine(AppContext.BaseDirectory, "artefacts", "report-demo-a4.png");
        Directory.CreateDirectory(Path.GetDirectoryName(screenshot)!);

        await page.ScreenshotAsync(new PageScreenshotOptions { Path = screenshot, FullPage = true });

        Assert.True(scroll <= A4WidthPx, $"The page is {scroll} px wide, more than A4's {A4WidthPx} px.");
        // A PNG starts with the eight bytes 89 50 4E 47 0D 0A 1A 0A (ISO/IEC 15948, 5.2).
        Assert.Equal(new byte[] { 0x89, 0x50, 0x4E, 0x47, 0x0D, 0x0A, 0x1A, 0x0A }, File.ReadAllBytes(screenshot)[..8]);
    }
}
