using ThermVerify.Design;
using ThermVerify.FrontEnd;

namespace ThermVerify.Check;

/// <summary>
/// The first-order closed form of each effect the ideal model leaves out, at one temperature: Ohm's law for
/// leakage and bias currents, the switched-capacitor resistance for the average sampling current (Johns &amp;
/// Martin), charge sharing with a reservoir, and single-pole settling without one (the dominant pole from the sum
/// of open-circuit time constants, R_s·(C_sh + C_pin) + R_on·C_sh; exact for C_pin = 0).
/// </summary>
internal static class EffectEstimator
{
    public static EffectEstimates At(FrontEndDesign design, ClosedFormPoint point, double dcPinVolts, double? prechargeVolts)
    {
        var adc = design.Adc;
        var source = SourceOhms(design, point);
        var leakage = -LeakageAmps(design, point.Celsius) * source;
        var divider = design.Divider;
        var driftOhms = divider.FixedResistorOhms * divider.FixedTempcoPerKelvin * ((design.Check.BoardCelsius ?? point.Celsius) - 25);
        // The divider output depends on R_s/(R_s + R_f) only, so dV/dR_f = −(R_s/R_f)·dV/dR_s.
        var drift = (design.Buffer?.Gain ?? 1) * driftOhms * -(point.SensorOhms / divider.FixedResistorOhms) *
                    DividerFormula.SlopeVoltsPerOhm(divider.SensorSide, divider.ExcitationVolts, point.SensorOhms, divider.FixedResistorOhms);
        var bias = design.Buffer is { } b ? -b.BiasCurrentAmperes * point.TheveninOhms * b.Gain : 0;
        var average = DcSweepCase.UsesAverageSamplingCurrent(design, prechargeVolts)
            ? SamplingFormulas.SwitchedCapacitorErrorVolts(prechargeVolts!.Value - point.IdealVolts, source, adc.SampleRateHertz, adc.SamplingCapacitanceFarads)
            : 0;
        if (prechargeVolts is not { } pre) return new EffectEstimates(source, drift, leakage, bias, average, 0, 0);

        var step = pre - dcPinVolts;
        var reservoir = design.Filter.ReservoirCapacitorFarads;
        if (reservoir > 0)
        {
            var kick = SamplingFormulas.KickbackStepVolts(step, adc.SamplingCapacitanceFarads, reservoir + adc.PinCapacitanceFarads);
            return new EffectEstimates(source, drift, leakage, bias, average, kick, kick);
        }
        var shared = SamplingFormulas.KickbackStepVolts(step, adc.SamplingCapacitanceFarads, adc.PinCapacitanceFarads);
        var tau = source * (adc.SamplingCapacitanceFarads + adc.PinCapacitanceFarads) + adc.SwitchResistanceOhms * adc.SamplingCapacitanceFarads;
        var residual = SamplingFormulas.SinglePoleResidualVolts(shared, adc.AcquisitionTimeSeconds, tau);
        return new EffectEstimates(source, drift, leakage, bias, average, residual, residual);
    }

    /// <summary>Resistance the ADC pin sees: the divider's Thevenin resistance (or the buffer, taken as ideal) plus the filter.</summary>
    public static double SourceOhms(FrontEndDesign design, ClosedFormPoint point) =>
        (design.Buffer is { } b ? b.IsolationResistorOhms : point.TheveninOhms) + design.Filter.SeriesResistorOhms;

    /// <summary>Pin leakage at a swept temperature, or at the board temperature when the design fixes one.</summary>
    public static double LeakageAmps(FrontEndDesign design, double sweptCelsius) =>
        design.Adc.PinLeakageAmperesAt(design.Check.BoardCelsius ?? sweptCelsius);
}
