using ThermVerify.Check.Buffer;
using ThermVerify.Design;
using ThermVerify.FrontEnd;

namespace ThermVerify.Check;

/// <summary>
/// The first-order closed form of each effect the ideal model leaves out, at one temperature: Ohm's law for leakage
/// and bias currents, the fixed resistor's tempco through the divider's slope (a bridge's opposite half through its own
/// ratio, which the converter reads with the opposite sign), the buffer's offset with its drift,
/// the switched-capacitor resistance for the average sampling current (Johns &amp; Martin), charge sharing with a
/// reservoir (the first conversion from the settled pin; the steady state from the sawtooth the reservoir settles into,
/// <see cref="SamplingFormulas.SteadySampleVolts"/>, against the pin with the average sampling current), and
/// single-pole settling without one (the dominant pole from the sum of open-circuit time constants,
/// R_s·(C_sh + C_pin) + R_on·C_sh; exact for C_pin = 0).
/// </summary>
internal static class EffectEstimator
{
    public static EffectEstimates At(FrontEndDesign design, ClosedFormPoint point, double staticPinVolts, double averagePinVolts,
        double? prechargeVolts, double selfHeatingVolts)
    {
        var adc = design.Adc;
        var source = SourceOhms(design, point);
        var leakage = -PinCurrentAmps(design, point.Celsius) * source;
        var (drift, excitation, leads) = (0.0, 0.0, 0.0);
        if (design.Divider is { } divider)
        {
            var driftOhms = divider.FixedResistorOhms * divider.FixedTempcoPerKelvin * ((design.Check.BoardCelsius ?? point.Celsius) - 25);
            // The divider output depends on R_s/(R_s + R_f) only, so dV/dR_f = −(R_s/R_f)·dV/dR_s.
            drift = design.StageGain * driftOhms * -(point.SensorOhms / divider.FixedResistorOhms) *
                    DividerFormula.SlopeVoltsPerOhm(divider.SensorSide, divider.ExcitationVolts, point.SensorOhms, divider.FixedResistorOhms);
            leads = DividerLeadVolts(design, divider, point);
            if (design.Bridge is { } bridge)
            {
                drift -= design.StageGain * divider.ExcitationVolts * (bridge.RatioAt(design.Check.BoardCelsius ?? point.Celsius) - bridge.RatioAt(25));
                // A differential input's negative leakage pulls the second output down through R_high ∥ R_low (Ohm's law): read as a rise.
                if (adc.NegativeInput is not null)
                    leakage += adc.NegativeLeakageAmperesAt(design.Check.BoardCelsius ?? point.Celsius) * bridge.HighOhms * bridge.LowOhms / (bridge.HighOhms + bridge.LowOhms);
            }
        }
        else if (design.Netlist is { } netlist)
        {
            drift = NetlistTransfer.Of(netlist).PartDriftVolts(point.SensorOhms, design.Check.BoardCelsius ?? point.Celsius);
            // A differential input: both pins' leakage through the netlist's transresistances (NetlistTransfer).
            if (netlist.NegativePinNode is not null && adc.NegativeInput is not null)
                leakage = NetlistTransfer.Of(netlist).LeakageVolts(point.SensorOhms, PinCurrentAmps(design, point.Celsius),
                    adc.NegativeLeakageAmperesAt(design.Check.BoardCelsius ?? point.Celsius));
        }
        else
            (leakage, excitation, leads) = CurrentLoading(design, point);
        var (offset, bias) = design.Amplifier is not null ? AmplifierErrors(design, point)
            : design.Buffer is null ? (0.0, 0.0) : BufferStaticErrors.At(design, point) is var s ? (s.OffsetVolts + s.DriftVolts, s.BiasVolts) : default;
        var average = DcLevels.UsesAverageSamplingCurrent(design, prechargeVolts)
            ? SamplingFormulas.SwitchedCapacitorErrorVolts(prechargeVolts!.Value - point.IdealVolts, source, adc.SampleRateHertz, adc.SamplingCapacitanceFarads)
            : 0;
        EffectEstimates Make(double first, double steady) =>
            new(source, drift, leakage, offset, bias, average, first, steady, selfHeatingVolts)
            {
                ExcitationVolts = excitation, LeadVolts = leads,
                ClampVolts = ProtectionEstimate.ClampVolts(design, point, staticPinVolts, source),
                InsulationVolts = ProtectionEstimate.InsulationVolts(design, point),
                InputLoadVolts = DeltaSigmaInputLoadVolts(design, point, source),
            };
        if (prechargeVolts is not { } pre) return Make(0, 0);

        var reservoir = FrontEndCircuit.ReservoirFarads(design);
        if (reservoir > 0)
        {
            var external = reservoir + adc.PinCapacitanceFarads;
            var steady = SamplingFormulas.SteadySampleVolts(staticPinVolts, pre, adc.SamplingCapacitanceFarads, external,
                source * external, 1 / adc.SampleRateHertz) - averagePinVolts;
            return Make(SamplingFormulas.KickbackStepVolts(pre - staticPinVolts, adc.SamplingCapacitanceFarads, external), steady);
        }
        var tau = SinglePoleTauSeconds(design, source);
        double Residual(double from) => SamplingFormulas.SinglePoleResidualVolts(
            SamplingFormulas.KickbackStepVolts(pre - from, adc.SamplingCapacitanceFarads, adc.PinCapacitanceFarads), adc.AcquisitionTimeSeconds, tau);
        return Make(Residual(staticPinVolts), Residual(averagePinVolts));
    }

    /// <summary>
    /// A current excitation's pin error on the converter's scale, from the network solved by hand
    /// (<see cref="CurrentFormula.Network"/>), over the reference where a reference resistor makes it (times the nominal
    /// I·R_ref). Split in three that add up exactly: the excitation's own part (no leads, no leakage, against I·R_s), what
    /// the leakage adds to it, and what the leads add to that.
    /// </summary>
    private static (double LeakageVolts, double ExcitationVolts, double LeadVolts) CurrentLoading(FrontEndDesign design, ClosedFormPoint point)
    {
        var nominal = design.CurrentSource!.NominalReferenceVolts;
        var board = design.Check.BoardCelsius ?? point.Celsius;
        var drawn = PinCurrentAmps(design, point.Celsius);
        double Read(double amperes, bool leads)
        {
            var n = CurrentFormula.Network(design, point.SensorOhms, amperes, board, leads);
            return nominal is { } v ? n.PinVolts * v / n.ReferenceVolts : n.PinVolts;
        }
        var bare = Read(0, false);
        var leaking = Read(drawn, false);
        return (leaking - bare, bare - point.IdealVolts, Read(drawn, true) - leaking);
    }

    /// <summary>
    /// A delta-sigma converter's input through the resistance the pin sees: unbuffered, R_eq = 1/(f_mod·C) to ground
    /// divides the pin, −V·R_s/(R_s + R_eq) (Johns &amp; Martin); buffered, its input current, −I_in·R_s (Ohm's law).
    /// </summary>
    private static double DeltaSigmaInputLoadVolts(FrontEndDesign design, ClosedFormPoint point, double sourceOhms) =>
        design.Adc.DeltaSigma is { } d
            ? FrontEnd.DeltaSigma.InputLoading.ClosedFormShiftVolts(d, point.IdealVolts / design.Adc.ProgrammableGain, sourceOhms)
            : 0;

    /// <summary>
    /// 2 wires to a divider's sensor: the divider with R_s + 2·R_L against R_s, times the buffer's gain; 3 wires in a
    /// bridge: a lead in each arm (<see cref="BridgeArmLeads"/>) against none, times the amplifier's gain.
    /// </summary>
    private static double DividerLeadVolts(FrontEndDesign design, DividerSpec divider, ClosedFormPoint point)
    {
        if (design.Wiring is not { } w) return 0;
        var at = w.LeadCelsius ?? design.Check.BoardCelsius ?? point.Celsius;
        var leads = 2 * w.LeadOhmsAt(at);
        double Out(double sensorOhms) => DividerFormula.OutputVolts(divider.SensorSide, divider.ExcitationVolts, sensorOhms, divider.FixedResistorOhms);
        if (w.Wires == 3)
            return design.StageGain * (BridgeArmLeads.PositiveVolts(divider.SensorSide, divider.ExcitationVolts, point.SensorOhms, divider.FixedResistorOhms,
                (w with { LeadOhms = Math.Max(w.LeadOhms, 1e-3) }).LeadOhmsAt(at), w.LeadMismatch) - Out(point.SensorOhms));
        return design.StageGain * (Out(point.SensorOhms + leads) - Out(point.SensorOhms));
    }

    /// <summary>The dominant time constant of the acquisition without a reservoir: R_s·(C_sh + C_pin) + R_on·C_sh.</summary>
    public static double SinglePoleTauSeconds(FrontEndDesign design, double sourceOhms) =>
        sourceOhms * (design.Adc.SamplingCapacitanceFarads + design.Adc.PinCapacitanceFarads) + design.Adc.SwitchResistanceOhms * design.Adc.SamplingCapacitanceFarads;

    /// <summary>Resistance the ADC pin sees: the divider's Thevenin resistance (or the buffer, taken as ideal) plus the filter.</summary>
    public static double SourceOhms(FrontEndDesign design, ClosedFormPoint point) =>
        (design.Amplifier is not null ? 0 : design.Buffer is { } b ? b.IsolationResistorOhms : point.TheveninOhms) + design.Filter.SeriesResistorOhms;

    /// <summary>
    /// An amplifier's own errors at the output, in closed form (<see cref="AmplifierStage.OutputVolts"/> against the ideal
    /// G·V_d on the unloaded bridge): offset with drift, gain error and common mode together, and the bias currents,
    /// which draw I_b through each output's Thevenin resistance (R_s ∥ R_f and R_high ∥ R_low; Ohm's law).
    /// </summary>
    private static (double OffsetVolts, double BiasVolts) AmplifierErrors(FrontEndDesign design, ClosedFormPoint point)
    {
        var a = design.Amplifier!;
        var half = design.VoltageDivider;
        var bridge = design.Bridge!;
        var board = design.Check.BoardCelsius ?? point.Celsius;
        var positive = DividerFormula.OutputVolts(half.SensorSide, half.ExcitationVolts, point.SensorOhms, half.FixedResistorOhms);
        var negative = BridgeFormula.NegativeVolts(half, bridge);
        var offset = AmplifierStage.OutputVolts(a, positive, negative, board) - a.Gain * (positive - negative);
        var theveninPositive = DividerFormula.TheveninOhms(point.SensorOhms, half.FixedResistorOhms);
        var theveninNegative = bridge.HighOhms * bridge.LowOhms / (bridge.HighOhms + bridge.LowOhms);
        var bias = -a.Gain * (1 + a.GainError) * a.BiasCurrentAmperes * (theveninPositive - theveninNegative);
        return (offset, bias);
    }

    /// <summary>Pin leakage at a swept temperature, or at the board temperature when the design fixes one.</summary>
    public static double LeakageAmps(FrontEndDesign design, double sweptCelsius) =>
        design.Adc.PinLeakageAmperesAt(design.Check.BoardCelsius ?? sweptCelsius);

    /// <summary>Every DC current the converter's side draws from the pin: its leakage and the gain stage's input current.</summary>
    public static double PinCurrentAmps(FrontEndDesign design, double sweptCelsius) =>
        LeakageAmps(design, sweptCelsius) + (design.Adc.GainStage?.InputCurrentAmperes ?? 0);
}
