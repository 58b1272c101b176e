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
            // A delta-sigma converter has no acquisition window: its channel switch takes the sampling figure's place.
            result.DeltaSigma is { } ds ? ChannelSwitchPlot.Render(result, ds.ChannelSwitch) : WaveformPlot.Render(result, result.Waveform),
            SensitivityPlot.Render(result),
            .. BufferPlots.Render(result.Buffer),
        ];
    }
}
