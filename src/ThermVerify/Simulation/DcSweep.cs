using ThermVerify.Circuits;
using ThermVerify.Simulation.Mna;

namespace ThermVerify.Simulation;

/// <summary>
/// DC sweeps. Each point starts Newton from the previous point's solution; a linear circuit costs one
/// LU and one substitution per point, with only the temperature- or value-dependent stamps restamped.
/// </summary>
internal static class DcSweep
{
    public const string TemperatureAnalysisName = "DC temperature sweep";
    public const string ElementAnalysisName = "DC sweep";

    /// <summary>Sweeps the circuit temperature; every temperature-dependent element follows, as SPICE's
    /// <c>.dc temp</c> does.</summary>
    public static DcSweepResult Temperature(Circuit circuit, IReadOnlyList<double> temperaturesCelsius)
    {
        foreach (var t in temperaturesCelsius)
            Circuit.CheckTemperature(t);
        TopologyCheck.Run(circuit);
        var system = new BoundSystem(circuit);
        return Run(system, temperaturesCelsius, TemperatureAnalysisName, "temperature (°C)",
            (s, t) => s.SetTemperature(t));
    }

    /// <summary>Sweeps the main value of one element (a source's DC value, a resistance) at the circuit temperature.</summary>
    public static DcSweepResult Element(Circuit circuit, string elementName, IReadOnlyList<double> values)
    {
        TopologyCheck.Run(circuit);
        var system = new BoundSystem(circuit);
        var stamp = system.StampOf(elementName);
        var quantity = stamp.SweepQuantity
            ?? throw new CircuitException($"{stamp.Element.Describe} has no single value a DC sweep can vary; sweep a source or a resistor.");
        system.MarkVarying(stamp);
        return Run(system, values, ElementAnalysisName, $"{elementName} {quantity}",
            (s, v) => s.SetSweepValue(stamp, v));
    }

    private static DcSweepResult Run(BoundSystem system, IReadOnlyList<double> values, string analysis, string parameter,
        Action<BoundSystem, double> set)
    {
        var width = system.Layout.VectorLength;
        var data = new double[values.Count * width];
        var warnings = new Warnings(system);
        for (var p = 0; p < values.Count; p++)
        {
            set(system, values[p]);
            if (!TryNewton(system))
                DcSolver.Solve(system, analysis, values[p]);
            Array.Copy(system.Context.Solution, 0, data, p * width, width);
            warnings.Check(sweepValue: values[p]);
        }
        return new DcSweepResult(system, parameter, [.. values], data, warnings.Found);
    }

    private static bool TryNewton(BoundSystem system)
    {
        try
        {
            return Newton.Iterate(system, NewtonSettings.Default, out _);
        }
        catch (SingularMatrixException)
        {
            return false;
        }
    }
}
