using ThermVerify.Design;
using ThermVerify.FrontEnd;

namespace ThermVerify.Tolerances;

/// <summary>
/// choose-fixed on a bridge: the candidate is the sensor half's fixed resistor, and the bridge keeps its balance. The
/// sensor resistance at which the bridge nulls now, R_b (V_d = 0: the sensor half's ratio equals the opposite half's,
/// the bridge equation), stays the null of every candidate: the opposite half keeps its high resistor as declared and its
/// low resistor becomes R_high·q/(1 − q), q the sensor half's ratio at R_b with the candidate (not rounded to a series
/// value: its nominal is what a designer then picks the nearest standard resistor for). Without that a candidate would
/// move the balance and, on a single-ended converter, push the bottom of the range below code 0. Its tolerance and
/// tempco stay as declared. The quarter bridge's sensitivity |dV_d/dT| = E·R_f/(R_s + R_f)²·|dR_s/dT| does not depend on
/// the opposite half, so the slope objective's maximum is at R_f = R_s, as for a divider (common practice).
/// </summary>
internal static class BridgeHalfChoice
{
    public static (double PresentOhms, Func<double, FrontEndDesign> WithFixed) FixedOf(FrontEndDesign design, BridgeSpec bridge)
    {
        var half = design.VoltageDivider;
        var balance = BridgeFormula.SensorOhms(half, bridge, 0);
        if (!(double.IsFinite(balance) && balance > 0))
            throw new DesignException(design.Name, 1, 1, "bridge",
                "choose-fixed keeps the bridge's balance while it changes the sensor half's fixed resistor, and this bridge has no sensor resistance at which it nulls",
                "Give the opposite half a ratio the sensor's half reaches (opposite_low/(opposite_high + opposite_low) between 0 and 1, as the sensor half's ratio over the range).");
        return (half.FixedResistorOhms, ohms =>
        {
            var q = DividerFormula.OutputVolts(half.SensorSide, 1, balance, ohms);
            return design with
            {
                Divider = half with { FixedResistorOhms = ohms },
                Bridge = bridge with { LowOhms = bridge.HighOhms * q / (1 - q) },
            };
        });
    }
}
