using MathNet.Numerics.LinearAlgebra;

namespace ThermVerify.Simulation.Switched;

/// <summary>
/// One switch configuration as a state-space model: z' = A·z + u between edges, and every MNA unknown x = P·z + p
/// (the algebraic ones follow the state instantly, so at an edge they jump while z does not).
/// </summary>
internal sealed class SegmentModel
{
    private readonly double[] outputRows;
    private readonly double[] outputOffsets;

    public SegmentModel(Matrix<double> a, Vector<double> u, Matrix<double> p, double[] offset)
    {
        A = a;
        U = u;
        StateCount = a.RowCount;
        UnknownCount = p.RowCount;
        outputRows = p.ToRowMajorArray();
        outputOffsets = offset;
    }

    public Matrix<double> A { get; }

    /// <summary>
    /// For each slew residual (<see cref="LinearAssembly.Residuals"/>), the response to a unit current into its pole
    /// node: the input column of z' and the unknowns' direct part (x = P·z + that·i).
    /// </summary>
    public (Vector<double> U, double[] Offset)[] Injections { get; private init; } = [];

    /// <summary>The same model with the residuals' responses (<see cref="Injections"/>).</summary>
    public SegmentModel WithInjections((Vector<double> U, double[] Offset)[] injections) => new(this) { Injections = injections };

    private SegmentModel(SegmentModel other)
    {
        A = other.A;
        U = other.U;
        StateCount = other.StateCount;
        UnknownCount = other.UnknownCount;
        outputRows = other.outputRows;
        outputOffsets = other.outputOffsets;
    }

    /// <summary>p of x = P·z + p.</summary>
    public ReadOnlySpan<double> Offsets => outputOffsets;

    /// <summary>Row <paramref name="unknown"/> of P.</summary>
    public ReadOnlySpan<double> OutputRow(int unknown) => outputRows.AsSpan(unknown * StateCount, StateCount);

    public Vector<double> U { get; }

    public int StateCount { get; }

    public int UnknownCount { get; }

    /// <summary>x[unknown] = P[unknown, ·]·z + p[unknown]; the ground index (one past the last unknown) reads 0.</summary>
    public double Output(int unknown, ReadOnlySpan<double> z)
    {
        if (unknown == UnknownCount)
            return 0;
        var r = StateCount;
        var sum = outputOffsets[unknown];
        var row = outputRows.AsSpan(unknown * r, r);
        for (var i = 0; i < r; i++)
            sum += row[i] * z[i];
        return sum;
    }

    /// <summary>x[unknown] as a row over z and a constant (P[unknown, ·], p[unknown]); zeros for the ground index.</summary>
    public (double[] Row, double Constant) OutputAffine(int unknown) =>
        unknown == UnknownCount ? (new double[StateCount], 0) : (outputRows.AsSpan(unknown * StateCount, StateCount).ToArray(), outputOffsets[unknown]);

    /// <summary>The whole solution vector x = P·z + p.</summary>
    public double[] Solution(ReadOnlySpan<double> z)
    {
        var x = new double[UnknownCount];
        for (var i = 0; i < x.Length; i++)
            x[i] = Output(i, z);
        return x;
    }

    /// <summary>A monitored quantity as a row over z and a constant: q = w·z + w₀.</summary>
    public (double[] Row, double Constant) Monitor(LinearMonitor monitor)
    {
        var r = StateCount;
        var row = new double[r];
        var constant = monitor.Constant;
        for (var k = 0; k < monitor.Indices.Length; k++)
        {
            var unknown = monitor.Indices[k];
            var coefficient = monitor.Coefficients[k];
            for (var i = 0; i < r; i++)
                row[i] += coefficient * outputRows[unknown * r + i];
            constant += coefficient * outputOffsets[unknown];
        }
        return (row, constant);
    }

    /// <summary>
    /// exp([[A·h, u·h], [0, 0]]) = [[e^(Ah), ∫₀ʰ e^(As) ds·u], [0, 1]] (Van Loan, "Computing integrals involving the
    /// matrix exponential", IEEE Trans. Automatic Control 23(3), 1978, from memory): the exact step of z' = A·z + u
    /// over h, without A⁻¹, so a singular A is fine.
    /// </summary>
    /// <summary>
    /// The exact response over h of z' = A·z + u_e·i(s) to a current ramping linearly between the step's ends:
    /// ∫₀ʰ e^(A(h−s)) u_e ds (weight of i at the start) and ∫₀ʰ e^(A(h−s)) u_e·s/h ds (weight of its change), both read off one
    /// exponential of [[A, u_e, 0], [0, 0, 1/h], [0, 0, 0]]·h (Van Loan 1978, as <see cref="AugmentedExponential"/>).
    /// </summary>
    public (double[] Constant, double[] Ramp) RampResponse(Vector<double> input, double h)
    {
        var r = StateCount;
        var augmented = Matrix<double>.Build.Dense(r + 2, r + 2);
        augmented.SetSubMatrix(0, 0, A * h);
        augmented.SetSubMatrix(0, r, (input * h).ToColumnMatrix());
        augmented[r, r + 1] = 1;
        var e = MatrixExponential.Exp(augmented);
        return ([.. e.Column(r).SubVector(0, r)], [.. e.Column(r + 1).SubVector(0, r)]);
    }

    public Matrix<double> AugmentedExponential(double h)
    {
        var r = StateCount;
        var augmented = Matrix<double>.Build.Dense(r + 1, r + 1);
        augmented.SetSubMatrix(0, 0, A * h);
        augmented.SetSubMatrix(0, r, (U * h).ToColumnMatrix());
        return MatrixExponential.Exp(augmented);
    }
}
