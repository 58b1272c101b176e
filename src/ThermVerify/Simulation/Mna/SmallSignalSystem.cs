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
    private readonly DenseLu<Complex> lu;

    private readonly string analysis;

    public SmallSignalSystem(Circuit circuit, string analysis)
    {
        this.analysis = analysis;
        TopologyCheck.Run(circuit);
        System = new BoundSystem(circuit);
        DcSolver.Solve(System, $"{analysis} operating point", null);
        System.Assemble();
        var n = System.Size;
        Conductances = new double[System.Layout.MatrixLength];
        Array.Copy(System.Context.Matrix, Conductances, n * n);
        Reactances = new double[System.Layout.MatrixLength];
        foreach (var s in System.Stamps)
            s.LoadReactive(Reactances);
        matrix = new Complex[n * n];
        lu = new DenseLu<Complex>(n);
        Warnings = Mna.Warnings.Collect(System);
    }

    public BoundSystem System { get; }

    public double[] Conductances { get; }

    public double[] Reactances { get; }

    public List<SimulationWarning> Warnings { get; }

    public int Size => System.Size;

    public Complex[] NewVector() => new Complex[System.Layout.VectorLength];

    /// <summary>Factorises A(f) built from the given conductances (default: the circuit's own).</summary>
    /// <exception cref="IllConditionedMatrixException">The matrix at this frequency has lost more than half its digits.</exception>
    public void Factor(double frequencyHertz, double[]? conductances = null)
    {
        var g = conductances ?? Conductances;
        var w = 2 * Math.PI * frequencyHertz;
        var n = Size;
        for (var i = 0; i < n; i++)
            for (var j = 0; j < n; j++)
            {
                var source = i * n + j;
                matrix[source] = new Complex(g[source], w * Reactances[source]);
            }
        var failed = lu.Factor(matrix);
        if (failed >= 0)
            throw System.Singular(failed);
        if (lu.ConditionNumber > MatrixCondition.Limit)
            throw MatrixCondition.Exception(System.Layout, lu.ConditionNumber, lu.SensitiveUnknowns(), analysis, $" at {frequencyHertz:G6} Hz");
    }

    public void Solve(Complex[] rhs, Complex[] x)
    {
        lu.Solve(rhs, x);
        x[Size] = Complex.Zero;
    }

    /// <summary>Solves Aᵀ·x = rhs with the last factorisation (adjoint noise analysis).</summary>
    public void SolveTransposed(Complex[] rhs, Complex[] x)
    {
        lu.SolveTransposed(rhs, x);
        x[Size] = Complex.Zero;
    }
}
