using System.Globalization;
using ThermVerify.Design;
using ThermVerify.FrontEnd;
using ThermVerify.Quantities;

namespace ThermVerify.Check;

/// <summary>
/// The multiplexer's charge injection on its own: the check's readings already carry it (every sampling transient
/// injects Q at each window opening, <see cref="ChargeInjection"/>), inside the settling part of the split. Here its
/// own share is simulated at the check's worst temperature, for the reading the check found worst there, as the same
/// sampling run with and without the charge; it is a finding where it moves that sample by more than ½ LSB and fails
/// where its share in K exceeds the budget. The closed form beside it: the charge shared by every capacitance at the
/// pin, ΔV = Q/(C_s + C_pin + C_res), decaying through the source for the acquisition, ΔV·e^(−t_acq/τ) with
/// τ = R·(C_s + C_pin + C_res) (the first conversion); in the steady state Q every period is an average current
/// Q·f_s, Q·f_s·R through the resistance the pin sees (Ohm's law), with up to ΔV of ripple on top.
/// </summary>
internal static class ChargeInjectionRule
{
    public const string Id = "charge-injection";

    public static IEnumerable<Finding> Evaluate(FrontEndDesign design, IReadOnlyList<CheckPoint> points, double lsbVolts, CheckOptions options)
    {
        if (design.Adc.ChargeInjectionCoulombs == 0 || points.Count == 0) yield break;
        var worst = points[ErrorModel.WorstIndex([.. points.Select(p => p.ErrorKelvin)])];
        var simulated = OwnShareVolts(design, worst.Celsius, worst.PrechargeVolts, worst.FirstConversion, lsbVolts, options);
        if (Math.Abs(simulated) <= lsbVolts / 2) yield break;
        var kelvin = simulated / new ClosedFormModel(design).At(worst.Celsius).VoltsPerKelvin;
        var sourceOhms = worst.Estimates.SourceOhms;
        var capacitance = design.Adc.SamplingCapacitanceFarads + design.Adc.PinCapacitanceFarads + FrontEndCircuit.ReservoirFarads(design);
        var step = ChargeInjection.StepVolts(design);
        var first = step * Math.Exp(-design.Adc.AcquisitionTimeSeconds / (sourceOhms * capacitance));
        var steady = ChargeInjection.SteadyVolts(design, sourceOhms);
        var estimate = worst.FirstConversion ? first : steady;
        var severity = Math.Abs(kelvin) > worst.BudgetKelvin ? Severity.Fail : Severity.Warn;
        yield return new Finding(Id, severity, "the multiplexer's charge injection moves the sample by more than ½ LSB",
            worst.Celsius, worst.Celsius, worst.Celsius, simulated, simulated / lsbVolts, kelvin,
            I($"{C(design.Adc.ChargeInjectionCoulombs)} at each window opening, shared by C_s + C_pin + C_res = {F(capacitance)}: ΔV = Q/C = {V(step)}") +
            (worst.FirstConversion
                ? I($", decaying through the {O(sourceOhms)} the pin sees for the acquisition, ΔV·e^(−t_acq/τ) = {V(first)} (first conversion")
                : I($"; every period adds Q, an average current Q·f_s through the {O(sourceOhms)} the pin sees, Q·f_s·R = {V(steady)}, with up to ΔV of ripple on top (steady state")) +
            I($", precharge {worst.Precharge.Name}, at {worst.Celsius:0.##} °C, simulated with and without the charge)"),
            estimate, simulated, []);
    }

    /// <summary>
    /// The injection's own share of one sample: the sampling run at a temperature for one precharge case and sample
    /// (first or steady), with the charge and without it (the bounds at zero, as the check's sampling runs have them).
    /// </summary>
    public static double OwnShareVolts(FrontEndDesign design, double celsius, double? prechargeVolts, bool first, double lsbVolts, CheckOptions options)
    {
        var settle = design.Check.SettleLimitLsb * lsbVolts;
        double Sample(FrontEndDesign d) => first
            ? SamplingRun.FirstSampleVolts(d, celsius, prechargeVolts, settle, options.Engine)
            : SamplingRun.Run(d, celsius, prechargeVolts, settle, cancel: options.Cancel, engine: options.Engine).SteadyVolts;
        var sampled = StaticBounds.Zeroed(design);
        return Sample(sampled) - Sample(sampled with { Adc = sampled.Adc with { ChargeInjectionCoulombs = 0 } });
    }

    private static string V(double volts) => EngineeringFormat.Format(volts, UnitKind.Volt, 4);
    private static string C(double coulombs) => EngineeringFormat.Format(coulombs, UnitKind.Coulomb, 4);
    private static string F(double farads) => EngineeringFormat.Format(farads, UnitKind.Farad, 4);
    private static string O(double ohms) => EngineeringFormat.Format(ohms, UnitKind.Ohm, 4);
    private static string I(FormattableString s) => s.ToString(CultureInfo.InvariantCulture);
}
