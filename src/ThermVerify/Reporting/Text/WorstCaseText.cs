using System.Text;
using ThermVerify.Design;
using ThermVerify.Provenance;
using ThermVerify.Tolerances;
using static ThermVerify.Reporting.Text.TextNumbers;

namespace ThermVerify.Reporting.Text;

/// <summary>The terminal summary of a worst-case run: verdict, the band at up to 20 temperatures, sensitivities at the worst point.</summary>
public static class WorstCaseText
{
    public static string Render(FrontEndDesign design, WorstCaseResult r, RunProvenance provenance)
    {
        var text = new StringBuilder();
        var worst = r.Worst;
        text.AppendLine(Invariant($"{(r.WithinBudget ? "PASS" : "FAIL")} {design.Name}: worst case {Kelvin(worst.LowKelvin)} .. {Kelvin(worst.HighKelvin)} K at {worst.Celsius:0.##} °C (budget ±{worst.BudgetKelvin:0.###} K)"));
        ProvenanceText.Append(text, provenance);
        text.AppendLine(Invariant($"{r.Parameters.Count} tolerances, {r.CornersEvaluated} corners verified in full"));
        if (design.Adc.Kind == ConverterKind.DeltaSigma) text.AppendLine(DeltaSigmaUnit.StaticReadingNote);
        text.AppendLine(Invariant($"noise: each corner's error leaves room for the design's noise at its coverage and ramp lag, up to ±{r.Points.Max(p => p.NoiseKelvin):0.###} K (as check counts it)"));
        if (r.Enumeration is { } e)
            text.AppendLine(e.LargestShortfallKelvin <= 1e-9
                ? Invariant($"all {e.Corners} corners enumerated: the sensitivities' corners are the extremes")
                : Invariant($"all {e.Corners} corners enumerated: the sensitivities' corners fall short of the extremes by up to {e.LargestShortfallKelvin * 1e3:0.###} mK (at {e.ShortfallCelsius:0.##} °C)"));
        text.AppendLine();
        var table = new TextTable("T (°C)", "budget", "nominal", "low corner", "high corner", "Σ|s·a|", "RSS", "σ");
        var every = Math.Max(1, r.Points.Count / 20);
        for (var i = 0; i < r.Points.Count; i++)
        {
            if (i % every != 0 && i != r.Points.Count - 1) continue;
            var p = r.Points[i];
            table.AddRow(Invariant($"{p.Celsius:0.##}"), Kelvin(p.BudgetKelvin), Kelvin(p.NominalKelvin), Kelvin(p.LowKelvin), Kelvin(p.HighKelvin),
                Kelvin(p.LinearSumKelvin), Kelvin(p.RssKelvin), Kelvin(p.SigmaKelvin));
        }
        text.Append(table);
        text.AppendLine();
        var index = r.Points.ToList().IndexOf(worst);
        text.AppendLine(Invariant($"sensitivities at {worst.Celsius:0.##} °C (K for the full tolerance):"));
        var sensitivities = new TextTable("tolerance", "±tolerance", "effect (K)");
        foreach (var s in r.Sensitivities.OrderByDescending(s => Math.Abs(s.KelvinPerUnit[index] * s.Parameter.HalfWidth)))
            sensitivities.AddRow(s.Parameter.Key, ToleranceText.HalfWidth(s.Parameter), Kelvin(s.KelvinPerUnit[index] * s.Parameter.HalfWidth));
        text.Append(sensitivities);
        if (r.RemedyNote is { } note) text.AppendLine($"remedies: {note}");
        foreach (var remedy in r.Remedies)
        {
            text.AppendLine($"remedy: {ReportFormat.RemedyLine(remedy)}");
            text.AppendLine($"  ({remedy.Method})");
            text.AppendLine($"  ({remedy.Proof})");
        }
        return text.ToString();
    }

    /// <summary>The worst-case band against temperature, one row per checked temperature.</summary>
    public static string Csv(WorstCaseResult r)
    {
        var text = new StringBuilder("celsius,budget_k,nominal_k,low_k,high_k,linear_sum_k,rss_k,sigma_k\n");
        foreach (var p in r.Points)
            text.AppendLine(string.Join(",", new[] { p.Celsius, p.BudgetKelvin, p.NominalKelvin, p.LowKelvin, p.HighKelvin, p.LinearSumKelvin, p.RssKelvin, p.SigmaKelvin }
                .Select(RoundTrip)));
        return text.ToString();
    }
}
