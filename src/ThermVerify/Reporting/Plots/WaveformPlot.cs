using ScottPlot;
using ThermVerify.Check;
using ThermVerify.FrontEnd;

namespace ThermVerify.Reporting.Plots;

/// <summary>
/// The pin and the sampling capacitor during the first acquisitions at the worst temperature, each window drawn
/// from the moment the sampling switch closes, with the settled (DC) pin voltage the sample should reach.
/// </summary>
internal static class WaveformPlot
{
    public static RenderedPlot Render(CheckResult result, SamplingWaveform waveform)
    {
        var (scale, unit) = TimeScale(waveform.AcquisitionSeconds);
        var pre = waveform.PrechargeVolts is { } v ? FormattableString.Invariant($"precharged to {v:0.###} V") : "holding the last sample";
        var worst = result.Points.First(p => p.Celsius == waveform.Celsius);
        var settled = worst.StaticPinVolts;
        // Volts read well for a swing of a volt; a swing of microvolts would print ten identical tick labels, so small
        // swings are drawn as the deviation from the settled pin voltage instead.
        var all = waveform.Conversions.SelectMany(c => c.PinVolts.Concat(c.HoldVolts)).Append(settled).ToArray();
        var (offset, yScale, yUnit) = (all.Max() - all.Min()) switch
        {
            >= 0.05 => (0.0, 1.0, "V"),
            >= 50e-6 => (settled, 1e3, "mV"),
            >= 50e-9 => (settled, 1e6, "µV"),
            _ => (settled, 1e9, "nV"),
        };
        var yLabel = offset == 0 ? "Voltage (V)" : FormattableString.Invariant($"Voltage minus the settled pin {settled:0.######} V ({yUnit})");
        var plot = PlotStyle.NewPlot(FormattableString.Invariant($"Sampling at {waveform.Celsius:0.##} °C ({pre})"),
            $"Time from the start of the acquisition ({unit})", yLabel);
        double[] Y(double[] volts) => [.. volts.Select(v => (v - offset) * yScale)];

        foreach (var trace in waveform.Conversions)
        {
            var color = PlotStyle.Series[(trace.Conversion - 1) % PlotStyle.Series.Length];
            var x = trace.TimeFromStartSeconds.Select(s => s * scale).ToArray();
            // Later conversions are drawn thinner on top, so identical windows (a fixed precharge) stay visible.
            var width = 2 + 1.8f * (waveform.Conversions.Count - trace.Conversion);
            PlotStyle.AddLine(plot, x, Y(trace.PinVolts), $"pin, conversion {trace.Conversion}", color, width);
            PlotStyle.AddLine(plot, x, Y(trace.HoldVolts), $"C_sample, conversion {trace.Conversion}", color, width, LinePattern.Dashed);
        }
        var target = plot.Add.HorizontalLine((settled - offset) * yScale);
        target.Color = Colors.Black;
        target.LinePattern = LinePattern.Dotted;
        target.LineWidth = 1.5f;
        target.LegendText = "settled pin (DC)";
        var open = plot.Add.VerticalLine(waveform.AcquisitionSeconds * scale);
        open.Color = Colors.Gray;
        open.LineWidth = 1;
        open.LegendText = "sample taken";
        plot.ShowLegend(Edge.Right);

        return PlotStyle.Render(plot, "sampling", "Sampling waveforms at the worst temperature",
            FormattableString.Invariant($"The first {waveform.Conversions.Count} acquisitions at {waveform.Celsius:0.##} °C, {pre}; ") +
            "each window starts when the sampling switch closes (shown from a quarter acquisition before). " +
            "The sample is the capacitor's voltage when the switch opens.");
    }

    private static (double Scale, string Unit) TimeScale(double seconds) => seconds switch
    {
        < 1e-6 => (1e9, "ns"),
        < 1e-3 => (1e6, "µs"),
        < 1 => (1e3, "ms"),
        _ => (1, "s"),
    };
}
