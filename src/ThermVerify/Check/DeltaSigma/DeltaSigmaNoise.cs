using System.Globalization;
using ThermVerify.Check.Noise;
using ThermVerify.Design;
using ThermVerify.FrontEnd;
using ThermVerify.FrontEnd.DeltaSigma;
using ThermVerify.Quantities;
using ThermVerify.Simulation;

namespace ThermVerify.Check.DeltaSigma;

/// <summary>
/// The noise of a delta-sigma reading, in the form every check point carries (<see cref="ReadingNoise"/>). The front
/// end's noise density at the pin (the engine's noise analysis: every resistor's Johnson–Nyquist noise at its own
/// temperature) passes the digital filter: σ² = ∫ S(f)·|H(f)|² df, summed on a linear grid of f_data/32 up to 20·f_data,
/// beyond which a sinc filter passes nothing that counts (the grid resolves its lobes between the zeros at k·f_data).
/// The converter's own noise is the noise table's row at the design's data rate and gain (it includes the modulator's
/// sampled kT/C), or adc.noise, or 0.5 LSB assumed; it is independent from reading to reading. The firmware's mean of
/// N readings divides it by N, the front end's part by the correlated factor of its time constant (as for every front
/// end). The lag on a ramp adds the filter's group delay, (L_h − 1)/(2·f_mod) for an impulse response of L_h samples.
/// </summary>
internal static class DeltaSigmaNoise
{
    private const int GridPerDataRate = 32;
    private const int DataRates = 20;

    /// <summary>The converter's own rms noise per reading in volts at the input, and how it was declared.</summary>
    public static (double Volts, string Words, bool Assumed) ConverterNoise(FrontEndDesign design, double lsbVolts)
    {
        var d = design.Adc.DeltaSigma!;
        if (d.TableNoise is { } row)
            return (row.RmsVolts, I($"{EngineeringFormat.Format(row.RmsVolts, UnitKind.Volt, 3)} rms from the noise table at {EngineeringFormat.Format(d.DataRateHertz, UnitKind.Hertz, 4)}, gain {d.Gain:G4}"), false);
        if (design.Adc.NoiseVolts is { } v) return (v, EngineeringFormat.Format(v, UnitKind.Volt, 3) + " rms (declared)", false);
        if (design.Adc.NoiseLsb is { } l) return (l * lsbVolts, I($"{l:0.###} LSB rms (declared)"), false);
        return (DesignDefaults.ConverterNoiseLsb * lsbVolts,
            I($"{DesignDefaults.ConverterNoiseLsb:0.###} LSB rms assumed (the design declares no noise table and no adc.noise)"), true);
    }

    /// <summary>
    /// The frequencies the filtered noise is summed over, and |H|² there (the same at every temperature), from the
    /// filter's stages (<see cref="SincFilter.PowerAt"/>); a filter's grid is made once and kept with it (filters are shared per
    /// spec: <see cref="SincFilter.Of"/>; a remedy's check and every Monte Carlo run ask for the same grid). The arrays
    /// are only read.
    /// </summary>
    public static (double[] Hertz, double[] FilterPower) Grid(SincFilter filter) =>
        Grids.GetValue(filter, f =>
        {
            var step = f.DataRateHertz / GridPerDataRate;
            var hertz = Enumerable.Range(1, GridPerDataRate * DataRates).Select(k => k * step).ToArray();
            return new GridValues(hertz, f.PowerAt(hertz));
        }).Tuple;

    private sealed record GridValues(double[] Hertz, double[] FilterPower)
    {
        public (double[] Hertz, double[] FilterPower) Tuple => (Hertz, FilterPower);
    }

    private static readonly System.Runtime.CompilerServices.ConditionalWeakTable<SincFilter, GridValues> Grids = new();

    /// <summary>The front end's filtered rms noise at the pin at one temperature: ∫ S·|H|² df by the trapezoid rule from 0 (S(0) taken as S at the first point).</summary>
    public static double AnalogRmsVolts(FrontEndDesign design, double celsius, (double[] Hertz, double[] FilterPower) grid)
    {
        var circuit = FrontEndCircuit.Dc(design, null, celsius);
        var own = Noise.SamplingNoiseCircuit.OwnTemperatures(design, circuit);
        var psd = NoiseAnalysis.Run(circuit, FrontEndCircuit.PinNode(design), FrequencySweep.At(grid.Hertz), elementCelsius: own).OutputPsd;
        var sum = psd[0] * grid.FilterPower[0] * grid.Hertz[0]; // 0 .. f₁, |H(0)|² = 1 against |H(f₁)|²: the rectangle below the first point
        for (var i = 1; i < grid.Hertz.Length; i++)
            sum += (psd[i] * grid.FilterPower[i] + psd[i - 1] * grid.FilterPower[i - 1]) / 2 * (grid.Hertz[i] - grid.Hertz[i - 1]);
        return Math.Sqrt(sum);
    }

    public static ReadingNoise At(FrontEndDesign design, ClosedFormModel model, double celsius, (double[] Hertz, double[] FilterPower) grid, SincFilter filter)
    {
        var cf = model.At(celsius);
        var lsb = model.Adc.LsbVolts;
        var (converter, words, _) = ConverterNoise(design, lsb);
        var analog = AnalogRmsVolts(design, celsius, grid);
        var tau = CorrelationSeconds(design, cf);
        var rho = tau > 0 ? Math.Exp(-1 / (filter.DataRateHertz * tau)) : 0;
        var n = design.Noise.ReadingsAveraged;
        var averaged = Math.Sqrt(converter * converter / n + analog * analog * ReadingNoiseAnalysis.CorrelatedFactor(n, rho));
        var lag = design.Noise.RampKelvinPerSecond is { } rate ? rate * LagSeconds(design, filter, tau) : 0;
        return new ReadingNoise(celsius, analog, 0, analog, 0, converter, Math.Sqrt(analog * analog + converter * converter), averaged, rho,
            cf.VoltsPerKelvin, lsb, design.Noise.Coverage, lag,
            [.. new[] { new NoiseShare("front end", "resistors' thermal noise through the digital filter", analog), new NoiseShare("converter", words, converter) }
                .OrderByDescending(s => s.RmsVolts)], []);
    }

    /// <summary>R_source·(C_res + C_pin): how long the front end's own noise stays correlated.</summary>
    public static double CorrelationSeconds(FrontEndDesign design, ClosedFormPoint cf) =>
        InputLoading.SourceOhms(design, cf) * (design.Filter.ReservoirCapacitorFarads + design.Adc.PinCapacitanceFarads);

    /// <summary>The mean of N readings is (N − 1)/(2·f_data) old, the filter's group delay and the RC's τ come on top.</summary>
    public static double LagSeconds(FrontEndDesign design, SincFilter filter, double tauSeconds) =>
        (design.Noise.ReadingsAveraged - 1) / (2 * filter.DataRateHertz) + (filter.ImpulseResponse.Count - 1) / (2 * filter.ModulatorRateHertz) + tauSeconds;

    public static NoiseSummary Summary(FrontEndDesign design, ClosedFormModel model, IReadOnlyList<ReadingNoise> points, SincFilter filter)
    {
        var worst = points.MaxBy(p => p.CoveredKelvin)!;
        var tau = CorrelationSeconds(design, model.At(worst.Celsius));
        var n = design.Noise.ReadingsAveraged;
        var (_, words, assumed) = ConverterNoise(design, model.Adc.LsbVolts);
        var method = I($"noise analysis (adjoint) at the pin, each resistor at its own temperature, through the digital filter's |H(f)|² ") +
                     I($"(sinc{filter.Order}{(filter.AverageLength > 1 ? I($" and a mean of {filter.AverageLength}") : "")}, noise bandwidth {Hz(filter.NoiseBandwidthHertz)}) ") +
                     I($"up to {Hz(DataRates * filter.DataRateHertz)}; the converter's noise {words}; ") +
                     (n > 1 ? I($"the mean of {n} readings; ") : "one reading per value; ") +
                     I($"counted in the budget as ±{design.Noise.Coverage:0.##}σ");
        return new NoiseSummary(points, 0, DataRates * filter.DataRateHertz, filter.NoiseBandwidthHertz, words, assumed, n, n / filter.DataRateHertz,
            tau, 1 / ReadingNoiseAnalysis.CorrelatedFactor(n, worst.Correlation), design.Noise.RampKelvinPerSecond, LagSeconds(design, filter, tau), method)
        {
            Band = I($"the front end's density at the pin times the digital filter's |H(f)|², summed up to {Hz(DataRates * filter.DataRateHertz)}; the filter's noise bandwidth is {Hz(filter.NoiseBandwidthHertz)} ((f_mod/2)·Σh², Parseval)"),
            SampledKtc = false,
        };
    }

    private static string Hz(double f) => EngineeringFormat.Format(f, UnitKind.Hertz, 3);
    private static string I(FormattableString s) => s.ToString(CultureInfo.InvariantCulture);
}
