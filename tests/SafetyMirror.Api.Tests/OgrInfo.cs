using System.ComponentModel;
using System.Diagnostics;

namespace SafetyMirror.Api.Tests;

/// <summary>GDAL's ogrinfo (Debian gdal-bin), an independent GeoJSON reader, run on a file.</summary>
internal static class OgrInfo
{
    /// <summary>Runs ogrinfo with the arguments and returns what it printed; fails the test, saying what to install, when it is missing.</summary>
    public static async Task<string> RunAsync(params string[] arguments)
    {
        var start = new ProcessStartInfo("ogrinfo") { RedirectStandardOutput = true, RedirectStandardError = true };
        foreach (var argument in arguments)
        {
            start.ArgumentList.Add(argument);
        }

        Process? process = null;
        try
        {
            process = Process.Start(start);
        }
        catch (Win32Exception e)
        {
            Assert.Fail($"ogrinfo (GDAL) could not be started ({e.Message}); install it with `apt-get install -y gdal-bin`, as .ci/run does.");
        }

        using (process)
        {
            Assert.NotNull(process);
            var output = process.StandardOutput.ReadToEndAsync();
            var errors = process.StandardError.ReadToEndAsync();
            await process.WaitForExitAsync();
            Assert.True(process.ExitCode == 0, $"ogrinfo {string.Join(' ', arguments)} exited with {process.ExitCode}: {await errors}");
            return await output;
        }
    }
}
