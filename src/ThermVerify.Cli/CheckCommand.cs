using System.CommandLine;
using ThermVerify.Baselines;
using ThermVerify.Check;
using ThermVerify.Design;
using ThermVerify.Files;
using ThermVerify.Firmware;
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
        var samplingPoints = new Option<int>("--sampling-points")
        {
            Description = "simulate sampling at this many temperatures at most (every point of the sweep when it has fewer)",
            DefaultValueFactory = _ => new CheckOptions().MaximumSamplingPoints,
        };
        var engine = new Option<string>("--engine")
        {
            Description = "simulation engine: built-in, or ngspice (needs the ngspice shared library; a design's own subcircuit needs ngspice)",
            DefaultValueFactory = _ => EngineChoice.BuiltIn,
        };
        engine.AcceptOnlyFromAmong(EngineChoice.BuiltIn, EngineChoice.Ngspice);
        var process = new Option<bool>("--ngspice-process") { Description = "with --engine ngspice: run every deck in a child 'ngspice -b' process instead of the shared library" };
        var command = new Command("check", "Verify a front end: closed form against simulation, every error in mV, LSB and K against the budget.")
        {
            design, json, threads, noRemedies, quiet, report, junit, baseline, force, samplingPoints, engine, process,
        };
        threads.Validators.Add(r =>
        {
            if (r.GetValueOrDefault<int>() < 1) r.AddError("--threads must be at least 1");
        });
        samplingPoints.Validators.Add(r =>
        {
            if (r.GetValueOrDefault<int>() < 2) r.AddError("--sampling-points must be at least 2 (both ends of the range)");
        });
        command.SetAction((parsed, cancel) =>
        {
            var path = parsed.GetValue(design)!.FullName;
            var loaded = DesignLoader.Load(path);
            // Refuse to replace outputs before the work, not after it: a long run is not wasted on a refusal.
            var overwrite = parsed.GetValue(force);
            foreach (var file in new[] { parsed.GetValue(json), parsed.GetValue(junit) })
                if (file is { Exists: true } && !overwrite)
                    throw new OutputExistsException($"{file} exists already; pass --force to replace it");
            if (parsed.GetValue(report) is { } folder)
                ReportDirectory.EnsureWritable(folder.FullName, overwrite);
            var chosen = EngineChoice.Create(parsed.GetValue(engine)!, parsed.GetValue(process));
            var result = FrontEndCheck.Run(loaded, new CheckOptions
            {
                Threads = parsed.GetValue(threads),
                ComputeRemedies = !parsed.GetValue(noRemedies),
                MaximumSamplingPoints = parsed.GetValue(samplingPoints),
                Cancel = cancel,
                Engine = chosen,
            });
            var faults = FaultThresholdsOrNull(loaded);
            if (parsed.GetValue(json) is { } jsonFile)
                AtomicFile.WriteAllText(jsonFile.FullName, CheckJson.Write(result, parsed.GetValue(design)!.ToString(), faults), overwrite);

            var comparison = parsed.GetValue(baseline) is { } baselineFile
                ? BaselineComparison.Compare(baselineFile.ToString(), BaselineFile.Read(baselineFile.FullName), BaselineFigures.From(result, CheckJson.ToolVersion()))
                : null;
            if (parsed.GetValue(junit) is { } junitFile)
                AtomicFile.WriteAllText(junitFile.FullName, CheckJUnit.Write(result, comparison), overwrite);
            if (parsed.GetValue(report) is { } reportFolder)
                ReportDirectory.Write(CheckReport.Build(result, parsed.GetValue(design)!.ToString(), comparison), reportFolder.FullName, overwrite);

            var output = parsed.InvocationConfiguration.Output;
            var summary = CheckSummaryText.Render(result);
            if (faults is not null)
            {
                var caution = summary.LastIndexOf(CheckSummaryText.Caution, StringComparison.Ordinal);
                summary = summary.Insert(caution, FaultText.Render(faults) + Environment.NewLine + Environment.NewLine);
            }
            output.Write(parsed.GetValue(quiet) ? summary.Split('\n').First(l => l.StartsWith("PASS") || l.StartsWith("FAIL")) + "\n" : summary);
            if (comparison is not null)
                output.Write(parsed.GetValue(quiet) ? BaselineTable.Render(comparison).Split('\n')[0] + "\n" : "\n" + BaselineTable.Render(comparison));
            if (parsed.GetValue(report) is { } written)
                output.WriteLine($"report: {Path.Combine(written.ToString(), ReportDirectory.HtmlFile)}, {Path.Combine(written.ToString(), ReportDirectory.MarkdownFile)}");
            var passed = result.Passed && comparison?.Passed != false;
            return Task.FromResult(passed ? ExitCodes.Success : ExitCodes.CheckFailed);
        });
        return command;
    }

    /// <summary>
    /// The codes an open or shorted sensor or fixed resistor produce, and thresholds with margin; none when the
    /// tolerances leave no room between a fault and a healthy reading (the table command explains why).
    /// </summary>
    private static FaultThresholds? FaultThresholdsOrNull(FrontEndDesign design)
    {
        try
        {
            return FaultAnalysis.Thresholds(FirmwareFromDesign.Model(design, correctForLoading: false), FirmwareFromDesign.Tolerances(design));
        }
        catch (FirmwareInputException)
        {
            return null;
        }
    }
}
