using ThermVerify.Circuits;
using ThermVerify.Simulation;
using ThermVerify.Simulation.Mna;
using Complex = System.Numerics.Complex;

namespace ThermVerify.Tests.Differential;

/// <summary>
/// The built-in engine's AC and noise analyses as ngspice 39 computes them for voltage-controlled switches: ngspice
/// linearises every switch at its off conductance in .ac and .noise whatever its control says (observed: a switch on
/// a DC control of 1 V, threshold 0.5 V, conducts as ron at .op but as roff in .ac and .noise), while its operating
/// point has the switch in the right state. Here the operating point is the circuit's own (or the one nearest a given
/// start); only the switches'
/// small-signal conductance (and thermal noise) is set to the off value. Agreement with ngspice in this view
/// explains a disagreement as ngspice's, not the engine's.
/// </summary>
internal static class NgspiceSwitchView
{
    public static bool Applies(Circuit circuit) => circuit.Elements.OfType<TimedSwitch>().Any(s => s.Schedule.IsClosed(0));

    /// <param name="start">Where the operating point's Newton starts (<see cref="SmallSignalSystem"/>), e.g. at
    /// ngspice's operating point (<see cref="OtherSolution.Seed"/>).</param>
    public static Complex[][] Ac(Circuit circuit, IReadOnlyList<string> nodes, double[] frequencies, Action<BoundSystem>? start = null)
    {
        var (system, conductances) = AcSystem(circuit, start);
        var rhs = system.NewVector();
        foreach (var s in system.System.Stamps)
            s.LoadAcExcitation(rhs);
        var x = system.NewVector();
        var result = nodes.Select(_ => new Complex[frequencies.Length]).ToArray();
        for (var k = 0; k < frequencies.Length; k++)
        {
            system.Factor(frequencies[k], conductances);
            system.Solve(rhs, x);
            for (var i = 0; i < nodes.Count; i++)
                result[i][k] = x[system.System.Layout.IndexOfNode(nodes[i])];
        }
        return result;
    }

    /// <summary>The small-signal system of the view and its conductances (every switch closed at t = 0 at its off value).</summary>
    public static (SmallSignalSystem System, double[] Conductances) AcSystem(Circuit circuit, Action<BoundSystem>? start = null)
    {
        circuit = OpenedWhereLinear(circuit, start);
        var system = new SmallSignalSystem(circuit, "AC (ngspice's switch view)", start);
        return (system, OpenSwitches(system, circuit));
    }

    public static double[] NoiseDensity(Circuit circuit, string output, double[] frequencies, Action<BoundSystem>? start = null)
    {
        circuit = OpenedWhereLinear(circuit, start);
        var system = new SmallSignalSystem(circuit, "Noise (ngspice's switch view)", start);
        var conductances = OpenSwitches(system, circuit);
        var layout = system.System.Layout;
        var noise = new NoiseContext(circuit.TemperatureCelsius, layout.Ground);
        foreach (var s in system.System.Stamps)
            s.CollectNoise(noise);
        var generators = noise.Generators.Select(g => circuit[g.Element] is TimedSwitch sw
            ? g with { WhitePsd = noise.ThermalCurrentPsd(sw.Name, 1 / sw.OffResistanceOhms) }
            : g).ToList();
        var e = system.NewVector();
        e[layout.IndexOfNode(output)] = 1;
        var y = system.NewVector();
        var density = new double[frequencies.Length];
        for (var k = 0; k < frequencies.Length; k++)
        {
            system.Factor(frequencies[k], conductances);
            system.SolveTransposed(e, y);
            var psd = 0.0;
            foreach (var g in generators)
            {
                var transfer = y[g.Into] - y[g.From];
                psd += (transfer.Real * transfer.Real + transfer.Imaginary * transfer.Imaginary) * g.Psd(frequencies[k]);
            }
            density[k] = Math.Sqrt(psd);
        }
        return density;
    }

    /// <summary>The small-signal conductances with every switch closed at t = 0 set to its off conductance.</summary>
    /// <summary>
    /// A linear circuit with its closed switches off, stamped as they are: its operating point does not enter the
    /// small-signal system, and the view then needs no subtraction. Adding 1/R_off − 1/R_on to a slot that holds 1/R_on
    /// (<see cref="OpenSwitches"/>) leaves 1/R_off with the slot's rounding, about 1e-16 S: on a 1.4e11 Ω switch that was
    /// 8e-6 of its conductance and 2.5e-6 dB on the node it fed (seed 134). A nonlinear circuit keeps its own operating
    /// point (ngspice linearises there) and the subtraction.
    /// </summary>
    private static Circuit OpenedWhereLinear(Circuit circuit, Action<BoundSystem>? start)
    {
        if (start is not null || new BoundSystem(circuit).IsNonlinear)
            return circuit;
        foreach (var s in circuit.Elements.OfType<TimedSwitch>().Where(s => s.Schedule.IsClosed(0)).ToList())
            circuit = circuit.Replace(s with { OnResistanceOhms = s.OffResistanceOhms });
        return circuit;
    }

    /// <remarks>
    /// The Jacobian is assembled anew at the system's operating point with the closed switches stamped off (the
    /// stamps' step limiting walked there first, as <see cref="OtherSolution.Seed"/> does), not by adding
    /// 1/R_off − 1/R_on to the slots: that subtraction left the slots' rounding beside 1/R_off (see
    /// <see cref="OpenedWhereLinear"/>), which on a nonlinear circuit was 6e-6 and 2e-5 dB (seeds 355 and 1303).
    /// </remarks>
    private static double[] OpenSwitches(SmallSignalSystem system, Circuit circuit)
    {
        var opened = circuit;
        foreach (var s in circuit.Elements.OfType<TimedSwitch>().Where(s => s.Schedule.IsClosed(0)).ToList())
            opened = opened.Replace(s with { OnResistanceOhms = s.OffResistanceOhms });
        var bound = new BoundSystem(opened);
        bound.SetTemperature(system.System.Context.TemperatureCelsius);
        Array.Copy(system.System.Context.Solution, bound.Context.Solution, bound.Context.Solution.Length);
        for (var k = 0; k < 1000; k++)
        {
            bound.Assemble();
            if (!bound.Context.Limited)
                break;
        }
        var n = system.Size;
        var g = new double[system.System.Layout.MatrixLength];
        Array.Copy(bound.Context.Matrix, g, n * n);
        return g;
    }
}
