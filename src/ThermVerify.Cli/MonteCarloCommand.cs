using System.CommandLine;
using ThermVerify.Api;
using ThermVerify.Design;
using ThermVerify.Files;
using ThermVerify.Provenance;
using ThermVerify.Reporting;
using ThermVerify.Reporting.Text;
using ThermVerify.Tolerances;

namespace ThermVerify.Cli;

/// <summary>`thermverify montecarlo`: build N units with their own parts, verify each, report the envelope and the yield.</summary>
internal static class MonteCarloCommand
{
    public static Command Create()
    {
        var design = new Argument<FileInfo>("design") { Description = "the design file (TOML)" };
        var units = new Option<int>("--units", "-n") { Description = "units to build and verify", DefaultValueFactory = _ => 10_000 };
        var seed = new Option<ulong>("--seed") { Description = "seed of the random parts; the same seed gives the same result on any thread count", DefaultValueFactory = _ => 1 };
        var threads = new Option<int>("--threads") { Description = "units verified in parallel", DefaultValueFactory = _ => Environment.ProcessorCount };
        var minimumYield = new Option<double?>("--minimum-yield") { Description = "exit 1 when fewer than this percentage of units meet the budget" };
        var csv = new Option<FileInfo?>("--csv") { Description = "write the error envelope against temperature as CSV (for plots)" };
        var unitsCsv = new Option<FileInfo?>("--units-csv") { Description = "write every unit's worst error and its parts' deviations as CSV" };
        var noSettling = new Option<bool>("--no-unit-settling") { Description = "use the nominal settling for every unit instead of each unit's own sampling transient" };
        var command = new Command("montecarlo", "Build units with random parts within their tolerances, verify each, and report the error envelope, the yield and the main contributors.")
        {
            design, units, seed, threads, minimumYield, csv, unitsCsv, noSettling,
        };
        var outputs = AnalysisOutputs.AddTo(command);
        var work = WorkOptions.AddTo(command);
        units.Validators.Add(r => { if (r.GetValueOrDefault<int>() is < 2 or > MaximumUnits) r.AddError($"--units must be between 2 and {MaximumUnits}"); });
        threads.Validators.Add(r => { if (r.GetValueOrDefault<int>() is < 1 or > 1024) r.AddError("--threads must be between 1 and 1024"); });
        command.SetAction((parsed, interrupt) => work.Run(parsed, interrupt, cancel =>
        {
            var loaded = DesignLoader.Load(parsed.GetValue(design)!.FullName);
            var designPath = parsed.GetValue(design)!.ToString();
            MonteCarloResult? result = null;
            RunProvenance? provenance = null;
            var set = outputs.NewSet(parsed);
            outputs.Declare(parsed, set, () => MonteCarloJson.Write(result!, loaded, provenance!, designPath, !parsed.GetValue(noSettling)),
                () => MonteCarloReport.Build(result!, loaded, provenance!, designPath, parsed.GetValue(minimumYield)));
            if (parsed.GetValue(csv) is { } envelopeFile)
                set.Add(envelopeFile.ToString(), () => MonteCarloText.EnvelopeCsv(result!));
            if (parsed.GetValue(unitsCsv) is { } unitFile)
                set.Add(unitFile.ToString(), () => MonteCarloText.UnitsCsv(result!));
            set.CheckTargets();
            var output = parsed.InvocationConfiguration.Output;
            var options = new MonteCarloOptions
            {
                Units = parsed.GetValue(units),
                Seed = parsed.GetValue(seed),
                Threads = parsed.GetValue(threads),
                SimulateSettling = !parsed.GetValue(noSettling),
                Progress = work.Progress(parsed, "units"),
                Cancel = cancel,
            };
            result = Verifier.MonteCarlo(loaded, options);
            provenance = RunStamp.MonteCarlo(loaded, options);
            set.Write();
            output.Write(MonteCarloText.Render(loaded, result, provenance));
            outputs.Announce(parsed);
            var passed = parsed.GetValue(minimumYield) is not { } wanted || 100 * result.Yield >= wanted;
            return passed ? ExitCodes.Success : ExitCodes.CheckFailed;
        }));
        return command;
    }

    /// <summary>Ten million units: each keeps a few numbers, so more would outgrow memory long before it finished.</summary>
    private const int MaximumUnits = 10_000_000;
}
