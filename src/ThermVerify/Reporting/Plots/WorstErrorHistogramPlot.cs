using ScottPlot;
using ThermVerify.Tolerances;

namespace ThermVerify.Reporting.Plots;

/// <summary>How many units reach each worst |error| over the range, with the budget marked and the yield in the title.</summary>
internal static class WorstErrorHistogramPlot
{
    public const int Bins = 40;

    public static RenderedPlot Render(MonteCarloResult result, string designName, double budgetKelvin, bool budgetVaries)
    {
        var magnitudes = result.WorstErrorKelvin.Where(double.IsFinite).Select(Math.Abs).ToArray();
        var unreadable = result.Units - magnitudes.Length;
        var top = magnitudes.DefaultIfEmpty(0).Max();
        var width = top > 0 ? top / Bins : budgetKelvin / Bins;
        var counts = new int[Bins];
        foreach (var m in magnitudes) counts[Math.Min(Bins - 1, (int)(m / width))]++;

        var plot = PlotStyle.NewPlot(FormattableString.Invariant($"Worst |error| per unit: yield {100 * result.Yield:0.00} % ({result.UnitsWithinBudget} of {result.Units})"),
            "Largest |reported minus true| over the range (K)", "Units");
        var bars = counts.Select((c, b) => new Bar
        {
            Position = (b + 0.5) * width,
            Value = c,
            Size = width * 0.92,
            FillColor = (b + 1) * width > budgetKelvin ? PlotStyle.Limit : PlotStyle.Closed,
            LineWidth = 0,
        }).ToList();
        plot.Add.Bars(bars);
        var line = plot.Add.VerticalLine(budgetKelvin);
        line.Color = PlotStyle.Budget;
        line.LineWidth = 3;
        line.LinePattern = LinePattern.Dashed;
        line.LegendText = budgetVaries ? FormattableString.Invariant($"budget {budgetKelvin:0.###} K (regions differ)") : FormattableString.Invariant($"budget {budgetKelvin:0.###} K");
        plot.Axes.AutoScale();
        var limits = plot.Axes.GetLimits();
        plot.Axes.SetLimits(0, Math.Max(limits.Right, budgetKelvin * 1.08), 0, counts.DefaultIfEmpty(0).Max() * 1.1 + 1);
        plot.ShowLegend(Edge.Bottom);

        return PlotStyle.Render(plot, "montecarlo-worst-error", "Worst error per unit",
            FormattableString.Invariant($"Each unit's largest |error| over the check range, in {Bins} bins of {width * 1e3:0.###} mK; bars reaching past the budget are red. ") +
            (budgetVaries ? "The budget differs by region; a unit counts as within budget when it is within the budget at every temperature, so the line marks the range's main budget only. " : "") +
            FormattableString.Invariant($"Yield {100 * result.Yield:0.00} % ± {100 * result.YieldStandardError:0.00} % (binomial standard error).") +
            (unreadable > 0 ? $" {unreadable} unit(s) read a code no sensor produces somewhere and are not drawn (they count as over budget)." : ""));
    }
}
