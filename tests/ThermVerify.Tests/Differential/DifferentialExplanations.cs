using ThermVerify.Circuits;
using ThermVerify.Circuits.Spice;
using ThermVerify.Ngspice;
using ThermVerify.Simulation;
using ThermVerify.Simulation.Mna;
using Complex = System.Numerics.Complex;

namespace ThermVerify.Tests.Differential;

/// <summary>
/// The explanations of <see cref="DifferentialCase"/> added on 3 December 2026 (evening), each reproducing its cause:
/// the exact AC solution of the engine's own equations, the transient from two DC solutions (ngspice started at the
/// engine's operating point), a transient with nothing to compare, and a sweep point that is ngspice's drift or gmin.
/// </summary>
internal static partial class DifferentialCase
{
    /// <summary>ngspice's gmin (its default, unchanged in these decks).</summary>
    private const double NgspiceGminSiemens = 1e-12;

    /// <summary>ngspice's vntol in the transient decks (<c>.options vntol=1e-9</c>, the deck writer's default): below it
    /// ngspice does not resolve a node voltage.</summary>
    private const double TransientVoltageTolerance = 1e-9;

    /// <summary>
    /// The engine's AC against the exact solution of its own small-signal equations (<see cref="ExactAcSolution"/>; in
    /// ngspice's switch view where that applies) at each frequency where the engines disagree beyond the limit: the
    /// largest difference in dB over the nodes compared there (and ngspice's, from the same exact solution), the number
    /// of those frequencies whose exact response is zero at every node (where only rounding is compared), and the number
    /// of disagreeing frequencies. Null if the
    /// engine's AC or the view cannot be had, or if the exact solution is zero at a node where the engine's is not while
    /// other nodes respond. The engine's operating point must agree with ngspice's (else the linearisation differs), and
    /// the circuit must have no element whose small-signal model differs between the engines by construction, so that
    /// both solve the same equations: no diode (ngspice approximates a junction's conductance below −3·n·V_T) and no
    /// slewing op-amp (ngspice's twin linearises its tanh, <see cref="SlewTanhView"/>). Without that condition the
    /// engine's being exact would not say that ngspice's rounding is the difference (seed 1755 is such).
    /// </summary>
    private static (double Decibels, double NgspiceDecibels, int Zero, int Frequencies)? ExactAcDistance(RandomCircuit rc, NgspicePlot plot)
    {
        if (rc.Circuit.Elements.Any(e => e is Diode || e is OpAmp a && double.IsFinite(a.SlewRateVoltsPerSecond)))
            return null;
        try
        {
            var op = Ngspice(rc, DifferentialAnalysis.OperatingPoint);
            var own = OperatingPoint.Solve(rc.Circuit);
            if (ScaledDifference(rc.Nodes.Select(n => (new[] { own.Voltage(n) }, op[n].Real))) > Limits[DifferentialAnalysis.OperatingPoint])
                return null;
            var (system, conductances) = NgspiceSwitchView.Applies(rc.Circuit)
                ? NgspiceSwitchView.AcSystem(rc.Circuit)
                : (new SmallSignalSystem(rc.Circuit, "AC"), (double[]?)null);
            conductances ??= system.Conductances;
            var frequencies = plot["frequency"].Real;
            var theirs = rc.Nodes.Select(n => plot[n].Complex!).ToList();
            var rhs = system.NewVector();
            foreach (var s in system.System.Stamps)
                s.LoadAcExcitation(rhs);
            var x = system.NewVector();
            var (worst, worstTheirs, zero, count) = (0.0, 0.0, 0, 0);
            for (var k = 0; k < frequencies.Length; k++)
            {
                system.Factor(frequencies[k], conductances);
                system.Solve(rhs, x);
                var ours = rc.Nodes.Select(n => new[] { x[system.System.Layout.IndexOfNode(n)] }).ToList();
                var at = theirs.Select(v => new[] { v[k] }).ToList();
                if (AcMetric(ours, at) <= Limits[DifferentialAnalysis.Ac])
                    continue;
                count++;
                var exact = ExactAcSolution.NodeVoltages(system, conductances, rc.Nodes, frequencies[k]);
                if (exact.All(v => v == Complex.Zero))
                {
                    zero++;
                    continue;
                }
                var largest = at.Max(v => v[0].Magnitude);
                for (var i = 0; i < exact.Length; i++)
                    if (at[i][0].Magnitude > 1e-3 * largest)
                    {
                        if (exact[i] == Complex.Zero)
                            return null;
                        worst = Math.Max(worst, Math.Abs(20 * Math.Log10(ours[i][0].Magnitude / exact[i].Magnitude)));
                        worstTheirs = Math.Max(worstTheirs, Math.Abs(20 * Math.Log10(at[i][0].Magnitude / exact[i].Magnitude)));
                    }
            }
            return count == 0 ? null : (worst, worstTheirs, zero, count);
        }
        catch (Exception e) when (e is SimulationException or CircuitException or NgspiceException or KeyNotFoundException or InvalidOperationException)
        {
            return null;
        }
    }

    /// <summary>
    /// Where the engines' operating points differ and ngspice's is another solution of the engine's equations
    /// (<see cref="OtherSolutionDistance"/>), each transient starts from its engine's own: ngspice's transient rerun with
    /// <c>.nodeset</c> at the engine's operating point (every circuit node), against the engine's transient, and how far
    /// ngspice's first point then is from the engine's operating point (both over the scale); null when the operating
    /// points agree, ngspice's is not shown to be another solution, or ngspice cannot run the deck. Seeds 993, 1417,
    /// 1565, 1761 (and more): a latch or a diode loop settles in one state in one engine and another in the other.
    /// </summary>
    private static (double Difference, double StartApart)? FromEnginesOperatingPoint(RandomCircuit rc)
    {
        try
        {
            var op = Ngspice(rc, DifferentialAnalysis.OperatingPoint);
            var own = OperatingPoint.Solve(rc.Circuit);
            if (ScaledDifference(rc.Nodes.Select(n => (new[] { own.Voltage(n) }, op[n].Real))) <= Limits[DifferentialAnalysis.OperatingPoint]
                || OtherSolutionDistance(rc, DifferentialAnalysis.OperatingPoint, op) is not { } other || other > Limits[DifferentialAnalysis.OperatingPoint])
                return null;
            var stop = rc.TransientStopSeconds;
            var deck = SpiceDeckWriter.Write(NgspiceTwin.For(rc.Circuit), new TransientSweep(stop, stop / 100));
            var nodeset = ".nodeset " + string.Join(" ", rc.Nodes.Select(n => $"v({n})={own.Voltage(n):R}"));
            var end = deck.LastIndexOf(".end", StringComparison.Ordinal);
            var plot = DifferentialNgspice.Run(deck[..end] + nodeset + "\n" + deck[end..]).Plot("tran");
            var start = ScaledDifference(rc.Nodes.Select(n => (new[] { own.Voltage(n) }, new[] { plot[n].Real[0] })));
            return TransientDifference(rc, plot) is { } d ? (d, start) : null;
        }
        catch (Exception e) when (e is SimulationException or CircuitException or NgspiceException or KeyNotFoundException)
        {
            return null;
        }
    }

    /// <summary>The largest node voltage magnitude of the engine's transient (at its own points).</summary>
    private static double LargestTransientVolts(RandomCircuit rc)
    {
        var stop = rc.TransientStopSeconds;
        var simulation = new TransientSimulation(rc.Circuit, new TransientOptions { StopTimeSeconds = stop, MaxStepSeconds = stop / 100 });
        simulation.AdvanceTo(stop);
        var result = simulation.Result;
        return rc.Nodes.Max(n => result.Voltage(n).Max(Math.Abs));
    }

    /// <summary>
    /// As <see cref="NgspiceAloneDistance"/>, but a point also counts as ngspice's where the engine, with
    /// <see cref="NgspiceGminSiemens"/> from every circuit node to ground, agrees with ngspice's sweep: the smaller of the
    /// two distances at each disagreeing point. Nonlinear seed 9 with an F (10 nodes, current-controlled sources): at
    /// 3.426 V ngspice's point, in its sweep and alone, leaves exactly 1e-12 S × V(n5) unaccounted at n5 (1e-9 A at
    /// 1023 V, 1e-3 V off on a node of 1e6 Ω), and the engine with that gmin agrees with it to 1e-6 V; at 3.212 V
    /// ngspice's sweep drifts 272 V from its own answer alone, which is the engine's.
    /// </summary>
    private static double? NgspiceAloneOrGminDistance(RandomCircuit rc, DifferentialAnalysis analysis, NgspicePlot plot)
    {
        var withGmin = new Circuit([.. rc.Circuit.Elements, .. rc.Nodes.Select(n => new Resistor($"RG{n}", n, Circuit.Ground, 1 / NgspiceGminSiemens))],
            rc.Circuit.TemperatureCelsius);
        DcSweepResult gmin;
        try
        {
            gmin = analysis == DifferentialAnalysis.SourceSweep
                ? DcSweep.Element(withGmin, rc.SweepSource, SweepValues(rc, analysis))
                : DcSweep.Temperature(withGmin, SweepValues(rc, analysis));
        }
        catch (Exception e) when (e is SimulationException or CircuitException)
        {
            return null;
        }
        return WorstOverDisagreeingPoints(rc, analysis, plot, (p, value, _, ours) =>
        {
            var viaGmin = rc.Nodes.Max(n => Math.Abs(gmin.Voltage(n)[p] - plot[n].Real[p]));
            SpiceAnalysis single = analysis == DifferentialAnalysis.TemperatureSweep
                ? new DcTemperatureSweep(value, 1, 1)
                : new DcSourceSweep(rc.SweepSource, value, 1, 1);
            try
            {
                var alone = DifferentialNgspice.Run(SpiceDeckWriter.Write(NgspiceTwin.For(rc.Circuit), single)).Plot("dc");
                return Math.Min(viaGmin, rc.Nodes.Select((n, i) => Math.Abs(alone[n].Real[0] - ours[i])).Max());
            }
            catch (NgspiceException)
            {
                return viaGmin;
            }
        });
    }
}
