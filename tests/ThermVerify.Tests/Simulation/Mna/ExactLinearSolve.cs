using System.Numerics;

namespace ThermVerify.Tests.Simulation.Mna;

/// <summary>
/// The exact solution of a linear system whose entries are doubles, by Gaussian elimination in rational arithmetic
/// (fractions of <see cref="BigInteger"/>s): every double is a dyadic rational, so nothing is rounded until the final
/// division. A reference that owes nothing to floating-point pivoting (elementary algebra).
/// </summary>
public static class ExactLinearSolve
{
    public static double[] Solve(double[,] a, double[] b)
    {
        var n = b.Length;
        var m = new Fraction[n, n + 1];
        for (var i = 0; i < n; i++)
        {
            for (var j = 0; j < n; j++)
                m[i, j] = Fraction.From(a[i, j]);
            m[i, n] = Fraction.From(b[i]);
        }
        for (var k = 0; k < n; k++)
        {
            var p = k;
            while (p < n && m[p, k].IsZero)
                p++;
            if (p == n)
                throw new InvalidOperationException("The matrix is exactly singular.");
            for (var j = 0; j <= n; j++)
                (m[k, j], m[p, j]) = (m[p, j], m[k, j]);
            for (var i = k + 1; i < n; i++)
            {
                if (m[i, k].IsZero)
                    continue;
                var f = m[i, k] / m[k, k];
                for (var j = k; j <= n; j++)
                    m[i, j] -= f * m[k, j];
            }
        }
        var x = new Fraction[n];
        for (var i = n - 1; i >= 0; i--)
        {
            var sum = m[i, n];
            for (var j = i + 1; j < n; j++)
                sum -= m[i, j] * x[j];
            x[i] = sum / m[i, i];
        }
        return [.. x.Select(f => f.ToDouble())];
    }

    private readonly record struct Fraction(BigInteger Numerator, BigInteger Denominator)
    {
        public bool IsZero => Numerator.IsZero;

        public static Fraction From(double v)
        {
            if (v == 0)
                return new(0, 1);
            var bits = BitConverter.DoubleToInt64Bits(v);
            var exponent = (int)((bits >> 52) & 0x7FF);
            var mantissa = bits & 0xFFFFFFFFFFFFFL;
            if (exponent == 0) exponent++; else mantissa |= 1L << 52;
            exponent -= 1075;
            var numerator = new BigInteger(mantissa) * (v < 0 ? -1 : 1);
            return exponent >= 0 ? new(numerator << exponent, 1) : Reduce(numerator, BigInteger.One << -exponent);
        }

        private static Fraction Reduce(BigInteger n, BigInteger d)
        {
            if (d.Sign < 0) (n, d) = (-n, -d);
            var g = BigInteger.GreatestCommonDivisor(n, d);
            return g.IsOne || g.IsZero ? new(n, d) : new(n / g, d / g);
        }

        public static Fraction operator -(Fraction a, Fraction b) => Reduce(a.Numerator * b.Denominator - b.Numerator * a.Denominator, a.Denominator * b.Denominator);
        public static Fraction operator *(Fraction a, Fraction b) => Reduce(a.Numerator * b.Numerator, a.Denominator * b.Denominator);
        public static Fraction operator /(Fraction a, Fraction b) => Reduce(a.Numerator * b.Denominator, a.Denominator * b.Numerator);

        /// <summary>Correctly rounded to within one unit in the last place: 64 significant bits are divided out first.</summary>
        public double ToDouble()
        {
            if (Numerator.IsZero) return 0;
            var shift = (int)(Numerator.GetBitLength() - Denominator.GetBitLength()) - 64;
            var q = shift >= 0 ? BigInteger.Divide(Numerator, Denominator << shift) : BigInteger.Divide(Numerator << -shift, Denominator);
            return Math.ScaleB((double)q, shift);
        }
    }
}
