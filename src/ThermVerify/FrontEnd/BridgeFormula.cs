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
    public static double NegativeVolts(DividerSpec half, BridgeSpec opposite) => NegativeVolts(half.ExcitationVolts, opposite.HighOhms, opposite.LowOhms);

    /// <summary>V− = E·R_low/(R_high + R_low), for any values of the opposite half (a fault analysis's tolerance corners).</summary>
    public static double NegativeVolts(double excitationVolts, double highOhms, double lowOhms) =>
        excitationVolts * lowOhms / (highOhms + lowOhms);

    public static double OutputVolts(DividerSpec half, BridgeSpec opposite, double sensorOhms) =>
        OutputVolts(half.SensorSide, half.ExcitationVolts, half.FixedResistorOhms, opposite, sensorOhms);

    /// <summary>V_d for the sensor's half given by its parts (the firmware model keeps them as numbers, not a <see cref="DividerSpec"/>).</summary>
    public static double OutputVolts(SensorSide side, double excitationVolts, double fixedOhms, BridgeSpec opposite, double sensorOhms) =>
        DividerFormula.OutputVolts(side, excitationVolts, sensorOhms, fixedOhms) - NegativeVolts(excitationVolts, opposite.HighOhms, opposite.LowOhms);

    /// <summary>The sensor resistance a differential voltage stands for: the divider's inverse at V+ = V_d + V−; NaN where no sensor gives it.</summary>
    public static double SensorOhms(DividerSpec half, BridgeSpec opposite, double volts) =>
        SensorOhms(half.SensorSide, half.ExcitationVolts, half.FixedResistorOhms, opposite, volts);

    public static double SensorOhms(SensorSide side, double excitationVolts, double fixedOhms, BridgeSpec opposite, double volts) =>
        DividerFormula.SensorOhms(side, excitationVolts, volts + NegativeVolts(excitationVolts, opposite.HighOhms, opposite.LowOhms), fixedOhms);
}
