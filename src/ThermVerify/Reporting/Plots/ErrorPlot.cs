using ScottPlot;
using ThermVerify.Check;

namespace ThermVerify.Reporting.Plots;

/// <summary>The reported-temperature error against temperature: the budget band, the total and each contribution.</summary>
internal static class ErrorPlot
{
    public static RenderedPlot Render(CheckResult result)
    {
        var points = result.Points;
        var t = points.Select(p => p.Celsius).ToArray();
        var plot = PlotStyle.NewPlot($"Reported-temperature error: {result.Design.Name}", "True temperature (°C)", "Reported minus true (K)");

        var band = plot.Add.FillY(t, [.. points.Select(p => -p.BudgetKelvin)], [.. points.Select(p => p.BudgetKelvin)]);
        band.FillColor = PlotStyle.Budget.WithAlpha(0.18);
        band.LineColor = PlotStyle.Budget.WithAlpha(0.6);
        band.LegendText = "budget ±";

        // The total goes first, so that a contribution equal to it stays visible on top.
        PlotStyle.AddLine(plot, t, [.. points.Select(p => p.ErrorKelvin)], "total error", PlotStyle.Total, 3);
        var parts = ReportFormat.ContributionColumns(points);
        for (var i = 0; i < parts.Count; i++)
        {
            var ys = points.Select(p => parts[i].Kelvin(p)).ToArray();
            // A contribution that is zero everywhere would only hide the others; the table still lists it.
            if (ys.All(y => y == 0)) continue;
            PlotStyle.AddLine(plot, t, ys, parts[i].Header == "rest" ? "rest (unmappable)" : parts[i].Header, PlotStyle.Series[i % PlotStyle.Series.Length], 1.5f);
        }
        var zero = plot.Add.HorizontalLine(0);
        zero.Color = Colors.Gray;
        zero.LineWidth = 1;
        plot.ShowLegend(Edge.Bottom);

        var unreadable = points.Count(p => !double.IsFinite(p.ErrorKelvin));
        return PlotStyle.Render(plot, "error", "Reported-temperature error and its causes",
            "Total error with its split by cause (each step of the voltage mapped through the exact inverse); the band is the budget." +
            (unreadable > 0 ? $" {unreadable} point(s) give a code no sensor inside its range produces and are left out of the lines." : ""));
    }
}
