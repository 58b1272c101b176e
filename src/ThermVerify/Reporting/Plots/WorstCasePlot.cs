using ScottPlot;
using ThermVerify.Tolerances;

namespace ThermVerify.Reporting.Plots;

/// <summary>
/// The worst-case band against temperature: the errors of the corners that raise and lower the error most, the
/// nominal unit, nominal ± RSS of the sensitivities and the budget band.
/// </summary>
internal static class WorstCasePlot
{
    public static RenderedPlot Render(WorstCaseResult result, string designName)
    {
        var points = result.Points;
        var t = points.Select(p => p.Celsius).ToArray();
        var plot = PlotStyle.NewPlot($"Worst case over the tolerance box: {designName}", "True temperature (°C)", "Reported minus true (K)");
        var budget = PlotStyle.Band(plot, t, points.Select(p => -p.BudgetKelvin), points.Select(p => p.BudgetKelvin), PlotStyle.Budget, 0.15, "budget ±");
        budget.LineColor = PlotStyle.Budget.WithAlpha(0.6);
        PlotStyle.Band(plot, t, points.Select(p => p.NominalKelvin - p.RssKelvin), points.Select(p => p.NominalKelvin + p.RssKelvin),
            PlotStyle.Closed, 0.25, "nominal ± RSS");
        PlotStyle.AddLine(plot, t, [.. points.Select(p => p.HighKelvin)], "high corner (verified)", PlotStyle.Simulated, 2.5f);
        PlotStyle.AddLine(plot, t, [.. points.Select(p => p.LowKelvin)], "low corner (verified)", PlotStyle.Series[1], 2.5f);
        PlotStyle.AddLine(plot, t, [.. points.Select(p => p.NominalKelvin)], "nominal unit", PlotStyle.Total, 2, LinePattern.Dashed);
        plot.ShowLegend(Edge.Bottom);

        var worst = result.Worst;
        return PlotStyle.Render(plot, "worstcase-band", "Worst-case band",
            "At each temperature the signs of the sensitivities pick the corner of the tolerance box that raises the error most and the one that lowers it most; " +
            $"each of those {result.CornersEvaluated} corners is verified in full (DC sweep, sampling transient, quantisation). " +
            "The blue band is the nominal error ± the root sum of squares of the sensitivities times the tolerances; the green band is the budget. " +
            FormattableString.Invariant($"Worst at {worst.Celsius:0.##} °C: {worst.LowKelvin:+0.000;-0.000} K to {worst.HighKelvin:+0.000;-0.000} K."));
    }
}
