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
        command.SetAction((parsed, cancel) =>
        {
            var path = parsed.GetValue(design)!.FullName;
            var target = parsed.GetValue(outFile)?.FullName ?? Baseline.DefaultPathFor(path);
            // Refuse before the simulations run rather than after.
            if (!parsed.GetValue(force) && File.Exists(target))
                throw new OutputExistsException($"{target} exists already; pass --force to replace it");
            var (baseline, result) = Verifier.MakeBaseline(Verifier.LoadDesign(path), new CheckOptions { Threads = parsed.GetValue(threads), Cancel = cancel });
            AtomicFile.WriteAllText(target, BaselineFile.ToJson(baseline), parsed.GetValue(force));
            parsed.InvocationConfiguration.Output.Write(BaselineText.Render(target, baseline, result.Passed));
            return Task.FromResult(ExitCodes.Success);
        });
        return command;
    }
}
