using ThermVerify.Circuits;
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

    /// <summary>The converter's negative input where the wiring puts it on a lead (3 or 4 wires) or a bridge's opposite half; null: ground.</summary>
    public double[]? NegativeInputVolts { get; init; }

    /// <summary>A bridge's second output (the opposite midpoint); null without a bridge.</summary>
    public double[]? SecondOutputVolts { get; init; }

    /// <summary>An amplifier's output; null without one.</summary>
    public double[]? AmplifierOutputVolts { get; init; }

    /// <summary>The converter's negative input at point <paramref name="i"/>.</summary>
    public double NegativeAt(int i) => NegativeInputVolts?[i] ?? 0;

    /// <summary>
    /// The level a sample settles to, first conversion: the settled pin, less the negative input where the converter
    /// samples it too (a differential input, whose samples are V+ − V−).
    /// </summary>
    public double StaticSampleLevel(FrontEndDesign design, int i) =>
        StaticPinVolts[i] - (SamplingRun.SamplesNegativeInput(design) ? NegativeAt(i) : 0);

    /// <summary>The same for the steady state: the pin with the average sampling current of precharge case <paramref name="c"/>.</summary>
    public double AverageSampleLevel(FrontEndDesign design, int c, int i) =>
        AveragePinVolts[c][i] - (SamplingRun.SamplesNegativeInput(design) ? NegativeAt(i) : 0);

    /// <summary>What the converter converts, over the reference where the circuit makes it: its own scale.</summary>
    public double StaticRatio(int i) => (StaticPinVolts[i] - NegativeAt(i)) / (ReferenceVolts?[i] ?? 1);

    /// <summary>
    /// The average sampling current is modelled where a reservoir holds the pin between samples; without one the pin
    /// follows the source between samples and the transient alone tells the sampling error.
    /// </summary>
    public static bool UsesAverageSamplingCurrent(FrontEndDesign design, double? prechargeVolts) =>
        prechargeVolts is not null && FrontEndCircuit.ReservoirFarads(design) > 0;

    /// <summary>The design with no DC loading: no pin or clamp leakage, no insulation leakage, a fixed resistor without tempco.</summary>
    public static FrontEndDesign WithoutLoading(FrontEndDesign design) => design with
    {
        Adc = design.Adc with { PinLeakageAmperes = 0 },
        Protection = null,
        Divider = design.Divider is { } d ? d with { FixedTempcoPerKelvin = 0 } : null,
        Bridge = design.Bridge is { } b ? b with { HighTempcoPerKelvin = 0, LowTempcoPerKelvin = 0 } : null,
    };

    public static DcLevels Run(FrontEndDesign design, IReadOnlyList<PrechargeCase> cases, IReadOnlyList<double> temperaturesCelsius,
        ICheckEngine? engine = null)
    {
        engine ??= BuiltInEngine.Instance;
        var pinNode = FrontEndCircuit.PinNode(design);
        var source = design.CurrentSource;
        if (design.Netlist is not null) return RunNetlist(design, cases, temperaturesCelsius, engine, pinNode);
        if (source is not null) return RunCurrent(design, cases, temperaturesCelsius, engine, pinNode);
        var bridge = design.Bridge is not null;
        var amplifier = design.Amplifier is not null;
        var plain = Sweep(engine, design, null, temperaturesCelsius,
            bridge ? amplifier ? [Divider, pinNode, BridgeNegative, AmplifierOutput] : [Divider, pinNode, BridgeNegative] : [Divider, pinNode]);
        var staticPin = plain[1];
        var afterBuffer = design.Buffer is null && !amplifier ? null : Sweep(engine, WithoutLoading(design), null, temperaturesCelsius, [pinNode])[0];
        var average = cases.Select(c => UsesAverageSamplingCurrent(design, c.Volts)
            ? Sweep(engine, design, c.Volts, temperaturesCelsius, [pinNode])[0]
            : staticPin).ToArray();
        // A bridge: the converter's negative input is the opposite half's midpoint, from the same sweep.
        // Behind an amplifier the converter reads its single output against ground; the bridge's second output and the
        // amplifier's output are kept for its common-mode and output-range findings.
        return new DcLevels(plain[0], afterBuffer, staticPin, average)
        {
            NegativeInputVolts = bridge && !amplifier ? plain[2] : null,
            SecondOutputVolts = bridge ? plain[2] : null,
            AmplifierOutputVolts = amplifier ? plain[3] : null,
        };
    }

    /// <summary>
    /// A netlist front end: the pin and the sensor's two terminals (its voltage, for self-heating, in place of the
    /// divider's). A ratiometric converter's reference node is driven by a DC source from ground (the loader holds it
    /// to that), so its voltage is the nominal reference exactly and the converter knows it, as with a divider.
    /// </summary>
    private static DcLevels RunNetlist(FrontEndDesign design, IReadOnlyList<PrechargeCase> cases, IReadOnlyList<double> temperatures,
        ICheckEngine engine, string pinNode)
    {
        var netlist = design.Netlist!;
        var sensor = netlist.Parsed.Find(netlist.SensorElements[0])!;
        // Ground is no vector of a sweep (ngspice has none for it): a sensor terminal on it reads 0.
        var nodes = sensor.Nodes.Where(n => n != Circuit.Ground).Append(pinNode).ToList();
        // A differential input: its negative node too, from the same sweep (the pin's stays last).
        if (netlist.NegativePinNode is { } negativeNode)
            nodes.Insert(0, negativeNode);
        var swept = Sweep(engine, design, null, temperatures, nodes);
        double[] At(string node) => node == Circuit.Ground ? new double[temperatures.Count] : swept[nodes.IndexOf(node)];
        var v = new[] { At(sensor.Nodes[0]), At(sensor.Nodes[1]), swept[^1] };
        var average = cases.Select(c => UsesAverageSamplingCurrent(design, c.Volts)
            ? Sweep(engine, design, c.Volts, temperatures, [pinNode])[0]
            : v[2]).ToArray();
        return new DcLevels([.. v[0].Select((x, i) => x - v[1][i])], null, v[2], average)
        {
            NegativeInputVolts = netlist.NegativePinNode is { } n ? At(n) : null,
        };
    }

    /// <summary>
    /// A current-excited design: besides the pin, the source's output (compliance), the reference resistor's two ends
    /// (the converter's reference), the converter's negative input (3 or 4 wires) and the sensor's own terminals (its
    /// voltage, for self-heating).
    /// </summary>
    private static DcLevels RunCurrent(FrontEndDesign design, IReadOnlyList<PrechargeCase> cases, IReadOnlyList<double> temperatures,
        ICheckEngine engine, string pinNode)
    {
        var output = CurrentSourceCircuit.OutputNode(design);
        var negative = CurrentSourceCircuit.NegativeInput(design);
        var wired = design.Wiring is not null;
        var nodes = new List<string> { wired ? SensorTop : Divider, wired ? SensorBottom : Circuit.Ground, pinNode, output, CurrentSourceCircuit.ChainTop(design), negative ?? Circuit.Ground };
        var v = Sweep(engine, design, null, temperatures, nodes);
        double[] Difference(int a, int b) => [.. v[a].Select((x, i) => x - v[b][i])];
        double[]? reference = design.CurrentSource!.ReferenceResistorOhms is null ? null : Difference(3, 4);
        var average = cases.Select(c => UsesAverageSamplingCurrent(design, c.Volts)
            ? Sweep(engine, design, c.Volts, temperatures, [pinNode])[0]
            : v[2]).ToArray();
        return new DcLevels(Difference(0, 1), null, v[2], average)
        {
            ReferenceVolts = reference,
            SourceVolts = v[3],
            NegativeInputVolts = negative is null ? null : v[5],
        };
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
