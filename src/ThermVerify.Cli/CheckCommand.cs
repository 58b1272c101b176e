using System.CommandLine;
using ThermVerify.Design;
using ThermVerify.Reporting;
using ThermVerify.Verification;

namespace ThermVerify.Cli;

/// <summary>`thermverify check`: verify a design; exit 0 within budget, 1 over budget or any failing finding.</summary>
internal static class CheckCommand
{
    public static Command Create()
    {
        var design = new Argument<FileInfo>("design") { Description = "the design file (TOML)" };
        var json = new Option<FileInfo?>("--json") { Description = "also write every number as JSON (schema in docs/json-output.md)" };
        var threads = new Option<int>("--threads") { Description = "simulations in parallel", DefaultValueFactory = _ => Environment.ProcessorCount };
        var noRemedies = new Option<bool>("--no-remedies") { Description = "skip the simulations that search for remedies" };
        var quiet = new Option<bool>("--quiet", "-q") { Description = "print only the verdict line" };
        var engine = new Option<string>("--engine")
        {
            Description = "simulation engine: built-in, or ngspice (needs the ngspice shared library; a design's own subcircuit needs ngspice)",
            DefaultValueFactory = _ => EngineChoice.BuiltIn,
        };
        engine.AcceptOnlyFromAmong(EngineChoice.BuiltIn, EngineChoice.Ngspice);
        var process = new Option<bool>("--ngspice-process") { Description = "with --engine ngspice: run every deck in a child 'ngspice -b' process instead of the shared library" };
        var command = new Command("check", "Verify a front end: closed form against simulation, every error in mV, LSB and K against the budget.")
        {
            design, json, threads, noRemedies, quiet, engine, process,
        };
        threads.Validators.Add(r =>
        {
            if (r.GetValueOrDefault<int>() < 1) r.AddError("--threads must be at least 1");
        });
        command.SetAction((parsed, cancel) =>
        {
            var path = parsed.GetValue(design)!.FullName;
            var loaded = DesignLoader.Load(path);
            var chosen = EngineChoice.Create(parsed.GetValue(engine)!, parsed.GetValue(process));
            var result = FrontEndCheck.Run(loaded, new CheckOptions
            {
                Threads = parsed.GetValue(threads),
                ComputeRemedies = !parsed.GetValue(noRemedies),
                Cancel = cancel,
                Engine = chosen,
            });
            if (parsed.GetValue(json) is { } jsonFile)
                AtomicFile.WriteAllText(jsonFile.FullName, CheckJson.Write(result, parsed.GetValue(design)!.ToString()));

            var output = parsed.InvocationConfiguration.Output;
            var summary = CheckSummaryText.Render(result);
            output.Write(parsed.GetValue(quiet) ? summary.Split('\n').First(l => l.StartsWith("PASS") || l.StartsWith("FAIL")) + "\n" : summary);
            return Task.FromResult(result.Passed ? ExitCodes.Success : ExitCodes.CheckFailed);
        });
        return command;
    }
}
