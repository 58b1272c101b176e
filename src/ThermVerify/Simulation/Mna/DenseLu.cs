using ThermVerify.Limits;
namespace ThermVerify.Simulation.Mna;

/// <summary>
/// LU factorisation with partial pivoting of a dense row-major n×n matrix into preallocated storage
/// (Doolittle form, unit lower triangle; Golub & Van Loan, Matrix Computations, alg. 3.4.1, from memory).
/// The circuits here have tens of unknowns, where dense beats sparse bookkeeping.
/// </summary>
internal sealed class DenseLu(int n)
{
    /// <summary>A pivot below this fraction of its column's largest original entry counts as zero.</summary>
    private const double PivotRelativeThreshold = 1e-15;

    private readonly double[] lu = new double[n * n];
    private readonly int[] rowOfPivot = new int[n];
    // Per thread, not per matrix: short analyses that build a new matrix each time still count up.
    [ThreadStatic] private static int factorisations;
    private readonly double[] columnScale = new double[n];
    private readonly double[] work = new double[n];

    /// <summary>Factorises the first n² entries of <paramref name="matrix"/>; returns −1 or the failing column.</summary>
    public int Factor(double[] matrix)
    {
        // Every analysis passes through here: Ctrl+C and the time limit stop it within a few solver steps.
        if ((++factorisations & 63) == 0) Work.ThrowIfCancelled();
        Span<double> a = lu;
        Span<double> scale = columnScale;
        scale.Clear();
        for (var i = 0; i < n; i++)
        {
            rowOfPivot[i] = i;
            var source = matrix.AsSpan(i * n, n);
            var target = a.Slice(i * n, n);
            for (var j = 0; j < source.Length; j++)
            {
                var v = source[j];
                target[j] = v;
                scale[j] = Math.Max(scale[j], Math.Abs(v));
            }
        }
        for (var k = 0; k < n; k++)
        {
            var p = k;
            var best = Math.Abs(a[k * n + k]);
            for (var i = k + 1; i < n; i++)
            {
                var v = Math.Abs(a[i * n + k]);
                if (v > best)
                {
                    best = v;
                    p = i;
                }
            }
            if (!(best > PivotRelativeThreshold * scale[k]) || !double.IsFinite(best))
                return k;
            if (p != k)
            {
                var rowP = a.Slice(p * n, n);
                var rowK = a.Slice(k * n, n);
                for (var j = 0; j < rowP.Length; j++)
                    (rowP[j], rowK[j]) = (rowK[j], rowP[j]);
                (rowOfPivot[p], rowOfPivot[k]) = (rowOfPivot[k], rowOfPivot[p]);
            }
            var pivotRow = a.Slice(k * n + k + 1, n - k - 1);
            var inverse = 1.0 / a[k * n + k];
            for (var i = k + 1; i < n; i++)
            {
                var factor = a[i * n + k];
                if (factor == 0)
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

    /// <summary>Solves A·x = b for the last factorised A; b and x may be longer than n (ground cell untouched).</summary>
    public void Solve(double[] b, double[] x)
    {
        for (var i = 0; i < n; i++)
        {
            var sum = b[rowOfPivot[i]];
            var row = i * n;
            for (var j = 0; j < i; j++)
                sum -= lu[row + j] * work[j];
            work[i] = sum;
        }
        for (var i = n - 1; i >= 0; i--)
        {
            var sum = work[i];
            var row = i * n;
            for (var j = i + 1; j < n; j++)
                sum -= lu[row + j] * x[j];
            x[i] = sum / lu[row + i];
        }
    }
}
