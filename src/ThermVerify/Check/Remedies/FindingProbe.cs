using ThermVerify.Design;
using ThermVerify.FrontEnd;

namespace ThermVerify.Check.Remedies;

/// <summary>
/// A finding's own quantity, simulated for a design at one temperature and precharge case, the way the check forms
/// it (the same <see cref="CheckEvaluation"/> over that one temperature): the quantity a remedy search bisects on.
/// Effects are sizes at the pin in volts, against ½ LSB; the over-budget finding is the reported error in K, against
/// the budget. A proof is always the whole check of the changed design; this only finds the value to prove.
/// </summary>
/// <param name="precharge">The precharge case of the reading the finding was worst at (null: the design's cases).</param>
/// <param name="first">Which sample that reading was (null: both).</param>
internal sealed class FindingProbe(string findingId, double celsius, PrechargeCase? precharge, bool? first, CheckOptions options)
{
    public string FindingId { get; } = findingId;
    public double Celsius { get; } = celsius;

    /// <summary>The size of the finding in the changed design (NaN when it cannot be formed: no sensor reading there).</summary>
    public double Measure(FrontEndDesign design)
    {
        if (FindingId == "buffer-noise")
            return Buffer.BufferNoise.Run(design, [Celsius], options.Engine).Worst.RmsVolts;
        if (FindingId is Noise.NoiseFindingRules.NoiseId or Noise.NoiseFindingRules.RampLagId)
        {
            var n = Noise.ReadingNoiseAnalysis.Reading(design, new ClosedFormModel(design), Celsius, SampledFrontEnd(design));
            return FindingId == Noise.NoiseFindingRules.NoiseId ? n.CoveredVolts : n.RampLagVolts;
        }
        if (FindingId == ChargeInjectionRule.Id)
            return Math.Abs(ChargeInjectionRule.OwnShareVolts(design, Celsius, precharge?.Volts, first ?? true, new ClosedFormModel(design).Adc.LsbVolts, options));
        var sampling = FindingId is "settling" or "converter" or FindingRules.OverBudgetId;
        IReadOnlyList<PrechargeCase>? cases = precharge is null ? null : [precharge];
        SampleKinds? kinds = !sampling ? null : first switch { true => SampleKinds.FirstOnly, false => SampleKinds.SteadyOnly, _ => SampleKinds.Both };
        var e = CheckEvaluation.Run(design, [Celsius], options with { MaximumSamplingPoints = 2, Threads = 1 }, cases, kinds,
            noise: FindingId == FindingRules.OverBudgetId);
        var p = e.Points[0];
        return FindingId switch
        {
            FindingRules.OverBudgetId => double.IsFinite(p.ErrorKelvin) ? Math.Abs(p.ErrorKelvin) + p.NoiseKelvin + p.RampLagKelvin : double.PositiveInfinity,
            "settling" => first switch
            {
                true => Math.Abs(e.Offsets.FirstVolts[0][0]),
                false => Math.Abs(e.Offsets.SteadyVolts[0][0]),
                _ => Math.Max(Math.Abs(e.Offsets.FirstVolts[0][0]), Math.Abs(e.Offsets.SteadyVolts[0][0])),
            },
            "reservoir-recovery" => Math.Abs(e.Dc.Base.AveragePinVolts[0][0] - e.Dc.Base.StaticPinVolts[0]),
            "dc-loading" => Math.Abs(p.Simulated.DcLoadingVolts),
            "buffer-static" or "amplifier-static" => Math.Abs(p.Simulated.BufferVolts),
            "self-heating" => Math.Abs(p.Simulated.SelfHeatingVolts),
            "converter" => ConverterShift(e, p),
            // In range or not: the search holds the excess at zero, so any excess reads as beyond every target.
            GainRangeRule.Id => GainRangeRule.ExcessPinVolts(design, e.Dc, 0) > 0 ? double.MaxValue : 0,
            _ => double.NaN,
        };
    }

    private (FrontEndDesign FrontEnd, Noise.ReadingNoiseAnalysis.SampledNoise Noise)? lastSampled;

    /// <summary>
    /// The front end's sampled noise at the probe's temperature, analysed again only when the front end changed (a
    /// search over the averaging or the converter's noise leaves it as it is).
    /// </summary>
    private Noise.ReadingNoiseAnalysis.SampledNoise SampledFrontEnd(FrontEndDesign design)
    {
        var frontEnd = Noise.ReadingNoiseAnalysis.FrontEndOnly(design);
        if (lastSampled is { } last && last.FrontEnd.Equals(frontEnd)) return last.Noise;
        var sampled = Noise.ReadingNoiseAnalysis.Sample(frontEnd, Celsius, options.Engine, density: false);
        lastSampled = (frontEnd, sampled);
        return sampled;
    }

    /// <summary>What the finding is held to: the budget at its temperature for the total, ½ LSB at the pin for an effect.</summary>
    public double Target(FrontEndDesign original) =>
        FindingId == FindingRules.OverBudgetId ? original.Check.BudgetAt(Celsius) : new ClosedFormModel(original).Adc.LsbVolts / 2;

    /// <summary>The largest code shift over the converter's cases (INL of either sign), in volts of the nominal LSB.</summary>
    private static double ConverterShift(CheckEvaluation e, CheckPoint p)
    {
        var q = e.Model.Adc.LsbVolts;
        var worst = 0.0;
        for (var k = 0; k < e.Inputs.CornerCount; k++)
            worst = Math.Max(worst, Math.Abs(e.Inputs.UnroundedCode(0, p.SampleVolts, k) * q - p.SampleVolts));
        return worst;
    }

    /// <summary>Whether a finding has a probe at all (the buffer's loop, headroom and recovery are searched by their own analyses).</summary>
    public static bool Supports(string findingId) =>
        findingId is FindingRules.OverBudgetId or "settling" or "reservoir-recovery" or "dc-loading" or "buffer-static" or "amplifier-static" or "self-heating" or "converter"
            or "buffer-noise" or Noise.NoiseFindingRules.NoiseId or Noise.NoiseFindingRules.RampLagId or GainRangeRule.Id or ChargeInjectionRule.Id;
}
