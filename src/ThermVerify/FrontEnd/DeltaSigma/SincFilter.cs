using System.Numerics;
using ThermVerify.Design;

namespace ThermVerify.FrontEnd.DeltaSigma;

/// <summary>
/// A delta-sigma converter's digital filter, built from its definition: N cascaded moving averages of M modulator
/// samples (sinc^N), optionally followed by the mean of L of its decimated outputs (an averaging stage), at the
/// modulator rate f_mod. Everything here is computed from the impulse response h[n] so built, never from the closed
/// forms (which the tests hold it to): the response H(f) = Σ h[n]·e^(−j2πfn/f_mod), the step response Σ_{m≤n} h[m],
/// the noise bandwidth (f_mod/2)·Σh[n]² (Parseval) and the filter's output for any input sampled at f_mod.
/// A reading is the filter's output at the end of a conversion; conversion k (1, 2, ...) ends at modulator sample
/// k·M·L − 1 after the filter starts (a reset, or a step synchronous with a conversion).
/// </summary>
internal sealed class SincFilter
{
    private readonly double[] _impulse;

    public SincFilter(int order, int decimation, int averageLength, double modulatorRateHertz)
    {
        if (order < 1 || decimation < 1 || averageLength < 1 || !(modulatorRateHertz > 0))
            throw new ArgumentException("A sinc filter needs an order, a decimation and an averaging length of at least 1 and a positive modulator rate.");
        Order = order;
        Decimation = decimation;
        AverageLength = averageLength;
        ModulatorRateHertz = modulatorRateHertz;
        _impulse = Build(order, decimation, averageLength);
    }

    /// <summary>
    /// The filter of a converter. Filters are immutable, and a Monte Carlo unit, a remedy's check and each temperature
    /// ask for the same few again and again: each is built once (a sinc3 at 20 Hz from 256 kHz is 38,398 taps, three
    /// arrays of that length to build), and the cache is emptied should a run ever ask for very many.
    /// </summary>
    public static SincFilter Of(DeltaSigmaSpec spec)
    {
        var key = (spec.FilterOrder, spec.Decimation, spec.AverageLength, spec.ModulatorRateHertz);
        if (Built.TryGetValue(key, out var filter)) return filter;
        if (Built.Count >= 64) Built.Clear();
        return Built.GetOrAdd(key, k => new SincFilter(k.FilterOrder, k.Decimation, k.AverageLength, k.ModulatorRateHertz));
    }

    private static readonly System.Collections.Concurrent.ConcurrentDictionary<(int FilterOrder, int Decimation, int AverageLength, double ModulatorRateHertz), SincFilter> Built = new();

    public int Order { get; }
    public int Decimation { get; }
    public int AverageLength { get; }
    public double ModulatorRateHertz { get; }

    /// <summary>Modulator samples per reading: M·L.</summary>
    public int SamplesPerReading => Decimation * AverageLength;

    public double DataRateHertz => ModulatorRateHertz / SamplesPerReading;

    public double ConversionSeconds => 1 / DataRateHertz;

    /// <summary>h[n] at the modulator rate, summing to 1 (unity gain at DC).</summary>
    public IReadOnlyList<double> ImpulseResponse => _impulse;

    /// <summary>
    /// N moving averages of M, each applied as a running sum (exact in integers before the one scaling), then the mean
    /// of L outputs M apart.
    /// </summary>
    private static double[] Build(int order, int m, int l)
    {
        var h = new double[] { 1 };
        for (var stage = 0; stage < order; stage++)
            h = MovingSum(h, m, 1);
        if (l > 1) h = MovingSum(h, l, m);
        var scale = Math.Pow(m, order) * l;
        for (var i = 0; i < h.Length; i++) h[i] /= scale;
        return h;
    }

    /// <summary>y[n] = Σ_{k=0}^{count−1} x[n − k·spacing].</summary>
    private static double[] MovingSum(double[] x, int count, int spacing)
    {
        var y = new double[x.Length + (count - 1) * spacing];
        for (var n = 0; n < y.Length; n++)
        {
            var sum = n < x.Length ? x[n] : 0;
            if (n >= spacing) sum += y[n - spacing];
            var drop = n - count * spacing;
            if (drop >= 0 && drop < x.Length) sum -= x[drop];
            y[n] = sum;
        }
        return y;
    }

    /// <summary>H(f), the discrete-time Fourier transform of h at the modulator rate.</summary>
    public Complex Response(double hertz)
    {
        var w = 2 * Math.PI * hertz / ModulatorRateHertz;
        // e^(−jwn) by a rotating phasor, renormalised now and then so its length stays 1 over millions of steps.
        var step = new Complex(Math.Cos(w), -Math.Sin(w));
        var phasor = Complex.One;
        var sum = Complex.Zero;
        for (var n = 0; n < _impulse.Length; n++)
        {
            sum += _impulse[n] * phasor;
            phasor *= step;
            if ((n & 1023) == 1023) phasor = Complex.FromPolarCoordinates(1, -w * (n + 1));
        }
        return sum;
    }

    public double Magnitude(double hertz) => Response(hertz).Magnitude;

    /// <summary>
    /// |H(f)|² at many frequencies (the noise integral's grid), from the filter's stages rather than its whole impulse
    /// response: a cascade's response is the product of its stages' (the convolution theorem), so H(f) = A_M(f)^N·A_L(f)
    /// with A_M = (1/M)·Σ_(a&lt;M) e^(−jωa) and the mean A_L = (1/L)·Σ_(l&lt;L) e^(−jωlM), each summed phasor by phasor
    /// as <see cref="Response"/> sums h: M + L terms a frequency instead of N(M − 1) + (L − 1)M + 1.
    /// </summary>
    public double[] PowerAt(IReadOnlyList<double> hertz)
    {
        var power = new double[hertz.Count];
        for (var i = 0; i < power.Length; i++)
        {
            var w = 2 * Math.PI * hertz[i] / ModulatorRateHertz;
            var box = Phasors(w, Decimation, 1) / Decimation;
            var mean = Phasors(w, AverageLength, Decimation) / AverageLength;
            power[i] = Math.Pow(box.Magnitude, 2 * Order) * Math.Pow(mean.Magnitude, 2);
        }
        return power;
    }

    /// <summary>Σ_(a&lt;count) e^(−jω·a·spacing), by a rotating phasor renormalised now and then (as <see cref="Response"/>).</summary>
    private static Complex Phasors(double w, int count, int spacing)
    {
        var step = Complex.FromPolarCoordinates(1, -w * spacing);
        var phasor = Complex.One;
        var sum = Complex.Zero;
        for (var a = 0; a < count; a++)
        {
            sum += phasor;
            phasor *= step;
            if ((a & 1023) == 1023) phasor = Complex.FromPolarCoordinates(1, -w * spacing * (a + 1));
        }
        return sum;
    }

    /// <summary>The rejection at a frequency in dB (positive: attenuated); infinite at an exact zero of the response.</summary>
    public double RejectionDecibels(double hertz) => -20 * Math.Log10(Magnitude(hertz));

    /// <summary>The one-sided noise bandwidth: ∫₀^(f_mod/2) |H|² df = (f_mod/2)·Σh² (Parseval), for white noise at the modulator's samples.</summary>
    public double NoiseBandwidthHertz => ModulatorRateHertz / 2 * _impulse.Sum(v => v * v);

    /// <summary>The step response Σ_{m≤n} h[m] at modulator sample n (1 from the end of the impulse response on).</summary>
    public double StepAt(long n)
    {
        if (n < 0) return 0;
        return Cumulative[(int)Math.Min(n, _impulse.Length - 1)];
    }

    /// <summary>Σ_{m≤n} h[m] for every n of the impulse response, summed in order once (as a sum tap by tap rounds).</summary>
    private double[] Cumulative => _cumulative ??= BuildCumulative(_impulse);

    private double[]? _cumulative;

    private static double[] BuildCumulative(double[] h)
    {
        var c = new double[h.Length];
        var sum = 0.0;
        for (var i = 0; i < h.Length; i++) c[i] = sum += h[i];
        return c;
    }

    /// <summary>The step response at the end of conversions 1..count after a step at the filter's start (synchronous, or a reset).</summary>
    public double[] StepReadings(int count, int delaySamples = 0) =>
        [.. Enumerable.Range(1, count).Select(k => StepAt((long)k * SamplesPerReading - 1 - delaySamples))];

    /// <summary>
    /// The conversions after which a step has passed wholly through the filter: the impulse response is
    /// N(M − 1) + (L − 1)M + 1 samples long, so this is its length over M·L, rounded up.
    /// </summary>
    public int SettlingConversions => (int)Math.Ceiling((double)_impulse.Length / SamplesPerReading - 1e-12);

    /// <summary>
    /// The readings of an input sampled at the modulator rate: reading k is Σ h[j]·x[n_k − j] at the end of conversion
    /// k, n_k = k·M·L − 1 samples after the filter started. <paramref name="history"/> gives the input before the start
    /// (what a filter without reset still holds); with a reset the filter's memory is zero before the start, and
    /// the converter gives no reading until the filter has filled: <paramref name="reset"/> skips the readings the
    /// filter has not yet filled (the first reading is the one after N conversions).
    /// </summary>
    public IReadOnlyList<FilterReading> Readings(Func<long, double> input, Func<long, double> history, int count, bool reset)
    {
        var skip = reset ? SettlingConversions - 1 : 0;
        var list = new List<FilterReading>(count);
        for (var k = 1 + skip; list.Count < count; k++)
        {
            var end = (long)k * SamplesPerReading - 1;
            var sum = 0.0;
            for (var j = 0; j < _impulse.Length; j++)
            {
                var n = end - j;
                sum += _impulse[j] * (n >= 0 ? input(n) : reset ? 0 : history(n));
            }
            list.Add(new FilterReading(list.Count + 1, (end + 1) / ModulatorRateHertz, sum));
        }
        return list;
    }
}

/// <summary>One reading of the filter: its number after the start (1 is the first the converter gives), when it is ready, its value.</summary>
public sealed record FilterReading(int Number, double Seconds, double Value);
