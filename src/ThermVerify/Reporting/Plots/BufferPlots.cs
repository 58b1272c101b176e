using ScottPlot;
using ThermVerify.Check.Buffer;

namespace ThermVerify.Reporting.Plots;

/// <summary>
/// The buffer's two views of stability: the loop gain's magnitude and phase margin over frequency (the worst loop),
/// and the closed-loop small step from the transient.
/// </summary>
internal static class BufferPlots
{
    public static IReadOnlyList<RenderedPlot> Render(BufferReport? buffer)
    {
        if (buffer is null) return [];
        var plots = new List<RenderedPlot> { LoopGain(buffer.Stability) };
        if (buffer.Stability.Step is { } step) plots.Add(Step(step));
        return plots;
    }

    private static RenderedPlot LoopGain(StabilityReport s)
    {
        var loop = s.Worst;
        var logF = loop.FrequenciesHertz.Select(Math.Log10).ToArray();
        var plot = PlotStyle.NewPlot($"Buffer loop gain at {loop.Celsius:0.##} °C", "Frequency", "|T| (dB)");
        PlotStyle.AddLine(plot, logF, [.. loop.MagnitudeDb], "|T| (dB), left axis", PlotStyle.Closed, 3);
        // The phase as margin to −180°: where |T| crosses 0 dB this curve is the phase margin.
        PlotStyle.AddLine(plot, logF, [.. loop.PhaseDegrees.Select(p => 180 + p)], "180° + ∠T (°), right axis", PlotStyle.Simulated, 2, yAxis: plot.Axes.Right);
        var zero = plot.Add.HorizontalLine(0);
        zero.Color = PlotStyle.Total;
        zero.LinePattern = LinePattern.Dashed;
        var minimum = plot.Add.HorizontalLine(s.MinimumPhaseMarginDegrees);
        minimum.Color = PlotStyle.Limit;
        minimum.LinePattern = LinePattern.Dotted;
        minimum.Axes.YAxis = plot.Axes.Right;
        minimum.LegendText = "minimum phase margin (right axis)";
        plot.Axes.Right.Label.Text = "Phase above −180° (°)";
        PlotStyle.DecadeTicksHertz(plot.Axes.Bottom, loop.FrequenciesHertz[0], loop.FrequenciesHertz[^1]);
        plot.ShowLegend(Edge.Bottom);
        var caption = loop.PhaseMarginDegrees is { } pm
            ? $"Loop gain by Bode's return ratio with the real load; phase margin {pm:0.#}° at {PlotStyle.Hertz(loop.CrossoverHertz!.Value)} (single-pole estimate {loop.ClosedFormPhaseMarginDegrees:0.#}°)."
            : "Loop gain by Bode's return ratio with the real load; |T| never falls through 0 dB inside the sweep.";
        return PlotStyle.Render(plot, "buffer-loop-gain", "Buffer loop gain", caption);
    }

    private static RenderedPlot Step(StepResponse step)
    {
        var t = step.TimesSeconds.Select(x => x * 1e6).ToArray();
        var plot = PlotStyle.NewPlot("Buffer closed-loop step", "Time after the step (µs)", $"V({step.Node}) (V)");
        PlotStyle.AddLine(plot, t, [.. step.Volts], $"op-amp output '{step.Node}'", PlotStyle.Simulated, 2);
        plot.ShowLegend(Edge.Bottom);
        return PlotStyle.Render(plot, "buffer-step", "Buffer closed-loop step",
            $"A {step.StepVolts * 1e3:0.##} mV step at the buffer's input with the real load (transient): overshoot {step.OvershootPercent:0.#} %.");
    }
}
