using System.CommandLine;
using ThermVerify.Baselines;
using ThermVerify.Check;
using ThermVerify.Design;
using ThermVerify.Files;
using ThermVerify.Reporting;

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
            var result = FrontEndCheck.Run(DesignLoader.Load(path), new CheckOptions { Threads = parsed.GetValue(threads), ComputeRemedies = false, Cancel = cancel });
            var baseline = BaselineFigures.From(result, CheckJson.ToolVersion());
            BaselineFile.Write(target, baseline, parsed.GetValue(force));

            var output = parsed.InvocationConfiguration.Output;
            output.WriteLine($"baseline written: {target} ({baseline.Figures.Count} figures; the check itself {(result.Passed ? "passes" : "fails")})");
            var table = new TextTable("figure", "value", "better", "tolerance");
            foreach (var f in baseline.Figures)
                table.AddRow(f.Id, f.Value is { } v ? FormattableString.Invariant($"{v:0.####} {f.Unit}") : "none", f.Better == Better.Lower ? "lower" : "higher",
                    FormattableString.Invariant($"±{f.Tolerance:0.####} {f.Unit}"));
            output.Write(table);
            return Task.FromResult(ExitCodes.Success);
        });
        return command;
    }
}
