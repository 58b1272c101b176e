using ThermVerify.Simulation.Switched;

namespace ThermVerify.FrontEnd.DeltaSigma;

/// <summary>
/// The digital filter's readings of modulator samples that follow a linear recurrence (<see cref="LinearSampleSequence"/>:
/// s_n = ŵ·X^(n−n₀)·ẑ from n₀ on, with the augmented state ẑ = [z; 1], X = [[Φ, c], [0, 1]], ŵ = [w, d]), without
/// following the samples one by one. A reading is Σ_j h_j·s_(e−j); when its whole window lies in the recurrence that is
/// ŵ·X^(e−n₀−(ℓ−1))·P(X)·ẑ, ℓ the impulse response's length and P(X) = Σ_j h_j·X^j, since the filter's polynomial is
/// palindromic (each moving sum's is) and so equals its reverse Σ_j h_j·X^(ℓ−1−j). The filter's structure gives P(X)
/// in a few matrix products: N moving sums of M and a mean of L outputs M apart are
/// P(X) = [B_M(X)/M]^N · B_L(X^M)/L with the geometric sums B_n(Y) = Σ_(a&lt;n) Y^a, each by doubling
/// (B_2m = B_m + Y^m·B_m, B_(m+1) = B_m + Y^m). One reading to the next is one product with X^(M·L). A reading whose
/// window reaches before n₀ (a filter without reset still holding the other channel, or the schedules still starting)
/// takes the recurrence's part through the filter's integrator-comb form (<see cref="PartialWindows"/>) and the early
/// samples and the history tap by tap. The cost is a few dozen products of small matrices instead of a matrix-vector
/// product per modulator sample.
/// </summary>
internal static class RecurrenceReadings
{
    /// <summary>As <see cref="SincFilter.Readings"/>, with the input given by <paramref name="samples"/> and <paramref name="history"/> before it.</summary>
    public static IReadOnlyList<FilterReading> Of(SincFilter filter, LinearSampleSequence samples, double history, int count, bool reset)
    {
        var h = filter.ImpulseResponse;
        var taps = h.Count;
        var perReading = filter.SamplesPerReading;
        var n0 = samples.FirstRegular;
        var list = new List<FilterReading>(count);
        var k = 1 + (reset ? filter.SettlingConversions - 1 : 0);
        long End(long reading) => reading * perReading - 1;

        // Windows reaching before n₀: the recurrence's part through the integrator-comb form, the early samples and the history tap by tap.
        var partial = 0;
        while (partial < count && End(k + partial) - (taps - 1) < n0) partial++;
        if (partial > 0)
        {
            var fromRecurrence = PartialWindows(filter, samples, [.. Enumerable.Range(0, partial).Select(i => End(k + i) - n0)]);
            for (var i = 0; i < partial; i++, k++)
            {
                var end = End(k);
                var sum = fromRecurrence[i];
                for (var m = Math.Max(0, end - (taps - 1)); m < n0 && m <= end; m++) sum += h[(int)(end - m)] * samples.EarlyVolts[m];
                if (!reset) sum += history * (1 - filter.StepAt(end));
                list.Add(new FilterReading(list.Count + 1, (end + 1) / filter.ModulatorRateHertz, sum));
            }
        }
        if (list.Count == count) return list;

        var q = samples.StateCount + 1;
        var x = Augmented(samples);
        var (polynomial, perDecimation) = FilterPolynomial(filter, x, q);
        var perReadingPower = GeometricSum(perDecimation, filter.AverageLength, q).Power;
        var state = Apply(polynomial, [.. samples.State, 1], q);
        state = Apply(Power(x, End(k) - n0 - (taps - 1), q), state, q);
        double[] row = [.. samples.Row, samples.Constant];
        for (; list.Count < count; k++)
        {
            var value = 0.0;
            for (var i = 0; i < q; i++) value += row[i] * state[i];
            list.Add(new FilterReading(list.Count + 1, (End(k) + 1) / filter.ModulatorRateHertz, value));
            state = Apply(perReadingPower, state, q);
        }
        return list;
    }

    /// <summary>
    /// Σ_(i=0..p) h_(p−i)·s_(n₀+i) for each p (a window that starts before the recurrence does), from the filter as
    /// integrators and combs (Hogenauer, "An economical class of digital filters for decimation and interpolation", IEEE
    /// Trans. ASSP 29(2), 1981, from memory): H(z) = G(z)/(1 − z⁻¹)^N with the comb G(z) = (1 − z^−M)^(N−1)·(1 − z^−ML)/(M^N·L),
    /// so the output at p is Σ_l g_l·I_(p−d_l) over the comb's terms g_l·z^(−d_l), I the N-fold running sum of the input
    /// (zero before it starts). The input u_i = X^i·ẑ and its running sums c_1 … c_N advance together by one block
    /// matrix T (u ← X·u, c_k ← c_1 + … + c_k + X·u), so I at the points p − d_l, all M apart, takes T^b and T^M once
    /// and a product each.
    /// </summary>
    private static double[] PartialWindows(SincFilter filter, LinearSampleSequence samples, long[] ends)
    {
        var q = samples.StateCount + 1;
        var n = filter.Order;
        var m = (long)filter.Decimation;
        var comb = Comb(filter);
        var size = (n + 1) * q;
        var x = Augmented(samples);
        var t = new double[size * size];
        for (var block = 0; block <= n; block++)
        {
            for (var i = 0; i < q; i++)
                for (var j = 0; j < q; j++)
                    t[(block * q + i) * size + j] = x[i * q + j];
            for (var c = 1; c <= block; c++)
                for (var i = 0; i < q; i++)
                    t[(block * q + i) * size + c * q + i] = 1;
        }
        double[] z = [.. samples.State, 1];
        var state = new double[size];
        for (var block = 0; block <= n; block++) Array.Copy(z, 0, state, block * q, q);

        // Every point p − d_l is b + a·M (the ends and the comb's delays are M apart): I at a = 0, 1, … in turn.
        var points = ends.SelectMany(p => comb.Select(g => p - g.Delay)).Where(p => p >= 0).ToArray();
        var values = new Dictionary<long, double>();
        if (points.Length > 0)
        {
            var b = points.Min() % m;
            var perDecimation = Power(t, m, size);
            state = Apply(Power(t, b, size), state, size);
            double[] row = [.. samples.Row, samples.Constant];
            for (long p = b; p <= points.Max(); p += m)
            {
                var value = 0.0;
                for (var i = 0; i < q; i++) value += row[i] * state[n * q + i];
                values[p] = value;
                if (p + m <= points.Max()) state = Apply(perDecimation, state, size);
            }
        }
        return [.. ends.Select(p => comb.Sum(g => p - g.Delay >= 0 ? g.Coefficient * values[p - g.Delay] : 0))];
    }

    /// <summary>The comb G(z) = (1 − z^−M)^(N−1)·(1 − z^−ML)/(M^N·L) as its terms (coefficient, delay in samples).</summary>
    private static (double Coefficient, long Delay)[] Comb(SincFilter filter)
    {
        long m = filter.Decimation;
        var terms = new Dictionary<long, double> { [0] = 1 };
        void Times(long delay)
        {
            var next = new Dictionary<long, double>(terms);
            foreach (var (d, c) in terms) next[d + delay] = next.GetValueOrDefault(d + delay) - c;
            terms = next;
        }
        for (var stage = 1; stage < filter.Order; stage++) Times(m);
        Times(m * filter.AverageLength);
        var scale = Math.Pow(m, filter.Order) * filter.AverageLength;
        return [.. terms.Where(e => e.Value != 0).Select(e => (e.Value / scale, e.Key))];
    }

    /// <summary>
    /// The samples at rising indices (a report's trace): the early ones as they are, then the state carried from index to
    /// index by X to the power of the gap (the gaps of an even decimation are few, so each power is made once).
    /// </summary>
    public static double[] SamplesAt(LinearSampleSequence samples, IReadOnlyList<long> indices)
    {
        var q = samples.StateCount + 1;
        var x = Augmented(samples);
        var powers = new Dictionary<long, double[]>();
        double[] state = [.. samples.State, 1];
        double[] row = [.. samples.Row, samples.Constant];
        long at = samples.FirstRegular;
        var values = new double[indices.Count];
        for (var i = 0; i < values.Length; i++)
        {
            var n = indices[i];
            if (n < samples.FirstRegular)
            {
                values[i] = samples.EarlyVolts[n];
                continue;
            }
            if (n < at) throw new ArgumentException("The indices must rise.", nameof(indices));
            if (n > at)
            {
                if (!powers.TryGetValue(n - at, out var power))
                    powers[n - at] = power = Power(x, n - at, q);
                state = Apply(power, state, q);
                at = n;
            }
            var value = 0.0;
            for (var j = 0; j < q; j++) value += row[j] * state[j];
            values[i] = value;
        }
        return values;
    }

    /// <summary>P(X) = [B_M(X)/M]^N · B_L(X^M)/L, and X^M.</summary>
    private static (double[] Polynomial, double[] PerDecimation) FilterPolynomial(SincFilter filter, double[] x, int q)
    {
        var (box, xm) = GeometricSum(x, filter.Decimation, q);
        Scale(box, 1.0 / filter.Decimation);
        var polynomial = box;
        for (var stage = 1; stage < filter.Order; stage++)
            polynomial = Multiply(polynomial, box, q);
        if (filter.AverageLength > 1)
        {
            var (mean, _) = GeometricSum(xm, filter.AverageLength, q);
            Scale(mean, 1.0 / filter.AverageLength);
            polynomial = Multiply(polynomial, mean, q);
        }
        return (polynomial, xm);
    }

    /// <summary>(Σ_(a&lt;n) Y^a, Y^n) by doubling over n's bits from the highest.</summary>
    private static (double[] Sum, double[] Power) GeometricSum(double[] y, long n, int q)
    {
        var sum = new double[q * q];
        var power = Identity(q);
        for (var bit = 62; bit >= 0; bit--)
        {
            if (n >> bit == 0) continue;
            // Doubling m → 2m: B_2m = B_m + Y^m·B_m, Y^2m = Y^m·Y^m.
            var doubled = Multiply(power, sum, q);
            for (var i = 0; i < doubled.Length; i++) doubled[i] += sum[i];
            (sum, power) = (doubled, Multiply(power, power, q));
            if ((n >> bit & 1) != 0)
            {
                // m → m + 1: B_(m+1) = B_m + Y^m, Y^(m+1) = Y·Y^m.
                for (var i = 0; i < sum.Length; i++) sum[i] += power[i];
                power = Multiply(y, power, q);
            }
        }
        return (sum, power);
    }

    private static double[] Power(double[] y, long n, int q)
    {
        var result = Identity(q);
        var square = y;
        for (; n > 0; n >>= 1)
        {
            if ((n & 1) != 0) result = Multiply(square, result, q);
            if (n > 1) square = Multiply(square, square, q);
        }
        return result;
    }

    /// <summary>X = [[Φ, c], [0, 1]], row-major (r+1)×(r+1).</summary>
    private static double[] Augmented(LinearSampleSequence s)
    {
        var r = s.StateCount;
        var q = r + 1;
        var x = new double[q * q];
        for (var i = 0; i < r; i++)
        {
            for (var k = 0; k < r; k++) x[i * q + k] = s.Phi[i * r + k];
            x[i * q + r] = s.Offset[i];
        }
        x[r * q + r] = 1;
        return x;
    }

    private static double[] Identity(int q)
    {
        var m = new double[q * q];
        for (var i = 0; i < q; i++) m[i * q + i] = 1;
        return m;
    }

    private static void Scale(double[] m, double factor)
    {
        for (var i = 0; i < m.Length; i++) m[i] *= factor;
    }

    private static double[] Multiply(double[] a, double[] b, int q)
    {
        var c = new double[q * q];
        for (var i = 0; i < q; i++)
            for (var k = 0; k < q; k++)
            {
                var aik = a[i * q + k];
                if (aik == 0) continue;
                for (var j = 0; j < q; j++) c[i * q + j] += aik * b[k * q + j];
            }
        return c;
    }

    private static double[] Apply(double[] m, double[] v, int q)
    {
        var result = new double[q];
        for (var i = 0; i < q; i++)
        {
            var sum = 0.0;
            for (var k = 0; k < q; k++) sum += m[i * q + k] * v[k];
            result[i] = sum;
        }
        return result;
    }
}
