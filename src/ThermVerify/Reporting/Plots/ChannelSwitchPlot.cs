using System.Globalization;
using ScottPlot;
using ThermVerify.Check;
using ThermVerify.FrontEnd.DeltaSigma;

namespace ThermVerify.Reporting.Plots;

/// <summary>
/// A delta-sigma converter has no acquisition window to draw: its sampling figure is the channel switch the check
/// judged, the modulator's samples of the pin from the switch (the analog transient) and the digital filter's readings
/// with the settled reading and the first reading the firmware uses.
/// </summary>
internal static class ChannelSwitchPlot
{
    public static RenderedPlot Render(CheckResult result, ChannelSettlingResult s)
    {
        var start = s.Start switch
        {
            ChannelStart.SwitchOn => "after the excitation's switch-on",
            ChannelStart.SharedFilter => I($"after a channel switch from {s.OtherChannelVolts:0.###} V (shared filter)"),
            _ => "after a channel switch (own filter)",
        };
        var all = s.Trace.Volts.Concat(s.Readings.Select(r => r.Value)).Append(s.FinalVolts).ToArray();
        var swing = all.Length > 0 ? all.Max() - all.Min() : 0;
        // As the sampling figure does: a swing of microvolts is drawn as the deviation from the settled reading.
        var (offset, yScale, yUnit) = swing switch
        {
            >= 0.05 => (0.0, 1.0, "V"),
            >= 50e-6 => (s.FinalVolts, 1e3, "mV"),
            >= 50e-9 => (s.FinalVolts, 1e6, "µV"),
            _ => (s.FinalVolts, 1e9, "nV"),
        };
        var yLabel = offset == 0 ? "Voltage (V)" : I($"Voltage minus the settled reading {s.FinalVolts:0.######} V ({yUnit})");
        var plot = PlotStyle.NewPlot(I($"Readings after a switch at {s.Celsius:0.##} °C"), "Time after the switch (ms)", yLabel);
        double Y(double v) => (v - offset) * yScale;
        PlotStyle.AddLine(plot, [.. s.Trace.Seconds.Select(t => t * 1e3)], [.. s.Trace.Volts.Select(Y)], "pin (modulator samples)", PlotStyle.Pin);
        var readings = plot.Add.ScatterPoints(s.Readings.Select(r => r.Seconds * 1e3).ToArray(), s.Readings.Select(r => Y(r.Value)).ToArray());
        readings.Color = PlotStyle.Code;
        readings.MarkerSize = 9;
        readings.LegendText = "filter readings";
        var settled = plot.Add.HorizontalLine(Y(s.FinalVolts));
        settled.Color = Colors.Black;
        settled.LinePattern = LinePattern.Dotted;
        settled.LineWidth = 1.5f;
        settled.LegendText = "settled reading";
        var used = Math.Min(s.ReadingsDiscarded, s.Readings.Count - 1);
        var first = plot.Add.VerticalLine(s.Readings[used].Seconds * 1e3);
        first.Color = s.FirstUsedOff ? PlotStyle.Limit : Colors.Gray;
        first.LineWidth = 1;
        first.LegendText = I($"first reading used ({used} discarded)");
        plot.ShowLegend(Edge.Right);
        var discard = s.ReadingsToDiscard is { } n ? I($"{n} reading{(n == 1 ? "" : "s")} to discard for every later one to be within ½ LSB") : "no reading followed settles within ½ LSB";
        return PlotStyle.Render(plot, "sampling", "Readings after a channel switch",
            I($"The modulator's samples of the pin ({s.Trace.Volts.Length} drawn) and the digital filter's readings at {s.Celsius:0.##} °C {start}, ") +
            I($"the case the check judged worst; the first reading used is {s.FirstUsedErrorVolts / s.LsbVolts:0.#} LSB from the settled reading; {discard}."));
    }

    private static string I(FormattableString s) => s.ToString(CultureInfo.InvariantCulture);
}
