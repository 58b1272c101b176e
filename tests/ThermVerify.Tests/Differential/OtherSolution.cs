using ThermVerify.Circuits;
using ThermVerify.Ngspice;
using ThermVerify.Simulation;
using ThermVerify.Simulation.Mna;

namespace ThermVerify.Tests.Differential;

/// <summary>
/// Whether ngspice's DC answer is another solution of the engine's own equations: a circuit with positive feedback (an
/// op-amp latch, a diode loop) can have several, and each engine may find a different one. The engine's Newton
/// iteration starts from ngspice's node voltages (its op-amp pole nodes and branch currents too, read from the
/// subcircuit's internal nodes and the branch vectors); if it stays there, ngspice's point solves the engine's
/// equations as well, and the disagreement is the circuit's, not an engine's.
/// </summary>
internal static class OtherSolution
{
    /// <summary>The largest node difference (volts) between ngspice's point and where the engine's Newton goes from it,
    /// or null when Newton does not converge from there.</summary>
    /// <param name="point">Index into ngspice's vectors (0 for an operating point).</param>
    /// <param name="set">Puts the system at the sweep value of that point (nothing for an operating point).</param>
    public static double? Distance(RandomCircuit rc, NgspicePlot plot, int point, Action<BoundSystem> set)
    {
        var system = new BoundSystem(rc.Circuit);
        set(system);
        Seed(system, plot, point);
        SingularMatrixException? singular = null;
        if (!DcSolver.Attempt(system, ref singular, out _))
            return null;
        return rc.Nodes.Max(node => Math.Abs(system.NodeVoltage(node) - plot[node].Real[point]));
    }

    /// <summary>Puts ngspice's values of point <paramref name="point"/> into the system's solution, unknown by unknown.</summary>
    public static void Seed(BoundSystem system, NgspicePlot plot, int point)
    {
        var layout = system.Layout;
        var x = system.Context.Solution;
        for (var i = 0; i < layout.Size; i++)
            if (plot.Vectors.TryGetValue(NgspiceName(layout.UnknownNames[i]), out var vector))
                x[i] = vector.Real[point];
    }

    /// <summary>The engine's unknown names as ngspice's vectors: "U1#pole" is "xu1.pole", "I(V1)" is "v1#branch".</summary>
    private static string NgspiceName(string unknown)
    {
        if (unknown.StartsWith("I(", StringComparison.Ordinal))
        {
            var element = unknown[2..^1];
            var letter = element[0] switch { 'L' => 'l', 'E' => 'e', 'V' => 'v', _ => ' ' };
            return letter == ' ' ? "" : $"{(char.ToLowerInvariant(element[0]) == letter ? "" : letter.ToString())}{element.ToLowerInvariant()}#branch";
        }
        var hash = unknown.IndexOf('#');
        if (hash > 0)
        {
            var (element, part) = (unknown[..hash], unknown[(hash + 1)..]);
            return element.StartsWith('U') ? $"x{element.ToLowerInvariant()}.{part}" : "";
        }
        return unknown.ToLowerInvariant();
    }
}
