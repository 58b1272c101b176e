using ThermVerify.Check;
using ThermVerify.FrontEnd;

namespace ThermVerify.Reporting.Plots;

/// <summary>Every figure of a check report, in the order the report shows them.</summary>
public static class CheckPlots
{
    /// <summary>Conversions drawn in the sampling figure: the first shows the precharge step, the next ones the recovery.</summary>
    public const int WaveformConversions = 3;

    public static IReadOnlyList<RenderedPlot> Render(CheckResult result)
    {
        var worst = result.Worst;
        var waveform = SamplingWaveform.Simulate(result.Design, worst.Celsius, worst.PrechargeVolts, WaveformConversions);
        return
        [
            TransferPlot.Render(result),
            ErrorPlot.Render(result),
            WaveformPlot.Render(result, waveform),
            SensitivityPlot.Render(result),
            .. BufferPlots.Render(result.Buffer),
        ];
    }
}
