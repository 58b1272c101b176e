using ThermVerify.Check.DeltaSigma;
using ThermVerify.FrontEnd.DeltaSigma;
using ThermVerify.Quantities;
using static ThermVerify.Reporting.ReportFormat;

namespace ThermVerify.Reporting;

/// <summary>
/// A delta-sigma converter's own analyses as report sections (text, Markdown and HTML render them as they render the
/// buffer's): the input's load three ways, the readings after a channel switch, the rejection of interference.
/// </summary>
internal static class DeltaSigmaSections
{
    /// <summary>Readings shown after a channel switch: enough to see the settling, not a page of them.</summary>
    private const int ShownReadings = 8;

    public static IReadOnlyList<BufferSection> Build(DeltaSigmaReport? r)
    {
        if (r is null) return [];
        var s = r.ChannelSwitch;
        var filter = $"Filter: {r.Filter}, decimation {r.Decimation} at {V(r.ModulatorRateHertz, UnitKind.Hertz)}, {V(r.DataRateHertz, UnitKind.Hertz)} data rate; " +
                     $"a step passes it in {r.FilterSettlingReadings} conversions; noise bandwidth {V(r.NoiseBandwidthHertz, UnitKind.Hertz)}.";
        var load = new BufferSection("input-loading", "Delta-sigma input load",
            [filter,
             "The converter's input three ways: the switched-capacitor transient's periodic steady state (what the converter takes), the average resistor " +
             "R_eq = 1/(f_mod·C) in the DC circuit, and the closed form V·R_eq/(R_s + R_eq) (Johns & Martin); errors against the unloaded pin."],
            ["T (°C)", "unloaded", "switched", "average", "closed form", "error", "R_eq", "R_s"],
            [.. r.InputLoading.Select(l => (string[])
            [
                N(l.Celsius, "0.##"), V(l.UnloadedVolts, UnitKind.Volt), V(l.SwitchedVolts, UnitKind.Volt), V(l.AverageVolts, UnitKind.Volt),
                V(l.ClosedFormVolts, UnitKind.Volt), V(l.ErrorVolts, UnitKind.Volt),
                double.IsFinite(l.EquivalentOhms) ? V(l.EquivalentOhms, UnitKind.Ohm) : "buffered", V(l.SourceOhms, UnitKind.Ohm),
            ])]);
        var channel = new BufferSection("channel-switch", "Readings after a channel switch",
            [$"At {C(s.Celsius)}, the other channel at {V(s.OtherChannelVolts, UnitKind.Volt)} ({s.Start switch { ChannelStart.SharedFilter => "shared filter: it starts from the other channel", ChannelStart.SwitchOn => "the excitation switched on: the pin starts from 0 V", _ => "own filter: it starts unloaded" }}); " +
             $"settled reading {V(s.FinalVolts, UnitKind.Volt)}, ½ LSB = {V(s.LsbVolts / 2, UnitKind.Volt)}.",
             (s.ReadingsToDiscard is { } n
                 ? $"Readings to discard: {n}; reading {n + 1} is the first within ½ LSB for good, {V(s.SettledSeconds!.Value, UnitKind.Second)} after the switch. "
                 : $"No reading within the {s.Readings.Count} followed comes within ½ LSB. ") +
             $"The design discards {s.ReadingsDiscarded}: the first reading used is {V(s.FirstUsedErrorVolts, UnitKind.Volt)} off."],
            ["reading", "ready after", "value", "error", "error (LSB)"],
            [.. s.Readings.Take(ShownReadings).Select((x, i) => (string[])
            [
                x.Number.ToString(System.Globalization.CultureInfo.InvariantCulture) + (i < s.ReadingsDiscarded ? " (discarded)" : ""),
                V(x.Seconds, UnitKind.Second), V(x.Value, UnitKind.Volt), V(s.ErrorVolts[i], UnitKind.Volt), N(s.ErrorVolts[i] / s.LsbVolts, "0.##"),
            ])]);
        var rejection = new BufferSection("rejection", "Interference rejection",
            [$"At {C(r.RejectionCelsius)}: the digital filter's |H(f)| and the analog path from a source in series with the sensor to the pin (AC analysis); " +
             "with a declared amplitude, the largest move of a reading it makes."],
            ["f", "filter (dB)", "front end (gain)", "total (dB)", "reading moves", "in K"],
            [.. r.Rejection.Select(x => (string[])
            [
                V(x.Hertz, UnitKind.Hertz), Db(x.DigitalDecibels), N(x.AnalogGain, "0.####"), Db(x.TotalDecibels),
                x.ErrorVolts is { } v ? V(v, UnitKind.Volt) : "none declared", x.ErrorKelvin is { } k ? N(k, "0.#####") : "",
            ])]);
        return [load, channel, rejection];
    }

    private static string Db(double db) => double.IsFinite(db) ? N(db, "0.#") : "∞ (a zero)";
}
