using System.Diagnostics;
using ThermVerify.Cli;

namespace ThermVerify.Tests.Hardening;

/// <summary>Ctrl+C (SIGINT) on a long run: the command stops, exits 130 and leaves no output file, whole or partial.</summary>
public class CancellationTests
{
    [Fact]
    public async Task Interrupting_a_long_monte_carlo_run_writes_nothing()
    {
        if (!OperatingSystem.IsLinux()) return; // SIGINT is sent with kill(1)
        var folder = Directory.CreateTempSubdirectory("tv-cancel-");
        try
        {
            var example = Path.Combine(AppContext.BaseDirectory, "..", "..", "..", "..", "..", "netlists", "oven-pt1000.toml");
            var start = new ProcessStartInfo("dotnet",
                [Path.Combine(AppContext.BaseDirectory, "ThermVerify.Cli.dll"), "montecarlo", example, "-n", "1000000",
                 "--json", Path.Combine(folder.FullName, "mc.json"), "--report", Path.Combine(folder.FullName, "report")])
            {
                RedirectStandardOutput = true, RedirectStandardError = true, UseShellExecute = false,
            };
            using var process = Process.Start(start)!;
            var error = process.StandardError.ReadToEndAsync();
            _ = process.StandardOutput.ReadToEndAsync();
            await Task.Delay(TimeSpan.FromSeconds(3)); // well into the run: a million units take minutes
            await Process.Start("kill", ["-INT", process.Id.ToString()])!.WaitForExitAsync();
            using var limit = new CancellationTokenSource(TimeSpan.FromSeconds(30)); // the run must stop well within this
            await process.WaitForExitAsync(limit.Token);
            Assert.Equal(ExitCodes.Cancelled, process.ExitCode);
            Assert.Contains("cancelled; no output file was written", await error);
            Assert.Empty(Directory.GetFileSystemEntries(folder.FullName)); // no result, no report, no temporary file
        }
        finally
        {
            folder.Delete(recursive: true);
        }
    }
}
