using ThermVerify.Design;
using ThermVerify.FrontEnd;

namespace ThermVerify.Check;

/// <summary>
/// Turns the checked points into findings. Each effect larger than ½ LSB somewhere is a finding; it fails the check
/// where the budget is broken at a temperature where the effect is that large, and warns otherwise. The budget
/// itself is a finding of its own when broken.
/// </summary>
internal static class FindingRules
{
    public static IReadOnlyList<Finding> Evaluate(FrontEndDesign design, ClosedFormModel model, IReadOnlyList<CheckPoint> points, CheckOptions options)
    {
        var halfLsb = model.Adc.LsbVolts / 2;
        var settleVolts = design.Check.SettleLimitLsb * model.Adc.LsbVolts;
        var findings = new List<Finding>();

        var leakage = Effect(points, p => p.Simulated.StaticLoadingVolts, halfLsb);
        if (leakage is { } l)
        {
            var amps = EffectEstimator.LeakageAmps(design, l.Worst.Celsius);
            IReadOnlyList<Remedy> remedies = amps != 0 ? [Remedies.LargestSourceResistance(halfLsb, amps)] : [];
            findings.Add(Make("dc-loading", "DC error at the pin: leakage and bias currents, fixed-resistor drift", l, model, points,
                "pin leakage and bias currents flow through the resistance the pin sees (Ohm's law), and the fixed resistor " +
                "drifts with its tempco away from 25 °C",
                l.Worst.Estimates.StaticVolts, remedies));
        }

        var average = Effect(points, p => p.Simulated.AverageSamplingVolts, halfLsb);
        if (average is { } a)
            findings.Add(Make("reservoir-recovery", "the reservoir does not recover between samples", a, model, points,
                "each acquisition drags the reservoir towards the precharge level; at this sample rate the source cannot refill it " +
                "(average current of a capacitor switched at f_s: R_eq = 1/(f_s·C_sh))",
                a.Worst.Estimates.AverageSamplingVolts,
                [Remedies.HighestSampleRate(design, a.Worst, halfLsb), Remedies.BufferBandwidth(design, PrechargeStep(a.Worst), halfLsb)]));

        var settling = Effect(points, p => p.Simulated.WorstSettlingVolts, halfLsb);
        if (settling is { } s)
        {
            var firstIsWorse = s.Worst.Simulated.FirstIsWorse;
            var remedies = new List<Remedy>();
            if (options.ComputeRemedies)
            {
                var estimate = SinglePoleAcquisitionEstimate(design, s.Worst, halfLsb);
                if (Remedies.ShortestAcquisition(design, s.Worst, halfLsb, settleVolts, estimate, options.Engine) is { } r1) remedies.Add(r1);
                if (Remedies.SmallestReservoir(design, s.Worst, halfLsb, settleVolts, options.Engine) is { } r2) remedies.Add(r2);
            }
            remedies.Add(Remedies.BufferBandwidth(design, PrechargeStep(s.Worst), halfLsb));
            findings.Add(Make("settling", firstIsWorse ? "the first conversion after a precharge does not settle" : "the sampled value does not settle",
                s, model, points,
                design.Filter.ReservoirCapacitorFarads > 0
                    ? "the sampling capacitor shares its charge with the reservoir (ΔV·C_sh/(C_sh + C_ext))"
                    : "the acquisition is too short for the source resistance to charge the sampling capacitor (ΔV·e^(−t/τ))",
                firstIsWorse ? s.Worst.Estimates.FirstConversionVolts : s.Worst.Estimates.SteadySettlingVolts, remedies));
        }

        findings.AddRange(Resolution(design, model, points));
        if (points.Any(p => !p.WithinBudget)) findings.Insert(0, OverBudget(model, points, findings));
        return findings;
    }

    private sealed record EffectSpan(CheckPoint Worst, double From, double To, Func<CheckPoint, double> Volts);

    /// <summary>Where an effect exceeds ½ LSB, and its largest point; null if it never does.</summary>
    private static EffectSpan? Effect(IReadOnlyList<CheckPoint> points, Func<CheckPoint, double> volts, double halfLsb)
    {
        var over = points.Where(p => Math.Abs(volts(p)) > halfLsb).ToList();
        return over.Count == 0 ? null : new EffectSpan(over.MaxBy(p => Math.Abs(volts(p)))!, over[0].Celsius, over[^1].Celsius, volts);
    }

    private static Finding Make(string id, string title, EffectSpan span, ClosedFormModel model, IReadOnlyList<CheckPoint> points,
        string cause, double estimateVolts, IReadOnlyList<Remedy> remedies)
    {
        var halfLsb = model.Adc.LsbVolts / 2;
        var breaks = points.Any(p => !p.WithinBudget && Math.Abs(span.Volts(p)) > halfLsb);
        var volts = span.Volts(span.Worst);
        return new Finding(id, breaks ? Severity.Fail : Severity.Warn, title, span.From, span.To, span.Worst.Celsius,
            volts, volts / model.Adc.LsbVolts, KelvinOf(model, span.Worst, volts), cause, estimateVolts, volts, remedies);
    }

    /// <summary>What a voltage error at the pin does to the temperature, through the exact inverse (no linearisation).</summary>
    private static double KelvinOf(ClosedFormModel model, CheckPoint point, double volts) =>
        model.CelsiusAtVolts(point.IdealVolts + volts) - point.Celsius;

    /// <summary>Quantisation alone: a failure where half an LSB is already more than the budget.</summary>
    private static IEnumerable<Finding> Resolution(FrontEndDesign design, ClosedFormModel model, IReadOnlyList<CheckPoint> points)
    {
        var over = points.Where(p => p.KelvinPerLsb / 2 > p.BudgetKelvin).ToList();
        if (over.Count == 0) yield break;
        var worst = over.MaxBy(p => p.KelvinPerLsb / 2 / p.BudgetKelvin)!;
        var extraBits = (int)Math.Ceiling(Math.Log2(worst.KelvinPerLsb / 2 / worst.BudgetKelvin));
        yield return new Finding("resolution", Severity.Fail, "the converter's resolution alone exceeds the budget",
            over[0].Celsius, over[^1].Celsius, worst.Celsius, model.Adc.LsbVolts / 2, 0.5, worst.KelvinPerLsb / 2,
            $"one LSB is {worst.KelvinPerLsb:0.###} K at {worst.Celsius:0.##} °C, so quantisation alone reaches ±{worst.KelvinPerLsb / 2:0.###} K (IEEE Std 1241: ±Q/2)",
            null, null,
            [new Remedy("adc.bits", $"use at least {design.Adc.Bits + extraBits} bits, or a divider with more slope there", design.Adc.Bits + extraBits, "bits",
                "½ LSB in K against the budget")]);
    }

    private static Finding OverBudget(ClosedFormModel model, IReadOnlyList<CheckPoint> points, IReadOnlyList<Finding> causes)
    {
        var over = points.Where(p => !p.WithinBudget).ToList();
        var worst = over.MaxBy(p => double.IsFinite(p.ErrorKelvin) ? Math.Abs(p.ErrorKelvin) : double.PositiveInfinity)!;
        var volts = worst.WorstSampleVolts - worst.IdealVolts;
        var cause = double.IsFinite(worst.ErrorKelvin)
            ? $"the largest contribution at {worst.Celsius:0.##} °C is {Dominant(worst.Contributions)}"
            : $"at {worst.Celsius:0.##} °C the code {worst.Code} cannot come from a sensor inside its valid range";
        return new Finding("over-budget", Severity.Fail, $"the reported temperature is outside the budget at {over.Count} of {points.Count} points",
            over[0].Celsius, over[^1].Celsius, worst.Celsius, volts, volts / model.Adc.LsbVolts, worst.ErrorKelvin, cause, null, volts,
            [.. causes.Where(f => f.Severity == Severity.Fail).SelectMany(f => f.Remedies).DistinctBy(r => (r.Key, r.Action))]);
    }

    private static string Dominant(ErrorContributions c)
    {
        var parts = new (string Name, double Kelvin)[]
        {
            ("quantisation", c.QuantisationKelvin), ("DC loading", c.DcLoadingKelvin), ("settling", c.SettlingKelvin),
            ("the buffer", c.BufferKelvin), ("the rest", c.RestKelvin),
        };
        var top = parts.MaxBy(p => Math.Abs(p.Kelvin));
        return FormattableString.Invariant($"{top.Name} ({top.Kelvin:+0.###;-0.###} K)");
    }

    /// <summary>The step a sampling capacitor brings to the pin: precharge level minus the pin's DC voltage.</summary>
    private static double PrechargeStep(CheckPoint p) => (p.PrechargeVolts ?? p.DcPinVolts) - p.DcPinVolts;

    /// <summary>t = τ·ln(|ΔV|/ε) with the single-pole τ of <see cref="EffectEstimator"/>.</summary>
    private static double SinglePoleAcquisitionEstimate(FrontEndDesign design, CheckPoint worst, double allowedVolts)
    {
        var adc = design.Adc;
        var tau = worst.Estimates.SourceOhms * (adc.SamplingCapacitanceFarads + adc.PinCapacitanceFarads) + adc.SwitchResistanceOhms * adc.SamplingCapacitanceFarads;
        var step = (worst.PrechargeVolts ?? worst.DcPinVolts) - worst.DcPinVolts;
        return SamplingFormulas.AcquisitionSecondsFor(step * adc.SamplingCapacitanceFarads / (adc.SamplingCapacitanceFarads + adc.PinCapacitanceFarads), allowedVolts, tau);
    }
}
