using System.Diagnostics;
using ThermVerify.Cli;
using ThermVerify.Tests.Ngspice;

namespace ThermVerify.Tests.Hardening;

/// <summary>
/// Ctrl+C (SIGINT), SIGTERM, SIGKILL and --timeout on a long run: the command stops, exits 130 (or 3 for the time
/// limit) and leaves nothing behind, no output file whole or partial, no temporary file, no ngspice folder or
/// worker. No test here assumes how fast anything is: each waits for the run to show it has started (its progress
/// line, or its ngspice folder) before it interrupts it. The waits have a guard of several minutes, there only so a
/// broken build cannot hang CI for ever; it is not a limit on the run.
/// </summary>
[Collection(TemporaryFolderCollection.Name)]
public sealed class CancellationTests : IDisposable
{
    private static readonly TimeSpan HangGuard = TimeSpan.FromMinutes(10);

    private readonly DirectoryInfo folder = Directory.CreateTempSubdirectory("tv-cancel-");

    public void Dispose() => folder.Delete(recursive: true);

    private static string Example(string name) => Path.Combine(AppContext.BaseDirectory, "..", "..", "..", "..", "..", "netlists", name);

    private static Process Start(params string[] args)
    {
        var start = new ProcessStartInfo("dotnet", [Path.Combine(AppContext.BaseDirectory, "ThermVerify.Cli.dll"), .. args])
        {
            RedirectStandardOutput = true, RedirectStandardError = true, UseShellExecute = false,
        };
        return Process.Start(start)!;
    }

    private static void Signal(Process process, string signal) =>
        Process.Start("kill", [$"-{signal}", process.Id.ToString()])!.WaitForExit();

    /// <summary>Reads standard error line by line until a line satisfies <paramref name="started"/>; returns everything read.</summary>
    private static async Task<string> WaitFor(Process process, Func<string, bool> started)
    {
        using var guard = new CancellationTokenSource(HangGuard);
        var seen = new System.Text.StringBuilder();
        while (await process.StandardError.ReadLineAsync(guard.Token) is { } line)
        {
            seen.AppendLine(line);
            if (started(line)) return seen.ToString();
        }
        Assert.Fail($"the run ended before it showed it had started:\n{seen}");
        return "";
    }

    private static async Task<(int Code, string Error)> Finish(Process process, string before)
    {
        using var guard = new CancellationTokenSource(HangGuard);
        var rest = await process.StandardError.ReadToEndAsync(guard.Token);
        await process.WaitForExitAsync(guard.Token);
        return (process.ExitCode, before + rest);
    }

    private void AssertNothingWritten() => Assert.Empty(Directory.GetFileSystemEntries(folder.FullName, "*", SearchOption.AllDirectories));

    [Theory]
    [InlineData("INT")]
    [InlineData("TERM")]
    public async Task Interrupting_a_long_monte_carlo_run_writes_nothing(string signal)
    {
        if (!OperatingSystem.IsLinux()) return; // signals are sent with kill(1)
        using var process = Start("montecarlo", Example("oven-pt1000.toml"), "-n", "1000000", "--threads", "1", "--progress",
            "--json", Path.Combine(folder.FullName, "mc.json"), "--report", Path.Combine(folder.FullName, "report"),
            "--csv", Path.Combine(folder.FullName, "envelope.csv"));
        _ = process.StandardOutput.ReadToEndAsync();
        var before = await WaitFor(process, line => line.StartsWith("units:", StringComparison.Ordinal)); // the run has begun
        Signal(process, signal);
        var (code, error) = await Finish(process, before);
        Assert.Equal(ExitCodes.Cancelled, code);
        Assert.Contains("cancelled; no output file was written", error);
        AssertNothingWritten();
    }

    /// <summary>
    /// Ctrl+C pressed again and again while the run stops: the process still ends by itself with 130 and writes nothing.
    /// Before the process handled the signals itself, a second one arriving after the command had returned (in the
    /// clean-up) killed the process by SIGINT.
    /// </summary>
    [Fact]
    public async Task Ctrl_c_pressed_again_while_stopping_never_kills_the_process()
    {
        if (!OperatingSystem.IsLinux()) return;
        using var process = Start("montecarlo", Example("oven-pt1000.toml"), "-n", "1000000", "--threads", "1", "--progress",
            "--json", Path.Combine(folder.FullName, "mc.json"));
        _ = process.StandardOutput.ReadToEndAsync();
        var before = await WaitFor(process, line => line.StartsWith("units:", StringComparison.Ordinal));
        for (var k = 0; k < 20 && !process.HasExited; k++)
            Signal(process, "INT");
        var (code, error) = await Finish(process, before);
        Assert.Equal(ExitCodes.Cancelled, code);
        Assert.Contains("cancelled; no output file was written", error);
        AssertNothingWritten();
    }

    /// <summary>
    /// The other long searches: `choose-fixed` (182 E96 candidates, each a full check; the buffered cable probe's take
    /// seconds each) and `worstcase` (a thousand corner units on the buffered logger), interrupted once or pressed
    /// again and again, on one thread and on two: each stops with 130 and writes nothing (issue 17 item 5). The
    /// cancellation reaches inside each candidate through the run's token and the solvers' checks (Limits/Work).
    /// </summary>
    [Theory]
    [InlineData("choose-fixed", "buffered-cable-probe.toml", "1", 1)]
    [InlineData("choose-fixed", "buffered-cable-probe.toml", "2", 20)]
    [InlineData("worstcase", "cold-storage-logger-buffered.toml", "1", 1)]
    [InlineData("worstcase", "cold-storage-logger-buffered.toml", "2", 20)]
    public async Task Interrupting_a_search_stops_it_and_writes_nothing(string command, string example, string threads, int presses)
    {
        if (!OperatingSystem.IsLinux()) return;
        using var process = Start(command, Example(example), "--threads", threads, "--progress",
            "--json", Path.Combine(folder.FullName, "out.json"));
        _ = process.StandardOutput.ReadToEndAsync();
        // The first progress line: at least one candidate or unit is done and the next ones are running.
        var before = await WaitFor(process, line => line.StartsWith("candidates:", StringComparison.Ordinal) || line.StartsWith("units:", StringComparison.Ordinal));
        for (var k = 0; k < presses && !process.HasExited; k++)
            Signal(process, "INT");
        var (code, error) = await Finish(process, before);
        Assert.Equal(ExitCodes.Cancelled, code);
        Assert.Contains("cancelled; no output file was written", error);
        AssertNothingWritten();
    }

    [Fact]
    public async Task A_time_limit_stops_the_run_with_exit_3_and_writes_nothing()
    {
        using var process = Start("montecarlo", Example("oven-pt1000.toml"), "-n", "1000000", "--threads", "1", "--timeout", "1",
            "--json", Path.Combine(folder.FullName, "mc.json"));
        _ = process.StandardOutput.ReadToEndAsync();
        var (code, error) = await Finish(process, "");
        Assert.Equal(ExitCodes.SimulationFailed, code);
        Assert.Contains("stopped at the time limit of 1 s (--timeout)", error);
        AssertNothingWritten();
    }

    private static string[] NgspiceFolders(int pid) =>
        Directory.GetDirectories(Path.GetTempPath(), $"thermverify-ngspice-{pid}-*");

    /// <summary>Waits until the run has an ngspice folder and a child process (a worker or an ngspice program): the engine is at work.</summary>
    private static List<Process> WaitForNgspice(Process process)
    {
        var guard = Stopwatch.StartNew();
        while (!process.HasExited && guard.Elapsed < HangGuard)
        {
            var children = Process.GetProcesses().Where(p => IsChildOf(p, process.Id)).ToList();
            if (NgspiceFolders(process.Id).Length > 0 && children.Count > 0) return children;
            Thread.Sleep(10);
        }
        Assert.Fail("the run ended before ngspice started");
        return [];
    }

    [NgspiceTheory]
    [InlineData("library", "INT")]
    [InlineData("process", "INT")]
    [InlineData("library", "KILL")]
    [InlineData("process", "KILL")]
    public async Task Stopping_a_check_on_ngspice_leaves_no_temporary_folder_and_no_worker(string mode, string signal)
    {
        if (!OperatingSystem.IsLinux()) return;
        string[] engine = mode == "process" ? ["--engine", "ngspice", "--ngspice-process"] : ["--engine", "ngspice"];
        using var process = Start(["check", Example("cold-storage-logger-reservoir.toml"), "-q", "--threads", "1",
            "--json", Path.Combine(folder.FullName, "check.json"), .. engine]);
        _ = process.StandardOutput.ReadToEndAsync();
        var error = process.StandardError.ReadToEndAsync();
        var workers = WaitForNgspice(process);
        var pid = process.Id;
        Signal(process, signal);
        using (var guard = new CancellationTokenSource(HangGuard)) await process.WaitForExitAsync(guard.Token);
        if (signal == "INT")
        {
            Assert.Equal(ExitCodes.Cancelled, process.ExitCode);
            Assert.Contains("cancelled", await error);
        }
        // After SIGKILL the worker sees its input end, removes its folder and ends; a child ngspice finishes its deck.
        foreach (var worker in workers)
            using (var guard = new CancellationTokenSource(HangGuard)) await worker.WaitForExitAsync(guard.Token);
        // A process killed outright cannot remove the folder of the ngspice program it had started: the next run
        // sweeps the folders of processes that no longer exist (the worker of the library mode removes its own).
        if (signal == "KILL" && mode == "process")
            ThermVerify.Ngspice.TemporaryFolders.SweepAbandoned();
        Assert.Empty(NgspiceFolders(pid));
        AssertNothingWritten();
    }

    private static bool IsChildOf(Process candidate, int parent)
    {
        try
        {
            var stat = File.ReadAllText($"/proc/{candidate.Id}/stat");
            var fields = stat[(stat.LastIndexOf(')') + 2)..].Split(' ');
            return int.Parse(fields[1]) == parent;
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException or FormatException or IndexOutOfRangeException)
        {
            return false;
        }
    }
}
