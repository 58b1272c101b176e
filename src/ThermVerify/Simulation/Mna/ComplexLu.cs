using System.Numerics;
using ThermVerify.Limits;

namespace ThermVerify.Simulation.Mna;

/// <summary>LU with partial pivoting of a dense complex n×n matrix (as <see cref="DenseLu"/>, for AC and noise).</summary>
internal sealed class ComplexLu(int n)
{
    private readonly Complex[] lu = new Complex[n * n];
    private readonly int[] rowOfPivot = new int[n];
    // Per thread, not per matrix: short analyses that build a new matrix each time still count up.
    [ThreadStatic] private static int factorisations;
    private readonly Complex[] work = new Complex[n];

    /// <summary>Factorises the first n² entries; returns −1 or the column whose pivot vanished.</summary>
    public int Factor(Complex[] matrix)
    {
        // Every analysis passes through here: Ctrl+C and the time limit stop it within a few solver steps.
        if ((++factorisations & 63) == 0) Work.ThrowIfCancelled();
        Array.Copy(matrix, lu, n * n);
        var scale = 0.0;
        for (var i = 0; i < n * n; i++)
            scale = Math.Max(scale, Magnitude(lu[i]));
        for (var i = 0; i < n; i++)
            rowOfPivot[i] = i;
        for (var k = 0; k < n; k++)
        {
            var p = k;
            var best = Magnitude(lu[k * n + k]);
            for (var i = k + 1; i < n; i++)
            {
                var v = Magnitude(lu[i * n + k]);
                if (v > best)
                {
                    best = v;
                    p = i;
                }
            }
            if (!(best > 1e-18 * scale) || !double.IsFinite(best))
                return k;
            if (p != k)
            {
                lu.AsSpan(p * n, n).CopyTo(work);
                lu.AsSpan(k * n, n).CopyTo(lu.AsSpan(p * n, n));
                work.AsSpan(0, n).CopyTo(lu.AsSpan(k * n, n));
                (rowOfPivot[p], rowOfPivot[k]) = (rowOfPivot[k], rowOfPivot[p]);
            }
            var kRow = k * n;
            var inverse = Complex.One / lu[kRow + k];
            for (var i = k + 1; i < n; i++)
            {
                var iRow = i * n;
                var factor = lu[iRow + k];
                if (factor == Complex.Zero)
                    continue;
                factor *= inverse;
                lu[iRow + k] = factor;
                for (var j = k + 1; j < n; j++)
                    lu[iRow + j] -= factor * lu[kRow + j];
            }
        }
        return -1;
    }

    public void Solve(Complex[] b, Complex[] x)
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

    private static double Magnitude(Complex z) => Math.Abs(z.Real) + Math.Abs(z.Imaginary);
}
