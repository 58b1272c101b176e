using ThermVerify.Check.DeltaSigma;

namespace ThermVerify.Reporting;

/// <summary>The "deltaSigma" block of the check's JSON (docs/json-output.md); null for a successive-approximation converter.</summary>
internal static class DeltaSigmaJson
{
    public static object? ToJson(DeltaSigmaReport? r) => r is null ? null : new
    {
        filter = r.Filter,
        decimation = r.Decimation,
        modulatorRateHertz = r.ModulatorRateHertz,
        dataRateHertz = r.DataRateHertz,
        noiseBandwidthHertz = r.NoiseBandwidthHertz,
        filterSettlingReadings = r.FilterSettlingReadings,
        inputLoading = r.InputLoading.Select(l => new
        {
            celsius = l.Celsius,
            buffered = l.Buffered,
            unloadedVolts = l.UnloadedVolts,
            switchedVolts = l.SwitchedVolts,
            averageVolts = l.AverageVolts,
            closedFormVolts = l.ClosedFormVolts,
            errorVolts = l.ErrorVolts,
            equivalentOhms = double.IsFinite(l.EquivalentOhms) ? l.EquivalentOhms : (double?)null,
            sourceOhms = l.SourceOhms,
        }),
        channelSwitch = new
        {
            celsius = r.ChannelSwitch.Celsius,
            filter = r.ChannelSwitch.Start switch { FrontEnd.DeltaSigma.ChannelStart.SharedFilter => "shared", FrontEnd.DeltaSigma.ChannelStart.SwitchOn => "switch-on", _ => "own" },
            otherChannelVolts = r.ChannelSwitch.OtherChannelVolts,
            settledVolts = r.ChannelSwitch.FinalVolts,
            lsbVolts = r.ChannelSwitch.LsbVolts,
            readingsToDiscard = r.ChannelSwitch.ReadingsToDiscard,
            settledSeconds = r.ChannelSwitch.SettledSeconds,
            readingsDiscarded = r.ChannelSwitch.ReadingsDiscarded,
            firstUsedErrorVolts = r.ChannelSwitch.FirstUsedErrorVolts,
            pinSamples = new { seconds = r.ChannelSwitch.Trace.Seconds, volts = r.ChannelSwitch.Trace.Volts },
            readings = r.ChannelSwitch.Readings.Select((x, i) => new { number = x.Number, seconds = x.Seconds, volts = x.Value, errorVolts = r.ChannelSwitch.ErrorVolts[i] }),
        },
        rejection = r.Rejection.Select(x => new
        {
            hertz = x.Hertz,
            filterGain = x.DigitalGain,
            frontEndGain = x.AnalogGain,
            errorVolts = x.ErrorVolts,
            errorKelvin = x.ErrorKelvin,
        }),
        rejectionCelsius = r.RejectionCelsius,
    };
}
