using ScottPlot;
using ThermVerify.Quantities;
using ThermVerify.Tolerances;

namespace ThermVerify.Reporting.Plots;

/// <summary>
/// The ranking figure of choose-fixed: the objective's figure against the candidate resistance on a log axis, with
/// the present fixed resistor and the best candidate marked (and the budget, for the error objective).
/// </summary>
internal static class FixedResistorPlot
{
    public static RenderedPlot Render(IReadOnlyList<FixedResistorCandidate> ranked, FixedResistorObjective objective, double presentOhms, double? budgetKelvin, string designName)
    {
        var byValue = ranked.OrderBy(c => c.Ohms).ToArray();
        var x = byValue.Select(c => Math.Log10(c.Ohms)).ToArray();
        var (yLabel, figure) = objective switch
        {
            FixedResistorObjective.WorstResolution => ("Worst resolution over the range (K/LSB)", (Func<FixedResistorCandidate, double>)(c => c.WorstKelvinPerLsb)),
            FixedResistorObjective.SlopeAt => ("Divider slope |dV/dT| (mV/K)", c => c.SlopeVoltsPerKelvin * 1e3),
            _ => ("Worst |reported minus true| with self-heating (K)", c => Math.Abs(c.WorstErrorKelvin)),
        };
        var plot = PlotStyle.NewPlot($"Fixed resistor candidates: {designName}", "Fixed resistor", yLabel);
        var y = byValue.Select(figure).ToArray();
        PlotStyle.AddLine(plot, x, y, $"{byValue.Length} candidates", PlotStyle.Closed, 1.5f);
        var markers = plot.Add.ScatterPoints(x.Where((_, i) => double.IsFinite(y[i])).ToArray(), y.Where(double.IsFinite).ToArray());
        markers.Color = PlotStyle.Closed;
        markers.MarkerSize = byValue.Length > 60 ? 4 : 6;

        var best = ranked[0];
        var star = plot.Add.ScatterPoints(new[] { Math.Log10(best.Ohms) }, new[] { figure(best) });
        star.Color = PlotStyle.Simulated;
        star.MarkerSize = 14;
        star.MarkerShape = MarkerShape.FilledDiamond;
        star.LegendText = $"best: {Ohms(best.Ohms)}";
        var present = plot.Add.VerticalLine(Math.Log10(presentOhms));
        present.Color = Colors.Gray;
        present.LinePattern = LinePattern.Dotted;
        present.LineWidth = 2;
        present.LegendText = $"design now: {Ohms(presentOhms)}";
        if (objective == FixedResistorObjective.WorstError && budgetKelvin is { } budget)
        {
            var limit = plot.Add.HorizontalLine(budget);
            limit.Color = PlotStyle.Budget;
            limit.LinePattern = LinePattern.Dashed;
            limit.LineWidth = 2;
            limit.LegendText = FormattableString.Invariant($"budget {budget:0.###} K");
        }
        var (low, high) = (byValue[0].Ohms, byValue[^1].Ohms);
        var pad = Math.Max(0.05, (Math.Log10(high) - Math.Log10(low)) * 0.03);
        plot.Axes.AutoScale();
        plot.Axes.SetLimitsX(Math.Min(Math.Log10(low), Math.Log10(presentOhms)) - pad, Math.Max(Math.Log10(high), Math.Log10(presentOhms)) + pad);
        PlotStyle.LogTicks(plot.Axes.Bottom, Math.Min(low, presentOhms) / Math.Pow(10, pad), Math.Max(high, presentOhms) * Math.Pow(10, pad), Ohms);
        plot.ShowLegend(Edge.Bottom);

        return PlotStyle.Render(plot, "fixed-candidates", "Fixed resistor candidates",
            objective switch
            {
                FixedResistorObjective.WorstResolution => "The worst K per LSB over the check range for each candidate (smaller is finer); ",
                FixedResistorObjective.SlopeAt => "The closed-form divider slope at the chosen temperature for each candidate (steeper is better); ",
                _ => "The worst reported error over the check range for each candidate, from a full check with settling by transient on a 9-point grid and the self-heating added; ",
            } + "the axis is logarithmic in resistance. The diamond is the best candidate, the dotted line the design's present value.");
    }

    private static string Ohms(double ohms) => EngineeringFormat.Format(ohms, UnitKind.Ohm, 3);
}
