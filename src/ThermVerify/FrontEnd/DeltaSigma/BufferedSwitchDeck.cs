using System.Globalization;
using ThermVerify.Circuits;
using ThermVerify.Circuits.Spice;
using ThermVerify.Design;

namespace ThermVerify.FrontEnd.DeltaSigma;

/// <summary>
/// The transient deck of a buffered delta-sigma input after a channel switch: the check takes its settling in closed
/// form (<see cref="ChannelSettling.BufferedSample"/>, a single pole), and this deck is the circuit that closed form
/// stands for, so another engine can check it: the design's DC circuit with the buffer's input current stepped on at
/// t = 0 (the operating point before it is the unloaded pin, where the channel's own filter rested), and with a shared
/// filter the pin held at the other channel's voltage through 1 µΩ until <see cref="HoldFraction"/>·T, from when the
/// closed form's clock runs. Modulator sample n is the pin at (n + ½)·T on that clock: no switch opens then, so the
/// instant is sharp in any engine.
/// </summary>
internal static class BufferedSwitchDeck
{
    /// <summary>The hold's length in modulator periods: longer than SPICE's 1 ps switch edges at any modulator rate allowed.</summary>
    public const double HoldFraction = 1e-3;

    public static string Write(FrontEndDesign design, DeltaSigmaSpec d, double celsius, DeckOptions options)
    {
        var other = DeltaSigmaDecks.OtherChannelVolts(design, celsius);
        var circuit = Circuit(design, celsius, other);
        var filter = SincFilter.Of(d);
        var ends = DeltaSigmaDecks.ReadingEnds(d, filter, options.Conversions);
        var period = 1 / d.ModulatorRateHertz;
        var sweep = new TransientSweep(SampleSeconds(d, ends[^1], other is not null) + period, period / 20);
        var pin = FrontEndCircuit.PinNode(design);
        var what = I($"channel switch at {celsius:0.###} °C, {options.Conversions} readings: the buffered input's current {d.InputCurrentAmperes:G4} A into the pin from t = 0") +
                   (other is { } v ? I($"; the shared filter holds the other channel's {v:G6} V until {HoldFraction:G3}·T (the farther of 0 V and full scale from this channel)")
                       : "; the channel's own filter rests at its unloaded voltage") +
                   I($"; modulator sample n is v({pin}) at {(other is null ? "" : I($"{HoldFraction:G3}·T + "))}(n + 0.5)·T, T = 1/f_mod = {period:G6} s; reading k of the ") +
                   I($"{(d.FilterReset ? "reset " : "")}sinc{d.FilterOrder} filter is Σ h[j]·sample(n_k − j) over its {filter.ImpulseResponse.Count} taps, n_k the reading's last sample");
        return SpiceDeckWriter.Write(circuit, sweep,
            FrontEndDecks.Header(design, circuit, what,
                I($"prints last_sample_k for k = 1 … {options.Conversions}: the modulator's last sample in reading k (n_k = {string.Join(", ", ends.Take(3))}, …)")),
            options.PrintFigures
                ? [.. ends.Select((n, k) => new MeasureAt(I($"last_sample_{k + 1}"), pin, SampleSeconds(d, n, other is not null)))]
                : []);
    }

    /// <summary>The circuit: the DC circuit with the input current stepped on at 0 and, for a shared filter, the hold.</summary>
    public static Circuit Circuit(FrontEndDesign design, double celsius, double? otherVolts)
    {
        var d = design.Adc.DeltaSigma!;
        var pin = FrontEndCircuit.PinNode(design);
        var period = 1 / d.ModulatorRateHertz;
        // An ideal step in the built-in engine, a 1 ps edge in SPICE; held on far beyond any run.
        var circuit = FrontEndCircuit.Dc(design, null, celsius)
            .Add(new CurrentSource(InputLoading.BufferCurrent, pin, Circuits.Circuit.Ground, new PulseWaveform(0, d.InputCurrentAmperes, 0, 0, 0, 1e9, 0)));
        return otherVolts is { } v
            ? circuit
                .Add(new VoltageSource(ChannelSettling.HoldSource, ChannelSettling.HoldNode, Circuits.Circuit.Ground, new DcWaveform(v)))
                .Add(new TimedSwitch(ChannelSettling.HoldSwitch, ChannelSettling.HoldNode, pin, 1e-6, FrontEndCircuit.SwitchOffOhms,
                    new PeriodicSchedule(0, period, HoldFraction * period, 1)))
            : circuit;
    }

    /// <summary>When modulator sample n is read: (n + ½)·T after the closed form's clock starts (the hold's end with a shared filter).</summary>
    public static double SampleSeconds(DeltaSigmaSpec d, long n, bool held) => ((held ? HoldFraction : 0) + n + 0.5) / d.ModulatorRateHertz;

    private static string I(FormattableString s) => s.ToString(CultureInfo.InvariantCulture);
}
