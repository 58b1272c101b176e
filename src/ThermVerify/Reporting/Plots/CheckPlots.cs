using ThermVerify.Check;

namespace ThermVerify.Reporting.Plots;

/// <summary>Every figure of a check report, in the order the report shows them.</summary>
internal static class CheckPlots
{
    public static IReadOnlyList<RenderedPlot> Render(CheckResult result)
    {
        return
        [
            TransferPlot.Render(result),
            ErrorPlot.Render(result),
            WaveformPlot.Render(result, result.Waveform),
            SensitivityPlot.Render(result),
            .. BufferPlots.Render(result.Buffer),
        ];
    }
}
