using System.Diagnostics;
using Microsoft.AspNetCore.Hosting;
using Microsoft.AspNetCore.Hosting.Server;
using Microsoft.AspNetCore.Hosting.Server.Features;
using Microsoft.AspNetCore.Mvc.Testing;
using Microsoft.Extensions.DependencyInjection;

namespace SafetyMirror.Api.Tests.OpenApi;

// A client we did not write calls the service on a loopback Kestrel port: openapi-typescript generates its types from
// the committed openapi/openapi.json, tsc compiles tools/openapi/client/check.ts against them, and node runs it.
public sealed class GeneratedClientTests(GeneratedClientTests.Client client) : IClassFixture<GeneratedClientTests.Client>
{
    [Fact]
    public async Task DemoEvaluation_GeneratedClient_Gets200WithDecision()
    {
        await client.RunAsync(client.DevelopmentUrl, "demo-evaluation");
    }

    [Fact]
    public async Task RadiusOutOfRange_GeneratedClient_Gets400NamingTheField()
    {
        await client.RunAsync(client.DevelopmentUrl, "bad-request");
    }

    [Fact]
    public async Task RecommendationWithoutKeyInProduction_GeneratedClient_Gets401()
    {
        await client.RunAsync(client.ProductionUrl, "no-key");
    }

    /// <summary>The client compiled once, and the service listening in the Development and Production environments.</summary>
    public sealed class Client : IAsyncLifetime
    {
        private static readonly string Tools = RepositoryFiles.PathOf("tools", "openapi");
        private readonly ApiFactory development = new();
        private readonly WebApplicationFactory<Program> production;

        public Client() => production = development.WithWebHostBuilder(host => host.UseEnvironment("Production"));

        public string DevelopmentUrl { get; private set; } = "";

        public string ProductionUrl { get; private set; } = "";

        public async Task InitializeAsync()
        {
            if (!File.Exists(Path.Combine(Tools, "node_modules", ".bin", "openapi-typescript")))
            {
                throw new InvalidOperationException("The npm tools are missing: run `npm ci --prefix tools/openapi`, as .ci/run does (needs Node.js and npm).");
            }

            var (exitCode, output) = await Run("npm", ["run", "-s", "client"]);
            Assert.True(exitCode == 0, $"Generating and compiling the client failed ({exitCode}):\n{output}");
            DevelopmentUrl = Listen(development);
            ProductionUrl = Listen(production);
        }

        public async Task DisposeAsync()
        {
            await production.DisposeAsync();
            await development.DisposeAsync();
        }

        /// <summary>Runs one case of the compiled client against a service; fails with what the client printed.</summary>
        public async Task RunAsync(string url, string name)
        {
            var (exitCode, output) = await Run("node", [Path.Combine("client", "out", "check.js"), url, name]);
            Assert.True(exitCode == 0, $"The generated client's case {name} failed:\n{output}");
        }

        private static string Listen(WebApplicationFactory<Program> factory)
        {
            factory.UseKestrel(0);
            factory.StartServer();
            return factory.Services.GetRequiredService<IServer>().Features.Get<IServerAddressesFeature>()!.Addresses.First();
        }

        private static async Task<(int ExitCode, string Output)> Run(string program, string[] arguments)
        {
            var start = new ProcessStartInfo(program) { WorkingDirectory = Tools, RedirectStandardOutput = true, RedirectStandardError = true };
            arguments.ToList().ForEach(start.ArgumentList.Add);
            using var process = Process.Start(start)!;
            var output = process.StandardOutput.ReadToEndAsync();
            var error = process.StandardError.ReadToEndAsync();
            using var timeout = new CancellationTokenSource(TimeSpan.FromMinutes(2));
            await process.WaitForExitAsync(timeout.Token);
            return (process.ExitCode, await output + await error);
        }
    }
}
