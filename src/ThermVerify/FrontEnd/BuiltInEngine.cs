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

    ISampledTransient ICheckEngine.StartTransient(Circuit circuit, TransientOptions options) =>
        ExactSwitchedTransient.TryStart(circuit, out var exact, out _)
            ? new Exact(exact, () => new Stepped(new TransientSimulation(circuit, options)))
            : new Stepped(new TransientSimulation(circuit, options));

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
        public double VoltageAt(double timeSeconds, string node)
        {
            if (timeSeconds > simulation.TimeSeconds)
            {
                simulation.AdvanceTo(timeSeconds);
                simulation.ForgetRecordedPoints();
            }
            return simulation.Voltage(node);
        }
    }

    /// <summary>
    /// Exact propagation; when an op-amp leaves its linear region the run is time-stepped from the start instead (reads
    /// rise, so the stepped run simply catches up to the time asked for).
    /// </summary>
    private sealed class Exact(ExactSwitchedTransient exact, Func<Stepped> fallBack) : ISampledTransient
    {
        private readonly Func<double, string, double> read = exact.Reader();
        private Stepped? stepped;

        public double VoltageAt(double timeSeconds, string node)
        {
            if (stepped is null)
            {
                try
                {
                    return read(timeSeconds, node);
                }
                catch (NotLinearException)
                {
                    stepped = fallBack();
                }
            }
            return stepped.VoltageAt(timeSeconds, node);
        }

        public bool TryPeriodicSteadyState(string samplingSwitch, string node, out double volts)
        {
            volts = double.NaN;
            if (stepped is not null) return false;
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
