using System.Numerics;
using ThermVerify.Circuits;

namespace ThermVerify.Simulation.Mna;

/// <summary>
/// The circuit linearised at its operating point: A(f) = G + j·2πf·B, where G is the DC Jacobian
/// assembled at the converged solution (so every nonlinear element contributes its small-signal
/// conductance) and B collects capacitances and inductances. Used by AC, loop-gain and noise analyses.
/// </summary>
internal sealed class SmallSignalSystem
{
    private readonly Complex[] matrix;
    private readonly ComplexLu lu;

    public SmallSignalSystem(Circuit circuit, string analysis)
    {
        TopologyCheck.Run(circuit);
        System = new BoundSystem(circuit);
        DcSolver.Solve(System, analysis, null);
        System.Assemble();
        var n = System.Size;
        Conductances = new double[System.Layout.MatrixLength];
        Array.Copy(System.Context.Matrix, Conductances, n * n);
        Reactances = new double[System.Layout.MatrixLength];
        foreach (var s in System.Stamps)
            s.LoadReactive(Reactances);
        matrix = new Complex[n * n];
        lu = new ComplexLu(n);
        Warnings = Mna.Warnings.Collect(System);
    }

    public BoundSystem System { get; }

    public double[] Conductances { get; }

    public double[] Reactances { get; }

    public List<SimulationWarning> Warnings { get; }

    public int Size => System.Size;

    public Complex[] NewVector() => new Complex[System.Layout.VectorLength];

    /// <summary>Factorises A(f) (or its transpose, for adjoint solves) built from the given conductances.</summary>
    public void Factor(double frequencyHertz, bool transpose = false, double[]? conductances = null)
    {
        var g = conductances ?? Conductances;
        var w = 2 * Math.PI * frequencyHertz;
        var n = Size;
        for (var i = 0; i < n; i++)
            for (var j = 0; j < n; j++)
            {
                var source = i * n + j;
                matrix[transpose ? j * n + i : source] = new Complex(g[source], w * Reactances[source]);
            }
        var failed = lu.Factor(matrix);
        if (failed >= 0)
            throw System.Singular(failed);
    }

    public void Solve(Complex[] rhs, Complex[] x)
    {
        lu.Solve(rhs, x);
        x[Size] = Complex.Zero;
    }
}
