using System.Text;
using ThermVerify.Design;
using ThermVerify.Provenance;
using ThermVerify.Tolerances;
using static ThermVerify.Reporting.Text.TextNumbers;

namespace ThermVerify.Reporting.Text;

/// <summary>The terminal summary of a Monte Carlo run: yield, the error envelope at up to 20 temperatures, the contributors.</summary>
public static class MonteCarloText
{
    public static string Render(FrontEndDesign design, MonteCarloResult r, RunProvenance provenance)
    {
        var text = new StringBuilder();
        var distribution = r.Parameters.Count > 0 ? r.Parameters[0].Distribution.ToString() : "none";
        text.AppendLine(Invariant($"{design.Name}: {r.Units} units, seed {r.Seed}, tolerances {distribution}"));
        ProvenanceText.Append(text, provenance);
        text.AppendLine(Invariant($"yield: {100 * r.Yield:0.00} % within budget ({r.UnitsWithinBudget} of {r.Units}; ±{100 * r.YieldStandardError:0.00} % standard error)"));
        if (design.Adc.Kind == ConverterKind.DeltaSigma) text.AppendLine(r.ChannelSwitch is { } s ? DeltaSigmaUnit.SwitchNote(s) : DeltaSigmaUnit.StaticReadingNote);
        text.AppendLine(Invariant($"noise: each unit's error leaves room for the design's noise at its coverage and ramp lag, up to ±{r.LargestNoiseKelvin:0.###} K (as check counts it)"));
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
            table.AddRow([Invariant($"{e.Celsius:0.##}"), Kelvin(e.BudgetKelvin), Kelvin(e.NominalErrorKelvin), Kelvin(e.MinKelvin),
                .. e.PercentileKelvin.Select(Kelvin), Kelvin(e.MaxKelvin)]);
        }
        text.Append(table);
        text.AppendLine();
        text.AppendLine(Invariant($"contributors, share of the error variance at {r.ContributorsCelsius:0.##} °C (σ = {Math.Sqrt(r.VarianceKelvinSquared):0.####} K):"));
        var shares = new TextTable("tolerance", "share", "±tolerance");
        foreach (var s in r.Contributors)
        {
            var p = r.Parameters.FirstOrDefault(q => q.Key == s.Key);
            shares.AddRow(s.Key, Invariant($"{100 * s.Share:0.0} %"), p is null ? "" : ToleranceText.HalfWidth(p));
        }
        text.Append(shares);
        return text.ToString();
    }

    /// <summary>The error envelope against temperature, one row per checked temperature.</summary>
    public static string EnvelopeCsv(MonteCarloResult r)
    {
        var text = new StringBuilder("celsius,budget_k,nominal_k,min_k,");
        text.Append(string.Join(",", r.Percentiles.Select(p => Invariant($"p{p:0.###}_k")))).AppendLine(",max_k,mean_k,sd_k");
        foreach (var e in r.Envelope)
            text.AppendLine(string.Join(",", new[] { e.Celsius, e.BudgetKelvin, e.NominalErrorKelvin, e.MinKelvin }
                .Concat(e.PercentileKelvin).Concat([e.MaxKelvin, e.MeanKelvin, e.StandardDeviationKelvin]).Select(RoundTrip)));
        return text.ToString();
    }

    /// <summary>Every unit's worst error and the deviation of each of its parts.</summary>
    public static string UnitsCsv(MonteCarloResult r)
    {
        var text = new StringBuilder("unit,worst_error_k,worst_celsius,");
        text.AppendLine(string.Join(",", r.Parameters.Select(p => p.Key)));
        for (var u = 0; u < r.Units; u++)
            text.AppendLine(string.Join(",", new[] { Integer(u), RoundTrip(r.WorstErrorKelvin[u]), RoundTrip(r.WorstCelsius[u]) }
                .Concat(r.Deviations[u].Select(RoundTrip))));
        return text.ToString();
    }
}
