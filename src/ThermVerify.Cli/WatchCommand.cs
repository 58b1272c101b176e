using System.CommandLine;
using ThermVerify.Api;
using ThermVerify.Check;
using ThermVerify.Design;
using ThermVerify.Files;
using ThermVerify.Reporting;
using ThermVerify.Reporting.Text;

namespace ThermVerify.Cli;

/// <summary>
/// `thermverify watch`: check the design, then again whenever it (or a file it names) is saved, printing what
/// changed; with --report the report folder is kept current and an open page reloads itself. Ctrl+C ends it.
/// </summary>
internal static class WatchCommand
{
    /// <summary>How often the files are looked at: quick enough to feel immediate, rare enough to cost nothing.</summary>
    private static readonly TimeSpan PollInterval = TimeSpan.FromMilliseconds(300);

    public static Command Create()
    {
        var design = new Argument<FileInfo>("design") { Description = "the design file (TOML)" };
        var report = new Option<DirectoryInfo?>("--report") { Description = "keep report.html, report.md and plots/ current in this folder; an open report page reloads itself" };
        var noRemedies = new Option<bool>("--no-remedies") { Description = "skip the simulations that search for remedies (faster turns)" };
        var threads = new Option<int>("--threads") { Description = "simulations in parallel", DefaultValueFactory = _ => Environment.ProcessorCount };
        var force = new Option<bool>("--force") { Description = "replace a report already in the --report folder" };
        var engine = new Option<string>("--engine") { Description = "simulation engine: built-in, or ngspice", DefaultValueFactory = _ => EngineChoice.BuiltIn };
        engine.AcceptOnlyFromAmong(EngineChoice.BuiltIn, EngineChoice.Ngspice);
        var command = new Command("watch", "Check a design again every time it is saved, print what changed, and keep a live report.")
        {
            design, report, noRemedies, threads, engine, force,
        };
        threads.Validators.Add(r => { if (r.GetValueOrDefault<int>() < 1) r.AddError("--threads must be at least 1"); });
        command.SetAction(async (parsed, invocation) =>
        {
            using var interrupted = CancellationTokenSource.CreateLinkedTokenSource(invocation, Interruption.Token);
            var cancel = interrupted.Token;
            var path = parsed.GetValue(design)!.FullName;
            if (parsed.GetValue(report) is { } reportFolder)
                ReportDirectory.EnsureWritable(reportFolder.FullName, parsed.GetValue(force));
            var output = parsed.InvocationConfiguration.Output;
            using var chosen = EngineChoice.Create(parsed.GetValue(engine)!, childProcess: false);
            var options = new CheckOptions
            {
                Threads = parsed.GetValue(threads),
                ComputeRemedies = !parsed.GetValue(noRemedies),
                Engine = chosen.Engine,
                Cancel = cancel,
            };
            CheckResult? previous = null;
            var stamp = 0L;
            output.WriteLine($"watching {parsed.GetValue(design)}; Ctrl+C to stop");
            try
            {
                while (true)
                {
                    // Hashed before the check runs, so a save during the run is seen as a change afterwards.
                    var files = new FileSet([path]);
                    try
                    {
                        var loaded = Verifier.LoadDesign(path);
                        files = new FileSet(DesignFiles.Of(path, loaded));
                        var run = Verifier.Check(loaded, options);
                        var result = run.Result;
                        output.Write($"[{DateTime.Now:HH:mm:ss}] {CheckSummaryText.VerdictLine(result)}");
                        if (previous is not null) output.Write(ChangeText.Render(previous, result));
                        if (parsed.GetValue(report) is { } folder)
                            LiveReport.Write(CheckReport.Build(result, run.Provenance, parsed.GetValue(design)!.ToString()), folder.FullName, ++stamp);
                        previous = result;
                    }
                    catch (Exception e) when (ExitCodeOf(e) is ExitCodes.BadInput or ExitCodes.SimulationFailed)
                    {
                        output.WriteLine($"[{DateTime.Now:HH:mm:ss}] {e.Message}"); // fix the file and save: the loop goes on
                    }
                    var changed = await files.WaitForChangeAsync(PollInterval, cancel);
                    output.WriteLine($"[{DateTime.Now:HH:mm:ss}] changed: {string.Join(", ", changed.Select(Path.GetFileName))}");
                }
            }
            catch (OperationCanceledException) when (cancel.IsCancellationRequested)
            {
                output.WriteLine("stopped watching");
                return ExitCodes.Success;
            }
        });
        return command;
    }

    private static int ExitCodeOf(Exception e) => ErrorReport.ExitCodeFor(e);
}
