using ScottPlot;
using ThermVerify.Check;
using ThermVerify.Tolerances;

namespace ThermVerify.Reporting.Plots;

/// <summary>
/// Kelvin per LSB against temperature, with the resolution limit: quantisation alone reaches ±½ LSB (IEEE Std
/// 1241), so the budget can hold only where one LSB is at most twice the budget.
/// </summary>
internal static class SensitivityPlot
{
    public static RenderedPlot Render(CheckResult result)
    {
        var points = result.Points;
        var t = points.Select(p => p.Celsius).ToArray();
        var plot = PlotStyle.NewPlot($"Sensitivity: {result.Design.Name}", "Temperature (°C)", "Temperature step of one LSB (K/LSB)");
        PlotStyle.AddLine(plot, t, [.. points.Select(p => p.KelvinPerLsb)], "K per LSB (closed form)", PlotStyle.Closed, 3);
        PlotStyle.AddLine(plot, t, [.. points.Select(p => 2 * p.BudgetKelvin)], "resolution limit: 2 × budget (½ LSB = budget)", PlotStyle.Limit, 2, LinePattern.Dashed);
        plot.Axes.AutoScale();
        var limits = plot.Axes.GetLimits();
        // Head room above the highest line keeps the legend clear of it.
        plot.Axes.SetLimitsY(0, limits.Top * 1.1);
        plot.ShowLegend(Edge.Bottom);
        return PlotStyle.Render(plot, "sensitivity", "Sensitivity in K per LSB",
            "How far the reported temperature moves for one code; where the line crosses the limit, quantisation alone breaks the budget.");
    }
}
