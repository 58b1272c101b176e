using ThermVerify.Circuits;
using ThermVerify.Design;
using ThermVerify.Simulation;
using ThermVerify.Simulation.Switched;

namespace ThermVerify.FrontEnd.DeltaSigma;

/// <summary>
/// The readings after the multiplexer switches to this channel, the analog transient at the pin followed through the
/// digital filter. The channel's own RC filter sits ahead of the multiplexer (<see cref="ChannelStart.OwnFilter"/>):
/// while another channel was read its reservoir rested at the unloaded voltage, and the unbuffered input, joined at
/// the switch, pulls it down to the loaded level with the time constant (R_s ∥ R_eq)·C. The modulator takes C·V of
/// the input capacitor at the end of each charging phase: the switched transient of <see cref="InputLoading"/> read
/// there. The built-in engine composes those samples as a linear recurrence (exact propagation: one period's map), and
/// the filter's readings follow from its powers and geometric sums (<see cref="RecurrenceReadings"/>); an engine that
/// cannot is read sample by sample and the readings summed tap by tap (<see cref="SincFilter.Readings"/>), the cross-check
/// of the recurrence. The filter's memory holds the
/// other channel's input unless it is reset (<see cref="SincFilter.Readings"/>); the other channel is taken at 0 V
/// and at full scale, and the worse is reported. A buffered input draws only its current: the reservoir moves by
/// I·R_s with τ = R_s·C (single pole, elementary), a recurrence of one state. Every reading is compared with the settled reading, the filter's
/// output of the periodic steady state.
/// </summary>
internal static class ChannelSettling
{
    public const string HoldSwitch = "Sds_hold";
    public const string HoldSource = "Vds_hold";
    public const string HoldNode = "ds_hold";

    /// <summary>Samples read after the pin is within this fraction of an LSB of its steady state are taken as steady (no further reads).</summary>
    private const double SteadyLsb = 1e-4;

    /// <summary>At most this many readings are followed after a switch.</summary>
    public const int MaximumReadings = 64;

    /// <param name="trace">Record the pin's trace for a report's figure (a Monte Carlo unit needs only its readings).</param>
    public static ChannelSettlingResult At(FrontEndDesign design, double celsius, ICheckEngine engine, ChannelStart start = ChannelStart.OwnFilter,
        bool trace = true)
    {
        var d = design.Adc.DeltaSigma ?? throw new ArgumentException($"{design.Name} has no delta-sigma converter.", nameof(design));
        var filter = SincFilter.Of(d);
        var load = InputLoading.At(design, celsius, engine);
        var fullScale = design.NominalReferenceVolts / d.Gain;
        var lsb = fullScale / Math.Pow(2, design.Adc.Bits);
        var final = load.SwitchedVolts; // the filter passes DC with gain 1: the settled reading is the steady sample
        var count = ReadingsToFollow(design, d, filter, load);
        var sequences = new Dictionary<double, LinearSampleSequence?>();
        Func<long, double, double>? samples = null; // sample by sample, where the engine composes no recurrence
        ChannelSettlingResult? worst = null;
        Func<IReadOnlyList<long>, double[]>? worstTrace = null;
        // Switched on, the front end starts from 0 V and the filter from nothing: one case.
        foreach (var other in start == ChannelStart.SwitchOn ? [0.0] : new[] { 0.0, fullScale })
        {
            // The own filter's reservoir starts unloaded whatever the other channel was: one run serves both levels.
            var key = start == ChannelStart.OwnFilter ? 0 : other;
            if (!sequences.TryGetValue(key, out var sequence))
                sequences[key] = sequence = Recurrence(design, d, celsius, load, engine, start, other);
            IReadOnlyList<FilterReading> readings;
            Func<IReadOnlyList<long>, double[]> traced;
            if (sequence is not null)
            {
                readings = RecurrenceReadings.Of(filter, sequence, other, count, d.FilterReset);
                traced = indices => RecurrenceReadings.SamplesAt(sequence, indices);
            }
            else
            {
                samples ??= Samples(design, d, celsius, load, count * filter.SamplesPerReading + filter.ImpulseResponse.Count, engine, start, lsb);
                var level = other;
                readings = filter.Readings(n => samples(n, level), _ => level, count, d.FilterReset);
                traced = indices => [.. indices.Select(n => samples(n, level))];
            }
            var result = Judge(readings, final, lsb, d.ReadingsDiscarded, other, celsius, filter, start);
            if (worst is null || Math.Abs(result.FirstUsedErrorVolts) > Math.Abs(worst.FirstUsedErrorVolts)) (worst, worstTrace) = (result, traced);
        }
        return trace ? worst! with { Trace = Trace(d, worst.Readings, worstTrace!) } : worst!;
    }

    /// <summary>
    /// The modulator's samples after the switch as a linear recurrence (<see cref="RecurrenceReadings"/> filters it
    /// without following it sample by sample): a buffered input's single pole, or what the engine composes of the
    /// switched circuit (exact propagation of a linear front end); null where the engine can only step the samples.
    /// </summary>
    internal static LinearSampleSequence? Recurrence(FrontEndDesign design, DeltaSigmaSpec d, double celsius, InputLoad load, ICheckEngine engine,
        ChannelStart start, double other)
    {
        if (d.InputBuffered) return BufferedRecurrence(design, d, load, start, other);
        var period = 1 / d.ModulatorRateHertz;
        var lead = start == ChannelStart.SwitchOn ? SwitchOnLeadSeconds(design) : 0;
        var circuit = SwitchCircuit(design, celsius, start == ChannelStart.OwnFilter ? null : other, lead);
        var run = engine.StartTransient(circuit, new TransientOptions { StopTimeSeconds = period * 2 + lead, MaxStepSeconds = period / 20 });
        return run.TryLinearSamples(InputLoading.InputSwitch, InputLoading.InputNode, out var sequence) ? sequence : null;
    }

    /// <summary>
    /// <see cref="BufferedSample"/> as a recurrence of one state: s_0 = V_∞ + (V_0 − V_∞)·e^(−(T/2 + lead)/τ), then
    /// s_(n+1) = ρ·s_n + (1 − ρ)·V_∞ with ρ = e^(−T/τ) (ρ = 0 without a time constant).
    /// </summary>
    internal static LinearSampleSequence BufferedRecurrence(FrontEndDesign design, DeltaSigmaSpec d, InputLoad load, ChannelStart start, double other)
    {
        var tau = AnalogTimeConstant(design, d, load);
        var rho = tau > 0 ? Math.Exp(-1 / (d.ModulatorRateHertz * tau)) : 0;
        return new LinearSampleSequence([], 1, [rho], [(1 - rho) * load.SwitchedVolts], [BufferedSample(design, d, load, start, other, 0)], [1], 0);
    }

    /// <summary>Points of the pin's trace a report draws: the modulator samples up to the last reading, at most this many.</summary>
    public const int TracePoints = 600;

    /// <summary>
    /// The modulator's samples from the switch to the last reading followed, decimated evenly to at most
    /// <see cref="TracePoints"/> (every sample while there are fewer), for the report's plot of the switch. Sample n is
    /// placed at (n + 1)/f_mod, the readings' clock (<see cref="FilterReading.Seconds"/>: reading k at its last sample's).
    /// </summary>
    private static SettlingTrace Trace(DeltaSigmaSpec d, IReadOnlyList<FilterReading> readings, Func<IReadOnlyList<long>, double[]> samples)
    {
        var last = (long)Math.Round(readings[^1].Seconds * d.ModulatorRateHertz) - 1;
        var step = Math.Max(1, (last + 1 + TracePoints - 1) / TracePoints);
        var indices = new List<long>();
        for (long n = 0; n <= last; n += step) indices.Add(n);
        if (indices[^1] != last) indices.Add(last);
        return new SettlingTrace([.. indices.Select(n => (n + 1) / d.ModulatorRateHertz)], samples(indices));
    }

    /// <summary>The readings to follow: the filter's settling, the analog transient's 20 time constants and the discarded ones, with two more.</summary>
    internal static int ReadingsToFollow(FrontEndDesign design, DeltaSigmaSpec d, SincFilter filter, InputLoad load)
    {
        var tau = AnalogTimeConstant(design, d, load);
        var analog = (int)Math.Ceiling(20 * tau * filter.DataRateHertz);
        return Math.Min(MaximumReadings, Math.Max(filter.SettlingConversions + analog, d.ReadingsDiscarded + 1) + 2);
    }

    /// <summary>(R_s ∥ R_eq)·(C_res + C_pin): the pin's time constant with the input joined (single pole).</summary>
    public static double AnalogTimeConstant(FrontEndDesign design, DeltaSigmaSpec d, InputLoad load)
    {
        var r = double.IsFinite(load.EquivalentOhms) ? load.SourceOhms * load.EquivalentOhms / (load.SourceOhms + load.EquivalentOhms) : load.SourceOhms;
        return r * (design.Filter.ReservoirCapacitorFarads + design.Adc.PinCapacitanceFarads);
    }

    /// <summary>
    /// The modulator's samples after the switch, by index (0: the first charging phase), for an other channel's voltage.
    /// Read from the engine until the pin is steady, then the steady sample.
    /// </summary>
    private static Func<long, double, double> Samples(FrontEndDesign design, DeltaSigmaSpec d, double celsius, InputLoad load, long count,
        ICheckEngine engine, ChannelStart start, double lsb)
    {
        var period = 1 / d.ModulatorRateHertz;
        if (d.InputBuffered)
        {
            return (n, other) => BufferedSample(design, d, load, start, other, n);
        }
        var cache = new Dictionary<double, double[]>();
        var lead = start == ChannelStart.SwitchOn ? SwitchOnLeadSeconds(design) : 0;
        return (n, other) =>
        {
            var key = start == ChannelStart.OwnFilter ? 0 : other;
            if (!cache.TryGetValue(key, out var values))
                cache[key] = values = Simulate(design, d, celsius, load, count, engine, start == ChannelStart.OwnFilter ? null : other, lsb, lead);
            return n < values.Length ? values[n] : load.SwitchedVolts;
        };
    }

    /// <summary>
    /// A buffered input's modulator sample n, at (n + ½)·T (plus the switch-on lead): the buffer's current pulls the
    /// reservoir from where it starts (its unloaded level with its own filter, the other channel's with a shared one, 0 V
    /// at switch-on) to the loaded level, a single pole of <see cref="AnalogTimeConstant"/> (elementary).
    /// </summary>
    internal static double BufferedSample(FrontEndDesign design, DeltaSigmaSpec d, InputLoad load, ChannelStart start, double other, long n)
    {
        var tau = AnalogTimeConstant(design, d, load);
        var from = start == ChannelStart.OwnFilter ? load.UnloadedVolts : other;
        var t = (n + 0.5) / d.ModulatorRateHertz + (start == ChannelStart.SwitchOn ? SwitchOnLeadSeconds(design) : 0);
        return load.SwitchedVolts + (from - load.SwitchedVolts) * (tau > 0 ? Math.Exp(-t / tau) : 0);
    }

    /// <summary>
    /// The switched input joined at t = T (its first charging phase [T, 1.5T)); with a shared filter a switch holds the
    /// pin at the other channel's voltage until T/2. Sample n is the input capacitor's voltage as it leaves the pin.
    /// </summary>
    private static double[] Simulate(FrontEndDesign design, DeltaSigmaSpec d, double celsius, InputLoad load, long count, ICheckEngine engine,
        double? otherVolts, double lsb, double leadSeconds)
    {
        var period = 1 / d.ModulatorRateHertz;
        var circuit = SwitchCircuit(design, celsius, otherVolts, leadSeconds);
        var stop = period * (count + 2) + leadSeconds;
        var run = engine.StartTransient(circuit, new TransientOptions { StopTimeSeconds = stop, MaxStepSeconds = period / 20 });
        // Exact propagation reads each sample in a few matrix products; a time-stepped run is bounded like any sampling run.
        if (!run.TryPeriodicSteadyState(InputLoading.InputSwitch, InputLoading.InputNode, out _))
            SteppedPeriods.Check(count, design);
        var values = new List<double>();
        var steadyRun = 0;
        for (long n = 0; n < count; n++)
        {
            var sample = run.VoltageAt(SampleSeconds(d, n, leadSeconds), InputLoading.InputNode);
            values.Add(sample);
            // Once a few hundred samples in a row sit on the steady state, the rest are the steady state.
            steadyRun = Math.Abs(sample - load.SwitchedVolts) <= SteadyLsb * lsb ? steadyRun + 1 : 0;
            if (steadyRun >= 256) break;
        }
        return [.. values];
    }

    /// <summary>
    /// The circuit of a switch: the design's DC circuit at <paramref name="celsius"/> with the unbuffered input joined at
    /// <paramref name="leadSeconds"/> + T; with <paramref name="otherVolts"/> (a shared filter) the pin held at the other
    /// channel's voltage through 1 mΩ until T/2. Modulator sample n is v(<see cref="InputLoading.InputNode"/>) at
    /// <see cref="SampleSeconds"/>(n), as the input capacitor leaves the pin. The `deck` command writes this same circuit.
    /// </summary>
    public static Circuit SwitchCircuit(FrontEndDesign design, double celsius, double? otherVolts, double leadSeconds)
    {
        var period = 1 / design.Adc.DeltaSigma!.ModulatorRateHertz;
        Element[] hold = otherVolts is { } v
            ?
            [
                new VoltageSource(HoldSource, HoldNode, Circuit.Ground, new DcWaveform(v)),
                new TimedSwitch(HoldSwitch, HoldNode, FrontEndCircuit.PinNode(design), 1e-3, FrontEndCircuit.SwitchOffOhms,
                    new PeriodicSchedule(0, period, period / 2, 1)),
            ]
            : [];
        // The input's switches start one modulator period late, so the state at t = 0 is the pin without the input.
        return InputLoading.Switched(design, celsius, null, period + leadSeconds, hold);
    }

    /// <summary>When modulator sample n (0: the first charging phase) leaves the pin: lead + (n + 1.5)·T.</summary>
    public static double SampleSeconds(DeltaSigmaSpec d, long n, double leadSeconds = 0) => leadSeconds + (n + 1.5) / d.ModulatorRateHertz;

    /// <summary>How long the excitation is on before the converter starts (the divider's switch_on_lead); 0 when not switched.</summary>
    public static double SwitchOnLeadSeconds(FrontEndDesign design) => design.Divider?.SwitchOnLeadSeconds ?? 0;

    private static ChannelSettlingResult Judge(IReadOnlyList<FilterReading> readings, double final, double lsb, int discarded, double other,
        double celsius, SincFilter filter, ChannelStart start)
    {
        var half = lsb / 2;
        var errors = readings.Select(r => r.Value - final).ToArray();
        var lastOutside = Array.FindLastIndex(errors, e => Math.Abs(e) > half);
        var settled = lastOutside + 1 < readings.Count ? lastOutside + 1 : -1; // index of the first reading within ½ LSB for good
        var used = Math.Min(discarded, readings.Count - 1);
        return new ChannelSettlingResult(celsius, start, other, final, lsb, [.. readings], [.. errors],
            settled < 0 ? null : settled, settled < 0 ? null : readings[settled].Seconds, discarded, errors[used], filter.SettlingConversions);
    }
}

/// <summary>Where the channel's filter sits against the multiplexer, so what the pin holds at the switch.</summary>
public enum ChannelStart
{
    /// <summary>Each channel has its own RC filter ahead of the multiplexer: the reservoir holds its own unloaded voltage.</summary>
    OwnFilter,
    /// <summary>The filter is shared, after the multiplexer: it holds the other channel's voltage.</summary>
    SharedFilter,
    /// <summary>
    /// The excitation is switched on for the reading: the pin starts from 0 V (the front end's energy is stored at the
    /// pin: reservoir and pin capacitance) and the converter starts the switch-on lead later with an empty filter.
    /// </summary>
    SwitchOn,
}

/// <summary>
/// The readings after a channel switch at one temperature: each reading's value and error against the settled one
/// (volts at the input), the readings to discard for every later one to be within ½ LSB (null: not within the readings
/// followed), when that reading is ready, and the error of the first reading the firmware uses.
/// </summary>
public sealed record ChannelSettlingResult(double Celsius, ChannelStart Start, double OtherChannelVolts, double FinalVolts, double LsbVolts,
    IReadOnlyList<FilterReading> Readings, IReadOnlyList<double> ErrorVolts, int? ReadingsToDiscard, double? SettledSeconds, int ReadingsDiscarded,
    double FirstUsedErrorVolts, int FilterSettlingConversions)
{
    /// <summary>Whether the first reading used is more than ½ LSB from the settled one.</summary>
    public bool FirstUsedOff => Math.Abs(FirstUsedErrorVolts) > LsbVolts / 2;

    /// <summary>The modulator's samples of the pin from the switch to the last reading (decimated), for the report's plot; empty when not recorded.</summary>
    public SettlingTrace Trace { get; init; } = new([], []);
}

/// <summary>Modulator samples after a switch: when each was taken (seconds on the readings' clock) and its voltage as the input capacitor left the pin.</summary>
public sealed record SettlingTrace(double[] Seconds, double[] Volts);
