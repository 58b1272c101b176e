using System.Collections.Concurrent;
using System.Numerics;
using ThermVerify.Circuits;
using ThermVerify.Circuits.Spice;
using ThermVerify.FrontEnd;
using ThermVerify.Limits;
using ThermVerify.Simulation;

namespace ThermVerify.Ngspice;

/// <summary>How ngspice is run.</summary>
public enum NgspiceMode
{
    /// <summary>The shared library in this process; decks that include a user's file still go to a child process.</summary>
    SharedLibrary,

    /// <summary>Every deck in a child <c>ngspice -b</c> process.</summary>
    ChildProcess,
}

/// <summary>
/// ngspice as the check's engine: each simulation becomes a deck from <see cref="SpiceDeckWriter"/>, run by the
/// shared library in a worker process (<see cref="NgspiceWorker"/>, one per thread at most) or by a child
/// <c>ngspice -b</c> process, and the vectors come back as plain voltages. Either way a deck that hangs or crashes
/// ngspice costs a process, never thermverify, and the run's cancellation (Ctrl+C, --timeout) stops it at once.
/// Dispose the engine to stop its workers (they also stop by themselves when this process ends).
/// </summary>
public sealed class NgspiceEngine : ICheckEngine, IDisposable
{
    /// <summary>Conversions the first sampling run covers; each later run doubles the simulated time.</summary>
    private const int FirstRunFactor = 16;

    private readonly ConcurrentBag<NgspiceWorker> idle = [];
    private readonly SemaphoreSlim slots = new(Environment.ProcessorCount);
    private readonly TimeSpan deckTimeLimit;
    private readonly string? workerLibrary;

    /// <param name="deckTimeLimit">A deck that runs longer is taken as hung and stopped (default 5 minutes).</param>
    public NgspiceEngine(NgspiceMode mode = NgspiceMode.SharedLibrary, TimeSpan? deckTimeLimit = null)
        : this(mode, deckTimeLimit, null)
    {
    }

    /// <param name="workerLibrary">A build of the shared library for the workers to load instead of the system's (tests).</param>
    internal NgspiceEngine(NgspiceMode mode, TimeSpan? deckTimeLimit, string? workerLibrary)
    {
        Mode = mode;
        TemporaryFolders.SweepOnce(); // the folders of runs that were killed outright, before this run adds its own
        this.workerLibrary = workerLibrary;
        this.deckTimeLimit = deckTimeLimit ?? NgspiceProcess.DefaultTimeLimit;
        if (mode == NgspiceMode.SharedLibrary)
            NgspiceLibrary.EnsureAvailable();
        else if (!NgspiceProcess.IsAvailable)
            throw new NgspiceUnavailableException(NgspiceProcess.InstallHint);
    }

    public NgspiceMode Mode { get; }

    public string Name => Mode == NgspiceMode.SharedLibrary ? "ngspice" : "ngspice (child process)";

    /// <summary>
    /// ngspice's version: the shared library states it when it starts (so it is known once a deck has run in a worker);
    /// the program is asked once with <c>ngspice -v</c>.
    /// </summary>
    public string? Version => Mode == NgspiceMode.ChildProcess ? programVersion.Value : libraryVersion;

    private readonly Lazy<string?> programVersion = new(NgspiceProcess.Version);
    private volatile string? libraryVersion;

    IReadOnlyList<double[]> ICheckEngine.TemperatureSweep(Circuit circuit, IReadOnlyList<double> temperaturesCelsius, IReadOnlyList<string> nodes)
    {
        var sweep = DcTemperatureSweep.From(temperaturesCelsius);
        var plot = Run(SpiceDeckWriter.Write(circuit, sweep, new SpiceDeckHeader("thermverify temperature sweep"))).Plot("dc");
        var swept = plot["temp-sweep"].Real;
        if (swept.Length < sweep.Points)
            throw new NgspiceException($"ngspice returned {swept.Length} temperatures of the {sweep.Points} asked for", []);
        for (var i = 0; i < sweep.Points; i++)
            if (Math.Abs(swept[i] - temperaturesCelsius[i]) > 1e-6 * Math.Max(1, Math.Abs(sweep.StepKelvin)))
                throw new NgspiceException($"ngspice swept {swept[i]} °C where {temperaturesCelsius[i]} °C was asked for", []);
        // Ground is 0 V by definition and ngspice keeps no vector for it (a current source's bottom without leads is ground).
        return [.. nodes.Select(n => n == Circuit.Ground ? new double[sweep.Points]
            : Finite(plot[n].Real[..sweep.Points], $"node {n} in the temperature sweep"))];
    }

    ISampledTransient ICheckEngine.StartTransient(Circuit circuit, TransientOptions options) => new SampledRun(this, circuit, options);

    (double[] FrequenciesHertz, Complex[][] Volts) ICheckEngine.AcSweep(Circuit circuit, double startHertz, double stopHertz, int pointsPerDecade,
        IReadOnlyList<string> nodes)
    {
        var plot = Run(SpiceDeckWriter.Write(circuit, new AcSweep(startHertz, stopHertz, pointsPerDecade), new SpiceDeckHeader("thermverify AC sweep"))).Plot("ac");
        var frequencies = Finite(plot["frequency"].Real, "the AC sweep's frequencies");
        return (frequencies, [.. nodes.Select(n => plot[n].Complex is { } c && c.All(v => double.IsFinite(v.Real) && double.IsFinite(v.Imaginary))
            ? c
            : throw new NgspiceException($"ngspice returned no finite AC values for node {n}", []))]);
    }

    (double[] FrequenciesHertz, double[] VoltsPerRootHertz) ICheckEngine.NoiseSweep(Circuit circuit, string node, string inputSource,
        double startHertz, double stopHertz, int pointsPerDecade)
    {
        var deck = SpiceDeckWriter.Write(circuit, new NoiseSweep(node, inputSource, startHertz, stopHertz, pointsPerDecade), new SpiceDeckHeader("thermverify noise"));
        var plot = Run(deck).Plot("noise");
        return (Finite(plot["frequency"].Real, "the noise sweep's frequencies"), Finite(plot["onoise_spectrum"].Real, $"the noise density at node {node}"));
    }

    /// <summary>Runs a deck the way this engine was asked to.</summary>
    internal NgspiceResult Run(string deck)
    {
        Work.ThrowIfCancelled();
        if (Mode == NgspiceMode.ChildProcess)
            return NgspiceProcess.Run(deck, deckTimeLimit);
        slots.Wait(Work.Cancel);
        try
        {
            var worker = idle.TryTake(out var ready) ? ready : NgspiceWorker.Start(workerLibrary);
            try
            {
                var result = worker.Run(deck, deckTimeLimit);
                libraryVersion ??= NgspiceBanner.Version(result.Output);
                return result;
            }
            finally
            {
                if (worker.Usable) idle.Add(worker);
                else worker.Dispose();
            }
        }
        finally
        {
            slots.Release();
        }
    }

    public void Dispose()
    {
        while (idle.TryTake(out var worker)) worker.Dispose();
    }

    /// <summary>A value ngspice returned that is not a number stops the analysis with the place it came from.</summary>
    private static double[] Finite(double[] values, string what)
    {
        for (var i = 0; i < values.Length; i++)
            if (!double.IsFinite(values[i]))
                throw new NgspiceException($"ngspice returned a value that is not a finite number for {what} (point {i + 1}); the circuit has no usable solution there", []);
        return values;
    }

    /// <summary>
    /// ngspice cannot be paused and resumed cheaply through either runner, so the transient is run to a stop time and
    /// re-run from the start, twice as long, when a later sample is asked for: at most about twice the work of one
    /// run of the right length.
    /// </summary>
    private sealed class SampledRun(NgspiceEngine engine, Circuit circuit, TransientOptions options) : ISampledTransient
    {
        private double simulatedTo;
        private NgspicePlot? plot;

        public double VoltageAt(double timeSeconds, string node)
        {
            if (plot is null || timeSeconds > simulatedTo)
                Simulate(Math.Min(options.StopTimeSeconds, Math.Max(timeSeconds * (plot is null ? FirstRunFactor : 1), 2 * simulatedTo)));
            if (timeSeconds > simulatedTo * (1 + 1e-12))
                throw new ArgumentOutOfRangeException(nameof(timeSeconds), timeSeconds, $"The transient stops at {options.StopTimeSeconds} s.");
            var value = Interpolate(plot!["time"].Real, plot[node].Real, timeSeconds);
            return double.IsFinite(value) ? value
                : throw new NgspiceException($"ngspice returned a value that is not a finite number for node {node} at t = {timeSeconds:G4} s in the sampling transient", []);
        }

        private void Simulate(double stopSeconds)
        {
            var maxStep = options.MaxStepSeconds > 0 ? options.MaxStepSeconds : stopSeconds / 50;
            var sweep = new TransientSweep(stopSeconds, maxStep)
            {
                StepGuards = StepGuard.ForSwitches(circuit),
                // Tighter than this, ngspice gives up at the switch edges ("timestep too small"); the guard times carry the accuracy.
                RelativeTolerance = 1e-6,
                VoltageToleranceVolts = 1e-9,
            };
            plot = engine.Run(SpiceDeckWriter.Write(circuit, sweep, new SpiceDeckHeader("thermverify sampling transient"))).Plot("tran");
            simulatedTo = stopSeconds;
        }

        /// <summary>The value at a time point within 0.1 ps (switch edges are breakpoints, so samples fall on one), else linear between neighbours.</summary>
        private static double Interpolate(double[] time, double[] value, double t)
        {
            var i = Array.BinarySearch(time, t);
            if (i >= 0) return value[i];
            i = ~i;
            if (i > 0 && t - time[i - 1] <= 1e-13) return value[i - 1];
            if (i < time.Length && time[i] - t <= 1e-13) return value[i];
            if (i == 0 || i == time.Length) return value[Math.Clamp(i, 0, time.Length - 1)];
            var w = (t - time[i - 1]) / (time[i] - time[i - 1]);
            return value[i - 1] + w * (value[i] - value[i - 1]);
        }
    }
}
