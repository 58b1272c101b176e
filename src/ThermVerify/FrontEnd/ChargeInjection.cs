using ThermVerify.Circuits;
using ThermVerify.Design;
using static ThermVerify.FrontEnd.FrontEndNodes;

namespace ThermVerify.FrontEnd;

/// <summary>
/// The multiplexer's charge injection: a charge Q put into the pin each time the acquisition window opens, simulated
/// as a short current pulse into the pin, Q/t_w for t_w = t_acq/100, one width after the window's opening edge (an edge of its own: ngspice's time step
/// collapsed where the pulse and the sampling switch changed at the same instant), in every period.
/// Why a pulse: the charge must add up window after window (with a last-sample precharge nothing else resets the
/// capacitor), which a current does and a step on the capacitor's plate, undone while the switch is open, does not;
/// the pulse is short beside the window, so the charge is in before the sample settles, and it is a SPICE PULSE
/// source, the same in ngspice's deck. The built-in engine then steps in time instead of propagating exactly (a
/// pulsed source is not piecewise constant between switch edges), and reaches the steady state by extrapolation.
/// </summary>
internal static class ChargeInjection
{
    /// <summary>The pulse's width as a fraction of the acquisition time, and its edges as a fraction of its width.</summary>
    private const double WidthFraction = 0.01, EdgeFraction = 0.01;

    public static void Add(List<Element> elements, FrontEndDesign design, int conversions)
    {
        var adc = design.Adc;
        var period = 1 / adc.SampleRateHertz;
        var width = adc.AcquisitionTimeSeconds * WidthFraction;
        var edge = width * EdgeFraction;
        // The charge of a trapezoid: amplitude·(width + edge), so the amplitude gives exactly Q.
        var amps = adc.ChargeInjectionCoulombs / (width + edge);
        // Positive into the pin: the source drives its current from ground into the pin.
        elements.Add(new CurrentSource(SourceElement, Circuit.Ground, FrontEndCircuit.PinNode(design),
            new PulseWaveform(0, amps, period - adc.AcquisitionTimeSeconds + width, edge, edge, width, period)));
    }

    /// <summary>
    /// The closed form: Q shared by every capacitance at the pin when the window opens, ΔV = Q/(C_s + C_pin + C_res)
    /// (charge conservation).
    /// </summary>
    public static double StepVolts(FrontEndDesign design) =>
        design.Adc.ChargeInjectionCoulombs / (design.Adc.SamplingCapacitanceFarads + design.Adc.PinCapacitanceFarads + FrontEndCircuit.ReservoirFarads(design));

    /// <summary>
    /// The closed form of the steady shift: Q every period is an average current Q·f_s into the pin, which settles
    /// to Q·f_s·R through the resistance the pin sees (Ohm's law).
    /// </summary>
    public static double SteadyVolts(FrontEndDesign design, double sourceOhms) =>
        design.Adc.ChargeInjectionCoulombs * design.Adc.SampleRateHertz * sourceOhms;

    public const string SourceElement = "Iinject";
}
