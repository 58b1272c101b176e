using ScottPlot;
using ThermVerify.Check;

namespace ThermVerify.Reporting.Plots;

/// <summary>
/// Divider voltage and ADC code against temperature: the closed form (unloaded divider, ideal ADC) beside the
/// simulated DC pin voltage, the simulated sample and the code it converts to. The code axis is the voltage axis
/// divided by one LSB, so a code marker sits on the voltage it stands for.
/// </summary>
internal static class TransferPlot
{
    public static RenderedPlot Render(CheckResult result)
    {
        var points = result.Points;
        var t = points.Select(p => p.Celsius).ToArray();
        var plot = PlotStyle.NewPlot($"Divider voltage and ADC code: {result.Design.Name}", "Temperature (°C)", "Voltage at the ADC pin (V)");
        PlotStyle.AddLine(plot, t, [.. points.Select(p => p.IdealVolts)], "closed form (unloaded divider)", PlotStyle.Closed, 3);
        PlotStyle.AddLine(plot, t, [.. points.Select(p => p.DcPinVolts)], "simulated DC pin voltage", PlotStyle.Pin, 2, LinePattern.Dashed);
        PlotStyle.AddLine(plot, t, [.. points.Select(p => p.SampleVolts)], "simulated sample (the worst reading)", PlotStyle.Simulated, 2);

        var codes = plot.Add.ScatterPoints(t, [.. points.Select(p => (double)p.Code)]);
        codes.Color = PlotStyle.Code;
        codes.MarkerSize = points.Count > 120 ? 3 : 5;
        codes.MarkerShape = MarkerShape.OpenCircle;
        codes.LegendText = "ADC code of the sample (right axis)";
        codes.Axes.YAxis = plot.Axes.Right;
        plot.Axes.Right.Label.Text = "ADC code";
        plot.Axes.Right.Label.FontSize = 15;

        plot.Axes.AutoScale();
        var left = plot.Axes.GetLimits(plot.Axes.Bottom, plot.Axes.Left);
        var lsb = result.Adc.LsbVolts;
        plot.Axes.SetLimitsY(left.Bottom / lsb, left.Top / lsb, plot.Axes.Right);
        plot.ShowLegend(Edge.Bottom);

        return PlotStyle.Render(plot, "transfer", "Divider voltage and ADC code",
            $"Closed form against simulation; 1 LSB = {lsb * 1e3:0.###} mV. The code axis is the voltage axis in LSB.");
    }
}
