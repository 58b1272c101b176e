using System.Numerics;
using System.Runtime.CompilerServices;

namespace ThermVerify.Simulation.Mna;

/// <summary>
/// The few operations the LU needs beyond <see cref="INumberBase{TSelf}"/>, for <see cref="double"/> and
/// <see cref="Complex"/>. The type tests are constants for the JIT, so each instantiation keeps only its own branch.
/// </summary>
internal static class Scalar<T> where T : struct, INumberBase<T>
{
    /// <summary>|x| for real numbers; |Re| + |Im| for complex ones, the cheap magnitude LAPACK's complex routines
    /// pivot and scale on (CABS1 in the LAPACK Users' Guide, 3rd ed., 1999).</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public static double Magnitude(T x)
    {
        if (typeof(T) == typeof(double))
            return Math.Abs(Unsafe.As<T, double>(ref x));
        if (typeof(T) == typeof(Complex))
        {
            var z = Unsafe.As<T, Complex>(ref x);
            return Math.Abs(z.Real) + Math.Abs(z.Imaginary);
        }
        return double.CreateChecked(T.Abs(x));
    }

    /// <summary>The complex conjugate (a real number is its own).</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public static T Conjugate(T x)
    {
        if (typeof(T) == typeof(Complex))
        {
            var z = Complex.Conjugate(Unsafe.As<T, Complex>(ref x));
            return Unsafe.As<Complex, T>(ref z);
        }
        return x;
    }

    /// <summary>x/|x| (±1 for a real number), and 1 for 0.</summary>
    public static T Sign(T x)
    {
        if (typeof(T) == typeof(Complex))
        {
            var z = Unsafe.As<T, Complex>(ref x);
            var m = Complex.Abs(z);
            var s = m > 0 ? z / m : Complex.One;
            return Unsafe.As<Complex, T>(ref s);
        }
        return T.IsNegative(x) ? -T.One : T.One;
    }

    public static T From(double value) => T.CreateChecked(value);
}
