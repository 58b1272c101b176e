using System.Globalization;
using ThermVerify.Design;
using ThermVerify.FrontEnd;
using ThermVerify.Quantities;

namespace ThermVerify.Check;

/// <summary>
/// The settling finding of a design that switches its excitation on only to measure (a divider's or a netlist's
/// switch_on_lead), where the first conversion is taken after the switch-on: its title, its cause and its closed form.
/// </summary>
internal static class SwitchOnWords
{
    public const string Title = "the first conversion after the excitation switches on does not settle";

    public static bool Applies(FrontEndDesign design, CheckPoint p) => p.FirstConversion && SwitchOnSettling.Applies(design);

    public static string Cause(FrontEndDesign design, CheckPoint p) =>
        I($"the front end charges from the excitation's switch-on, {EngineeringFormat.Format(SwitchOnSettling.LeadSeconds(design)!.Value, UnitKind.Second, 4)} ") +
        I($"before the acquisition window (switch_on_lead), through the {EngineeringFormat.Format(p.Estimates.SourceOhms, UnitKind.Ohm, 4)} the pin sees into ") +
        I($"{EngineeringFormat.Format(FrontEndCircuit.ReservoirFarads(design), UnitKind.Farad, 4)} at the pin; first-order charging leaves ") +
        I($"−V·e^(−t/τ) at t = lead + t_acq, τ = R·C (common practice; precharge {p.Precharge.Name}, first conversion)");

    /// <summary>
    /// First-order charging from 0 V: the pin's settled level times e^(−t/τ), t the lead and the acquisition, τ the
    /// Thevenin resistance the pin sees times the capacitance from the pin to ground; 0 without a capacitor there.
    /// Exact for one RC; the sampling network and capacitors further back count in the simulation alone.
    /// </summary>
    public static double EstimateVolts(FrontEndDesign design, CheckPoint p)
    {
        var farads = FrontEndCircuit.ReservoirFarads(design);
        if (farads <= 0) return 0;
        var t = SwitchOnSettling.LeadSeconds(design)!.Value + design.Adc.AcquisitionTimeSeconds;
        return -p.StaticPinVolts * Math.Exp(-t / (p.Estimates.SourceOhms * farads));
    }

    private static string I(FormattableString s) => s.ToString(CultureInfo.InvariantCulture);
}
