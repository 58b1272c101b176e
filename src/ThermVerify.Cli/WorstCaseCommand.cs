using System.CommandLine;
using System.Globalization;
using System.Text;
using ThermVerify.Design;
using ThermVerify.Files;
using ThermVerify.Reporting;
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
        threads.Validators.Add(r => { if (r.GetValueOrDefault<int>() < 1) r.AddError("--threads must be at least 1"); });
        command.SetAction((parsed, cancel) =>
        {
            var loaded = DesignLoader.Load(parsed.GetValue(design)!.FullName);
            outputs.EnsureWritable(parsed);
            var result = WorstCase.Run(loaded, new WorstCaseOptions { Threads = parsed.GetValue(threads), Cancel = cancel });
            if (parsed.GetValue(csv) is { } file)
                AtomicFile.WriteAllText(file.FullName, Csv(result));
            parsed.InvocationConfiguration.Output.Write(Summary(loaded, result));
            var designPath = parsed.GetValue(design)!.ToString();
            outputs.Write(parsed, () => WorstCaseJson.Write(result, loaded, designPath), () => WorstCaseReport.Build(result, loaded, designPath));
            return Task.FromResult(result.WithinBudget ? ExitCodes.Success : ExitCodes.CheckFailed);
        });
        return command;
    }

    private static string Summary(FrontEndDesign design, WorstCaseResult r)
    {
        var text = new StringBuilder();
        var worst = r.Worst;
        text.AppendLine(I($"{(r.WithinBudget ? "PASS" : "FAIL")} {design.Name}: worst case {K(worst.LowKelvin)} .. {K(worst.HighKelvin)} K at {worst.Celsius:0.##} °C (budget ±{worst.BudgetKelvin:0.###} K)"));
        text.AppendLine(I($"{r.Parameters.Count} tolerances, {r.CornersEvaluated} corners verified in full"));
        if (r.Enumeration is { } e)
            text.AppendLine(e.LargestShortfallKelvin <= 1e-9
                ? I($"all {e.Corners} corners enumerated: the sensitivities' corners are the extremes")
                : I($"all {e.Corners} corners enumerated: the sensitivities' corners fall short of the extremes by up to {e.LargestShortfallKelvin * 1e3:0.###} mK (at {e.ShortfallCelsius:0.##} °C)"));
        text.AppendLine();
        var table = new TextTable("T (°C)", "budget", "nominal", "low corner", "high corner", "Σ|s·a|", "RSS", "σ");
        var every = Math.Max(1, r.Points.Count / 20);
        for (var i = 0; i < r.Points.Count; i++)
        {
            if (i % every != 0 && i != r.Points.Count - 1) continue;
            var p = r.Points[i];
            table.AddRow(I($"{p.Celsius:0.##}"), K(p.BudgetKelvin), K(p.NominalKelvin), K(p.LowKelvin), K(p.HighKelvin),
                K(p.LinearSumKelvin), K(p.RssKelvin), K(p.SigmaKelvin));
        }
        text.Append(table);
        text.AppendLine();
        var index = r.Points.ToList().IndexOf(worst);
        text.AppendLine(I($"sensitivities at {worst.Celsius:0.##} °C (K for the full tolerance):"));
        var sens = new TextTable("tolerance", "±tolerance", "effect (K)");
        foreach (var s in r.Sensitivities.OrderByDescending(s => Math.Abs(s.KelvinPerUnit[index] * s.Parameter.HalfWidth)))
            sens.AddRow(s.Parameter.Key, MonteCarloCommand.Tolerance(s.Parameter), K(s.KelvinPerUnit[index] * s.Parameter.HalfWidth));
        text.Append(sens);
        return text.ToString();
    }

    private static string Csv(WorstCaseResult r)
    {
        var text = new StringBuilder("celsius,budget_k,nominal_k,low_k,high_k,linear_sum_k,rss_k,sigma_k\n");
        foreach (var p in r.Points)
            text.AppendLine(string.Join(",", new[] { p.Celsius, p.BudgetKelvin, p.NominalKelvin, p.LowKelvin, p.HighKelvin, p.LinearSumKelvin, p.RssKelvin, p.SigmaKelvin }
                .Select(v => v.ToString("R", CultureInfo.InvariantCulture))));
        return text.ToString();
    }

    private static string K(double v) => double.IsFinite(v) ? v.ToString("0.000", CultureInfo.InvariantCulture) : "unreadable";

    private static string I(FormattableString s) => FormattableString.Invariant(s);
}
