using System.Globalization;
using ThermVerify.Design;
using ThermVerify.Quantities;

namespace ThermVerify.Check.Noise;

/// <summary>
/// Noise as findings, by the rule every effect follows (docs/methods.md): a finding where it moves the reading at the
/// pin by more than ½ LSB, failing where its own size in K exceeds the budget. Noise is sized as ±k·σ of the reading
/// (k: noise.coverage); the lag on the declared ramp as the ramp rate times the lag of the averaging and the filter.
/// </summary>
internal static class NoiseFindingRules
{
    public const string NoiseId = "noise";
    public const string RampLagId = "ramp-lag";

    public static IEnumerable<Finding> Evaluate(FrontEndDesign design, double lsbVolts, IReadOnlyList<CheckPoint> points)
    {
        var half = lsbVolts / 2;
        var noisy = points.Where(p => p.Noise is { } n && n.CoveredVolts > half).ToList();
        if (noisy.Count > 0)
        {
            var w = noisy.MaxBy(p => p.NoiseKelvin / p.BudgetKelvin)!;
            var n = w.Noise!;
            var top = n.Shares[0];
            var averaging = design.Noise.ReadingsAveraged;
            var needed = (int)Math.Ceiling(Math.Pow(n.Coverage * n.SingleRmsVolts / half, 2));
            yield return new Finding(NoiseId, points.Any(p => p.NoiseKelvin > p.BudgetKelvin) ? Severity.Fail : Severity.Warn,
                I($"noise at ±{n.Coverage:0.##}σ moves the reading by more than ½ LSB"),
                noisy[0].Celsius, noisy[^1].Celsius, w.Celsius, n.CoveredVolts, n.CoveredVolts / lsbVolts, n.CoveredKelvin,
                I($"{n.AveragedRmsVolts * 1e6:0.##} µV rms per reading ({(averaging > 1 ? $"mean of {averaging} conversions" : "one conversion")}), ") +
                I($"±{n.Coverage:0.##}σ = {n.CoveredKelvin * 1e3:0.#} mK at {w.Celsius:0.##} °C; largest source: {Source(top)} {top.RmsVolts * 1e6:0.##} µV rms per conversion") +
                (design.Adc.NoiseDeclared ? "" : I($" (converter noise assumed {DesignDefaults.ConverterNoiseLsb:0.##} LSB rms: declare adc.noise)")) +
                I($"; independent conversions would need a mean of {needed} for ±{n.Coverage:0.##}σ within ½ LSB (σ/√N)"),
                n.Coverage * ClosedFormRms(n, averaging), n.CoveredVolts, []);
        }
        if (design.Noise.RampKelvinPerSecond is not { } rate) yield break;
        var lagging = points.Where(p => p.Noise is { } n && n.RampLagVolts > half).ToList();
        if (lagging.Count == 0) yield break;
        var worst = lagging.MaxBy(p => p.RampLagKelvin / p.BudgetKelvin)!;
        var volts = worst.Noise!.RampLagVolts;
        var lag = worst.RampLagKelvin / rate;
        yield return new Finding(RampLagId, points.Any(p => p.RampLagKelvin > p.BudgetKelvin) ? Severity.Fail : Severity.Warn,
            I($"on a ramp of {rate:0.###} K/s the reading lags by more than ½ LSB"),
            lagging[0].Celsius, lagging[^1].Celsius, worst.Celsius, volts, volts / lsbVolts, worst.RampLagKelvin,
            I($"the reading is {Seconds(lag)} behind: the mean of {design.Noise.ReadingsAveraged} conversions is (N − 1)·T_s/2 old and the filter lags a ramp by its τ (first-order lag); ") +
            I($"{worst.RampLagKelvin * 1e3:0.#} mK (the sensor's own thermal lag comes on top and is not modelled)"),
            volts, null, []);
    }

    /// <summary>
    /// The hand calculation beside the analysis: a passive network at one temperature leaves kT/C_sh on the sampling
    /// capacitor (equipartition), the converter adds its own, and N independent conversions average to σ/√N.
    /// </summary>
    private static double ClosedFormRms(ReadingNoise n, int averaged) =>
        Math.Sqrt((n.KtcRmsVolts * n.KtcRmsVolts + n.ConverterRmsVolts * n.ConverterRmsVolts) / averaged);

    private static string Source(NoiseShare s) => s.Source switch
    {
        "converter" => I($"the converter ({s.Label})"),
        SamplingNoiseCircuit.SwitchResistor => "the sampling switch (kT/C)",
        SamplingNoiseCircuit.NegativeSwitchResistor => "the negative input's sampling switch (kT/C)",
        _ => I($"{s.Source} ({s.Label})"),
    };

    private static string Seconds(double s) => EngineeringFormat.Format(s, UnitKind.Second, 3);
    private static string I(FormattableString s) => s.ToString(CultureInfo.InvariantCulture);
}
