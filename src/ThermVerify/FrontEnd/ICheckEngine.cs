using System.Diagnostics.CodeAnalysis;
using System.Numerics;
using ThermVerify.Circuits;
using ThermVerify.Simulation;
using ThermVerify.Simulation.Switched;

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

    /// <summary>The engine's own version where it reports one (ngspice's, once it has run a deck), for every output's provenance.</summary>
    string? Version => null;

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

    /// <summary>
    /// The node's voltage when <paramref name="samplingSwitch"/> opens in the periodic steady state, where the engine
    /// can compute it directly (exact propagation); false where only conversion after conversion can tell.
    /// </summary>
    bool TryPeriodicSteadyState(string samplingSwitch, string node, out double volts)
    {
        volts = double.NaN;
        return false;
    }

    /// <summary>
    /// The node read each time <paramref name="samplingSwitch"/> opens, as a linear recurrence the engine has composed
    /// (exact propagation: <see cref="LinearSampleSequence"/>), so that any number of conversions follows without
    /// stepping them; false where the engine can only run conversion after conversion.
    /// </summary>
    bool TryLinearSamples(string samplingSwitch, string node, [NotNullWhen(true)] out LinearSampleSequence? sequence)
    {
        sequence = null;
        return false;
    }
}

/// <summary>The engine's simulations called on a concrete engine (its interface members are implemented explicitly).</summary>
internal static class CheckEngineCalls
{
    public static IReadOnlyList<double[]> TemperatureSweep(this ICheckEngine engine, Circuit circuit, IReadOnlyList<double> temperaturesCelsius,
        IReadOnlyList<string> nodes) => engine.TemperatureSweep(circuit, temperaturesCelsius, nodes);

    public static ISampledTransient StartTransient(this ICheckEngine engine, Circuit circuit, TransientOptions options) =>
        engine.StartTransient(circuit, options);

    public static (double[] FrequenciesHertz, Complex[][] Volts) AcSweep(this ICheckEngine engine, Circuit circuit,
        double startHertz, double stopHertz, int pointsPerDecade, IReadOnlyList<string> nodes) =>
        engine.AcSweep(circuit, startHertz, stopHertz, pointsPerDecade, nodes);

    public static (double[] FrequenciesHertz, double[] VoltsPerRootHertz) NoiseSweep(this ICheckEngine engine, Circuit circuit, string node,
        string inputSource, double startHertz, double stopHertz, int pointsPerDecade) =>
        engine.NoiseSweep(circuit, node, inputSource, startHertz, stopHertz, pointsPerDecade);
}
