using System.Numerics;
using ThermVerify.Limits;

namespace ThermVerify.Simulation.Mna;

/// <summary>
/// LU factorisation of a dense row-major n×n matrix, real (transient, DC) or complex (AC, noise), into
/// preallocated storage. The circuits here have tens of unknowns, where dense beats sparse bookkeeping.
/// <para>
/// MNA rows mix units and sizes wildly: an op-amp's input transconductance (siemens) shares a row with its
/// pole capacitor's companion conductance C/h (1e8 S at a short step), a node row holds 1e-12 S of an open
/// switch beside a branch current's ±1. Plain partial pivoting compares entries of a column across such rows,
/// so a large entry of a badly scaled row wins the pivot and elimination spreads its size over rows that
/// carry small, accurate values (digits lost, steps collapsing). So the matrix is first equilibrated: every
/// row, then every column, is scaled by a power of two to a largest entry between ½ and 1 (LAPACK's xGEEQUB;
/// Anderson et al., LAPACK Users' Guide, 3rd ed., 1999, §2.4.1, from memory), which is exact in binary
/// floating point. Partial pivoting on the equilibrated matrix is then row-scaled partial pivoting (Golub &amp;
/// Van Loan, Matrix Computations, 3rd ed., §3.5.2, from memory): each candidate is judged against its own
/// row. Doolittle form, unit lower triangle (Golub &amp; Van Loan alg. 3.4.1, from memory).
/// </para>
/// <para>
/// <see cref="ConditionNumber"/> estimates κ₁ of the equilibrated matrix, and <see cref="ErrorAmplification"/> the
/// componentwise (Skeel) amplification |A⁻¹|·|A|·|x| of a solution x, both by Hager's method with Higham's
/// refinements (<see cref="OneNormEstimator{T}"/>) from a handful of extra solves, so a caller can refuse a result
/// that has lost more than half its digits instead of returning noise.
/// </para>
/// </summary>
internal sealed class DenseLu<T> where T : struct, INumberBase<T>
{
    private readonly int n;
    private readonly T[] lu;
    private readonly T[] equilibrated;
    private readonly int[] rowOfPivot;
    private readonly T[] rowScale;
    private readonly T[] columnScale;
    private readonly double[] magnitudeScratch;
    private readonly T[] work;
    private readonly T[] scaledRhs;
    private readonly T[] residual;
    private readonly OneNormEstimator<T> estimator;
    private readonly Action<T[]> inverse, inverseTransposed;
    private double equilibratedNorm;
    // Whether some row's entries span more than 1/u, so that summing the stamps into it may have lost whole terms.
    private bool absorbs;
    private static readonly double UnitRoundoffInverse = Math.ScaleB(1.0, 53);
    private double? condition;
    // Per thread, not per matrix: short analyses that build a new matrix each time still count up.
    [ThreadStatic] private static int factorisations;

    public DenseLu(int n)
    {
        this.n = n;
        lu = new T[n * n];
        equilibrated = new T[n * n];
        rowOfPivot = new int[n];
        rowScale = new T[n];
        columnScale = new T[n];
        magnitudeScratch = new double[n];
        work = new T[n];
        scaledRhs = new T[n];
        residual = new T[n];
        estimator = new OneNormEstimator<T>(n);
        inverse = SolveEquilibrated;
        inverseTransposed = SolveEquilibratedTransposed;
        rowWeight = new T[n];
        columnWeight = new T[n];
        weightedInverse = WeightedInverse;
        weightedTransposedInverse = WeightedTransposedInverse;
    }

    private readonly T[] rowWeight, columnWeight;
    private readonly Action<T[]> weightedInverse, weightedTransposedInverse;
    private bool weightsTransposed;

    public int Size => n;

    /// <summary>Whether the last factorisation replaced a vanished pivot (a matrix whose rows span more than 1/u, whose
    /// smaller terms rounding may have lost): the solve then has no digits there, and the matrix is not singular.</summary>
    public bool ReplacedPivot { get; private set; }

    /// <summary>
    /// Factorises the first n² entries of <paramref name="matrix"/>; returns −1, or the unknown (column) whose
    /// pivot vanished, or whose row or column is empty. A pivot that vanished in a matrix whose rows span more than
    /// 1/u (u = 2⁻⁵³) is replaced by a tiny one instead (see below): rounding, not the circuit, may have made it zero.
    /// </summary>
    public int Factor(T[] matrix)
    {
        // Every analysis passes through here: Ctrl+C and the time limit stop it within a few solver steps.
        if ((++factorisations & 63) == 0) Work.ThrowIfCancelled();
        condition = null;
        ReplacedPivot = false;
        var a = lu.AsSpan();
        matrix.AsSpan(0, n * n).CopyTo(a);
        var failed = Equilibrate(a);
        if (failed >= 0)
            return failed;
        a.CopyTo(equilibrated);
        var result = Eliminate(a, sparsest: false);
        if (result >= 0 || !ReplacedPivot)
            return result;
        // A vanished pivot in a matrix whose rows span more than 1/u: the largest entry of a column is often a huge
        // conductance whose row, used as the pivot, absorbs the small terms of every row it is subtracted from (a diode
        // forced forward by sources: its 4e29 S swallows the ±1 of the source's branch current, and the two source
        // rows become equal). Elimination that takes each column's pivot among its large entries (within 1/10 of the
        // largest) from the row with the fewest nonzeros left — Markowitz's choice restricted to one column, as sparse
        // SPICE solvers make it (H. M. Markowitz, Management Science 3 (1957); K. S. Kundert, Sparse 1.3, from memory) —
        // pivots on the sources' rows first, whose ±1 entries subtract exactly, and keeps those terms. It is tried
        // once; if a pivot still vanishes, the first factorisation's replacement stands as before.
        equilibrated.CopyTo(a);
        ReplacedPivot = false;
        result = Eliminate(a, sparsest: true);
        if (result >= 0 || !ReplacedPivot)
            return result;
        equilibrated.CopyTo(a);
        ReplacedPivot = false;
        return Eliminate(a, sparsest: false);
    }

    /// <summary>Threshold below which, relative to the largest candidate, an entry is not taken as a pivot by the
    /// sparsest-row choice (a common threshold of sparse LU codes, from memory).</summary>
    private const double SparsePivotThreshold = 0.1;

    /// <summary>Gaussian elimination of the equilibrated matrix in <paramref name="a"/> with row pivoting: the largest entry of
    /// each column, or with <paramref name="sparsest"/> the large entry whose row has the fewest nonzeros left.</summary>
    private int Eliminate(Span<T> a, bool sparsest)
    {
        for (var i = 0; i < n; i++)
            rowOfPivot[i] = i;
        for (var k = 0; k < n; k++)
        {
            var p = k;
            var best = Scalar<T>.Magnitude(a[k * n + k]);
            for (var i = k + 1; i < n; i++)
            {
                var v = Scalar<T>.Magnitude(a[i * n + k]);
                if (v > best)
                {
                    best = v;
                    p = i;
                }
            }
            if (sparsest && best > 0 && double.IsFinite(best))
                p = SparsestRow(a, k, best);
            // Only an exactly vanishing pivot makes the matrix singular here. A tiny one may still give a usable answer (a
            // diode conducting 1e19 A beside unit entries leaves pivots of 1e-21 after scaling); whether the answer kept
            // its digits is the componentwise check's to say (MatrixCondition), with the unknowns named.
            if (!double.IsFinite(best))
                return k;
            if (best == 0)
            {
                if (!absorbs)
                    return k;
                // A row whose entries span more than 1/u lost its small terms when the stamps were summed (a diode forced
                // to 7 V by a source conducts 1e117 A, and its 1e119 S swallows every other conductance on its nodes), so
                // this zero may be rounding's, not the circuit's: the matrix is then not singular but has lost every
                // digit. The pivot is replaced by u times its row's scale (static pivoting, X. S. Li and J. W. Demmel,
                // ACM TOMS 29 (2003) 110–140, from memory), so the solve goes on and the componentwise check reports the
                // unknowns that lost their digits, where a singular matrix would name only the column that ran out.
                a[k * n + k] = Scalar<T>.From(Math.ScaleB(1.0, -53));
                ReplacedPivot = true;
            }
            if (p != k)
            {
                var rowP = a.Slice(p * n, n);
                var rowK = a.Slice(k * n, n);
                for (var j = 0; j < n; j++)
                    (rowP[j], rowK[j]) = (rowK[j], rowP[j]);
                (rowOfPivot[p], rowOfPivot[k]) = (rowOfPivot[k], rowOfPivot[p]);
            }
            var pivotRow = a.Slice(k * n + k + 1, n - k - 1);
            var inverse = T.One / a[k * n + k];
            for (var i = k + 1; i < n; i++)
            {
                var factor = a[i * n + k];
                if (factor == T.Zero)
                    continue;
                factor *= inverse;
                a[i * n + k] = factor;
                var row = a.Slice(i * n + k + 1, pivotRow.Length);
                for (var j = 0; j < row.Length; j++)
                    row[j] -= factor * pivotRow[j];
            }
        }
        return -1;
    }

    /// <summary>Among rows k… whose entry in column k is at least <see cref="SparsePivotThreshold"/> of
    /// <paramref name="best"/>, the one with the fewest nonzeros in columns k…; ties go to the larger entry.</summary>
    private int SparsestRow(Span<T> a, int k, double best)
    {
        var p = k;
        var fewest = int.MaxValue;
        var largest = 0.0;
        for (var i = k; i < n; i++)
        {
            var v = Scalar<T>.Magnitude(a[i * n + k]);
            if (v < SparsePivotThreshold * best)
                continue;
            var count = 0;
            for (var j = k; j < n; j++)
                if (a[i * n + j] != T.Zero)
                    count++;
            if (count < fewest || (count == fewest && v > largest))
            {
                (fewest, largest, p) = (count, v, i);
            }
        }
        return p;
    }

    /// <summary>
    /// Scales rows, then columns, by powers of two to largest magnitudes in [½, 1]; remembers ‖Â‖₁ of the
    /// result. Returns the index of an empty row or column, else −1.
    /// </summary>
    private int Equilibrate(Span<T> a)
    {
        absorbs = false;
        for (var i = 0; i < n; i++)
        {
            var largest = 0.0;
            var smallest = double.PositiveInfinity;
            var row = a.Slice(i * n, n);
            for (var j = 0; j < n; j++)
            {
                var m = Scalar<T>.Magnitude(row[j]);
                largest = Math.Max(largest, m);
                if (m > 0)
                    smallest = Math.Min(smallest, m);
            }
            if (!(largest > 0) || !double.IsFinite(largest))
                return i;
            absorbs |= largest > UnitRoundoffInverse * smallest;
            var s = PowerOfTwoBelowInverse(largest);
            rowScale[i] = Scalar<T>.From(s);
            for (var j = 0; j < n; j++)
                row[j] *= rowScale[i];
        }
        var columnMax = magnitudeScratch.AsSpan();
        columnMax.Clear();
        for (var i = 0; i < n; i++)
        {
            var row = a.Slice(i * n, n);
            for (var j = 0; j < n; j++)
                columnMax[j] = Math.Max(columnMax[j], Scalar<T>.Magnitude(row[j]));
        }
        for (var j = 0; j < n; j++)
        {
            if (!(columnMax[j] > 0))
                return j;
            columnScale[j] = Scalar<T>.From(PowerOfTwoBelowInverse(columnMax[j]));
        }
        columnMax.Clear();
        for (var i = 0; i < n; i++)
        {
            var row = a.Slice(i * n, n);
            for (var j = 0; j < n; j++)
            {
                row[j] *= columnScale[j];
                columnMax[j] += Scalar<T>.Magnitude(row[j]);
            }
        }
        equilibratedNorm = 0;
        for (var j = 0; j < n; j++)
            equilibratedNorm = Math.Max(equilibratedNorm, columnMax[j]);
        return -1;
    }

    /// <summary>
    /// 2^−e with 2^(e−1) ≤ m &lt; 2^e, so that m·2^−e lies in [½, 1). For a normal m whose result is normal too, read
    /// off the exponent field (m = 1.f·2^(E−1023) gives 2^(1022−(E−1023)), the field 2045 − E): the same power of two as
    /// ILogB and ScaleB give, which cost about as much as the rest of a small matrix's equilibration.
    /// </summary>
    internal static double PowerOfTwoBelowInverse(double m)
    {
        var field = (int)((BitConverter.DoubleToInt64Bits(m) >> 52) & 0x7FF);
        return field is > 0 and < 2045
            ? BitConverter.Int64BitsToDouble((long)(2045 - field) << 52)
            : Math.ScaleB(1.0, -(Math.ILogB(m) + 1));
    }

    /// <summary>
    /// Solves A·x = b for the last factorised A; b and x may be longer than n (a ground cell stays untouched). With
    /// <paramref name="refine"/>, up to two steps of iterative refinement in working precision follow (residual of the
    /// equilibrated system, a correction from the same factors): partial pivoting is normwise but not componentwise
    /// backward stable, and on MNA rows mixing 1e6 Ω companion resistances with ±1 entries its error can reach tens of
    /// units in the last place of a branch current, which such a resistance turns into visible volts; one refinement
    /// step makes the solve componentwise backward stable (R. D. Skeel, "Iterative refinement implies numerical
    /// stability for Gaussian elimination", Math. Comp. 35 (1980) 817–832, from memory).
    /// </summary>
    public void Solve(T[] b, T[] x, bool refine = false)
    {
        for (var i = 0; i < n; i++)
            x[i] = rowScale[i] * b[i];
        if (refine)
            x.AsSpan(0, n).CopyTo(scaledRhs);
        SolveEquilibrated(x);
        if (refine)
            Refine(x, transposed: false);
        for (var i = 0; i < n; i++)
            x[i] *= columnScale[i];
    }

    private void Refine(T[] y, bool transposed)
    {
        for (var step = 0; step < 2; step++)
        {
            var largestCorrection = 0.0;
            var largest = 0.0;
            for (var i = 0; i < n; i++)
            {
                var sum = scaledRhs[i];
                if (transposed)
                    for (var j = 0; j < n; j++)
                        sum -= equilibrated[j * n + i] * y[j];
                else
                {
                    var row = i * n;
                    for (var j = 0; j < n; j++)
                        sum -= equilibrated[row + j] * y[j];
                }
                residual[i] = sum;
            }
            if (transposed)
                SolveEquilibratedTransposed(residual);
            else
                SolveEquilibrated(residual);
            for (var i = 0; i < n; i++)
            {
                y[i] += residual[i];
                largestCorrection = Math.Max(largestCorrection, Scalar<T>.Magnitude(residual[i]));
                largest = Math.Max(largest, Scalar<T>.Magnitude(y[i]));
            }
            if (largestCorrection <= 1e-15 * largest)
                return;
        }
    }

    /// <summary>Solves Aᵀ·x = b (the plain transpose, also for complex A), e.g. for adjoint noise analysis; refined as <see cref="Solve"/>.</summary>
    public void SolveTransposed(T[] b, T[] x, bool refine = false)
    {
        for (var i = 0; i < n; i++)
            x[i] = columnScale[i] * b[i];
        if (refine)
            x.AsSpan(0, n).CopyTo(scaledRhs);
        SolveEquilibratedTransposed(x);
        if (refine)
            Refine(x, transposed: true);
        for (var i = 0; i < n; i++)
            x[i] *= rowScale[i];
    }

    /// <summary>
    /// Estimated 1-norm condition number of the equilibrated matrix (≥ 1; ∞ when not factorised). Its
    /// product with the unit roundoff bounds the relative error of a solution in the equilibrated norm.
    /// Computed once per factorisation, on first use.
    /// </summary>
    public double ConditionNumber => condition ??= equilibratedNorm * estimator.Estimate(inverse, inverseTransposed);

    /// <summary>
    /// Estimate of max_i w_i·(|A⁻¹|·|A|·|x|)_i for a solution x of the last factorised A: how much relative rounding
    /// of the matrix entries (and of the elimination, which is backward stable) can move each unknown, weighted by
    /// <paramref name="weights"/> (1 over the size each unknown is judged against). Times the unit roundoff it bounds
    /// the weighted error to first order: Skeel's componentwise condition number (R. D. Skeel, "Scaling for numerical
    /// stability in Gaussian elimination", J. ACM 26 (1979) 494–526) estimated as LAPACK's xGERFS estimates its
    /// forward error bound (M. Arioli, J. W. Demmel, I. S. Duff, "Solving sparse linear systems with sparse backward
    /// error", SIAM J. Matrix Anal. Appl. 10 (1989) 165–190); all from memory. Unlike the normwise κ it does not
    /// count perturbations a circuit cannot have (a saturated op-amp's large but exactly known pole voltage).
    /// </summary>
    /// <param name="transposed">x solves Aᵀ·x = b (<see cref="SolveTransposed"/>): judge that system instead.</param>
    public double ErrorAmplification(T[] x, double[] weights, bool transposed = false)
    {
        PrepareWeights(x, weights, transposed);
        weightsTransposed = transposed;
        // ‖diag(w)·Â⁻¹·diag(g)‖∞ is the 1-norm of its transpose diag(g)·Â⁻ᵀ·diag(w) (Â⁻ᵀ and Â⁻¹ swap for Aᵀ).
        return estimator.Estimate(weightedTransposedInverse, weightedInverse);
    }

    /// <summary>
    /// A rigorous upper bound of <see cref="ErrorAmplification"/> (A, not Aᵀ) from one pass over the factors, for the
    /// common case where it settles the question without the estimate's five or so solves: with P·Â = L·U,
    /// |Â⁻¹| ≤ |U⁻¹|·|L⁻¹|·P elementwise, and a triangular matrix's |T⁻¹| is at most M(T)⁻¹, the inverse of its
    /// comparison matrix (|t_ii| on the diagonal, −|t_ij| off it), which has no negative entries (N. J. Higham, Accuracy
    /// and Stability of Numerical Algorithms, 2nd ed., 2002, §8.3, from memory). So w·C·M(U)⁻¹·M(L)⁻¹·P·g, two
    /// triangular solves in absolute values, bounds w·C·|Â⁻¹|·g from above. With partial pivoting |l_ij| ≤ 1, and for
    /// the small, well-scaled matrices of a front end's DC circuit the bound is within a small factor of the true
    /// amplification, far below <see cref="MatrixCondition.Limit"/>. A complex entry's magnitude here is |Re| + |Im|,
    /// at least its modulus and at most √2 times it, so the diagonal is divided by √2 and the result multiplied by √2
    /// (the entries of Â⁻¹ are measured the same way) to stay a bound.
    /// </summary>
    public double ErrorAmplificationBound(T[] x, double[] weights)
    {
        PrepareWeights(x, weights, transposed: false);
        var diagonalFactor = typeof(T) == typeof(double) ? 1.0 : Math.Sqrt(2);
        var z = magnitudeScratch;
        for (var i = 0; i < n; i++)
        {
            var sum = Scalar<T>.Magnitude(rowWeight[rowOfPivot[i]]);
            var row = i * n;
            for (var j = 0; j < i; j++)
                sum += Scalar<T>.Magnitude(lu[row + j]) * z[j];
            z[i] = sum;
        }
        var bound = 0.0;
        for (var i = n - 1; i >= 0; i--)
        {
            var sum = z[i];
            var row = i * n;
            for (var j = i + 1; j < n; j++)
                sum += Scalar<T>.Magnitude(lu[row + j]) * z[j];
            z[i] = sum / (Scalar<T>.Magnitude(lu[row + i]) / diagonalFactor);
            bound = Math.Max(bound, Scalar<T>.Magnitude(columnWeight[i]) * z[i]);
        }
        // Every term is non-negative, so rounding moves the bound by a few units in the last place at most.
        return double.IsNaN(bound) ? double.PositiveInfinity : bound * diagonalFactor * (1 + 1e-12);
    }

    /// <summary>The same amplification exactly for every unknown (n extra solves; for messages).</summary>
    public double[] ErrorAmplificationPerUnknown(T[] x, double[] weights, bool transposed = false)
    {
        PrepareWeights(x, weights, transposed);
        var amplification = new double[n];
        var column = new T[n];
        for (var k = 0; k < n; k++)
        {
            Array.Clear(column);
            column[k] = T.One;
            if (transposed)
                SolveEquilibratedTransposed(column);
            else
                SolveEquilibrated(column);
            var g = Scalar<T>.Magnitude(rowWeight[k]);
            for (var i = 0; i < n; i++)
                amplification[i] += Scalar<T>.Magnitude(column[i]) * g;
        }
        for (var i = 0; i < n; i++)
            amplification[i] *= Scalar<T>.Magnitude(columnWeight[i]);
        return amplification;
    }

    /// <summary>
    /// g = |Â|·|ŷ| with ŷ = C⁻¹·x the equilibrated unknowns (into <see cref="rowWeight"/>), and w·C (into
    /// <see cref="columnWeight"/>). For Aᵀ = C⁻¹·Âᵀ·R⁻¹ the roles of R and C swap: g = |Âᵀ|·|R⁻¹·x|, w·R.
    /// </summary>
    private void PrepareWeights(T[] x, double[] weights, bool transposed)
    {
        var inner = transposed ? rowScale : columnScale;
        // |ŷ_j| once per unknown, not once per entry (a division per entry had been most of the check on a 13-unknown circuit).
        var unknowns = magnitudeScratch;
        for (var j = 0; j < n; j++)
            unknowns[j] = Scalar<T>.Magnitude(x[j]) / Scalar<T>.Magnitude(inner[j]);
        for (var i = 0; i < n; i++)
        {
            var sum = 0.0;
            for (var j = 0; j < n; j++)
            {
                var entry = transposed ? equilibrated[j * n + i] : equilibrated[i * n + j];
                sum += Scalar<T>.Magnitude(entry) * unknowns[j];
            }
            rowWeight[i] = Scalar<T>.From(sum);
            columnWeight[i] = Scalar<T>.From(weights[i] * Scalar<T>.Magnitude(inner[i]));
        }
    }

    /// <summary>v ← diag(w·C)·Â⁻¹·diag(g)·v (Â⁻ᵀ in place of Â⁻¹ when judging Aᵀ).</summary>
    private void WeightedInverse(T[] v)
    {
        for (var i = 0; i < n; i++)
            v[i] *= rowWeight[i];
        if (weightsTransposed)
            SolveEquilibratedTransposed(v);
        else
            SolveEquilibrated(v);
        for (var i = 0; i < n; i++)
            v[i] *= columnWeight[i];
    }

    /// <summary>The transpose of <see cref="WeightedInverse"/>: v ← diag(g)·Â⁻ᵀ·diag(w·C)·v.</summary>
    private void WeightedTransposedInverse(T[] v)
    {
        for (var i = 0; i < n; i++)
            v[i] *= columnWeight[i];
        if (weightsTransposed)
            SolveEquilibrated(v);
        else
            SolveEquilibratedTransposed(v);
        for (var i = 0; i < n; i++)
            v[i] *= rowWeight[i];
    }

    /// <summary>Overwrites v with Â⁻¹·v, Â the equilibrated matrix (P·Â = L·U).</summary>
    private void SolveEquilibrated(T[] v)
    {
        var y = work;
        for (var i = 0; i < n; i++)
        {
            var sum = v[rowOfPivot[i]];
            var row = i * n;
            for (var j = 0; j < i; j++)
                sum -= lu[row + j] * y[j];
            y[i] = sum;
        }
        for (var i = n - 1; i >= 0; i--)
        {
            var sum = y[i];
            var row = i * n;
            for (var j = i + 1; j < n; j++)
                sum -= lu[row + j] * v[j];
            v[i] = sum / lu[row + i];
        }
    }

    /// <summary>Overwrites v with Â⁻ᵀ·v: Âᵀ = Uᵀ·Lᵀ·P, so Uᵀ forward, Lᵀ backward, then the permutation undone.</summary>
    private void SolveEquilibratedTransposed(T[] v)
    {
        var y = work;
        for (var i = 0; i < n; i++)
        {
            var sum = v[i];
            for (var j = 0; j < i; j++)
                sum -= lu[j * n + i] * y[j];
            y[i] = sum / lu[i * n + i];
        }
        for (var i = n - 1; i >= 0; i--)
        {
            var sum = y[i];
            for (var j = i + 1; j < n; j++)
                sum -= lu[j * n + i] * y[j];
            y[i] = sum;
        }
        for (var i = 0; i < n; i++)
            v[rowOfPivot[i]] = y[i];
    }
}
