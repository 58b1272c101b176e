namespace ThermVerify.Sensors;

/// <summary>ln R from 1/T for the Steinhart–Hart polynomial y = A + B x + D x² + C x³, x = ln R.</summary>
internal static class SteinhartHartInverse
{
    private const int MaxNewtonSteps = 60;

    /// <summary>
    /// Closed-form cubic root for the 3-term form (encyclopedia article "Steinhart–Hart equation"), or a linear
    /// start when C and D vanish; then Newton on x. The polish matters: when C is small the closed form subtracts two
    /// nearly equal cube roots and loses digits, and with D ≠ 0 there is no closed form at all.
    /// </summary>
    public static double LnResistance(double a, double b, double c, double d, double inverseKelvin)
    {
        var x = StartingPoint(a, b, c, d, inverseKelvin);
        for (var step = 0; step < MaxNewtonSteps; step++)
        {
            var f = a + x * (b + x * (d + x * c)) - inverseKelvin;
            var slope = b + x * (2 * d + 3 * c * x);
            if (!(slope > 0))
                throw new ArithmeticException($"Newton step for ln R stopped where d(1/T)/d(ln R) = {slope:G4} is not positive (ln R = {x:G6}).");
            var dx = f / slope;
            x -= dx;
            if (Math.Abs(dx) <= 1e-15 * Math.Max(1, Math.Abs(x))) return x;
        }
        throw new ArithmeticException($"Newton iteration for ln R did not converge at 1/T = {inverseKelvin:G10} 1/K.");
    }

    /// <summary>True when d(1/T)/dx = B + 2Dx + 3Cx² is positive on the whole of [x1, x2].</summary>
    public static bool SlopeIsPositive(double b, double c, double d, double x1, double x2)
    {
        double Slope(double x) => b + x * (2 * d + 3 * c * x);
        if (!(Slope(x1) > 0) || !(Slope(x2) > 0)) return false;
        // A quadratic's interior extreme is at its vertex; only a minimum (C > 0) can dip below the ends.
        if (c <= 0) return true;
        var vertex = -d / (3 * c);
        return vertex <= x1 || vertex >= x2 || Slope(vertex) > 0;
    }

    private static double StartingPoint(double a, double b, double c, double d, double inverseKelvin)
    {
        if (c == 0 || d != 0 && c <= 0) return (inverseKelvin - a) / b;
        // Encyclopedia article "Steinhart–Hart equation": y = (A − 1/T)/C, x = √((B/3C)³ + y²/4),
        // ln R = ∛(x − y/2) − ∛(x + y/2). With D ≠ 0 this root of the 3-term part is still a close start.
        var y = (a - inverseKelvin) / c;
        var bOver3C = b / (3 * c);
        var s = Math.Sqrt(bOver3C * bOver3C * bOver3C + y * y / 4);
        var root = Math.Cbrt(s - y / 2) - Math.Cbrt(s + y / 2);
        return double.IsFinite(root) ? root : (inverseKelvin - a) / b;
    }
}
