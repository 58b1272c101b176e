using System.Collections.Concurrent;
using System.Diagnostics.CodeAnalysis;
using System.Numerics;
using ThermVerify.Circuits;
using ThermVerify.Simulation;
using ThermVerify.Simulation.Switched;

namespace ThermVerify.FrontEnd;

/// <summary>
/// An engine that simulates each netlist once per run. A remedy is proven by checking a copy of the design with the
/// change applied, and many changes leave the analog front end as it was (a converter error calibrated out, more
/// readings averaged): the copy's sweeps and transients are then the very ones already simulated. Simulations are
/// deterministic, so the same circuit with the same options gives the same numbers; this decorator keeps them, keyed
/// by the circuit's content (<see cref="CircuitContent"/>), and gives the recorded numbers back.
/// <para>
/// A transient is a sequence of reads at rising times, and a time-stepping engine may land on slightly different
/// points when it is stopped at other times, so a transient is kept as the sequence of reads it was given: a later run
/// of the same circuit is served from it while it asks for the same reads in the same order, and from the first read
/// that differs runs the inner engine, replaying its own earlier reads first. Every run therefore gets exactly what an
/// uncached run making the same reads would get.
/// </para>
/// </summary>
internal sealed class MemoizingEngine(ICheckEngine inner) : ICheckEngine
{
    /// <summary>Reads kept over all transients of a run (about 40 bytes each); beyond it transients run uncached.</summary>
    private const int MaximumReads = 4_000_000;

    private readonly ConcurrentDictionary<(Circuit, TransientOptions), Recording> transients = new(new TransientKey());
    private readonly ConcurrentDictionary<object, object> others = new();
    private int readsKept;

    public ICheckEngine Inner => inner;

    public string Name => inner.Name;

    public string? Version => inner.Version;

    /// <summary>The engine, memoizing (an engine already memoizing is returned as it is).</summary>
    public static ICheckEngine Wrap(ICheckEngine engine) => engine as MemoizingEngine ?? new MemoizingEngine(engine);

    IReadOnlyList<double[]> ICheckEngine.TemperatureSweep(Circuit circuit, IReadOnlyList<double> temperaturesCelsius, IReadOnlyList<string> nodes) =>
        Remember(new SweepKey(circuit, [.. temperaturesCelsius], [.. nodes]), () => inner.TemperatureSweep(circuit, temperaturesCelsius, nodes),
            v => [.. v.Select(a => (double[])a.Clone())]);

    (double[] FrequenciesHertz, Complex[][] Volts) ICheckEngine.AcSweep(Circuit circuit, double startHertz, double stopHertz, int pointsPerDecade,
        IReadOnlyList<string> nodes) =>
        Remember(new SmallSignalKey(circuit, "ac", startHertz, stopHertz, pointsPerDecade, [.. nodes]),
            () => inner.AcSweep(circuit, startHertz, stopHertz, pointsPerDecade, nodes),
            v => ((double[])v.FrequenciesHertz.Clone(), [.. v.Volts.Select(a => (Complex[])a.Clone())]));

    (double[] FrequenciesHertz, double[] VoltsPerRootHertz) ICheckEngine.NoiseSweep(Circuit circuit, string node, string inputSource,
        double startHertz, double stopHertz, int pointsPerDecade) =>
        Remember(new SmallSignalKey(circuit, "noise " + node + " " + inputSource, startHertz, stopHertz, pointsPerDecade, []),
            () => inner.NoiseSweep(circuit, node, inputSource, startHertz, stopHertz, pointsPerDecade),
            v => ((double[])v.FrequenciesHertz.Clone(), (double[])v.VoltsPerRootHertz.Clone()));

    ISampledTransient ICheckEngine.StartTransient(Circuit circuit, TransientOptions options)
    {
        if (Volatile.Read(ref readsKept) >= MaximumReads) return inner.StartTransient(circuit, options);
        return new Replay(this, transients.GetOrAdd((circuit, options), _ => new Recording()), circuit, options);
    }

    // A caller gets its own copy of the arrays; a failure is not kept (the next run of the same circuit meets it again).
    private T Remember<T>(object key, Func<T> run, Func<T, T> copy) where T : notnull
    {
        if (others.TryGetValue(key, out var found)) return copy((T)found);
        var result = run();
        others[key] = copy(result);
        return result;
    }

    /// <summary>The reads of one transient, in order: (time, node, value), or a periodic steady state (node, switch, value).</summary>
    private sealed class Recording
    {
        public readonly List<(double Time, string Node, string? Switch, bool Found, double Volts)> Reads = [];
    }

    /// <summary>A run served from a recording while its reads match it, and by the inner engine from the first that does not.</summary>
    private sealed class Replay(MemoizingEngine owner, Recording recording, Circuit circuit, TransientOptions options) : ISampledTransient
    {
        private readonly List<(double Time, string Node, string? Switch)> mine = [];
        private ISampledTransient? run;

        public double VoltageAt(double timeSeconds, string node) => Read(timeSeconds, node, null, out _);

        public bool TryPeriodicSteadyState(string samplingSwitch, string node, out double volts)
        {
            volts = Read(double.NaN, node, samplingSwitch, out var found);
            return found;
        }

        /// <summary>A pure function of the circuit: composed once per run by a run of its own and kept (the sequence is never changed).</summary>
        public bool TryLinearSamples(string samplingSwitch, string node, [NotNullWhen(true)] out LinearSampleSequence? sequence)
        {
            var key = (new SmallSignalKey(circuit, "linear samples " + samplingSwitch + " " + node, 0, 0, 0, []), options);
            sequence = owner.Remember<LinearSampleSequence?[]>(key, () =>
                [owner.Inner.StartTransient(circuit, options).TryLinearSamples(samplingSwitch, node, out var s) ? s : null], v => v)[0];
            return sequence is not null;
        }

        private double Read(double time, string node, string? samplingSwitch, out bool found)
        {
            var index = mine.Count;
            mine.Add((time, node, samplingSwitch));
            if (run is null)
            {
                lock (recording)
                {
                    if (index < recording.Reads.Count)
                    {
                        var r = recording.Reads[index];
                        if (Same(r.Time, time) && r.Node == node && r.Switch == samplingSwitch)
                        {
                            found = r.Found;
                            return r.Volts;
                        }
                    }
                }
                run = owner.Inner.StartTransient(circuit, options);
                for (var i = 0; i < index; i++) Ask(run, mine[i], out _);
            }
            var volts = Ask(run, mine[index], out found);
            lock (recording)
            {
                // Only a recording this run has followed so far may grow: the reads before are then its own.
                if (recording.Reads.Count == index && Interlocked.Increment(ref owner.readsKept) <= MaximumReads)
                    recording.Reads.Add((time, node, samplingSwitch, found, volts));
            }
            return volts;
        }

        private static double Ask(ISampledTransient run, (double Time, string Node, string? Switch) read, out bool found)
        {
            if (read.Switch is null)
            {
                found = true;
                return run.VoltageAt(read.Time, read.Node);
            }
            found = run.TryPeriodicSteadyState(read.Switch, read.Node, out var volts);
            return volts;
        }

        private static bool Same(double a, double b) => a.Equals(b); // NaN equals NaN here (a steady-state read has no time)
    }

    private sealed class TransientKey : IEqualityComparer<(Circuit Circuit, TransientOptions Options)>
    {
        public bool Equals((Circuit Circuit, TransientOptions Options) x, (Circuit Circuit, TransientOptions Options) y) =>
            x.Options.Equals(y.Options) && CircuitContent.Comparer.Equals(x.Circuit, y.Circuit);

        public int GetHashCode((Circuit Circuit, TransientOptions Options) key) =>
            HashCode.Combine(CircuitContent.Comparer.GetHashCode(key.Circuit), key.Options);
    }

    private sealed record SweepKey(Circuit Circuit, double[] Temperatures, string[] Nodes)
    {
        public bool Equals(SweepKey? other) => other is not null && CircuitContent.Comparer.Equals(Circuit, other.Circuit)
            && Temperatures.AsSpan().SequenceEqual(other.Temperatures) && Nodes.AsSpan().SequenceEqual(other.Nodes);

        public override int GetHashCode() => CircuitContent.Comparer.GetHashCode(Circuit);
    }

    private sealed record SmallSignalKey(Circuit Circuit, string What, double Start, double Stop, int PerDecade, string[] Nodes)
    {
        public bool Equals(SmallSignalKey? other) => other is not null && What == other.What && Start == other.Start && Stop == other.Stop
            && PerDecade == other.PerDecade && Nodes.AsSpan().SequenceEqual(other.Nodes) && CircuitContent.Comparer.Equals(Circuit, other.Circuit);

        public override int GetHashCode() => HashCode.Combine(CircuitContent.Comparer.GetHashCode(Circuit), What, Start, Stop, PerDecade);
    }
}
