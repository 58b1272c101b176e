using System.CommandLine;
using ThermVerify.Reporting.Text;
using ThermVerify.Api;
using ThermVerify.Check;
using ThermVerify.Design;
using ThermVerify.Files;
using ThermVerify.Reporting;

namespace ThermVerify.Cli;

/// <summary>`thermverify check`: verify a design; exit 0 within budget, 1 over budget, any failing finding or a figure worse than its baseline.</summary>
internal static class CheckCommand
{
    public static Command Create()
    {
        var design = new Argument<FileInfo>("design") { Description = "the design file (TOML)" };
        var json = new Option<FileInfo?>("--json") { Description = "also write every number as JSON (schema in docs/json-output.md)" };
        var threads = new Option<int>("--threads") { Description = "simulations in parallel", DefaultValueFactory = _ => Environment.ProcessorCount };
        var noRemedies = new Option<bool>("--no-remedies") { Description = "skip the simulations that search for remedies" };
        var quiet = new Option<bool>("--quiet", "-q") { Description = "print only the verdict line" };
        var report = new Option<DirectoryInfo?>("--report") { Description = "write report.html (self-contained), report.md and plots/ (PNG, SVG) into this folder" };
        var junit = new Option<FileInfo?>("--junit") { Description = "also write JUnit XML: one test case per check and per finding" };
        var baseline = new Option<FileInfo?>("--baseline") { Description = "compare with a baseline (thermverify baseline); exit 1 when a figure got worse than its tolerance" };
        var force = new Option<bool>("--force") { Description = "replace existing output files (--json, --junit, the --report folder's report)" };
        var command = new Command("check", "Verify a front end: closed form against simulation, every error in mV, LSB and K against the budget.")
        {
            design, json, threads, noRemedies, quiet, report, junit, baseline, force,
        };
        var simulation = SimulationOptions.AddTo(command);
        var work = WorkOptions.AddTo(command);
        threads.Validators.Add(r =>
        {
            if (r.GetValueOrDefault<int>() is < 1 or > 1024) r.AddError("--threads must be between 1 and 1024");
        });
        command.SetAction((parsed, interrupt) => work.Run(parsed, interrupt, cancel =>
        {
            var loaded = DesignLoader.Load(parsed.GetValue(design)!.FullName);
            var designPath = parsed.GetValue(design)!.ToString();
            // Every output is declared and checked before the work, and written as one set after it.
            CheckRun? run = null;
            var outputs = new OutputSet(parsed.GetValue(force));
            if (parsed.GetValue(json) is { } jsonFile)
                outputs.Add(jsonFile.ToString(), () => CheckJson.Write(run!.Result, run.Provenance, designPath));
            if (parsed.GetValue(junit) is { } junitFile)
                outputs.Add(junitFile.ToString(), () => CheckJUnit.Write(run!.Result, run.Provenance, run.Baseline));
            if (parsed.GetValue(report) is { } reportFolder)
                outputs.AddFolder(reportFolder.ToString(), () => ReportDirectory.Files(CheckReport.Build(run!.Result, run.Provenance, designPath, run.Baseline)),
                    ReportDirectory.ExpectedFiles);
            outputs.CheckTargets();
            using var chosen = simulation.Engine(parsed);
            run = Verifier.Check(loaded, new CheckOptions
            {
                Threads = parsed.GetValue(threads),
                ComputeRemedies = !parsed.GetValue(noRemedies),
                MaximumSamplingPoints = simulation.SamplingPoints(parsed),
                Progress = work.Progress(parsed, "sampling runs", parsed.GetValue(quiet)),
                RemedyProgress = parsed.GetValue(noRemedies) ? null : work.Progress(parsed, "remedy searches", parsed.GetValue(quiet)),
                Cancel = cancel,
                Engine = chosen.Engine,
            }, parsed.GetValue(baseline)?.FullName);
            outputs.Write();

            var output = parsed.InvocationConfiguration.Output;
            output.Write(parsed.GetValue(quiet) ? CheckSummaryText.VerdictLine(run.Result) : CheckSummaryText.Render(run.Result, run.Provenance));
            if (run.Baseline is { } comparison)
                output.Write(parsed.GetValue(quiet) ? BaselineTable.Headline(comparison) + "\n" : "\n" + BaselineTable.Render(comparison));
            if (parsed.GetValue(report) is { } written)
                output.WriteLine($"report: {Path.Combine(written.ToString(), ReportDirectory.HtmlFile)}, {Path.Combine(written.ToString(), ReportDirectory.MarkdownFile)}");
            return run.Passed ? ExitCodes.Success : ExitCodes.CheckFailed;
        }));
        return command;
    }
}
