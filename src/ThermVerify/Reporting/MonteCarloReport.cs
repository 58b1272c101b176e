using System.Globalization;
using ThermVerify.Design;
using ThermVerify.FrontEnd;
using ThermVerify.Provenance;
using ThermVerify.Reporting.Plots;
using ThermVerify.Tolerances;
using static ThermVerify.Reporting.Text.ToleranceText;

namespace ThermVerify.Reporting;

/// <summary>The report page of a Monte Carlo run: yield, envelope, histogram of worst errors, contributors, tolerances.</summary>
public static class MonteCarloReport
{
    /// <param name="minimumYieldPercent">When given, the verdict passes or fails against it; otherwise it only states the yield.</param>
    public static AnalysisReport Build(MonteCarloResult r, FrontEndDesign design, RunProvenance provenance, string designFile, double? minimumYieldPercent = null)
    {
        var model = new ClosedFormModel(design);
        var yield = I($"{100 * r.Yield:0.00} % ± {100 * r.YieldStandardError:0.00} %");
        var worstUnit = Enumerable.Range(0, r.Units).MaxBy(u => double.IsFinite(r.WorstErrorKelvin[u]) ? Math.Abs(r.WorstErrorKelvin[u]) : double.PositiveInfinity);
        var verdict = I($"Yield {yield}: {r.UnitsWithinBudget} of {r.Units} units within budget at every temperature; the worst unit reads {Kelvin(r.WorstErrorKelvin[worstUnit])} K at {r.WorstCelsius[worstUnit]:0.##} °C") +
                      (minimumYieldPercent is { } m ? I($" (minimum yield {m:0.###} %)") : "");
        bool? passed = minimumYieldPercent is { } min ? 100 * r.Yield >= min : null;
        var plots = new[]
        {
            EnvelopePlot.Render(r, design.Name),
            WorstErrorHistogramPlot.Render(r, design.Name, design.Check.BudgetKelvin, design.Check.Regions.Count > 0),
            ContributorsPlot.Render(r, design.Name),
        };
        var distribution = r.Parameters.Count > 0 ? r.Parameters[0].Distribution.ToString() : "none";
        ReportSection[] sections =
        [
            new("yield", "Yield",
            [
                design.Adc.Kind == ConverterKind.DeltaSigma
                    ? I($"{r.Units} units built with seed {r.Seed} (tolerances {distribution}); each verified over the check grid (its own DC sweep, quantisation and the firmware's reading). {Sentence(r.ChannelSwitch is { } s ? DeltaSigmaUnit.SwitchNote(s) : DeltaSigmaUnit.StaticReadingNote)}")
                    : I($"{r.Units} units built with seed {r.Seed} (tolerances {distribution}); each verified over the check grid as check does (its own DC sweep, its sampling transient rerun at its worst temperature, quantisation and the firmware's reading)."),
                I($"Yield {yield} (binomial standard error √(y(1 − y)/N)). Largest self-heating in any unit: {r.MaximumSelfHeatingKelvin * 1e3:0.###} mK."),
            ], []),
            new("envelope", "Error envelope", ["Reported minus true, in K, at selected temperatures; --json holds every temperature."], [EnvelopeTable(r)]),
            new("contributors", "Contributors",
            [
                I($"Share of the error variance at {r.ContributorsCelsius:0.##} °C, where the units spread most (σ = {Math.Sqrt(r.VarianceKelvinSquared):0.####} K), from a least-squares fit of the unquantised error on the deviations."),
            ], [ContributorsTable(r)]),
            new("tolerances", "Tolerances", ["Every nonzero tolerance of the design, as the units draw it (docs/tolerances.md)."], [Table(r.Parameters)]),
        ];
        return new AnalysisReport($"thermverify montecarlo: {design.Name}", design.Description, verdict, passed,
            [.. ReportFormat.Settings(design, model.Sensor.Description, model.Adc)], designFile, plots, sections,
            DesignWriter.ToToml(design), provenance, MonteCarloJson.Schema);
    }

    private static ReportTable EnvelopeTable(MonteCarloResult r)
    {
        var every = Math.Max(1, r.Envelope.Count / 20);
        var rows = r.Envelope.Where((_, i) => i % every == 0 || i == r.Envelope.Count - 1).Select(e => (IReadOnlyList<string>)
            [I($"{e.Celsius:0.##}"), e.BudgetKelvin.ToString("0.###", CultureInfo.InvariantCulture), Kelvin(e.NominalErrorKelvin), Kelvin(e.MinKelvin),
             .. e.PercentileKelvin.Select(Kelvin), Kelvin(e.MaxKelvin), ReportFormat.N(e.StandardDeviationKelvin, "0.000")]);
        return new ReportTable(["T (°C)", "budget", "nominal", "min", .. r.Percentiles.Select(p => I($"{p:0.###} %")), "max", "σ"], [.. rows]);
    }

    private static ReportTable ContributorsTable(MonteCarloResult r) => new(
        ["tolerance", "share", "±", "fit slope (K per unit)"],
        [.. r.Contributors.Select(s => (IReadOnlyList<string>)
        [
            s.Key, I($"{100 * s.Share:0.0} %"),
            r.Parameters.FirstOrDefault(p => p.Key == s.Key) is { } p ? HalfWidth(p) : "",
            double.IsFinite(s.KelvinPerUnit) ? s.KelvinPerUnit.ToString("G4", CultureInfo.InvariantCulture) : "",
        ])]);

    private static string I(FormattableString s) => FormattableString.Invariant(s);

    /// <summary>The terminal's note as a sentence of the page.</summary>
    internal static string Sentence(string note) => char.ToUpperInvariant(note[0]) + note[1..] + ".";
}
