using System.Diagnostics;
using ThermVerify.Check;
using ThermVerify.Cli;
using ThermVerify.Reporting.Text;
using ThermVerify.Tests.Check;

namespace ThermVerify.Tests.Cli;

/// <summary>`watch` checks a design again on every save and says what changed; Ctrl+C ends it cleanly.</summary>
public class WatchCommandTests
{
    /// <summary>Only a guard against a loop that never answers; nothing here measures time.</summary>
    private static readonly TimeSpan HangGuard = TimeSpan.FromMinutes(5);

    [Fact]
    public void What_changed_between_two_checks_is_listed()
    {
        var options = new CheckOptions { ComputeRemedies = false, MaximumSamplingPoints = 3 };
        var before = FrontEndCheck.Run(TestDesign.Make(("check.step", "\"10 K\"")), options);
        var after = FrontEndCheck.Run(TestDesign.Make(("check.step", "\"10 K\""), ("check.budget", "\"0.001 K\"")), options);
        var text = ChangeText.Render(before, after);
        Assert.Contains("verdict PASS → FAIL", text);
        Assert.Contains("finding added: FAIL over-budget", text);
        Assert.Contains("verdict PASS (unchanged)", ChangeText.Render(before, before));
        Assert.Contains("finding cleared: FAIL over-budget", ChangeText.Render(after, before));
    }

    [Fact]
    public async Task A_saved_edit_gives_the_new_verdict_and_ctrl_c_ends_the_loop()
    {
        if (!OperatingSystem.IsLinux()) return; // SIGINT is sent with kill(1)
        var folder = Directory.CreateTempSubdirectory("tv-watch-");
        try
        {
            var design = Path.Combine(folder.FullName, "probe.toml");
            File.Copy(Path.Combine(Repository.Netlists, "oven-pt1000.toml"), design);
            var start = new ProcessStartInfo("dotnet", [Path.Combine(AppContext.BaseDirectory, "ThermVerify.Cli.dll"), "watch", design, "--no-remedies",
                "--report", Path.Combine(folder.FullName, "report")])
            {
                RedirectStandardOutput = true, RedirectStandardError = true, UseShellExecute = false,
            };
            using var process = Process.Start(start)!;
            _ = process.StandardError.ReadToEndAsync();
            using var guard = new CancellationTokenSource(HangGuard);
            async Task<string> LineStartingWith(string text)
            {
                while (await process.StandardOutput.ReadLineAsync(guard.Token) is { } line)
                    if (line.Contains(text, StringComparison.Ordinal)) return line;
                throw new InvalidOperationException($"watch ended before printing '{text}'");
            }

            Assert.Contains("PASS", await LineStartingWith("] PASS"));
            File.WriteAllText(design, File.ReadAllText(design).Replace("budget = \"3 K\"", "budget = \"0.01 K\""));
            await LineStartingWith("changed: probe.toml");
            Assert.Contains("FAIL", await LineStartingWith("] FAIL"));
            Assert.Contains("verdict PASS → FAIL", await LineStartingWith("verdict"));
            Assert.True(File.Exists(Path.Combine(folder.FullName, "report", "report.html")));

            await Process.Start("kill", ["-INT", process.Id.ToString()])!.WaitForExitAsync(guard.Token);
            await LineStartingWith("stopped watching");
            await process.WaitForExitAsync(guard.Token);
            Assert.Equal(ExitCodes.Success, process.ExitCode);
        }
        finally
        {
            folder.Delete(recursive: true);
        }
    }
}
