namespace ThermVerify.Sensors;

/// <summary>
/// Monotone piecewise cubic Hermite interpolation of strictly increasing data (Fritsch–Carlson).
/// </summary>
/// <remarks>
/// F. N. Fritsch, R. E. Carlson, "Monotone Piecewise Cubic Interpolation", SIAM J. Numer. Anal. 17(2) (1980)
/// 238–246; also the encyclopedia article "Monotone cubic interpolation". Node slopes start from the
/// three-point (parabola) estimate, which keeps the interpolant third-order accurate on smooth data, and are
/// then limited so that α² + β² ≤ 9 on every interval, which guarantees a monotone result. Monotone output
/// matters here because a thermistor table must give one temperature per resistance.
/// </remarks>
internal sealed class MonotoneCubic
{
    private readonly double[] _x;
    private readonly double[] _y;
    private readonly double[] _m;

    /// <param name="x">Strictly increasing abscissae, at least 2.</param>
    /// <param name="y">Strictly increasing ordinates.</param>
    public MonotoneCubic(IReadOnlyList<double> x, IReadOnlyList<double> y)
    {
        _x = [.. x];
        _y = [.. y];
        var n = _x.Length;
        var h = new double[n - 1];
        var delta = new double[n - 1];
        for (var k = 0; k < n - 1; k++)
        {
            h[k] = _x[k + 1] - _x[k];
            delta[k] = (_y[k + 1] - _y[k]) / h[k];
        }
        _m = new double[n];
        if (n == 2)
        {
            _m[0] = _m[1] = delta[0];
            return;
        }
        for (var k = 1; k < n - 1; k++)
            _m[k] = (h[k] * delta[k - 1] + h[k - 1] * delta[k]) / (h[k - 1] + h[k]);
        _m[0] = EndSlope(h[0], h[1], delta[0], delta[1]);
        _m[n - 1] = EndSlope(h[n - 2], h[n - 3], delta[n - 2], delta[n - 3]);
        for (var k = 0; k < n - 1; k++)
        {
            var alpha = _m[k] / delta[k];
            var beta = _m[k + 1] / delta[k];
            var sum = alpha * alpha + beta * beta;
            if (sum <= 9) continue;
            var tau = 3 / Math.Sqrt(sum);
            _m[k] = tau * alpha * delta[k];
            _m[k + 1] = tau * beta * delta[k];
        }
    }

    /// <summary>The knots, values and limited slopes, for writing the same curve elsewhere (SPICE export).</summary>
    internal IReadOnlyList<double> Knots => _x;
    internal IReadOnlyList<double> Values => _y;
    internal IReadOnlyList<double> Slopes => _m;

    public double MinX => _x[0];
    public double MaxX => _x[^1];
    public double MinY => _y[0];
    public double MaxY => _y[^1];

    public double Value(double x)
    {
        var k = Segment(_x, x);
        var (h, t) = Local(k, x);
        var t2 = t * t;
        var t3 = t2 * t;
        return (2 * t3 - 3 * t2 + 1) * _y[k] + (t3 - 2 * t2 + t) * h * _m[k]
             + (-2 * t3 + 3 * t2) * _y[k + 1] + (t3 - t2) * h * _m[k + 1];
    }

    public double Derivative(double x)
    {
        var k = Segment(_x, x);
        var (h, t) = Local(k, x);
        var t2 = t * t;
        return ((6 * t2 - 6 * t) * _y[k] + (-6 * t2 + 6 * t) * _y[k + 1]) / h
             + (3 * t2 - 4 * t + 1) * _m[k] + (3 * t2 - 2 * t) * _m[k + 1];
    }

    /// <summary>The x with Value(x) = y: bracketed Newton inside the one segment that holds y.</summary>
    public double Inverse(double y)
    {
        var k = Segment(_y, y);
        double lo = _x[k], hi = _x[k + 1];
        // Start from the secant: exact on linear data, close elsewhere.
        var x = lo + (y - _y[k]) / (_y[k + 1] - _y[k]) * (hi - lo);
        for (var step = 0; step < 100; step++)
        {
            var f = Value(x) - y;
            if (f == 0) return x;
            if (f > 0) hi = x; else lo = x;
            var slope = Derivative(x);
            var next = x - f / slope;
            // Bisect whenever Newton would leave the bracket (a limited slope can be zero at a node).
            if (!(slope > 0) || next <= lo || next >= hi) next = 0.5 * (lo + hi);
            if (Math.Abs(next - x) <= 1e-15 * Math.Max(Math.Abs(x), 1e-300)) return next;
            x = next;
        }
        return x;
    }

    private (double H, double T) Local(int k, double x)
    {
        var h = _x[k + 1] - _x[k];
        return (h, (x - _x[k]) / h);
    }

    private static double EndSlope(double h0, double h1, double d0, double d1)
    {
        // Non-centred three-point estimate, kept to the sign of the end secant as Fritsch–Carlson require.
        var m = ((2 * h0 + h1) * d0 - h0 * d1) / (h0 + h1);
        if (Math.Sign(m) != Math.Sign(d0)) return 0;
        if (Math.Sign(d0) != Math.Sign(d1) && Math.Abs(m) > Math.Abs(3 * d0)) return 3 * d0;
        return m;
    }

    private static int Segment(double[] nodes, double value)
    {
        var i = Array.BinarySearch(nodes, value);
        if (i < 0) i = ~i - 1;
        return Math.Clamp(i, 0, nodes.Length - 2);
    }
}
