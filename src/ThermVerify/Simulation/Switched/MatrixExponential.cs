using MathNet.Numerics.LinearAlgebra;

namespace ThermVerify.Simulation.Switched;

/// <summary>
/// e^A by scaling and squaring with diagonal Padé approximants: N. J. Higham, "The scaling and squaring method for
/// the matrix exponential revisited", SIAM J. Matrix Anal. Appl. 26(4), 2005, Algorithm 2.3. The lowest degree m in
/// {3, 5, 7, 9, 13} whose bound θ_m covers ‖A‖₁ is used directly; beyond θ₁₃ the matrix is scaled by 2^−s so that
/// ‖A/2^s‖₁ ≤ θ₁₃, r₁₃ is evaluated and squared s times. θ_m is the largest norm for which r_m has a backward error
/// of at most the unit roundoff 2^−53 (the paper's Table 2.3, values from memory; the tests check the results
/// against closed forms and an eigendecomposition). The later refinement against overscaling (Al-Mohy &amp; Higham,
/// 2009) is not used: the matrices here are small and their norms moderate after scaling.
/// </summary>
internal static class MatrixExponential
{
    private static readonly (int Degree, double Theta)[] Degrees =
    [
        (3, 1.495585217958292e-2),
        (5, 2.539398330063230e-1),
        (7, 9.504178996162932e-1),
        (9, 2.097847961257068e0),
        (13, 5.371920351148152e0),
    ];

    public static Matrix<double> Exp(Matrix<double> a)
    {
        if (a.RowCount != a.ColumnCount)
            throw new ArgumentException($"The matrix exponential needs a square matrix, not {a.RowCount}×{a.ColumnCount}.", nameof(a));
        var norm = a.L1Norm();
        if (!double.IsFinite(norm))
            throw new ArgumentException("The matrix exponential needs finite entries.", nameof(a));
        foreach (var (degree, theta) in Degrees.AsSpan(0, Degrees.Length - 1))
            if (norm <= theta)
                return Pade(a, degree);
        var (_, theta13) = Degrees[^1];
        var s = Math.Max(0, (int)Math.Ceiling(Math.Log2(norm / theta13)));
        var r = Pade(a / Math.Pow(2, s), 13);
        for (var i = 0; i < s; i++)
            r = r * r;
        return r;
    }

    /// <summary>
    /// The coefficients c_j = (2m − j)!·m! / ((2m)!·j!·(m − j)!) of the degree-m Padé numerator p_m(x) = Σ c_j x^j
    /// (the denominator is p_m(−x)), by the ratio c_{j+1}/c_j = (m − j)/((2m − j)(j + 1)).
    /// </summary>
    internal static double[] Coefficients(int m)
    {
        var c = new double[m + 1];
        c[0] = 1;
        for (var j = 0; j < m; j++)
            c[j + 1] = c[j] * (m - j) / ((2.0 * m - j) * (j + 1));
        return c;
    }

    /// <summary>r_m(A) = (V − U)⁻¹(V + U) with U the odd and V the even part of p_m(A).</summary>
    private static Matrix<double> Pade(Matrix<double> a, int m)
    {
        var c = Coefficients(m);
        var identity = Matrix<double>.Build.DenseIdentity(a.RowCount);
        var a2 = a * a;
        Matrix<double> u, v;
        if (m == 13)
        {
            // Higham's evaluation with A², A⁴, A⁶: six products instead of twelve.
            var a4 = a2 * a2;
            var a6 = a4 * a2;
            u = a * (a6 * (c[13] * a6 + c[11] * a4 + c[9] * a2) + c[7] * a6 + c[5] * a4 + c[3] * a2 + c[1] * identity);
            v = a6 * (c[12] * a6 + c[10] * a4 + c[8] * a2) + c[6] * a6 + c[4] * a4 + c[2] * a2 + c[0] * identity;
        }
        else
        {
            var odd = c[1] * identity;
            v = c[0] * identity;
            var power = identity;
            for (var j = 2; j <= m; j += 2)
            {
                power = power * a2;
                v += c[j] * power;
                if (j + 1 <= m)
                    odd += c[j + 1] * power;
            }
            u = a * odd;
        }
        return (v - u).Solve(v + u);
    }
}
