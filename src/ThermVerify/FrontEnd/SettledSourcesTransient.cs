using ThermVerify.Circuits;
using ThermVerify.Simulation;
using ThermVerify.Simulation.Switched;

namespace ThermVerify.FrontEnd;

/// <summary>
/// A transient whose time-varying sources have all reached a constant level some time before the run ends: a
/// netlist's PULSE excitation switching on (its delay and rise), then held for the rest of the run. Only the stretch up
/// to the sources' last corner is time-stepped; from there the circuit is linear between switch edges with DC sources,
/// so exact propagation (<see cref="ExactSwitchedTransient"/>) carries the stepped state to every later read, with no
/// time step. A 10 ms switch-on lead before a 2 µs acquisition window had been hundreds of steps per run (a few
/// milliseconds of a Monte Carlo unit); now it is the 10 ns ramp's few steps and one interval map.
/// <para>
/// Where exact propagation cannot take over (the circuit is not linear between edges, or an op-amp leaves its linear
/// region after the corner), the time-stepping run simply continues: the reads are then exactly those of
/// <see cref="TransientSimulation"/>.
/// </para>
/// </summary>
internal sealed class SettledSourcesTransient : ISampledTransient
{
    private readonly TransientSimulation stepped;
    private readonly ExactSwitchedTransient exact;
    private readonly double settledSeconds;
    private Func<double, string, (double Volts, LinearityViolation? Violation)>? read;
    private bool steppedOnly;

    private SettledSourcesTransient(TransientSimulation stepped, ExactSwitchedTransient exact, double settledSeconds)
    {
        this.stepped = stepped;
        this.exact = exact;
        this.settledSeconds = settledSeconds;
    }

    /// <summary>
    /// The run, when the circuit has time-varying sources that are all constant from some instant before
    /// <see cref="TransientOptions.StopTimeSeconds"/> on, and the circuit with them held there is one exact propagation
    /// handles; else null.
    /// </summary>
    public static ISampledTransient? TryStart(Circuit circuit, TransientOptions options, ExactSwitchedOptions? exactOptions)
    {
        var stop = options.StopTimeSeconds;
        var varying = new List<(Element Element, Waveform Wave)>();
        foreach (var e in circuit.Elements)
            if (e is VoltageSource { Waveform: not DcWaveform } v) varying.Add((v, v.Waveform));
            else if (e is CurrentSource { Waveform: not DcWaveform } i) varying.Add((i, i.Waveform));
        if (varying.Count == 0 || !(stop > 0) || !double.IsFinite(stop)) return null;
        var corners = new List<double>();
        foreach (var (_, wave) in varying)
            wave.CollectBreakpoints(0, stop, corners);
        // A source that keeps switching through the run (the multiplexer's charge-injection pulse in every conversion)
        // is stepped as before: this is for a source that switches on once.
        if (corners.Count > 4 * varying.Count) return null;
        var settled = corners.Where(c => c < stop).DefaultIfEmpty(0).Max();
        if (!(settled > 0)) return null;
        // Between corners a waveform is linear in time (DC, PULSE and PWL alike), and no corner lies after the last one
        // before the end: equal halfway there and at the end, it is constant from that corner on.
        var held = circuit;
        foreach (var (element, wave) in varying)
        {
            var level = wave.ValueAt(stop);
            if (wave.ValueAt(settled + (stop - settled) / 2) != level) return null;
            held = held.Replace(element is VoltageSource v
                ? v with { Waveform = new DcWaveform(level) }
                : ((CurrentSource)element) with { Waveform = new DcWaveform(level) });
        }
        if (!ExactSwitchedTransient.TryStart(held, out var exact, out _, exactOptions)) return null;
        return new SettledSourcesTransient(new TransientSimulation(circuit, options), exact, settled);
    }

    public double VoltageAt(double timeSeconds, string node)
    {
        if (timeSeconds <= settledSeconds || steppedOnly)
            return SteppedAt(timeSeconds, node);
        try
        {
            if (read is null)
            {
                // The stepped run stops on the corner itself (a breakpoint), where the held circuit takes over.
                stepped.AdvanceTo(settledSeconds);
                stepped.ForgetRecordedPoints();
                read = exact.TryReaderFrom(settledSeconds, stepped.CaptureState().Solution);
            }
            var (volts, violation) = read(timeSeconds, node);
            if (violation is null) return volts;
        }
        catch (NotLinearException e) when (e.Violation is null)
        {
            // A configuration exact propagation cannot model, met only as the run reaches it: step the rest.
        }
        steppedOnly = true;
        return SteppedAt(timeSeconds, node);
    }

    private double SteppedAt(double timeSeconds, string node)
    {
        if (timeSeconds > stepped.TimeSeconds)
        {
            stepped.AdvanceTo(timeSeconds);
            stepped.ForgetRecordedPoints();
        }
        return stepped.Voltage(node);
    }
}
