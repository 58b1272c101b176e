using ScottPlot;
using ThermVerify.Tolerances;

namespace ThermVerify.Reporting.Plots;

/// <summary>
/// How many units reach each worst |error| over the range, with the budget marked and the yield in the title. Each bar
/// is split by the rule the yield counts with (<see cref="MonteCarloResult.UnitWithinBudget"/>: within the budget at
/// every temperature, regions included): units within budget at the bottom, the others stacked on them in red, so a
/// unit that fails a tighter region budget with a small |error| is drawn as failing.
/// </summary>
internal static class WorstErrorHistogramPlot
{
    public const int Bins = 40;

    /// <summary>The bins: their width, and per bin the units within budget and the units over it (unreadable units left out).</summary>
    public static (double WidthKelvin, int[] Within, int[] Over) Counts(MonteCarloResult result, double budgetKelvin)
    {
        var top = result.WorstErrorKelvin.Where(double.IsFinite).Select(Math.Abs).DefaultIfEmpty(0).Max();
        var width = top > 0 ? top / Bins : budgetKelvin / Bins;
        var within = new int[Bins];
        var over = new int[Bins];
        for (var u = 0; u < result.Units; u++)
        {
            var e = result.WorstErrorKelvin[u];
            if (!double.IsFinite(e)) continue;
            var bin = Math.Min(Bins - 1, (int)(Math.Abs(e) / width));
            if (result.UnitWithinBudget[u]) within[bin]++; else over[bin]++;
        }
        return (width, within, over);
    }

    public static RenderedPlot Render(MonteCarloResult result, string designName, double budgetKelvin, bool budgetVaries)
    {
        var (width, within, over) = Counts(result, budgetKelvin);
        var unreadable = result.WorstErrorKelvin.Count(e => !double.IsFinite(e));

        var plot = PlotStyle.NewPlot(FormattableString.Invariant($"Worst |error| per unit: yield {100 * result.Yield:0.00} % ({result.UnitsWithinBudget} of {result.Units})"),
            "Largest |reported minus true| over the range (K)", "Units");
        var bars = new List<Bar>();
        for (var b = 0; b < Bins; b++)
        {
            var position = (b + 0.5) * width;
            if (within[b] > 0)
                bars.Add(new Bar { Position = position, ValueBase = 0, Value = within[b], Size = width * 0.92, FillColor = PlotStyle.Closed, LineWidth = 0 });
            if (over[b] > 0)
                bars.Add(new Bar { Position = position, ValueBase = within[b], Value = within[b] + over[b], Size = width * 0.92, FillColor = PlotStyle.Limit, LineWidth = 0 });
        }
        plot.Add.Bars(bars);
        var line = plot.Add.VerticalLine(budgetKelvin);
        line.Color = PlotStyle.Budget;
        line.LineWidth = 3;
        line.LinePattern = LinePattern.Dashed;
        line.LegendText = budgetVaries ? FormattableString.Invariant($"budget {budgetKelvin:0.###} K (regions differ)") : FormattableString.Invariant($"budget {budgetKelvin:0.###} K");
        plot.Axes.AutoScale();
        var limits = plot.Axes.GetLimits();
        var tallest = Enumerable.Range(0, Bins).Select(b => within[b] + over[b]).DefaultIfEmpty(0).Max();
        plot.Axes.SetLimits(0, Math.Max(limits.Right, budgetKelvin * 1.08), 0, tallest * 1.1 + 1);
        plot.ShowLegend(Edge.Bottom);

        return PlotStyle.Render(plot, "montecarlo-worst-error", "Worst error per unit",
            FormattableString.Invariant($"Each unit's largest |error| over the check range, in {Bins} bins of {width * 1e3:0.###} mK; in each bar the units within budget at every temperature are blue and those that are not are red, the rule the yield counts with. ") +
            (budgetVaries ? "The budget differs by region, so a unit can fail a tighter region with an error below the line, which marks the range's main budget only. " : "") +
            FormattableString.Invariant($"Yield {100 * result.Yield:0.00} % ± {100 * result.YieldStandardError:0.00} % (binomial standard error).") +
            (unreadable > 0 ? $" {unreadable} unit(s) read a code no sensor produces somewhere and are not drawn (they count as over budget)." : ""));
    }
}
