using MathNet.Numerics.LinearAlgebra;

namespace ThermVerify.Simulation.Switched;

/// <summary>
/// Reduces the descriptor system C·x' + G·x = b (modified nodal analysis: most unknowns carry no capacitance) to an
/// ordinary differential equation z' = A·z + u in r state coordinates, with the unknowns given back by x = P·z + p.
/// <para>
/// C does not change with the switches (they are resistive), so the coordinates are fixed once: the unknowns that
/// touch C (its nonzero rows and columns: capacitor nodes, inductor currents, the op-amp's pole nodes) form the block
/// C₁₁, which is scaled to unit diagonal (D⁻¹C₁₁D⁻¹ with D = √max|row|, so a 100 nF reservoir and an 8 pF sampling
/// capacitor weigh alike) and split by its singular value decomposition U·Σ·Vᵀ. Its r nonzero singular values
/// are the independent energy stores (a loop of capacitors leaves one of them dependent); with x₁ = D⁻¹V·y and the
/// rows multiplied by UᵀD⁻¹ the system reads Σ_r·y_d' + Ĝ_dd·y_d + Ĝ_da·y_a = b̂_d, Ĝ_ad·y_d + Ĝ_aa·y_a = b̂_a.
/// Each switch configuration eliminates the algebraic part y_a = Ĝ_aa⁻¹(b̂_a − Ĝ_ad·y_d), the Schur complement
/// (Golub &amp; Van Loan, Matrix Computations, from memory), which needs Ĝ_aa regular: a differential-algebraic
/// system of index 1. A capacitor straight across a voltage source (or a loop of them) raises the index and is
/// reported; the front ends here never have one. The state z = y_d is continuous across switch edges, since the
/// charges C·x are.
/// </para>
/// </summary>
internal sealed class StateCoordinates
{
    /// <summary>Singular values of the scaled C below this fraction of the largest are exact zeros in disguise.</summary>
    private const double RankTolerance = 1e-10;

    /// <summary>A scaled algebraic block with a larger condition number is singular for this purpose.</summary>
    private const double SingularCondition = 1e13;

    private readonly int n;
    private readonly int[] order;
    private readonly Matrix<double> left;
    private readonly Matrix<double> right;
    private readonly Vector<double> inverseSigma;
    private readonly Matrix<double> toState;

    public StateCoordinates(double[] reactive, int size)
    {
        n = size;
        var touches = new bool[n];
        for (var i = 0; i < n; i++)
            for (var j = 0; j < n; j++)
                if (reactive[i * n + j] != 0)
                    touches[i] = touches[j] = true;
        var dynamic = Enumerable.Range(0, n).Where(i => touches[i]).ToArray();
        if (dynamic.Length == 0)
            throw NotLinearException.Unsupported(null, "the circuit has no capacitor or inductor, so nothing evolves between switch edges; solve the operating point of each switch state instead");
        order = [.. dynamic, .. Enumerable.Range(0, n).Where(i => !touches[i])];
        var d = dynamic.Length;

        var scale = new double[d];
        for (var i = 0; i < d; i++)
            for (var j = 0; j < d; j++)
                scale[i] = Math.Max(scale[i], Math.Abs(reactive[dynamic[i] * n + dynamic[j]]));
        for (var i = 0; i < d; i++)
            scale[i] = Math.Sqrt(scale[i]);
        var scaled = Matrix<double>.Build.Dense(d, d, (i, j) => reactive[dynamic[i] * n + dynamic[j]] / (scale[i] * scale[j]));
        var svd = scaled.Svd(computeVectors: true);
        var sigma = svd.S;
        StateCount = sigma.Count(s => s > RankTolerance * sigma[0]);
        var r = StateCount;

        left = Matrix<double>.Build.DenseIdentity(n);
        right = Matrix<double>.Build.DenseIdentity(n);
        var uT = svd.U.Transpose();
        var vT = svd.VT;
        for (var i = 0; i < d; i++)
            for (var j = 0; j < d; j++)
            {
                left[i, j] = uT[i, j] / scale[j];
                right[i, j] = vT[j, i] / scale[i];
            }
        inverseSigma = Vector<double>.Build.Dense(r, i => 1 / sigma[i]);
        toState = Matrix<double>.Build.Dense(r, n, (i, j) => j < d ? vT[i, j] * scale[j] : 0);
    }

    /// <summary>r: the number of independent energy stores, the length of z.</summary>
    public int StateCount { get; }

    /// <summary>z from a full solution x (only its dynamic unknowns matter).</summary>
    public double[] StateOf(double[] solution)
    {
        var permuted = Vector<double>.Build.Dense(n, i => solution[order[i]]);
        return (toState * permuted).ToArray();
    }

    /// <summary>z' = A·z + u and x = P·z + p for one switch configuration.</summary>
    /// <param name="describe">Names the configuration in an error message.</param>
    public SegmentModel Reduce(double[] g, double[] b, Func<string> describe)
    {
        var r = StateCount;
        var na = n - r;
        var permutedG = Matrix<double>.Build.Dense(n, n, (i, j) => g[order[i] * n + order[j]]);
        var permutedB = Vector<double>.Build.Dense(n, i => b[order[i]]);
        var gHat = left * permutedG * right;
        var bHat = left * permutedB;

        var gdd = gHat.SubMatrix(0, r, 0, r);
        var bd = bHat.SubVector(0, r);
        var p = right.SubMatrix(0, n, 0, r);
        var offset = Vector<double>.Build.Dense(n);
        if (na > 0)
        {
            var gaa = gHat.SubMatrix(r, na, r, na);
            if (IsSingular(gaa))
                throw NotLinearException.Unsupported(null,
                    $"with {describe()} its algebraic equations are singular (a capacitor or inductor tied to a voltage source, or a loop of them: " +
                    "a differential-algebraic system of index above 1)");
            var lu = gaa.LU();
            var k = lu.Solve(gHat.SubMatrix(r, na, 0, r));
            var k0 = lu.Solve(bHat.SubVector(r, na));
            var gda = gHat.SubMatrix(0, r, r, na);
            gdd -= gda * k;
            bd -= gda * k0;
            var algebraic = right.SubMatrix(0, n, r, na);
            p -= algebraic * k;
            offset = algebraic * k0;
        }
        var a = -Matrix<double>.Build.DiagonalOfDiagonalVector(inverseSigma) * gdd;
        var u = inverseSigma.PointwiseMultiply(bd);

        var unpermutedP = Matrix<double>.Build.Dense(n, r);
        var unpermutedOffset = new double[n];
        for (var i = 0; i < n; i++)
        {
            unpermutedP.SetRow(order[i], p.Row(i));
            unpermutedOffset[order[i]] = offset[i];
        }
        return new SegmentModel(a, u, unpermutedP, unpermutedOffset);
    }

    /// <summary>Singular after scaling every row and then every column to a largest entry of 1.</summary>
    private static bool IsSingular(Matrix<double> m)
    {
        var scaled = m.Clone();
        for (var i = 0; i < scaled.RowCount; i++)
        {
            var max = scaled.Row(i).AbsoluteMaximum();
            if (max == 0)
                return true;
            scaled.SetRow(i, scaled.Row(i) / max);
        }
        for (var j = 0; j < scaled.ColumnCount; j++)
        {
            var max = scaled.Column(j).AbsoluteMaximum();
            if (max == 0)
                return true;
            scaled.SetColumn(j, scaled.Column(j) / max);
        }
        var s = scaled.Svd(computeVectors: false).S;
        return !(s[^1] > s[0] / SingularCondition);
    }
}
