using ThermVerify.Design;

namespace ThermVerify.FrontEnd;

/// <summary>
/// The closed form of a design's excitation, whichever it is: a netlist's ideal transfer (<see cref="NetlistTransfer"/>), the unloaded divider (<see cref="DividerFormula"/>), a Wheatstone bridge (<see cref="BridgeFormula"/>: the divider less the opposite half, so its slope and the pin's Thevenin resistance are the divider's) or a
/// current through the sensor (<see cref="CurrentFormula"/>). Every closed form of the check asks through here.
/// </summary>
internal static class SensorTransfer
{
    /// <summary>The ideal voltage the converter reads for a sensor resistance.</summary>
    public static double OutputVolts(FrontEndDesign design, double sensorOhms) => design.Netlist is { } n
        ? NetlistTransfer.Of(n).OutputVolts(sensorOhms)
        : design.CurrentSource is { } c
        ? CurrentFormula.OutputVolts(c.CurrentAmperes, sensorOhms)
        : design.Bridge is { } b
        ? BridgeFormula.OutputVolts(design.VoltageDivider, b, sensorOhms)
        : DividerFormula.OutputVolts(design.VoltageDivider.SensorSide, design.VoltageDivider.ExcitationVolts, sensorOhms, design.VoltageDivider.FixedResistorOhms);

    /// <summary>The firmware's inverse: the sensor resistance a voltage stands for; NaN where no sensor gives it.</summary>
    public static double SensorOhms(FrontEndDesign design, double volts) => design.Netlist is { } n
        ? NetlistTransfer.Of(n).SensorOhms(volts)
        : design.CurrentSource is { } c
        ? CurrentFormula.SensorOhms(c.CurrentAmperes, volts)
        : design.Bridge is { } b
        ? BridgeFormula.SensorOhms(design.VoltageDivider, b, volts)
        : DividerFormula.SensorOhms(design.VoltageDivider.SensorSide, design.VoltageDivider.ExcitationVolts, volts, design.VoltageDivider.FixedResistorOhms);

    /// <summary>dV/dR_sensor of the ideal transfer.</summary>
    public static double SlopeVoltsPerOhm(FrontEndDesign design, double sensorOhms) => design.Netlist is { } n
        ? NetlistTransfer.Of(n).SlopeVoltsPerOhm(sensorOhms)
        : design.CurrentSource is { } c
        ? c.CurrentAmperes
        : DividerFormula.SlopeVoltsPerOhm(design.VoltageDivider.SensorSide, design.VoltageDivider.ExcitationVolts, sensorOhms, design.VoltageDivider.FixedResistorOhms);

    /// <summary>
    /// The resistance the sensor's node sees (nominal parts at 25 °C; with leads, two of them in series with the sensor;
    /// 3 wires in a bridge's arms: (R_s + R_L) ∥ (R_f + R_L) through the sense lead's R_L).
    /// </summary>
    public static double TheveninOhms(FrontEndDesign design, double sensorOhms) => design.Netlist is { } n
        ? NetlistTransfer.Of(n).TheveninOhms(sensorOhms)
        : design.CurrentSource is { } c
        ? CurrentFormula.TheveninOhms(c, sensorOhms + 2 * (design.Wiring?.LeadOhms ?? 0), 25)
        : design is { Bridge: not null, Wiring: { Wires: 3 } arms }
        ? DividerFormula.TheveninOhms(sensorOhms + arms.LeadOhms, design.VoltageDivider.FixedResistorOhms + arms.LeadOhms) + arms.LeadOhms
        : DividerFormula.TheveninOhms(sensorOhms, design.VoltageDivider.FixedResistorOhms);
}
