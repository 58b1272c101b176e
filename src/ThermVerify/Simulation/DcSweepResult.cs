using ThermVerify.Circuits;
using ThermVerify.Simulation.Mna;

namespace ThermVerify.Simulation;

/// <summary>Node voltages and element currents at every point of a DC sweep.</summary>
internal sealed class DcSweepResult
{
    private readonly BoundSystem system;
    private readonly double[] data;
    private readonly int width;

    internal DcSweepResult(BoundSystem system, string parameter, double[] values, double[] data, IReadOnlyList<SimulationWarning> warnings)
    {
        this.system = system;
        this.data = data;
        width = system.Layout.VectorLength;
        Parameter = parameter;
        SweepValues = values;
        Warnings = warnings;
    }

    /// <summary>What was swept, with its unit.</summary>
    public string Parameter { get; }

    public IReadOnlyList<double> SweepValues { get; }

    public IReadOnlyList<SimulationWarning> Warnings { get; }

    /// <summary>The points that needed a convergence aid, with the aid (empty when plain Newton did throughout).</summary>
    public IReadOnlyList<SolverNote> Notes { get; init; } = [];

    /// <summary>Linear solves the sweep took (Newton iterations over every point, the aids' included).</summary>
    public long Solves => system.Solves;

    public int Count => SweepValues.Count;

    /// <summary>Voltage of <paramref name="node"/> at every sweep point.</summary>
    public double[] Voltage(string node)
    {
        var index = system.Layout.IndexOfNode(node);
        var v = new double[Count];
        for (var p = 0; p < v.Length; p++)
            v[p] = data[p * width + index];
        return v;
    }

    /// <summary>
    /// Current through an element at every point: branch currents of sources and inductors, and the
    /// current of resistors, sensors and leakage sources at each point's temperature.
    /// </summary>
    public double[] Current(string elementName)
    {
        var stamp = system.StampOf(elementName);
        var isTemperature = Parameter.StartsWith("temperature", StringComparison.Ordinal);
        var isSwept = !isTemperature && Parameter.StartsWith(elementName + " ", StringComparison.Ordinal);
        var current = new double[Count];
        var x = new double[width];
        for (var p = 0; p < Count; p++)
        {
            if (isTemperature)
                stamp.SetTemperature(SweepValues[p]);
            else if (isSwept)
                stamp.SetSweepValue(SweepValues[p]);
            Array.Copy(data, p * width, x, 0, width);
            current[p] = stamp.CurrentAmperes(x);
            if (double.IsNaN(current[p]))
                throw new CircuitException($"{stamp.Element.Describe} reports no current in a DC sweep.");
        }
        return current;
    }
}
