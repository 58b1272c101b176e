using System.CommandLine;
using System.Globalization;
using System.Text;
using ThermVerify.Design;
using ThermVerify.Files;
using ThermVerify.Reporting;
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
        units.Validators.Add(r => { if (r.GetValueOrDefault<int>() < 2) r.AddError("--units must be at least 2"); });
        threads.Validators.Add(r => { if (r.GetValueOrDefault<int>() < 1) r.AddError("--threads must be at least 1"); });
        command.SetAction((parsed, cancel) =>
        {
            var loaded = DesignLoader.Load(parsed.GetValue(design)!.FullName);
            outputs.EnsureWritable(parsed);
            var output = parsed.InvocationConfiguration.Output;
            var result = MonteCarlo.Run(loaded, new MonteCarloOptions
            {
                Units = parsed.GetValue(units),
                Seed = parsed.GetValue(seed),
                Threads = parsed.GetValue(threads),
                SimulateSettling = !parsed.GetValue(noSettling),
                Progress = ProgressDisplay.For(parsed.InvocationConfiguration.Error, "units"),
                Cancel = cancel,
            });
            if (parsed.GetValue(csv) is { } envelopeFile)
                AtomicFile.WriteAllText(envelopeFile.FullName, EnvelopeCsv(result));
            if (parsed.GetValue(unitsCsv) is { } unitFile)
                AtomicFile.WriteAllText(unitFile.FullName, UnitsCsv(result));
            output.Write(Summary(loaded, result));
            var designPath = parsed.GetValue(design)!.ToString();
            outputs.Write(parsed, () => MonteCarloJson.Write(result, loaded, designPath, !parsed.GetValue(noSettling)),
                () => MonteCarloReport.Build(result, loaded, designPath, parsed.GetValue(minimumYield)));
            var passed = parsed.GetValue(minimumYield) is not { } wanted || 100 * result.Yield >= wanted;
            return Task.FromResult(passed ? ExitCodes.Success : ExitCodes.CheckFailed);
        });
        return command;
    }

    private static string Summary(FrontEndDesign design, MonteCarloResult r)
    {
        var text = new StringBuilder();
        var distribution = r.Parameters.Count > 0 ? r.Parameters[0].Distribution.ToString() : "none";
        text.AppendLine(Invariant($"{design.Name}: {r.Units} units, seed {r.Seed}, tolerances {distribution}"));
        text.AppendLine(Invariant($"yield: {100 * r.Yield:0.00} % within budget ({r.UnitsWithinBudget} of {r.Units}; ±{100 * r.YieldStandardError:0.00} % standard error)"));
        text.AppendLine(Invariant($"largest self-heating in any unit: {r.MaximumSelfHeatingKelvin * 1e3:0.###} mK"));
        text.AppendLine();
        text.AppendLine("error envelope (K, reported minus true):");
        var headers = new List<string> { "T (°C)", "budget", "nominal", "min" };
        headers.AddRange(r.Percentiles.Select(p => Invariant($"p{p:0.###}")));
        headers.Add("max");
        var table = new TextTable([.. headers]);
        var every = Math.Max(1, r.Envelope.Count / 20);
        for (var i = 0; i < r.Envelope.Count; i++)
        {
            if (i % every != 0 && i != r.Envelope.Count - 1) continue;
            var e = r.Envelope[i];
            table.AddRow([Invariant($"{e.Celsius:0.##}"), K(e.BudgetKelvin), K(e.NominalErrorKelvin), K(e.MinKelvin),
                .. e.PercentileKelvin.Select(K), K(e.MaxKelvin)]);
        }
        text.Append(table);
        text.AppendLine();
        text.AppendLine(Invariant($"contributors, share of the error variance at {r.ContributorsCelsius:0.##} °C (σ = {Math.Sqrt(r.VarianceKelvinSquared):0.####} K):"));
        var shares = new TextTable("tolerance", "share", "±tolerance");
        foreach (var s in r.Contributors)
        {
            var p = r.Parameters.FirstOrDefault(q => q.Key == s.Key);
            shares.AddRow(s.Key, Invariant($"{100 * s.Share:0.0} %"), p is null ? "" : Tolerance(p));
        }
        text.Append(shares);
        return text.ToString();
    }

    private static string EnvelopeCsv(MonteCarloResult r)
    {
        var text = new StringBuilder("celsius,budget_k,nominal_k,min_k,");
        text.Append(string.Join(",", r.Percentiles.Select(p => Invariant($"p{p:0.###}_k")))).AppendLine(",max_k,mean_k,sd_k");
        foreach (var e in r.Envelope)
            text.AppendLine(string.Join(",", new[] { e.Celsius, e.BudgetKelvin, e.NominalErrorKelvin, e.MinKelvin }
                .Concat(e.PercentileKelvin).Concat([e.MaxKelvin, e.MeanKelvin, e.StandardDeviationKelvin]).Select(R)));
        return text.ToString();
    }

    private static string UnitsCsv(MonteCarloResult r)
    {
        var text = new StringBuilder("unit,worst_error_k,worst_celsius,");
        text.AppendLine(string.Join(",", r.Parameters.Select(p => p.Key)));
        for (var u = 0; u < r.Units; u++)
            text.AppendLine(string.Join(",", new[] { u.ToString(CultureInfo.InvariantCulture), R(r.WorstErrorKelvin[u]), R(r.WorstCelsius[u]) }
                .Concat(r.Deviations[u].Select(R))));
        return text.ToString();
    }

    internal static string Tolerance(ToleranceParameter p) => ToleranceText.HalfWidth(p);

    private static string K(double v) => double.IsFinite(v) ? v.ToString("0.000", CultureInfo.InvariantCulture) : "unreadable";

    private static string R(double v) => v.ToString("R", CultureInfo.InvariantCulture);

    private static string Invariant(FormattableString s) => FormattableString.Invariant(s);
}
