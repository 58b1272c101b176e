using System.CommandLine;
using ThermVerify.Api;
using ThermVerify.Design;
using ThermVerify.Files;
using ThermVerify.Reporting;
using ThermVerify.Reporting.Text;
using ThermVerify.Tolerances;

namespace ThermVerify.Cli;

/// <summary>`thermverify worstcase`: extreme-value analysis and RSS over the tolerance box; exit 1 when a corner breaks the budget.</summary>
internal static class WorstCaseCommand
{
    public static Command Create()
    {
        var design = new Argument<FileInfo>("design") { Description = "the design file (TOML)" };
        var threads = new Option<int>("--threads") { Description = "simulations in parallel", DefaultValueFactory = _ => Environment.ProcessorCount };
        var csv = new Option<FileInfo?>("--csv") { Description = "write the worst-case band against temperature as CSV (for plots)" };
        var command = new Command("worstcase", "Worst case over the tolerance box (sensitivities pick the corners, each corner verified) and root-sum-square.")
        {
            design, threads, csv,
        };
        var outputs = AnalysisOutputs.AddTo(command);
        var work = WorkOptions.AddTo(command);
        threads.Validators.Add(r => { if (r.GetValueOrDefault<int>() is < 1 or > 1024) r.AddError("--threads must be between 1 and 1024"); });
        command.SetAction((parsed, interrupt) => work.Run(parsed, interrupt, cancel =>
        {
            var loaded = DesignLoader.Load(parsed.GetValue(design)!.FullName);
            var designPath = parsed.GetValue(design)!.ToString();
            WorstCaseResult? result = null;
            var provenance = RunStamp.WorstCase(loaded);
            var set = outputs.NewSet(parsed);
            outputs.Declare(parsed, set, () => WorstCaseJson.Write(result!, loaded, provenance, designPath), () => WorstCaseReport.Build(result!, loaded, provenance, designPath));
            if (parsed.GetValue(csv) is { } file)
                set.Add(file.ToString(), () => WorstCaseText.Csv(result!));
            set.CheckTargets();
            result = Verifier.WorstCase(loaded, new WorstCaseOptions { Threads = parsed.GetValue(threads), Progress = work.Progress(parsed, "units"), Cancel = cancel });
            set.Write();
            parsed.InvocationConfiguration.Output.Write(WorstCaseText.Render(loaded, result, provenance));
            outputs.Announce(parsed);
            return result.WithinBudget ? ExitCodes.Success : ExitCodes.CheckFailed;
        }));
        return command;
    }
}
