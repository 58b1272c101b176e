using ThermVerify.Design;
using static ThermVerify.FrontEnd.FrontEndNodes;

namespace ThermVerify.FrontEnd;

/// <summary>
/// The temperature sweep of the DC circuit for one precharge case: divider, op-amp output and pin voltages, with
/// and without the average sampling current (so that its share can be reported on its own).
/// </summary>
internal sealed record DcSweepCase(
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

    public static DcSweepCase Run(FrontEndDesign design, double? prechargeVolts, IReadOnlyList<double> temperaturesCelsius,
        ICheckEngine? engine = null)
    {
        engine ??= BuiltInEngine.Instance;
        var pinNode = FrontEndCircuit.PinNode(design);
        var plain = engine.TemperatureSweep(FrontEndCircuit.Dc(design, null), temperaturesCelsius,
            design.Buffer is null ? [Divider, pinNode] : [Divider, FrontEndCircuit.AmplifierNode(design), pinNode]);
        var divider = plain[0];
        var buffer = design.Buffer is null ? divider : plain[1];
        var staticPin = plain[^1];
        var pin = UsesAverageSamplingCurrent(design, prechargeVolts)
            ? engine.TemperatureSweep(FrontEndCircuit.Dc(design, prechargeVolts), temperaturesCelsius, [pinNode])[0]
            : staticPin;
        return new DcSweepCase(prechargeVolts, divider, buffer, staticPin, pin);
    }
}
