using System.CommandLine;
using ThermVerify.Api;
using ThermVerify.Baselines;
using ThermVerify.Check;
using ThermVerify.Design;
using ThermVerify.Files;
using ThermVerify.Reporting;
using ThermVerify.Reporting.Text;

namespace ThermVerify.Cli;

/// <summary>`thermverify baseline`: run the check and keep its key figures for later `check --baseline` runs.</summary>
internal static class BaselineCommand
{
    public static Command Create()
    {
        var design = new Argument<FileInfo>("design") { Description = "the design file (TOML)" };
        var outFile = new Option<FileInfo?>("--out") { Description = "where to write the baseline (default: beside the design, NAME.baseline.json)" };
        var force = new Option<bool>("--force") { Description = "replace an existing baseline" };
        var threads = new Option<int>("--threads") { Description = "simulations in parallel", DefaultValueFactory = _ => Environment.ProcessorCount };
        threads.Validators.Add(r =>
        {
            if (r.GetValueOrDefault<int>() < 1) r.AddError("--threads must be at least 1");
        });
        var command = new Command("baseline", "Check a design and write its key figures (worst errors per region, margins, settling and loading errors) as a regression baseline.")
        {
            design, outFile, force, threads,
        };
        var simulation = SimulationOptions.AddTo(command);
        var work = WorkOptions.AddTo(command);
        command.SetAction((parsed, interrupt) => work.Run(parsed, interrupt, cancel =>
        {
            var path = parsed.GetValue(design)!.FullName;
            var target = parsed.GetValue(outFile)?.ToString() ?? Baseline.DefaultPathFor(path);
            Baseline? baseline = null;
            // Refuse before the simulations run rather than after.
            var outputs = new OutputSet(parsed.GetValue(force)).Add(target, () => BaselineFile.ToJson(baseline!));
            outputs.CheckTargets();
            using var chosen = simulation.Engine(parsed);
            (baseline, var result) = Verifier.MakeBaseline(Verifier.LoadDesign(path), new CheckOptions
            {
                Threads = parsed.GetValue(threads),
                MaximumSamplingPoints = simulation.SamplingPoints(parsed),
                Engine = chosen.Engine,
                Progress = work.Progress(parsed, "sampling runs"),
                Cancel = cancel,
            });
            outputs.Write();
            parsed.InvocationConfiguration.Output.Write(BaselineText.Render(target, baseline, result.Passed));
            return ExitCodes.Success;
        }));
        return command;
    }
}
