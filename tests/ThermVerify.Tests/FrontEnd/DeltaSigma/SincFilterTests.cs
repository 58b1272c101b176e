using ThermVerify.FrontEnd.DeltaSigma;

namespace ThermVerify.Tests.FrontEnd.DeltaSigma;

/// <summary>
/// The sinc^N filter built from its definition (N cascaded moving averages of M samples) against the textbook closed
/// forms: E. B. Hogenauer, "An economical class of digital filters for decimation and interpolation", IEEE Trans. ASSP
/// 29 (1981) 155–162, gives H(z) = [(1 − z^(−M))/(M(1 − z^(−1)))]^N, so |H(f)| = |sin(πfM/f_mod)/(M·sin(πf/f_mod))|^N
/// (from memory).
/// </summary>
public class SincFilterTests
{
    private const double Fmod = 256e3;

    [Theory]
    [InlineData(1, 1)]
    [InlineData(3, 1)]
    [InlineData(4, 3)]
    public void The_power_from_the_stages_is_the_impulse_responses_and_the_closed_form(int order, int average)
    {
        // |H|² on the noise grid from the stages' phasor sums, against the sum over h (Response) and Hogenauer's closed form.
        var filter = new SincFilter(order, 512, average, Fmod);
        double[] hertz = [.. Enumerable.Range(1, 640).Select(k => k * filter.DataRateHertz / 32)];
        var power = filter.PowerAt(hertz);
        for (var i = 0; i < hertz.Length; i++)
        {
            // |H| within 1e-10 of itself and 1e-14 (the sum over h rounds to about 1e-16 of its Σh = 1 near a zero).
            Tolerance.AssertClose(filter.Magnitude(hertz[i]), Math.Sqrt(power[i]), 1e-10, 1e-14, $"{hertz[i]} Hz against h");
            Tolerance.AssertClose(ClosedForm(hertz[i], order, 512, average), Math.Sqrt(power[i]), 1e-10, 1e-14, $"{hertz[i]} Hz against the closed form");
        }
    }

    /// <summary>The closed form of the sinc^N magnitude, with the averaging stage's own sinc1 of L outputs M apart.</summary>
    private static double ClosedForm(double f, int n, int m, int l = 1)
    {
        double Ratio(double x, int k) => Math.Abs(Math.Sin(k * x)) < 1e-300 && Math.Abs(Math.Sin(x)) < 1e-300 ? 1 : Math.Sin(k * x) / (k * Math.Sin(x));
        var x = Math.PI * f / Fmod;
        return Math.Pow(Math.Abs(Ratio(x, m)), n) * Math.Abs(Ratio(x * m, l));
    }

    [Theory]
    [InlineData(1, 64, 1)]
    [InlineData(3, 64, 1)]
    [InlineData(4, 250, 1)]
    [InlineData(3, 5120, 1)]
    [InlineData(2, 128, 4)]
    public void The_magnitude_follows_the_closed_form(int n, int m, int l)
    {
        var filter = new SincFilter(n, m, l, Fmod);
        Assert.Equal(1, filter.ImpulseResponse.Sum(), 12); // unity gain at DC
        foreach (var f in new[] { 0.37, 10, 49.5, 50, 61.3, 1000.7, 12345.6 }.Select(x => x * filter.DataRateHertz / 50))
        {
            var expected = ClosedForm(f, n, m, l);
            var actual = filter.Magnitude(f);
            // |a − e| ≤ 1e-9·max + 1e-13: the DTFT summed over up to 15 000 samples against the product form.
            Assert.True(Tolerance.Within(actual, expected, 1e-9, 1e-13), $"f = {f} Hz: {actual} against {expected}");
        }
    }

    [Theory]
    [InlineData(1, 5120)]
    [InlineData(3, 5120)]
    [InlineData(4, 100)]
    public void The_response_is_zero_at_every_multiple_of_the_data_rate(int n, int m)
    {
        // A moving average of M samples nulls every frequency whose whole periods fit M samples: k·f_mod/M (from the closed form).
        var filter = new SincFilter(n, m, 1, Fmod);
        for (var k = 1; k <= 6; k++)
            Assert.True(filter.Magnitude(k * filter.DataRateHertz) < 1e-9, $"k = {k}: {filter.Magnitude(k * filter.DataRateHertz)}");
        // Between the zeros the response is not zero: half-way past the first, sinc^N gives |sin(1.5π)/(1.5π)|^N approximately.
        Assert.Equal(Math.Pow(1 / (1.5 * Math.PI), n), filter.Magnitude(1.5 * filter.DataRateHertz), 3);
    }

    [Theory]
    [InlineData(1, 64)]
    [InlineData(3, 64)]
    [InlineData(4, 1000)]
    [InlineData(8, 32)]
    public void A_synchronous_step_settles_in_N_conversions(int n, int m)
    {
        // A step at a conversion's start has passed the N moving averages after N·(M − 1) + 1 samples: reading N is final, N − 1 is not.
        var filter = new SincFilter(n, m, 1, Fmod);
        var readings = filter.StepReadings(n + 2);
        Assert.Equal(n, filter.SettlingConversions);
        Assert.Equal(1, readings[n - 1], 12);
        if (n > 1) Assert.True(readings[n - 2] < 1 - 1e-6, $"reading {n - 1}: {readings[n - 2]}");
        // The first reading of a sinc1 step is the whole step; of a sinc^N the first reading is 1/N! of it for large M
        // (the N-fold convolution of a box's area grows as t^N/N!: elementary).
        if (m >= 1000) Assert.Equal(1.0 / Factorial(n), readings[0], 2);
    }

    [Fact]
    public void A_step_between_conversion_starts_takes_one_conversion_more()
    {
        var filter = new SincFilter(3, 64, 1, Fmod);
        var late = filter.StepReadings(5, delaySamples: 20);
        Assert.True(late[2] < 1 - 1e-6);
        Assert.Equal(1, late[3], 12);
    }

    [Theory]
    [InlineData(1, 1, 2)]
    [InlineData(1, 64, 2)]
    [InlineData(3, 64, 1)]
    [InlineData(4, 37, 1)]
    [InlineData(3, 16, 3)]
    public void The_noise_bandwidth_follows_the_generating_function(int n, int m, int l)
    {
        // Σh² is the centre coefficient of H(z)²; for L = 1 it is Σ_k (−1)^k·C(2N,k)·C(P − kM + 2N − 1, 2N − 1)/M^(2N),
        // P = N(M − 1): the coefficient of z^P in (1 − z^M)^(2N)·(1 − z)^(−2N) (binomial series; elementary, from memory).
        var filter = new SincFilter(n, m, l, Fmod);
        if (l == 1)
        {
            var p = n * (m - 1);
            var sum = 0.0;
            for (var k = 0; k * m <= p; k++)
                sum += (k % 2 == 0 ? 1 : -1) * Binomial(2 * n, k) * Binomial(p - k * m + 2 * n - 1, 2 * n - 1);
            Assert.Equal(Fmod / 2 * sum / Math.Pow(m, 2 * n), filter.NoiseBandwidthHertz, 9);
        }
        else
        {
            // With the averaging stage: ∫₀^(f_mod/2) |H|² df of the closed form by Simpson's rule on 200 000 intervals.
            const int intervals = 200_000;
            var hstep = Fmod / 2 / intervals;
            var integral = 0.0;
            for (var i = 0; i <= intervals; i++)
            {
                var w = i == 0 || i == intervals ? 1 : i % 2 == 1 ? 4 : 2;
                var h = ClosedForm(i * hstep, n, m, l);
                integral += w * h * h;
            }
            integral *= hstep / 3;
            Assert.True(Tolerance.Within(filter.NoiseBandwidthHertz, integral, 1e-9, 0), $"{filter.NoiseBandwidthHertz} against {integral}");
        }
    }

    [Theory]
    [InlineData(1, 0.5)]
    [InlineData(2, 1.0 / 3)]
    [InlineData(3, 11.0 / 40)]
    [InlineData(4, 151.0 / 630)]
    public void For_a_long_decimation_the_noise_bandwidth_is_the_sinc_power_integral_times_the_data_rate(int n, double c)
    {
        // ∫₀^∞ |sin(πx)/(πx)|^(2N) dx = 1/2, 1/3, 11/40, 151/630 for N = 1..4 (from memory; the Eulerian-number
        // integrals of powers of sinc): the noise bandwidth of sinc^N tends to c_N·f_data as M grows.
        var filter = new SincFilter(n, 4096, 1, Fmod);
        Assert.True(Tolerance.Within(filter.NoiseBandwidthHertz, c * filter.DataRateHertz, 1e-4, 0), $"{filter.NoiseBandwidthHertz} against {c * filter.DataRateHertz}");
    }

    [Fact]
    public void Readings_with_reset_start_settled_and_without_it_carry_the_old_channel()
    {
        var filter = new SincFilter(3, 64, 1, Fmod);
        // A new channel at 1 V after an old one at 0 V: with reset the first reading given is already final;
        // without reset the first readings mix in the old channel, as the step response says.
        var reset = filter.Readings(_ => 1.0, _ => 0.0, 3, reset: true);
        Assert.All(reset, r => Assert.Equal(1, r.Value, 12));
        Assert.Equal(3 * 64 / Fmod, reset[0].Seconds, 15);
        var carried = filter.Readings(_ => 1.0, _ => 0.0, 4, reset: false);
        var step = filter.StepReadings(4);
        for (var k = 0; k < 4; k++) Assert.Equal(step[k], carried[k].Value, 12);
    }

    private static double Factorial(int n) => n <= 1 ? 1 : n * Factorial(n - 1);

    private static double Binomial(int n, int k)
    {
        if (k < 0 || k > n) return 0;
        var r = 1.0;
        for (var i = 1; i <= k; i++) r = r * (n - k + i) / i;
        return r;
    }
}
