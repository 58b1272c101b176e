using ThermVerify.Design;

namespace ThermVerify.FrontEnd;

/// <summary>
/// The unloaded Wheatstone bridge and its inverse, as hand calculations and firmware assume: two dividers across the
/// same excitation E, the sensor's half giving V+ (<see cref="DividerFormula"/>) and the opposite half V− = E·R_low/(R_high + R_low);
/// the converter reads V_d = V+ − V−. For the sensor on the low side V_d = E·(R_s/(R_s + R_f) − R_low/(R_high + R_low)),
/// the textbook bridge equation (Kirchhoff's laws on two voltage dividers).
/// </summary>
internal static class BridgeFormula
{
    /// <summary>V− of the nominal opposite half (its resistors at 25 °C, as the firmware takes them).</summary>
    public static double NegativeVolts(DividerSpec half, BridgeSpec opposite) =>
        half.ExcitationVolts * opposite.LowOhms / (opposite.HighOhms + opposite.LowOhms);

    public static double OutputVolts(DividerSpec half, BridgeSpec opposite, double sensorOhms) =>
        DividerFormula.OutputVolts(half.SensorSide, half.ExcitationVolts, sensorOhms, half.FixedResistorOhms) - NegativeVolts(half, opposite);

    /// <summary>The sensor resistance a differential voltage stands for: the divider's inverse at V+ = V_d + V−; NaN where no sensor gives it.</summary>
    public static double SensorOhms(DividerSpec half, BridgeSpec opposite, double volts) =>
        DividerFormula.SensorOhms(half.SensorSide, half.ExcitationVolts, volts + NegativeVolts(half, opposite), half.FixedResistorOhms);
}
