using System.Diagnostics.CodeAnalysis;
using System.Numerics;
using ThermVerify.Circuits;
using ThermVerify.Simulation;
using ThermVerify.Simulation.Switched;

namespace ThermVerify.FrontEnd;

/// <summary>
/// The built-in modified-nodal-analysis engine, the default. A sampling transient whose circuit is linear between
/// switch edges (periodic switches, DC sources, an op-amp that stays in its linear region) is propagated exactly
/// (<see cref="ExactSwitchedTransient"/>: no time step, rounding the only error, the periodic steady state in one
/// solve); any other transient, or one whose op-amp leaves its linear region, is time-stepped
/// (<see cref="TransientSimulation"/>).
/// </summary>
public sealed class BuiltInEngine : ICheckEngine
{
    public static readonly BuiltInEngine Instance = new();

    private BuiltInEngine() { }

    public string Name => "built-in";

    IReadOnlyList<double[]> ICheckEngine.TemperatureSweep(Circuit circuit, IReadOnlyList<double> temperaturesCelsius, IReadOnlyList<string> nodes)
    {
        var result = DcSweep.Temperature(circuit, temperaturesCelsius);
        return [.. nodes.Select(result.Voltage)];
    }

    ISampledTransient ICheckEngine.StartTransient(Circuit circuit, TransientOptions options)
    {
        var exactOptions = options.AccuracyVolts is { } accuracy ? new ExactSwitchedOptions { LinearityToleranceVolts = accuracy } : null;
        // Sources that change over time (a netlist's PULSE excitation switching on) keep the whole run from exact
        // propagation; where they have settled before the end, only the stretch up to their last corner is stepped.
        if (SettledSourcesTransient.TryStart(circuit, options, exactOptions) is { } settled)
            return settled;
        return ExactSwitchedTransient.TryStart(circuit, out var exact, out _, exactOptions)
            ? new Exact(exact, () => new Stepped(new TransientSimulation(circuit, options)))
            : new Stepped(new TransientSimulation(circuit, options));
    }

    (double[] FrequenciesHertz, Complex[][] Volts) ICheckEngine.AcSweep(Circuit circuit, double startHertz, double stopHertz, int pointsPerDecade,
        IReadOnlyList<string> nodes)
    {
        var result = AcAnalysis.Run(circuit, FrequencySweep.Logarithmic(startHertz, stopHertz, pointsPerDecade));
        return ([.. result.FrequenciesHertz], [.. nodes.Select(result.Voltage)]);
    }

    (double[] FrequenciesHertz, double[] VoltsPerRootHertz) ICheckEngine.NoiseSweep(Circuit circuit, string node, string inputSource,
        double startHertz, double stopHertz, int pointsPerDecade)
    {
        var result = NoiseAnalysis.Run(circuit, node, FrequencySweep.Logarithmic(startHertz, stopHertz, pointsPerDecade));
        return ([.. result.FrequenciesHertz], result.OutputDensity);
    }

    /// <summary>Time stepping; only the samples are read, so a long run keeps no recorded waveform.</summary>
    private sealed class Stepped(TransientSimulation simulation) : ISampledTransient
    {
        public double TimeSeconds => simulation.TimeSeconds;

        public double VoltageAt(double timeSeconds, string node)
        {
            AdvanceTo(timeSeconds);
            return simulation.Voltage(node);
        }

        public void AdvanceTo(double timeSeconds)
        {
            if (timeSeconds <= simulation.TimeSeconds) return;
            simulation.AdvanceTo(timeSeconds);
            simulation.ForgetRecordedPoints();
        }

        public double[] Solution() => simulation.CaptureState().Solution;

        /// <summary>Continues from another engine's solution (see <see cref="TransientSimulation.RestartAt"/>).</summary>
        public void RestartAt(double timeSeconds, double[] solution) => simulation.RestartAt(timeSeconds, solution);
    }

    /// <summary>
    /// Exact propagation, with time stepping where an op-amp leaves its linear region: the time-stepping run restarts
    /// from the exact solution at the start of the interval that failed (as from a breakpoint), is carried past the
    /// instant the exact run failed at, and exact propagation continues from its state there. So only the nonlinear
    /// stretches are stepped, not the linear ones between them. A further failure on the same interval doubles the
    /// stretch stepped (see <see cref="ResumeAfter"/>), so a slow recovery (an amplifier leaving its rail) costs a few
    /// attempts. Reads rise, so the stepped run only ever moves forward.
    /// </summary>
    private sealed class Exact(ExactSwitchedTransient exact, Func<Stepped> fallBack) : ISampledTransient
    {
        private ExactReader? reader = exact.Follow();
        private Stepped? stepped;
        private double resumeSeconds = double.NaN;
        private double stretch, failedIntervalEnd = double.NaN;

        public double VoltageAt(double timeSeconds, string node)
        {
            while (true)
            {
                if (reader is not null && TryExact(timeSeconds, node, out var volts))
                    return volts;
                if (timeSeconds <= resumeSeconds)
                    return stepped!.VoltageAt(timeSeconds, node);
                stepped!.AdvanceTo(resumeSeconds);
                reader = exact.FollowFrom(resumeSeconds, stepped.Solution());
            }
        }

        /// <summary>
        /// The exact read, true while the op-amp stays linear. Leaving the region is reported, not raised (an exception
        /// cost more than the step it reported); a configuration exact propagation cannot model at all, met only as the
        /// run reaches it, still raises, and then the rest of the run is stepped (from t = 0: its state is not known).
        /// </summary>
        private bool TryExact(double timeSeconds, string node, out double volts)
        {
            LinearityViolation? violation;
            try
            {
                (volts, violation) = reader!.Read(timeSeconds, node);
                if (violation is null)
                    return true;
            }
            catch (NotLinearException e) when (e.Violation is null)
            {
                (volts, violation) = (double.NaN, null);
            }
            stepped ??= fallBack();
            if (violation is not null && violation.FromSeconds > stepped.TimeSeconds + StopQueue.Epsilon(violation.FromSeconds))
                stepped.RestartAt(violation.FromSeconds, reader!.SolutionWhereStopped());
            reader = null;
            resumeSeconds = violation is null ? double.PositiveInfinity : ResumeAfter(violation);
            return false;
        }

        /// <summary>
        /// Where to try exact propagation again after it failed on the interval [From, To]: a stretch as long as the
        /// interval had run linearly before it failed (at least 1/256 of the interval), doubled on every further
        /// failure within the same interval. An excursion is usually short against its interval (an added follower
        /// switched on at its rail, charging a 100 nF reservoir, recovers in tens of microseconds of a 10 ms interval),
        /// and a fixed 1/16 of the interval stepped 600 µs there.
        /// </summary>
        private double ResumeAfter(LinearityViolation v)
        {
            stretch = v.ToSeconds == failedIntervalEnd ? 2 * stretch
                : Math.Max((v.ToSeconds - v.FromSeconds) / 256, v.AtSeconds - v.FromSeconds);
            failedIntervalEnd = v.ToSeconds;
            var resume = Math.Min(v.ToSeconds, Math.Max(stepped!.TimeSeconds, v.AtSeconds) + stretch);
            return resume;
        }

        public bool TryLinearSamples(string samplingSwitch, string node, [NotNullWhen(true)] out LinearSampleSequence? sequence) =>
            exact.TryLinearSamples(samplingSwitch, node, out sequence);

        public bool TryPeriodicSteadyState(string samplingSwitch, string node, out double volts)
        {
            volts = double.NaN;
            try
            {
                volts = exact.SteadyStateSampleVoltage(samplingSwitch, node);
                return true;
            }
            catch (NotLinearException)
            {
                return false;
            }
        }
    }
}
