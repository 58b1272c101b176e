using MathNet.Numerics.LinearAlgebra;
using ThermVerify.Circuits;
using ThermVerify.Simulation.Mna;
using ThermVerify.Simulation.Stamps;

namespace ThermVerify.Simulation.Switched;

/// <summary>
/// The circuit in descriptor form C·x' + G·x = b, assembled from the engine's own stamps: C from their reactive
/// parts (capacitances, −inductances), G and b from their loads in transient mode with a zero integration
/// coefficient (companion conductances and histories vanish, the branch equations of inductors remain), each timed
/// switch at the on or off conductance the configuration gives it, and each op-amp linearised in its linear region.
/// Rejects what would make the system time-varying or nonlinear between switch edges: sources that are not DC and
/// nonlinear elements other than the op-amp macro-model.
/// </summary>
internal sealed class LinearAssembly
{
    private readonly BoundSystem system;
    private readonly Stamp[] loaders;
    private readonly (ConductanceSlots Slots, double On, double Off)[] switches;
    private readonly OpAmpLinearRegion[] opAmps;
    private readonly double[] scratch;

    public LinearAssembly(BoundSystem system, double linearityToleranceVolts)
    {
        this.system = system;
        var bind = new BindContext(system.Layout);
        var loaders = new List<Stamp>();
        var switches = new List<(ConductanceSlots, double, double)>();
        var switchElements = new List<TimedSwitch>();
        var opAmps = new List<OpAmpLinearRegion>();
        foreach (var s in system.Stamps)
        {
            switch (s.Element)
            {
                case TimedSwitch sw:
                    switches.Add((new ConductanceSlots(bind, bind.Node(sw.NodeA), bind.Node(sw.NodeB)), 1 / sw.OnResistanceOhms, 1 / sw.OffResistanceOhms));
                    switchElements.Add(sw);
                    continue;
                case VoltageSource { Waveform: not DcWaveform } or CurrentSource { Waveform: not DcWaveform }:
                    throw NotLinearException.Unsupported(s.Element.Name,
                        $"{s.Element.Describe} has a time-varying waveform; exact propagation needs DC sources between switch edges");
            }
            if (s is OpAmpStamp amp)
            {
                opAmps.Add(new OpAmpLinearRegion(system, amp, linearityToleranceVolts));
                continue;
            }
            if (s.IsNonlinear)
                throw NotLinearException.Unsupported(s.Element.Name,
                    $"{s.Element.Describe} is nonlinear; exact propagation handles linear elements and the op-amp macro-model in its linear region");
            if (s.HasLoad)
                loaders.Add(s);
        }
        this.loaders = [.. loaders];
        this.switches = [.. switches];
        this.opAmps = [.. opAmps];
        Switches = [.. switchElements];
        Monitors = [.. opAmps.SelectMany(a => a.Monitors)];
        var residuals = new List<SlewResidual>();
        var first = 0;
        foreach (var a in opAmps)
        {
            if (a.Residual is { } residual)
                residuals.Add(residual with { Monitor = first + residual.Monitor });
            first += a.Monitors.Count;
        }
        Residuals = residuals;
        NodeNames = [.. system.Layout.UnknownNames.Take(system.Layout.NodeCount)];
        ToleranceVolts = linearityToleranceVolts;
        scratch = new double[system.Layout.VectorLength];
    }

    public int Size => system.Size;

    /// <summary>The timed switches in circuit order; bit j of a configuration mask closes switch j.</summary>
    public IReadOnlyList<TimedSwitch> Switches { get; }

    public IReadOnlyList<LinearMonitor> Monitors { get; }

    /// <summary>The slew-limited op-amps' residuals, carried to first order on every checked interval.</summary>
    public IReadOnlyList<SlewResidual> Residuals { get; }

    /// <summary>The circuit's nodes, unknowns 0 … n − 1: where a residual's effect is judged.</summary>
    public IReadOnlyList<string> NodeNames { get; }

    /// <summary>How far the linear model may depart from the macro-model, in volts (see <see cref="ExactSwitchedOptions.LinearityToleranceVolts"/>).</summary>
    public double ToleranceVolts { get; }

    /// <summary>b for a unit current into <paramref name="unknown"/>'s row alone: the input through which a residual acts.</summary>
    public double[] UnitInjection(int unknown)
    {
        var b = new double[Size];
        b[unknown] = 1;
        return b;
    }

    /// <summary>C, row-major n×n.</summary>
    public double[] Reactive()
    {
        var n = Size;
        var matrix = new double[system.Layout.MatrixLength];
        foreach (var s in system.Stamps)
            s.LoadReactive(matrix);
        return matrix[..(n * n)];
    }

    /// <summary>
    /// The DC solution of the linear model, G·x = b (capacitors open, inductors shorted, op-amps linear), or null
    /// when G is singular; a starting guess for the engine's own operating point.
    /// </summary>
    public double[]? LinearDcSolution(int mask)
    {
        var n = Size;
        var (g, b) = Assemble(mask);
        var matrix = Matrix<double>.Build.Dense(n, n, (i, j) => g[i * n + j]);
        var x = matrix.LU().Solve(Vector<double>.Build.DenseOfArray(b)).ToArray();
        return x.All(double.IsFinite) ? x : null;
    }

    /// <summary>G (row-major n×n) and b with the switches set by <paramref name="mask"/>.</summary>
    public (double[] G, double[] B) Assemble(int mask)
    {
        var n = Size;
        var c = system.Context;
        c.Mode = AnalysisMode.Transient;
        c.Ag0 = 0;
        c.Trapezoidal = false;
        c.TimeSeconds = 0;
        c.StepSeconds = 0;
        c.DiagonalGmin = 0;
        c.SourceFactor = 1;
        Array.Clear(c.PreviousState);
        Array.Clear(c.Matrix);
        Array.Clear(c.Rhs);
        foreach (var s in system.Stamps)
            s.LoadStatic(c.Matrix);
        foreach (var s in loaders)
            s.Load(c);
        for (var j = 0; j < switches.Length; j++)
            switches[j].Slots.Add(c.Matrix, (mask >> j & 1) != 0 ? switches[j].On : switches[j].Off);
        foreach (var a in opAmps)
            a.LoadLinear(c, scratch);
        return (c.Matrix[..(n * n)], c.Rhs[..n]);
    }
}
