using ScottPlot;
using ThermVerify.Tolerances;

namespace ThermVerify.Reporting.Plots;

/// <summary>
/// The Monte Carlo error envelope against temperature: the budget band, min to max over the units, the percentile
/// bands paired from the outside in, the median and the nominal unit.
/// </summary>
internal static class EnvelopePlot
{
    // Darker than the bands it runs through.
    private static readonly Color Median = Color.FromHex("#08306b");

    public static RenderedPlot Render(MonteCarloResult result, string designName)
    {
        var envelope = result.Envelope;
        var plot = PlotStyle.NewPlot($"Error envelope over {result.Units} units: {designName}", "True temperature (°C)", "Reported minus true (K)");
        var budget = PlotStyle.Band(plot, envelope.Select(e => e.Celsius), envelope.Select(e => -e.BudgetKelvin), envelope.Select(e => e.BudgetKelvin),
            PlotStyle.Budget, 0.15, "budget ±");
        budget.LineColor = PlotStyle.Budget.WithAlpha(0.6);

        PlotStyle.Band(plot, envelope.Select(e => e.Celsius), envelope.Select(e => e.MinKelvin), envelope.Select(e => e.MaxKelvin),
            PlotStyle.Closed, 0.15, "min to max");
        var percentiles = result.Percentiles;
        for (var i = 0; i < percentiles.Count / 2; i++)
        {
            var (lo, hi) = (i, percentiles.Count - 1 - i);
            PlotStyle.Band(plot, envelope.Select(e => e.Celsius), envelope.Select(e => e.PercentileKelvin[lo]), envelope.Select(e => e.PercentileKelvin[hi]),
                PlotStyle.Closed, 0.2 + 0.15 * i, FormattableString.Invariant($"{percentiles[lo]:0.###} % to {percentiles[hi]:0.###} %"));
        }
        var t = envelope.Select(e => e.Celsius).ToArray();
        if (percentiles.Count % 2 == 1)
            PlotStyle.AddLine(plot, t, [.. envelope.Select(e => e.PercentileKelvin[percentiles.Count / 2])],
                percentiles[percentiles.Count / 2] == 50 ? "median" : FormattableString.Invariant($"{percentiles[percentiles.Count / 2]:0.###} %"), Median, 2.5f);
        PlotStyle.AddLine(plot, t, [.. envelope.Select(e => e.NominalErrorKelvin)], "nominal unit", PlotStyle.Total, 2, LinePattern.Dashed);
        // The budget's edges again on top: where the units spread past it, the bands would hide the green fill.
        PlotStyle.AddLine(plot, t, [.. envelope.Select(e => e.BudgetKelvin)], "budget edge", PlotStyle.Budget, 2.5f, LinePattern.Dashed);
        PlotStyle.AddLine(plot, t, [.. envelope.Select(e => -e.BudgetKelvin)], "", PlotStyle.Budget, 2.5f, LinePattern.Dashed);
        plot.ShowLegend(Edge.Bottom);

        var unreadable = envelope.Count(e => !double.IsFinite(e.MaxKelvin) || !double.IsFinite(e.MinKelvin));
        return PlotStyle.Render(plot, "montecarlo-envelope", "Monte Carlo error envelope",
            FormattableString.Invariant($"Reading error of {result.Units} units (seed {result.Seed}) at each temperature: the outer band is the smallest to the largest error, ") +
            "the inner bands the percentiles (0.135/99.865 % and 2.5/97.5 % are ±3σ and ±2σ of a normal population), the line the median; the green band is the budget." +
            (unreadable > 0 ? $" At {unreadable} temperature(s) some unit reads a code no sensor produces; the band leaves those out." : ""));
    }
}
