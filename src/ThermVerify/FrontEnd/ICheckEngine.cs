using System.Numerics;
using ThermVerify.Circuits;
using ThermVerify.Simulation;

namespace ThermVerify.FrontEnd;

/// <summary>
/// The two simulations a check needs, so that another engine (ngspice) can stand in for the built-in one: the
/// temperature sweep of a DC circuit, and a transient read at the sample instants. Results are plain voltages, the
/// same whichever engine produced them. Programs choose an engine (<see cref="BuiltInEngine.Instance"/>, or ngspice's);
/// the simulations themselves are the library's own business, so they are internal.
/// </summary>
public interface ICheckEngine
{
    /// <summary>A short name for reports ("built-in", "ngspice").</summary>
    string Name { get; }

    /// <summary>The voltage of each of <paramref name="nodes"/> at every temperature, as SPICE's <c>.dc temp</c>.</summary>
    internal IReadOnlyList<double[]> TemperatureSweep(Circuit circuit, IReadOnlyList<double> temperaturesCelsius, IReadOnlyList<string> nodes);

    /// <summary>A transient of <paramref name="circuit"/> from its operating point, read at rising times.</summary>
    internal ISampledTransient StartTransient(Circuit circuit, TransientOptions options);

    /// <summary>
    /// Small-signal voltages of <paramref name="nodes"/> driven by the circuit's AC sources, logarithmic in frequency
    /// (as SPICE's <c>.ac dec</c>); the engine says at which frequencies. The buffer checks of a design's own op-amp
    /// subcircuit measure its loop gain this way.
    /// </summary>
    internal (double[] FrequenciesHertz, Complex[][] Volts) AcSweep(Circuit circuit, double startHertz, double stopHertz, int pointsPerDecade,
        IReadOnlyList<string> nodes);

    /// <summary>The output noise density (V/√Hz) at <paramref name="node"/>, logarithmic in frequency (as SPICE's <c>.noise</c>).</summary>
    internal (double[] FrequenciesHertz, double[] VoltsPerRootHertz) NoiseSweep(Circuit circuit, string node, string inputSource,
        double startHertz, double stopHertz, int pointsPerDecade);
}

/// <summary>A running transient: node voltages at times that never go back.</summary>
internal interface ISampledTransient
{
    double VoltageAt(double timeSeconds, string node);
}

/// <summary>The built-in modified-nodal-analysis engine, the default.</summary>
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
        new Running(new TransientSimulation(circuit, options));

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

    private sealed class Running(TransientSimulation simulation) : ISampledTransient
    {
        public double VoltageAt(double timeSeconds, string node)
        {
            if (timeSeconds > simulation.TimeSeconds)
            {
                simulation.AdvanceTo(timeSeconds);
                simulation.ForgetRecordedPoints(); // only the samples are read: a long run must not keep every point
            }
            return simulation.Voltage(node);
        }
    }
}
