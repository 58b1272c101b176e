using System.Numerics;

namespace ThermVerify.Simulation.Mna;

/// <summary>
/// Estimates ‖B‖₁ of a matrix known only through products with B and Bᵀ (here B = A⁻¹ through the LU's
/// solves), after W. W. Hager, "Condition estimates", SIAM J. Sci. Stat. Comput. 5 (1984) 311–316, with
/// N. J. Higham's refinements (at most five iterations, stop when the sign vector repeats or the estimate
/// stops growing, then compare with the alternating test vector (−1)^i·(1 + i/(n−1))): "FORTRAN codes for
/// estimating the one-norm of a real or complex matrix, with applications to condition estimation",
/// ACM TOMS 14 (1988) 381–396, the algorithm of LAPACK's xLACN2 (all from memory). The estimate is a lower
/// bound, nearly always within a factor of 3 of the norm. Complex matrices use Bᴴ·v = conj(Bᵀ·conj(v)).
/// </summary>
internal sealed class OneNormEstimator<T>(int n) where T : struct, INumberBase<T>
{
    private const int MaxIterations = 5;

    private readonly T[] x = new T[n];
    private readonly T[] sign = new T[n];

    /// <param name="apply">Overwrites its argument v with B·v.</param>
    /// <param name="applyTransposed">Overwrites its argument v with Bᵀ·v.</param>
    public double Estimate(Action<T[]> apply, Action<T[]> applyTransposed)
    {
        if (n == 0)
            return 0;
        var uniform = Scalar<T>.From(1.0 / n);
        Array.Fill(x, uniform);
        apply(x);
        var estimate = Norm1(x);
        if (n == 1)
            return estimate;
        SetSign(x);
        var j = ArgMaxAfterAdjoint(applyTransposed);
        for (var iteration = 2; iteration <= MaxIterations; iteration++)
        {
            Array.Clear(x);
            x[j] = T.One;
            apply(x);
            var next = Norm1(x);
            if (next <= estimate || SignRepeats(x))
            {
                estimate = Math.Max(estimate, next);
                break;
            }
            estimate = next;
            SetSign(x);
            var previous = j;
            j = ArgMaxAfterAdjoint(applyTransposed);
            if (j == previous)
                break;
        }
        // Higham's safeguard against the rare matrices that fool the iteration.
        for (var i = 0; i < n; i++)
            x[i] = Scalar<T>.From((i % 2 == 0 ? 1 : -1) * (1 + (double)i / (n - 1)));
        apply(x);
        return Math.Max(estimate, 2 * Norm1(x) / (3 * n));
    }

    /// <summary>z = Bᴴ·sign, and the index of its largest entry.</summary>
    private int ArgMaxAfterAdjoint(Action<T[]> applyTransposed)
    {
        for (var i = 0; i < n; i++)
            x[i] = Scalar<T>.Conjugate(sign[i]);
        applyTransposed(x);
        var best = 0;
        var largest = -1.0;
        for (var i = 0; i < n; i++)
        {
            var m = Scalar<T>.Magnitude(x[i]);
            if (m > largest)
            {
                largest = m;
                best = i;
            }
        }
        return best;
    }

    private void SetSign(T[] y)
    {
        for (var i = 0; i < n; i++)
            sign[i] = Scalar<T>.Sign(y[i]);
    }

    private bool SignRepeats(T[] y)
    {
        for (var i = 0; i < n; i++)
            if (Scalar<T>.Sign(y[i]) != sign[i])
                return false;
        return true;
    }

    private static double Norm1(T[] v)
    {
        var sum = 0.0;
        foreach (var e in v)
            sum += typeof(T) == typeof(Complex) ? Complex.Abs(Complex.CreateChecked(e)) : Scalar<T>.Magnitude(e);
        return sum;
    }
}
