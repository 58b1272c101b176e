using System.Globalization;
using ThermVerify.Circuits.Spice;
using ThermVerify.Design;
using ThermVerify.Sensors;

namespace ThermVerify.FrontEnd.DeltaSigma;

/// <summary>
/// The SPICE decks of a design read by a delta-sigma converter, the circuits its check simulates: the temperature sweep
/// of the DC circuit with the input's average load (R_eq = 1/(f_mod·C) to ground, or the buffer's input current), and
/// the transient after a channel switch (<see cref="ChannelSettling.SwitchCircuit"/>: the unbuffered input's switches
/// and capacitor joined one modulator period in, a shared filter held at the other channel's voltage until then). The
/// AC and noise decks are the common ones (the DC circuit without the load, as the noise analysis runs it).
/// </summary>
internal static class DeltaSigmaDecks
{
    public static string Write(FrontEndDesign design, DeckAnalysis analysis, DeckOptions options)
    {
        var d = design.Adc.DeltaSigma!;
        var pin = FrontEndCircuit.PinNode(design);
        var load = d.InputBuffered
            ? I($"the buffer's input current {d.InputCurrentAmperes:G4} A at the pin")
            : I($"the unbuffered input's average load R_eq = 1/(f_mod·C) = {InputLoading.EquivalentOhms(d):G6} ohm from the pin to ground");
        if (analysis == DeckAnalysis.Dc)
        {
            var temperatures = SensorTabulation.Grid(design.Check.Range, design.Check.StepKelvin).ToList();
            var circuit = InputLoading.WithAverageLoad(design, FrontEndCircuit.Dc(design, null));
            return SpiceDeckWriter.Write(circuit, DcTemperatureSweep.From(temperatures),
                FrontEndDecks.Header(design, circuit, $"temperature sweep over the check range with {load}",
                    $"prints v({pin}) at each temperature: the pin voltage the converter's static reading takes (the check's DC level with the input's average load)"),
                options.PrintFigures ? [new PrintVectors("dc", design.Netlist is null ? [$"v({FrontEndNodes.Divider})", $"v({pin})"] : [$"v({pin})"])] : []);
        }
        return Transient(design, d, options);
    }

    /// <summary>The transient after a channel switch, covering <see cref="DeckOptions.Conversions"/> readings.</summary>
    private static string Transient(FrontEndDesign design, DeltaSigmaSpec d, DeckOptions options)
    {
        var celsius = options.TemperatureCelsius ?? (design.Check.Range.MinCelsius + design.Check.Range.MaxCelsius) / 2;
        if (d.InputBuffered) return BufferedSwitchDeck.Write(design, d, celsius, options);
        var other = OtherChannelVolts(design, celsius);
        var circuit = ChannelSettling.SwitchCircuit(design, celsius, other, 0);
        var filter = SincFilter.Of(d);
        var ends = ReadingEnds(d, filter, options.Conversions);
        var period = 1 / d.ModulatorRateHertz;
        // One period past the last sample: ngspice's .meas cannot read at the very end of a run.
        var sweep = new TransientSweep(ChannelSettling.SampleSeconds(d, ends[^1]) + period, period / 20);
        var what = I($"channel switch at {celsius:0.###} °C, {options.Conversions} readings: the unbuffered input (C = {d.SamplingCapacitanceFarads:G4} F at f_mod = {d.ModulatorRateHertz:G6} Hz, T = 1/f_mod) joins the pin at t = T") +
                   (other is { } v ? I($"; the shared filter holds the other channel's {v:G6} V until T/2 (the farther of 0 V and full scale from this channel)") : "; the channel's own filter rests at its unloaded voltage") +
                   I($"; modulator sample n is v({InputLoading.InputNode}) at (n + 1.5)·T, reading k of the {(d.FilterReset ? "reset " : "")}sinc{d.FilterOrder} filter") +
                   (d.AverageLength > 1 ? I($" (with the mean of {d.AverageLength})") : "") +
                   I($" is Σ h[j]·sample(n_k − j) over its {filter.ImpulseResponse.Count} taps, n_k the reading's last sample") +
                   (other is null || d.FilterReset ? "" : "; samples before the switch count as the other channel's voltage");
        return SpiceDeckWriter.Write(circuit, sweep,
            FrontEndDecks.Header(design, circuit, what,
                I($"prints last_sample_k for k = 1 … {options.Conversions}: the modulator's last sample in reading k (n_k = {string.Join(", ", ends.Take(3))}, …), ") +
                "read T/1000 before the input switch opens (SPICE opens a switch at the first time point past its threshold, so the instant itself is not sharp; the capacitor follows the pin there)"),
            options.PrintFigures
                ? [.. ends.Select((n, k) => new MeasureAt(I($"last_sample_{k + 1}"), InputLoading.InputNode, MeasureSeconds(d, n)))]
                : []);
    }

    /// <summary>Where the deck reads modulator sample n: T/1000 before its switch opens, where both engines agree (docs/methods.md, section 15).</summary>
    public static double MeasureSeconds(DeltaSigmaSpec d, long n) => ChannelSettling.SampleSeconds(d, n) - 1e-3 / d.ModulatorRateHertz;

    /// <summary>
    /// The other channel's voltage a shared filter holds at the switch: the farther of 0 V and full scale from this
    /// channel's (closed form), the worse of the two the check follows; null with the channel's own filter.
    /// </summary>
    public static double? OtherChannelVolts(FrontEndDesign design, double celsius)
    {
        var d = design.Adc.DeltaSigma!;
        if (!d.SharedFilter) return null;
        var fullScale = design.NominalReferenceVolts / d.Gain;
        var here = new ClosedFormModel(design).At(celsius).IdealVolts;
        return here > fullScale / 2 ? 0 : fullScale;
    }

    /// <summary>The index of each reading's last modulator sample after the switch (a reset filter gives its first reading after N conversions).</summary>
    public static long[] ReadingEnds(DeltaSigmaSpec d, SincFilter filter, int readings)
    {
        var skip = d.FilterReset ? filter.SettlingConversions - 1 : 0;
        return [.. Enumerable.Range(1 + skip, readings).Select(k => (long)k * filter.SamplesPerReading - 1)];
    }

    private static string I(FormattableString s) => s.ToString(CultureInfo.InvariantCulture);
}
