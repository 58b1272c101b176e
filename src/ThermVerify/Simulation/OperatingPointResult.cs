using ThermVerify.Circuits;
using ThermVerify.Simulation.Mna;

namespace ThermVerify.Simulation;

/// <summary>The DC operating point: every node voltage and branch current, plus warnings.</summary>
internal sealed class OperatingPointResult
{
    private readonly MnaLayout layout;
    private readonly double[] solution;
    private readonly Dictionary<string, Stamp> stamps;

    internal OperatingPointResult(BoundSystem system, IReadOnlyList<SimulationWarning> warnings, ConvergenceAid aid)
    {
        Aid = aid;
        layout = system.Layout;
        solution = (double[])system.Context.Solution.Clone();
        stamps = system.Stamps.ToDictionary(s => s.Element.Name);
        TemperatureCelsius = system.Context.TemperatureCelsius;
        Warnings = warnings;
    }

    public double TemperatureCelsius { get; }

    public IReadOnlyList<SimulationWarning> Warnings { get; }

    /// <summary>The convergence aid the solution needed (<see cref="ConvergenceAid.None"/>: plain Newton).</summary>
    public ConvergenceAid Aid { get; }

    /// <summary>Voltage of <paramref name="node"/> against ground ("0" gives 0).</summary>
    public double Voltage(string node) => solution[layout.IndexOfNode(node)];

    /// <summary>Current through an element in its positive direction (sources: Positive → Negative inside).</summary>
    public double Current(string elementName)
    {
        if (!stamps.TryGetValue(elementName, out var s))
            throw new CircuitException($"The circuit has no element named '{elementName}'.");
        var i = s.CurrentAmperes(solution);
        return double.IsNaN(i)
            ? throw new CircuitException($"{s.Element.Describe} reports no current at the operating point.")
            : i;
    }

    /// <summary>Every unknown by name: node voltages and I(element) branch currents.</summary>
    public IReadOnlyDictionary<string, double> Unknowns =>
        layout.UnknownNames.Select((n, i) => (n, i)).ToDictionary(p => p.n, p => solution[p.i]);
}
