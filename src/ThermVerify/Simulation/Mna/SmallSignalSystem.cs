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
    private readonly double[] magnitudes;
    private readonly double[] weights;
    private double factoredHertz;

    /// <param name="start">Sets the starting point of the operating point's Newton iteration (a circuit with several
    /// DC solutions is linearised about the one nearest it); none starts from zero.</param>
    public SmallSignalSystem(Circuit circuit, string analysis, Action<BoundSystem>? start = null)
    {
        this.analysis = analysis;
        TopologyCheck.Run(circuit);
        System = new BoundSystem(circuit);
        start?.Invoke(System);
        DcSolver.Solve(System, $"{analysis} operating point", null);
        System.Assemble();
        var n = System.Size;
        Conductances = new double[System.Layout.MatrixLength];
        Array.Copy(System.Context.Matrix, Conductances, n * n);
        Reactances = new double[System.Layout.MatrixLength];
        foreach (var s in System.Stamps)
            s.LoadReactive(Reactances);
        matrix = new Complex[n * n];
        magnitudes = new double[n];
        weights = new double[n];
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
        factoredHertz = frequencyHertz;
    }

    /// <exception cref="IllConditionedMatrixException">The solution has lost more than half its digits.</exception>
    public void Solve(Complex[] rhs, Complex[] x)
    {
        lu.Solve(rhs, x, refine: true);
        x[Size] = Complex.Zero;
        CheckConditioning(x, transposed: false);
    }

    /// <summary>Solves Aᵀ·x = rhs with the last factorisation (adjoint noise analysis).</summary>
    public void SolveTransposed(Complex[] rhs, Complex[] x)
    {
        lu.SolveTransposed(rhs, x, refine: true);
        x[Size] = Complex.Zero;
        CheckConditioning(x, transposed: true);
    }

    /// <summary>Refuses a solution that lost more than half its digits (<see cref="MatrixCondition"/>), of A or of Aᵀ.</summary>
    private void CheckConditioning(Complex[] x, bool transposed)
    {
        var n = Size;
        for (var i = 0; i < n; i++)
            magnitudes[i] = x[i].Magnitude;
        var nodeCurrents = 0.0;
        for (var i = 0; i < System.Layout.NodeCount; i++)
        {
            var sum = 0.0;
            for (var j = 0; j < n; j++)
                sum += (transposed ? matrix[j * n + i] : matrix[i * n + j]).Magnitude * magnitudes[j];
            nodeCurrents = Math.Max(nodeCurrents, sum);
        }
        MatrixCondition.Weights(System.Layout, magnitudes, nodeCurrents, weights, adjoint: transposed);
        if (lu.ErrorAmplification(x, weights, transposed) > MatrixCondition.Limit)
            throw MatrixCondition.Exception(System.Layout, lu.ErrorAmplificationPerUnknown(x, weights, transposed), analysis,
                $" at {factoredHertz:G6} Hz{(transposed ? " (adjoint system of the noise analysis)" : "")}");
    }
}
