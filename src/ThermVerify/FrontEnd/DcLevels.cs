using ThermVerify.Design;
using static ThermVerify.FrontEnd.FrontEndNodes;

namespace ThermVerify.FrontEnd;

/// <summary>
/// The DC levels of a design over the check grid, each from its own temperature sweep so that every effect is
/// simulated where it enters the circuit and can be told apart from the others: the pin with the buffer's own errors
/// only (offset and its drift, bias currents, finite gain; no pin leakage, no fixed-resistor tempco), the pin with
/// everything static (the settled pin a first conversion starts from), and, per precharge case, the pin with the
/// average sampling current where a reservoir holds it. The divider node of the full circuit is kept for the sensor's
/// self-heating.
/// </summary>
internal sealed record DcLevels(
    double[] DividerVolts,
    double[]? AfterBufferVolts,
    double[] StaticPinVolts,
    IReadOnlyList<double[]> AveragePinVolts)
{
    /// <summary>
    /// The converter's reference where the circuit makes it, the reference resistor's voltage v(exc) − v(div) from the
    /// sweep with everything static; null for a fixed reference or a ratiometric divider (the converter knows those).
    /// </summary>
    public double[]? ReferenceVolts { get; init; }

    /// <summary>A current source's output voltage (for its compliance); null for a divider.</summary>
    public double[]? SourceVolts { get; init; }

    /// <summary>The settled pin voltage over the reference, the converter's own scale (the pin itself without a simulated reference).</summary>
    public double StaticRatio(int i) => ReferenceVolts is { } r ? StaticPinVolts[i] / r[i] : StaticPinVolts[i];

    /// <summary>
    /// The average sampling current is modelled where a reservoir holds the pin between samples; without one the pin
    /// follows the source between samples and the transient alone tells the sampling error.
    /// </summary>
    public static bool UsesAverageSamplingCurrent(FrontEndDesign design, double? prechargeVolts) =>
        prechargeVolts is not null && design.Filter.ReservoirCapacitorFarads > 0;

    /// <summary>The design with no DC loading: no pin leakage, a fixed resistor without tempco.</summary>
    public static FrontEndDesign WithoutLoading(FrontEndDesign design) => design with
    {
        Adc = design.Adc with { PinLeakageAmperes = 0 },
        Divider = design.Divider is { } d ? d with { FixedTempcoPerKelvin = 0 } : null,
    };

    public static DcLevels Run(FrontEndDesign design, IReadOnlyList<PrechargeCase> cases, IReadOnlyList<double> temperaturesCelsius,
        ICheckEngine? engine = null)
    {
        engine ??= BuiltInEngine.Instance;
        var pinNode = FrontEndCircuit.PinNode(design);
        var source = design.CurrentSource;
        var output = source is null ? null : CurrentSourceCircuit.OutputNode(source);
        var plain = Sweep(engine, design, null, temperaturesCelsius, output is null ? [Divider, pinNode] : [Divider, pinNode, output]);
        var staticPin = plain[1];
        double[]? reference = source?.ReferenceResistorOhms is null ? null : [.. plain[2].Select((v, i) => v - plain[0][i])];
        var afterBuffer = design.Buffer is null ? null : Sweep(engine, WithoutLoading(design), null, temperaturesCelsius, [pinNode])[0];
        var average = cases.Select(c => UsesAverageSamplingCurrent(design, c.Volts)
            ? Sweep(engine, design, c.Volts, temperaturesCelsius, [pinNode])[0]
            : staticPin).ToArray();
        return new DcLevels(plain[0], afterBuffer, staticPin, average) { ReferenceVolts = reference, SourceVolts = output is null ? null : plain[2] };
    }

    /// <summary>
    /// One temperature sweep of the DC circuit. Where the op-amp's offset drifts with the sweep (no board temperature)
    /// the macro-model's offset, a constant, cannot follow it within one sweep; the DC circuit is affine in the offset
    /// (a source in series with the input; the output clamp only flattens it), so a second sweep with the offset
    /// raised by 1 mV gives the simulated pin voltage per volt of offset at every temperature, and the drift D·(T − 25 °C)
    /// is added through it: superposition, exact for the linear stage and zero where the output is clipped.
    /// </summary>
    private static IReadOnlyList<double[]> Sweep(ICheckEngine engine, FrontEndDesign design, double? prechargeVolts,
        IReadOnlyList<double> temperatures, IReadOnlyList<string> nodes)
    {
        var plain = engine.TemperatureSweep(FrontEndCircuit.Dc(design, prechargeVolts), temperatures, nodes);
        if (!BufferStage.DriftFollowsSweep(design)) return plain;
        const double stepVolts = 1e-3;
        var b = design.Buffer!;
        var raised = engine.TemperatureSweep(
            FrontEndCircuit.Dc(design with { Buffer = b with { OffsetVolts = b.OffsetVolts + stepVolts } }, prechargeVolts), temperatures, nodes);
        return [.. nodes.Select((_, n) => temperatures.Select((t, i) =>
            plain[n][i] + (raised[n][i] - plain[n][i]) / stepVolts * b.OffsetDriftVoltsPerKelvin * (t - 25)).ToArray())];
    }
}
