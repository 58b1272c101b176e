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

    /// <summary>
    /// How far ngspice's point of <paramref name="point"/> is from solving Kirchhoff's current law at the circuit's
    /// nodes, in the engine's equations: the largest node residual (amperes) and that residual over the sum of the
    /// magnitudes of the currents meeting there, with its node. The loads are assembled at ngspice's point (the step
    /// limiting walked there, <see cref="Seed"/>), so each row's residual is the sum of the elements' currents into
    /// that node; the op-amps' internal rows are left out (their input stages differ by design, see docs/engine.md).
    /// </summary>
    public static (double Amperes, double Relative, string Node) CurrentLawResidual(Circuit circuit, NgspicePlot plot, int point, Action<BoundSystem> set)
    {
        var system = new BoundSystem(circuit);
        set(system);
        Seed(system, plot, point);
        system.Assemble();
        var (x, m, b, n) = (system.Context.Solution, system.Context.Matrix, system.Context.Rhs, system.Size);
        var worst = (Amperes: 0.0, Relative: 0.0, Node: "");
        for (var i = 0; i < system.Layout.NodeCount; i++)
        {
            var residual = -b[i];
            var magnitude = Math.Abs(b[i]);
            for (var j = 0; j < n; j++)
            {
                residual += m[i * n + j] * x[j];
                magnitude += Math.Abs(m[i * n + j] * x[j]);
            }
            var relative = magnitude > 0 ? Math.Abs(residual) / magnitude : 0;
            if (relative > worst.Relative)
                worst = (Math.Abs(residual), relative, system.Layout.UnknownNames[i]);
        }
        return worst;
    }

    /// <summary>Puts ngspice's values of point <paramref name="point"/> into the system's solution, unknown by unknown.</summary>
    public static void Seed(BoundSystem system, NgspicePlot plot, int point)
    {
        var layout = system.Layout;
        var x = system.Context.Solution;
        for (var i = 0; i < layout.Size; i++)
            if (plot.Vectors.TryGetValue(NgspiceName(layout.UnknownNames[i]), out var vector))
                x[i] = vector.Real[point];
        // A diode's internal node (between its series resistance and its junction) is not among ngspice's vectors. Left
        // at zero it puts the junction volts off its place, Newton leaves ngspice's point, and another DC solution
        // could not be shown; so it is derived from the terminal voltages as the series current law demands.
        for (var e = 0; e < system.Circuit.Elements.Length; e++)
            if (system.Circuit.Elements[e] is Diode { SeriesResistanceOhms: > 0 } d)
            {
                var anode = d.Anode == Circuit.Ground ? 0 : x[layout.IndexOfNode(d.Anode)];
                var cathode = d.Cathode == Circuit.Ground ? 0 : x[layout.IndexOfNode(d.Cathode)];
                x[layout.ExtraStart[e]] = JunctionVolts(d, anode, cathode, system.Context.TemperatureCelsius, system.Context.JunctionGmin);
            }
        // The stamps limit each Newton step from the voltages they last saw (a fresh system: 0 V). A diode seeded at
        // 0.7 V would be linearised at 85 mV (pnjlim from 0 V), an op-amp's clamp from mid-swing, and the first step
        // would leave ngspice's point whether or not it is a solution. Loading at the seeded point until nothing is
        // limited walks their memories there (the solution itself is not changed).
        for (var k = 0; k < 1000; k++)
        {
            system.Assemble();
            if (!system.Context.Limited)
                break;
        }
    }

    /// <summary>
    /// The internal node's voltage v with (V_a − v)/R_s = I_s·(e^((v − V_k)/(n·V_t)) − 1) + gmin·(v − V_k), the engine's
    /// diode equations, by bisection: the left side falls and the right side rises with v, so the root is unique and
    /// lies between the two terminal voltages.
    /// </summary>
    internal static double JunctionVolts(Diode d, double anode, double cathode, double celsius, double gmin)
    {
        var nvt = d.EmissionCoefficient * ThermVerify.Quantities.PhysicalConstants.ThermalVolts(celsius);
        var isat = d.SaturationCurrentAmperesAt(celsius);
        double Excess(double v) => (anode - v) / d.SeriesResistanceOhms
                                   - isat * (Math.Exp(Math.Min((v - cathode) / nvt, 700)) - 1) - gmin * (v - cathode);
        var (low, high) = (Math.Min(anode, cathode), Math.Max(anode, cathode));
        for (var k = 0; k < 200 && high > low; k++)
        {
            var middle = 0.5 * (low + high);
            if (middle <= low || middle >= high)
                break;
            if (Excess(middle) > 0)
                low = middle;
            else
                high = middle;
        }
        return 0.5 * (low + high);
    }

    /// <summary>The engine's unknown names as ngspice's vectors: "U1#pole" is "xu1.pole", "I(V1)" is "v1#branch", "I(U1)" is
    /// "b.xu1.bdrive#branch".</summary>
    private static string NgspiceName(string unknown)
    {
        if (unknown.StartsWith("I(", StringComparison.Ordinal))
        {
            var element = unknown[2..^1];
            // An op-amp's drive-source current is its behavioural drive source's branch in ngspice (same sign: from the
            // drive node through the source to ground). Left at zero it puts the drive node's current law far off.
            if (element.StartsWith('U'))
                return $"b.x{element.ToLowerInvariant()}.bdrive#branch";
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
