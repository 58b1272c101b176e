using ThermVerify.Design;
using ThermVerify.Simulation;
using static ThermVerify.Verification.FrontEndNodes;

namespace ThermVerify.Verification;

/// <summary>
/// The temperature sweep of the DC circuit for one precharge case: divider, op-amp output and pin voltages, with
/// and without the average sampling current (so that its share can be reported on its own).
/// </summary>
public sealed record DcSweepCase(
    double? PrechargeVolts,
    double[] DividerVolts,
    double[] BufferVolts,
    double[] StaticPinVolts,
    double[] PinVolts)
{
    /// <summary>
    /// The average sampling current is modelled where a reservoir holds the pin between samples; without one the
    /// pin follows the source between samples and the transient alone tells the sampling error.
    /// </summary>
    public static bool UsesAverageSamplingCurrent(FrontEndDesign design, double? prechargeVolts) =>
        prechargeVolts is not null && design.Filter.ReservoirCapacitorFarads > 0;

    public static DcSweepCase Run(FrontEndDesign design, double? prechargeVolts, IReadOnlyList<double> temperaturesCelsius)
    {
        var plain = DcSweep.Temperature(FrontEndCircuit.Dc(design, null), temperaturesCelsius);
        var divider = plain.Voltage(Divider);
        var buffer = design.Buffer is null ? divider : plain.Voltage(FrontEndCircuit.AmplifierNode(design));
        var pinNode = FrontEndCircuit.PinNode(design);
        var staticPin = plain.Voltage(pinNode);
        var pin = UsesAverageSamplingCurrent(design, prechargeVolts)
            ? DcSweep.Temperature(FrontEndCircuit.Dc(design, prechargeVolts), temperaturesCelsius).Voltage(pinNode)
            : staticPin;
        return new DcSweepCase(prechargeVolts, divider, buffer, staticPin, pin);
    }
}
